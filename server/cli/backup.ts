/**
 * `npm run backup -- <file>`: a consistent copy of the live database (the server may keep running) in
 * `<file>`, and the uploaded files in `<file>.uploads/`. Reads the same settings as the server
 * (DATABASE_URL, or DATABASE_PATH; UPLOADS_DIR). Exits 2 with one line on stderr for a bad call.
 */
import { loadConfig } from '../config';
import { describeLocation, openDatabase } from '../database';
import { backupTo } from '../services/backup';

async function main(): Promise<number> {
  const [file, ...extra] = process.argv.slice(2);
  if (!file || extra.length) {
    console.error('usage: npm run backup -- <file>   (writes <file>, and <file>.uploads/ when there are uploads)');
    return 2;
  }
  const config = loadConfig();
  const sequelize = await openDatabase(config);
  try {
    const summary = await backupTo(sequelize, config, file);
    console.log(`[arcwright] database ${describeLocation(config)} copied to ${summary.file}`);
    console.log(
      summary.uploadsCopy
        ? `[arcwright] ${summary.uploads} uploaded file(s) copied to ${summary.uploadsCopy}`
        : '[arcwright] no uploaded files to copy',
    );
    return 0;
  } finally {
    await sequelize.close();
  }
}

main().then(
  (code) => process.exit(code),
  (err: unknown) => {
    console.error(`[arcwright] backup failed: ${err instanceof Error ? err.message : String(err)}`);
    process.exit(1);
  },
);
