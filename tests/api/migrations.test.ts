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
