import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startTestServer, type TestServer } from './helpers';

// Behind a TLS-terminating proxy (TRUST_PROXY=1) the cookie is Secure when the proxy says https.
let server: TestServer;
beforeAll(async () => {
  server = await startTestServer({ TRUST_PROXY: '1' });
});
afterAll(async () => {
  await server.close();
});

const cookieOf = (res: request.Response) =>
  ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('arcwright.sid=')) ?? '';

describe('session cookie behind a proxy', () => {
  it('is Secure for requests the proxy received over https', async () => {
    const res = await request(server.app).get('/api/auth/csrf').set('X-Forwarded-Proto', 'https');
    expect(cookieOf(res)).toMatch(/; Secure/i);
    expect(cookieOf(res)).toMatch(/HttpOnly/i);
  });

  it('is not Secure for plain http', async () => {
    const res = await request(server.app).get('/api/auth/csrf');
    expect(cookieOf(res)).not.toBe('');
    expect(cookieOf(res)).not.toMatch(/; Secure/i);
  });
});
