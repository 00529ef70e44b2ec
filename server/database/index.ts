import type { Sequelize, WhereOptions } from 'sequelize';
import type { RateLimiterStoreAbstract } from 'rate-limiter-flexible';
import type { RateCounterOptions } from './rate-counters';
import type { DatabaseDialect, DatabaseLocation } from './dialect';
import { postgresDialect } from './postgres';
import { sqliteDialect } from './sqlite';

export type { DatabaseDialect, DatabaseLocation, SqlValue } from './dialect';
export { clearEndedRateCounts, type RateCounterOptions } from './rate-counters';
export { ownLiveSketch, sessionWithAccount, type LiveSketchRecord, type SessionAccountRecord } from './hot-reads';

/** The dialect for a location: PostgreSQL when it has a URL, else the SQLite file. */
export function dialectFor(location: DatabaseLocation): DatabaseDialect {
  return location.databaseUrl ? postgresDialect : sqliteDialect;
}

/** The dialect of an open database. */
export function dialectOf(sequelize: Sequelize): DatabaseDialect {
  return sequelize.getDialect() === 'postgres' ? postgresDialect : sqliteDialect;
}

/** Opens the database the location names and binds the models to it. Run migrations next. */
export function openDatabase(location: DatabaseLocation): Promise<Sequelize> {
  return dialectFor(location).open(location);
}

/** See DatabaseDialect.caseInsensitiveContains; `column` is qualified as `Model.attribute`. */
export function caseInsensitiveContains(sequelize: Sequelize, column: string, text: string): WhereOptions {
  return dialectOf(sequelize).caseInsensitiveContains(column, text);
}

/** See DatabaseDialect.withExclusiveLock. */
export function withExclusiveLock<T>(sequelize: Sequelize, name: string, work: () => Promise<T>): Promise<T> {
  return dialectOf(sequelize).withExclusiveLock(sequelize, name, work);
}

/** See DatabaseDialect.withoutForeignKeyChecks. */
export function withoutForeignKeyChecks<T>(sequelize: Sequelize, work: () => Promise<T>): Promise<T> {
  return dialectOf(sequelize).withoutForeignKeyChecks(sequelize, work);
}

/** See DatabaseDialect.rateCounter. */
export function databaseRateCounter(sequelize: Sequelize, options: RateCounterOptions): RateLimiterStoreAbstract {
  return dialectOf(sequelize).rateCounter(sequelize, options);
}

/** Where a location is, for logs: the SQLite file, or the PostgreSQL URL without its password. */
export function describeLocation(location: DatabaseLocation): string {
  if (!location.databaseUrl) return location.databasePath;
  const u = new URL(location.databaseUrl);
  if (u.password) u.password = '***';
  return u.toString();
}
