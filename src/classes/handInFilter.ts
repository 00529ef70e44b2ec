/** Which hand-ins the assignment page's table shows: a text search over the student's name, late ones only, flagged ones only. Pure. */
import type { HandInRow } from '../../shared/schema/classes';

export interface HandInFilter {
  /** part of the student's name, any case */
  text: string;
  lateOnly: boolean;
  withFlags: boolean;
}

export function filterHandIns(rows: readonly HandInRow[], f: HandInFilter): HandInRow[] {
  const needle = f.text.trim().toLocaleLowerCase();
  return rows.filter(
    (r) =>
      (!needle || r.student.name.toLocaleLowerCase().includes(needle)) &&
      (!f.lateOnly || r.late) &&
      (!f.withFlags || r.flagCount > 0),
  );
}
