import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Caller, newMember, startTestServer, type TestServer } from './helpers';

// Passwords people guess first are refused wherever a password is chosen: at sign-up and at reset.
let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

async function signUp(email: string, password: string) {
  const caller = new Caller(server.app);
  await caller.refreshToken();
  return caller.post('/api/auth/signup').send({ email, password, name: 'Ada Quillfeather' });
}

/** The problem the answer lists for the password field. */
const passwordProblem = (details: unknown) =>
  ((details ?? []) as string[]).find((d) => d.startsWith('password:')) ?? '(none)';

describe('choosing a password', () => {
  it('refuses passwords from the common-password lists with a reason and a way out', async () => {
    // Each is on the lists of most-used passwords that come with @zxcvbn-ts/language-common.
    for (const password of ['password1234', 'qwertyuiop', '1234567890', 'iloveyou123']) {
      const res = await signUp('careful.person@example.test', password);
      expect(res.status, password).toBe(400);
      expect(res.body.error, password).toBe('this password is too easy to guess');
      expect(passwordProblem(res.body.details), password).toMatch(/^password: .+\. .+/);
    }
    const res = await signUp('careful.person@example.test', 'password1234');
    expect(passwordProblem(res.body.details)).toMatch(/most used passwords/i);
  });

  it('refuses the e-mail address, its part before the @ and the name as the password', async () => {
    const email = 'rosalind.quarry@example.test';
    for (const password of [email, 'Rosalind.Quarry', 'rosalind.quarry']) {
      const res = await signUp(email, password);
      expect(res.status, password).toBe(400);
      expect(passwordProblem(res.body.details), password).toMatch(/your e-mail address/);
    }
    const named = await signUp('ada@example.test', 'Ada Quillfeather');
    expect(named.status).toBe(400);
  });

  it('takes a long passphrase of uncommon words', async () => {
    const res = await signUp('strong.choice@example.test', 'gravel-otter-lantern-cobalt');
    expect(res.status).toBe(202);
  });

  it('refuses a weak new password at reset too, and the account keeps its old one', async () => {
    const user = await newMember(server.app, 'resetter');
    const anon = new Caller(server.app);
    await anon.refreshToken();
    await anon.post('/api/auth/reset-request').send({ email: user.email }).expect(202);
    const [mail] = await server.deliveredTo(user.email);
    const token = /\/reset\?token=([A-Za-z0-9_-]+)/.exec(mail.text)![1];
    for (const password of ['letmein123', user.email]) {
      const res = await anon.post('/api/auth/reset').send({ token, password });
      expect(res.status, password).toBe(400);
      expect(res.body.error).toBe('this password is too easy to guess');
    }
    // The refused tries did not use up the link.
    expect((await anon.post('/api/auth/reset').send({ token, password: 'marble-heron-quarry-57' })).status).toBe(204);
  });
});
