import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';

/**
 * The PostgreSQL server the API tests run against, set by the PostgreSQL pass (tests/api/postgres/run.ts)
 * as the URL of its `postgres` database; unset, the API tests run on SQLite files.
 */
export const TEST_PG_URL = process.env.ARCWRIGHT_TEST_PG_URL || null;

/** The database the API tests are running on in this pass. */
export const testDialect: 'sqlite' | 'postgres' = TEST_PG_URL ? 'postgres' : 'sqlite';

/** An empty database of its own for one test server, and the environment that points the server at it. */
export interface TestDatabase {
  /** DATABASE_URL (PostgreSQL pass) or DATABASE_PATH (SQLite pass), plus UPLOADS_DIR, for loadConfig. */
  env: Record<string, string>;
  /** A temporary folder of this database's own (the SQLite file and uploads live there). */
  dir: string;
  /** Drops the database (PostgreSQL) and removes the folder. Close every connection to it first. */
  drop(): Promise<void>;
}

async function onServer<T>(work: (client: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: TEST_PG_URL! });
  await client.connect();
  try {
    return await work(client);
  } finally {
    await client.end();
  }
}

/**
 * A fresh, empty database: on PostgreSQL a new database (CREATE DATABASE) in the pass's cluster, so that
 * test files running side by side never share one; on SQLite a new file in a temporary folder.
 */
export async function createTestDatabase(): Promise<TestDatabase> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'arcwright-api-'));
  const uploads = { UPLOADS_DIR: path.join(dir, 'uploads') };
  if (!TEST_PG_URL) {
    return {
      env: { DATABASE_PATH: path.join(dir, 'test.sqlite'), ...uploads },
      dir,
      async drop() {
        fs.rmSync(dir, { recursive: true, force: true });
      },
    };
  }
  const name = `arcwright_test_${randomBytes(6).toString('hex')}`;
  await onServer((client) => client.query(`CREATE DATABASE ${name}`));
  const url = new URL(TEST_PG_URL);
  url.pathname = `/${name}`;
  return {
    env: { DATABASE_URL: url.toString(), ...uploads },
    dir,
    async drop() {
      await onServer((client) => client.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`));
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}
