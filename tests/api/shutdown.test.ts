import { get as httpGet, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import express from 'express';
import request from 'supertest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { createApp } from '../../server/app';
import { errorHandler } from '../../server/middleware/error-handler';
import { sweepLimiter } from '../../server/middleware/rate-limit';
import { RequestGate, SHUTTING_DOWN_ERROR, shutDown } from '../../server/shutdown';
import { startTestServer, type TestServer } from './helpers';
import { sketchFile } from './fixtures';

/** Sweeps sent at once: each is tens of ms of CPU, so most are still queued when the shutdown begins. */
const SWEEPS = 12;

let server: TestServer | null = null;
afterEach(() => {
  vi.restoreAllMocks();
  server = null;
});

/** The test server's database behind a listening app with its own gate; the session's writes need a CSRF pair. */
async function listeningApp() {
  server = await startTestServer({ SWEEP_MAX_PER_MINUTE: '1000' });
  const gate = new RequestGate();
  const app = createApp({ sequelize: server.sequelize, config: server.config, mailer: server.mail.mailer, gate });
  const http: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  let arrived = 0;
  http.on('request', () => (arrived += 1));
  const base = `http://127.0.0.1:${(http.address() as AddressInfo).port}`;
  const csrf = await fetch(`${base}/api/auth/csrf`);
  const cookie = csrf.headers.getSetCookie()[0].split(';')[0];
  const { token } = (await csrf.json()) as { token: string };
  const sweep = (signal?: AbortSignal) =>
    fetch(`${base}/api/sweep`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'x-csrf-token': token, cookie },
      body: JSON.stringify(sketchFile()),
      signal,
    });
  return { app, gate, http, sweep, arrived: () => arrived - 1, steps: stepsFor(http, gate, server) };
}

function stepsFor(http: Server, gate: RequestGate, test: TestServer) {
  return {
    server: http,
    gate,
    stopTimers: () => undefined,
    closeMail: () => Promise.resolve(),
    // Closes the mail, the database and (unless shared) drops it: the database goes last, as in server/index.ts.
    closeDatabase: () => test.close(),
  };
}

async function until(condition: () => boolean): Promise<void> {
  const deadline = Date.now() + 20_000;
  while (!condition()) {
    if (Date.now() > deadline) throw new Error('timed out');
    await new Promise((resolve) => setTimeout(resolve, 2));
  }
}

/** Everything logged as an error or warning during `work`, as text. */
async function logsDuring(work: () => Promise<void>): Promise<string[]> {
  const logged: string[] = [];
  const keep = (...args: unknown[]) =>
    void logged.push(args.map((a) => (a instanceof Error ? a.stack : String(a))).join(' '));
  vi.spyOn(console, 'error').mockImplementation(keep);
  vi.spyOn(console, 'warn').mockImplementation(keep);
  await work();
  return logged;
}

// Each test starts a server and sends a burst of sweeps: slower than most on a loaded machine.
describe('shutting down', { timeout: 60_000 }, () => {
  it('answers every request in flight before it closes the database', async () => {
    const { gate, sweep, arrived, steps } = await listeningApp();
    // The answer of a sweep while nothing shuts down.
    const expected = await (await sweep()).text();
    let drained: boolean | undefined;
    const logged = await logsDuring(async () => {
      const sent = Array.from({ length: SWEEPS }, () => sweep());
      await until(() => arrived() === SWEEPS + 1);
      expect(gate.inFlight).toBeGreaterThan(0);
      const shutdown = shutDown({ ...steps, graceMs: 20_000 });
      for (const res of await Promise.all(sent)) {
        expect(res.status).toBe(200);
        expect(await res.text()).toBe(expected);
      }
      drained = await shutdown;
    });
    expect(drained).toBe(true);
    expect(logged).toEqual([]);
  });

  it('lets requests whose callers left finish before it closes the database', async () => {
    const { gate, sweep, arrived, steps } = await listeningApp();
    const aborts = Array.from({ length: SWEEPS }, () => new AbortController());
    let drained: boolean | undefined;
    let inFlightAtStart = 0;
    const logged = await logsDuring(async () => {
      const sent = aborts.map((a) => sweep(a.signal).catch(() => null));
      await until(() => arrived() === SWEEPS);
      inFlightAtStart = gate.inFlight;
      // The callers leave once the shutdown begins, as a load test's connections do when its time is up: their
      // connections close while the server still works on their requests.
      const shutdown = shutDown({ ...steps, graceMs: 20_000 });
      for (const a of aborts) a.abort();
      await Promise.all(sent);
      drained = await shutdown;
    });
    expect(inFlightAtStart).toBeGreaterThan(0);
    expect(drained).toBe(true);
    expect(gate.inFlight).toBe(0);
    // No request ran into the closed database (SQLITE_MISUSE: Database is closed, or a closed connection pool).
    expect(logged).toEqual([]);
  });

  it('answers a request that arrives after the shutdown with a JSON 503, before it touches the database', async () => {
    const { app, steps } = await listeningApp();
    await shutDown(steps);
    const logged = await logsDuring(async () => {
      for (const res of [
        await request(app).get('/api/health'),
        await request(app).post('/api/sweep').send(sketchFile()),
        await request(app).get('/api/sketches/1'),
      ]) {
        expect(res.status).toBe(503);
        expect(res.headers['content-type']).toMatch(/^application\/json/);
        expect(res.body).toEqual({ error: SHUTTING_DOWN_ERROR });
      }
    });
    expect(logged).toEqual([]);
  });

  it('tells a request cut short past the grace period to retry, in one log line without a stack trace', async () => {
    server = await startTestServer();
    const test = server;
    // A route of our own that is still running when the grace period ends, and only then counts in the database: as
    // a request held up by the real routes would, but at a moment the test decides.
    const gate = new RequestGate();
    let release = () => undefined as void;
    const released = new Promise<void>((resolve) => (release = resolve));
    const app = express();
    app.use(gate.admit);
    // The sweep's limiter counts in the database (the write that failed in the load test's shutdown).
    const limiter = sweepLimiter(test.config, 'sweep');
    app.get(
      '/slow',
      (_req, _res, next) => void released.then(() => next()),
      limiter,
      (_req, res) => void res.json({ status: 'ok' }),
    );
    app.use(errorHandler);
    const http: Server = await new Promise((resolve) => {
      const s = app.listen(0, '127.0.0.1', () => resolve(s));
    });
    const base = `http://127.0.0.1:${(http.address() as AddressInfo).port}`;
    let drained: boolean | undefined;
    const logged = await logsDuring(async () => {
      const answer = new Promise<{ status: number; body: unknown } | null>((resolve) =>
        httpGet(`${base}/slow`, (res) => {
          let text = '';
          res.on('data', (chunk: Buffer) => (text += chunk.toString()));
          res.on('end', () => resolve({ status: res.statusCode ?? 0, body: JSON.parse(text) }));
          // The shutdown closes the connection at the end of the grace period: the caller sees it close.
        }).on('error', () => resolve(null)),
      );
      await until(() => gate.inFlight === 1);
      // The connection stays open past the grace period only if shutDown leaves it: close it after the database.
      const steps = stepsFor(http, gate, test);
      const done = shutDown({
        ...steps,
        graceMs: 0,
        closeDatabase: async () => {
          await steps.closeDatabase();
          release();
          await until(() => gate.inFlight === 0);
        },
      });
      drained = await done;
      const answered = await answer;
      if (answered) expect(answered).toEqual({ status: 503, body: { error: SHUTTING_DOWN_ERROR } });
    });
    expect(drained).toBe(false);
    expect(logged).toHaveLength(1);
    expect(logged[0]).toMatch(/^\[arcwright\] GET \/slow cut short by the shutdown: \S/);
    expect(logged[0]).not.toMatch(/\n\s+at /);
  });
});
