import { randomBytes, scrypt, timingSafeEqual, type ScryptOptions } from 'node:crypto';

/**
 * scrypt cost: N = 2^15, r = 8, p = 1 uses 32 MiB and about 50–100 ms per hash on this class of
 * machine (OWASP password storage cheat sheet lists N=2^17 as the strong end; 2^15 keeps the
 * sign-in route usable on 2 cores). The parameters travel with each hash so they can be raised later.
 */
const COST = { N: 2 ** 15, r: 8, p: 1 } as const;
const KEY_BYTES = 32;
const SALT_BYTES = 16;
/** scrypt needs 128·N·r bytes; Node's default cap (32 MiB) is exactly at the edge. */
const MAX_MEM_BYTES = 64 * 1024 * 1024;

function derive(password: string, salt: Buffer, opts: ScryptOptions, bytes: number): Promise<Buffer> {
  return new Promise((resolve, reject) =>
    scrypt(password.normalize('NFKC'), salt, bytes, { ...opts, maxmem: MAX_MEM_BYTES }, (err, key) =>
      err ? reject(err) : resolve(key),
    ),
  );
}

/** Hashes a password as `scrypt$N$r$p$salt$key` (base64url parts). */
export async function hashPassword(password: string): Promise<string> {
  const salt = randomBytes(SALT_BYTES);
  const key = await derive(password, salt, COST, KEY_BYTES);
  return ['scrypt', COST.N, COST.r, COST.p, salt.toString('base64url'), key.toString('base64url')].join('$');
}

/** True when `password` matches `stored`. A malformed stored value never matches. */
export async function verifyPassword(password: string, stored: string): Promise<boolean> {
  const parts = stored.split('$');
  if (parts.length !== 6 || parts[0] !== 'scrypt') return false;
  const [N, r, p] = parts.slice(1, 4).map(Number);
  const salt = Buffer.from(parts[4], 'base64url');
  const expected = Buffer.from(parts[5], 'base64url');
  if (!N || !r || !p || expected.length === 0) return false;
  const key = await derive(password, salt, { N, r, p }, expected.length);
  return timingSafeEqual(key, expected);
}

/** A hash of a random password, verified against when the e-mail is unknown, so timing does not tell. */
let decoy: Promise<string> | null = null;
export function decoyHash(): Promise<string> {
  decoy ??= hashPassword(randomBytes(12).toString('base64url'));
  return decoy;
}
