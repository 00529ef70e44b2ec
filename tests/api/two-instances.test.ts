import path from 'node:path';
import { spawn, type ChildProcess } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { Sequelize } from 'sequelize';
import { Caller, demo } from './helpers';
import { sketchFile } from './fixtures';
import { tinyPng } from './fixtures/images';
import { freePort, smtpServer } from './fixtures/smtp';
import { createTestDatabase, testDialect, type TestDatabase } from './test-database';
import { openDatabase } from '../../server/database';
import { MailQueueItem } from '../../server/models';

// Two app instances, each a process of its own, on one database (PostgreSQL in the PostgreSQL pass, one SQLite
// file otherwise): a session, a rate limit, an upload and a queued mail started on one are seen by the other.

const START_MS = 60_000;

interface Instance {
  url: string;
  child: ChildProcess;
  output: string[];
  exited: Promise<number | null>;
}

let database: TestDatabase;
let smtpPort: number;
const instances: Instance[] = [];

/** Starts `server/index.ts` in a new Node process on the shared database; resolves once it listens. */
function startInstance(name: string): Promise<Instance> {
  const child = spawn(process.execPath, ['--import', 'tsx', path.join('server', 'index.ts')], {
    cwd: process.cwd(),
    env: {
      PATH: process.env.PATH,
      ...database.env,
      PORT: '0',
      PUBLIC_URL: 'http://arcwright.example.test',
      SESSION_SECRET: 'one-secret-for-every-instance',
      SMTP_URL: `smtp://127.0.0.1:${smtpPort}`,
      LOGIN_MAX_PER_ADDRESS: '3',
      LOGIN_MAX_PER_ACCOUNT: '100',
      DIST_DIR: path.join(database.dir, 'no-dist'),
      UPLOAD_SPOOL_DIR: path.join(database.dir, `spool-${name}`),
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const output: string[] = [];
  const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`${name} did not start:\n${output.join('')}`)), START_MS);
    const read = (chunk: Buffer) => {
      output.push(chunk.toString());
      const m = /listening on (http:\/\/localhost:\d+)/.exec(output.join(''));
      if (m) {
        clearTimeout(timer);
        const instance = { url: m[1], child, output, exited };
        instances.push(instance);
        resolve(instance);
      }
    };
    child.stdout!.on('data', read);
    child.stderr!.on('data', (chunk: Buffer) => output.push(chunk.toString()));
    void exited.then((code) => reject(new Error(`${name} stopped (exit ${code}):\n${output.join('')}`)));
  });
}

async function stop(instance: Instance): Promise<void> {
  if (instance.child.exitCode === null) instance.child.kill('SIGTERM');
  await instance.exited;
}

async function until(check: () => Promise<boolean> | boolean, what: string, ms = 30_000): Promise<void> {
  const end = Date.now() + ms;
  while (!(await check())) {
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

let a: Instance;
let b: Instance;
beforeAll(async () => {
  database = await createTestDatabase();
  smtpPort = await freePort();
  // The first migrates and seeds the empty database; the second finds it ready.
  a = await startInstance('a');
  b = await startInstance('b');
}, 2 * START_MS);
afterAll(async () => {
  for (const instance of instances) await stop(instance);
  await database.drop();
}, 30_000);

/** The session cookie a response sets. */
function sessionCookie(res: request.Response): string {
  const cookies = ([] as string[]).concat(res.headers['set-cookie'] ?? []);
  const sid = cookies.find((c) => c.startsWith('arcwright.sid='));
  if (!sid) throw new Error('no session cookie in the answer');
  return sid.split(';')[0];
}

describe(`two instances on one ${testDialect === 'postgres' ? 'PostgreSQL database' : 'SQLite file'}`, () => {
  it('share a session and an upload: signed in on one, uploading on the other, served by the first', async () => {
    const onA = new Caller(a.url);
    await onA.refreshToken();
    const login = await onA.post('/api/auth/login').send(demo.maker).expect(200);
    const cookie = sessionCookie(login);
    const token = await onA.refreshToken();

    const me = await request(b.url).get('/api/auth/me').set('Cookie', cookie);
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe(demo.maker.email);

    const sketch = await request(b.url)
      .post('/api/sketches')
      .set('Cookie', cookie)
      .set('X-CSRF-Token', token)
      .send({ name: 'Two-instance rig', document: sketchFile('Two-instance rig') })
      .expect(201);
    const png = tinyPng();
    const up = await request(b.url)
      .post(`/api/sketches/${sketch.body.id}/uploads`)
      .set('Cookie', cookie)
      .set('X-CSRF-Token', token)
      .attach('file', png, 'photo.png');
    expect(up.status).toBe(201);
    const got = await request(a.url).get(up.body.url).set('Cookie', cookie).buffer(true);
    expect(got.status).toBe(200);
    expect(Buffer.compare(got.body as Buffer, png)).toBe(0);
  }, 60_000);

  it('share a rate limit: failed sign-ins on both count together', async () => {
    const onA = new Caller(a.url);
    const onB = new Caller(b.url);
    await onA.refreshToken();
    await onB.refreshToken();
    const wrong = { email: demo.student.email, password: 'not-the-password' };
    expect((await onA.post('/api/auth/login').send(wrong)).status).toBe(401);
    expect((await onA.post('/api/auth/login').send(wrong)).status).toBe(401);
    expect((await onB.post('/api/auth/login').send(wrong)).status).toBe(401);
    // Three failures from this address in all: the limit (3) is reached on both instances.
    const res = await onB.post('/api/auth/login').send(demo.student);
    expect(res.status).toBe(429);
    expect(res.body.error).toMatch(/too many sign-in attempts/);
    expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
  }, 60_000);

  it('share the mail queue: mail queued on one while SMTP is down is sent once by the other after the first stops', async () => {
    const anon = new Caller(a.url);
    await anon.refreshToken();
    expect((await anon.post('/api/auth/reset-request').send({ email: demo.instructor.email })).status).toBe(202);
    await stop(a);

    const smtp = await smtpServer(smtpPort);
    let sequelize: Sequelize | null = null;
    try {
      await until(() => smtp.received.length > 0, 'the mail to arrive', 45_000);
      sequelize = await openDatabase({
        databaseUrl: database.env.DATABASE_URL ?? null,
        databasePath: database.env.DATABASE_PATH ?? '',
      });
      await until(
        async () => (await MailQueueItem.findOne({ where: { to: demo.instructor.email } }))?.state === 'sent',
        'the queue row to be marked sent',
      );
      expect(smtp.received).toEqual([{ to: demo.instructor.email, subject: 'Arcwright: reset your password' }]);
    } finally {
      await sequelize?.close();
      await smtp.close();
    }
  }, 90_000);
});
