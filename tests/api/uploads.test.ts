import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { newMember, startTestServer, type Caller, type TestServer } from './helpers';
import { sketchFile } from './fixtures';
import { jpegBytes, tinyPng } from './fixtures/images';
import { Upload, UploadChunk } from '../../server/models';

let server: TestServer;
let alice: Caller;
let bob: Caller;
let sketchId: number;

beforeAll(async () => {
  server = await startTestServer();
  alice = await newMember(server.app, 'alice');
  bob = await newMember(server.app, 'bob');
  sketchId = (await alice.post('/api/sketches').send({ name: 'Traced rear', document: sketchFile() })).body.id;
});
afterAll(async () => {
  await server.close();
});

describe('uploads', () => {
  it('stores a PNG under a server-made name and serves it to the owner with nosniff', async () => {
    const png = tinyPng();
    const res = await alice
      .post(`/api/sketches/${sketchId}/uploads`)
      .attach('file', png, { filename: '../../evil.html', contentType: 'text/html' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ mime: 'image/png', size: png.length });
    expect(res.body.url).toBe(`/api/uploads/${res.body.id}`);
    const row = await Upload.findByPk(res.body.id);
    expect(row!.storedName).toBe(`${res.body.id}.png`);
    // The bytes are in the database, where every instance reads them; no file is left on this machine.
    const chunks = await UploadChunk.findAll({ where: { uploadId: res.body.id }, order: [['seq', 'ASC']] });
    expect(Buffer.compare(Buffer.concat(chunks.map((c) => c.data)), png)).toBe(0);
    expect(fs.existsSync(path.join(server.config.uploadsDir, row!.storedName))).toBe(false);
    expect(fs.readdirSync(server.config.uploadSpoolDir)).toEqual([]);

    const got = await alice.get(res.body.url);
    expect(got.status).toBe(200);
    expect(got.headers['content-type']).toBe('image/png');
    expect(got.headers['x-content-type-options']).toBe('nosniff');
    expect(Buffer.compare(got.body as Buffer, png)).toBe(0);
  });

  it('accepts a JPEG, detected from its bytes', async () => {
    const res = await alice
      .post(`/api/sketches/${sketchId}/uploads`)
      .attach('file', jpegBytes, { filename: 'photo.png', contentType: 'image/png' });
    expect(res.status).toBe(201);
    expect(res.body.mime).toBe('image/jpeg');
  });

  it('refuses files that are not PNG or JPEG, whatever their name says', async () => {
    const before = await Upload.count();
    const html = await alice
      .post(`/api/sketches/${sketchId}/uploads`)
      .attach('file', Buffer.from('<script>alert(1)</script>'), { filename: 'x.png', contentType: 'image/png' });
    expect(html.status).toBe(415);
    const gif = await alice
      .post(`/api/sketches/${sketchId}/uploads`)
      .attach('file', Buffer.from('GIF89a\x01\x00\x01\x00\x00\x00\x00;'), { filename: 'x.gif' });
    expect(gif.status).toBe(415);
    expect(await Upload.count()).toBe(before);
  });

  it('refuses a missing file, a wrong field, two files and a file over 10 MB', async () => {
    expect((await alice.post(`/api/sketches/${sketchId}/uploads`).field('note', 'x')).status).toBe(400);
    expect((await alice.post(`/api/sketches/${sketchId}/uploads`).attach('photo', tinyPng(), 'a.png')).status).toBe(
      400,
    );
    const two = await alice
      .post(`/api/sketches/${sketchId}/uploads`)
      .attach('file', tinyPng(), 'a.png')
      .attach('file', tinyPng(), 'b.png');
    expect(two.status).toBe(400);
    const big = Buffer.concat([tinyPng(), Buffer.alloc(10 * 1024 * 1024)]);
    const tooBig = await alice.post(`/api/sketches/${sketchId}/uploads`).attach('file', big, 'big.png');
    expect(tooBig.status).toBe(413);
    expect(tooBig.body).toEqual({ error: 'file is larger than 10 MB' });
  });

  it('needs the CSRF token', async () => {
    const res = await alice.agent.post(`/api/sketches/${sketchId}/uploads`).attach('file', tinyPng(), 'a.png');
    expect(res.status).toBe(403);
  });

  it("refuses uploads to someone else's sketch and hides the file from them (404), and from guests", async () => {
    expect((await bob.post(`/api/sketches/${sketchId}/uploads`).attach('file', tinyPng(), 'a.png')).status).toBe(404);
    const up = await alice.post(`/api/sketches/${sketchId}/uploads`).attach('file', tinyPng(), 'a.png');
    expect((await bob.get(up.body.url)).status).toBe(404);
    expect((await request(server.app).get(up.body.url)).status).toBe(404);
    expect((await request(server.app).get('/api/uploads/not-a-uuid')).status).toBe(404);
  });

  it('serves the file to a guest holding the share token, until the link is revoked', async () => {
    const up = await alice.post(`/api/sketches/${sketchId}/uploads`).attach('file', tinyPng(), 'a.png');
    const share = await alice.post(`/api/sketches/${sketchId}/share`).send({ mode: 'link' });
    const url = `${up.body.url}?share=${share.body.shareToken}`;
    expect((await request(server.app).get(url)).status).toBe(200);
    expect((await request(server.app).get(`${up.body.url}?share=wrong-token-value-123`)).status).toBe(404);
    await alice.post(`/api/sketches/${sketchId}/share`).send({ mode: 'private' }).expect(200);
    expect((await request(server.app).get(url)).status).toBe(404);
  });
});
