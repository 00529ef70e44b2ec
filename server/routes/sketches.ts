import { Router } from 'express';
import type { ServerConfig } from '../config';
import { requireUser, currentUser } from '../middleware/require-user';
import { idParam } from '../middleware/params';
import { parseOr400 } from '../middleware/validate';
import { shareMailLimiters } from '../middleware/rate-limit';
import {
  buildSheetQuery,
  createSketchBody,
  listQuery,
  shareBody,
  updateSketchBody,
} from '../../shared/schema/sketchRequests';
import * as sketches from '../services/sketches';
import type { Mailer } from '../services/mail/mailer';
import { shareNoticeMail } from '../services/mail/messages';
import { exportRoutes } from './exports';
import { sendBuildSheet } from './buildSheet';

/** /api/sketches: the caller's own sketches. Someone else's sketch is 404 on every route. */
export function sketchRoutes(config: ServerConfig, mailer: Mailer): Router {
  const router = Router();
  router.use(requireUser);

  router.get('/', async (req, res) => {
    res.json(await sketches.listSketches(currentUser(req), parseOr400(listQuery, req.query, 'invalid query')));
  });

  router.post('/', async (req, res) => {
    const body = parseOr400(createSketchBody, req.body);
    const doc = sketches.validDocument(body.document, body.name, 'document');
    res.status(201).json(await sketches.createSketch(currentUser(req), doc));
  });

  router.post('/import', async (req, res) => {
    const doc = sketches.validDocument(req.body, undefined);
    res.status(201).json(await sketches.createSketch(currentUser(req), doc));
  });

  router.get('/:id', async (req, res) => {
    res.type('application/json').send(await sketches.getSketchJson(currentUser(req), idParam(req, 'id')));
  });

  router.put('/:id', async (req, res) => {
    const id = idParam(req, 'id');
    const body = parseOr400(updateSketchBody, req.body);
    const doc = sketches.validDocument(body.document, body.name, 'document');
    res.json(await sketches.updateSketch(currentUser(req), id, doc, body.version));
  });

  router.delete('/:id', async (req, res) => {
    await sketches.deleteSketch(currentUser(req), idParam(req, 'id'));
    res.status(204).end();
  });

  router.post('/:id/undelete', async (req, res) => {
    res.json(await sketches.undeleteSketch(currentUser(req), idParam(req, 'id')));
  });

  router.get('/:id/revisions', async (req, res) => {
    res.json(await sketches.listRevisions(currentUser(req), idParam(req, 'id')));
  });

  router.get('/:id/revisions/:rev', async (req, res) => {
    res.json(await sketches.getRevision(currentUser(req), idParam(req, 'id'), idParam(req, 'rev')));
  });

  router.post('/:id/restore/:rev', async (req, res) => {
    res.json(await sketches.restoreRevision(currentUser(req), idParam(req, 'id'), idParam(req, 'rev')));
  });

  router.post('/:id/copy', async (req, res) => {
    res.status(201).json(await sketches.copySketch(currentUser(req), idParam(req, 'id')));
  });

  router.get('/:id/export', async (req, res) => {
    const { fileName, document } = await sketches.exportSketch(currentUser(req), idParam(req, 'id'));
    res.attachment(fileName);
    res.type('application/json').send(JSON.stringify(document, null, 2));
  });

  router.use(
    '/:id',
    exportRoutes(config, (req) => sketches.ownDocument(currentUser(req), idParam(req, 'id'))),
  );

  router.get('/:id/build-sheet', async (req, res) => {
    const query = parseOr400(buildSheetQuery, req.query, 'invalid query');
    await sendBuildSheet(res, await sketches.sheetSource(currentUser(req), idParam(req, 'id')), query);
  });

  router.get('/:id/share', async (req, res) => {
    res.json(await sketches.getShareState(currentUser(req), idParam(req, 'id'), config));
  });

  // One message per send, to one address; sends are counted per account and per recipient (shareMailLimiters).
  const shareMail = shareMailLimiters(config);
  router.post('/:id/share', shareMail.perAccount, shareMail.perRecipient, async (req, res) => {
    const user = currentUser(req);
    const id = idParam(req, 'id');
    const body = parseOr400(shareBody, req.body);
    const { name, ...state } = await sketches.setShare(user, id, body, config);
    if (body.email && state.url) {
      // Queued in the database before the answer, sent in the background: a failed send is retried and
      // logged, and never undoes the share.
      await mailer.queue(shareNoticeMail(config, { to: body.email, from: user, sketchName: name, url: state.url }));
    }
    res.json(state);
  });

  return router;
}
