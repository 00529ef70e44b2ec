import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { CookieOptions, Request, RequestHandler, Response } from 'express';
import { csrfSync } from 'csrf-sync';
import type { ServerConfig } from '../config';

/**
 * CSRF protection for every POST, PUT, PATCH and DELETE (uploads included): the request must carry a token in
 * the X-CSRF-Token header, fetched from GET /api/auth/csrf.
 *
 * - Signed in: a synchronizer token kept in the session (csrf-sync).
 * - Signed out: a signed double-submit cookie, so that a visitor costs no session row. The browser holds a
 *   random value in an HttpOnly cookie; the token is its HMAC under the session secret. A page on another site
 *   can neither read the token nor make one for a value it cannot see.
 */
const SYNCED = csrfSync({
  getTokenFromRequest: (req) => tokenInHeader(req),
  errorConfig: { statusCode: 403, message: 'missing or invalid CSRF token', code: 'EBADCSRFTOKEN' },
});

/** The cookie that holds a signed-out browser's random value. */
export const CSRF_COOKIE = 'arcwright.csrf';
const NONCE_BYTES = 32;
const NONCE_PATTERN = /^[A-Za-z0-9_-]{43}$/;
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

function tokenInHeader(req: Request): string | undefined {
  const header = req.headers['x-csrf-token'];
  return typeof header === 'string' ? header : undefined;
}

/** The value of cookie `name` in the request, when well formed. */
function cookieValue(req: Request, name: string): string | undefined {
  for (const part of (req.headers.cookie ?? '').split(';')) {
    const eq = part.indexOf('=');
    if (eq > 0 && part.slice(0, eq).trim() === name) return part.slice(eq + 1).trim();
  }
  return undefined;
}

const signedIn = (req: Request) => Boolean(req.user);

export interface Csrf {
  /** The token for this browser's next writes; sets the signed-out cookie when it is missing. */
  token(req: Request, res: Response): string;
  /** Refuses a state-changing request without the right token (403). */
  protection: RequestHandler;
}

export function csrfProtection(config: ServerConfig): Csrf {
  const sign = (nonce: string) =>
    createHmac('sha256', config.sessionSecret).update(`arcwright signed-out csrf:${nonce}`).digest('base64url');
  // Secure like the session cookie: always with COOKIE_SECURE, else behind a proxy when the request came over HTTPS.
  const cookieOptions = (req: Request): CookieOptions => ({
    httpOnly: true,
    sameSite: 'lax',
    secure: config.cookieSecure || (Boolean(config.trustProxy) && req.secure),
    path: '/',
  });

  function signedOutToken(req: Request, res: Response): string {
    let nonce = cookieValue(req, CSRF_COOKIE);
    if (!nonce || !NONCE_PATTERN.test(nonce)) {
      nonce = randomBytes(NONCE_BYTES).toString('base64url');
      res.cookie(CSRF_COOKIE, nonce, cookieOptions(req));
    }
    return sign(nonce);
  }

  function signedOutValid(req: Request): boolean {
    const nonce = cookieValue(req, CSRF_COOKIE);
    const given = tokenInHeader(req);
    if (!nonce || !NONCE_PATTERN.test(nonce) || !given) return false;
    const expected = Buffer.from(sign(nonce));
    const actual = Buffer.from(given);
    return actual.length === expected.length && timingSafeEqual(actual, expected);
  }

  return {
    token: (req, res) => (signedIn(req) ? SYNCED.generateToken(req) : signedOutToken(req, res)),
    protection: (req, res, next) => {
      if (SAFE_METHODS.has(req.method)) return next();
      if (signedIn(req)) return SYNCED.csrfSynchronisedProtection(req, res, next);
      return signedOutValid(req) ? next() : next(SYNCED.invalidCsrfTokenError);
    },
  };
}
