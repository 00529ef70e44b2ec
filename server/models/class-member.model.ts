import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** A student's place in a Class. */
export class ClassMember extends Model<InferAttributes<ClassMember>, InferCreationAttributes<ClassMember>> {
  declare classId: number;
  declare userId: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    ClassMember.init(
      {
        classId: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
        userId: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'class_members' },
    );
  }
}
