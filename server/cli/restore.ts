/**
 * `npm run restore -- <file>`: loads a copy made by `npm run backup` into the configured database, which
 * must be new (DATABASE_PATH names no file yet) or empty (the database of DATABASE_URL has no tables), and
 * its uploaded files from `<file>.uploads/` into UPLOADS_DIR. Run it with the server stopped, start it after.
 */
import { loadConfig } from '../config';
import { restoreFrom } from '../services/backup';

async function main(): Promise<number> {
  const [file, ...extra] = process.argv.slice(2);
  if (!file || extra.length) {
    console.error('usage: npm run restore -- <file>   (a file written by npm run backup)');
    return 2;
  }
  const config = loadConfig();
  const summary = await restoreFrom(config, file);
  console.log(`[arcwright] restored into ${summary.file}`);
  console.log(`[arcwright] ${summary.uploads} uploaded file(s) restored to ${config.uploadsDir}`);
  return 0;
}

main().then(
  (code) => process.exit(code),
  (err: unknown) => {
    console.error(`[arcwright] restore failed: ${err instanceof Error ? err.message : String(err)}`);
    process.exit(1);
  },
);
