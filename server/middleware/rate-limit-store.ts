import { createHash } from 'node:crypto';
import type { ClientRateLimitInfo, IncrementResponse, Options, Store } from 'express-rate-limit';
import type { RateLimiterStoreAbstract } from 'rate-limiter-flexible';
import { databaseRateCounter } from '../database';
import { boundDatabase } from '../models';

/** Longest key stored as it is (characters); the table's key column holds 255 with the limiter's name before it. */
const KEY_MAX = 160;

/**
 * A key as stored: as it is when short and of printable ASCII, else its SHA-256 (hex). Keys carry what a request
 * names (an e-mail address before it is validated: any length, any characters), and a key the column cannot hold
 * (too long, or a NUL, which PostgreSQL's text refuses) must count, not fail.
 */
export function storedKey(key: string): string {
  return key.length <= KEY_MAX && /^[\x20-\x7e]*$/.test(key)
    ? key
    : `sha256:${createHash('sha256').update(key).digest('hex')}`;
}

/**
 * express-rate-limit's counting done by rate-limiter-flexible in the database (table rate_limits), so the
 * limits hold across app instances and restarts. express-rate-limit keeps deciding what counts (skips,
 * successful or failed requests), the answers and the RateLimit/Retry-After headers.
 */
export class DatabaseRateStore implements Store {
  /** Counts are shared by every instance on the database. */
  readonly localKeys = false;
  readonly prefix: string;
  private counter: RateLimiterStoreAbstract | null = null;
  private windowS = 60;
  private points = 1;

  /** `name` tells this limiter's keys from every other's in the shared table. */
  constructor(name: string) {
    this.prefix = name;
  }

  /** Called as the app is built, when the models are bound to the app's database: the counter uses that one. */
  init(options: Options): void {
    this.windowS = Math.max(1, Math.ceil(options.windowMs / 1000));
    this.points = typeof options.limit === 'number' ? options.limit : 1;
    this.counter = databaseRateCounter(boundDatabase(), {
      keyPrefix: this.prefix,
      points: this.points,
      durationS: this.windowS,
    });
  }

  private get store(): RateLimiterStoreAbstract {
    if (!this.counter) throw new Error(`rate limiter ${this.prefix} used before express-rate-limit set it up`);
    return this.counter;
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const res = await this.store.get(storedKey(key));
    if (!res) return undefined;
    return { totalHits: res.consumedPoints, resetTime: new Date(Date.now() + res.msBeforeNext) };
  }

  async increment(key: string): Promise<IncrementResponse> {
    // penalty adds a point without refusing: express-rate-limit compares the total with its limit itself.
    const res = await this.store.penalty(storedKey(key), 1);
    return { totalHits: res.consumedPoints, resetTime: new Date(Date.now() + res.msBeforeNext) };
  }

  async decrement(key: string): Promise<void> {
    // Only within the window: a point given back after it ended would start the next window below zero.
    if (await this.store.get(storedKey(key))) await this.store.reward(storedKey(key), 1);
  }

  async resetKey(key: string): Promise<void> {
    await this.store.delete(storedKey(key));
  }
}
