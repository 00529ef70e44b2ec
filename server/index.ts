import { loadConfig } from './config';
import { describeLocation, openDatabase } from './database';
import { prepareDatabase } from './prepare-database';
import { setUpMail } from './services/mail';
import { purgeDeleted } from './services/uploads';
import { createApp } from './app';
import { listenOn } from './listen';

const PURGE_EVERY_MS = 6 * 3600_000;

/** Opens the database, migrates, seeds, starts the mail catcher (unless SMTP_URL), and listens on PORT (0: any free port). */
async function main(): Promise<void> {
  const config = loadConfig();
  const sequelize = await openDatabase(config);
  const { applied, seeded } = await prepareDatabase(sequelize, config);
  if (applied.length) console.log(`[arcwright] migrations applied: ${applied.join(', ')}`);
  if (seeded) console.log('[arcwright] demo shop, class, accounts and sketches are in place');
  const mail = await setUpMail(config);
  console.log(
    mail.catcher
      ? `[arcwright] mail catcher on 127.0.0.1:${mail.catcher.port} (read it at /admin/outbox)`
      : '[arcwright] mail via SMTP_URL',
  );

  const purge = () => purgeDeleted(config.uploadsDir).catch((err) => console.error('[arcwright] purge failed:', err));
  await purge();
  setInterval(purge, PURGE_EVERY_MS).unref();

  const app = createApp({ sequelize, config, mailer: mail.mailer });
  const server = await listenOn(app, config);
  console.log(
    `[arcwright] listening on http://localhost:${config.port}, links to ${config.publicUrl} (database ${describeLocation(config)})`,
  );

  let closing = false;
  const shutdown = (signal: string) => {
    if (closing) return;
    closing = true;
    console.log(`[arcwright] ${signal}: closing`);
    setTimeout(() => process.exit(0), 5000).unref();
    server.close(() => {
      void mail
        .close()
        .then(() => sequelize.close())
        .finally(() => process.exit(0));
    });
  };
  process.on('SIGINT', () => shutdown('SIGINT'));
  process.on('SIGTERM', () => shutdown('SIGTERM'));
}

main().catch((err) => {
  console.error('[arcwright] failed to start:', err);
  process.exit(1);
});
