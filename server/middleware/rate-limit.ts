import { ipKeyGenerator, rateLimit, type Options } from 'express-rate-limit';
import type { Request, RequestHandler } from 'express';
import type { ServerConfig } from '../config';

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

/** Failed sign-ins per account and per address; successful ones do not count. */
export function loginLimiters(config: ServerConfig): RequestHandler[] {
  const common = {
    windowMs: config.loginWindowMs,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8' as const,
    legacyHeaders: false,
    handler: tooMany('too many sign-in attempts'),
  };
  return [
    rateLimit({ ...common, limit: config.loginMaxPerAddress, keyGenerator: addressKey }),
    rateLimit({ ...common, limit: config.loginMaxPerAccount, keyGenerator: emailKey }),
  ];
}

/** Sign-ups and reset e-mails per address (and reset e-mails per account), to stop mail floods. */
export function signupLimiter(config: ServerConfig): RequestHandler {
  return rateLimit({
    windowMs: HOUR_MS, limit: config.signupMaxPerAddress, keyGenerator: addressKey,
    standardHeaders: 'draft-8', legacyHeaders: false, handler: tooMany('too many requests from this address'),
  });
}

export function resetRequestLimiters(config: ServerConfig): RequestHandler[] {
  const common = { windowMs: HOUR_MS, standardHeaders: 'draft-8' as const, legacyHeaders: false };
  return [
    rateLimit({ ...common, limit: config.signupMaxPerAddress, keyGenerator: addressKey, handler: tooMany('too many reset requests') }),
    rateLimit({ ...common, limit: 5, keyGenerator: emailKey, handler: tooMany('too many reset requests for this account') }),
  ];
}
