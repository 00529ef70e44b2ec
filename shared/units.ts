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

/**
 * What kind of number a sweep quantity is, so that it is converted and labelled for display:
 * lengths in mm (the user may see inches), angles in degrees, percentages and plain ratios as
 * they are, rates in N/mm, forces in N, torques in N·m and angular rates in N·m per degree in both
 * unit systems.
 */
export type QuantityKind = 'length' | 'angle' | 'percent' | 'ratio' | 'rate' | 'force' | 'torque' | 'angularRate';

/** A value in the file's unit (mm, deg, %, N/mm, N, N·m) in the display unit, as a number. */
export function quantityToUnit(v: number, q: QuantityKind, u: LengthUnit): number {
  return q === 'length' ? mmToUnit(v, u) : v;
}

/** A display value back to the file's unit. */
export function unitToQuantity(v: number, q: QuantityKind, u: LengthUnit): number {
  return q === 'length' ? unitToMm(v, u) : v;
}

const QUANTITY_UNITS: Record<Exclude<QuantityKind, 'length'>, string> = {
  angle: '°',
  percent: '%',
  ratio: '',
  rate: 'N/mm',
  force: 'N',
  torque: 'N·m',
  angularRate: 'N·m/°',
};

/** The display unit of a quantity kind. */
export function quantityUnitOf(q: QuantityKind, u: LengthUnit): string {
  return q === 'length' ? u : QUANTITY_UNITS[q];
}
