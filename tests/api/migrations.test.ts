import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Sequelize } from 'sequelize';
import { openDatabase } from '../../server/database';
import { loadConfig } from '../../server/config';
import { createMigrator } from '../../server/migrations/umzug';
import { createTestDatabase, type TestDatabase } from './test-database';

// A database made by the shipped migrations, with data in it, takes the share-recipients step without losing any.
let database: TestDatabase;
let sequelize: Sequelize;
beforeAll(async () => {
  database = await createTestDatabase();
  sequelize = await openDatabase(loadConfig(database.env));
});
afterAll(async () => {
  await sequelize.close();
  await database.drop();
});

/** Every row of `table` with the named columns, in id order (through the query interface: no dialect's own SQL). */
async function rows(table: string, attributes: string[]): Promise<Record<string, unknown>[]> {
  const all = (await sequelize.getQueryInterface().select(null, table, {})) as Record<string, unknown>[];
  return all
    .sort((a, b) => Number(a.id) - Number(b.id))
    .map((row) => Object.fromEntries(attributes.map((name) => [name, row[name]])));
}

describe('0004-share-recipients on a database in use', () => {
  it('adds the table and keeps every sketch and its share link; undoing it drops only that table', async () => {
    const qi = sequelize.getQueryInterface();
    const migrator = createMigrator(sequelize);
    await migrator.up({ to: '0003-mail' });
    const now = new Date();
    await qi.bulkInsert('users', [
      {
        id: 1,
        email: 'old@example.test',
        name: 'Old hand',
        role: 'member',
        passwordHash: 'x',
        disabled: false,
        createdAt: now,
        updatedAt: now,
      },
    ]);
    await qi.bulkInsert('sketches', [
      {
        id: 7,
        ownerId: 1,
        name: 'Kept rear',
        layout: 'leaf-spring',
        document: '{}',
        version: 3,
        share: 'link',
        shareToken: 'kept-token-0123456789',
        createdAt: now,
        updatedAt: now,
      },
    ]);

    expect((await migrator.up({ to: '0004-share-recipients' })).map((m) => m.name)).toEqual(['0004-share-recipients']);
    expect(await rows('sketches', ['id', 'name', 'version', 'share', 'shareToken'])).toEqual([
      { id: 7, name: 'Kept rear', version: 3, share: 'link', shareToken: 'kept-token-0123456789' },
    ]);
    await qi.bulkInsert('share_recipients', [{ sketchId: 7, senderId: 1, email: 'a@example.test', sentAt: now }]);
    expect(await rows('share_recipients', ['email', 'linkRevokedAt'])).toEqual([
      { email: 'a@example.test', linkRevokedAt: null },
    ]);

    await migrator.down({ to: '0004-share-recipients' });
    const tables = (await qi.showAllTables()).map((t) =>
      typeof t === 'string' ? t : (t as { tableName: string }).tableName,
    );
    expect(tables).not.toContain('share_recipients');
    expect(tables).toContain('sketches');
    expect(await rows('sketches', ['id'])).toEqual([{ id: 7 }]);
  });
});

describe('0005-classes on a database in use', () => {
  it('gives existing classes a join code and keeps their students; undoing it keeps them too', async () => {
    const qi = sequelize.getQueryInterface();
    const migrator = createMigrator(sequelize);
    await migrator.up({ to: '0004-share-recipients' });
    const now = new Date();
    await qi.bulkInsert('classes', [
      { id: 3, name: 'Old lab', term: 'Autumn 2026', instructorId: 1, createdAt: now, updatedAt: now },
      { id: 4, name: 'Other lab', term: null, instructorId: 1, createdAt: now, updatedAt: now },
    ]);
    await qi.bulkInsert('class_members', [{ classId: 3, userId: 1, createdAt: now, updatedAt: now }]);

    expect((await migrator.up({ to: '0005-classes' })).map((m) => m.name)).toEqual(['0005-classes']);
    const classes = await rows('classes', ['id', 'name', 'joinCode', 'closedAt', 'deletedAt']);
    expect(classes.map((c) => c.name)).toEqual(['Old lab', 'Other lab']);
    for (const c of classes) {
      expect(c.joinCode).toMatch(/^[A-Z2-9]{8}$/);
      expect(c).toMatchObject({ closedAt: null, deletedAt: null });
    }
    expect(classes[0].joinCode).not.toBe(classes[1].joinCode);
    expect(await rows('class_members', ['classId', 'userId'])).toEqual([{ classId: 3, userId: 1 }]);
    await expect(qi.bulkUpdate('classes', { joinCode: classes[0].joinCode }, { id: 4 })).rejects.toThrow();

    await migrator.down({ to: '0005-classes' });
    const tables = (await qi.showAllTables()).map((t) =>
      typeof t === 'string' ? t : (t as { tableName: string }).tableName,
    );
    for (const gone of ['class_invites', 'assignments', 'assignment_copies', 'hand_ins', 'feedback']) {
      expect(tables).not.toContain(gone);
    }
    expect(await rows('classes', ['id', 'name'])).toEqual([
      { id: 3, name: 'Old lab' },
      { id: 4, name: 'Other lab' },
    ]);
    expect(await rows('class_members', ['classId', 'userId'])).toEqual([{ classId: 3, userId: 1 }]);
  });
});
