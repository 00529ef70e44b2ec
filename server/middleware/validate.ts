import type { RequestHandler } from 'express';
import type { ZodError, ZodType } from 'zod';
import { badRequest } from './http-error';
import { formatPath } from '../../shared/schema/errors';

/** One line per problem, naming the path: "email: Invalid email address", "items[2].id: ...". */
export function zodProblems(err: ZodError): string[] {
  return err.issues.map((issue) => `${formatPath(issue.path, '(body)')}: ${issue.message}`);
}

/** Parses `value` with `schema`, or throws 400 with the problems. */
export function parseOr400<T>(schema: ZodType<T>, value: unknown, message = 'invalid request'): T {
  const result = schema.safeParse(value);
  if (!result.success) throw badRequest(message, zodProblems(result.error));
  return result.data;
}

/** Middleware: replaces req.body with its parsed form, or answers 400 with the problems. */
export function validBody<T>(schema: ZodType<T>): RequestHandler {
  return (req, _res, next) => {
    req.body = parseOr400(schema, req.body);
    next();
  };
}
