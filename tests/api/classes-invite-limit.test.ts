import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from './helpers';
import { newClass, newInstructor } from './classHelpers';
import { ClassInvite } from '../../server/models';

// A class's own hourly bound on invitation mails (CLASS_INVITE_MAX_PER_HOUR), set low here.
let limited: TestServer;
beforeAll(async () => {
  limited = await startTestServer({ CLASS_INVITE_MAX_PER_HOUR: '3' });
});
afterAll(async () => {
  await limited.close();
});

describe('invitation mails per class per hour', () => {
  it('beyond the bound are refused before any mail goes, saying how many more may go', async () => {
    const teacher = await newInstructor(limited.app);
    const klass = await newClass(teacher);
    const res = await teacher
      .post(`/api/classes/${klass.id}/invites`)
      .send({ emails: ['h1@example.test', 'h2@example.test'] });
    expect(res.status).toBe(200);
    const over = await teacher
      .post(`/api/classes/${klass.id}/invites`)
      .send({ emails: ['h3@example.test', 'h4@example.test'] });
    expect(over.status).toBe(429);
    expect(over.body.error).toBe(
      'a class sends at most 3 invitation mails an hour; 2 went out in the last hour, so at most 1 more can go now; ' +
        'try the rest later',
    );
    expect(await limited.mailTo('h3@example.test')).toHaveLength(0);
    expect(await ClassInvite.count({ where: { classId: klass.id } })).toBe(2);
    // Within the bound it goes on; a resend counts too.
    await teacher
      .post(`/api/classes/${klass.id}/invites`)
      .send({ emails: ['h3@example.test'] })
      .expect(200);
    const resend = await teacher.post(`/api/classes/${klass.id}/invites/${res.body.sent[0].id}/resend`);
    expect(resend.status).toBe(429);
  });
});
