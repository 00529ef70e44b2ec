/**
 * The heave rows of a sweep as CSV (RFC 4180: comma separated, CRLF line ends, quoted
 * where needed). One column per number, named by its path in the JSON result; units as in
 * the result (mm, deg, %, N/mm, N), never the inch-pound units the board may show. A null (not
 * defined) is an empty cell.
 */
import type { HeaveRow, SweepResult } from './types';
import { csvView, linkLoadEntry, memberEntries, metricEntry, metricShown } from './metrics/registry';

type Column = { name: string; get: (r: HeaveRow) => number | null | undefined };

function quote(cell: string): string {
  return /[",\r\n]/.test(cell) ? `"${cell.replace(/"/g, '""')}"` : cell;
}

/** Numbers as JavaScript prints them (shortest exact form), nulls empty. */
function cell(v: number | null | undefined): string {
  return v === null || v === undefined || !Number.isFinite(v) ? '' : String(v);
}

/** Each member's readings in the registry's order; the optional ones where the ride row's reading has them. */
function memberColumns(first: HeaveRow): Column[] {
  const cols: Column[] = [];
  for (const [id, m] of Object.entries(first.members)) {
    for (const e of memberEntries) {
      if (e.given && !e.given(m)) continue;
      cols.push({ name: e.csv(id), get: (r) => (r.members[id] ? e.read(r.members[id]) : undefined) });
    }
  }
  return cols;
}

/**
 * The columns in the registry's CSV order. A metric the sweep gives only for some sketches
 * (independent wheels, driveline, leaf springs, half-shafts) has a column when the ride row carries it.
 */
function columns(result: SweepResult): Column[] {
  const first = result.ride;
  const cols: Column[] = [];
  for (const item of csvView) {
    if (item === '*members') cols.push(...memberColumns(first));
    else if (item === '*linkLoads') {
      for (const id of Object.keys(first.linkLoads ?? {}))
        cols.push({ name: linkLoadEntry.csv(id), get: (r) => linkLoadEntry.read(r.linkLoads, id) });
    } else {
      const e = metricEntry({ sweep: 'heave', key: item.key });
      if (e.csv === undefined || !metricShown(e, first)) continue;
      cols.push({ name: e.csv, get: e.read });
    }
  }
  return cols;
}

/** The heave rows of `result` as one CSV text with a header line. */
export function heaveRowsCsv(result: SweepResult): string {
  const cols = columns(result);
  const lines = [cols.map((c) => quote(c.name)).join(',')];
  for (const r of result.heave) lines.push(cols.map((c) => cell(c.get(r))).join(','));
  return lines.join('\r\n') + '\r\n';
}
