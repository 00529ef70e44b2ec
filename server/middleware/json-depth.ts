import type { RequestHandler } from 'express';
import { badRequest } from './http-error';
import { JSON_MAX_DEPTH } from '../../shared/schema/requestLimits';

/** True when `value` has arrays or objects nested more than `limit` levels deep. Walks without recursion. */
export function nestedDeeperThan(value: unknown, limit: number): boolean {
  const stack: [unknown, number][] = [[value, 1]];
  while (stack.length) {
    const [v, depth] = stack.pop()!;
    if (v === null || typeof v !== 'object') continue;
    if (depth > limit) return true;
    for (const child of Object.values(v)) {
      if (child !== null && typeof child === 'object') stack.push([child, depth + 1]);
    }
  }
  return false;
}

/**
 * Refuses a parsed JSON body nested deeper than any request of the API uses (400), so that no validator or
 * serialiser further on can run out of stack on it. Mount right after the JSON body parser.
 */
export const jsonDepthLimit: RequestHandler = (req, _res, next) => {
  if (nestedDeeperThan(req.body, JSON_MAX_DEPTH)) {
    return next(badRequest(`request body is nested more than ${JSON_MAX_DEPTH} levels deep; no request needs that`));
  }
  next();
};
