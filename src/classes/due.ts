/**
 * Due dates as people type and read them: a date and a time of day in the browser's own time zone, sent
 * as an ISO instant; shown back with how far away they are. Pure (the present is passed in).
 */

/** The ISO instant of a local date ("2026-12-18") and time ("17:00"), or why they are not one. */
export function dueFromInputs(
  date: string,
  time: string,
  now: Date,
): { ok: true; iso: string } | { ok: false; problem: string } {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(date.trim())) return { ok: false, problem: 'Due date: pick a day.' };
  if (!/^\d{2}:\d{2}$/.test(time.trim())) return { ok: false, problem: 'Due time: pick a time of day.' };
  const at = new Date(`${date.trim()}T${time.trim()}:00`);
  if (Number.isNaN(at.getTime())) return { ok: false, problem: `Due: “${date} ${time}” is not a date and time.` };
  if (at.getTime() <= now.getTime()) return { ok: false, problem: 'Due: the date and time must lie in the future.' };
  return { ok: true, iso: at.toISOString() };
}

const DAY_MS = 24 * 3600 * 1000;
const HOUR_MS = 3600 * 1000;

/** How far away an instant is, in words: "in 3 days", "in 5 hours", "2 days ago", "now". */
export function howFar(iso: string, now: Date): string {
  const diff = Date.parse(iso) - now.getTime();
  const abs = Math.abs(diff);
  const words =
    abs >= DAY_MS
      ? `${Math.round(abs / DAY_MS)} day${Math.round(abs / DAY_MS) === 1 ? '' : 's'}`
      : abs >= HOUR_MS
        ? `${Math.round(abs / HOUR_MS)} hour${Math.round(abs / HOUR_MS) === 1 ? '' : 's'}`
        : abs >= 60_000
          ? `${Math.round(abs / 60_000)} min`
          : '';
  if (!words) return 'now';
  return diff > 0 ? `in ${words}` : `${words} ago`;
}

/** A date and time as the pages write them, in the browser's locale and time zone. */
export function whenText(iso: string): string {
  return new Date(iso).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' });
}

/** A due date with how far away it is: "12 Dec 2026, 17:00 (in 6 days)". */
export function dueText(iso: string, now: Date): string {
  return `${whenText(iso)} (${howFar(iso, now)})`;
}
