import { spawn } from 'node:child_process';
import { createHash } from 'node:crypto';
import { Op, QueryTypes, Sequelize, col, fn, where, type WhereOptions } from 'sequelize';
import { RateLimiterPostgres, type RateLimiterStoreAbstract } from 'rate-limiter-flexible';
import { initModels } from '../models';
import type { DatabaseDialect, DatabaseLocation, SqlValue } from './dialect';
import { rateCounterOptions, type RateCounterOptions } from './rate-counters';

/** Connections one instance keeps to PostgreSQL at most; several instances share the server's max_connections. */
const POOL_MAX = 10;

async function open(location: DatabaseLocation): Promise<Sequelize> {
  const sequelize = new Sequelize(location.databaseUrl!, {
    dialect: 'postgres',
    logging: false,
    pool: { max: POOL_MAX, min: 0, idle: 10_000 },
  });
  initModels(sequelize);
  await sequelize.authenticate();
  return sequelize;
}

/** strpos() rather than LIKE/ILIKE, so that % and _ in the search text are plain characters. */
function caseInsensitiveContains(column: string, text: string): WhereOptions {
  return where(fn('strpos', fn('lower', col(column)), text.toLowerCase()), Op.gt, 0);
}

/** The advisory-lock key for `name`: 48 bits of its SHA-256, so different names do not share a lock. */
export function advisoryLockKey(name: string): number {
  return parseInt(createHash('sha256').update(`arcwright:${name}`).digest('hex').slice(0, 12), 16);
}

/**
 * Holds a transaction-scoped advisory lock while `work` runs: another instance's call waits at
 * pg_advisory_xact_lock until this transaction ends, and the server releases the lock by itself
 * if this process dies. `work` runs its statements on other pooled connections, outside the transaction.
 */
async function withExclusiveLock<T>(sequelize: Sequelize, name: string, work: () => Promise<T>): Promise<T> {
  return sequelize.transaction(async (transaction) => {
    await sequelize.query('SELECT pg_advisory_xact_lock(:key)', {
      replacements: { key: advisoryLockKey(name) },
      transaction,
    });
    return work();
  });
}

/** PostgreSQL alters a table in place: nothing to switch off. */
function withoutForeignKeyChecks<T>(_sequelize: Sequelize, work: () => Promise<T>): Promise<T> {
  return work();
}

/** The connection settings of `url` as libpq's environment variables, so that no password shows on a command line. */
function libpqEnvironment(url: string): NodeJS.ProcessEnv {
  const u = new URL(url);
  const env: NodeJS.ProcessEnv = {
    PGHOST: decodeURIComponent(u.hostname) || undefined,
    PGPORT: u.port || undefined,
    PGUSER: decodeURIComponent(u.username) || undefined,
    PGPASSWORD: decodeURIComponent(u.password) || undefined,
    PGDATABASE: decodeURIComponent(u.pathname.replace(/^\//, '')) || undefined,
    PGSSLMODE: u.searchParams.get('sslmode') ?? undefined,
  };
  return Object.fromEntries(Object.entries(env).filter(([, v]) => v !== undefined));
}

/** Runs one of PostgreSQL's client programs (on PATH) against the location's database; rejects with its stderr. */
function runClientProgram(program: string, args: string[], location: DatabaseLocation): Promise<void> {
  const env = { ...process.env, ...libpqEnvironment(location.databaseUrl!) };
  return new Promise<void>((resolve, reject) => {
    const child = spawn(program, args, { env, stdio: ['ignore', 'ignore', 'pipe'] });
    let stderr = '';
    child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
    child.on('error', (err) =>
      reject(new Error(`could not run ${program} (install PostgreSQL's client programs): ${err.message}`)),
    );
    child.on('exit', (code) =>
      code === 0 ? resolve() : reject(new Error(`${program} failed (exit ${code}): ${stderr.trim()}`)),
    );
  });
}

/** pg_dump in its custom format: one consistent snapshot, taken while the server runs. */
function backup(_sequelize: Sequelize, location: DatabaseLocation, file: string): Promise<void> {
  return runClientProgram('pg_dump', ['--format=custom', '--no-owner', '--no-privileges', `--file=${file}`], location);
}

/** pg_restore into the (existing, empty) database of DATABASE_URL, all or nothing. */
async function restore(location: DatabaseLocation, file: string): Promise<void> {
  const sequelize = await open(location);
  try {
    const tables = await sequelize.getQueryInterface().showAllTables();
    if (tables.length) {
      throw new Error('the database of DATABASE_URL already has tables: restore into a new, empty database');
    }
  } finally {
    await sequelize.close();
  }
  const database = decodeURIComponent(new URL(location.databaseUrl!).pathname.replace(/^\//, ''));
  await runClientProgram(
    'pg_restore',
    ['--no-owner', '--no-privileges', '--exit-on-error', '--single-transaction', `--dbname=${database}`, file],
    location,
  );
}

/** rate-limiter-flexible's PostgreSQL store (table rate_limits), on Sequelize's own pool of connections. */
function rateCounter(sequelize: Sequelize, options: RateCounterOptions): RateLimiterStoreAbstract {
  return new RateLimiterPostgres({ ...rateCounterOptions(options), storeClient: sequelize, storeType: 'sequelize' });
}

/** Sequelize's plain query: on PostgreSQL it builds no model and looks at the stack only when a query fails. */
function selectRows<T extends object>(
  sequelize: Sequelize,
  sql: string,
  params: Record<string, SqlValue>,
): Promise<T[]> {
  return sequelize.query<T>(sql, { replacements: params, type: QueryTypes.SELECT });
}

export const postgresDialect: DatabaseDialect = {
  name: 'postgres',
  open,
  caseInsensitiveContains,
  withExclusiveLock,
  withoutForeignKeyChecks,
  backup,
  restore,
  rateCounter,
  selectRows,
};
