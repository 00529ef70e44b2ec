import fs from 'node:fs';
import path from 'node:path';
import { Op, QueryTypes, Sequelize, Transaction, col, fn, where, type WhereOptions } from 'sequelize';
import sqlite3 from 'sqlite3';
import { RateLimiterSQLite, type RateLimiterStoreAbstract } from 'rate-limiter-flexible';
import { initModels } from '../models';
import type { DatabaseDialect, DatabaseLocation, SqlValue } from './dialect';
import { rateCounterOptions, type RateCounterOptions } from './rate-counters';

/** How long a connection waits for another's write lock before giving up (ms). */
export const BUSY_TIMEOUT_MS = 10_000;

/** The key of the connection that serves reads outside transactions (readsOnTheirOwnConnection). */
const READS_KEY = 'arcwright-reads-connection';

/**
 * Statements every SQLite connection runs before its first query. The busy timeout comes first: switching a new
 * file to WAL takes its lock, and two instances opening one new file at once must wait for each other, not fail.
 */
const CONNECTION_PRAGMAS = [
  `PRAGMA busy_timeout = ${BUSY_TIMEOUT_MS}`,
  'PRAGMA journal_mode = WAL',
  'PRAGMA foreign_keys = ON',
  'PRAGMA synchronous = NORMAL',
];

interface RawSqliteConnection {
  run(sql: string, cb: (err: Error | null) => void): void;
  serialize(): void;
}

function runOn(connection: RawSqliteConnection, sql: string): Promise<void> {
  return new Promise((resolve, reject) => connection.run(sql, (err) => (err ? reject(err) : resolve())));
}

/** Tries a pragma again while the file is busy: SQLite answers a switch to WAL with SQLITE_BUSY at once, without waiting. */
async function pragmaOn(connection: RawSqliteConnection, sql: string, attempts = 100): Promise<void> {
  for (let i = 1; ; i++) {
    try {
      return await runOn(connection, sql);
    } catch (err) {
      if ((err as { code?: string }).code !== 'SQLITE_BUSY' || i >= attempts) throw err;
      await new Promise((r) => setTimeout(r, 20));
    }
  }
}

/**
 * Sequelize's sqlite dialect opens a fresh connection for every transaction (keyed by the
 * transaction id) besides its default one, and has no hook for new connections. Its
 * connection manager's getConnection is the single place they open, so the pragmas are run
 * there, once per connection, and awaited before the connection is handed out.
 *
 * Each connection is also put in serialized mode: node-sqlite3 otherwise runs several
 * statements of one connection at once on libuv's thread pool (4 threads), where they wait
 * for each other, and a connection waiting for the write lock could occupy every thread the
 * lock holder needs to finish.
 */
function applyPragmasOnEveryConnection(sequelize: Sequelize): void {
  const manager = sequelize.connectionManager as unknown as {
    getConnection(options?: { uuid?: string }): Promise<RawSqliteConnection>;
  };
  const original = manager.getConnection.bind(manager);
  const configured = new WeakMap<RawSqliteConnection, Promise<void>>();
  manager.getConnection = async (options) => {
    const connection = await original(options);
    let ready = configured.get(connection);
    if (!ready) {
      const forReads = options?.uuid === READS_KEY;
      ready = (async () => {
        for (const sql of CONNECTION_PRAGMAS) await pragmaOn(connection, sql);
        if (forReads) await runOn(connection, 'PRAGMA query_only = ON');
        else connection.serialize();
      })();
      configured.set(connection, ready);
    }
    await ready;
    return connection;
  };
}

/**
 * Every query outside a transaction used to share the one default connection, which is serialized: a query starts
 * only after the previous one's answer came back to the event loop. Under load that hand-over, not SQLite, was the
 * limit: a signed-in read makes three queries (session, user, sketch), and 50 of them in flight queued behind each
 * other one round trip at a time. Reads (Sequelize's SELECT queries outside a transaction) therefore get a
 * connection of their own in parallel mode, so they are all handed to the thread pool at once.
 *
 * That is safe where the default connection's serialized mode is needed: in WAL mode a reader never waits for the
 * write lock, so a read cannot hold a pool thread that a writer needs. `query_only` makes the connection refuse
 * any write, should one ever be sent here as a SELECT. Each read sees every write committed before it started,
 * as on the default connection; reads inside a transaction stay on the transaction's connection.
 */
function readsOnTheirOwnConnection(sequelize: Sequelize): void {
  const manager = sequelize.connectionManager as unknown as {
    getConnection(options?: { uuid?: string; type?: string }): Promise<RawSqliteConnection>;
  };
  // An in-memory database is one connection whatever the key: nothing to split there.
  if ((sequelize as unknown as { options: { storage?: string } }).options.storage === ':memory:') return;
  const getConnection = manager.getConnection.bind(manager);
  // Opened once and then handed out as it is: this runs for every read, so it copies no options and awaits nothing.
  let reads: Promise<RawSqliteConnection> | null = null;
  manager.getConnection = (options) => {
    const outsideTransaction = !options?.uuid || options.uuid === 'default';
    if (options?.type === QueryTypes.SELECT && outsideTransaction && !readsOnDefaultConnection.has(sequelize)) {
      reads ??= getConnection({ uuid: READS_KEY }).catch((err: unknown) => {
        reads = null;
        throw err;
      });
      return reads;
    }
    return getConnection(options);
  };
  const close = sequelize.close.bind(sequelize);
  sequelize.close = () => {
    reads = null;
    return close();
  };
}

/**
 * Runs managed transactions one at a time within this process. SQLite has one writer anyway;
 * queueing here means a waiting transaction waits in JavaScript instead of in SQLite's busy
 * handler on a pool thread (which could starve the transaction holding the lock). busy_timeout
 * still covers writers outside the queue (single statements, other processes).
 * Do not start a transaction inside another one: it would wait for itself.
 */
function queueTransactions(sequelize: Sequelize): void {
  let tail: Promise<unknown> = Promise.resolve();
  const original = sequelize.transaction.bind(sequelize) as (...args: unknown[]) => Promise<unknown>;
  (sequelize as unknown as { transaction: (...args: unknown[]) => Promise<unknown> }).transaction = (...args) => {
    const managed = args.some((a) => typeof a === 'function');
    if (!managed) return original(...args);
    const run = tail.then(() => original(...args));
    tail = run.catch(() => undefined);
    return run;
  };
}

/**
 * The dialect opens (and after commit closes) a new SQLite connection for every transaction.
 * As transactions are queued, one spare connection kept open serves nearly all of them;
 * a transaction that finds it busy (an unmanaged one, or a savepoint's parent elsewhere) gets
 * a connection of its own as before. A connection is only ever used by one transaction at a time.
 */
function reuseTransactionConnection(sequelize: Sequelize): void {
  const manager = sequelize.connectionManager as unknown as {
    getConnection(options?: { uuid?: string }): Promise<RawSqliteConnection>;
    releaseConnection(connection: RawSqliteConnection, force?: boolean): unknown;
    connections: Record<string, RawSqliteConnection>;
  };
  const getConnection = manager.getConnection.bind(manager);
  const releaseConnection = manager.releaseConnection.bind(manager);
  let spare: RawSqliteConnection | null = null;
  let spareInUse = false;
  const SPARE_KEY = 'arcwright-spare-transaction-connection';

  manager.getConnection = async (options) => {
    if (!options?.uuid || options.uuid === 'default' || spareInUse) return getConnection(options);
    spareInUse = true;
    try {
      spare ??= await getConnection({ ...options, uuid: SPARE_KEY });
    } catch (err) {
      spareInUse = false;
      throw err;
    }
    return spare;
  };
  manager.releaseConnection = (connection, force) => {
    if (connection === spare && !force) {
      spareInUse = false;
      return;
    }
    return releaseConnection(connection, force);
  };
  const close = sequelize.close.bind(sequelize);
  sequelize.close = async () => {
    if (spare) {
      const s = spare as unknown as { close(cb: (err: Error | null) => void): void };
      await new Promise<void>((resolve) => s.close(() => resolve()));
      delete manager.connections[SPARE_KEY];
      spare = null;
    }
    return close();
  };
}

/** Opens (creating when missing) the SQLite file and binds the models to it. Run migrations next. */
async function open(location: DatabaseLocation): Promise<Sequelize> {
  const databasePath = location.databasePath;
  fs.mkdirSync(path.dirname(databasePath), { recursive: true });
  const sequelize = new Sequelize({
    dialect: 'sqlite',
    storage: databasePath,
    logging: false,
    // Writers take the lock at BEGIN, so a read-then-write transaction never fails half way
    // with SQLITE_BUSY when another writer got in between.
    transactionType: Transaction.TYPES.IMMEDIATE,
    retry: { max: 3 },
  });
  applyPragmasOnEveryConnection(sequelize);
  readsOnTheirOwnConnection(sequelize);
  reuseTransactionConnection(sequelize);
  queueTransactions(sequelize);
  initModels(sequelize);
  await sequelize.authenticate();
  return sequelize;
}

/**
 * SQLite's own write lock is the shared lock: `work` runs inside BEGIN IMMEDIATE on the default
 * connection (the one every statement outside a managed transaction uses), so another process's
 * `work` waits at its BEGIN until this one commits, and a failure rolls all of `work` back.
 * `work` must not start a managed transaction: that one would wait for this lock.
 */
async function withExclusiveLock<T>(sequelize: Sequelize, _name: string, work: () => Promise<T>): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      await sequelize.query('BEGIN IMMEDIATE');
      break;
    } catch (err) {
      // busy_timeout has passed while another process held the lock: keep waiting for it a while longer.
      if (attempt >= LOCK_ATTEMPTS || !/SQLITE_BUSY/.test(String(err))) throw err;
    }
  }
  // The work's reads must see its own uncommitted writes: they stay on the default connection meanwhile.
  readsOnDefaultConnection.add(sequelize);
  try {
    const result = await work();
    await sequelize.query('COMMIT');
    return result;
  } catch (err) {
    await sequelize.query('ROLLBACK').catch(() => undefined);
    throw err;
  } finally {
    readsOnDefaultConnection.delete(sequelize);
  }
}

/** PRAGMA foreign_keys on the default connection, the one the schema changes of a migration use. */
async function withoutForeignKeyChecks<T>(sequelize: Sequelize, work: () => Promise<T>): Promise<T> {
  await sequelize.query('PRAGMA foreign_keys = OFF');
  try {
    return await work();
  } finally {
    await sequelize.query('PRAGMA foreign_keys = ON');
  }
}

/** Databases inside withExclusiveLock, whose reads readsOnTheirOwnConnection leaves on the default connection. */
const readsOnDefaultConnection = new WeakSet<Sequelize>();

/** How many times BEGIN IMMEDIATE waits busy_timeout for another process's lock before giving up. */
const LOCK_ATTEMPTS = 6;

/**
 * A date as Sequelize writes it to SQLite (UTC, its default time zone, to the millisecond), so that a parameter
 * compares with the stored dates as Sequelize's own escaping would.
 */
export function sqliteDate(date: Date): string {
  return date.toISOString().replace('T', ' ').replace('Z', ' +00:00');
}

/**
 * Straight on the reads connection (readsOnTheirOwnConnection) with node-sqlite3's own parameter binding. Sequelize's
 * SQLite query reads the stack of an Error it makes for every query, which V8 formats on the spot (through the
 * source maps when the server runs under tsx), and before a model query it asks SQLite for the table's column
 * types: together more CPU than the read itself. None of that happens here.
 */
async function selectRows<T extends object>(
  sequelize: Sequelize,
  sql: string,
  params: Record<string, SqlValue>,
): Promise<T[]> {
  const manager = sequelize.connectionManager as unknown as {
    getConnection(options: { type: string }): Promise<sqlite3.Database>;
  };
  const connection = await manager.getConnection({ type: QueryTypes.SELECT });
  const bound: Record<string, string | number | null> = {};
  for (const [name, value] of Object.entries(params))
    bound[`:${name}`] = value instanceof Date ? sqliteDate(value) : value;
  return new Promise((resolve, reject) =>
    connection.all(sql, bound, (err, rows) => (err ? reject(err) : resolve(rows as T[]))),
  );
}

/** VACUUM INTO writes a consistent, compacted copy from one read transaction; writers go on meanwhile (WAL). */
async function backup(sequelize: Sequelize, _location: DatabaseLocation, file: string): Promise<void> {
  await sequelize.query(`VACUUM INTO ${sequelize.escape(file)}`);
}

/** The copy is a complete SQLite file: it becomes the database file, which must not exist yet. */
async function restore(location: DatabaseLocation, file: string): Promise<void> {
  const target = location.databasePath;
  if (fs.existsSync(target)) {
    throw new Error(`${target} already exists: restore into a new DATABASE_PATH, or move the old file away first`);
  }
  fs.mkdirSync(path.dirname(target), { recursive: true });
  fs.copyFileSync(file, target, fs.constants.COPYFILE_EXCL);
}

/** instr() rather than LIKE, so that % and _ in the search text are plain characters. */
function caseInsensitiveContains(column: string, text: string): WhereOptions {
  return where(fn('instr', fn('lower', col(column)), text.toLowerCase()), Op.gt, 0);
}

/**
 * The one SQLite connection the rate counters of a database use, opened on first need and closed with the
 * database. rate-limiter-flexible's SQLite store wants a plain sqlite3 connection, and a connection of its
 * own keeps its short write (one upsert) out of Sequelize's transactions.
 */
const counterConnections = new WeakMap<Sequelize, sqlite3.Database>();

function counterConnection(sequelize: Sequelize): sqlite3.Database {
  const known = counterConnections.get(sequelize);
  if (known) return known;
  const storage = (sequelize as unknown as { options: { storage?: string } }).options.storage;
  if (!storage) throw new Error('the SQLite database has no file');
  const connection = new sqlite3.Database(storage);
  connection.configure('busyTimeout', BUSY_TIMEOUT_MS);
  counterConnections.set(sequelize, connection);
  const close = sequelize.close.bind(sequelize);
  sequelize.close = async () => {
    counterConnections.delete(sequelize);
    await new Promise<void>((resolve) => connection.close(() => resolve()));
    return close();
  };
  return connection;
}

/**
 * rate-limiter-flexible's SQLite store, made safe after a failed write: the store wraps its upsert in a
 * SAVEPOINT and on an error (SQLITE_BUSY under heavy load, say) only rolls back TO it, which leaves the
 * transaction the SAVEPOINT opened in place, so the connection would keep its lock and every later count
 * would pile into an uncommitted transaction. A plain ROLLBACK after the error ends it.
 */
class SQLiteRateCounter extends RateLimiterSQLite {
  _upsert(...args: unknown[]): Promise<unknown> {
    const connection = (this as unknown as { client: sqlite3.Database }).client;
    // Counts of several limiters share the connection. Each upsert is SAVEPOINT, write, RELEASE: two at once
    // would nest one in the other's transaction (the inner RELEASE then commits nothing, and a failure could
    // leave the outer one open, holding the write lock). So they take turns.
    const turn = (upsertTurns.get(connection) ?? Promise.resolve()).then(() => this.upsertOnce(connection, args));
    upsertTurns.set(
      connection,
      turn.then(
        () => undefined,
        () => undefined,
      ),
    );
    return turn;
  }

  private async upsertOnce(connection: sqlite3.Database, args: unknown[]): Promise<unknown> {
    const upsert = RateLimiterSQLite.prototype as unknown as { _upsert(...a: unknown[]): Promise<unknown> };
    try {
      return await upsert._upsert.apply(this, args);
    } catch (err) {
      // No transaction open (the SAVEPOINT itself failed): SQLite answers an error, which changes nothing.
      await new Promise<void>((resolve) => connection.run('ROLLBACK', () => resolve()));
      throw err;
    }
  }
}

/** The last upsert queued on each counter connection (see SQLiteRateCounter). */
const upsertTurns = new WeakMap<sqlite3.Database, Promise<void>>();

/** rate-limiter-flexible's SQLite store on the database file (table rate_limits). */
function rateCounter(sequelize: Sequelize, options: RateCounterOptions): RateLimiterStoreAbstract {
  return new SQLiteRateCounter({
    ...rateCounterOptions(options),
    storeClient: counterConnection(sequelize),
    storeType: 'sqlite3',
  });
}

export const sqliteDialect: DatabaseDialect = {
  name: 'sqlite',
  open,
  caseInsensitiveContains,
  withExclusiveLock,
  withoutForeignKeyChecks,
  backup,
  restore,
  rateCounter,
  selectRows,
};
