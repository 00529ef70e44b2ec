import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { startTestServer, type TestServer } from './helpers';

// A stand-in for the built client (dist/): an index.html and one hashed asset.
const dist = fs.mkdtempSync(path.join(os.tmpdir(), 'arcwright-dist-'));
fs.writeFileSync(path.join(dist, 'index.html'), '<!doctype html><title>Arcwright</title><div id="app"></div>');
fs.mkdirSync(path.join(dist, 'assets'));
fs.writeFileSync(path.join(dist, 'assets', 'index-abc123.js'), 'console.log("client")');

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer({ DIST_DIR: dist });
});
afterAll(async () => {
  await server.close();
  fs.rmSync(dist, { recursive: true, force: true });
});

describe('serving the built client', () => {
  it('serves index.html at / and for deep links (history fallback)', async () => {
    for (const url of ['/', '/library', '/board/12', '/shared/some-token']) {
      const res = await request(server.app).get(url);
      expect(res.status, url).toBe(200);
      expect(res.headers['content-type']).toMatch(/text\/html/);
      expect(res.text).toContain('<div id="app">');
    }
  });

  it('serves hashed assets with a long cache life, and 404 for a missing asset', async () => {
    const res = await request(server.app).get('/assets/index-abc123.js');
    expect(res.status).toBe(200);
    expect(res.headers['cache-control']).toMatch(/immutable/);
    const missing = await request(server.app).get('/assets/gone.js');
    expect(missing.status).toBe(404);
  });

  it('answers a missing file with a JSON 404 that names no folder of the server', async () => {
    for (const url of ['/assets/gone.js', '/assets/deep/er/gone.css', '/favicon-nope.png', '/fonts/none.woff2']) {
      const res = await request(server.app).get(url);
      expect(res.status, url).toBe(404);
      expect(res.headers['content-type'], url).toMatch(/json/);
      expect(res.body.error, url).toBe(`no such file: ${url}`);
      expect(res.text, url).not.toContain(dist);
      expect(res.text, url).not.toContain(os.tmpdir());
    }
  });

  it('keeps JSON 404 for unknown /api paths', async () => {
    const res = await request(server.app).get('/api/library');
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).toMatch(/json/);
  });

  it('sends the CSP with the page', async () => {
    const res = await request(server.app).get('/library');
    expect(res.headers['content-security-policy']).toContain("script-src 'self'");
    expect(res.headers['content-security-policy']).toContain("style-src 'self' 'unsafe-inline'");
  });
});
