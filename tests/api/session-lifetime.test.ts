import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { Caller, demo, startTestServer, type TestServer } from './helpers';
import { Session } from '../../server/models';
import { loadConfig } from '../../server/config';

// How long a session lives: none before sign-in, idle expiry pushed on by activity, an absolute end.
let server: TestServer;
beforeAll(async () => {
  server = await startTestServer({ SESSION_IDLE_MINUTES: '1', SESSION_ABSOLUTE_HOURS: '1' });
});
afterAll(async () => {
  await server.close();
});
afterEach(() => {
  vi.useRealTimers();
});

describe('signed-out visitors', () => {
  it('get CSRF tokens without a session row being written', async () => {
    const before = await Session.count();
    for (let i = 0; i < 5; i++) {
      const res = await new Caller(server.app).agent.get('/api/auth/csrf');
      expect(res.status).toBe(200);
      expect(res.body.token).toMatch(/^[A-Za-z0-9_-]{20,}$/);
    }
    const caller = new Caller(server.app);
    for (let i = 0; i < 5; i++) await caller.refreshToken();
    expect(await Session.count()).toBe(before);
  });

  it('still need that token for a signed-out write, and the token of their own browser', async () => {
    const a = new Caller(server.app);
    const b = new Caller(server.app);
    await a.refreshToken();
    await b.refreshToken();
    expect((await a.agent.post('/api/auth/reset-request').send({ email: 'x@example.test' })).status).toBe(403);
    const crossed = await b.agent
      .post('/api/auth/reset-request')
      .set('X-CSRF-Token', a.token)
      .send({ email: 'x@example.test' });
    expect(crossed.status).toBe(403);
    expect((await a.post('/api/auth/reset-request').send({ email: 'x@example.test' })).status).toBe(202);
    // A signed-out token stops working once signed in: the session has its own.
    const signedOutToken = a.token;
    await a.post('/api/auth/login').send(demo.student).expect(200);
    expect((await a.agent.post('/api/auth/logout').set('X-CSRF-Token', signedOutToken)).status).toBe(403);
    await a.refreshToken();
    expect((await a.post('/api/auth/logout')).status).toBe(204);
  });

  it('write a session row only at sign-in', async () => {
    const before = await Session.count();
    const caller = new Caller(server.app);
    await caller.refreshToken();
    expect(await Session.count()).toBe(before);
    await caller.post('/api/auth/login').send(demo.maker).expect(200);
    expect(await Session.count()).toBe(before + 1);
  });
});

describe('idle and absolute expiry', () => {
  it('keeps a session active every 20 s well past the idle limit, and ends it after a minute of quiet', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    const caller = await new Caller(server.app).signIn(demo.instructor.email, demo.instructor.password);
    // Five idle limits (1 minute each) of a request every 20 s.
    for (let t = 20; t <= 300; t += 20) {
      vi.advanceTimersByTime(20_000);
      expect((await caller.get('/api/auth/me')).status, `after ${t} s`).toBe(200);
    }
    vi.advanceTimersByTime(61_000);
    expect((await caller.get('/api/auth/me')).status).toBe(401);
  });

  it('ends a session at the absolute limit however active it is', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    const caller = await new Caller(server.app).signIn(demo.admin.email, demo.admin.password);
    // One hour of a request every 30 s, then one more past the hour.
    for (let t = 30; t < 3600; t += 30) {
      vi.advanceTimersByTime(30_000);
      if (t % 600 === 0) expect((await caller.get('/api/auth/me')).status, `after ${t} s`).toBe(200);
      else await caller.get('/api/auth/me');
    }
    vi.advanceTimersByTime(60_000);
    expect((await caller.get('/api/auth/me')).status).toBe(401);
  });

  it('defaults to 30 minutes idle and 12 hours absolute', () => {
    const config = loadConfig({});
    expect(config.sessionIdleMs).toBe(30 * 60_000);
    expect(config.sessionAbsoluteMs).toBe(12 * 3600_000);
  });
});
