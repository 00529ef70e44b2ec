import { describe, expect, it } from 'vitest';
import { Caller, demo } from './helpers';
import { withMailDown } from './mail-down';
import { PasswordReset } from '../../server/models';

// A mail server that refuses connections.
const down = withMailDown();

describe('when the SMTP server is down', () => {
  it('answers the reset request 202, keeps the token, retries the mail and logs each failure', async () => {
    const anon = new Caller(down.server.app);
    await anon.refreshToken();
    const res = await anon.post('/api/auth/reset-request').send({ email: demo.maker.email });
    expect(res.status).toBe(202);
    expect(await PasswordReset.count()).toBe(1);
    await down.server.mail.mailer.idle();
    const mailLines = down.failuresTo('maker@demo.test');
    expect(mailLines).toHaveLength(4);
    expect(mailLines[3]).toMatch(/giving up/);
    // Nothing was sent, so nothing is in the log of sent mail.
    expect(await down.server.mailTo(demo.maker.email)).toHaveLength(0);
  });
});
