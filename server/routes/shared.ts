import { Router } from 'express';
import { requireUser, currentUser } from '../middleware/require-user';
import { notFound } from '../middleware/http-error';
import * as sketches from '../services/sketches';
import type { ServerConfig } from '../config';
import { exportRoutes } from './exports';
import { parseOr400 } from '../middleware/validate';
import { buildSheetQuery } from '../../shared/schema/sketchRequests';
import { sendBuildSheet } from './buildSheet';

const TOKEN_PATTERN = /^[A-Za-z0-9_-]{16,64}$/;

function tokenParam(raw: unknown): string {
  if (typeof raw !== 'string' || !TOKEN_PATTERN.test(raw)) throw notFound('this link is not shared (any more)');
  return raw;
}

/** /api/shared/:token: a sketch opened by its read-only link, for guests too. */
export function sharedRoutes(config: ServerConfig): Router {
  const router = Router();

  router.get('/:token', async (req, res) => {
    res.json(await sketches.getShared(req.user ?? null, tokenParam(req.params.token)));
  });

  router.use(
    '/:token',
    exportRoutes(config, (req) => sketches.sharedDocument(tokenParam(req.params.token))),
  );

  router.get('/:token/build-sheet', async (req, res) => {
    const token = tokenParam(req.params.token);
    const query = parseOr400(buildSheetQuery, req.query, 'invalid query');
    await sendBuildSheet(res, await sketches.sharedSheetSource(token), query);
  });

  router.post('/:token/copy', requireUser, async (req, res) => {
    res.status(201).json(await sketches.copyShared(currentUser(req), tokenParam(req.params.token)));
  });

  return router;
}
