import { loadConfig } from './config';
import { openDatabase } from './db';
import { migrate } from './migrations/umzug';
import { seedDemoData } from './seed';
import { createApp } from './app';

/** Opens the database, migrates, seeds, and listens on PORT. */
async function main(): Promise<void> {
  const config = loadConfig();
  const sequelize = await openDatabase(config.databasePath);
  const applied = await migrate(sequelize);
  if (applied.length) console.log(`[arcwright] migrations applied: ${applied.join(', ')}`);
  await seedDemoData(sequelize);

  const app = createApp({ sequelize, config });
  const server = app.listen(config.port, () => {
    console.log(`[arcwright] listening on http://localhost:${config.port} (database ${config.databasePath})`);
  });

  const shutdown = (signal: string) => {
    console.log(`[arcwright] ${signal}: closing`);
    server.close(() => {
      void sequelize.close().finally(() => process.exit(0));
    });
    setTimeout(() => process.exit(0), 5000).unref();
  };
  process.on('SIGINT', () => shutdown('SIGINT'));
  process.on('SIGTERM', () => shutdown('SIGTERM'));
}

main().catch((err) => {
  console.error('[arcwright] failed to start:', err);
  process.exit(1);
});
