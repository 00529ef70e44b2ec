import { execFile } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Sequelize } from 'sequelize';
import { Caller, newMember, startTestServer, type TestServer } from './helpers';
import { sketchFile } from './fixtures';
import { createTestDatabase, testDialect, type TestDatabase } from './test-database';
import { loadConfig, type ServerConfig } from '../../server/config';
import { openDatabase } from '../../server/database';
import { migrate } from '../../server/migrations/umzug';
import { createApp } from '../../server/app';
import { setUpMail, type MailSetup } from '../../server/services/mail';
import { backupTo, restoreFrom } from '../../server/services/backup';

const run = promisify(execFile);
const tsx = path.resolve('node_modules/.bin/tsx');

/** The first bytes of a PNG (signature and the start of IHDR): the upload route decides the type from them. */
const png = Buffer.concat([
  Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]),
  Buffer.from('IHDR', 'ascii'),
  Buffer.from([0, 0, 0, 1, 0, 0, 0, 1, 8, 2, 0, 0, 0, 0x90, 0x77, 0x53, 0xde]),
]);

/** Runs `npm run <script> -- file` (each start of tsx takes several seconds on a busy machine) the way the README says, with the server's settings in the environment. */
function npmScript(script: 'backup' | 'restore', config: ServerConfig, file: string) {
  const env: NodeJS.ProcessEnv = { ...process.env, UPLOADS_DIR: config.uploadsDir, DATABASE_PATH: config.databasePath };
  if (config.databaseUrl) env.DATABASE_URL = config.databaseUrl;
  else delete env.DATABASE_URL;
  const entry = { backup: 'server/cli/backup.ts', restore: 'server/cli/restore.ts' }[script];
  return run(tsx, [entry, file], { env, timeout: 60_000 });
}

let live: TestServer;
let backupDir: string;
let target: TestDatabase;
let restored: { sequelize: Sequelize; mail: MailSetup } | undefined;
beforeAll(async () => {
  live = await startTestServer();
  backupDir = fs.mkdtempSync(path.join(os.tmpdir(), 'arcwright-backup-'));
  target = await createTestDatabase();
});
afterAll(async () => {
  await restored?.mail.close();
  await restored?.sequelize.close();
  await live.close();
  await target.drop();
  fs.rmSync(backupDir, { recursive: true, force: true });
});

describe(`backup and restore (${testDialect})`, () => {
  it('copies the live database with its uploads; restored elsewhere, the sketch and its photo read back', async () => {
    const maker = await newMember(live.app, 'backed-up');
    const created = await maker.post('/api/sketches').send({ name: 'Kept through a restore', document: sketchFile() });
    expect(created.status).toBe(201);
    const upload = await maker
      .post(`/api/sketches/${created.body.id}/uploads`)
      .attach('file', png, { filename: 'trace.png', contentType: 'image/png' });
    expect(upload.status).toBe(201);

    // The server keeps running (and its connections open) while the copy is taken.
    const file = path.join(backupDir, 'arcwright.backup');
    const backup = await npmScript('backup', live.config, file);
    // Uploads live in the database: the database's copy carries them, and no folder is left to copy.
    expect(backup.stdout).toContain('no uploaded files to copy');
    expect(fs.statSync(file).size).toBeGreaterThan(0);
    expect(fs.existsSync(`${file}.uploads`)).toBe(false);
    // A second backup to the same name is refused rather than overwriting the first.
    await expect(backupTo(live.sequelize, live.config, file)).rejects.toThrow(/already exists: name a new file/);

    const config = loadConfig({ ...target.env, PUBLIC_URL: 'http://arcwright.example.test' });
    await npmScript('restore', config, file);

    const sequelize = await openDatabase(config);
    const mail = await setUpMail(config);
    restored = { sequelize, mail };
    // The copy carries its migrations: nothing is left to apply.
    expect(await migrate(sequelize)).toEqual([]);
    const app = createApp({ sequelize, config, mailer: mail.mailer });
    const again = await new Caller(app).signIn(maker.email, maker.password);
    const sketch = await again.get(`/api/sketches/${created.body.id}`);
    expect(sketch.status).toBe(200);
    expect(sketch.body.name).toBe('Kept through a restore');
    expect(sketch.body.document).toEqual(created.body.document);
    const photo = await again.get(`/api/uploads/${upload.body.id}`).buffer(true);
    expect(photo.status).toBe(200);
    expect(Buffer.compare(photo.body as Buffer, png)).toBe(0);
  }, 120_000);

  it('refuses to restore over a database that already holds data', async () => {
    await expect(restoreFrom(live.config, path.join(backupDir, 'arcwright.backup'))).rejects.toThrow(
      /already (exists|has tables)/,
    );
  });
});
