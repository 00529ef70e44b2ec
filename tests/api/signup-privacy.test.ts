import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { Caller, demo, startTestServer, type TestServer } from './helpers';
import { Session, User } from '../../server/models';

// Sign-up answers alike whether or not the address has an account: the mailbox learns which, the caller does not.
let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

const PASSWORD = 'tidal-furnace-orchard-42';

async function signUp(email: string, password = PASSWORD, name = 'Someone New') {
  const caller = new Caller(server.app);
  await caller.refreshToken();
  const started = performance.now();
  const res = await caller.post('/api/auth/signup').send({ email, password, name });
  return { caller, res, ms: performance.now() - started };
}

const confirmToken = (text: string) => {
  const m = /\/signup\/confirm\?token=([A-Za-z0-9_-]+)/.exec(text);
  if (!m) throw new Error('no confirmation link in the mail');
  return m[1];
};

const setCookies = (res: request.Response) => ([] as string[]).concat(res.headers['set-cookie'] ?? []);

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

describe('sign-up', () => {
  it('gives the same answer for a new address and for one that has an account, and signs neither in', async () => {
    const sessions = await Session.count();
    const fresh = await signUp('first.timer@example.test');
    const taken = await signUp(demo.maker.email);
    expect(taken.res.status).toBe(fresh.res.status);
    expect(fresh.res.status).toBe(202);
    expect(taken.res.body).toEqual(fresh.res.body);
    expect(fresh.res.body.status).toMatch(/check your e-mail/i);
    expect(setCookies(fresh.res)).toEqual([]);
    expect(setCookies(taken.res)).toEqual([]);
    expect((await fresh.caller.get('/api/auth/me')).status).toBe(401);
    expect((await taken.caller.get('/api/auth/me')).status).toBe(401);
    expect(await Session.count()).toBe(sessions);
  });

  it('takes about as long for an address with an account as for a new one (a password is hashed either way)', async () => {
    const fresh: number[] = [];
    const taken: number[] = [];
    for (let i = 0; i < 5; i++) {
      fresh.push((await signUp(`timing-${i}@example.test`)).ms);
      taken.push((await signUp(demo.student.email)).ms);
    }
    // A scrypt hash (tens of ms) dominates both; without it the taken address would answer several times faster.
    expect(median(taken)).toBeGreaterThan(0.5 * median(fresh));
  });

  it('mails the owner of a taken address instead, and leaves the account as it was', async () => {
    const { res } = await signUp(demo.instructor.email, 'another-try-at-this-9', 'Intruder');
    expect(res.status).toBe(202);
    const [mail] = await server.deliveredTo(demo.instructor.email);
    expect(mail.subject).toBe('Arcwright: someone tried to sign up with your address');
    expect(mail.text).toContain('http://arcwright.example.test/signin');
    expect(mail.text).toContain('http://arcwright.example.test/forgot');
    expect(mail.text).not.toMatch(/token=/);
    const caller = new Caller(server.app);
    await caller.refreshToken();
    const intruder = { email: demo.instructor.email, password: 'another-try-at-this-9' };
    expect((await caller.post('/api/auth/login').send(intruder)).status).toBe(401);
    expect((await caller.post('/api/auth/login').send(demo.instructor)).status).toBe(200);
    expect((await User.findOne({ where: { email: demo.instructor.email } }))!.name).not.toBe('Intruder');
  });

  it('creates a new account only from the link mailed to its address, once', async () => {
    const email = 'link.follower@example.test';
    await signUp(' Link.Follower@Example.test ', PASSWORD, 'Link Follower');
    expect(await User.count({ where: { email } })).toBe(0);
    const anon = new Caller(server.app);
    await anon.refreshToken();
    // Before the link is followed the account does not exist: the usual answer for a wrong password.
    expect((await anon.post('/api/auth/login').send({ email, password: PASSWORD })).status).toBe(401);

    const [mail] = await server.deliveredTo(email);
    expect(mail.subject).toBe('Arcwright: confirm your address to finish signing up');
    const token = confirmToken(mail.text);
    const done = await anon.post('/api/auth/signup/confirm').send({ token });
    expect(done.status).toBe(201);
    expect(done.body.user).toMatchObject({ email, name: 'Link Follower', role: 'member' });
    expect(done.body.user.passwordHash).toBeUndefined();
    expect((await anon.post('/api/auth/login').send({ email, password: PASSWORD })).status).toBe(200);
    await anon.refreshToken();

    const again = await anon.post('/api/auth/signup/confirm').send({ token });
    expect(again.status).toBe(400);
    expect(again.body.error).toMatch(/already has an account/);
    expect(await User.count({ where: { email } })).toBe(1);
  });

  it('refuses a made-up or altered confirmation link with 400', async () => {
    await signUp('altered@example.test');
    const [mail] = await server.deliveredTo('altered@example.test');
    const token = confirmToken(mail.text);
    const altered = token.slice(0, -2) + (token.endsWith('AA') ? 'BB' : 'AA');
    const anon = new Caller(server.app);
    await anon.refreshToken();
    for (const bad of ['made-up', altered]) {
      const res = await anon.post('/api/auth/signup/confirm').send({ token: bad });
      expect(res.status).toBe(400);
      expect(res.body.error).toMatch(/not valid/);
    }
    expect(await User.count({ where: { email: 'altered@example.test' } })).toBe(0);
  });
});
