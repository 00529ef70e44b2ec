import { Router } from 'express';
import { requireUser, currentUser } from '../middleware/require-user';
import * as invites from '../services/classes/invites';

const tokenOf = (raw: unknown) => (typeof raw === 'string' ? raw : '');

/** /api/invites/:token: what an invitation link is for (signed out too), and accepting it (signed in). */
export function inviteRoutes(): Router {
  const router = Router();

  router.get('/:token', async (req, res) => {
    res.json(await invites.previewInvite(tokenOf(req.params.token)));
  });

  router.post('/:token/accept', requireUser, async (req, res) => {
    res.json(await invites.acceptInvite(currentUser(req), tokenOf(req.params.token)));
  });

  return router;
}
