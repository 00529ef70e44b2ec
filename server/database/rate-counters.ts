import type { Sequelize } from 'sequelize';

/** The table rate-limit counters live in (made by migration 0006-shared-state), as rate-limiter-flexible lays it out. */
export const RATE_LIMIT_TABLE = 'rate_limits';

/** What a rate limiter counts: `points` per `durationS` seconds, under keys starting with `keyPrefix`. */
export interface RateCounterOptions {
  keyPrefix: string;
  points: number;
  durationS: number;
}

/** The rate-limiter-flexible options every dialect's store shares. */
export function rateCounterOptions(options: RateCounterOptions) {
  return {
    keyPrefix: options.keyPrefix,
    points: options.points,
    duration: options.durationS,
    tableName: RATE_LIMIT_TABLE,
    // The migration made the table; rows whose window has ended are deleted by clearEndedRateCounts
    // (the housekeeping), not by a timer in each limiter.
    tableCreated: true,
    clearExpiredByTimeout: false,
  };
}

/** Deletes the counters whose window ended before `nowMs` (the column holds ms since epoch); plain SQL on either database. */
export async function clearEndedRateCounts(sequelize: Sequelize, nowMs: number): Promise<void> {
  await sequelize.query(`DELETE FROM ${RATE_LIMIT_TABLE} WHERE expire < :nowMs`, { replacements: { nowMs } });
}
