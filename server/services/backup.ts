import fs from 'node:fs';
import path from 'node:path';
import type { Sequelize } from 'sequelize';
import { describeLocation, dialectFor, dialectOf, type DatabaseLocation } from '../database';

/** Where a backup keeps and where a restore takes its uploaded files: beside the database copy. */
export function uploadsCopyOf(file: string): string {
  return `${file}.uploads`;
}

export interface BackupSummary {
  /** The database copy. */
  file: string;
  /** The folder the uploaded files were copied to, or null when there were none. */
  uploadsCopy: string | null;
  /** How many uploaded files were copied. */
  uploads: number;
}

interface UploadsLocation {
  /** UPLOADS_DIR */
  uploadsDir: string;
}

function filesIn(dir: string): string[] {
  return fs.existsSync(dir) ? fs.readdirSync(dir).filter((name) => fs.statSync(path.join(dir, name)).isFile()) : [];
}

/**
 * Copies the live database to `file` (consistent, safe while the server runs) and the uploaded files, when
 * there are any, to `<file>.uploads/`. Uploads are written once under fresh names and never changed, so
 * copying them after the database leaves no row of the copy without its file. Refuses to overwrite anything.
 */
export async function backupTo(
  sequelize: Sequelize,
  config: DatabaseLocation & UploadsLocation,
  file: string,
): Promise<BackupSummary> {
  const target = path.resolve(file);
  const uploadsCopy = uploadsCopyOf(target);
  for (const existing of [target, uploadsCopy]) {
    if (fs.existsSync(existing)) throw new Error(`${existing} already exists: name a new file for the backup`);
  }
  fs.mkdirSync(path.dirname(target), { recursive: true });
  await dialectOf(sequelize).backup(sequelize, config, target);
  const uploads = filesIn(config.uploadsDir);
  if (!uploads.length) return { file: target, uploadsCopy: null, uploads: 0 };
  fs.mkdirSync(uploadsCopy);
  for (const name of uploads) {
    fs.copyFileSync(path.join(config.uploadsDir, name), path.join(uploadsCopy, name), fs.constants.COPYFILE_EXCL);
  }
  return { file: target, uploadsCopy, uploads: uploads.length };
}

/**
 * Loads a backup made by `backupTo` into the configured database (a new SQLite file, or an empty PostgreSQL
 * database) and its uploaded files into UPLOADS_DIR. Run it with the server stopped; start the server after.
 */
export async function restoreFrom(config: DatabaseLocation & UploadsLocation, file: string): Promise<BackupSummary> {
  const source = path.resolve(file);
  if (!fs.existsSync(source)) throw new Error(`${source} does not exist: name the file a backup wrote`);
  await dialectFor(config).restore(config, source);
  const uploadsCopy = uploadsCopyOf(source);
  const uploads = filesIn(uploadsCopy);
  fs.mkdirSync(config.uploadsDir, { recursive: true });
  for (const name of uploads) {
    fs.copyFileSync(path.join(uploadsCopy, name), path.join(config.uploadsDir, name), fs.constants.COPYFILE_EXCL);
  }
  return { file: describeLocation(config), uploadsCopy: uploads.length ? uploadsCopy : null, uploads: uploads.length };
}
