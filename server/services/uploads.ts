import fs from 'node:fs/promises';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import { fileTypeFromBuffer } from 'file-type';
import { Op } from 'sequelize';
import { Sketch, Upload, type PublicUser } from '../models';
import { HttpError, badRequest, notFound } from '../middleware/http-error';
import { RESTORE_WINDOW_MS, maySeeSketch } from './sketches';
import type { UploadInfo } from '../../shared/schema/apiResponses';
import { UPLOAD_IMAGE_TYPES } from '../../shared/schema/requestLimits';

/** What may be uploaded, decided from the file's first bytes (never from its name or the browser's claim). */
const ALLOWED: Readonly<Record<string, string>> = UPLOAD_IMAGE_TYPES;

/** Stores an image for one of the caller's own sketches under a name the server makes. */
export async function saveUpload(
  uploadsDir: string,
  user: PublicUser,
  sketchId: number,
  bytes: Buffer | undefined,
): Promise<UploadInfo> {
  const sketch = await Sketch.findOne({
    where: { id: sketchId, ownerId: user.id, deletedAt: null },
    attributes: ['id'],
  });
  if (!sketch) throw notFound('no such sketch');
  if (!bytes || bytes.length === 0) throw badRequest('send one PNG or JPEG image in the form field "file"');
  const type = await fileTypeFromBuffer(bytes);
  const ext = type && ALLOWED[type.mime];
  if (!type || !ext) throw new HttpError(415, 'only PNG and JPEG images can be uploaded');

  const id = randomUUID();
  const storedName = `${id}.${ext}`;
  await fs.mkdir(uploadsDir, { recursive: true });
  const file = path.join(uploadsDir, storedName);
  await fs.writeFile(file, bytes, { flag: 'wx', mode: 0o600 });
  try {
    await Upload.create({ id, sketchId, ownerId: user.id, mime: type.mime, size: bytes.length, storedName });
  } catch (err) {
    await fs.rm(file, { force: true });
    throw err;
  }
  return { id, url: `/api/uploads/${id}`, mime: type.mime, size: bytes.length };
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;

/** The file behind an upload id, if the viewer (or the holder of the sketch's share token) may see its sketch. */
export async function findUpload(uploadsDir: string, viewer: PublicUser | null, id: string, shareToken?: string) {
  if (!UUID.test(id)) throw notFound('no such file');
  const upload = await Upload.findByPk(id);
  if (!upload || !(await maySeeSketch(viewer, upload.sketchId, shareToken))) throw notFound('no such file');
  return { file: path.join(uploadsDir, upload.storedName), mime: upload.mime, size: upload.size };
}

/** Deletes sketches past the restore window together with their files on disk. Returns how many sketches. */
export async function purgeDeleted(uploadsDir: string): Promise<number> {
  const expired = await Sketch.findAll({
    where: { deletedAt: { [Op.lt]: new Date(Date.now() - RESTORE_WINDOW_MS) } },
    attributes: ['id'],
  });
  if (!expired.length) return 0;
  const ids = expired.map((s) => s.id);
  const files = await Upload.findAll({ where: { sketchId: ids }, attributes: ['storedName'] });
  const removed = await Sketch.destroy({ where: { id: ids } });
  await Promise.all(files.map((f) => fs.rm(path.join(uploadsDir, f.storedName), { force: true })));
  return removed;
}
