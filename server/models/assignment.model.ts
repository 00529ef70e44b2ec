import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** Work set for a class: every student copies the starter document and hands in their variant by `dueAt`. */
export class Assignment extends Model<InferAttributes<Assignment>, InferCreationAttributes<Assignment>> {
  declare id: CreationOptional<number>;
  declare classId: number;
  declare starterSketchId: number;
  /** The starter sketch file (JSON text) as it was when the assignment was made. */
  declare starterDocument: string;
  declare title: string;
  declare instructions: string;
  declare dueAt: Date;
  /** Whether the starter's target bands go into every copy. */
  declare withTargets: boolean;
  /** Every student's hand-ins shown to the whole class. */
  declare published: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Assignment.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        classId: { type: DataTypes.INTEGER, allowNull: false },
        starterSketchId: { type: DataTypes.INTEGER, allowNull: false },
        starterDocument: { type: DataTypes.TEXT, allowNull: false },
        title: { type: DataTypes.STRING(120), allowNull: false },
        instructions: { type: DataTypes.TEXT, allowNull: false },
        dueAt: { type: DataTypes.DATE, allowNull: false },
        withTargets: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        published: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'assignments' },
    );
  }
}
