import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Caller, demo, startTestServer, type TestServer } from './helpers';
import { PasswordReset } from '../../server/models';

// A mail server that refuses connections (nothing listens on the discard port).
let server: TestServer;
const logged: unknown[][] = [];
const originalError = console.error;
beforeAll(async () => {
  console.error = (...args: unknown[]) => {
    logged.push(args);
  };
  server = await startTestServer({ SMTP_URL: 'smtp://127.0.0.1:9' });
});
afterAll(async () => {
  await server.close();
  console.error = originalError;
});

describe('when the SMTP server is down', () => {
  it('answers the reset request 202, keeps the token, retries the mail and logs each failure', async () => {
    const anon = new Caller(server.app);
    await anon.refreshToken();
    const res = await anon.post('/api/auth/reset-request').send({ email: demo.maker.email });
    expect(res.status).toBe(202);
    expect(await PasswordReset.count()).toBe(1);
    await server.mail.mailer.idle();
    const mailLines = logged.map((args) => String(args[0])).filter((l) => l.includes('mail to maker@demo.test'));
    expect(mailLines).toHaveLength(4);
    expect(mailLines[3]).toMatch(/giving up/);
    // Nothing was sent, so nothing is in the log of sent mail.
    expect(await server.mailTo(demo.maker.email)).toHaveLength(0);
  });
});
