/**
 * The hardpoint table: a sketch's pivots as CSV for CAD and back (docs/sketch-format.md, "Hardpoint table").
 * One row per pivot in the sketch's order: `id`, `body`, then `x`, `y`, `z` in the sketch's axes, each
 * coordinate column naming its unit in brackets (`x (mm)` or `x (in)`). RFC 4180: comma separated, CRLF
 * line ends, quoted where needed.
 */
import type { Sketch } from '../schema/sketch';
import { mmToUnit, type LengthUnit } from '../units';

export const HARDPOINT_AXES = ['x', 'y', 'z'] as const;
export type HardpointAxis = (typeof HARDPOINT_AXES)[number];

/**
 * Digits after the point written per unit: 0.0001 mm, 0.000001 in (0.0000254 mm), both far below what a
 * fabricator can hold, so a table read back moves nothing (see IMPORT_TOLERANCE_MM).
 */
export const HARDPOINT_DIGITS: Record<LengthUnit, number> = { mm: 4, in: 6 };

function quote(cell: string): string {
  return /[",\r\n]/.test(cell) ? `"${cell.replace(/"/g, '""')}"` : cell;
}

/** A coordinate (mm) in `units`, rounded to the table's digits, never "-0". */
export function hardpointNumber(v: number, units: LengthUnit): string {
  const rounded = Number(mmToUnit(v, units).toFixed(HARDPOINT_DIGITS[units]));
  return String(rounded === 0 ? 0 : rounded);
}

/** The coordinate column's header, `x (mm)`. */
export function hardpointColumn(axis: HardpointAxis, units: LengthUnit): string {
  return `${axis} (${units})`;
}

/** The pivots of `sketch` as a hardpoint table in `units`. */
export function hardpointsCsv(sketch: Pick<Sketch, 'points'>, units: LengthUnit): string {
  const header = ['id', 'body', ...HARDPOINT_AXES.map((a) => hardpointColumn(a, units))];
  const rows = sketch.points.map((p) => [
    quote(p.id),
    quote(p.body),
    ...HARDPOINT_AXES.map((a) => hardpointNumber(p[a], units)),
  ]);
  return [header.join(','), ...rows.map((r) => r.join(','))].join('\r\n') + '\r\n';
}
