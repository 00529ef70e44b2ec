import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** One e-mail of a sketch's read-only link: to whom, when, and whether that link has since been revoked. */
export class ShareRecipient extends Model<InferAttributes<ShareRecipient>, InferCreationAttributes<ShareRecipient>> {
  declare id: CreationOptional<number>;
  declare sketchId: number;
  declare senderId: number | null;
  declare email: string;
  declare sentAt: CreationOptional<Date>;
  declare linkRevokedAt: CreationOptional<Date | null>;

  static initModel(sequelize: Sequelize): void {
    ShareRecipient.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        sketchId: { type: DataTypes.INTEGER, allowNull: false },
        senderId: { type: DataTypes.INTEGER, allowNull: true },
        email: { type: DataTypes.STRING(254), allowNull: false },
        sentAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        linkRevokedAt: { type: DataTypes.DATE, allowNull: true },
      },
      { sequelize, tableName: 'share_recipients', timestamps: false },
    );
  }
}
