import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Caller, demo, newMember, startTestServer, type TestServer } from './helpers';
import { daysFromNow, invite, newClass, newInstructor, newStudent, ownSketch } from './classHelpers';
import { ClassGroup, ClassMember } from '../../server/models';
import type { ClassDetail } from '../../shared/schema/classes';

// Who sees what: only a class's instructor (or an admin) and its students reach it; anyone else gets what a
// missing class gives (404), a signed-out caller 401, and a student asking for the instructor's work 403.
let server: TestServer;
let teacher: Caller;
let klass: ClassDetail;
let student: Caller;
let assignmentId: number;
let handInId: number;
beforeAll(async () => {
  server = await startTestServer();
  teacher = await newInstructor(server.app);
  klass = await newClass(teacher, 'Guarded lab');
  student = await newStudent(server.app, klass);
  const starter = await ownSketch(teacher);
  assignmentId = (
    await teacher
      .post(`/api/classes/${klass.id}/assignments`)
      .send({ sketchId: starter.id, title: 'Guarded work', dueAt: daysFromNow(5) })
      .expect(201)
  ).body.id;
  await student.post(`/api/assignments/${assignmentId}/copy`).expect(201);
  handInId = (await student.post(`/api/assignments/${assignmentId}/hand-ins`).expect(201)).body.id;
});
afterAll(async () => {
  await server.close();
});

/** Every class route, as [method, path, body]. */
const routes = (): [string, string, object?][] => [
  ['get', `/api/classes/${klass.id}`],
  ['patch', `/api/classes/${klass.id}`, { name: 'Taken over' }],
  ['delete', `/api/classes/${klass.id}`],
  ['post', `/api/classes/${klass.id}/restore`],
  ['delete', `/api/classes/${klass.id}/members/1`],
  ['post', `/api/classes/${klass.id}/leave`],
  ['post', `/api/classes/${klass.id}/invites`, { emails: ['someone@example.test'] }],
  ['post', `/api/classes/${klass.id}/invites/1/resend`],
  ['delete', `/api/classes/${klass.id}/invites/1`],
  ['post', `/api/classes/${klass.id}/assignments`, { sketchId: 1, title: 'x', dueAt: daysFromNow(1) }],
  ['get', `/api/assignments/${assignmentId}`],
  ['patch', `/api/assignments/${assignmentId}`, { published: true }],
  ['post', `/api/assignments/${assignmentId}/copy`],
  ['post', `/api/assignments/${assignmentId}/hand-ins`],
  ['get', `/api/hand-ins/${handInId}`],
  ['post', `/api/hand-ins/${handInId}/feedback`, { text: 'Not yours to write.' }],
];

function call(caller: Caller, [method, path, body]: [string, string, object?]) {
  const req = (caller as unknown as Record<string, (p: string) => ReturnType<Caller['get']>>)[method].call(
    caller,
    path,
  );
  return body ? req.send(body) : req;
}

async function expectUnchanged() {
  const row = await ClassGroup.findByPk(klass.id);
  expect(row).toMatchObject({ name: 'Guarded lab', deletedAt: null, closedAt: null });
  expect(await ClassMember.count({ where: { classId: klass.id } })).toBe(1);
}

describe('class routes', () => {
  it('answer 404 to a student of another class, on every route, and change nothing', async () => {
    const other = await newInstructor(server.app, 'other-teacher');
    const otherClass = await newClass(other, 'Other lab');
    const outsider = await newStudent(server.app, otherClass, 'outsider');
    for (const route of routes()) {
      const res = await call(outsider, route);
      expect(res.status, `${route[0]} ${route[1]}`).toBe(404);
    }
    // The other instructor is no instructor of this class either.
    for (const route of routes()) expect((await call(other, route)).status, `${route[0]} ${route[1]}`).toBe(404);
    await expectUnchanged();
  });

  it('answer 401 to a signed-out caller', async () => {
    const guest = new Caller(server.app);
    await guest.refreshToken();
    for (const route of routes()) expect((await call(guest, route)).status, `${route[0]} ${route[1]}`).toBe(401);
    expect((await guest.get('/api/classes')).status).toBe(401);
    expect((await guest.post('/api/classes').send({ name: 'Mine' })).status).toBe(401);
    expect((await guest.post('/api/classes/join').send({ joinCode: klass.joinCode })).status).toBe(401);
    await expectUnchanged();
  });

  it('answer 403 to a student asking for what only the instructor may do', async () => {
    const instructorOnly = routes().filter(([method, path]) =>
      /\/(restore|members|invites|assignments$)|feedback$/.test(path)
        ? true
        : (method === 'patch' || method === 'delete') && !path.includes('/members/'),
    );
    expect(instructorOnly.length).toBeGreaterThan(5);
    for (const route of instructorOnly) {
      const res = await call(student, route);
      expect(res.status, `${route[0]} ${route[1]}`).toBe(403);
      expect(res.body.error).toMatch(/only the instructor/);
    }
    await expectUnchanged();
  });

  it('end for a removed student, whose copy stays theirs', async () => {
    const removed = await newStudent(server.app, klass, 'removed');
    const copy = (await removed.post(`/api/assignments/${assignmentId}/copy`).expect(201)).body.sketchId;
    const own = (await removed.post(`/api/assignments/${assignmentId}/hand-ins`).expect(201)).body.id;
    const id = (await removed.get('/api/auth/me')).body.user.id;
    await teacher.delete(`/api/classes/${klass.id}/members/${id}`).expect(204);
    for (const route of routes()) expect((await call(removed, route)).status, `${route[0]} ${route[1]}`).toBe(404);
    // Not even their own hand-in: it belongs to the class's work now.
    expect((await removed.get(`/api/hand-ins/${own}`)).status).toBe(404);
    expect((await removed.get('/api/classes')).body.items).toEqual([]);
    expect((await removed.get(`/api/sketches/${copy}`)).status).toBe(200);
    await expectUnchanged();
  });

  it('refuse a member who is not an instructor making a class, with a clear message and no class left', async () => {
    const member = await new Caller(server.app).signIn(demo.maker.email, demo.maker.password);
    const before = await ClassGroup.count();
    const res = await member.post('/api/classes').send({ name: 'My own class' });
    expect(res.status).toBe(403);
    expect(res.body.error).toMatch(/only instructors and admins can create classes/);
    expect(await ClassGroup.count()).toBe(before);
  });

  it('let an admin create and run a class', async () => {
    const admin = await new Caller(server.app).signIn(demo.admin.email, demo.admin.password);
    const own = await newClass(admin, 'Admin lab');
    expect(own.role).toBe('instructor');
    // An admin may run any class, as its instructor would.
    const seen = await admin.get(`/api/classes/${klass.id}`);
    expect(seen.status).toBe(200);
    expect(seen.body.role).toBe('instructor');
    expect(seen.body.members).toHaveLength(1);
  });

  it('keep the invitations of a class from students and from preview callers beyond the one link', async () => {
    const result = await invite(teacher, klass, ['quiet@example.test']);
    const inviteId = result.sent[0].id;
    const stranger = await newMember(server.app, 'stranger');
    expect((await call(stranger, ['post', `/api/classes/${klass.id}/invites/${inviteId}/resend`])).status).toBe(404);
    expect((await call(student, ['delete', `/api/classes/${klass.id}/invites/${inviteId}`])).status).toBe(403);
    expect((await student.get(`/api/classes/${klass.id}`)).body.invites).toBeNull();
  });
});
