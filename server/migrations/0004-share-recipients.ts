import { DataTypes } from 'sequelize';
import type { Migration } from './umzug';

/** Who a sketch's read-only link was mailed to, and when. Adds a table; nothing existing changes. */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('share_recipients', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    sketchId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'sketches', key: 'id' },
      onDelete: 'CASCADE',
    },
    senderId: {
      type: DataTypes.INTEGER,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'SET NULL',
    },
    email: { type: DataTypes.STRING(254), allowNull: false },
    sentAt: { type: DataTypes.DATE, allowNull: false },
    // Set when the link that was mailed is revoked: that recipient's link no longer works.
    linkRevokedAt: { type: DataTypes.DATE, allowNull: true },
  });
  await qi.addIndex('share_recipients', ['sketchId', 'sentAt']);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('share_recipients');
};
