import type { Sequelize } from 'sequelize';
import { ClassGroup, ClassMember, Shop, User } from '../models';
import { hashPassword } from '../services/passwords';
import { demoAccounts, demoClass, demoShop } from './demo-data';

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
}
