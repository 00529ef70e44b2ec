import { Router } from 'express';
import multer from 'multer';
import type { ServerConfig } from '../config';
import { currentUser, requireUser } from '../middleware/require-user';
import { idParam } from '../middleware/params';
import { findUpload, saveUpload } from '../services/uploads';
import { UPLOAD_MAX_BYTES } from '../../shared/schema/requestLimits';

/** Multipart limits: one file of at most UPLOAD_MAX_BYTES (10 MB), and hardly any other fields. */
const receive = multer({
  storage: multer.memoryStorage(),
  limits: {
    fileSize: UPLOAD_MAX_BYTES,
    files: 1,
    fields: 4,
    parts: 5,
    fieldSize: 1024,
    fieldNameSize: 64,
    headerPairs: 100,
  },
}).single('file');

/** POST /api/sketches/:id/uploads and GET /api/uploads/:id. */
export function uploadRoutes(config: ServerConfig): Router {
  const router = Router();

  router.post('/sketches/:id/uploads', requireUser, receive, async (req, res) => {
    const info = await saveUpload(config.uploadsDir, currentUser(req), idParam(req, 'id'), req.file?.buffer);
    res.status(201).json(info);
  });

  // A guest who opened a shared sketch passes its token as ?share=… to see its tracing photo.
  router.get('/uploads/:id', async (req, res) => {
    const share = typeof req.query.share === 'string' ? req.query.share : undefined;
    const upload = await findUpload(config.uploadsDir, req.user ?? null, String(req.params.id), share);
    res.setHeader('Content-Type', upload.mime);
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Content-Disposition', 'inline');
    res.setHeader('Cache-Control', 'private, max-age=3600');
    res.setHeader('Content-Security-Policy', "default-src 'none'; sandbox");
    res.sendFile(upload.file);
  });

  return router;
}
