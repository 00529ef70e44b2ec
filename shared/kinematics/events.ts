/**
 * Flags raised along a sweep: shock travel limits, bind over the threshold, driveline
 * joint angles over the limit, the driveshaft's own rules (drivelineEvents.ts), and a shock or spring
 * through a wishbone arm (armClash.ts: at the first row where it does, not interpolated). Each
 * is found on each side of ride height separately, as the first crossing when marching
 * outward, at the travel (or roll) interpolated linearly between the two rows that
 * straddle the limit (crossings.ts).
 */
import type { Sketch } from '../schema/sketch';
import { firstCrossing, outward, whereText, type Row, type SweepKind } from './crossings';
import { armClashEvents } from './armClash';
import { drivelineEvents } from './drivelineEvents';
import type { SweepEvent } from './types';

export function sweepEvents(sketch: Sketch, kind: SweepKind, rows: Row[]): SweepEvent[] {
  const events: SweepEvent[] = [];
  const where = (at: number) => whereText(kind, at);
  const { bindThreshold, jointAngleLimit } = sketch.sweep;
  const seen = new Set<string>();
  const push = (e: SweepEvent) => {
    // A limit already crossed at ride shows up on both marches; report it once.
    const key = `${e.kind}|${e.member ?? ''}|${e.joint ?? ''}|${e.end ?? ''}|${e.at}`;
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
      for (const e of drivelineEvents(sketch.driveline, kind, side)) push(e);
    }
  }
  events.push(...armClashEvents(sketch, kind, rows));
  return events.sort((p, q) => Math.abs(p.at) - Math.abs(q.at) || p.at - q.at);
}
