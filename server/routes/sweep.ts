import { Router } from 'express';
import { runSweep } from '../../shared/kinematics';
import { isSketchValidationError } from '../../shared/schema/errors';
import type { ServerConfig } from '../config';
import { badRequest } from '../middleware/http-error';
import { sweepLimiter } from '../middleware/rate-limit';

/** POST /api/sweep: the body is a sketch file; the answer is the sweep result, as the command line prints it. */
export function sweepRoutes(config: ServerConfig): Router {
  const router = Router();
  const limiter = sweepLimiter(config, 'sweep');

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
