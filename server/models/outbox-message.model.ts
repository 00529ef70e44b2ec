import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { withoutResetTokens } from '../services/links';

/**
 * One outgoing e-mail as it left (or, with the local catcher, as it arrived), for the admin's mail log; the
 * tokens of password-reset links are removed before it is stored.
 */
export class OutboxMessage extends Model<InferAttributes<OutboxMessage>, InferCreationAttributes<OutboxMessage>> {
  declare id: CreationOptional<number>;
  declare to: string;
  declare from: string | null;
  declare subject: string;
  declare text: string;
  declare html: string;
  declare messageId: string | null;
  declare via: 'catcher' | 'smtp';
  declare sentAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    OutboxMessage.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        to: { type: DataTypes.TEXT, allowNull: false },
        from: { type: DataTypes.TEXT, allowNull: true },
        subject: { type: DataTypes.TEXT, allowNull: false },
        text: { type: DataTypes.TEXT, allowNull: false },
        html: { type: DataTypes.TEXT, allowNull: false },
        messageId: { type: DataTypes.STRING(255), allowNull: true },
        via: { type: DataTypes.STRING(16), allowNull: false },
        sentAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      },
      {
        sequelize,
        tableName: 'outbox',
        timestamps: false,
        hooks: {
          // Whoever writes the log (the local catcher, the SMTP mailer), reset links never reach it whole.
          beforeSave(row) {
            row.text = withoutResetTokens(row.text);
            row.html = withoutResetTokens(row.html);
          },
        },
      },
    );
  }
}
