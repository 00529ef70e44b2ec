import type { Request } from 'express';
import { notFound } from './http-error';

/**
 * A positive whole-number route parameter. Anything else cannot name a record, so it is a
 * 404 like any other missing record (not a 400 that would tell ids apart).
 */
export function idParam(req: Request, name: string): number {
  const raw = req.params[name];
  if (typeof raw !== 'string' || !/^[1-9][0-9]{0,15}$/.test(raw)) throw notFound();
  const n = Number(raw);
  if (!Number.isSafeInteger(n)) throw notFound();
  return n;
}
