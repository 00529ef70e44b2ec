import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fs from 'node:fs';
import { newMember, startTestServer, type Caller, type TestServer } from './helpers';
import { sketchFile } from './fixtures';
import { tinyPng } from './fixtures/images';
import { Sketch, Upload, UploadChunk } from '../../server/models';
import { runHousekeeping } from '../../server/services/housekeeping';

// The uploads findings of the security review: quota, rate limit, bytes in bounded pieces, old photos removed,
// malformed multipart bodies refused with 400.
let server: TestServer;
let alice: Caller;

const KB = 1024;
/** A PNG (detected from its first bytes) padded to `bytes` bytes. */
const pngOfSize = (bytes: number) => {
  const png = tinyPng();
  return Buffer.concat([png, Buffer.alloc(bytes - png.length, 7)]);
};

async function newSketch(caller: Caller, name: string): Promise<number> {
  return (
    await caller
      .post('/api/sketches')
      .send({ name, document: sketchFile(name) })
      .expect(201)
  ).body.id;
}

async function upload(caller: Caller, sketchId: number, bytes: Buffer) {
  return caller.post(`/api/sketches/${sketchId}/uploads`).attach('file', bytes, { filename: 'photo.png' });
}

/** Saves the sketch with `uploadId` as its side-view tracing photo. */
async function traceWith(caller: Caller, sketchId: number, up: { id: string; url: string }) {
  const current = (await caller.get(`/api/sketches/${sketchId}`).expect(200)).body;
  const photo = {
    upload: up.id,
    url: up.url,
    width: 1,
    height: 1,
    centre: { h: 0, v: 0 },
    mmPerPx: 1,
    opacity: 1,
    locked: false,
  };
  await caller
    .put(`/api/sketches/${sketchId}`)
    .send({ document: { ...current.document, tracing: { side: photo } }, version: current.version })
    .expect(200);
}

beforeAll(async () => {
  server = await startTestServer({ UPLOAD_QUOTA_MB: '1', UPLOAD_MAX_PER_HOUR: '12' });
  alice = await newMember(server.app, 'tracer');
});
afterAll(async () => {
  await server.close();
});

describe('per-account storage quota', () => {
  it('refuses an upload that would take the account past its quota with 413 naming the quota', async () => {
    const owner = await newMember(server.app, 'quota');
    const id = await newSketch(owner, 'Quota rig');
    expect((await upload(owner, id, pngOfSize(600 * KB))).status).toBe(201);
    const res = await upload(owner, id, pngOfSize(600 * KB));
    expect(res.status).toBe(413);
    expect(res.body.error).toMatch(/storage quota of 1 MB/);
    expect(await Upload.count({ where: { sketchId: id } })).toBe(1);
    // Another account has its own quota.
    const other = await newMember(server.app, 'quota-other');
    expect((await upload(other, await newSketch(other, 'Other rig'), pngOfSize(600 * KB))).status).toBe(201);
  });
});

describe('upload rate limit', () => {
  it('answers 429 with Retry-After once an account has uploaded too often in the hour', async () => {
    const busy = await newMember(server.app, 'busy');
    const id = await newSketch(busy, 'Busy rig');
    for (let i = 0; i < 12; i++) expect((await upload(busy, id, tinyPng())).status).toBe(201);
    const res = await upload(busy, id, tinyPng());
    expect(res.status).toBe(429);
    expect(res.body.error).toMatch(/too many uploads from this account/);
    expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
  });
});

describe('bytes in the database, in bounded pieces', () => {
  it('keeps a 900 KB photo as pieces of at most 256 KB, serves it back whole, and leaves no spooled file', async () => {
    const id = await newSketch(alice, 'Big photo');
    const bytes = pngOfSize(900 * KB);
    const res = await upload(alice, id, bytes);
    expect(res.status).toBe(201);
    const chunks = await UploadChunk.findAll({ where: { uploadId: res.body.id }, order: [['seq', 'ASC']] });
    expect(chunks.length).toBe(Math.ceil(bytes.length / (256 * KB)));
    expect(chunks.every((c) => c.data.length <= 256 * KB)).toBe(true);
    expect(Buffer.compare(Buffer.concat(chunks.map((c) => c.data)), bytes)).toBe(0);
    const got = await alice.get(res.body.url).buffer(true);
    expect(got.status).toBe(200);
    expect(Number(got.headers['content-length'])).toBe(bytes.length);
    expect(Buffer.compare(got.body as Buffer, bytes)).toBe(0);
    expect(fs.readdirSync(server.config.uploadSpoolDir)).toEqual([]);
  });
});

describe('replaced and unused photos are removed', () => {
  it('removes the photo a save replaces, and keeps the new one', async () => {
    const id = await newSketch(alice, 'Replaced photo');
    const first = (await upload(alice, id, tinyPng())).body;
    await traceWith(alice, id, first);
    expect((await alice.get(first.url)).status).toBe(200);
    const second = (await upload(alice, id, tinyPng())).body;
    await traceWith(alice, id, second);
    expect((await alice.get(first.url)).status).toBe(404);
    expect(await Upload.findByPk(first.id)).toBeNull();
    expect(await UploadChunk.count({ where: { uploadId: first.id } })).toBe(0);
    expect((await alice.get(second.url)).status).toBe(200);
  });

  it('removes a photo never placed in its sketch after a day, and keeps placed and recent ones', async () => {
    const id = await newSketch(alice, 'Unused photo');
    const placed = (await upload(alice, id, tinyPng())).body;
    await traceWith(alice, id, placed);
    const unused = (await upload(alice, id, tinyPng())).body;
    const recent = (await upload(alice, id, tinyPng())).body;
    const twoDaysAgo = new Date(Date.now() - 2 * 24 * 3600_000);
    await Upload.update({ createdAt: twoDaysAgo }, { where: { id: [placed.id, unused.id] }, silent: true });
    await runHousekeeping();
    expect(await Upload.findByPk(unused.id)).toBeNull();
    expect(await UploadChunk.count({ where: { uploadId: unused.id } })).toBe(0);
    expect(await Upload.findByPk(placed.id)).not.toBeNull();
    expect(await Upload.findByPk(recent.id)).not.toBeNull();
  });

  it('removes the photos of a sketch deleted for good', async () => {
    const id = await newSketch(alice, 'Binned');
    const up = (await upload(alice, id, tinyPng())).body;
    await traceWith(alice, id, up);
    await alice.delete(`/api/sketches/${id}`).expect(204);
    await Sketch.update({ deletedAt: new Date(Date.now() - 31 * 24 * 3600_000) }, { where: { id } });
    await runHousekeeping();
    expect(await Sketch.findByPk(id)).toBeNull();
    expect(await Upload.findByPk(up.id)).toBeNull();
    expect(await UploadChunk.count({ where: { uploadId: up.id } })).toBe(0);
  });
});

describe('malformed multipart bodies', () => {
  const head = (filename: string) =>
    `--XyZ\r\nContent-Disposition: form-data; name="file"; filename="${filename}"\r\nContent-Type: image/png\r\n\r\n`;
  const whole = (filename: string) =>
    Buffer.concat([Buffer.from(head(filename), 'latin1'), tinyPng(), Buffer.from('\r\n--XyZ--\r\n')]);
  let sender: Caller;
  let sketchId: number;
  beforeAll(async () => {
    sender = await newMember(server.app, 'malformed');
    sketchId = await newSketch(sender, 'Malformed');
  });
  const send = (contentType: string, body: Buffer) =>
    sender.post(`/api/sketches/${sketchId}/uploads`).set('Content-Type', contentType).send(body);

  it('accepts the well-formed body these cases are cut from', async () => {
    expect((await send('multipart/form-data; boundary=XyZ', whole('a.png'))).status).toBe(201);
  });

  it('answers 400 for a multipart body without a boundary', async () => {
    const res = await send('multipart/form-data', whole('a.png'));
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/boundary/);
  });

  it('answers 400 for a truncated body', async () => {
    const cut = whole('a.png').subarray(0, head('a.png').length + 20);
    const res = await send('multipart/form-data; boundary=XyZ', cut);
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/ended early|incomplete|truncated/);
  });

  it('answers 400 for a NUL or a CR in the file name', async () => {
    for (const name of ['a\u0000.png', 'a\r.png']) {
      const res = await send('multipart/form-data; boundary=XyZ', whole(name));
      expect(res.status).toBe(400);
      expect(res.body.error).toMatch(/file name/);
    }
    expect(await Upload.count({ where: { sketchId } })).toBe(1);
  });
});
