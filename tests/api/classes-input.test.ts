import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Op } from 'sequelize';
import { Caller, newMember, startTestServer, type TestServer } from './helpers';
import { daysFromNow, invitationToken, invite, newClass, newInstructor, newStudent, ownSketch } from './classHelpers';
import { Assignment, ClassGroup, ClassInvite, ClassMember, HandIn, OutboxMessage } from '../../server/models';
import { INVITES_PER_REQUEST_MAX } from '../../shared/schema/classes';

// Bad input to the classes API: each gets a clear message naming the problem, and nothing half-done stays.
let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

describe('a pasted list of addresses', () => {
  it('of 500, half malformed: names every bad one, sends only the good ones, records nothing for the bad', async () => {
    const teacher = await newInstructor(server.app);
    const klass = await newClass(teacher, 'Big lecture');
    const good = Array.from({ length: 250 }, (_, i) => `student${i}@big-lecture.example.test`);
    const malformed = [
      'no-at-sign.example.test',
      'two@@example.test',
      '@example.test',
      'trailing@',
      'spaces in@example.test',
      'comma,inside@example.test',
    ];
    const bad = Array.from({ length: 250 }, (_, i) => `${malformed[i % malformed.length].replace('@', `${i}@`)}#${i}`);
    const emails = good.flatMap((g, i) => [g, bad[i]]);
    expect(emails).toHaveLength(INVITES_PER_REQUEST_MAX);

    const result = await invite(teacher, klass, emails);
    expect(result.sent.map((s) => s.email)).toEqual(good);
    expect(result.skipped).toEqual([]);
    expect(result.refused).toHaveLength(250);
    expect(result.refused.map((r) => r.email).sort()).toEqual([...bad].sort());
    expect(new Set(result.refused.map((r) => r.problem))).toEqual(new Set(['not an e-mail address']));

    expect(await ClassInvite.count({ where: { classId: klass.id } })).toBe(250);
    const mailed = await OutboxMessage.count({ where: { to: { [Op.like]: '%@big-lecture.example.test' } } });
    expect(mailed).toBe(250);
    // Nothing at all for a bad address: no invitation and no mail.
    for (const b of bad.slice(0, 12)) {
      expect(await ClassInvite.count({ where: { email: b } })).toBe(0);
      expect(await OutboxMessage.count({ where: { to: b } })).toBe(0);
    }
    // The share-mail limit (20 an hour) did not stop a class of 250, and it is still free for sharing.
    const sketch = await ownSketch(teacher);
    const shared = await teacher
      .post(`/api/sketches/${sketch.id}/share`)
      .send({ mode: 'link', email: 'colleague@example.test' });
    expect(shared.status).toBe(200);
    // 250 mails through the local catcher: seconds on a quiet machine, far more on a busy one.
  }, 120_000);

  it('as one string, split on commas, semicolons and new lines, each repeat invited once', async () => {
    const teacher = await newInstructor(server.app);
    const klass = await newClass(teacher);
    const result = await invite(
      teacher,
      klass,
      'a@paste.example.test, b@paste.example.test;\nA@paste.example.test\n<c@paste.example.test>  not-an-address',
    );
    expect(result.sent.map((s) => s.email)).toEqual([
      'a@paste.example.test',
      'b@paste.example.test',
      'c@paste.example.test',
    ]);
    expect(result.skipped).toEqual([
      { email: 'a@paste.example.test', reason: expect.stringMatching(/more than once/) },
    ]);
    expect(result.refused).toEqual([{ email: 'not-an-address', problem: 'not an e-mail address' }]);
    expect(await server.mailTo('a@paste.example.test')).toHaveLength(1);
  });

  it('that is empty or longer than the limit is refused as a whole, naming the field', async () => {
    const teacher = await newInstructor(server.app);
    const klass = await newClass(teacher);
    const empty = await teacher.post(`/api/classes/${klass.id}/invites`).send({ emails: ' ,; ' });
    expect(empty.status).toBe(400);
    expect(empty.body.error).toMatch(/^emails: the list holds no address/);
    const many = Array.from({ length: 501 }, (_, i) => `x${i}@example.test`).join('\n');
    const tooMany = await teacher.post(`/api/classes/${klass.id}/invites`).send({ emails: many });
    expect(tooMany.status).toBe(400);
    expect(tooMany.body.error).toMatch(/501 addresses; at most 500/);
    const notAList = await teacher.post(`/api/classes/${klass.id}/invites`).send({ emails: 42 });
    expect(notAList.status).toBe(400);
    expect(notAList.body.details.join(' ')).toMatch(/emails/);
    expect(await ClassInvite.count({ where: { classId: klass.id } })).toBe(0);
  });
});

describe('an invitation link', () => {
  it('that expired is refused with 410 and the date, and joins nobody', async () => {
    const teacher = await newInstructor(server.app);
    const klass = await newClass(teacher);
    const email = `expired-${Date.now()}@example.test`;
    await invite(teacher, klass, [email]);
    const token = await invitationToken(server, email);
    // The invitation's time runs out (as 14 days on the clock would).
    await ClassInvite.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { email } });
    const preview = await new Caller(server.app).get(`/api/invites/${token}`);
    expect(preview.body.state).toBe('expired');
    const student = await newMember(server.app);
    const res = await student.post(`/api/invites/${token}/accept`);
    expect(res.status).toBe(410);
    expect(res.body.error).toMatch(/^this invitation expired on \d{4}-\d\d-\d\d; ask the instructor to send it again$/);
    expect(await ClassMember.count({ where: { classId: klass.id } })).toBe(0);
    expect((await teacher.get(`/api/classes/${klass.id}`)).body.invites[0].state).toBe('expired');
  });

  it('that was used already is refused with 409 for a second person, who does not join', async () => {
    const teacher = await newInstructor(server.app);
    const klass = await newClass(teacher);
    const email = `reused-${Date.now()}@example.test`;
    await invite(teacher, klass, [email]);
    const token = await invitationToken(server, email);
    const first = await newMember(server.app, 'first');
    await first.post(`/api/invites/${token}/accept`).expect(200);
    const second = await newMember(server.app, 'second');
    const res = await second.post(`/api/invites/${token}/accept`);
    expect(res.status).toBe(409);
    expect(res.body.error).toMatch(/this invitation has been used already/);
    expect((await first.post(`/api/invites/${token}/accept`)).status).toBe(409);
    expect(await ClassMember.count({ where: { classId: klass.id } })).toBe(1);
  });

  it('that never existed is 404 naming the link, for a made-up or malformed token', async () => {
    const guest = new Caller(server.app);
    for (const token of ['x'.repeat(43), 'short', '%2e%2e']) {
      const res = await guest.get(`/api/invites/${token}`);
      expect(res.status).toBe(404);
      expect(res.body.error).toMatch(/this invitation link is not valid/);
    }
  });

  it('to a class closed since is refused with 409', async () => {
    const teacher = await newInstructor(server.app);
    const klass = await newClass(teacher, 'Closing lab');
    const email = `closing-${Date.now()}@example.test`;
    await invite(teacher, klass, [email]);
    const token = await invitationToken(server, email);
    await teacher.patch(`/api/classes/${klass.id}`).send({ closed: true }).expect(200);
    const student = await newMember(server.app);
    const res = await student.post(`/api/invites/${token}/accept`);
    expect(res.status).toBe(409);
    expect(res.body.error).toBe('the class "Closing lab" is closed: it takes no new students');
    expect(await ClassMember.count({ where: { classId: klass.id } })).toBe(0);
    expect((await new Caller(server.app).get(`/api/invites/${token}`)).body.state).toBe('pending');
  });
});

describe('classes and assignments', () => {
  it('a class needs a name; a long one is refused naming the field', async () => {
    const teacher = await newInstructor(server.app);
    const before = await ClassGroup.count();
    for (const body of [{}, { name: '   ' }, { name: 'x'.repeat(121) }, { name: 'Lab', extra: 1 }]) {
      const res = await teacher.post('/api/classes').send(body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body.details.join(' ')).toMatch(/name|extra/);
    }
    expect(await ClassGroup.count()).toBe(before);
  });

  it('a due date in the past is refused at creation naming dueAt, and no assignment is made', async () => {
    const teacher = await newInstructor(server.app);
    const klass = await newClass(teacher);
    const sketch = await ownSketch(teacher);
    const past = new Date(Date.now() - 3600_000).toISOString();
    const res = await teacher
      .post(`/api/classes/${klass.id}/assignments`)
      .send({ sketchId: sketch.id, title: 'Too late', dueAt: past });
    expect(res.status).toBe(400);
    expect(res.body.error).toBe(`dueAt must lie in the future; ${past} has passed`);
    const notADate = await teacher
      .post(`/api/classes/${klass.id}/assignments`)
      .send({ sketchId: sketch.id, title: 'Never', dueAt: 'next friday' });
    expect(notADate.status).toBe(400);
    expect(notADate.body.details.join(' ')).toMatch(/dueAt/);
    expect(await Assignment.count({ where: { classId: klass.id } })).toBe(0);
  });

  it("an assignment is made only from the instructor's own sketch", async () => {
    const teacher = await newInstructor(server.app);
    const klass = await newClass(teacher);
    const someone = await newMember(server.app);
    const theirs = await ownSketch(someone);
    const res = await teacher
      .post(`/api/classes/${klass.id}/assignments`)
      .send({ sketchId: theirs.id, title: 'Borrowed', dueAt: daysFromNow(2) });
    expect(res.status).toBe(404);
    expect(res.body.error).toBe(`sketchId: no sketch ${theirs.id} among your own`);
    expect(await Assignment.count({ where: { classId: klass.id } })).toBe(0);
  });

  it('a hand-in after the class is closed is refused with a clear message and nothing stored', async () => {
    const teacher = await newInstructor(server.app);
    const klass = await newClass(teacher, 'Finished lab');
    const sketch = await ownSketch(teacher);
    const made = await teacher
      .post(`/api/classes/${klass.id}/assignments`)
      .send({ sketchId: sketch.id, title: 'Final', dueAt: daysFromNow(2) });
    const student = await newStudent(server.app, klass);
    await student.post(`/api/assignments/${made.body.id}/copy`).expect(201);
    await teacher.patch(`/api/classes/${klass.id}`).send({ closed: true }).expect(200);

    const res = await student.post(`/api/assignments/${made.body.id}/hand-ins`);
    expect(res.status).toBe(409);
    expect(res.body.error).toBe('the class "Finished lab" is closed: it takes no more hand-ins');
    expect(await HandIn.count({ where: { assignmentId: made.body.id } })).toBe(0);
    // Still readable: the student sees the assignment, marked closed.
    const seen = await student.get(`/api/assignments/${made.body.id}`);
    expect(seen.status).toBe(200);
    expect(seen.body.classClosed).toBe(true);
    const more = await teacher
      .post(`/api/classes/${klass.id}/assignments`)
      .send({ sketchId: sketch.id, title: 'Another', dueAt: daysFromNow(2) });
    expect(more.status).toBe(409);
    expect(more.body.error).toMatch(/closed: it takes no new assignments/);
  });

  it('a hand-in without a copy says to start one; feedback needs text', async () => {
    const teacher = await newInstructor(server.app);
    const klass = await newClass(teacher);
    const sketch = await ownSketch(teacher);
    const made = await teacher
      .post(`/api/classes/${klass.id}/assignments`)
      .send({ sketchId: sketch.id, title: 'Lab', dueAt: daysFromNow(2) });
    const student = await newStudent(server.app, klass);
    const res = await student.post(`/api/assignments/${made.body.id}/hand-ins`);
    expect(res.status).toBe(409);
    expect(res.body.error).toMatch(/no copy of this assignment to hand in; start your copy first/);
    await student.post(`/api/assignments/${made.body.id}/copy`).expect(201);
    const handIn = (await student.post(`/api/assignments/${made.body.id}/hand-ins`).expect(201)).body;
    const blank = await teacher.post(`/api/hand-ins/${handIn.id}/feedback`).send({ text: '  ' });
    expect(blank.status).toBe(400);
    expect(blank.body.details).toEqual(['text: must not be empty']);
  });
});
