import { DataTypes } from 'sequelize';
import type { Migration } from './umzug';

const timestamps = {
  createdAt: { type: DataTypes.DATE, allowNull: false },
  updatedAt: { type: DataTypes.DATE, allowNull: false },
};

/** Accounts, shops, classes and sign-in sessions. */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('shops', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(120), allowNull: false, unique: true },
    city: { type: DataTypes.STRING(120), allowNull: true },
    ...timestamps,
  });
  await qi.createTable('users', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    role: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'member' },
    passwordHash: { type: DataTypes.STRING(255), allowNull: false },
    disabled: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    shopId: {
      type: DataTypes.INTEGER,
      allowNull: true,
      references: { model: 'shops', key: 'id' },
      onDelete: 'SET NULL',
    },
    ...timestamps,
  });
  await qi.createTable('classes', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    term: { type: DataTypes.STRING(60), allowNull: true },
    instructorId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    ...timestamps,
  });
  await qi.createTable('class_members', {
    classId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      primaryKey: true,
      references: { model: 'classes', key: 'id' },
      onDelete: 'CASCADE',
    },
    userId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      primaryKey: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    ...timestamps,
  });
  await qi.createTable('sessions', {
    sid: { type: DataTypes.STRING(64), primaryKey: true },
    expires: { type: DataTypes.DATE, allowNull: true },
    data: { type: DataTypes.TEXT, allowNull: true },
    // No foreign key: a session row exists before sign-in, and ends with its user in code.
    userId: { type: DataTypes.INTEGER, allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('sessions', ['userId']);
  await qi.addIndex('sessions', ['expires']);
};

export const down: Migration = async ({ context: qi }) => {
  for (const table of ['sessions', 'class_members', 'classes', 'users', 'shops']) await qi.dropTable(table);
};
