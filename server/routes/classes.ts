import { Router } from 'express';
import type { ServerConfig } from '../config';
import { requireUser, currentUser } from '../middleware/require-user';
import { idParam } from '../middleware/params';
import { parseOr400 } from '../middleware/validate';
import {
  createAssignmentBody,
  createClassBody,
  inviteBody,
  joinBody,
  updateClassBody,
} from '../../shared/schema/classes';
import * as classes from '../services/classes/classes';
import * as invites from '../services/classes/invites';
import * as assignments from '../services/classes/assignments';
import type { Mailer } from '../services/mail/mailer';

/**
 * /api/classes: classes the caller teaches or belongs to. A class the caller may not see is 404 on every
 * route; a student asking for what only its instructor may do gets 403.
 */
export function classRoutes(config: ServerConfig, mailer: Mailer): Router {
  const router = Router();
  router.use(requireUser);

  router.get('/', async (req, res) => {
    res.json(await classes.listClasses(currentUser(req)));
  });

  router.post('/', async (req, res) => {
    const body = parseOr400(createClassBody, req.body);
    res.status(201).json(await classes.createClass(currentUser(req), body));
  });

  router.post('/join', async (req, res) => {
    const { joinCode } = parseOr400(joinBody, req.body);
    res.json(await invites.joinByCode(currentUser(req), joinCode));
  });

  router.get('/:id', async (req, res) => {
    res.json(await classes.getClass(currentUser(req), idParam(req, 'id')));
  });

  router.patch('/:id', async (req, res) => {
    const id = idParam(req, 'id');
    const body = parseOr400(updateClassBody, req.body);
    res.json(await classes.updateClass(currentUser(req), id, body));
  });

  router.delete('/:id', async (req, res) => {
    res.json(await classes.deleteClass(currentUser(req), idParam(req, 'id')));
  });

  router.post('/:id/restore', async (req, res) => {
    res.json(await classes.restoreClass(currentUser(req), idParam(req, 'id')));
  });

  router.delete('/:id/members/:userId', async (req, res) => {
    await classes.removeMember(currentUser(req), idParam(req, 'id'), idParam(req, 'userId'));
    res.status(204).end();
  });

  router.post('/:id/leave', async (req, res) => {
    await classes.leaveClass(currentUser(req), idParam(req, 'id'));
    res.status(204).end();
  });

  // Not the share-mail limiter: a class of 250 is invited in one request; invites.ts keeps its own hourly bound.
  router.post('/:id/invites', async (req, res) => {
    const id = idParam(req, 'id');
    const body = parseOr400(inviteBody, req.body);
    res.json(await invites.inviteStudents(currentUser(req), id, body, config, mailer));
  });

  router.post('/:id/invites/:inviteId/resend', async (req, res) => {
    const user = currentUser(req);
    res.json(await invites.resendInvite(user, idParam(req, 'id'), idParam(req, 'inviteId'), config, mailer));
  });

  router.delete('/:id/invites/:inviteId', async (req, res) => {
    await invites.withdrawInvite(currentUser(req), idParam(req, 'id'), idParam(req, 'inviteId'));
    res.status(204).end();
  });

  router.post('/:id/assignments', async (req, res) => {
    const id = idParam(req, 'id');
    const body = parseOr400(createAssignmentBody, req.body);
    res.status(201).json(await assignments.createAssignment(currentUser(req), id, body));
  });

  return router;
}
