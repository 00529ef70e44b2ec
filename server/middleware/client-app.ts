import fs from 'node:fs';
import path from 'node:path';
import express, { Router, type RequestHandler } from 'express';

/**
 * Serves the built client from `distDir` and answers every other non-/api GET with index.html
 * so that the client's router handles deep links (/board/12). Returns null when there is no build.
 */
export function clientApp(distDir: string): Router | null {
  const index = path.join(distDir, 'index.html');
  if (!fs.existsSync(index)) return null;
  const router = Router();
  // Hashed asset names never change content, so they may be cached for long; index.html may not.
  router.use('/assets', express.static(path.join(distDir, 'assets'), { immutable: true, maxAge: '1y' }));
  router.use('/assets', missingFile);
  router.use(express.static(distDir, { index: false }));
  router.get('/{*splat}', (req, res, next) => {
    if (req.path === '/api' || req.path.startsWith('/api/')) return next();
    // A file name (a dot in the last part) is never a page of the client: no index.html in its place.
    if (path.posix.extname(req.path)) return missingFile(req, res, next);
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
  return router;
}

/** JSON 404 naming the path asked for and nothing of the server's folders. */
const missingFile: RequestHandler = (req, res) => {
  res.status(404).json({ error: `no such file: ${req.originalUrl.split('?')[0]}` });
};
