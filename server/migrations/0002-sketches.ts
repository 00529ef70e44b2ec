import { DataTypes } from 'sequelize';
import type { Migration } from './umzug';

/** Sketches, their revisions, and uploaded files (tracing photos). */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('sketches', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    ownerId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    name: { type: DataTypes.STRING(200), allowNull: false },
    layout: { type: DataTypes.STRING(40), allowNull: false },
    document: { type: DataTypes.TEXT, allowNull: false },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    // 'private' | 'link'; 'class' joins with classes (shareClassId names the class).
    share: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'private' },
    shareToken: { type: DataTypes.STRING(64), allowNull: true, unique: true },
    shareClassId: {
      type: DataTypes.INTEGER,
      allowNull: true,
      references: { model: 'classes', key: 'id' },
      onDelete: 'SET NULL',
    },
    deletedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: { type: DataTypes.DATE, allowNull: false },
    updatedAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('sketches', ['ownerId', 'deletedAt']);

  await qi.createTable('sketch_revisions', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    sketchId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'sketches', key: 'id' },
      onDelete: 'CASCADE',
    },
    rev: { type: DataTypes.INTEGER, allowNull: false },
    version: { type: DataTypes.INTEGER, allowNull: false },
    name: { type: DataTypes.STRING(200), allowNull: false },
    document: { type: DataTypes.TEXT, allowNull: false },
    authorId: {
      type: DataTypes.INTEGER,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'SET NULL',
    },
    createdAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('sketch_revisions', ['sketchId', 'rev'], { unique: true });

  await qi.createTable('uploads', {
    id: { type: DataTypes.STRING(36), primaryKey: true },
    sketchId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'sketches', key: 'id' },
      onDelete: 'CASCADE',
    },
    ownerId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    mime: { type: DataTypes.STRING(40), allowNull: false },
    size: { type: DataTypes.INTEGER, allowNull: false },
    storedName: { type: DataTypes.STRING(80), allowNull: false, unique: true },
    createdAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('uploads', ['sketchId']);
};

export const down: Migration = async ({ context: qi }) => {
  for (const table of ['uploads', 'sketch_revisions', 'sketches']) await qi.dropTable(table);
};
