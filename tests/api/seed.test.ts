import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Caller, demo, startTestServer, type TestServer } from './helpers';
import { Assignment, ClassGroup, ClassMember, Feedback, HandIn, Shop, Sketch, User } from '../../server/models';
import { seedDemoData } from '../../server/seed';
import { demoSketches } from '../../server/seed/demo-sketches';
import { demoAccounts, demoAssignment } from '../../server/seed/demo-data';
import { assignmentDetailSchema, classListSchema } from '../../shared/schema/classes';
import { starters } from '../../shared/kinematics';
import { loadConfig } from '../../server/config';
import { openDatabase } from '../../server/database';
import { prepareDatabase } from '../../server/prepare-database';
import { createTestDatabase } from './test-database';

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

describe('demo data', () => {
  it('has the shop, the class with the student in it, and every demo account signs in', async () => {
    expect(await Shop.count()).toBe(1);
    const klass = await ClassGroup.findOne();
    const student = await User.findOne({ where: { email: demo.student.email } });
    expect(await ClassMember.count({ where: { classId: klass!.id, userId: student!.id } })).toBe(1);
    for (const account of Object.values(demo)) {
      const caller = await new Caller(server.app).signIn(account.email, account.password);
      expect((await caller.get('/api/auth/me')).body.user.email).toBe(account.email);
    }
  });

  it('has a demo sketch for every entry whose starter exists, valid and listed for its owner', async () => {
    const expected = demoSketches.filter((d) => starters[d.layout]);
    expect(expected.length).toBeGreaterThan(0);
    // The demo entries, and the copies of the students who handed in the demo assignment.
    expect(await Sketch.count()).toBe(expected.length + demoAssignment.handIns.length);
    const maker = await new Caller(server.app).signIn(demo.maker.email, demo.maker.password);
    const list = await maker.get('/api/sketches?sort=name&order=asc');
    const mine = expected
      .filter((d) => d.owner === demo.maker.email)
      .map((d) => d.name)
      .sort((a, b) => a.localeCompare(b));
    expect(
      list.body.items.map((i: { name: string }) => i.name).sort((a: string, b: string) => a.localeCompare(b)),
    ).toEqual(mine);
  });

  it('has the class of three students, one assignment, two hand-ins (one late) and one piece of feedback', async () => {
    const teacher = await new Caller(server.app).signIn(demo.instructor.email, demo.instructor.password);
    const [klass] = classListSchema.parse((await teacher.get('/api/classes').expect(200)).body).items;
    expect(klass).toMatchObject({ role: 'instructor', studentCount: 3, assignmentCount: 1 });
    const detail = (await teacher.get(`/api/classes/${klass.id}`).expect(200)).body;
    expect(detail.members.map((m: { email: string }) => m.email).sort()).toEqual(
      demoAccounts
        .filter((a) => a.inClass)
        .map((a) => a.email)
        .sort(),
    );
    for (const m of detail.members) expect(m.email).toMatch(/@(demo|example)\.test$/);
    const assignment = assignmentDetailSchema.parse(
      (await teacher.get(`/api/assignments/${detail.assignments[0].id}`).expect(200)).body,
    );
    expect(assignment.title).toBe(demoAssignment.title);
    expect(assignment.handIns.map((h) => h.late).sort()).toEqual([false, true]);
    expect(assignment.handIns.filter((h) => h.feedback)).toHaveLength(1);
    for (const h of assignment.handIns) {
      expect(h.problem).toBeNull();
      expect(h.keyNumbers.map((k) => k.key)).toEqual([
        'antiSquat',
        'pinionAngleChange',
        'lateralShift',
        'articulation',
      ]);
    }

    // The demo student sees their own hand-in and its feedback.
    const student = await new Caller(server.app).signIn(demo.student.email, demo.student.password);
    const theirs = assignmentDetailSchema.parse((await student.get(`/api/assignments/${assignment.id}`)).body);
    expect(theirs.handIns).toHaveLength(1);
    expect(theirs.handIns[0].feedback?.text).toBe(demoAssignment.handIns[0].feedback);
  });

  it('adds nothing when run again', async () => {
    const counts = async () => ({
      users: await User.count(),
      sketches: await Sketch.count(),
      members: await ClassMember.count(),
      assignments: await Assignment.count(),
      handIns: await HandIn.count(),
      feedback: await Feedback.count(),
    });
    const before = await counts();
    await seedDemoData(server.sequelize);
    expect(await counts()).toEqual(before);
  });
});

describe('when the demo data is added at start', () => {
  it('into a database the start created, again only with SEED_DEMO=1, never into one in use', async () => {
    const database = await createTestDatabase();
    const sequelize = await openDatabase(loadConfig(database.env));
    try {
      const first = await prepareDatabase(sequelize, loadConfig({ ...database.env }));
      expect(first).toMatchObject({ seeded: true });
      expect(first.applied.length).toBeGreaterThan(0);
      expect(await User.count({ where: { email: demo.maker.email } })).toBe(1);

      // A database in use: an admin removed a demo account; a plain restart leaves that as it is.
      await User.destroy({ where: { email: demo.maker.email } });
      expect(await prepareDatabase(sequelize, loadConfig({ ...database.env }))).toEqual({ applied: [], seeded: false });
      expect(await User.count({ where: { email: demo.maker.email } })).toBe(0);

      // Asked for, the demo data is put back (and nothing else changes: the seed only adds what is missing).
      const usersBefore = await User.count();
      const asked = await prepareDatabase(sequelize, loadConfig({ ...database.env, SEED_DEMO: '1' }));
      expect(asked).toEqual({ applied: [], seeded: true });
      expect(await User.count({ where: { email: demo.maker.email } })).toBe(1);
      expect(await User.count()).toBe(usersBefore + 1);
    } finally {
      await sequelize.close();
      await database.drop();
    }
  }, 60_000);
});
