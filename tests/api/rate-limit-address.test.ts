import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Caller, demo, startTestServer, type TestServer } from './helpers';

// Failed sign-ins counted per address, across accounts.
let server: TestServer;
beforeAll(async () => {
  server = await startTestServer({ LOGIN_MAX_PER_ADDRESS: '4', LOGIN_MAX_PER_ACCOUNT: '100' });
});
afterAll(async () => {
  await server.close();
});

describe('sign-in limit per address', () => {
  it('answers 429 once one address has failed too often, whichever accounts it tried', async () => {
    const caller = new Caller(server.app);
    await caller.refreshToken();
    const accounts = ['a@example.test', 'b@example.test', 'c@example.test', 'd@example.test'];
    for (const email of accounts) {
      expect((await caller.post('/api/auth/login').send({ email, password: 'wrong-password' })).status).toBe(401);
    }
    const res = await caller.post('/api/auth/login').send(demo.maker);
    expect(res.status).toBe(429);
    expect(res.body.error).toMatch(/too many sign-in attempts/);
  });
});
