import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Caller, newMember, startTestServer, type TestServer } from './helpers';
import { daysFromNow, invitationToken, invite, newClass, newInstructor, newStudent, ownSketch } from './classHelpers';
import { Assignment, ClassInvite } from '../../server/models';
import {
  assignmentCopySchema,
  assignmentDetailSchema,
  classDetailSchema,
  classInviteSchema,
  classListSchema,
  handInDetailSchema,
  handInRowSchema,
  invitePreviewSchema,
  joinResultSchema,
} from '../../shared/schema/classes';
import { startingTargets } from '../../shared/display/targets';

// A term's class from invitation to feedback, through the API and the mail the app sends.
let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

describe('a class from invitation to feedback', () => {
  it('invites by mail, joins through the link, hands in a variant and mails the feedback', async () => {
    const teacher = await newInstructor(server.app);
    const klass = await newClass(teacher, 'Vehicle Dynamics 310', 'Spring 2027');
    expect(klass).toMatchObject({ role: 'instructor', closed: false, deletedAt: null, studentCount: 0, members: [] });
    expect(klass.joinCode).toMatch(/^[A-Z2-9]{8}$/);

    // The invitation: one mail with a single-use link to the client's /invites/:token page.
    const studentEmail = `learner-${Date.now()}@example.test`;
    const sent = await invite(teacher, klass, `  ${studentEmail.toUpperCase()} `);
    expect(sent.refused).toEqual([]);
    expect(sent.sent).toHaveLength(1);
    expect(sent.sent[0]).toMatchObject({ email: studentEmail, state: 'pending', acceptedAt: null });
    const token = await invitationToken(server, studentEmail);
    // Only the token's hash is stored.
    const stored = await ClassInvite.findOne({ where: { email: studentEmail } });
    expect(stored!.tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(stored!.tokenHash).not.toContain(token);

    // A signed-out visitor sees what the link is for, then signs up and accepts it.
    const visitor = new Caller(server.app);
    const preview = invitePreviewSchema.parse((await visitor.get(`/api/invites/${token}`).expect(200)).body);
    expect(preview).toMatchObject({ className: 'Vehicle Dynamics 310', email: studentEmail, state: 'pending' });
    await visitor.refreshToken();
    expect((await visitor.post(`/api/invites/${token}/accept`)).status).toBe(401);
    await visitor.signUp(studentEmail, 'a long student password', 'Ada Quill');
    const joined = await visitor.post(`/api/invites/${token}/accept`);
    expect(joined.status).toBe(200);
    expect(joinResultSchema.parse(joined.body)).toEqual({ classId: klass.id, className: 'Vehicle Dynamics 310' });
    const student = visitor;

    // The roster shows the student with the date they joined, and the invitation as accepted.
    const roster = classDetailSchema.parse((await teacher.get(`/api/classes/${klass.id}`).expect(200)).body);
    expect(roster.members!.map((m) => m.email)).toEqual([studentEmail]);
    expect(roster.invites).toHaveLength(1);
    expect(roster.invites![0]).toMatchObject({ email: studentEmail, state: 'accepted' });
    expect(Date.parse(roster.invites![0].acceptedAt!)).toBeGreaterThan(Date.now() - 60_000);

    // The student sees the class without the roster, the invitations or the join code.
    const theirs = classDetailSchema.parse((await student.get(`/api/classes/${klass.id}`).expect(200)).body);
    expect(theirs).toMatchObject({ role: 'student', joinCode: null, members: null, invites: null, studentCount: 1 });
    const list = classListSchema.parse((await student.get('/api/classes').expect(200)).body);
    expect(list.items.map((c) => c.id)).toEqual([klass.id]);

    // An assignment from the instructor's own sketch, with its target bands.
    const starter = await ownSketch(teacher, 'Lab 4 starter', { targets: startingTargets });
    const made = await teacher.post(`/api/classes/${klass.id}/assignments`).send({
      sketchId: starter.id,
      title: 'Lab 4: anti-squat',
      instructions: 'Bring anti-squat at ride into the band.',
      dueAt: daysFromNow(7),
    });
    expect(made.status).toBe(201);
    const assignment = assignmentDetailSchema.parse(made.body);
    expect(assignment).toMatchObject({
      classId: klass.id,
      role: 'instructor',
      starterSketchId: starter.id,
      handIns: [],
    });
    const due = classListSchema.parse((await student.get('/api/classes').expect(200)).body).items[0];
    expect(due.nextDueAt).toBe(assignment.dueAt);

    // The student's own copy: a normal sketch of theirs, made once, with the starter's bands.
    const copied = await student.post(`/api/assignments/${assignment.id}/copy`);
    expect(copied.status).toBe(201);
    const copy = assignmentCopySchema.parse(copied.body);
    expect((await student.post(`/api/assignments/${assignment.id}/copy`).expect(200)).body.sketchId).toBe(
      copy.sketchId,
    );
    const sketch = (await student.get(`/api/sketches/${copy.sketchId}`).expect(200)).body;
    expect(sketch.mine).toBe(true);
    expect(sketch.document.targets).toEqual(startingTargets);

    // The student drags a pivot on the board (a save) and hands in: that version is frozen.
    const doc = sketch.document;
    const lowerFrame = doc.points.find((p: { id: string }) => p.id === 'LL.fl');
    lowerFrame.z += 40;
    doc.points.find((p: { id: string }) => p.id === 'LL.fr').z += 40;
    const saved = await student.put(`/api/sketches/${copy.sketchId}`).send({ document: doc, version: sketch.version });
    expect(saved.status).toBe(200);
    const handed = await student.post(`/api/assignments/${assignment.id}/hand-ins`);
    expect(handed.status).toBe(201);
    const row = handInRowSchema.parse(handed.body);
    expect(row).toMatchObject({ sketchId: copy.sketchId, version: saved.body.version, late: false, problem: null });
    expect(row.keyNumbers.map((k) => `${k.key}@${k.at}`)).toEqual([
      'antiSquat@ride',
      'pinionAngleChange@bump',
      'lateralShift@bump',
      'articulation@articulation',
    ]);
    expect(row.keyNumbers.every((k) => typeof k.value === 'number' && Number.isFinite(k.value))).toBe(true);

    // A later save does not change what was handed in.
    lowerFrame.z += 40;
    await student
      .put(`/api/sketches/${copy.sketchId}`)
      .send({ document: doc, version: saved.body.version })
      .expect(200);
    const frozen = handInDetailSchema.parse((await teacher.get(`/api/hand-ins/${row.id}`).expect(200)).body);
    expect(frozen.document.points.find((p) => p.id === 'LL.fl')!.z).toBe(lowerFrame.z - 40);
    expect(frozen).toMatchObject({ assignmentTitle: 'Lab 4: anti-squat', classId: klass.id, version: row.version });

    // The instructor's table: the hand-in with its numbers; feedback goes to the student's mail.
    const table = assignmentDetailSchema.parse(
      (await teacher.get(`/api/assignments/${assignment.id}`).expect(200)).body,
    );
    expect(table.handIns.map((h) => h.id)).toEqual([row.id]);
    const fb = await teacher.post(`/api/hand-ins/${row.id}/feedback`).send({ text: 'Anti-squat is in <the> band.' });
    expect(fb.status).toBe(200);
    expect(handInRowSchema.parse(fb.body).feedback).toMatchObject({ text: 'Anti-squat is in <the> band.' });
    const [mail] = await server.mailTo(studentEmail);
    expect(mail.subject).toContain('Lab 4: anti-squat');
    expect(mail.text).toContain('Anti-squat is in <the> band.');
    expect(mail.text).toContain(`http://arcwright.example.test/assignments/${assignment.id}`);
    expect(mail.html).toContain(`<a href="http://arcwright.example.test/assignments/${assignment.id}"`);
    expect(mail.html).toContain('Anti-squat is in &lt;the&gt; band.');

    // The student sees their hand-in and its feedback.
    const mine = assignmentDetailSchema.parse(
      (await student.get(`/api/assignments/${assignment.id}`).expect(200)).body,
    );
    expect(mine.role).toBe('student');
    expect(mine.copy!.sketchId).toBe(copy.sketchId);
    expect(mine.handIns.map((h) => h.feedback?.text)).toEqual(['Anti-squat is in <the> band.']);
  });
});

describe('invitations on the roster', () => {
  it('resends with a new link (the old one dies) and withdraws', async () => {
    const teacher = await newInstructor(server.app);
    const klass = await newClass(teacher);
    const email = `resent-${Date.now()}@example.test`;
    const [first] = (await invite(teacher, klass, [email])).sent;
    const oldToken = await invitationToken(server, email);

    const again = await teacher.post(`/api/classes/${klass.id}/invites/${first.id}/resend`);
    expect(again.status).toBe(200);
    expect(classInviteSchema.parse(again.body)).toMatchObject({ id: first.id, state: 'pending' });
    expect(await server.mailTo(email)).toHaveLength(2);
    const newToken = await invitationToken(server, email);
    expect(newToken).not.toBe(oldToken);
    expect((await new Caller(server.app).get(`/api/invites/${oldToken}`)).status).toBe(404);
    expect((await new Caller(server.app).get(`/api/invites/${newToken}`)).body.state).toBe('pending');

    await teacher.delete(`/api/classes/${klass.id}/invites/${first.id}`).expect(204);
    const preview = await new Caller(server.app).get(`/api/invites/${newToken}`);
    expect(preview.body.state).toBe('withdrawn');
    const late = await newMember(server.app);
    const refused = await late.post(`/api/invites/${newToken}/accept`);
    expect(refused.status).toBe(410);
    expect(refused.body.error).toMatch(/withdrawn/);
    expect((await late.get(`/api/classes/${klass.id}`)).status).toBe(404);
  });

  it('skips an address that is already invited and refuses one already in the class', async () => {
    const teacher = await newInstructor(server.app);
    const klass = await newClass(teacher);
    const member = await newStudent(server.app, klass);
    const email = `twice-${Date.now()}@example.test`;
    await invite(teacher, klass, [email]);
    const result = await invite(teacher, klass, [email, member.email, teacher.email]);
    expect(result.sent).toEqual([]);
    expect(result.skipped).toEqual([{ email, reason: expect.stringMatching(/pending invitation/) }]);
    expect(result.refused).toEqual([
      { email: member.email, problem: 'already in the class' },
      { email: teacher.email, problem: 'the instructor of this class' },
    ]);
    expect(await server.mailTo(email)).toHaveLength(1);
  });

  it('lets a student in with the join code, in any case and spacing', async () => {
    const teacher = await newInstructor(server.app);
    const klass = await newClass(teacher);
    const student = await newMember(server.app);
    const typed = `${klass.joinCode!.slice(0, 4).toLowerCase()}-${klass.joinCode!.slice(4)} `;
    const res = await student.post('/api/classes/join').send({ joinCode: typed });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ classId: klass.id, className: klass.name });
    const wrong = await student.post('/api/classes/join').send({ joinCode: 'NOSUCHCODE' });
    expect(wrong.status).toBe(404);
    expect(wrong.body.error).toMatch(/join code/);
  });
});

describe('running the class', () => {
  it('renames, closes (read-only but listed), reopens, deletes and restores', async () => {
    const teacher = await newInstructor(server.app);
    const klass = await newClass(teacher);
    const student = await newStudent(server.app, klass);

    const renamed = await teacher.patch(`/api/classes/${klass.id}`).send({ name: 'Renamed lab', term: null });
    expect(classDetailSchema.parse(renamed.body)).toMatchObject({ name: 'Renamed lab', term: null });
    const closed = await teacher.patch(`/api/classes/${klass.id}`).send({ closed: true });
    expect(closed.body.closed).toBe(true);
    expect((await student.get('/api/classes')).body.items.map((c: { id: number }) => c.id)).toContain(klass.id);
    const refused = await teacher.post(`/api/classes/${klass.id}/invites`).send({ emails: 'new@example.test' });
    expect(refused.status).toBe(409);
    expect(refused.body.error).toMatch(/closed/);
    await teacher.patch(`/api/classes/${klass.id}`).send({ closed: false }).expect(200);

    const deleted = await teacher.delete(`/api/classes/${klass.id}`);
    expect(deleted.status).toBe(200);
    expect(classDetailSchema.parse(deleted.body).deletedAt).not.toBeNull();
    expect((await student.get(`/api/classes/${klass.id}`)).status).toBe(404);
    expect((await student.get('/api/classes')).body.items).toEqual([]);
    const restored = await teacher.post(`/api/classes/${klass.id}/restore`);
    expect(restored.status).toBe(200);
    expect(restored.body.deletedAt).toBeNull();
    expect((await student.get(`/api/classes/${klass.id}`)).status).toBe(200);
  });

  it('a student who leaves or is removed loses the class but keeps their copies', async () => {
    const teacher = await newInstructor(server.app);
    const klass = await newClass(teacher);
    const starter = await ownSketch(teacher);
    const made = await teacher
      .post(`/api/classes/${klass.id}/assignments`)
      .send({ sketchId: starter.id, title: 'Lab 1', dueAt: daysFromNow(3) });
    const leaver = await newStudent(server.app, klass, 'leaver');
    const removed = await newStudent(server.app, klass, 'removed');
    const copies = [];
    for (const s of [leaver, removed])
      copies.push((await s.post(`/api/assignments/${made.body.id}/copy`)).body.sketchId);

    await leaver.post(`/api/classes/${klass.id}/leave`).expect(204);
    const removedId = (await removed.get('/api/auth/me')).body.user.id;
    await teacher.delete(`/api/classes/${klass.id}/members/${removedId}`).expect(204);
    expect((await teacher.delete(`/api/classes/${klass.id}/members/${removedId}`)).status).toBe(404);

    for (const [i, s] of [leaver, removed].entries()) {
      expect((await s.get(`/api/classes/${klass.id}`)).status).toBe(404);
      expect((await s.get(`/api/assignments/${made.body.id}`)).status).toBe(404);
      expect((await s.post(`/api/assignments/${made.body.id}/hand-ins`)).status).toBe(404);
      expect((await s.get(`/api/sketches/${copies[i]}`)).status).toBe(200);
    }
    expect((await teacher.get(`/api/classes/${klass.id}`)).body.members).toEqual([]);
  });

  it('hands in again before the due date, marks a late hand-in, and publishes to the class', async () => {
    const teacher = await newInstructor(server.app);
    const klass = await newClass(teacher);
    const starter = await ownSketch(teacher);
    const made = await teacher
      .post(`/api/classes/${klass.id}/assignments`)
      .send({ sketchId: starter.id, title: 'Lab 2', dueAt: daysFromNow(3) });
    const id = made.body.id as number;
    const [a, b] = [await newStudent(server.app, klass, 'ann'), await newStudent(server.app, klass, 'ben')];
    for (const s of [a, b]) await s.post(`/api/assignments/${id}/copy`).expect(201);
    const first = (await a.post(`/api/assignments/${id}/hand-ins`).expect(201)).body;
    const second = (await a.post(`/api/assignments/${id}/hand-ins`).expect(201)).body;
    expect(second.id).not.toBe(first.id);

    // The due date moves into the past (as the clock would): the next hand-in is accepted and marked late.
    await Assignment.update({ dueAt: new Date(Date.now() - 60_000) }, { where: { id } });
    const late = handInRowSchema.parse((await b.post(`/api/assignments/${id}/hand-ins`).expect(201)).body);
    expect(late.late).toBe(true);

    // The instructor's table has the latest of each student; a student sees only their own until published.
    const table = (await teacher.get(`/api/assignments/${id}`)).body.handIns.map((h: { id: number }) => h.id);
    expect(table.sort()).toEqual([second.id, late.id].sort());
    expect((await a.get(`/api/assignments/${id}`)).body.handIns.map((h: { id: number }) => h.id)).toEqual([
      second.id,
      first.id,
    ]);
    expect((await a.get(`/api/hand-ins/${late.id}`)).status).toBe(404);
    const published = await teacher.patch(`/api/assignments/${id}`).send({ published: true });
    expect(published.status).toBe(200);
    expect((await a.get(`/api/hand-ins/${late.id}`)).status).toBe(200);
    expect((await a.get(`/api/assignments/${id}`)).body.handIns.map((h: { id: number }) => h.id)).toContain(late.id);
  });
});
