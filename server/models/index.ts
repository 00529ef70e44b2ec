import type { Sequelize } from 'sequelize';
import { User } from './user.model';
import { Shop } from './shop.model';
import { ClassGroup } from './class-group.model';
import { ClassMember } from './class-member.model';
import { Session } from './session.model';

export { User, Shop, ClassGroup, ClassMember, Session };
export { roles, toPublicUser, type Role, type PublicUser } from './user.model';

/** Binds every model to `sequelize` and declares the associations, in one place. Tables come from migrations. */
export function initModels(sequelize: Sequelize): void {
  for (const model of [User, Shop, ClassGroup, ClassMember, Session]) model.initModel(sequelize);

  Shop.hasMany(User, { foreignKey: 'shopId', as: 'members' });
  User.belongsTo(Shop, { foreignKey: 'shopId', as: 'shop' });

  ClassGroup.belongsTo(User, { foreignKey: 'instructorId', as: 'instructor' });
  ClassGroup.belongsToMany(User, { through: ClassMember, foreignKey: 'classId', otherKey: 'userId', as: 'students' });
  User.belongsToMany(ClassGroup, { through: ClassMember, foreignKey: 'userId', otherKey: 'classId', as: 'classes' });
}
