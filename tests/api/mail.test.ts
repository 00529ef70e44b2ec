import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Caller, demo, newMember, startTestServer, type TestServer } from './helpers';
import { sketchFile } from './fixtures';
import { PasswordReset, Session, User } from '../../server/models';
import { Mailer } from '../../server/services/mail/mailer';
import type { Transporter } from 'nodemailer';

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

function tokenFrom(text: string): string {
  const m = /\/reset\?token=([A-Za-z0-9_-]+)/.exec(text);
  if (!m) throw new Error('no reset link in the mail');
  return m[1];
}

describe('password reset through the outbox', () => {
  it('mails a single-use link; the new password works, the old does not, and old sessions end', async () => {
    const user = await newMember(server.app, 'forgetful');
    const other = await new Caller(server.app).signIn(user.email, user.password);

    const anon = new Caller(server.app);
    await anon.refreshToken();
    const req = await anon.post('/api/auth/reset-request').send({ email: user.email.toUpperCase() });
    expect(req.status).toBe(202);

    const [mail] = await server.deliveredTo(user.email);
    expect(mail.subject).toBe('Arcwright: reset your password');
    expect(mail.text).toContain('http://arcwright.example.test/reset?token=');
    expect(mail.html).toContain('Choose a new password');
    const token = tokenFrom(mail.text);
    // Only the hash is stored.
    const row = await PasswordReset.findOne({ order: [['id', 'DESC']] });
    expect(row!.tokenHash).not.toContain(token);
    expect(row!.tokenHash).toMatch(/^[0-9a-f]{64}$/);

    expect((await anon.post('/api/auth/reset').send({ token, password: 'short' })).status).toBe(400);
    const done = await anon.post('/api/auth/reset').send({ token, password: 'brand-new-password' });
    expect(done.status).toBe(204);
    expect((await other.get('/api/auth/me')).status).toBe(401);
    expect((await user.get('/api/auth/me')).status).toBe(401);

    const again = await anon.post('/api/auth/reset').send({ token, password: 'another-new-password' });
    expect(again.status).toBe(400);
    expect(again.body.error).toMatch(/not valid/);

    const fresh = new Caller(server.app);
    await fresh.refreshToken();
    expect((await fresh.post('/api/auth/login').send({ email: user.email, password: user.password })).status).toBe(401);
    expect(
      (await fresh.post('/api/auth/login').send({ email: user.email, password: 'brand-new-password' })).status,
    ).toBe(200);
  });

  it('lets exactly one of several concurrent uses of one reset link through', async () => {
    const user = await newMember(server.app, 'hurried');
    const anon = new Caller(server.app);
    await anon.refreshToken();
    expect((await anon.post('/api/auth/reset-request').send({ email: user.email })).status).toBe(202);
    const [mail] = await server.deliveredTo(user.email);
    const token = tokenFrom(mail.text);

    const passwords = [1, 2, 3].map((n) => `raced-new-password-${n}`);
    const results = await Promise.all(
      passwords.map((password) => anon.post('/api/auth/reset').send({ token, password })),
    );
    expect(results.map((r) => r.status).sort()).toEqual([204, 400, 400]);
    // The password that works is the winner's; a refused one does not.
    const winner = results.findIndex((r) => r.status === 204);
    const loser = (winner + 1) % passwords.length;
    for (const [index, status] of [
      [winner, 200],
      [loser, 401],
    ]) {
      const fresh = new Caller(server.app);
      await fresh.refreshToken();
      const login = await fresh.post('/api/auth/login').send({ email: user.email, password: passwords[index] });
      expect(login.status).toBe(status);
    }
  }, 60_000); // each use hashes a password (scrypt): several at once take a while on a busy machine

  it('keeps the reset mail in the outbox with its link removed, while the mail sent has a working one', async () => {
    const user = await newMember(server.app, 'logged');
    const anon = new Caller(server.app);
    await anon.refreshToken();
    await anon.post('/api/auth/reset-request').send({ email: user.email }).expect(202);
    const [sent] = await server.deliveredTo(user.email);
    const token = tokenFrom(sent.text);
    expect(sent.html).toContain(token);

    const [logged] = await server.mailTo(user.email);
    expect(logged.subject).toBe('Arcwright: reset your password');
    for (const part of [logged.text, logged.html]) {
      expect(part).not.toContain(token);
      expect(part).toContain('/reset?token=(removed from the mail log)');
    }
    const admin = await new Caller(server.app).signIn(demo.admin.email, demo.admin.password);
    const outbox = await admin.get('/api/admin/outbox');
    expect(JSON.stringify(outbox.body)).not.toContain(token);

    // The link that was sent still works.
    expect((await anon.post('/api/auth/reset').send({ token, password: 'copper-lathe-harbour-91' })).status).toBe(204);
  });

  it('answers 202 for an unknown e-mail and sends nothing', async () => {
    const anon = new Caller(server.app);
    await anon.refreshToken();
    const res = await anon.post('/api/auth/reset-request').send({ email: 'nobody-here@example.test' });
    expect(res.status).toBe(202);
    expect(await server.mailTo('nobody-here@example.test')).toHaveLength(0);
  });

  it('refuses an expired token and an unknown one with 400', async () => {
    const user = await newMember(server.app, 'late');
    const anon = new Caller(server.app);
    await anon.refreshToken();
    await anon.post('/api/auth/reset-request').send({ email: user.email }).expect(202);
    const [mail] = await server.deliveredTo(user.email);
    await PasswordReset.update(
      { expiresAt: new Date(Date.now() - 1000) },
      { where: { userId: (await User.findOne({ where: { email: user.email } }))!.id } },
    );
    expect(
      (await anon.post('/api/auth/reset').send({ token: tokenFrom(mail.text), password: 'brand-new-password' })).status,
    ).toBe(400);
    expect(
      (await anon.post('/api/auth/reset').send({ token: 'made-up-token', password: 'brand-new-password' })).status,
    ).toBe(400);
  });
});

describe('share notice', () => {
  it('mails the link when the owner shares with an e-mail address, escaping the names in HTML', async () => {
    const owner = await newMember(server.app, 'sharer');
    const created = await owner.post('/api/sketches').send({ name: 'Rock <crawler> rear', document: sketchFile() });
    const res = await owner
      .post(`/api/sketches/${created.body.id}/share`)
      .send({ mode: 'link', email: 'friend@example.test' });
    expect(res.status).toBe(200);
    const [mail] = await server.mailTo('friend@example.test');
    expect(mail.subject).toContain('Rock <crawler> rear');
    expect(mail.text).toContain(res.body.url);
    expect(mail.html).toContain('Rock &lt;crawler&gt; rear');
    expect(mail.html).not.toContain('<crawler>');
  });

  it('refuses a bad e-mail address with 400 and leaves the sketch private', async () => {
    const owner = await newMember(server.app, 'sharer2');
    const created = await owner.post('/api/sketches').send({ name: 'Private one', document: sketchFile() });
    const res = await owner
      .post(`/api/sketches/${created.body.id}/share`)
      .send({ mode: 'link', email: 'not an address' });
    expect(res.status).toBe(400);
    expect((await owner.get(`/api/sketches/${created.body.id}`)).body.share).toBe('private');
  });
});

describe('a failing mail server', () => {
  it('retries, logs, and never fails the action', async () => {
    let calls = 0;
    const failing = {
      sendMail: async () => {
        calls += 1;
        throw new Error('connection refused');
      },
      close: () => undefined,
    } as unknown as Transporter;
    const mailer = new Mailer(failing, { from: 'test@example.test', attempts: 3, retryDelayMs: 1, recordSent: true });
    const errors: unknown[] = [];
    const original = console.error;
    console.error = (...args: unknown[]) => {
      errors.push(args);
    };
    try {
      expect(() => mailer.queue({ to: 'x@example.test', subject: 's', text: 't', html: '<p>t</p>' })).not.toThrow();
      await mailer.idle();
    } finally {
      await mailer.close();
      console.error = original;
    }
    expect(calls).toBe(3);
    expect(errors).toHaveLength(3);
    expect(String((errors[2] as unknown[])[0])).toMatch(/giving up/);
  });
});

describe('sessions row bookkeeping', () => {
  it('records the user id on the session row', async () => {
    const caller = await new Caller(server.app).signIn(demo.student.email, demo.student.password);
    const student = await User.findOne({ where: { email: demo.student.email } });
    expect(await Session.count({ where: { userId: student!.id } })).toBeGreaterThan(0);
    await caller.post('/api/auth/logout').expect(204);
  });
});
