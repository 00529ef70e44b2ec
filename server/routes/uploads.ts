import fs from 'node:fs/promises';
import { randomUUID } from 'node:crypto';
import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { once } from 'node:events';
import type { ServerConfig } from '../config';
import { currentUser, requireUser } from '../middleware/require-user';
import { idParam } from '../middleware/params';
import { badRequest } from '../middleware/http-error';
import { uploadLimiter } from '../middleware/rate-limit';
import { findUpload, saveUpload } from '../services/uploads';
import { databaseUploadStore } from '../services/upload-store';
import { UPLOAD_MAX_BYTES } from '../../shared/schema/requestLimits';

/** Whether `name` holds a NUL, CR, LF or other control character: never part of a file name a browser sends. */
const hasControlCharacter = (name: string) => [...name].some((c) => c.charCodeAt(0) < 0x20 || c.charCodeAt(0) === 0x7f);

/**
 * What busboy (multer's parser) reports about a body it cannot read, in words for the caller: a 400, as
 * the fault is in the request. Anything else passes on unchanged.
 */
function multipartProblem(err: unknown): unknown {
  const message = (err as { message?: unknown } | null)?.message;
  if ((err as { name?: unknown } | null)?.name === 'MulterError' || typeof message !== 'string') return err;
  if (/boundary not found/i.test(message)) {
    return badRequest('the multipart body has no boundary: send it as multipart/form-data with its boundary');
  }
  if (/unexpected end of (form|multipart)/i.test(message)) {
    return badRequest('the multipart body ended early: the upload is incomplete');
  }
  if (/malformed part header/i.test(message)) {
    return badRequest('a part header of the multipart body is malformed (a field or file name holds a CR, LF or NUL?)');
  }
  if (/multipart|form/i.test(message)) return badRequest(`the multipart body cannot be read: ${message}`);
  return err;
}

/**
 * Receives one file of at most UPLOAD_MAX_BYTES (10 MB) in the form field "file", and hardly any other
 * fields, into a file of the spool folder: the body is never held whole in memory. multer deletes the
 * spooled file itself when it refuses the body; the route deletes it once stored.
 */
function receiveOne(spoolDir: string): RequestHandler {
  const receive = multer({
    storage: multer.diskStorage({
      destination: spoolDir,
      filename: (_req, _file, cb) => cb(null, `arcwright-upload-${randomUUID()}`),
    }),
    limits: {
      fileSize: UPLOAD_MAX_BYTES,
      files: 1,
      fields: 4,
      parts: 5,
      fieldSize: 1024,
      fieldNameSize: 64,
      headerPairs: 100,
    },
    fileFilter: (_req, file, cb) => {
      if (hasControlCharacter(file.originalname)) {
        cb(badRequest('the file name holds a control character (NUL, CR, LF…); rename the file and send it again'));
      } else cb(null, true);
    },
  }).single('file');
  return (req, res, next) => receive(req, res, (err?: unknown) => next(err ? multipartProblem(err) : undefined));
}

/** POST /api/sketches/:id/uploads and GET /api/uploads/:id. */
export function uploadRoutes(config: ServerConfig): Router {
  const router = Router();

  router.post(
    '/sketches/:id/uploads',
    requireUser,
    uploadLimiter(config),
    receiveOne(config.uploadSpoolDir),
    async (req, res) => {
      const spooled = req.file;
      let info;
      try {
        info = await saveUpload(
          currentUser(req),
          idParam(req, 'id'),
          spooled && { path: spooled.path, size: spooled.size },
          config.uploadQuotaBytes,
        );
      } finally {
        if (spooled) await fs.rm(spooled.path, { force: true });
      }
      res.status(201).json(info);
    },
  );

  // A guest who opened a shared sketch passes its token as ?share=… to see its tracing photo.
  router.get('/uploads/:id', async (req, res) => {
    const share = typeof req.query.share === 'string' ? req.query.share : undefined;
    const upload = await findUpload(req.user ?? null, String(req.params.id), share);
    res.setHeader('Content-Type', upload.mime);
    res.setHeader('Content-Length', String(upload.size));
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Content-Disposition', 'inline');
    res.setHeader('Cache-Control', 'private, max-age=3600');
    res.setHeader('Content-Security-Policy', "default-src 'none'; sandbox");
    // Piece by piece from the database, waiting for the client to take each one. A failure half way ends the
    // answer short of its Content-Length, which the client sees as an incomplete download.
    try {
      for await (const piece of databaseUploadStore.read(upload.id)) {
        if (res.destroyed) return;
        if (!res.write(piece)) await once(res, 'drain');
      }
      res.end();
    } catch (err) {
      if (!res.headersSent) throw err;
      console.error(`[arcwright] serving upload ${upload.id} failed:`, err);
      res.destroy();
    }
  });

  return router;
}
