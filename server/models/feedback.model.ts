import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** The instructor's feedback on one hand-in (one per hand-in; writing again replaces it). */
export class Feedback extends Model<InferAttributes<Feedback>, InferCreationAttributes<Feedback>> {
  declare id: CreationOptional<number>;
  declare handInId: number;
  declare authorId: number | null;
  declare text: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Feedback.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        handInId: { type: DataTypes.INTEGER, allowNull: false, unique: true },
        authorId: { type: DataTypes.INTEGER, allowNull: true },
        text: { type: DataTypes.TEXT, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'feedback' },
    );
  }
}
