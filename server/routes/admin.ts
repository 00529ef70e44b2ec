import { Router } from 'express';
import { currentUser, requireRole } from '../middleware/require-user';
import { idParam } from '../middleware/params';
import { parseOr400 } from '../middleware/validate';
import { adminUserPatch } from '../../shared/schema/accounts';
import * as admin from '../services/admin';

/** /api/admin: accounts and the mail log, for admins only (403 for everyone else). */
export function adminRoutes(): Router {
  const router = Router();
  router.use(requireRole('admin'));

  router.get('/users', async (_req, res) => {
    res.json(await admin.listUsers());
  });

  router.patch('/users/:id', async (req, res) => {
    const patch = parseOr400(adminUserPatch, req.body);
    res.json(await admin.updateUser(currentUser(req).id, idParam(req, 'id'), patch));
  });

  router.get('/outbox', async (_req, res) => {
    res.json(await admin.listOutbox());
  });

  return router;
}
