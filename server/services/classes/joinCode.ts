import { randomBytes } from 'node:crypto';

/** Letters and digits a student can read out and type without confusing them (no 0/O, 1/I/L). */
const CODE_ALPHABET = 'ABCDEFGHJKMNPQRSTUVWXYZ23456789';
/** Characters of a join code: 31^8 ≈ 8.5·10^11 codes, too many to guess one. */
const CODE_LENGTH = 8;

/** A new random join code, e.g. "K7QX2MRT". */
export function newJoinCode(): string {
  // 256 is not a multiple of 31; the slight bias toward the first letters does not matter for a code this long.
  return [...randomBytes(CODE_LENGTH)].map((b) => CODE_ALPHABET[b % CODE_ALPHABET.length]).join('');
}

/** A join code as typed ("k7qx-2mrt ") in the stored form ("K7QX2MRT"). */
export function normalJoinCode(typed: string): string {
  return typed.toUpperCase().replace(/[^A-Z0-9]/g, '');
}
