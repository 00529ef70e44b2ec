import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import type { Sequelize } from 'sequelize';
import { loadConfig, type ServerConfig } from '../../server/config';
import { openDatabase } from '../../server/db';
import { migrate } from '../../server/migrations/umzug';
import { seedDemoData } from '../../server/seed';
import { createApp } from '../../server/app';

export interface TestServer {
  app: Express;
  sequelize: Sequelize;
  config: ServerConfig;
  dir: string;
  close(): Promise<void>;
}

/**
 * A fresh app on its own temporary database FILE (not :memory:, which would hide the
 * per-transaction connections), migrated and seeded with the demo accounts.
 */
export async function startTestServer(env: Record<string, string> = {}): Promise<TestServer> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'arcwright-api-'));
  const config = loadConfig({
    DATABASE_PATH: path.join(dir, 'test.sqlite'),
    UPLOADS_DIR: path.join(dir, 'uploads'),
    PUBLIC_URL: 'http://arcwright.example.test',
    DIST_DIR: path.join(dir, 'no-dist'),
    ...env,
  });
  const sequelize = await openDatabase(config.databasePath);
  await migrate(sequelize);
  await seedDemoData(sequelize);
  const app = createApp({ sequelize, config });
  return {
    app, sequelize, config, dir,
    async close() {
      await sequelize.close();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}
