import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** One hand-in: a saved version of a student's copy, frozen, with the key numbers read from it then. Never changed. */
export class HandIn extends Model<InferAttributes<HandIn>, InferCreationAttributes<HandIn>> {
  declare id: CreationOptional<number>;
  declare assignmentId: number;
  declare studentId: number;
  declare sketchId: number;
  declare version: number;
  /** The sketch file (JSON text) of that version. */
  declare document: string;
  declare handedInAt: Date;
  /** Handed in after the assignment's due date. */
  declare late: boolean;
  /** The key numbers (JSON list of shared/schema/classes KeyNumber). */
  declare keyNumbers: string;
  declare flagCount: number;
  declare missedTargetCount: number;
  /** Why the document could not be swept (then no key numbers), else null. */
  declare problem: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    HandIn.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        assignmentId: { type: DataTypes.INTEGER, allowNull: false },
        studentId: { type: DataTypes.INTEGER, allowNull: false },
        sketchId: { type: DataTypes.INTEGER, allowNull: false },
        version: { type: DataTypes.INTEGER, allowNull: false },
        document: { type: DataTypes.TEXT, allowNull: false },
        handedInAt: { type: DataTypes.DATE, allowNull: false },
        late: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        keyNumbers: { type: DataTypes.TEXT, allowNull: false },
        flagCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        missedTargetCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        problem: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'hand_ins' },
    );
  }
}
