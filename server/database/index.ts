import type { Sequelize, WhereOptions } from 'sequelize';
import type { RateLimiterStoreAbstract } from 'rate-limiter-flexible';
import type { RateCounterOptions } from './rate-counters';
import type { DatabaseDialect, DatabaseLocation, SqlValue } from './dialect';
import { postgresDialect } from './postgres';
import { sqliteDialect } from './sqlite';

export type { DatabaseDialect, DatabaseLocation, SqlValue } from './dialect';
export { clearEndedRateCounts, type RateCounterOptions } from './rate-counters';

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

/** See DatabaseDialect.selectRows. */
export function selectRows<T extends object>(
  sequelize: Sequelize,
  sql: string,
  params: Record<string, SqlValue>,
): Promise<T[]> {
  return dialectOf(sequelize).selectRows<T>(sequelize, sql, params);
}

/** A date column of a `selectRows` row: SQLite gives the text Sequelize wrote, PostgreSQL a Date. */
export function dateOf(value: string | Date): Date {
  return value instanceof Date ? value : new Date(value);
}

/** A boolean column of a `selectRows` row: SQLite gives 0 or 1, PostgreSQL a boolean. */
export function flagOf(value: boolean | number | null): boolean {
  return Boolean(value);
}

/** Where a location is, for logs: the SQLite file, or the PostgreSQL URL without its password. */
export function describeLocation(location: DatabaseLocation): string {
  if (!location.databaseUrl) return location.databasePath;
  const u = new URL(location.databaseUrl);
  if (u.password) u.password = '***';
  return u.toString();
}
