import { loadConfig } from './config';
import { describeLocation, openDatabase } from './database';
import { prepareDatabase } from './prepare-database';
import { setUpMail } from './services/mail';
import { startHousekeeping } from './services/housekeeping';
import { importFolderUploads } from './services/upload-store';
import { createApp } from './app';
import { listenOn } from './listen';
import { RequestGate, SHUTDOWN_GRACE_MS, shutDown } from './shutdown';

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

  const moved = await importFolderUploads(config.uploadsDir);
  if (moved) console.log(`[arcwright] ${moved} uploaded files moved from ${config.uploadsDir} into the database`);
  const stopHousekeeping = startHousekeeping((message, err) => console.error(message, err));

  const gate = new RequestGate();
  const app = createApp({ sequelize, config, mailer: mail.mailer, gate });
  const server = await listenOn(app, config);
  console.log(
    `[arcwright] listening on http://localhost:${config.port}, links to ${config.publicUrl} (database ${describeLocation(config)})`,
  );

  let closing = false;
  const shutdown = (signal: string) => {
    if (closing) return;
    closing = true;
    console.log(`[arcwright] ${signal}: closing (waiting for ${gate.inFlight} requests in flight)`);
    // Should a step hang, the process ends anyway a little after the grace period.
    setTimeout(() => process.exit(0), SHUTDOWN_GRACE_MS + 5000).unref();
    shutDown({
      server,
      gate,
      stopTimers: stopHousekeeping,
      closeMail: () => mail.close(),
      closeDatabase: () => sequelize.close(),
    })
      .then((drained) => {
        if (!drained) console.warn('[arcwright] some requests were still running at the end of the grace period');
      })
      .catch((err: unknown) => console.error('[arcwright] shutdown failed:', err))
      .finally(() => process.exit(0));
  };
  process.on('SIGINT', () => shutdown('SIGINT'));
  process.on('SIGTERM', () => shutdown('SIGTERM'));
}

main().catch((err) => {
  console.error('[arcwright] failed to start:', err);
  process.exit(1);
});
