import { Op, type Transaction } from 'sequelize';
import { Sketch, Upload } from '../models';
import { databaseUploadStore } from './upload-store';

/** The upload ids a stored sketch document places as tracing photos (none when it has no tracing). */
export function tracingUploadIds(document: string): string[] {
  let doc: unknown;
  try {
    doc = JSON.parse(document);
  } catch {
    return [];
  }
  const tracing = (doc as { tracing?: Record<string, { upload?: unknown } | undefined> } | null)?.tracing;
  if (!tracing || typeof tracing !== 'object') return [];
  return Object.values(tracing)
    .map((photo) => photo?.upload)
    .filter((id): id is string | number => typeof id === 'string' || typeof id === 'number')
    .map(String);
}

/** Whether a sketch other than `sketchId` places upload `id` in its current document (a copy of the sketch does). */
async function placedElsewhere(id: string, sketchId: number, t?: Transaction): Promise<boolean> {
  const count = await Sketch.count({
    where: { id: { [Op.ne]: sketchId }, document: { [Op.like]: `%${id}%` } },
    transaction: t,
  });
  return count > 0;
}

/**
 * Deletes the photos a save took out of sketch `sketchId`: placed in its document `before`, no longer in
 * `after`, and placed by no other sketch. Earlier revisions that placed them then show no photo.
 */
export async function removeReplacedUploads(
  sketchId: number,
  before: string,
  after: string,
  t: Transaction,
): Promise<number> {
  const kept = new Set(tracingUploadIds(after));
  const gone = tracingUploadIds(before).filter((id) => !kept.has(id));
  if (!gone.length) return 0;
  const own = await Upload.findAll({ where: { id: gone, sketchId }, attributes: ['id'], transaction: t });
  const removable: string[] = [];
  for (const upload of own) if (!(await placedElsewhere(upload.id, sketchId, t))) removable.push(upload.id);
  return databaseUploadStore.remove(removable, t);
}

/** An upload that no sketch places for this long after it arrived is not going to be placed (ms). */
export const UNUSED_UPLOAD_GRACE_MS = 24 * 3600_000;
/** Uploads looked at per housekeeping run. */
const UNUSED_BATCH = 500;

/**
 * Deletes uploads older than UNUSED_UPLOAD_GRACE_MS that neither their sketch nor any other places as a
 * tracing photo. Deleting by id is idempotent, so every instance may run it.
 */
export async function removeUnusedUploads(now = Date.now()): Promise<number> {
  let removed = 0;
  // Pages by id: the placed uploads stay and are stepped over, the unused ones go.
  for (let after = ''; ;) {
    const page = await Upload.findAll({
      where: { createdAt: { [Op.lt]: new Date(now - UNUSED_UPLOAD_GRACE_MS) }, id: { [Op.gt]: after } },
      include: [{ model: Sketch, attributes: ['document'] }],
      attributes: ['id', 'sketchId'],
      order: [['id', 'ASC']],
      limit: UNUSED_BATCH,
    });
    if (!page.length) return removed;
    after = page[page.length - 1].id;
    const unused: string[] = [];
    for (const upload of page) {
      const sketch = (upload as Upload & { Sketch?: Sketch }).Sketch;
      if (sketch && tracingUploadIds(sketch.document).includes(upload.id)) continue;
      if (await placedElsewhere(upload.id, upload.sketchId)) continue;
      unused.push(upload.id);
    }
    removed += await databaseUploadStore.remove(unused);
  }
}
