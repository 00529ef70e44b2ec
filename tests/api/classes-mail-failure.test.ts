import { describe, expect, it } from 'vitest';
import { withMailDown } from './mail-down';
import { daysFromNow, invite, newClass, newInstructor, newStudent, ownSketch, storedMember } from './classHelpers';
import { ClassInvite, Feedback } from '../../server/models';

// A mail server that refuses connections: no invitation is recorded as sent, and the answer names each address
// whose mail failed. Accounts are stored directly: signing up needs mail.
const down = withMailDown();

describe('when the SMTP server is down', () => {
  it('records no invitation as sent, names each failed address, and logs each failure', async () => {
    const teacher = await newInstructor(down.server.app, 'teacher', storedMember);
    const klass = await newClass(teacher);
    const result = await invite(teacher, klass, ['down1@example.test', 'not an address', 'down2@example.test']);
    expect(result.sent).toEqual([]);
    expect(result.refused).toEqual([
      // An array's entries are taken as they are (a string would be split on its spaces).
      { email: 'not an address', problem: 'not an e-mail address' },
      { email: 'down1@example.test', problem: 'the invitation mail could not be sent; try this address again later' },
      { email: 'down2@example.test', problem: 'the invitation mail could not be sent; try this address again later' },
    ]);
    expect(await ClassInvite.count({ where: { classId: klass.id } })).toBe(0);
    const roster = await teacher.get(`/api/classes/${klass.id}`);
    expect(roster.body.invites).toEqual([]);
    const lines = down.failuresTo('down1@example.test');
    expect(lines).toHaveLength(1);
    expect(await down.server.mailTo('down1@example.test')).toHaveLength(0);
  });

  it('a resend that fails changes nothing: the invitation keeps its link and date', async () => {
    const teacher = await newInstructor(down.server.app, 'teacher', storedMember);
    const klass = await newClass(teacher);
    // An invitation whose mail went out while the server was up (written here as the service writes it).
    const sentAt = new Date(Date.now() - 3600_000);
    const row = await ClassInvite.create({
      classId: klass.id,
      email: 'earlier@example.test',
      tokenHash: 'a'.repeat(64),
      invitedById: null,
      expiresAt: new Date(Date.now() + 86_400_000),
      sentAt,
    });
    const res = await teacher.post(`/api/classes/${klass.id}/invites/${row.id}/resend`);
    expect(res.status).toBe(503);
    expect(res.body.error).toBe(
      'the invitation mail to earlier@example.test could not be sent; nothing changed, try again later',
    );
    await row.reload();
    expect(row.tokenHash).toBe('a'.repeat(64));
    expect(row.sentAt!.getTime()).toBe(sentAt.getTime());
  });

  it('keeps the feedback when its mail cannot go, and retries that mail', async () => {
    const teacher = await newInstructor(down.server.app, 'teacher', storedMember);
    const klass = await newClass(teacher);
    const sketch = await ownSketch(teacher);
    const made = await teacher
      .post(`/api/classes/${klass.id}/assignments`)
      .send({ sketchId: sketch.id, title: 'Lab', dueAt: daysFromNow(2) });
    const student = await newStudent(down.server.app, klass, 'student', storedMember);
    await student.post(`/api/assignments/${made.body.id}/copy`).expect(201);
    const handIn = (await student.post(`/api/assignments/${made.body.id}/hand-ins`).expect(201)).body;
    const res = await teacher
      .post(`/api/hand-ins/${handIn.id}/feedback`)
      .send({ text: 'Kept whatever the mail does.' });
    expect(res.status).toBe(200);
    expect(await Feedback.count({ where: { handInId: handIn.id } })).toBe(1);
    await down.server.mail.mailer.idle();
    const lines = down.failuresTo(student.email);
    expect(lines).toHaveLength(4);
    expect(lines[3]).toMatch(/giving up/);
  });
});
