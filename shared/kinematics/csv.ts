/**
 * The heave rows of a sweep as CSV (RFC 4180: comma separated, CRLF line ends, quoted
 * where needed). One column per number, named by its path in the JSON result, in the registry's
 * CSV order (csvView). A null (not defined) is an empty cell.
 *
 * Two headers: `heaveRowsCsv` (the command line's) names the columns only and keeps the file's units
 * (mm, deg, %, N/mm, N); `sweepCsv` (the API's download) adds each column's unit to its name,
 * `travel (mm)`, and can give lengths, rates, forces and torques in the inch system.
 */
import type { HeaveRow, SweepResult } from './types';
import { csvView, linkLoadEntry, memberEntries, metricEntry, metricShown } from './metrics/registry';
import { quantityToUnit, quantityUnitOf, type LengthUnit, type QuantityKind } from '../units';

type Column = { name: string; quantity: QuantityKind; get: (r: HeaveRow) => number | null | undefined };

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
      cols.push({
        name: e.csv(id),
        quantity: e.quantity,
        get: (r) => (r.members[id] ? e.read(r.members[id]) : undefined),
      });
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
        cols.push({
          name: linkLoadEntry.csv(id),
          quantity: linkLoadEntry.quantity,
          get: (r) => linkLoadEntry.read(r.linkLoads, id),
        });
    } else {
      const e = metricEntry({ sweep: 'heave', key: item.key });
      if (e.csv === undefined || !metricShown(e, first)) continue;
      cols.push({ name: e.csv, quantity: e.quantity, get: e.read });
    }
  }
  return cols;
}

function csvText(header: string[], rows: string[][]): string {
  const lines = [header.map(quote).join(','), ...rows.map((r) => r.join(','))];
  return lines.join('\r\n') + '\r\n';
}

/** The heave rows of `result` as one CSV text with a header line of column names (the file's units). */
export function heaveRowsCsv(result: SweepResult): string {
  const cols = columns(result);
  return csvText(
    cols.map((c) => c.name),
    result.heave.map((r) => cols.map((c) => cell(c.get(r)))),
  );
}

/** A column's name with its unit in brackets, `travel (mm)`; a plain ratio has no unit and keeps its bare name. */
function withUnit(c: Column, units: LengthUnit): string {
  const unit = quantityUnitOf(c.quantity, units);
  return unit ? `${c.name} (${unit})` : c.name;
}

/**
 * The heave rows of `result` as CSV whose header names each column's unit; with `units` 'in' every
 * length is in inches, rates in lbf/in, forces in lbf, torques in lbf·ft (angles, % and ratios as they are).
 */
export function sweepCsv(result: SweepResult, units: LengthUnit): string {
  const cols = columns(result);
  return csvText(
    cols.map((c) => withUnit(c, units)),
    result.heave.map((r) => cols.map((c) => cell(convert(c.get(r), c.quantity, units)))),
  );
}

function convert(v: number | null | undefined, q: QuantityKind, units: LengthUnit): number | null | undefined {
  return v === null || v === undefined ? v : quantityToUnit(v, q, units);
}
