import { describe, expect, it, vi } from 'vitest';
import express from 'express';
import request from 'supertest';
import { z } from 'zod';
import { errorHandler } from '../../../server/middleware/error-handler';
import { HttpError } from '../../../server/middleware/http-error';

function appThrowing(err: unknown) {
  const app = express();
  app.get('/boom', () => {
    throw err;
  });
  app.use(errorHandler);
  return app;
}

describe('the error handler', () => {
  it('answers an unexpected error with 500 and a plain message, never the stack', async () => {
    const log = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    const res = await request(appThrowing(new Error('secret detail at /srv/app.ts:12'))).get('/boom');
    expect(res.status).toBe(500);
    expect(res.body).toEqual({ error: 'internal error' });
    expect(res.text).not.toContain('secret');
    expect(log).toHaveBeenCalled();
    log.mockRestore();
  });

  it('passes an HttpError through with its status, message and details', async () => {
    const res = await request(appThrowing(new HttpError(409, 'stale', { version: 3 }))).get('/boom');
    expect(res.status).toBe(409);
    expect(res.body).toEqual({ error: 'stale', details: { version: 3 } });
  });

  it('answers a zod error with 400 and one line per problem', async () => {
    const parsed = z.object({ n: z.number() }).safeParse({ n: 'x' });
    const res = await request(appThrowing(parsed.error)).get('/boom');
    expect(res.status).toBe(400);
    expect(res.body.details).toEqual([expect.stringMatching(/^n: /)]);
  });
});
