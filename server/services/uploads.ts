import fs from 'node:fs';
import { randomUUID } from 'node:crypto';
import { fileTypeFromFile } from 'file-type';
import { Op } from 'sequelize';
import { Sketch, Upload, User, type PublicUser } from '../models';
import { HttpError, badRequest, notFound } from '../middleware/http-error';
import { RESTORE_WINDOW_MS, maySeeSketch } from './sketches';
import { UPLOAD_CHUNK_BYTES, databaseUploadStore, type UploadStore } from './upload-store';
import type { UploadInfo } from '../../shared/schema/apiResponses';
import { UPLOAD_IMAGE_TYPES, byteSizeText } from '../../shared/schema/requestLimits';

/** What may be uploaded, decided from the file's first bytes (never from its name or the browser's claim). */
const ALLOWED: Readonly<Record<string, string>> = UPLOAD_IMAGE_TYPES;

/** A received file, spooled to disk by the upload route (never held whole in memory). */
export interface SpooledFile {
  path: string;
  /** Bytes. */
  size: number;
}

/**
 * Stores an image for one of the caller's own sketches under a name the server makes, if the account's
 * uploads stay within `quotaBytes`. The row and its bytes are written in one transaction.
 */
export async function saveUpload(
  user: PublicUser,
  sketchId: number,
  file: SpooledFile | undefined,
  quotaBytes: number,
  store: UploadStore = databaseUploadStore,
): Promise<UploadInfo> {
  const sketch = await Sketch.findOne({
    where: { id: sketchId, ownerId: user.id, deletedAt: null },
    attributes: ['id'],
  });
  if (!sketch) throw notFound('no such sketch');
  if (!file || file.size === 0) throw badRequest('send one PNG or JPEG image in the form field "file"');
  const type = await fileTypeFromFile(file.path);
  const ext = type && ALLOWED[type.mime];
  if (!type || !ext) throw new HttpError(415, 'only PNG and JPEG images can be uploaded');

  const id = randomUUID();
  await Upload.sequelize!.transaction(async (t) => {
    // The account row is locked (PostgreSQL) so two uploads of one account at once cannot both pass the quota.
    await User.findByPk(user.id, { attributes: ['id'], transaction: t, lock: t.LOCK.UPDATE });
    const used = Number(await Upload.sum('size', { where: { ownerId: user.id }, transaction: t })) || 0;
    if (used + file.size > quotaBytes) {
      throw new HttpError(
        413,
        `this file (${byteSizeText(file.size)}) would take the account past its storage quota of ` +
          `${byteSizeText(quotaBytes)} (${byteSizeText(used)} in use); replace or remove tracing photos first`,
      );
    }
    await Upload.create(
      { id, sketchId, ownerId: user.id, mime: type.mime, size: file.size, storedName: `${id}.${ext}` },
      { transaction: t },
    );
    const written = await store.write(id, fs.createReadStream(file.path, { highWaterMark: UPLOAD_CHUNK_BYTES }), t);
    if (written !== file.size) throw new Error(`upload ${id}: ${written} bytes stored of ${file.size}`);
  });
  return { id, url: `/api/uploads/${id}`, mime: type.mime, size: file.size };
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;

/** An upload, if the viewer (or the holder of the sketch's share token) may see its sketch; its bytes come from `store`. */
export async function findUpload(viewer: PublicUser | null, id: string, shareToken?: string) {
  if (!UUID.test(id)) throw notFound('no such file');
  const upload = await Upload.findByPk(id);
  if (!upload || !(await maySeeSketch(viewer, upload.sketchId, shareToken))) throw notFound('no such file');
  return { id: upload.id, mime: upload.mime, size: upload.size };
}

/**
 * Deletes sketches past the restore window; their uploads (rows and bytes) go with them. Returns how many
 * sketches. Every step deletes by id, so instances running it at the same time do no harm.
 */
export async function purgeDeleted(store: UploadStore = databaseUploadStore): Promise<number> {
  const expired = await Sketch.findAll({
    where: { deletedAt: { [Op.lt]: new Date(Date.now() - RESTORE_WINDOW_MS) } },
    attributes: ['id'],
  });
  if (!expired.length) return 0;
  const ids = expired.map((s) => s.id);
  const uploads = await Upload.findAll({ where: { sketchId: ids }, attributes: ['id'] });
  await store.remove(uploads.map((u) => u.id));
  return Sketch.destroy({ where: { id: ids } });
}
