import fs from 'node:fs';
import path from 'node:path';
import { Readable } from 'node:stream';
import type { Transaction } from 'sequelize';
import { Upload, UploadChunk } from '../models';

/** Largest piece of an upload kept in one row (bytes): writing or serving a photo never holds more than this. */
export const UPLOAD_CHUNK_BYTES = 256 * 1024;

/**
 * Where the bytes of uploaded files live. The database is the store (table upload_chunks), so every app
 * instance on it serves every upload; the rules (who may upload or see what, quota, types) are in uploads.ts.
 */
export interface UploadStore {
  /** Stores the bytes of upload `id` read from `source`, in pieces of at most UPLOAD_CHUNK_BYTES; answers the byte count. */
  write(id: string, source: AsyncIterable<Buffer | string>, t: Transaction): Promise<number>;
  /** The bytes of upload `id`, read one piece at a time. */
  read(id: string): Readable;
  /** Whether any bytes are stored for upload `id`. */
  has(id: string): Promise<boolean>;
  /** Deletes the uploads `ids`: their rows and their bytes. */
  remove(ids: string[], t?: Transaction): Promise<number>;
}

export const databaseUploadStore: UploadStore = {
  async write(id, source, t) {
    let seq = 0;
    let total = 0;
    let pending: Buffer[] = [];
    let pendingBytes = 0;
    const flush = async (upTo: number) => {
      const all = Buffer.concat(pending);
      const data = all.subarray(0, upTo);
      const rest = all.subarray(upTo);
      await UploadChunk.create({ uploadId: id, seq, data: Buffer.from(data) }, { transaction: t });
      seq += 1;
      pending = rest.length ? [Buffer.from(rest)] : [];
      pendingBytes = rest.length;
    };
    for await (const piece of source) {
      const buf = typeof piece === 'string' ? Buffer.from(piece) : piece;
      pending.push(buf);
      pendingBytes += buf.length;
      total += buf.length;
      while (pendingBytes >= UPLOAD_CHUNK_BYTES) await flush(UPLOAD_CHUNK_BYTES);
    }
    if (pendingBytes > 0) await flush(pendingBytes);
    return total;
  },

  read(id) {
    return Readable.from(
      (async function* pieces() {
        for (let seq = 0; ; seq++) {
          const chunk = await UploadChunk.findOne({ where: { uploadId: id, seq }, attributes: ['data'] });
          if (!chunk) return;
          yield chunk.data;
        }
      })(),
    );
  },

  async has(id) {
    return (await UploadChunk.count({ where: { uploadId: id } })) > 0;
  },

  async remove(ids, t) {
    if (!ids.length) return 0;
    // The rows would go with their uploads (ON DELETE CASCADE); deleting them first does not rely on it.
    await UploadChunk.destroy({ where: { uploadId: ids }, transaction: t });
    return Upload.destroy({ where: { id: ids }, transaction: t });
  },
};

/**
 * Moves the files of uploads kept in a folder (as UPLOADS_DIR held them before uploads went into the
 * database) into the store, then deletes each file moved. Uploads whose bytes are stored already are left
 * alone, so running it again, or on several instances, does no harm. Answers how many files moved.
 */
export async function importFolderUploads(dir: string, store: UploadStore = databaseUploadStore): Promise<number> {
  if (!fs.existsSync(dir)) return 0;
  let moved = 0;
  for (const upload of await Upload.findAll({ attributes: ['id', 'storedName'] })) {
    const file = path.join(dir, upload.storedName);
    if (!fs.existsSync(file) || (await store.has(upload.id))) continue;
    try {
      await Upload.sequelize!.transaction((t) =>
        store.write(upload.id, fs.createReadStream(file, { highWaterMark: UPLOAD_CHUNK_BYTES }), t),
      );
    } catch (err) {
      // Another instance starting at the same moment moved it first (its pieces are in), or the file is unreadable.
      if (await store.has(upload.id)) continue;
      throw err;
    }
    await fs.promises.rm(file, { force: true });
    moved += 1;
  }
  return moved;
}
