import { createCipheriv, createDecipheriv, hkdfSync, randomBytes } from 'node:crypto';
import type { ServerConfig } from '../config';
import { User, type PublicUser } from '../models';
import { HttpError, badRequest } from '../middleware/http-error';
import type { Mailer } from './mail/mailer';
import { signupAttemptMail, signupConfirmMail } from './mail/messages';
import { createAccount } from './accounts';
import { hashPassword } from './passwords';
import { refuseWeakPassword } from './password-strength';

/**
 * Sign-up in two steps, so that the answer never tells whether an address has an account:
 *
 * 1. POST /api/auth/signup answers the same 202 for every well-formed request, after hashing the password
 *    either way (so it takes as long). A new address is mailed a link that creates the account; an address
 *    that has one is mailed a note instead ("someone tried to sign up with your address").
 * 2. The link's token holds the pending account (address, name, password hash, expiry) sealed with AES-256-GCM
 *    under a key derived from the session secret: nothing is stored before the link is followed, and the token
 *    cannot be read or altered without the secret. Following it creates the account; the person then signs in.
 *
 * Only the mailbox's holder learns which mail was sent, and nobody is signed in by sign-up itself (a sign-in
 * there would give away that the address was new).
 */

/** A sign-up link works this long (hours). */
export const SIGNUP_VALID_HOURS = 24;

const IV_BYTES = 12;
const TAG_BYTES = 16;

interface PendingAccount {
  email: string;
  name: string;
  passwordHash: string;
  /** When the link stops working (ms since epoch). */
  expiresAt: number;
}

function sealKey(config: ServerConfig): Buffer {
  return Buffer.from(hkdfSync('sha256', config.sessionSecret, 'arcwright', 'sign-up confirmation token', 32));
}

function seal(pending: PendingAccount, config: ServerConfig): string {
  const iv = randomBytes(IV_BYTES);
  const cipher = createCipheriv('aes-256-gcm', sealKey(config), iv);
  const body = Buffer.concat([cipher.update(JSON.stringify(pending), 'utf8'), cipher.final()]);
  return Buffer.concat([iv, cipher.getAuthTag(), body]).toString('base64url');
}

/** The pending account in `token`, or null when the token was not sealed with this server's secret. */
function unseal(token: string, config: ServerConfig): PendingAccount | null {
  const raw = Buffer.from(token, 'base64url');
  if (raw.length <= IV_BYTES + TAG_BYTES) return null;
  try {
    const decipher = createDecipheriv('aes-256-gcm', sealKey(config), raw.subarray(0, IV_BYTES));
    decipher.setAuthTag(raw.subarray(IV_BYTES, IV_BYTES + TAG_BYTES));
    const text = Buffer.concat([decipher.update(raw.subarray(IV_BYTES + TAG_BYTES)), decipher.final()]);
    const p = JSON.parse(text.toString('utf8')) as PendingAccount;
    const ok =
      typeof p.email === 'string' &&
      typeof p.name === 'string' &&
      typeof p.passwordHash === 'string' &&
      Number.isFinite(p.expiresAt);
    return ok ? p : null;
  } catch {
    return null;
  }
}

/** Step 1: mails the link (new address) or the note (address with an account). Same work and answer for both. */
export async function requestSignup(
  input: { email: string; password: string; name: string },
  config: ServerConfig,
  mailer: Mailer,
): Promise<void> {
  await refuseWeakPassword(input.password, input.email, input.name);
  const [existing, passwordHash] = await Promise.all([
    User.findOne({ where: { email: input.email } }),
    hashPassword(input.password),
  ]);
  if (existing) {
    mailer.queue(signupAttemptMail(config, existing));
    return;
  }
  const expiresAt = Date.now() + SIGNUP_VALID_HOURS * 3600_000;
  const token = seal({ email: input.email, name: input.name, passwordHash, expiresAt }, config);
  mailer.queue(signupConfirmMail(config, input, token, SIGNUP_VALID_HOURS));
}

/** Step 2: creates the account the link describes. 400 for a bad or expired link, or an address taken since. */
export async function confirmSignup(token: string, config: ServerConfig): Promise<PublicUser> {
  const pending = unseal(token, config);
  if (!pending || pending.expiresAt < Date.now()) {
    throw badRequest('this sign-up link is not valid: it may have expired or been cut short; sign up again');
  }
  try {
    return await createAccount(pending);
  } catch (err) {
    // Followed twice, or two clicks at once (the unique index lets one through).
    const conflict = err instanceof HttpError && err.status === 409;
    if (conflict || (err as { name?: string }).name === 'SequelizeUniqueConstraintError') {
      throw badRequest(
        'this address already has an account: sign in, or ask for a new password if you have forgotten it',
      );
    }
    throw err;
  }
}
