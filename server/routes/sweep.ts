import { Router } from 'express';
import { rateLimit, ipKeyGenerator } from 'express-rate-limit';
import { runSweep } from '../../shared/kinematics';
import { isSketchValidationError } from '../../shared/schema/errors';
import type { ServerConfig } from '../config';
import { badRequest } from '../middleware/http-error';

/** POST /api/sweep: the body is a sketch file; the answer is the sweep result, as the command line prints it. */
export function sweepRoutes(config: ServerConfig): Router {
  const router = Router();
  const limiter = rateLimit({
    windowMs: 60_000,
    // Each sweep is CPU on the one event loop (tens of ms for a typical sketch), so cap them.
    limit: config.sweepMaxPerMinute,
    keyGenerator: (req) => ipKeyGenerator(req.ip ?? 'unknown'),
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, res) => {
      res.status(429).json({ error: 'too many sweeps from this address; wait a minute' });
    },
  });

  router.post('/sweep', limiter, (req, res) => {
    try {
      res.json(runSweep(req.body));
    } catch (err) {
      if (isSketchValidationError(err)) throw badRequest('not a valid sketch', err.problems);
      throw err;
    }
  });

  return router;
}
