import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes, type Sequelize } from 'sequelize';
import { openDatabase } from '../../server/db';
import { createMigrator } from '../../server/migrations/umzug';

// A database made by the shipped migrations, with data in it, takes the share-recipients step without losing any.
let dir: string;
let sequelize: Sequelize;
beforeAll(async () => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'arcwright-migrate-'));
  sequelize = await openDatabase(path.join(dir, 'old.sqlite'));
});
afterAll(async () => {
  await sequelize.close();
  fs.rmSync(dir, { recursive: true, force: true });
});

const select = (sql: string) => sequelize.query<Record<string, unknown>>(sql, { type: QueryTypes.SELECT });

describe('0004-share-recipients on a database in use', () => {
  it('adds the table and keeps every sketch and its share link; undoing it drops only that table', async () => {
    const migrator = createMigrator(sequelize);
    await migrator.up({ to: '0003-mail' });
    const now = new Date().toISOString();
    await sequelize.query(
      `INSERT INTO users (id, email, name, role, passwordHash, disabled, createdAt, updatedAt)
       VALUES (1, 'old@example.test', 'Old hand', 'member', 'x', 0, '${now}', '${now}')`,
    );
    await sequelize.query(
      `INSERT INTO sketches (id, ownerId, name, layout, document, version, share, shareToken, createdAt, updatedAt)
       VALUES (7, 1, 'Kept rear', 'leaf-spring', '{}', 3, 'link', 'kept-token-0123456789', '${now}', '${now}')`,
    );

    expect((await migrator.up({ to: '0004-share-recipients' })).map((m) => m.name)).toEqual(['0004-share-recipients']);
    expect(await select('SELECT id, name, version, share, shareToken FROM sketches')).toEqual([
      { id: 7, name: 'Kept rear', version: 3, share: 'link', shareToken: 'kept-token-0123456789' },
    ]);
    await sequelize.query(
      `INSERT INTO share_recipients (sketchId, senderId, email, sentAt) VALUES (7, 1, 'a@example.test', '${now}')`,
    );
    expect(await select('SELECT email, linkRevokedAt FROM share_recipients')).toEqual([
      { email: 'a@example.test', linkRevokedAt: null },
    ]);

    await migrator.down({ to: '0004-share-recipients' });
    const tables = (await select("SELECT name FROM sqlite_master WHERE type = 'table'")).map((t) => t.name);
    expect(tables).not.toContain('share_recipients');
    expect(tables).toContain('sketches');
    expect(await select('SELECT id FROM sketches')).toEqual([{ id: 7 }]);
  });
});

describe('0005-classes on a database in use', () => {
  it('gives existing classes a join code and keeps their students; undoing it keeps them too', async () => {
    const migrator = createMigrator(sequelize);
    await migrator.up({ to: '0004-share-recipients' });
    const now = new Date().toISOString();
    await sequelize.query(
      `INSERT INTO classes (id, name, term, instructorId, createdAt, updatedAt)
       VALUES (3, 'Old lab', 'Autumn 2026', 1, '${now}', '${now}'), (4, 'Other lab', NULL, 1, '${now}', '${now}')`,
    );
    await sequelize.query(
      `INSERT INTO class_members (classId, userId, createdAt, updatedAt) VALUES (3, 1, '${now}', '${now}')`,
    );

    expect((await migrator.up()).map((m) => m.name)).toEqual(['0005-classes']);
    const classes = await select('SELECT id, name, joinCode, closedAt, deletedAt FROM classes ORDER BY id');
    expect(classes.map((c) => c.name)).toEqual(['Old lab', 'Other lab']);
    for (const c of classes) {
      expect(c.joinCode).toMatch(/^[A-Z2-9]{8}$/);
      expect(c).toMatchObject({ closedAt: null, deletedAt: null });
    }
    expect(classes[0].joinCode).not.toBe(classes[1].joinCode);
    expect(await select('SELECT classId, userId FROM class_members')).toEqual([{ classId: 3, userId: 1 }]);
    await expect(
      sequelize.query(`UPDATE classes SET joinCode = '${classes[0].joinCode}' WHERE id = 4`),
    ).rejects.toThrow();

    await migrator.down({ to: '0005-classes' });
    const tables = (await select("SELECT name FROM sqlite_master WHERE type = 'table'")).map((t) => t.name);
    for (const gone of ['class_invites', 'assignments', 'assignment_copies', 'hand_ins', 'feedback']) {
      expect(tables).not.toContain(gone);
    }
    expect(await select('SELECT id, name FROM classes ORDER BY id')).toEqual([
      { id: 3, name: 'Old lab' },
      { id: 4, name: 'Other lab' },
    ]);
    expect(await select('SELECT classId, userId FROM class_members')).toEqual([{ classId: 3, userId: 1 }]);
  });
});
