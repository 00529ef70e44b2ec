import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { Caller, demo, newMember, startTestServer, type TestServer } from './helpers';
import { sketchFile } from './fixtures';
import {
  adminUserSchema,
  outboxMessageSchema,
  publicUserSchema,
  revisionDetailSchema,
  revisionListSchema,
  sketchDetailSchema,
  sketchPageSchema,
  uploadInfoSchema,
} from '../../shared/schema/apiResponses';

// The client reads these answers through the types inferred from shared/schema/apiResponses; here real
// answers of the server (a fresh app on its own database) are parsed with the same schemas, which are strict:
// a field one side adds or drops fails the parse.

/** The first bytes of a JPEG (SOI + JFIF APP0): enough for the server's detection from the bytes. */
const jpegBytes = Buffer.concat([
  Buffer.from([
    0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46, 0x00, 0x01, 0x01, 0x00, 0x00, 0x01, 0x00, 0x01, 0x00,
    0x00,
  ]),
  Buffer.alloc(64),
  Buffer.from([0xff, 0xd9]),
]);

let server: TestServer;
let alice: Awaited<ReturnType<typeof newMember>>;
let sketchId: number;
beforeAll(async () => {
  server = await startTestServer();
  alice = await newMember(server.app, 'alice');
  const created = await alice.post('/api/sketches').send({ name: 'Shop truck rear', document: sketchFile() });
  expect(created.status).toBe(201);
  sketchId = created.body.id;
});
afterAll(async () => {
  await server.close();
});

describe('answers of the sketch routes parse with the shared response schemas', () => {
  it('a created, read and updated sketch', async () => {
    const created = await alice.post('/api/sketches').send({ name: 'Shop truck front', document: sketchFile() });
    expect(created.status).toBe(201);
    expect(sketchDetailSchema.parse(created.body).name).toBe('Shop truck front');

    const got = await alice.get(`/api/sketches/${sketchId}`);
    expect(got.status).toBe(200);
    const detail = sketchDetailSchema.parse(got.body);
    expect(detail.id).toBe(sketchId);

    const put = await alice
      .put(`/api/sketches/${sketchId}`)
      .send({ document: got.body.document, name: 'Shop truck rear, lower links', version: detail.version });
    expect(put.status).toBe(200);
    expect(sketchDetailSchema.parse(put.body).version).toBe(detail.version + 1);
  });

  it('the library list, its revisions and one revision', async () => {
    const list = await alice.get('/api/sketches?sort=name&order=asc');
    expect(list.status).toBe(200);
    const page = sketchPageSchema.parse(list.body);
    expect(page.items.map((s) => s.id)).toContain(sketchId);

    const revisions = await alice.get(`/api/sketches/${sketchId}/revisions`);
    expect(revisions.status).toBe(200);
    const { items } = revisionListSchema.parse(revisions.body);
    expect(items.length).toBeGreaterThan(0);

    const one = await alice.get(`/api/sketches/${sketchId}/revisions/${items[0].rev}`);
    expect(one.status).toBe(200);
    expect(revisionDetailSchema.parse(one.body).rev).toBe(items[0].rev);
  });

  it('a sketch in the bin and a shared sketch', async () => {
    const doomed = await alice.post('/api/sketches').send({ name: 'Scrap idea', document: sketchFile() });
    expect((await alice.delete(`/api/sketches/${doomed.body.id}`)).status).toBe(204);
    const bin = await alice.get('/api/sketches?deleted=1');
    expect(bin.status).toBe(200);
    const binned = sketchPageSchema.parse(bin.body).items.find((s) => s.id === doomed.body.id);
    expect(binned?.deletedAt).not.toBeNull();

    const share = await alice.post(`/api/sketches/${sketchId}/share`).send({ mode: 'link' });
    expect(share.status).toBe(200);
    const shared = await request(server.app).get(`/api/shared/${share.body.shareToken}`);
    expect(shared.status).toBe(200);
    const seen = sketchDetailSchema.parse(shared.body);
    expect(seen.mine).toBe(false);
  });

  it('an upload', async () => {
    const res = await alice.post(`/api/sketches/${sketchId}/uploads`).attach('file', jpegBytes, 'rear.jpg');
    expect(res.status).toBe(201);
    expect(uploadInfoSchema.parse(res.body).mime).toBe('image/jpeg');
  });
});

describe('answers of the account and admin routes parse with the shared response schemas', () => {
  it('the signed-in account', async () => {
    const me = await alice.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(publicUserSchema.parse(me.body.user).email).toBe(alice.email);
  });

  it('the admin lists of accounts and mail', async () => {
    const admin = await new Caller(server.app).signIn(demo.admin.email, demo.admin.password);
    const users = await admin.get('/api/admin/users');
    expect(users.status).toBe(200);
    expect(users.body.items.length).toBeGreaterThan(0);
    for (const u of users.body.items) adminUserSchema.parse(u);

    // A share notice puts one message in the mail log.
    await alice.post(`/api/sketches/${sketchId}/share`).send({ mode: 'link', email: 'fitter@example.test' });
    expect(await server.mailTo('fitter@example.test')).toHaveLength(1);
    const outbox = await admin.get('/api/admin/outbox');
    expect(outbox.status).toBe(200);
    expect(outbox.body.items.length).toBeGreaterThan(0);
    for (const m of outbox.body.items) outboxMessageSchema.parse(m);
  });
});

describe('the response schemas can fail', () => {
  it('refuses an answer with a field the schema does not name, or without one it does', async () => {
    const got = await alice.get(`/api/sketches/${sketchId}`);
    expect(sketchDetailSchema.safeParse(got.body).success).toBe(true);
    expect(sketchDetailSchema.safeParse({ ...got.body, ownerEmail: 'x@example.test' }).success).toBe(false);
    const { canEdit: _canEdit, ...withoutCanEdit } = got.body;
    expect(sketchDetailSchema.safeParse(withoutCanEdit).success).toBe(false);
  });
});
