/**
 * Loopback load test of the sketches API (npm run bench:load).
 *
 * Starts the real server (npx tsx server/index.ts) on a temporary database and a free port,
 * signs up CLIENTS accounts, gives each its own sketch, then lets every client save its sketch
 * over and over for DURATION_S seconds, each save naming the version it edits. Afterwards it
 * checks that no request failed and that every acknowledged save is in the database as a
 * revision with the exact name that save sent. Prints requests per second and latency
 * percentiles. Exits 1 on any error or missing save.
 *
 * Settings: LOAD_CLIENTS (50), LOAD_SECONDS (20), LOAD_PROFILE=<dir> to write a V8 CPU profile
 * of the server there.
 */
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import sqlite3 from 'sqlite3';

const CLIENTS = Number(process.env.LOAD_CLIENTS ?? 50);
const DURATION_S = Number(process.env.LOAD_SECONDS ?? 20);
const root = path.resolve(import.meta.dirname, '../..');

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
    srv.on('error', reject);
  });
}

async function waitForHealth(base: string, timeoutMs: number): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    try {
      const res = await fetch(`${base}/api/health`);
      if (res.ok) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error('server did not answer /api/health in time');
}

/** The fields of the answers this script reads. */
interface ApiAnswer {
  token: string;
  id: number;
  version: number;
}

/** A client with its own cookie jar (the session cookie, and the CSRF cookie while signed out) and CSRF token. */
class Client {
  cookies = new Map<string, string>();
  token = '';
  constructor(readonly base: string) {}

  async call(method: string, url: string, body?: unknown): Promise<{ status: number; json: ApiAnswer }> {
    const cookie = [...this.cookies].map(([name, value]) => `${name}=${value}`).join('; ');
    const headers: Record<string, string> = { cookie };
    if (body !== undefined) headers['content-type'] = 'application/json';
    if (method !== 'GET') headers['x-csrf-token'] = this.token;
    const res = await fetch(this.base + url, {
      method,
      headers,
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    for (const set of res.headers.getSetCookie()) {
      const [pair] = set.split(';');
      const eq = pair.indexOf('=');
      this.cookies.set(pair.slice(0, eq), pair.slice(eq + 1));
    }
    const text = await res.text();
    return { status: res.status, json: (text ? JSON.parse(text) : {}) as ApiAnswer };
  }

  async refreshToken() {
    this.token = (await this.call('GET', '/api/auth/csrf')).json.token;
  }
}

function percentile(sorted: number[], p: number): number {
  if (!sorted.length) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

function queryAll<T>(db: sqlite3.Database, sql: string, params: unknown[] = []): Promise<T[]> {
  return new Promise((resolve, reject) =>
    db.all(sql, params, (err, rows) => (err ? reject(err) : resolve(rows as T[]))),
  );
}

/** The token of the sign-up link the server's mail catcher filed for `to` (the bench owns this database). */
async function signupToken(dbPath: string, to: string): Promise<string> {
  const db = new sqlite3.Database(dbPath, sqlite3.OPEN_READONLY);
  try {
    for (let tries = 0; tries < 100; tries++) {
      const rows = await queryAll<{ text: string }>(db, 'SELECT text FROM outbox WHERE "to" = ?', [to]);
      const m = rows.map((r) => /\/signup\/confirm\?token=([A-Za-z0-9_-]+)/.exec(r.text)).find(Boolean);
      if (m) return m[1];
      await new Promise((r) => setTimeout(r, 100));
    }
    throw new Error(`no sign-up mail to ${to}`);
  } finally {
    db.close();
  }
}

async function main() {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'arcwright-load-'));
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const dbPath = path.join(dir, 'load.sqlite');
  const profile = process.env.LOAD_PROFILE ? ['--cpu-prof', `--cpu-prof-dir=${process.env.LOAD_PROFILE}`] : [];
  // `node --import tsx` rather than the tsx command, so the server is this one process (and can be profiled).
  const server = spawn(process.execPath, [...profile, '--import', 'tsx', 'server/index.ts'], {
    cwd: root,
    env: {
      ...process.env,
      PORT: String(port),
      DATABASE_PATH: dbPath,
      UPLOADS_DIR: path.join(dir, 'uploads'),
      DIST_DIR: path.join(dir, 'no-client'),
      SIGNUP_MAX_PER_ADDRESS: String(CLIENTS * 2),
      NODE_ENV: 'development',
    },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  const stop = () => {
    if (server.exitCode === null) server.kill('SIGTERM');
  };
  process.on('exit', stop);

  try {
    await waitForHealth(base, 60_000);
    const document = JSON.parse(fs.readFileSync(path.join(root, 'tests/api/fixtures/four-link.sketch.json'), 'utf8'));

    const clients: { c: Client; id: number; version: number; acked: { version: number; name: string }[] }[] = [];
    for (let i = 0; i < CLIENTS; i++) {
      const c = new Client(base);
      await c.refreshToken();
      const account = { email: `load-${i}@example.test`, password: `load-password-${i}` };
      const signup = await c.call('POST', '/api/auth/signup', { ...account, name: `Load ${i}` });
      if (signup.status !== 202)
        throw new Error(`sign-up ${i} answered ${signup.status}: ${JSON.stringify(signup.json)}`);
      // Sign-up finishes through the link mailed to the address, then the account signs in.
      const confirmed = await c.call('POST', '/api/auth/signup/confirm', {
        token: await signupToken(dbPath, account.email),
      });
      if (confirmed.status !== 201) throw new Error(`sign-up link ${i} answered ${confirmed.status}`);
      const login = await c.call('POST', '/api/auth/login', account);
      if (login.status !== 200) throw new Error(`sign-in ${i} answered ${login.status}`);
      await c.refreshToken();
      const created = await c.call('POST', '/api/sketches', { name: `Load ${i} v1`, document });
      if (created.status !== 201) throw new Error(`create ${i} answered ${created.status}`);
      clients.push({ c, id: created.json.id, version: created.json.version, acked: [] });
    }
    console.log(`${CLIENTS} clients signed up, each with a sketch; saving for ${DURATION_S} s ...`);

    const latencies: number[] = [];
    const errors: string[] = [];
    const started = performance.now();
    const deadline = started + DURATION_S * 1000;
    await Promise.all(
      clients.map(async (cl, i) => {
        while (performance.now() < deadline) {
          const name = `Load ${i} v${cl.version + 1}`;
          const t0 = performance.now();
          let res;
          try {
            res = await cl.c.call('PUT', `/api/sketches/${cl.id}`, { document, name, version: cl.version });
          } catch (err) {
            errors.push(`client ${i}: ${(err as Error).message}`);
            continue;
          }
          latencies.push(performance.now() - t0);
          if (res.status !== 200) {
            errors.push(`client ${i}: ${res.status} ${JSON.stringify(res.json)}`);
            continue;
          }
          cl.version = res.json.version;
          cl.acked.push({ version: res.json.version, name });
        }
      }),
    );
    const elapsedS = (performance.now() - started) / 1000;

    stop();
    await new Promise((r) => server.once('exit', r));

    // Every acknowledged save must be a revision with that version and name.
    const db = new sqlite3.Database(dbPath, sqlite3.OPEN_READONLY);
    const revisions = await queryAll<{ sketchId: number; version: number; name: string }>(
      db,
      'SELECT sketchId, version, name FROM sketch_revisions',
    );
    const sketches = await queryAll<{ id: number; version: number; name: string }>(
      db,
      'SELECT id, version, name FROM sketches',
    );
    db.close();
    const have = new Set(revisions.map((r) => `${r.sketchId}/${r.version}/${r.name}`));
    const current = new Map(sketches.map((s) => [s.id, s]));
    let missing = 0;
    let acked = 0;
    for (const cl of clients) {
      for (const a of cl.acked) {
        acked += 1;
        if (!have.has(`${cl.id}/${a.version}/${a.name}`)) missing += 1;
      }
      const last = cl.acked.at(-1);
      const row = current.get(cl.id);
      if (last && (!row || row.version !== last.version || row.name !== last.name)) missing += 1;
    }

    const sorted = [...latencies].sort((a, b) => a - b);
    console.log(
      `requests: ${latencies.length} in ${elapsedS.toFixed(1)} s = ${(latencies.length / elapsedS).toFixed(0)} req/s`,
    );
    console.log(
      `latency ms: p50 ${percentile(sorted, 50).toFixed(1)}, p95 ${percentile(sorted, 95).toFixed(1)}, ` +
        `p99 ${percentile(sorted, 99).toFixed(1)}, max ${sorted.at(-1)?.toFixed(1)}`,
    );
    console.log(
      `acknowledged saves: ${acked}; missing from the database: ${missing}; failed requests: ${errors.length}`,
    );
    if (errors.length) console.log('first errors:', errors.slice(0, 5));
    fs.rmSync(dir, { recursive: true, force: true });
    process.exit(errors.length || missing || !acked ? 1 : 0);
  } catch (err) {
    console.error('load test failed:', err);
    stop();
    process.exit(1);
  }
}

void main();
