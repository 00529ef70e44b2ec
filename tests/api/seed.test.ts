import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Caller, demo, startTestServer, type TestServer } from './helpers';
import { ClassGroup, ClassMember, Shop, Sketch, User } from '../../server/models';
import { seedDemoData } from '../../server/seed';
import { demoSketches } from '../../server/seed/demo-sketches';
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
    expect(await Sketch.count()).toBe(expected.length);
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

  it('adds nothing when run again', async () => {
    const before = { users: await User.count(), sketches: await Sketch.count(), members: await ClassMember.count() };
    await seedDemoData(server.sequelize);
    expect({ users: await User.count(), sketches: await Sketch.count(), members: await ClassMember.count() }).toEqual(
      before,
    );
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
