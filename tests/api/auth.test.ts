import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { Caller, demo, newMember, signupTokenMailedTo, startTestServer, type TestServer } from './helpers';
import { Session, User } from '../../server/models';

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer({ LOGIN_MAX_PER_ACCOUNT: '3', SESSION_ABSOLUTE_HOURS: '1' });
});
afterAll(async () => {
  await server.close();
});

const sessionCookie = (res: request.Response) =>
  ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('arcwright.sid='));

describe('sign-up', () => {
  it('creates a member from the mailed link, with the e-mail trimmed and lower-cased, who can then sign in', async () => {
    const caller = new Caller(server.app);
    await caller.refreshToken();
    const res = await caller
      .post('/api/auth/signup')
      .send({ email: ' New.Person@Example.test ', password: 'eight ch plus words', name: 'New Person' });
    expect(res.status).toBe(202);
    const token = await signupTokenMailedTo('new.person@example.test');
    const done = await caller.post('/api/auth/signup/confirm').send({ token });
    expect(done.status).toBe(201);
    expect(done.body.user).toMatchObject({ email: 'new.person@example.test', name: 'New Person', role: 'member' });
    expect(done.body.user.passwordHash).toBeUndefined();
    await caller.signIn('new.person@example.test', 'eight ch plus words');
    const me = await caller.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe('new.person@example.test');
  });

  it('refuses a short password, a bad e-mail and extra fields with 400 naming each problem', async () => {
    const caller = new Caller(server.app);
    await caller.refreshToken();
    const res = await caller
      .post('/api/auth/signup')
      .send({ email: 'nope', password: 'short', name: '', role: 'admin' });
    expect(res.status).toBe(400);
    const details: string[] = res.body.details;
    expect(details.some((d) => d.startsWith('email:'))).toBe(true);
    expect(details.some((d) => d.startsWith('password:') && d.includes('8'))).toBe(true);
    expect(details.some((d) => d.startsWith('name:'))).toBe(true);
    expect(details.some((d) => d.includes('role'))).toBe(true);
  });

  it('accepts a 200-character password and does not truncate it', async () => {
    // Varied words (a run of one letter would be refused as too easy to guess).
    const long = Array.from({ length: 40 }, (_, i) => `w${(i * 7919) % 1000}q`)
      .join('-')
      .slice(0, 199);
    const a = await new Caller(server.app).signUp('long-pass@example.test', long + 'a', 'Long Pass');
    expect((await a.get('/api/auth/me')).status).toBe(200);
    const b = new Caller(server.app);
    await b.refreshToken();
    expect(
      (await b.post('/api/auth/login').send({ email: 'long-pass@example.test', password: long + 'b' })).status,
    ).toBe(401);
  });

  it('answers an e-mail that already has an account as it answers a new one (see signup-privacy.test.ts)', async () => {
    const caller = new Caller(server.app);
    await caller.refreshToken();
    const res = await caller
      .post('/api/auth/signup')
      .send({ email: 'maker@demo.test', password: 'whatever-long-enough-7', name: 'Copy' });
    expect(res.status).toBe(202);
    expect(await User.count({ where: { email: 'maker@demo.test' } })).toBe(1);
  });

  it('stores a scrypt hash, not the password', async () => {
    const user = await User.findOne({ where: { email: 'maker@demo.test' } });
    expect(user!.passwordHash.startsWith('scrypt$')).toBe(true);
    expect(user!.passwordHash).not.toContain('demo-maker-2026');
  });
});

describe('sign-in and sign-out', () => {
  it('signs in a demo account, changing the session id, with an HttpOnly SameSite=Lax cookie', async () => {
    const caller = new Caller(server.app);
    const csrfRes = await caller.agent.get('/api/auth/csrf');
    // A signed-out visitor has no session at all (the CSRF token rides on its own cookie).
    expect(sessionCookie(csrfRes)).toBeUndefined();
    caller.token = csrfRes.body.token;
    const res = await caller.post('/api/auth/login').send(demo.maker);
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ email: 'maker@demo.test', role: 'member' });
    const before = sessionCookie(res)!;
    // Signing in again from a signed-in browser starts another session id.
    await caller.refreshToken();
    const again = await caller.post('/api/auth/login').send(demo.maker);
    expect(again.status).toBe(200);
    const after = sessionCookie(again)!;
    expect(after).toBeDefined();
    expect(after.split(';')[0]).not.toBe(before.split(';')[0]);
    expect(after).toMatch(/HttpOnly/i);
    expect(after).toMatch(/SameSite=Lax/i);
    expect(after).not.toMatch(/Secure/i);
  });

  it('answers 401 for a wrong password and for an unknown account, with the same message', async () => {
    const caller = new Caller(server.app);
    await caller.refreshToken();
    const wrong = await caller
      .post('/api/auth/login')
      .send({ email: 'student@demo.test', password: 'not-the-password' });
    const unknown = await caller
      .post('/api/auth/login')
      .send({ email: 'nobody@demo.test', password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.error).toBe(unknown.body.error);
  });

  it('tells a disabled account it is disabled after the right password, and only then', async () => {
    const user = await newMember(server.app, 'switched-off');
    const id = (await user.get('/api/auth/me')).body.user.id;
    const admin = await new Caller(server.app).signIn(demo.admin.email, demo.admin.password);
    await admin.patch(`/api/admin/users/${id}`).send({ disabled: true }).expect(200);

    const caller = new Caller(server.app);
    await caller.refreshToken();
    const unknown = await caller.post('/api/auth/login').send({ email: 'nobody@demo.test', password: 'wrong-guess-1' });
    const wrong = await caller.post('/api/auth/login').send({ email: user.email, password: 'wrong-guess-1' });
    expect(wrong.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
    const right = await caller.post('/api/auth/login').send({ email: user.email, password: user.password });
    expect(right.status).toBe(403);
    expect(right.body.error).toMatch(/this account is disabled/);
    expect((await caller.get('/api/auth/me')).status).toBe(401);
  });

  it('destroys the session at sign-out', async () => {
    const caller = await new Caller(server.app).signIn(demo.student.email, demo.student.password);
    const count = await Session.count();
    const res = await caller.post('/api/auth/logout');
    expect(res.status).toBe(204);
    expect(await Session.count()).toBe(count - 1);
    expect((await caller.get('/api/auth/me')).status).toBe(401);
  });

  it('answers /me with 401 when signed out', async () => {
    const res = await request(server.app).get('/api/auth/me');
    expect(res.status).toBe(401);
    expect(res.body.error).toBeTruthy();
  });

  it('limits failed sign-ins per account with 429, even with the right password afterwards', async () => {
    const target = await newMember(server.app, 'limited');
    const attacker = new Caller(server.app);
    await attacker.refreshToken();
    for (let i = 0; i < 3; i++) {
      expect(
        (await attacker.post('/api/auth/login').send({ email: target.email, password: 'guess-' + i })).status,
      ).toBe(401);
    }
    const blocked = await attacker.post('/api/auth/login').send({ email: target.email, password: target.password });
    expect(blocked.status).toBe(429);
    expect(blocked.body.error).toMatch(/too many/);
    // Another account from the same address is not locked by this one.
    const other = new Caller(server.app);
    await other.refreshToken();
    expect((await other.post('/api/auth/login').send(demo.instructor)).status).toBe(200);
  });

  it('ends a session past the absolute limit even when active', async () => {
    const caller = await new Caller(server.app).signIn(demo.instructor.email, demo.instructor.password);
    const row = (await Session.findAll({ order: [['updatedAt', 'DESC']] }))[0];
    const data = JSON.parse(row.data!);
    data.signedInAt = Date.now() - 2 * 3600_000;
    await row.update({ data: JSON.stringify(data) });
    expect((await caller.get('/api/auth/me')).status).toBe(401);
  });

  it('refuses a session whose idle expiry has passed', async () => {
    const caller = await new Caller(server.app).signIn(demo.admin.email, demo.admin.password);
    await Session.update(
      { expires: new Date(Date.now() - 1000) },
      { where: { userId: (await User.findOne({ where: { email: demo.admin.email } }))!.id } },
    );
    expect((await caller.get('/api/auth/me')).status).toBe(401);
  });
});

describe('CSRF', () => {
  it('refuses a write without the token with 403', async () => {
    const caller = new Caller(server.app);
    await caller.refreshToken();
    const res = await caller.agent.post('/api/auth/login').send(demo.maker);
    expect(res.status).toBe(403);
    expect(res.body).toEqual({ error: 'missing or invalid CSRF token' });
  });

  it('refuses a forged token with 403', async () => {
    const caller = new Caller(server.app);
    await caller.refreshToken();
    const res = await caller.agent.post('/api/auth/login').set('X-CSRF-Token', 'forged-token-value').send(demo.maker);
    expect(res.status).toBe(403);
  });

  it("refuses another session's token", async () => {
    const a = new Caller(server.app);
    const b = new Caller(server.app);
    await a.refreshToken();
    await b.refreshToken();
    const res = await b.agent.post('/api/auth/login').set('X-CSRF-Token', a.token).send(demo.maker);
    expect(res.status).toBe(403);
  });

  it('needs a fresh token after sign-in, because the session changed', async () => {
    const caller = new Caller(server.app);
    const old = await caller.refreshToken();
    await caller.post('/api/auth/login').send(demo.maker).expect(200);
    const res = await caller.agent.post('/api/auth/logout').set('X-CSRF-Token', old);
    expect(res.status).toBe(403);
  });
});
