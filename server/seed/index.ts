import type { Sequelize } from 'sequelize';
import { starters } from '../../shared/kinematics';
import { checkSketch } from '../../shared/schema/sketch';
import {
  Assignment,
  AssignmentCopy,
  ClassGroup,
  ClassMember,
  Feedback,
  Shop,
  Sketch,
  User,
  toPublicUser,
} from '../models';
import { newJoinCode } from '../services/classes/joinCode';
import { recordHandIn } from '../services/classes/assignments';
import { hashPassword } from '../services/passwords';
import { createSketch } from '../services/sketches';
import { demoAccounts, demoAssignment, demoClass, demoShop } from './demo-data';
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
      defaults: { ...demoClass, instructorId: instructor.id, joinCode: newJoinCode() },
      transaction,
    });
    for (const account of demoAccounts.filter((a) => a.inClass)) {
      const student = users.get(account.email)!;
      await ClassMember.findOrCreate({ where: { classId: klass.id, userId: student.id }, transaction });
    }
  });
  await seedDemoSketches();
  await seedDemoClasswork();
}

/** One sketch per entry of demoSketches, unless its owner already has a sketch of that name. */
async function seedDemoSketches(): Promise<void> {
  for (const entry of demoSketches) {
    const starter = starters[entry.layout];
    const owner = await User.findOne({ where: { email: entry.owner } });
    if (!starter || !owner) continue;
    if (await Sketch.count({ where: { ownerId: owner.id, name: entry.name } })) continue;
    const checked = checkSketch({
      ...starter.build(entry.params),
      name: entry.name,
      ...(entry.targets ? { targets: entry.targets } : {}),
    });
    if (!checked.ok) throw new Error(`demo sketch "${entry.name}" is not valid: ${checked.problems.join('; ')}`);
    await createSketch(toPublicUser(owner), checked.sketch);
  }
}

const DAY_MS = 24 * 3600_000;

/**
 * The demo class's assignment from the instructor's starter sketch, the students' copies, their hand-ins
 * (one on time, one late) and one piece of feedback. Made once: nothing is added when the assignment exists.
 */
async function seedDemoClasswork(): Promise<void> {
  const instructorAccount = demoAccounts.find((a) => a.teachesClass)!;
  const instructor = await User.findOne({ where: { email: instructorAccount.email } });
  if (!instructor) return;
  const klass = await ClassGroup.findOne({ where: { name: demoClass.name, instructorId: instructor.id } });
  const starter = await Sketch.findOne({ where: { ownerId: instructor.id, name: demoAssignment.starter } });
  if (!klass || !starter) return;
  if (await Assignment.count({ where: { classId: klass.id, title: demoAssignment.title } })) return;

  const dueAt = new Date(Date.now() - demoAssignment.dueDaysAgo * DAY_MS);
  const assignment = await Assignment.create({
    classId: klass.id,
    starterSketchId: starter.id,
    starterDocument: starter.document,
    title: demoAssignment.title,
    instructions: demoAssignment.instructions,
    dueAt,
    withTargets: true,
  });
  for (const entry of demoAssignment.handIns) {
    const student = await User.findOne({ where: { email: entry.student } });
    if (!student) continue;
    const checked = checkSketch({
      ...starters[starter.layout as keyof typeof starters].build(entry.params),
      name: `${demoAssignment.title} (${student.name})`,
      targets: (JSON.parse(starter.document) as { targets?: unknown }).targets,
    });
    if (!checked.ok) throw new Error(`demo copy for ${entry.student} is not valid: ${checked.problems.join('; ')}`);
    const copy = await createSketch(toPublicUser(student), checked.sketch);
    await AssignmentCopy.create({ assignmentId: assignment.id, studentId: student.id, sketchId: copy.id });
    const sketch = await Sketch.findByPk(copy.id, { rejectOnEmpty: true });
    const handIn = await recordHandIn(
      assignment,
      student.id,
      sketch,
      new Date(dueAt.getTime() + entry.daysFromDue * DAY_MS),
    );
    if (entry.feedback) await Feedback.create({ handInId: handIn.id, authorId: instructor.id, text: entry.feedback });
  }
}
