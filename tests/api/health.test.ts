import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startTestServer, type TestServer } from './helpers';

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

describe('GET /api/health', () => {
  it('answers ok with the package version', async () => {
    const res = await request(server.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok', db: 'ok', version: '0.1.0' });
  });

  it('sends security headers with a CSP limited to our own origin', async () => {
    const res = await request(server.app).get('/api/health');
    const csp = res.headers['content-security-policy'];
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("worker-src 'self' blob:");
    expect(csp).not.toContain('http');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});

describe('API errors', () => {
  it('answers an unknown /api path with JSON 404', async () => {
    const res = await request(server.app).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.error).toMatch(/no such API route/);
  });

  it('answers malformed JSON with 400 and no stack trace', async () => {
    const res = await request(server.app)
      .post('/api/no-such-thing')
      .set('Content-Type', 'application/json')
      .send('{"a":');
    expect(res.status).toBe(400);
    expect(res.body).toEqual({ error: 'request body is not valid JSON' });
  });

  it('answers a body over 256 KB with 413', async () => {
    const res = await request(server.app)
      .post('/api/no-such-thing')
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ pad: 'x'.repeat(300 * 1024) }));
    expect(res.status).toBe(413);
    expect(res.body.error).toMatch(/256 KB/);
  });
});
