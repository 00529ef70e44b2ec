import { Op } from 'sequelize';
import { MailQueueItem, boundDatabase } from '../models';
import { clearEndedRateCounts } from '../database';
import { purgeDeleted } from './uploads';
import { removeUnusedUploads } from './tracing-uploads';

/** How often every instance runs the housekeeping (ms). */
export const HOUSEKEEPING_EVERY_MS = 6 * 3600_000;
/** Sent and given-up mail stays in the queue table this long, for the record (ms). */
const MAIL_KEPT_MS = 30 * 24 * 3600_000;

/**
 * The periodic clean-up: sketches past the restore window (with their uploads), uploads no sketch places,
 * rate counters whose window has ended, old finished mail. Each step is a delete of rows past a date or by
 * id, so several instances running it at the same moment delete each row once and none fails.
 */
export async function runHousekeeping(now = Date.now()): Promise<void> {
  await purgeDeleted();
  await removeUnusedUploads(now);
  await clearEndedRateCounts(boundDatabase(), now);
  await MailQueueItem.destroy({
    where: { state: { [Op.in]: ['sent', 'failed'] }, updatedAt: { [Op.lt]: new Date(now - MAIL_KEPT_MS) } },
  });
}

/** Runs the housekeeping now and then every HOUSEKEEPING_EVERY_MS, logging failures; answers a stop function. */
export function startHousekeeping(log: (message: string, err: unknown) => void): () => void {
  const run = () => runHousekeeping().catch((err: unknown) => log('[arcwright] housekeeping failed:', err));
  void run();
  const timer = setInterval(run, HOUSEKEEPING_EVERY_MS);
  timer.unref();
  return () => clearInterval(timer);
}
