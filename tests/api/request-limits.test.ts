import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { Caller, demo, startTestServer, type TestServer } from './helpers';
import { sketchFile } from './fixtures';
import { JSON_BODY_MAX_BYTES } from '../../shared/schema/requestLimits';

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

/** A JSON text of exactly `bytes` bytes (ASCII only, so characters are bytes). */
function jsonOfSize(bytes: number): string {
  const shell = '{"pad":""}';
  return `{"pad":"${'x'.repeat(bytes - shell.length)}"}`;
}

describe('the JSON body limit', () => {
  it('takes a body of exactly the limit and refuses one byte more with 413 naming the limit', async () => {
    expect(jsonOfSize(JSON_BODY_MAX_BYTES)).toHaveLength(JSON_BODY_MAX_BYTES);
    const atLimit = await request(server.app)
      .post('/api/no-such-thing')
      .set('Content-Type', 'application/json')
      .send(jsonOfSize(JSON_BODY_MAX_BYTES));
    // Parsed, then refused further on (no CSRF token), never for its size.
    expect(atLimit.status).not.toBe(413);
    expect(atLimit.status).toBe(403);

    const over = await request(server.app)
      .post('/api/no-such-thing')
      .set('Content-Type', 'application/json')
      .send(jsonOfSize(JSON_BODY_MAX_BYTES + 1));
    expect(over.status).toBe(413);
    // The limit as the API documentation writes it: 256 KB = 262144 bytes.
    expect(over.body).toEqual({ error: 'request body is larger than 256 KB' });
  });
});

/** `depth` arrays inside one another around a number, e.g. depth 2 → [[1]]. */
const nestedArrays = (depth: number) => '['.repeat(depth) + '1' + ']'.repeat(depth);

describe('JSON nested deeper than any request needs', () => {
  it('answers 400 naming the nesting on every JSON route, never 500', async () => {
    const caller = new Caller(server.app);
    await caller.signIn(demo.maker.email, demo.maker.password);
    // 50 000 levels is 100 KB: well inside the size limit, so only the depth can refuse it.
    const deep = nestedArrays(50_000);
    const document = `{"name":"Deep","document":{"format":"arcwright-sketch","members":${deep}}}`;
    for (const [url, body] of [
      ['/api/sketches', document],
      ['/api/sweep', `{"document":${deep}}`],
      ['/api/auth/logout', deep],
    ] as const) {
      const res = await caller.post(url).set('Content-Type', 'application/json').send(body);
      expect(res.status, url).toBe(400);
      expect(res.body.error, url).toMatch(/nested more than \d+ levels deep/);
    }
  });

  it('takes a real sketch file, whose nesting is far inside the limit', async () => {
    const caller = new Caller(server.app);
    await caller.signIn(demo.maker.email, demo.maker.password);
    const res = await caller.post('/api/sketches').send({ name: 'Within depth', document: sketchFile() });
    expect(res.status).toBe(201);
  });
});
