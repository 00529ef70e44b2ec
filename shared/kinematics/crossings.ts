/**
 * Where a reading first passes a limit along a sweep, for the flags (events.ts): each side of ride
 * height is marched outward from ride, and the crossing is interpolated linearly between the two rows
 * that straddle the limit.
 */
import type { HeaveRow, RollRow } from './types';

export type Row = HeaveRow | RollRow;
export type SweepKind = 'heave' | 'roll';

/** mm of travel (heave) or degrees of roll (roll). */
export const param = (r: Row): number => ('travel' in r ? r.travel : r.roll);

const fmt = (v: number, unit: string) => {
  const s = v.toFixed(unit === 'mm' ? 0 : 1);
  return `${v > 0 ? '+' : ''}${s === '-0' || s === '-0.0' ? s.slice(1) : s} ${unit}`;
};

/** "at +35 mm travel" / "at -4.0 ° roll": where an event starts, for its message. */
export function whereText(kind: SweepKind, at: number): string {
  return kind === 'heave' ? `at ${fmt(at, 'mm')} travel` : `at ${fmt(at, '°')} roll`;
}

/**
 * First crossing of `value(row) > limit` going outward along `rows` (ordered from ride
 * outward, ride first). Returns the interpolated parameter and value, or null.
 */
export function firstCrossing(
  rows: Row[],
  value: (r: Row) => number | undefined,
  limit: number,
): { at: number; value: number } | null {
  let prev: Row | null = null;
  for (const r of rows) {
    const v = value(r);
    if (v === undefined) return null;
    if (v > limit) {
      if (!prev) return { at: param(r), value: v };
      const pv = value(prev)!;
      const t = (limit - pv) / (v - pv);
      return { at: param(prev) + t * (param(r) - param(prev)), value: limit };
    }
    prev = r;
  }
  return null;
}

/** First crossing of `value(row) < limit` going outward: the same march, read upside down. */
export function firstCrossingBelow(
  rows: Row[],
  value: (r: Row) => number | undefined,
  limit: number,
): { at: number; value: number } | null {
  const c = firstCrossing(
    rows,
    (r) => {
      const v = value(r);
      return v === undefined ? undefined : -v;
    },
    -limit,
  );
  return c && { at: c.at, value: -c.value };
}

/** Rows of one sweep split into the two outward marches, each starting at the 0 row. */
export function outward(rows: Row[]): Row[][] {
  const zero = rows.findIndex((r) => param(r) === 0);
  if (zero < 0) return [];
  return [rows.slice(zero), rows.slice(0, zero + 1).reverse()];
}
