import { Router } from 'express';
import type { ServerConfig } from '../config';
import { requireUser, currentUser } from '../middleware/require-user';
import { idParam } from '../middleware/params';
import { parseOr400 } from '../middleware/validate';
import { sweepLimiter } from '../middleware/rate-limit';
import { feedbackBody, updateAssignmentBody } from '../../shared/schema/classes';
import * as assignments from '../services/classes/assignments';
import type { Mailer } from '../services/mail/mailer';

/** /api/assignments and /api/hand-ins: only the class's instructor and its students see them (others: 404). */
export function assignmentRoutes(config: ServerConfig, mailer: Mailer): Router {
  const router = Router();
  router.use(['/assignments', '/hand-ins'], requireUser);

  router.get('/assignments/:id', async (req, res) => {
    res.json(await assignments.getAssignment(currentUser(req), idParam(req, 'id')));
  });

  router.patch('/assignments/:id', async (req, res) => {
    const id = idParam(req, 'id');
    const body = parseOr400(updateAssignmentBody, req.body);
    res.json(await assignments.updateAssignment(currentUser(req), id, body));
  });

  router.post('/assignments/:id/copy', async (req, res) => {
    const { copy, created } = await assignments.copyAssignment(currentUser(req), idParam(req, 'id'));
    res.status(created ? 201 : 200).json(copy);
  });

  // Each hand-in sweeps the sketch on the one event loop, so hand-ins count as sweeps, in the sweep's own count.
  router.post('/assignments/:id/hand-ins', sweepLimiter(config, 'sweep'), async (req, res) => {
    res.status(201).json(await assignments.handIn(currentUser(req), idParam(req, 'id')));
  });

  router.get('/hand-ins/:id', async (req, res) => {
    res.json(await assignments.getHandIn(currentUser(req), idParam(req, 'id')));
  });

  router.post('/hand-ins/:id/feedback', async (req, res) => {
    const id = idParam(req, 'id');
    const { text } = parseOr400(feedbackBody, req.body);
    res.json(await assignments.writeFeedback(currentUser(req), id, text, config, mailer));
  });

  return router;
}
