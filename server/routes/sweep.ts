import { Router } from 'express';
import { rateLimit, ipKeyGenerator } from 'express-rate-limit';
import { isSketchValidationError, runSweep } from '../../shared/kinematics';
import { badRequest } from '../middleware/http-error';

/** Sweeps per address per minute: each one is up to a second or so of CPU on the one event loop. */
const SWEEPS_PER_MINUTE = 120;

/** POST /api/sweep: the body is a sketch file; the answer is the sweep result, as the command line prints it. */
export function sweepRoutes(): Router {
  const router = Router();
  const limiter = rateLimit({
    windowMs: 60_000,
    limit: SWEEPS_PER_MINUTE,
    keyGenerator: (req) => ipKeyGenerator(req.ip ?? 'unknown'),
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, res) => { res.status(429).json({ error: 'too many sweeps from this address; wait a minute' }); },
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
