/**
 * The heave rows of a sweep as CSV (RFC 4180: comma separated, CRLF line ends, quoted
 * where needed). One column per number, named by its path in the JSON result; units as in
 * the result (mm, deg, %, N/mm). A null (not defined) is an empty cell.
 */
import type { HeaveRow, SweepResult } from './types';

type Column = { name: string; get: (r: HeaveRow) => number | null | undefined };

function quote(cell: string): string {
  return /[",\r\n]/.test(cell) ? `"${cell.replace(/"/g, '""')}"` : cell;
}

/** Numbers as JavaScript prints them (shortest exact form), nulls empty. */
function cell(v: number | null | undefined): string {
  return v === null || v === undefined || !Number.isFinite(v) ? '' : String(v);
}

function columns(result: SweepResult): Column[] {
  const first = result.ride;
  const cols: Column[] = [
    { name: 'travel', get: (r) => r.travel },
    ...(['x', 'y', 'z', 'roll', 'pitch', 'yaw'] as const).map((k) => ({
      name: `pose.${k}`,
      get: (r: HeaveRow) => r.pose[k],
    })),
    { name: 'pinionAngleChange', get: (r) => r.pinionAngleChange },
    { name: 'lateralShift', get: (r) => r.lateralShift },
    { name: 'foreAftShift', get: (r) => r.foreAftShift },
    { name: 'instantCenter.x', get: (r) => r.instantCenter?.x ?? null },
    { name: 'instantCenter.z', get: (r) => r.instantCenter?.z ?? null },
    { name: 'antiSquat', get: (r) => r.antiSquat },
    { name: 'rollCenterHeight', get: (r) => r.rollCenterHeight },
    { name: 'bind', get: (r) => r.bind },
  ];
  for (const [id, m] of Object.entries(first.members)) {
    cols.push({ name: `members.${id}.length`, get: (r) => r.members[id]?.length });
    cols.push({ name: `members.${id}.lengthChange`, get: (r) => r.members[id]?.lengthChange });
    if (m.motionRatio !== undefined)
      cols.push({ name: `members.${id}.motionRatio`, get: (r) => r.members[id]?.motionRatio });
    if (m.wheelRate !== undefined) cols.push({ name: `members.${id}.wheelRate`, get: (r) => r.members[id]?.wheelRate });
  }
  // Independent wheels (addition): present when the ride row carries them.
  const optional: Column[] = [
    { name: 'camberChange', get: (r) => r.camberChange },
    { name: 'toeChange', get: (r) => r.toeChange },
    { name: 'trackChange', get: (r) => r.trackChange },
    { name: 'casterChange', get: (r) => r.casterChange },
    { name: 'frontViewInstantCenter.y', get: (r) => r.frontViewInstantCenter?.y ?? null },
    { name: 'frontViewInstantCenter.z', get: (r) => r.frontViewInstantCenter?.z ?? null },
    { name: 'antiDive', get: (r) => r.antiDive },
    { name: 'kingpin.inclination', get: (r) => r.kingpin?.inclination ?? null },
    { name: 'kingpin.caster', get: (r) => r.kingpin?.caster ?? null },
    { name: 'kingpin.scrubRadius', get: (r) => r.kingpin?.scrubRadius ?? null },
    { name: 'kingpin.trail', get: (r) => r.kingpin?.trail ?? null },
  ];
  const present: Record<string, boolean> = {
    camberChange: first.camberChange !== undefined,
    toeChange: first.toeChange !== undefined,
    trackChange: first.trackChange !== undefined,
    casterChange: first.casterChange !== undefined,
    frontViewInstantCenter: first.frontViewInstantCenter !== undefined,
    antiDive: first.antiDive !== undefined,
    kingpin: first.kingpin !== undefined,
  };
  cols.push(...optional.filter((c) => present[c.name.split('.')[0]]));
  if (first.driveline) {
    for (const k of ['length', 'plunge', 'outputAngle', 'pinionAngle'] as const) {
      cols.push({ name: `driveline.${k}`, get: (r) => r.driveline?.[k] });
    }
  }
  // Leaf springs, half-shafts and link loads (additions): present when the ride row carries them.
  if (first.shackleAngle !== undefined) cols.push({ name: 'shackleAngle', get: (r) => r.shackleAngle });
  for (const side of ['left', 'right'] as const) {
    if (!first.halfShafts?.[side]) continue;
    for (const k of ['length', 'plunge', 'innerAngle', 'outerAngle'] as const) {
      cols.push({ name: `halfShafts.${side}.${k}`, get: (r) => r.halfShafts?.[side]?.[k] });
    }
  }
  for (const id of Object.keys(first.linkLoads ?? {}))
    cols.push({ name: `linkLoads.${id}`, get: (r) => r.linkLoads?.[id] });
  return cols;
}

/** The heave rows of `result` as one CSV text with a header line. */
export function heaveRowsCsv(result: SweepResult): string {
  const cols = columns(result);
  const lines = [cols.map((c) => quote(c.name)).join(',')];
  for (const r of result.heave) lines.push(cols.map((c) => cell(c.get(r))).join(','));
  return lines.join('\r\n') + '\r\n';
}
