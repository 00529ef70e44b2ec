import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** An e-mailed invitation to a class; its single-use token is stored only as a SHA-256. */
export class ClassInvite extends Model<InferAttributes<ClassInvite>, InferCreationAttributes<ClassInvite>> {
  declare id: CreationOptional<number>;
  declare classId: number;
  declare email: string;
  declare tokenHash: string;
  declare invitedById: number | null;
  declare expiresAt: Date;
  /** When its mail was accepted by the mail server; null only while it is going out. */
  declare sentAt: CreationOptional<Date | null>;
  declare acceptedAt: CreationOptional<Date | null>;
  declare acceptedById: CreationOptional<number | null>;
  declare withdrawnAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    ClassInvite.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        classId: { type: DataTypes.INTEGER, allowNull: false },
        email: { type: DataTypes.STRING(254), allowNull: false },
        tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
        invitedById: { type: DataTypes.INTEGER, allowNull: true },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        sentAt: { type: DataTypes.DATE, allowNull: true },
        acceptedAt: { type: DataTypes.DATE, allowNull: true },
        acceptedById: { type: DataTypes.INTEGER, allowNull: true },
        withdrawnAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'class_invites' },
    );
  }
}
