import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { demo, startTestServer, type TestServer } from './helpers';

// Behind a TLS-terminating proxy (TRUST_PROXY=1) the cookies are Secure when the proxy says https.
let server: TestServer;
beforeAll(async () => {
  server = await startTestServer({ TRUST_PROXY: '1' });
});
afterAll(async () => {
  await server.close();
});

const cookieOf = (res: request.Response, name: string) =>
  ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith(`${name}=`)) ?? '';

/** The signed-out CSRF cookie and the session cookie of a sign-in, each request forwarded as `proto`. */
async function cookiesOver(proto: 'http' | 'https'): Promise<{ csrf: string; session: string }> {
  const csrfRes = await request(server.app).get('/api/auth/csrf').set('X-Forwarded-Proto', proto);
  // Sent by hand: the test's own connection is plain http, so a cookie jar would hold back a Secure cookie.
  const login = await request(server.app)
    .post('/api/auth/login')
    .set('X-Forwarded-Proto', proto)
    .set('Cookie', cookieOf(csrfRes, 'arcwright.csrf').split(';')[0])
    .set('X-CSRF-Token', csrfRes.body.token)
    .send(demo.student);
  expect(login.status).toBe(200);
  return { csrf: cookieOf(csrfRes, 'arcwright.csrf'), session: cookieOf(login, 'arcwright.sid') };
}

describe('cookies behind a proxy', () => {
  it('are Secure for requests the proxy received over https', async () => {
    for (const cookie of Object.values(await cookiesOver('https'))) {
      expect(cookie).toMatch(/; Secure/i);
      expect(cookie).toMatch(/HttpOnly/i);
    }
  });

  it('are not Secure for plain http', async () => {
    for (const cookie of Object.values(await cookiesOver('http'))) {
      expect(cookie).not.toBe('');
      expect(cookie).not.toMatch(/; Secure/i);
    }
  });
});
