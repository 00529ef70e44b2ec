import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { Caller, demo, startTestServer, type TestServer } from './helpers';
import { MailQueueItem } from '../../server/models';
import { createTestDatabase, type TestDatabase } from './test-database';
import { freePort, smtpServer } from './fixtures/smtp';

// The outgoing mail queue lives in the database: it outlives a restart, and instances sharing it send each message once.

let database: TestDatabase;
let smtpPort: number;
const open: TestServer[] = [];
const logged: unknown[][] = [];
const originalError = console.error;

beforeAll(async () => {
  console.error = (...args: unknown[]) => void logged.push(args);
  database = await createTestDatabase();
  smtpPort = await freePort();
});
afterEach(async () => {
  while (open.length) await open.pop()!.close();
});
afterAll(async () => {
  console.error = originalError;
  await database.drop();
});

/** An app on the test's one database, sending to the test's SMTP port. */
async function instance(): Promise<TestServer> {
  const server = await startTestServer({ SMTP_URL: `smtp://127.0.0.1:${smtpPort}` }, { database, retryDelayMs: 100 });
  open.push(server);
  return server;
}

async function until(check: () => Promise<boolean>, what: string, ms = 10_000): Promise<void> {
  const end = Date.now() + ms;
  while (!(await check())) {
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 20));
  }
}

describe('the mail queue in the database', () => {
  it('keeps mail queued while the SMTP server is down across a restart, and sends it once when it is up', async () => {
    const first = await instance();
    const anon = new Caller(first.app);
    await anon.refreshToken();
    expect((await anon.post('/api/auth/reset-request').send({ email: demo.maker.email })).status).toBe(202);
    // The first attempt fails (nothing listens); the message waits for its retry.
    await until(
      async () => (await MailQueueItem.findOne({ where: { to: demo.maker.email } }))?.attempts === 1,
      'attempt 1',
    );
    await open.pop()!.close();
    const restarted = await instance();
    const queued = await MailQueueItem.findOne({ where: { to: demo.maker.email } });
    expect(queued).toMatchObject({ state: 'queued', attempts: 1 });
    expect(queued!.text).toContain('/reset?token=');

    const smtp = await smtpServer(smtpPort);
    try {
      await restarted.mail.mailer.idle();
      // A later look at the queue finds nothing more to send.
      await new Promise((resolve) => setTimeout(resolve, 300));
      await restarted.mail.mailer.idle();
      expect(smtp.received).toEqual([{ to: demo.maker.email, subject: 'Arcwright: reset your password' }]);
      const sent = await MailQueueItem.findOne({ where: { to: demo.maker.email } });
      expect(sent).toMatchObject({ state: 'sent', attempts: 2, text: '', html: '' });
      expect(await restarted.mailTo(demo.maker.email)).toHaveLength(1);
    } finally {
      await smtp.close();
    }
  });

  it('sends each message once when two instances work through one queue at the same time', async () => {
    const smtp = await smtpServer(smtpPort);
    try {
      const a = await instance();
      const b = await instance();
      const to = (i: number) => `queued-${i}@example.test`;
      const message = (i: number) => ({ to: to(i), subject: `message ${i}`, text: 't', html: '<p>t</p>' });
      await Promise.all(Array.from({ length: 12 }, (_, i) => (i % 2 ? a : b).mail.mailer.queue(message(i))));
      await Promise.all([a.mail.mailer.idle(), b.mail.mailer.idle()]);
      const subjects = smtp.received.map((m) => m.subject).sort();
      expect(subjects).toEqual(Array.from({ length: 12 }, (_, i) => `message ${i}`).sort());
      expect(
        await MailQueueItem.count({ where: { to: Array.from({ length: 12 }, (_, i) => to(i)), state: 'sent' } }),
      ).toBe(12);
    } finally {
      await smtp.close();
    }
  });
});
