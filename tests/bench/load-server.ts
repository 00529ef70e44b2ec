/**
 * The real server for the load benchmarks: `node --import tsx server/index.ts` on a temporary database and a free
 * loopback port, and a small client with its own session cookie and CSRF token.
 */
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import sqlite3 from 'sqlite3';

export const root = path.resolve(import.meta.dirname, '../..');
/** Linux's USER_HZ, the unit of the times in /proc/<pid>/stat. */
const CLOCK_TICKS_PER_S = 100;

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

export interface LoadServer {
  base: string;
  /** The temporary folder holding the database and uploads; removed by `remove()`. */
  dir: string;
  dbPath: string;
  /** CPU time the server process has used so far (ms, user + system), or NaN where /proc is not there. */
  cpuMs(): number;
  /** Stops the server and waits for it to exit. */
  stop(): Promise<void>;
  /** Removes the temporary folder (after `stop`). */
  remove(): void;
}

/**
 * Starts the server and waits until /api/health answers. LOAD_PROFILE=<dir> writes a V8 CPU profile of the server
 * there when it stops. `env` adds settings (limits raised for the benchmark).
 */
export async function startServer(env: Record<string, string>): Promise<LoadServer> {
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
      NODE_ENV: 'development',
      ...env,
    },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  const kill = () => {
    if (server.exitCode === null) server.kill('SIGTERM');
  };
  process.on('exit', kill);
  const stop = async () => {
    if (server.exitCode !== null) return;
    const exited = new Promise((r) => server.once('exit', r));
    kill();
    await exited;
  };
  try {
    await waitForHealth(base, 60_000);
  } catch (err) {
    await stop();
    throw err;
  }
  const cpuMs = () => {
    try {
      // Fields 14 and 15 of /proc/<pid>/stat (after the parenthesised name): user and system time in clock ticks.
      const stat = fs.readFileSync(`/proc/${server.pid}/stat`, 'utf8');
      const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
      return ((Number(fields[11]) + Number(fields[12])) * 1000) / CLOCK_TICKS_PER_S;
    } catch {
      return NaN;
    }
  };
  return { base, dir, dbPath, cpuMs, stop, remove: () => fs.rmSync(dir, { recursive: true, force: true }) };
}

/** The fields of the answers the benchmarks read. */
export interface ApiAnswer {
  token: string;
  id: number;
  version: number;
}

/** A client with its own cookie jar (the session cookie, and the CSRF cookie while signed out) and CSRF token. */
export class Client {
  cookies = new Map<string, string>();
  token = '';
  constructor(readonly base: string) {}

  /** The Cookie header this client sends. */
  get cookie(): string {
    return [...this.cookies].map(([name, value]) => `${name}=${value}`).join('; ');
  }

  async call(method: string, url: string, body?: unknown): Promise<{ status: number; json: ApiAnswer }> {
    const headers: Record<string, string> = { cookie: this.cookie };
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

  /**
   * Signs up a new account as a person does: the sign-up (202), the link mailed to the address (read from the
   * outbox of the bench's own SQLite file), then signing in; fetches the signed-in session's CSRF token.
   */
  async signUp(email: string, password: string, name: string, dbPath: string): Promise<void> {
    await this.refreshToken();
    const signup = await this.call('POST', '/api/auth/signup', { email, password, name });
    if (signup.status !== 202) throw new Error(`sign-up answered ${signup.status}: ${JSON.stringify(signup.json)}`);
    const confirm = await this.call('POST', '/api/auth/signup/confirm', { token: await signupToken(dbPath, email) });
    if (confirm.status !== 201) throw new Error(`sign-up link answered ${confirm.status}`);
    const login = await this.call('POST', '/api/auth/login', { email, password });
    if (login.status !== 200) throw new Error(`sign-in answered ${login.status}`);
    await this.refreshToken();
  }
}

/** The token of the sign-up link the server's mail catcher filed for `to` (the bench owns this database). */
async function signupToken(dbPath: string, to: string): Promise<string> {
  const db = new sqlite3.Database(dbPath, sqlite3.OPEN_READONLY);
  const texts = () =>
    new Promise<{ text: string }[]>((resolve, reject) =>
      db.all('SELECT text FROM outbox WHERE "to" = ?', [to], (err, rows) =>
        err ? reject(err) : resolve(rows as { text: string }[]),
      ),
    );
  try {
    for (let tries = 0; tries < 100; tries++) {
      const m = (await texts()).map((r) => /\/signup\/confirm\?token=([A-Za-z0-9_-]+)/.exec(r.text)).find(Boolean);
      if (m) return m[1];
      await new Promise((r) => setTimeout(r, 100));
    }
    throw new Error(`no sign-up mail to ${to}`);
  } finally {
    db.close();
  }
}

/** The sketch file the benchmarks save and sweep (the four-link fixture of the API tests). */
export function fixtureDocument(): Record<string, unknown> {
  return JSON.parse(fs.readFileSync(path.join(root, 'tests/api/fixtures/four-link.sketch.json'), 'utf8')) as Record<
    string,
    unknown
  >;
}
