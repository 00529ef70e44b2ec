import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startTestServer, type TestServer } from './helpers';
import { JSON_BODY_MAX_BYTES } from '../../shared/schema/requestLimits';

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

/** A JSON text of exactly `bytes` bytes (ASCII only, so characters are bytes). */
function jsonOfSize(bytes: number): string {
  const shell = '{"pad":""}';
  return `{"pad":"${'x'.repeat(bytes - shell.length)}"}`;
}

describe('the JSON body limit', () => {
  it('takes a body of exactly the limit and refuses one byte more with 413 naming the limit', async () => {
    expect(jsonOfSize(JSON_BODY_MAX_BYTES)).toHaveLength(JSON_BODY_MAX_BYTES);
    const atLimit = await request(server.app)
      .post('/api/no-such-thing')
      .set('Content-Type', 'application/json')
      .send(jsonOfSize(JSON_BODY_MAX_BYTES));
    // Parsed, then refused further on (no CSRF token), never for its size.
    expect(atLimit.status).not.toBe(413);
    expect(atLimit.status).toBe(403);

    const over = await request(server.app)
      .post('/api/no-such-thing')
      .set('Content-Type', 'application/json')
      .send(jsonOfSize(JSON_BODY_MAX_BYTES + 1));
    expect(over.status).toBe(413);
    // The limit as the API documentation writes it: 256 KB = 262144 bytes.
    expect(over.body).toEqual({ error: 'request body is larger than 256 KB' });
  });
});
