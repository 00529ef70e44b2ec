import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { newMember, startTestServer, type TestServer } from './helpers';
import { sketchFile } from './fixtures';
import { runSweep } from '../../shared/kinematics';

// Answers under 8 KB go out uncompressed (they fit TCP's initial window anyway); larger ones are compressed
// for a browser that accepts it.

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

describe('compression of answers', () => {
  it('leaves a sketch of a few KB uncompressed and compresses a sweep of many KB', async () => {
    const member = await newMember(server.app, 'compress');
    const doc = sketchFile();
    const created = await member.post('/api/sketches').send({ name: 'Small answer', document: doc }).expect(201);

    const read = await member.get(`/api/sketches/${created.body.id}`).set('Accept-Encoding', 'gzip').expect(200);
    expect(Buffer.byteLength(JSON.stringify(read.body))).toBeLessThan(8 * 1024);
    expect(read.headers['content-encoding']).toBeUndefined();

    const sweep = await member.post('/api/sweep').set('Accept-Encoding', 'gzip').send(doc).expect(200);
    expect(Buffer.byteLength(JSON.stringify(sweep.body))).toBeGreaterThan(8 * 1024);
    expect(sweep.headers['content-encoding']).toBe('gzip');
    // supertest has inflated it: the same result as the library's.
    expect(sweep.body).toEqual(JSON.parse(JSON.stringify(runSweep(doc))));
  });
});
