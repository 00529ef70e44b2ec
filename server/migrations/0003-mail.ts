import { DataTypes } from 'sequelize';
import type { Migration } from './umzug';

/** The outgoing-mail log and password-reset tokens. */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('outbox', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    to: { type: DataTypes.TEXT, allowNull: false },
    from: { type: DataTypes.TEXT, allowNull: true },
    subject: { type: DataTypes.TEXT, allowNull: false },
    text: { type: DataTypes.TEXT, allowNull: false },
    html: { type: DataTypes.TEXT, allowNull: false },
    messageId: { type: DataTypes.STRING(255), allowNull: true },
    // 'catcher' (the local SMTP catcher received it) or 'smtp' (handed to SMTP_URL).
    via: { type: DataTypes.STRING(16), allowNull: false },
    sentAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('outbox', ['sentAt']);

  await qi.createTable('password_resets', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    userId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    // SHA-256 of the token: a copy of the database does not hand out working reset links.
    tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    usedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: { type: DataTypes.DATE, allowNull: false },
  });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('password_resets');
  await qi.dropTable('outbox');
};
