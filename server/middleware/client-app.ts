import fs from 'node:fs';
import path from 'node:path';
import express, { Router } from 'express';

/**
 * Serves the built client from `distDir` and answers every other non-/api GET with index.html
 * so that the client's router handles deep links (/board/12). Returns null when there is no build.
 */
export function clientApp(distDir: string): Router | null {
  const index = path.join(distDir, 'index.html');
  if (!fs.existsSync(index)) return null;
  const router = Router();
  // Hashed asset names never change content, so they may be cached for long; index.html may not.
  router.use(
    '/assets',
    express.static(path.join(distDir, 'assets'), { immutable: true, maxAge: '1y', fallthrough: false }),
  );
  router.use(express.static(distDir, { index: false }));
  router.get('/{*splat}', (req, res, next) => {
    if (req.path === '/api' || req.path.startsWith('/api/')) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
  return router;
}
