import { randomBytes } from 'node:crypto';
import { DataTypes, QueryTypes } from 'sequelize';
import type { Migration } from './umzug';
import { withoutForeignKeyChecks } from '../database';

const timestamps = {
  createdAt: { type: DataTypes.DATE, allowNull: false },
  updatedAt: { type: DataTypes.DATE, allowNull: false },
};

const fk = (table: string, onDelete: 'CASCADE' | 'SET NULL', allowNull = false) => ({
  type: DataTypes.INTEGER,
  allowNull,
  references: { model: table, key: 'id' },
  onDelete,
});

/** Letters and digits without look-alikes (no 0/O, 1/I/L), as the classes service makes them. */
const CODE_ALPHABET = 'ABCDEFGHJKMNPQRSTUVWXYZ23456789';

function joinCode(): string {
  return [...randomBytes(8)].map((b) => CODE_ALPHABET[b % CODE_ALPHABET.length]).join('');
}

/**
 * Classes at work: a join code, closing and deleting (with undo) on the existing classes table, and new
 * tables for e-mailed invitations, assignments, the students' copies, hand-ins and feedback.
 */
export const up: Migration = async ({ context: qi }) => {
  // SQLite cannot add a UNIQUE column: the column first, filled for existing classes, then a unique index.
  await qi.addColumn('classes', 'joinCode', { type: DataTypes.STRING(16), allowNull: true });
  await qi.addColumn('classes', 'closedAt', { type: DataTypes.DATE, allowNull: true });
  await qi.addColumn('classes', 'deletedAt', { type: DataTypes.DATE, allowNull: true });
  const existing = await qi.sequelize.query<{ id: number }>('SELECT id FROM classes', { type: QueryTypes.SELECT });
  for (const { id } of existing) await qi.bulkUpdate('classes', { joinCode: joinCode() }, { id });
  await qi.addIndex('classes', ['joinCode'], { unique: true, name: 'classes_join_code' });
  await qi.addIndex('classes', ['instructorId']);

  await qi.createTable('class_invites', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    classId: fk('classes', 'CASCADE'),
    email: { type: DataTypes.STRING(254), allowNull: false },
    // SHA-256 of the token in the mailed link: a copy of the database hands out no working invitations.
    tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    invitedById: fk('users', 'SET NULL', true),
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    // Null while the mail is going out; an invitation whose mail failed is removed, never left "sent".
    sentAt: { type: DataTypes.DATE, allowNull: true },
    acceptedAt: { type: DataTypes.DATE, allowNull: true },
    acceptedById: fk('users', 'SET NULL', true),
    withdrawnAt: { type: DataTypes.DATE, allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('class_invites', ['classId', 'email']);
  await qi.addIndex('class_invites', ['classId', 'sentAt']);

  await qi.createTable('assignments', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    classId: fk('classes', 'CASCADE'),
    // The instructor's sketch it was made from; no foreign key, as that sketch may be deleted later.
    starterSketchId: { type: DataTypes.INTEGER, allowNull: false },
    // The starter as it was when the assignment was made: every student copies the same document.
    starterDocument: { type: DataTypes.TEXT, allowNull: false },
    title: { type: DataTypes.STRING(120), allowNull: false },
    instructions: { type: DataTypes.TEXT, allowNull: false },
    dueAt: { type: DataTypes.DATE, allowNull: false },
    withTargets: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    published: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    ...timestamps,
  });
  await qi.addIndex('assignments', ['classId']);

  await qi.createTable('assignment_copies', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    assignmentId: fk('assignments', 'CASCADE'),
    studentId: fk('users', 'CASCADE'),
    // A normal sketch the student owns; it stays theirs when they leave the class.
    sketchId: fk('sketches', 'CASCADE'),
    ...timestamps,
  });
  await qi.addIndex('assignment_copies', ['assignmentId', 'studentId'], { unique: true });

  await qi.createTable('hand_ins', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    assignmentId: fk('assignments', 'CASCADE'),
    studentId: fk('users', 'CASCADE'),
    // The copy and its saved version at hand-in; the document is kept here, frozen, whatever becomes of the copy.
    sketchId: { type: DataTypes.INTEGER, allowNull: false },
    version: { type: DataTypes.INTEGER, allowNull: false },
    document: { type: DataTypes.TEXT, allowNull: false },
    handedInAt: { type: DataTypes.DATE, allowNull: false },
    late: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    // Key numbers (JSON list) and counts, computed by sweeping the document when it was handed in.
    keyNumbers: { type: DataTypes.TEXT, allowNull: false },
    flagCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    missedTargetCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    problem: { type: DataTypes.TEXT, allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('hand_ins', ['assignmentId', 'studentId']);

  await qi.createTable('feedback', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    handInId: { ...fk('hand_ins', 'CASCADE'), unique: true },
    authorId: fk('users', 'SET NULL', true),
    text: { type: DataTypes.TEXT, allowNull: false },
    ...timestamps,
  });
};

export const down: Migration = async ({ context: qi }) => {
  for (const table of ['feedback', 'hand_ins', 'assignment_copies', 'assignments', 'class_invites']) {
    await qi.dropTable(table);
  }
  await qi.removeIndex('classes', ['instructorId']);
  await qi.removeIndex('classes', 'classes_join_code');
  // Dropping a column may copy the table (SQLite), which with foreign keys on would empty class_members.
  await withoutForeignKeyChecks(qi.sequelize, async () => {
    for (const column of ['deletedAt', 'closedAt', 'joinCode']) await qi.removeColumn('classes', column);
  });
};
