/**
 * Units at the edges of Arcwright. Files, the API and the solver's results are
 * always in millimetres and degrees; the UI may show inches. Radians are used
 * only inside the kinematics core and never leave it.
 */

/** A length in millimetres. */
export type Mm = number;
/** A length in inches (display only). */
export type Inch = number;
/** An angle in degrees. */
export type Deg = number;
/** An angle in radians (inside the kinematics core only). */
export type Rad = number;
/** A spring or wheel rate in newtons per millimetre. */
export type NPerMm = number;

/** A length unit the UI can show. */
export type LengthUnit = 'mm' | 'in';

/** Exact by definition of the international inch (1959). */
export const MM_PER_INCH = 25.4;

/** Converts a length in mm to the given display unit. */
export function mmToUnit(v: Mm, u: LengthUnit): number {
  return u === 'in' ? v / MM_PER_INCH : v;
}

/** Converts a length in the given display unit to mm. */
export function unitToMm(v: number, u: LengthUnit): Mm {
  return u === 'in' ? v * MM_PER_INCH : v;
}

/**
 * Formats a length given in mm in the display unit, e.g. `formatLength(25.4, 'in') === '1.00 in'`.
 * `digits` defaults to 1 for mm and 2 for inches. Non-finite values format as an en dash, so a
 * missing number never shows as "NaN".
 */
export function formatLength(v: Mm, u: LengthUnit, digits?: number): string {
  if (!Number.isFinite(v)) return '–';
  const d = digits ?? (u === 'in' ? 2 : 1);
  const shown = mmToUnit(v, u).toFixed(d);
  // "-0.0" reads as a sign error on a readout.
  const clean = /^-0(\.0+)?$/.test(shown) ? shown.slice(1) : shown;
  return `${clean} ${u}`;
}

/** Degrees to radians. */
export function degToRad(v: Deg): Rad {
  return (v * Math.PI) / 180;
}

/** Radians to degrees. */
export function radToDeg(v: Rad): Deg {
  return (v * 180) / Math.PI;
}
