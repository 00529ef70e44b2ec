/**
 * Flags raised along a sweep: shock travel limits, bind over the threshold, driveline
 * joint angles over the limit. Each is found on each side of ride height separately, as
 * the first crossing when marching outward, at the travel (or roll) interpolated linearly
 * between the two rows that straddle the limit.
 */
import type { Sketch } from '../schema/sketch';
import type { HeaveRow, RollRow, SweepEvent } from './types';

type Row = HeaveRow | RollRow;
type SweepKind = 'heave' | 'roll';

const param = (r: Row): number => ('travel' in r ? r.travel : r.roll);

const fmt = (v: number, unit: string) => {
  const s = v.toFixed(unit === 'mm' ? 0 : 1);
  return `${v > 0 ? '+' : ''}${s === '-0' || s === '-0.0' ? s.slice(1) : s} ${unit}`;
};

/**
 * First crossing of `value(row) > limit` going outward along `rows` (ordered from ride
 * outward, ride first). Returns the interpolated parameter and value, or null.
 */
function firstCrossing(
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

/** Rows of one sweep split into the two outward marches, each starting at the 0 row. */
function outward(rows: Row[]): Row[][] {
  const zero = rows.findIndex((r) => param(r) === 0);
  if (zero < 0) return [];
  return [rows.slice(zero), rows.slice(0, zero + 1).reverse()];
}

export function sweepEvents(sketch: Sketch, kind: SweepKind, rows: Row[]): SweepEvent[] {
  const events: SweepEvent[] = [];
  const where = (at: number) => (kind === 'heave' ? `at ${fmt(at, 'mm')} travel` : `at ${fmt(at, '°')} roll`);
  const { bindThreshold, jointAngleLimit } = sketch.sweep;
  const seen = new Set<string>();
  const push = (e: SweepEvent) => {
    // A limit already crossed at ride shows up on both marches; report it once.
    const key = `${e.kind}|${e.member ?? ''}|${e.joint ?? ''}|${e.at}`;
    if (!seen.has(key)) events.push(e);
    seen.add(key);
  };
  for (const side of outward(rows)) {
    for (const m of sketch.members) {
      if (m.kind !== 'shock') continue;
      if (m.maxLength !== undefined) {
        const c = firstCrossing(side, (r) => r.members[m.id]?.length, m.maxLength);
        if (c)
          push({
            kind: 'shock-extended',
            sweep: kind,
            at: c.at,
            member: m.id,
            value: c.value,
            message: `Shock ${m.id} is fully extended (${m.maxLength} mm) ${where(c.at)}.`,
          });
      }
      if (m.minLength !== undefined) {
        const min = m.minLength;
        const c = firstCrossing(
          side,
          (r) => {
            const l = r.members[m.id]?.length;
            return l === undefined ? undefined : -l;
          },
          -min,
        );
        if (c)
          push({
            kind: 'shock-compressed',
            sweep: kind,
            at: c.at,
            member: m.id,
            value: -c.value,
            message: `Shock ${m.id} is fully compressed (${min} mm) ${where(c.at)}.`,
          });
      }
    }
    const b = firstCrossing(side, (r) => r.bind, bindThreshold);
    if (b)
      push({
        kind: 'bind',
        sweep: kind,
        at: b.at,
        value: b.value,
        message: `Bind passes ${bindThreshold} mm ${where(b.at)}: the bushings must take up the links' length mismatch.`,
      });
    if (sketch.driveline) {
      for (const joint of ['output', 'pinion'] as const) {
        const c = firstCrossing(
          side,
          (r) => (joint === 'output' ? r.driveline?.outputAngle : r.driveline?.pinionAngle),
          jointAngleLimit,
        );
        if (c)
          push({
            kind: 'joint-angle',
            sweep: kind,
            at: c.at,
            joint,
            value: c.value,
            message: `The ${joint} joint's operating angle passes ${jointAngleLimit}° ${where(c.at)}.`,
          });
      }
    }
  }
  return events.sort((p, q) => Math.abs(p.at) - Math.abs(q.at) || p.at - q.at);
}
