import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One piece of an upload's bytes; piece `seq` (0, 1, …) of the upload, in order. */
export class UploadChunk extends Model<InferAttributes<UploadChunk>, InferCreationAttributes<UploadChunk>> {
  declare uploadId: string;
  declare seq: number;
  declare data: Buffer;

  static initModel(sequelize: Sequelize): void {
    UploadChunk.init(
      {
        uploadId: { type: DataTypes.STRING(36), primaryKey: true },
        seq: { type: DataTypes.INTEGER, primaryKey: true },
        data: { type: DataTypes.BLOB, allowNull: false },
      },
      { sequelize, tableName: 'upload_chunks', timestamps: false },
    );
  }
}
