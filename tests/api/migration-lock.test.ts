import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Sequelize } from 'sequelize';
import { openDatabase } from '../../server/database';
import { loadConfig } from '../../server/config';
import { createMigrator, migrate } from '../../server/migrations/umzug';
import { createTestDatabase, testDialect, type TestDatabase } from './test-database';

// Two instances starting together on one new database: each opens its own connections and migrates at once.
let database: TestDatabase;
let first: Sequelize;
let second: Sequelize;
beforeAll(async () => {
  database = await createTestDatabase();
  const config = loadConfig(database.env);
  [first, second] = await Promise.all([openDatabase(config), openDatabase(config)]);
});
afterAll(async () => {
  await Promise.all([first?.close(), second?.close()]);
  await database.drop();
});

describe(`migrations started by two instances at once (${testDialect})`, () => {
  it('apply each migration exactly once, and both instances then see the whole schema', async () => {
    const every = (await createMigrator(first).pending()).map((m) => m.name);
    expect(every.length).toBeGreaterThan(0);

    const [a, b] = await Promise.all([migrate(first), migrate(second)]);

    // One instance applied everything and the other found nothing left (whichever got the lock first).
    expect([a, b].map((applied) => applied.length).sort()).toEqual([0, every.length]);
    expect([...a, ...b]).toEqual(every);
    // The migrations table lists each name once.
    const logged = (await first.getQueryInterface().select(null, 'migrations', { raw: true })) as unknown as {
      name: string;
    }[];
    expect(logged.map((row) => row.name).sort()).toEqual([...every].sort());
    expect(await createMigrator(second).pending()).toEqual([]);
  });
});
