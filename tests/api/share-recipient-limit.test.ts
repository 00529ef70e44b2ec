import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Caller, newMember, startTestServer, type TestServer } from './helpers';
import { sketchFile } from './fixtures';

// The share mail's bound per recipient, from all accounts together. In a file of its own: its server is the
// only one in the process, as the rate counters bind to the database of the app built last.

async function ownSketch(owner: Caller, name = 'Shared rear') {
  const created = await owner.post('/api/sketches').send({ name, document: sketchFile() });
  expect(created.status).toBe(201);
  return created.body.id as number;
}

describe('share mails per recipient', () => {
  let limited: TestServer;
  beforeAll(async () => {
    limited = await startTestServer({ SHARE_MAIL_MAX_PER_RECIPIENT: '2' });
  });
  afterAll(async () => {
    await limited.close();
  });

  it('answers 429 once one address has had its share of mails this hour, whichever accounts send them', async () => {
    const senders = [await newMember(limited.app, 'first'), await newMember(limited.app, 'second')];
    const third = await newMember(limited.app, 'third');
    for (const sender of senders) {
      const id = await ownSketch(sender);
      const res = await sender.post(`/api/sketches/${id}/share`).send({ mode: 'link', email: 'popular@example.test' });
      expect(res.status).toBe(200);
    }
    const id = await ownSketch(third);
    // The same address in capitals is the same recipient.
    const refused = await third.post(`/api/sketches/${id}/share`).send({ mode: 'link', email: 'Popular@Example.test' });
    expect(refused.status).toBe(429);
    expect(refused.body.error).toMatch(/too many share mails to this address/);
    expect(await limited.mailTo('popular@example.test')).toHaveLength(2);
    // The account itself may still mail others.
    const other = await third.post(`/api/sketches/${id}/share`).send({ mode: 'link', email: 'quiet@example.test' });
    expect(other.status).toBe(200);
  });

  it('counts an address the counters cannot store as it is (too long, a NUL) and still names the problem (400)', async () => {
    // The recipient's count is taken before the body is checked; the key column holds 255 characters.
    const sender = await newMember(limited.app, 'long');
    const id = await ownSketch(sender);
    const long = `${'a'.repeat(300)}@example.test`;
    const res = await sender.post(`/api/sketches/${id}/share`).send({ mode: 'link', email: long });
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body)).toMatch(/email/i);
    // A NUL, which PostgreSQL's text cannot hold, is counted too and refused by name.
    const nul = await sender.post(`/api/sketches/${id}/share`).send({ mode: 'link', email: 'a\u0000@example.test' });
    expect(nul.status).toBe(400);
    expect(JSON.stringify(nul.body)).toMatch(/email/i);
  });
});
