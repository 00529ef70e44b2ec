import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** A saved state of a sketch: one per save, numbered `rev` from 1 within its sketch. Never changed. */
export class SketchRevision extends Model<InferAttributes<SketchRevision>, InferCreationAttributes<SketchRevision>> {
  declare id: CreationOptional<number>;
  declare sketchId: number;
  declare rev: number;
  declare version: number;
  declare name: string;
  declare document: string;
  declare authorId: number | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    SketchRevision.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        sketchId: { type: DataTypes.INTEGER, allowNull: false },
        rev: { type: DataTypes.INTEGER, allowNull: false },
        version: { type: DataTypes.INTEGER, allowNull: false },
        name: { type: DataTypes.STRING(200), allowNull: false },
        document: { type: DataTypes.TEXT, allowNull: false },
        authorId: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'sketch_revisions', updatedAt: false },
    );
  }
}
