import { DataTypes } from 'sequelize';
import type { Migration } from './umzug';

/**
 * What one app process used to keep to itself, in the database, so that several instances on one database
 * behave as one: rate-limit counters, the outgoing mail queue, and the bytes of uploaded files.
 * Adds tables and an index; nothing existing changes.
 */
export const up: Migration = async ({ context: qi }) => {
  // The layout rate-limiter-flexible's SQL stores read and write (key, points, expire in ms since epoch).
  await qi.createTable('rate_limits', {
    key: { type: DataTypes.STRING(255), primaryKey: true },
    points: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    expire: { type: DataTypes.BIGINT, allowNull: true },
  });
  await qi.addIndex('rate_limits', ['expire']);

  await qi.createTable('mail_queue', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    to: { type: DataTypes.TEXT, allowNull: false },
    subject: { type: DataTypes.TEXT, allowNull: false },
    // Emptied once the message has left the queue (sent or given up on): a queue row never keeps a link longer than needed.
    text: { type: DataTypes.TEXT, allowNull: false },
    html: { type: DataTypes.TEXT, allowNull: false },
    // 'queued' (waiting for nextAttemptAt), 'sending' (claimed by one instance), 'sent' or 'failed'.
    state: { type: DataTypes.STRING(16), allowNull: false },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    nextAttemptAt: { type: DataTypes.DATE, allowNull: false },
    claimedAt: { type: DataTypes.DATE, allowNull: true },
    lastError: { type: DataTypes.TEXT, allowNull: true },
    createdAt: { type: DataTypes.DATE, allowNull: false },
    updatedAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('mail_queue', ['state', 'nextAttemptAt']);

  // An upload's bytes in pieces of at most UPLOAD_CHUNK_BYTES, read and written one piece at a time.
  await qi.createTable('upload_chunks', {
    uploadId: {
      type: DataTypes.STRING(36),
      primaryKey: true,
      references: { model: 'uploads', key: 'id' },
      onDelete: 'CASCADE',
    },
    seq: { type: DataTypes.INTEGER, primaryKey: true },
    data: { type: DataTypes.BLOB, allowNull: false },
  });
  // The storage quota sums an account's uploads.
  await qi.addIndex('uploads', ['ownerId']);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeIndex('uploads', ['ownerId']);
  await qi.dropTable('upload_chunks');
  await qi.dropTable('mail_queue');
  await qi.dropTable('rate_limits');
};
