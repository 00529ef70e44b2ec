import { ipKeyGenerator, rateLimit, type Options } from 'express-rate-limit';
import type { Request, RequestHandler } from 'express';
import type { ServerConfig } from '../config';
import { DatabaseRateStore } from './rate-limit-store';

const HOUR_MS = 60 * 60_000;

function tooMany(message: string): Options['handler'] {
  return (_req, res, _next, options) => {
    const minutes = Math.ceil(options.windowMs / 60_000);
    res.status(429).json({ error: `${message}; try again within ${minutes} minutes` });
  };
}

const addressKey = (req: Request) => ipKeyGenerator(req.ip ?? 'unknown');

function emailKey(req: Request): string {
  const email = (req.body as { email?: unknown } | undefined)?.email;
  return typeof email === 'string' ? email.trim().toLowerCase() : '(none)';
}

/*
 * Every limiter counts in the database (DatabaseRateStore), under its own name, so that the app instances on
 * one database share their counts and a restart forgets none.
 */

/**
 * Failed sign-ins per address, then per account; successful ones do not count. Mount the
 * account limiter after body validation, so that it keys on a real e-mail.
 */
export function loginLimiters(config: ServerConfig): { perAddress: RequestHandler; perAccount: RequestHandler } {
  const common = {
    windowMs: config.loginWindowMs,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8' as const,
    legacyHeaders: false,
    handler: tooMany('too many sign-in attempts'),
  };
  return {
    perAddress: rateLimit({
      ...common,
      limit: config.loginMaxPerAddress,
      keyGenerator: addressKey,
      store: new DatabaseRateStore('login-address'),
    }),
    perAccount: rateLimit({
      ...common,
      limit: config.loginMaxPerAccount,
      keyGenerator: emailKey,
      store: new DatabaseRateStore('login-account'),
    }),
  };
}

/** Sign-up mails to one e-mail address per hour, whether it has an account or not. */
const SIGNUPS_PER_EMAIL = 5;

/**
 * Sign-ups per address (to stop mail floods), and per e-mail address they mail. Mount the e-mail limiter after
 * body validation, so that it keys on the real address.
 */
export function signupLimiters(config: ServerConfig): { perAddress: RequestHandler; perAccount: RequestHandler } {
  const common = { windowMs: HOUR_MS, standardHeaders: 'draft-8' as const, legacyHeaders: false };
  return {
    perAddress: rateLimit({
      ...common,
      limit: config.signupMaxPerAddress,
      keyGenerator: addressKey,
      store: new DatabaseRateStore('signup'),
      handler: tooMany('too many requests from this address'),
    }),
    perAccount: rateLimit({
      ...common,
      limit: SIGNUPS_PER_EMAIL,
      keyGenerator: emailKey,
      store: new DatabaseRateStore('signup-email'),
      handler: tooMany('too many sign-ups with this e-mail address'),
    }),
  };
}

/** Reset mails per account per hour. */
const RESETS_PER_ACCOUNT = 5;

export function resetRequestLimiters(config: ServerConfig): { perAddress: RequestHandler; perAccount: RequestHandler } {
  const common = { windowMs: HOUR_MS, standardHeaders: 'draft-8' as const, legacyHeaders: false };
  return {
    perAddress: rateLimit({
      ...common,
      limit: config.signupMaxPerAddress,
      keyGenerator: addressKey,
      store: new DatabaseRateStore('reset-address'),
      handler: tooMany('too many reset requests'),
    }),
    perAccount: rateLimit({
      ...common,
      limit: RESETS_PER_ACCOUNT,
      keyGenerator: emailKey,
      store: new DatabaseRateStore('reset-account'),
      handler: tooMany('too many reset requests for this account'),
    }),
  };
}

/**
 * Sweeps per address per minute (POST /api/sweep, the sweep CSV): each is CPU on the one event loop (tens
 * of ms for a typical sketch), so they are capped. `name` keeps the counts of each route apart.
 */
export function sweepLimiter(config: ServerConfig, name: 'sweep' | 'sweep-csv'): RequestHandler {
  return rateLimit({
    windowMs: 60_000,
    limit: config.sweepMaxPerMinute,
    keyGenerator: addressKey,
    store: new DatabaseRateStore(name),
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, res) => {
      res.status(429).json({ error: 'too many sweeps from this address; wait a minute' });
    },
  });
}

/**
 * Share links mailed per account per hour, and per recipient per hour from all accounts together (POST
 * /api/sketches/:id/share with an `email`), so that neither one account nor many can flood an address.
 * Requests without an address and refused ones (400, 404, 429) do not count. Mount after `requireUser`.
 */
export function shareMailLimiters(config: ServerConfig): { perAccount: RequestHandler; perRecipient: RequestHandler } {
  const common = {
    windowMs: HOUR_MS,
    skip: (req: Request) => (req.body as { email?: unknown } | undefined)?.email === undefined,
    skipFailedRequests: true,
    standardHeaders: 'draft-8' as const,
    legacyHeaders: false,
  };
  return {
    perAccount: rateLimit({
      ...common,
      limit: config.shareMailMaxPerHour,
      keyGenerator: (req) => `user:${req.user?.id ?? 'none'}`,
      store: new DatabaseRateStore('share-mail'),
      handler: tooMany('too many share mails from this account'),
    }),
    perRecipient: rateLimit({
      ...common,
      limit: config.shareMailMaxPerRecipient,
      keyGenerator: (req) => `recipient:${emailKey(req)}`,
      store: new DatabaseRateStore('share-mail-recipient'),
      handler: tooMany('too many share mails to this address'),
    }),
  };
}

/** Upload requests per account per hour (POST /api/sketches/:id/uploads), refused ones too. Mount after `requireUser`. */
export function uploadLimiter(config: ServerConfig): RequestHandler {
  return rateLimit({
    windowMs: HOUR_MS,
    limit: config.uploadMaxPerHour,
    keyGenerator: (req) => `user:${req.user?.id ?? 'none'}`,
    store: new DatabaseRateStore('upload'),
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: tooMany('too many uploads from this account'),
  });
}
