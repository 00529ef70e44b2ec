import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** Which of a student's sketches is their copy of an assignment (one per student and assignment). */
export class AssignmentCopy extends Model<InferAttributes<AssignmentCopy>, InferCreationAttributes<AssignmentCopy>> {
  declare id: CreationOptional<number>;
  declare assignmentId: number;
  declare studentId: number;
  declare sketchId: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    AssignmentCopy.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        assignmentId: { type: DataTypes.INTEGER, allowNull: false },
        studentId: { type: DataTypes.INTEGER, allowNull: false },
        sketchId: { type: DataTypes.INTEGER, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'assignment_copies' },
    );
  }
}
