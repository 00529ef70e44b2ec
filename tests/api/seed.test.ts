import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Caller, demo, startTestServer, type TestServer } from './helpers';
import { ClassGroup, ClassMember, Shop, Sketch, User } from '../../server/models';
import { seedDemoData } from '../../server/seed';
import { demoSketches } from '../../server/seed/demo-sketches';
import { starters } from '../../shared/kinematics';

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
