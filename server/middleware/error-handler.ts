import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import { HttpError } from './http-error';
import { SHUTTING_DOWN_ERROR, shuttingDown } from '../shutdown';
import { zodProblems } from './validate';
import { JSON_BODY_MAX_BYTES, UPLOAD_MAX_BYTES, byteSizeText } from '../../shared/schema/requestLimits';

interface FrameworkError {
  status?: number;
  statusCode?: number;
  type?: string;
  code?: string;
  name?: string;
  message?: string;
}

/** Maps whatever reached the handler onto a status and a message the caller may see. */
function describe(err: unknown): { status: number; error: string; details?: unknown } {
  if (err instanceof HttpError) return { status: err.status, error: err.message, details: err.details };
  if (err instanceof ZodError) return { status: 400, error: 'invalid request', details: zodProblems(err) };
  const e = (err ?? {}) as FrameworkError;
  // body-parser
  if (e.type === 'entity.too.large')
    return { status: 413, error: `request body is larger than ${byteSizeText(JSON_BODY_MAX_BYTES)}` };
  if (e.type === 'entity.parse.failed') return { status: 400, error: 'request body is not valid JSON' };
  if (e.type === 'encoding.unsupported' || e.type === 'charset.unsupported') {
    return { status: 415, error: 'unsupported request encoding' };
  }
  // csrf-sync
  if (e.code === 'EBADCSRFTOKEN') return { status: 403, error: 'missing or invalid CSRF token' };
  // multer
  if (e.name === 'MulterError') {
    if (e.code === 'LIMIT_FILE_SIZE')
      return { status: 413, error: `file is larger than ${byteSizeText(UPLOAD_MAX_BYTES)}` };
    return { status: 400, error: `upload refused: ${e.message ?? 'bad form'}` };
  }
  if (e.name === 'SequelizeUniqueConstraintError') return { status: 409, error: 'that record already exists' };
  const status = e.status ?? e.statusCode;
  if (typeof status === 'number' && status >= 400 && status < 500) {
    return { status, error: e.message || 'bad request' };
  }
  return { status: 500, error: 'internal error' };
}

/** The one error handler: answers `{ error, details? }`, never a stack trace; logs server faults. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  const { status, error, details } = describe(err);
  // A request still running when the shutdown closed the database (past the grace period) failed for that reason:
  // the caller is told to retry, and the log says so in one line.
  if (status >= 500 && shuttingDown(res)) {
    console.warn(`[arcwright] ${req.method} ${req.originalUrl} cut short by the shutdown: ${String(err)}`);
    if (!res.headersSent) res.status(503).set('Connection', 'close').json({ error: SHUTTING_DOWN_ERROR });
    return;
  }
  if (status >= 500) console.error(`[arcwright] ${req.method} ${req.originalUrl} failed:`, err);
  if (res.headersSent) return;
  res.status(status).json(details === undefined ? { error } : { error, details });
};

/** JSON 404 for any /api path no route answered. */
export const apiNotFound: RequestHandler = (req, res) => {
  res.status(404).json({ error: `no such API route: ${req.method} ${req.path}` });
};
