import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

export const mailStates = ['queued', 'sending', 'sent', 'failed'] as const;
export type MailState = (typeof mailStates)[number];

/**
 * One outgoing e-mail waiting to be sent (or that was): the queue every app instance sends from.
 * An instance sends a row only after claiming it (queued → sending in one UPDATE), so no message goes twice.
 */
export class MailQueueItem extends Model<InferAttributes<MailQueueItem>, InferCreationAttributes<MailQueueItem>> {
  declare id: CreationOptional<number>;
  declare to: string;
  declare subject: string;
  declare text: string;
  declare html: string;
  declare state: MailState;
  /** Send attempts made so far. */
  declare attempts: CreationOptional<number>;
  /** Not sent before this time (the first attempt at once, retries later). */
  declare nextAttemptAt: Date;
  /** When an instance claimed it for sending. */
  declare claimedAt: CreationOptional<Date | null>;
  declare lastError: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    MailQueueItem.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        to: { type: DataTypes.TEXT, allowNull: false },
        subject: { type: DataTypes.TEXT, allowNull: false },
        text: { type: DataTypes.TEXT, allowNull: false },
        html: { type: DataTypes.TEXT, allowNull: false },
        state: { type: DataTypes.STRING(16), allowNull: false },
        attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        nextAttemptAt: { type: DataTypes.DATE, allowNull: false },
        claimedAt: { type: DataTypes.DATE, allowNull: true },
        lastError: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'mail_queue' },
    );
  }
}
