import type { Request, RequestHandler } from 'express';
import type { PublicUser, Role } from '../models';
import { forbidden, unauthorized } from './http-error';

/** 401 unless signed in. */
export const requireUser: RequestHandler = (req, _res, next) => {
  next(req.user ? undefined : unauthorized());
};

/** 401 unless signed in, 403 unless the user has one of `allowed`. */
export function requireRole(...allowed: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(unauthorized());
    next(allowed.includes(req.user.role) ? undefined : forbidden('this needs another role'));
  };
}

/** The signed-in user of a request that passed requireUser. */
export function currentUser(req: Request): PublicUser {
  if (!req.user) throw unauthorized();
  return req.user;
}
