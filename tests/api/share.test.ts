import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { Caller, demo, newMember, startTestServer, type TestServer } from './helpers';
import { sketchFile } from './fixtures';
import { ShareRecipient } from '../../server/models';
import { listenOn } from '../../server/listen';
import { shareStateSchema } from '../../shared/schema/apiResponses';

// The share dialog's API: the link's state, mailing it (one message per send), who it went to, revoking it.
let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

async function ownSketch(owner: Caller, name = 'Shared rear') {
  const created = await owner.post('/api/sketches').send({ name, document: sketchFile() });
  expect(created.status).toBe(201);
  return created.body.id as number;
}

describe('share state, sending and revoking', () => {
  it('creates a link, mails it once per send, lists the recipients, and revokes it', async () => {
    const owner = await newMember(server.app, 'sharer');
    const id = await ownSketch(owner, 'Trail <rig> rear');

    const before = await owner.get(`/api/sketches/${id}/share`);
    expect(before.status).toBe(200);
    expect(shareStateSchema.parse(before.body)).toEqual({
      share: 'private',
      shareToken: null,
      url: null,
      recipients: [],
    });

    const on = await owner.post(`/api/sketches/${id}/share`).send({ mode: 'link' });
    expect(on.status).toBe(200);
    const state = shareStateSchema.parse(on.body);
    expect(state.share).toBe('link');
    expect(state.url).toBe(`http://arcwright.example.test/shared/${state.shareToken}`);
    expect(state.recipients).toEqual([]);
    // Creating the link mails nobody.
    await server.mail.mailer.idle();
    expect(await ShareRecipient.count({ where: { sketchId: id } })).toBe(0);

    const sent = await owner.post(`/api/sketches/${id}/share`).send({ mode: 'link', email: 'Fitter@Example.test' });
    expect(sent.status).toBe(200);
    expect(sent.body.shareToken).toBe(state.shareToken);
    expect(sent.body.recipients).toHaveLength(1);
    expect(sent.body.recipients[0]).toMatchObject({ email: 'fitter@example.test', live: true });
    expect(Date.parse(sent.body.recipients[0].sentAt)).toBeGreaterThan(Date.now() - 60_000);

    const mails = await server.mailTo('fitter@example.test');
    expect(mails).toHaveLength(1);
    const [mail] = mails;
    // The text part carries the link; the HTML part a real anchor to it, with the user's text escaped.
    expect(mail.text).toContain(state.url);
    expect(mail.html).toContain(`<a href="${state.url}"`);
    expect(mail.html).toContain('Trail &lt;rig&gt; rear');
    expect(mail.html).not.toContain('<rig>');

    // A second send is a second message and a second line in the list, newest first.
    await owner.post(`/api/sketches/${id}/share`).send({ mode: 'link', email: 'buyer@example.test' }).expect(200);
    expect(await server.mailTo('buyer@example.test')).toHaveLength(1);
    expect(await server.mailTo('fitter@example.test')).toHaveLength(1);
    const listed = await owner.get(`/api/sketches/${id}/share`);
    expect(listed.body.recipients.map((r: { email: string }) => r.email)).toEqual([
      'buyer@example.test',
      'fitter@example.test',
    ]);

    const off = await owner.post(`/api/sketches/${id}/share`).send({ mode: 'private' });
    expect(off.status).toBe(200);
    expect(off.body).toMatchObject({ share: 'private', shareToken: null, url: null });
    // The list stays, marked: the link those people got no longer works.
    expect(off.body.recipients).toHaveLength(2);
    expect(off.body.recipients.every((r: { live: boolean }) => r.live === false)).toBe(true);
    const guest = await request(server.app).get(`/api/shared/${state.shareToken}`);
    expect(guest.status).toBe(404);
    expect(guest.body.error).toBe('this link is not shared (any more)');

    // A new link's mailings are live; the earlier ones stay dead.
    const again = await owner.post(`/api/sketches/${id}/share`).send({ mode: 'link', email: 'buyer@example.test' });
    expect(again.body.shareToken).not.toBe(state.shareToken);
    expect(again.body.recipients.map((r: { live: boolean }) => r.live)).toEqual([true, false, false]);
  });

  it('refuses a bad address with 400 naming the field, and saves nothing', async () => {
    const owner = await newMember(server.app, 'careful');
    const id = await ownSketch(owner);
    const bad = await owner.post(`/api/sketches/${id}/share`).send({ mode: 'link', email: 'not an address' });
    expect(bad.status).toBe(400);
    expect(bad.body.details).toEqual(['email: not an e-mail address']);
    // Neither the link nor a recipient was saved, and no mail left.
    const state = await owner.get(`/api/sketches/${id}/share`);
    expect(state.body).toEqual({ share: 'private', shareToken: null, url: null, recipients: [] });
    await server.mail.mailer.idle();
    expect(await ShareRecipient.count({ where: { sketchId: id } })).toBe(0);

    // Two addresses in one field are not one address.
    const two = await owner
      .post(`/api/sketches/${id}/share`)
      .send({ mode: 'link', email: 'a@example.test, b@example.test' });
    expect(two.status).toBe(400);
    expect(two.body.details[0]).toMatch(/^email: /);

    // A revoked link cannot be sent.
    const off = await owner.post(`/api/sketches/${id}/share`).send({ mode: 'private', email: 'c@example.test' });
    expect(off.status).toBe(400);
    expect(off.body.details).toEqual(["email: a link can only be sent with mode 'link'"]);
    expect(await server.mailTo('c@example.test')).toHaveLength(0);
  });

  it('keeps the share state to the owner: 401 signed out, 404 for another account', async () => {
    const owner = await newMember(server.app, 'owner');
    const id = await ownSketch(owner);
    await owner.post(`/api/sketches/${id}/share`).send({ mode: 'link', email: 'friend@example.test' }).expect(200);
    const anon = new Caller(server.app);
    await anon.refreshToken();
    expect((await anon.get(`/api/sketches/${id}/share`)).status).toBe(401);
    const other = await new Caller(server.app).signIn(demo.student.email, demo.student.password);
    expect((await other.get(`/api/sketches/${id}/share`)).status).toBe(404);
    const foreignSend = await other.post(`/api/sketches/${id}/share`).send({ mode: 'link', email: 'x@example.test' });
    expect(foreignSend.status).toBe(404);
    expect(await server.mailTo('x@example.test')).toHaveLength(0);
  });
});

describe('share mails per account', () => {
  let limited: TestServer;
  beforeAll(async () => {
    limited = await startTestServer({ SHARE_MAIL_MAX_PER_HOUR: '2' });
  });
  afterAll(async () => {
    await limited.close();
  });

  it('answers 429 past the limit and sends nothing more; refused sends and links without mail do not count', async () => {
    const owner = await newMember(limited.app, 'busy');
    const id = await ownSketch(owner);
    expect((await owner.post(`/api/sketches/${id}/share`).send({ mode: 'link', email: 'bad' })).status).toBe(400);
    for (const to of ['one@example.test', 'two@example.test']) {
      expect((await owner.post(`/api/sketches/${id}/share`).send({ mode: 'link', email: to })).status).toBe(200);
    }
    const third = await owner.post(`/api/sketches/${id}/share`).send({ mode: 'link', email: 'three@example.test' });
    expect(third.status).toBe(429);
    expect(third.body.error).toMatch(/too many share mails from this account/);
    expect(await limited.mailTo('three@example.test')).toHaveLength(0);
    expect(await ShareRecipient.count({ where: { sketchId: id } })).toBe(2);
    // The link itself can still be turned off and on.
    expect((await owner.post(`/api/sketches/${id}/share`).send({ mode: 'private' })).status).toBe(200);
    expect((await owner.post(`/api/sketches/${id}/share`).send({ mode: 'link' })).status).toBe(200);

    // Another account has its own count.
    const other = await newMember(limited.app, 'calm');
    const otherId = await ownSketch(other);
    const res = await other.post(`/api/sketches/${otherId}/share`).send({ mode: 'link', email: 'four@example.test' });
    expect(res.status).toBe(200);
    expect(await limited.mailTo('four@example.test')).toHaveLength(1);
  });
});

describe('links without PUBLIC_URL', () => {
  let listening: TestServer;
  let http: Server;
  let base: string;
  beforeAll(async () => {
    // PORT=0: the system picks a free port, never 3000's default; no PUBLIC_URL.
    listening = await startTestServer({ PUBLIC_URL: '', PORT: '0' });
    http = await listenOn(listening.app, listening.config, '127.0.0.1');
    base = `http://127.0.0.1:${listening.config.port}`;
  });
  afterAll(async () => {
    await new Promise<void>((done) => http.close(() => done()));
    await listening.close();
  });

  it('point at the port the server really listens on, in API answers and in mail', async () => {
    const port = listening.config.port;
    expect(port).toBeGreaterThan(0);
    expect(port).not.toBe(3000);
    const owner = await newMember(base, 'local');
    const id = await ownSketch(owner);
    const shared = await owner.post(`/api/sketches/${id}/share`).send({ mode: 'link', email: 'near@example.test' });
    expect(shared.body.url).toBe(`http://localhost:${port}/shared/${shared.body.shareToken}`);
    const [mail] = await listening.mailTo('near@example.test');
    expect(mail.text).toContain(shared.body.url);
    expect(mail.html).toContain(`href="${shared.body.url}"`);
    // The link's token opens the sketch on this very server.
    expect((await request(base).get(`/api/shared/${shared.body.shareToken}`)).status).toBe(200);

    const anon = new Caller(base);
    await anon.refreshToken();
    await anon.post('/api/auth/reset-request').send({ email: owner.email }).expect(202);
    const [reset] = await listening.deliveredTo(owner.email);
    expect(reset.text).toContain(`http://localhost:${port}/reset?token=`);
    expect(reset.html).toMatch(new RegExp(`<a href="http://localhost:${port}/reset\\?token=[A-Za-z0-9_-]+"`));
  });
});
