import path from 'node:path';
import type { Express } from 'express';
import request from 'supertest';
import type { Sequelize } from 'sequelize';
import { loadConfig, type ServerConfig } from '../../server/config';
import { openDatabase } from '../../server/database';
import { migrate } from '../../server/migrations/umzug';
import { seedDemoData } from '../../server/seed';
import { createApp } from '../../server/app';
import { setUpMail, type MailSetup } from '../../server/services/mail';
import type { CaughtMail } from '../../server/services/mail/catcher';
import { OutboxMessage } from '../../server/models';
import { createTestDatabase, type TestDatabase } from './test-database';

/** Every message the test servers' mail catchers delivered, oldest first (the mail as sent, links intact). */
const delivered: CaughtMail[] = [];

export interface TestServer {
  app: Express;
  sequelize: Sequelize;
  config: ServerConfig;
  mail: MailSetup;
  dir: string;
  /** Messages in the outbox (the admin's mail log) to `to`, newest first, once every queued mail has gone out. */
  mailTo(to: string): Promise<OutboxMessage[]>;
  /** Messages as the mail catcher received them (what the recipient reads), newest first, once the queue is empty. */
  deliveredTo(to: string): Promise<CaughtMail[]>;
  close(): Promise<void>;
}

/** Which database a test server uses, and how soon it retries mail. */
export interface TestServerOptions {
  /** A database the caller made (createTestDatabase) and drops: shared by every server started on it. */
  database?: TestDatabase;
  /** Pause before the first mail retry (ms). */
  retryDelayMs?: number;
}

/**
 * A fresh app on a database of its own, migrated and seeded with the demo accounts: a temporary SQLite
 * FILE (not :memory:, which would hide the per-transaction connections), or in the PostgreSQL pass a new
 * database in the pass's cluster (tests/api/test-database.ts). With `options.database`, an app on that
 * database (a restart, or a second instance), which close() leaves in place.
 */
export async function startTestServer(
  env: Record<string, string> = {},
  options: TestServerOptions = {},
): Promise<TestServer> {
  const database = options.database ?? (await createTestDatabase());
  const dir = database.dir;
  const config = loadConfig({
    ...database.env,
    UPLOAD_SPOOL_DIR: path.join(dir, 'spool'),
    PUBLIC_URL: 'http://arcwright.example.test',
    DIST_DIR: path.join(dir, 'no-dist'),
    ...env,
  });
  const sequelize = await openDatabase(config);
  await migrate(sequelize);
  await seedDemoData(sequelize);
  const mail = await setUpMail(
    config,
    { retryDelayMs: options.retryDelayMs ?? 20 },
    { onDelivered: (m) => delivered.push(m) },
  );
  const app = createApp({ sequelize, config, mailer: mail.mailer });
  return {
    app,
    sequelize,
    config,
    mail,
    dir,
    async mailTo(to: string) {
      await mail.mailer.idle();
      return OutboxMessage.findAll({ where: { to }, order: [['id', 'DESC']] });
    },
    async deliveredTo(to: string) {
      await mail.mailer.idle();
      return delivered.filter((m) => m.to === to).reverse();
    },
    async close() {
      await mail.close();
      await sequelize.close();
      if (!options.database) await database.drop();
    },
  };
}

/**
 * A browser-like caller: keeps its cookie and sends the session's CSRF token on every write. `app` is the
 * Express app (supertest starts it on a passing port per request) or the address of a server already listening.
 */
export class Caller {
  readonly agent: ReturnType<typeof request.agent>;
  token = '';

  constructor(app: Express | string) {
    this.agent = request.agent(app);
  }

  /** Fetches the CSRF token of the current session (again after sign-in and sign-out). */
  async refreshToken(): Promise<string> {
    const res = await this.agent.get('/api/auth/csrf').expect(200);
    this.token = res.body.token;
    return this.token;
  }

  async signIn(email: string, password: string): Promise<this> {
    await this.refreshToken();
    await this.post('/api/auth/login').send({ email, password }).expect(200);
    await this.refreshToken();
    return this;
  }

  /** Signs up as a person would: asks for the account, follows the link mailed to `email`, then signs in. */
  async signUp(email: string, password: string, name: string): Promise<this> {
    await this.refreshToken();
    await this.post('/api/auth/signup').send({ email, password, name }).expect(202);
    const token = await signupTokenMailedTo(email.trim().toLowerCase());
    await this.post('/api/auth/signup/confirm').send({ token }).expect(201);
    return this.signIn(email, password);
  }

  get(url: string) {
    return this.agent.get(url);
  }
  post(url: string) {
    return this.agent.post(url).set('X-CSRF-Token', this.token);
  }
  put(url: string) {
    return this.agent.put(url).set('X-CSRF-Token', this.token);
  }
  patch(url: string) {
    return this.agent.patch(url).set('X-CSRF-Token', this.token);
  }
  delete(url: string) {
    return this.agent.delete(url).set('X-CSRF-Token', this.token);
  }
}

/** The token of the newest sign-up link delivered to `to`, waiting (up to 10 s) for the mail to arrive. */
export async function signupTokenMailedTo(to: string): Promise<string> {
  const deadline = Date.now() + 10_000;
  for (;;) {
    for (let i = delivered.length - 1; i >= 0; i--) {
      const m = delivered[i].to === to ? /\/signup\/confirm\?token=([A-Za-z0-9_-]+)/.exec(delivered[i].text) : null;
      if (m) return m[1];
    }
    if (Date.now() > deadline) throw new Error(`no sign-up link was mailed to ${to}`);
    await new Promise((resolve) => setTimeout(resolve, 10));
  }
}

export const demo = {
  admin: { email: 'admin@demo.test', password: 'demo-admin-2026' },
  instructor: { email: 'instructor@demo.test', password: 'demo-instructor-2026' },
  maker: { email: 'maker@demo.test', password: 'demo-maker-2026' },
  student: { email: 'student@demo.test', password: 'demo-student-2026' },
} as const;

let counter = 0;
/** A new member account, signed in. */
export async function newMember(
  app: Express | string,
  label = 'user',
): Promise<Caller & { email: string; password: string }> {
  counter += 1;
  const email = `${label}-${counter}-${Date.now()}@example.test`;
  const password = `pass-${label}-${counter}-long`;
  const caller = await new Caller(app).signUp(email, password, `${label} ${counter}`);
  return Object.assign(caller, { email, password });
}
