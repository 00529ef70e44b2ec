import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { User } from './user.model';

/** A Class: an instructor's group of students (table `classes`; `Class` would shadow the keyword's meaning). */
export class ClassGroup extends Model<InferAttributes<ClassGroup>, InferCreationAttributes<ClassGroup>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare term: string | null;
  declare instructorId: number;
  /** What a student types to join without an invitation (letters and digits, upper case). */
  declare joinCode: string;
  /** Set while the class is closed: read-only, still listed. */
  declare closedAt: CreationOptional<Date | null>;
  /** Soft delete by hand, as for sketches: the instructor can restore it. */
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare instructor?: NonAttribute<User>;

  static initModel(sequelize: Sequelize): void {
    ClassGroup.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        term: { type: DataTypes.STRING(60), allowNull: true },
        instructorId: { type: DataTypes.INTEGER, allowNull: false },
        joinCode: { type: DataTypes.STRING(16), allowNull: false, unique: true },
        closedAt: { type: DataTypes.DATE, allowNull: true },
        deletedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'classes' },
    );
  }
}
