import type { Sequelize } from 'sequelize';
import { starters } from '../../shared/kinematics';
import { checkSketch } from '../../shared/schema/sketch';
import { ClassGroup, ClassMember, Shop, Sketch, User, toPublicUser } from '../models';
import { hashPassword } from '../services/passwords';
import { createSketch } from '../services/sketches';
import { demoAccounts, demoClass, demoShop } from './demo-data';
import { demoSketches } from './demo-sketches';
import { FIRST_MIGRATION } from '../migrations/umzug';

/**
 * The rule for the demo data: it is created when asked (SEED_DEMO=1) or when this start created the
 * database (applied its first migration), and never otherwise, so a live database is left as it is.
 * Deciding by "this start created the schema" (settled under the migration lock) rather than by
 * "no accounts yet" means that of several instances starting on one new database only one seeds.
 */
export function shouldSeedDemo(seedDemo: boolean, appliedMigrations: readonly string[]): boolean {
  return seedDemo || appliedMigrations.includes(FIRST_MIGRATION);
}

/**
 * Creates the demo shop, class and accounts when missing. Safe to run on every start:
 * it only adds what is absent and never changes an existing account (or its password).
 */
export async function seedDemoData(sequelize: Sequelize): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const [shop] = await Shop.findOrCreate({ where: { name: demoShop.name }, defaults: demoShop, transaction });
    const users = new Map<string, User>();
    for (const account of demoAccounts) {
      let user = await User.findOne({ where: { email: account.email }, transaction });
      if (!user) {
        user = await User.create(
          {
            email: account.email,
            name: account.name,
            role: account.role,
            passwordHash: await hashPassword(account.password),
            shopId: account.inShop ? shop.id : null,
          },
          { transaction },
        );
      }
      users.set(account.email, user);
    }
    const instructor = users.get(demoAccounts.find((a) => a.teachesClass)!.email)!;
    const [klass] = await ClassGroup.findOrCreate({
      where: { name: demoClass.name, instructorId: instructor.id },
      defaults: { ...demoClass, instructorId: instructor.id },
      transaction,
    });
    for (const account of demoAccounts.filter((a) => a.inClass)) {
      const student = users.get(account.email)!;
      await ClassMember.findOrCreate({ where: { classId: klass.id, userId: student.id }, transaction });
    }
  });
  await seedDemoSketches();
}

/** One sketch per entry of demoSketches, unless its owner already has a sketch of that name. */
async function seedDemoSketches(): Promise<void> {
  for (const entry of demoSketches) {
    const starter = starters[entry.layout];
    const owner = await User.findOne({ where: { email: entry.owner } });
    if (!starter || !owner) continue;
    if (await Sketch.count({ where: { ownerId: owner.id, name: entry.name } })) continue;
    const checked = checkSketch({ ...starter.build(entry.params), name: entry.name });
    if (!checked.ok) throw new Error(`demo sketch "${entry.name}" is not valid: ${checked.problems.join('; ')}`);
    await createSketch(toPublicUser(owner), checked.sketch);
  }
}
