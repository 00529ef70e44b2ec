import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** A Class: an instructor's group of students (table `classes`; `Class` would shadow the keyword's meaning). */
export class ClassGroup extends Model<InferAttributes<ClassGroup>, InferCreationAttributes<ClassGroup>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare term: string | null;
  declare instructorId: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    ClassGroup.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        term: { type: DataTypes.STRING(60), allowNull: true },
        instructorId: { type: DataTypes.INTEGER, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'classes' },
    );
  }
}
