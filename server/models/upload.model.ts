import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** An uploaded image attached to a sketch; the bytes live in UPLOADS_DIR under `storedName`. */
export class Upload extends Model<InferAttributes<Upload>, InferCreationAttributes<Upload>> {
  declare id: string;
  declare sketchId: number;
  declare ownerId: number;
  declare mime: string;
  /** Bytes. */
  declare size: number;
  declare storedName: string;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Upload.init(
      {
        id: { type: DataTypes.STRING(36), primaryKey: true },
        sketchId: { type: DataTypes.INTEGER, allowNull: false },
        ownerId: { type: DataTypes.INTEGER, allowNull: false },
        mime: { type: DataTypes.STRING(40), allowNull: false },
        size: { type: DataTypes.INTEGER, allowNull: false },
        storedName: { type: DataTypes.STRING(80), allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'uploads', updatedAt: false },
    );
  }
}
