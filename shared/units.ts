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
 * Exact by definition: the international avoirdupois pound is 0.45359237 kg (international yard and
 * pound agreement, 1959) and standard gravity 9.80665 m/s² (3rd CGPM, 1901), so 1 lbf = 4.4482216152605 N.
 */
export const N_PER_LBF = 4.4482216152605;

/** A foot in metres, exact by the same 1959 agreement (12 × 25.4 mm). */
export const M_PER_FOOT = 0.3048;

/**
 * N·m in one lbf·ft: a pound-force acting at a foot, 4.4482216152605 × 0.3048 = 1.3558179483314004 exactly
 * (the floating-point product is the nearest double to it).
 */
export const NM_PER_LBF_FT = N_PER_LBF * M_PER_FOOT;

/**
 * What kind of number a sweep quantity is, so that it is converted and labelled for display:
 * lengths in mm, rates in N/mm, forces in N, torques in N·m and angular rates in N·m per degree
 * (inches, lbf/in, lbf, lbf·ft and lbf·ft per degree when the user picks inches); angles in
 * degrees, percentages and plain ratios as they are in both unit systems.
 */
export type QuantityKind = 'length' | 'angle' | 'percent' | 'ratio' | 'rate' | 'force' | 'torque' | 'angularRate';

interface QuantityUnits {
  /** the unit the file, the API and the CSV use (shown when the user picks mm) */
  file: string;
  /** the unit shown when the user picks inches */
  inch: string;
  /** how many file units one inch-system unit is */
  filePerInch: number;
}

/** One conversion per quantity kind: the only place a display unit of a sweep quantity is defined. */
const QUANTITY_UNITS: Record<QuantityKind, QuantityUnits> = {
  length: { file: 'mm', inch: 'in', filePerInch: MM_PER_INCH },
  angle: { file: '°', inch: '°', filePerInch: 1 },
  percent: { file: '%', inch: '%', filePerInch: 1 },
  ratio: { file: '', inch: '', filePerInch: 1 },
  // N/mm per lbf/in: a pound-force over an inch.
  rate: { file: 'N/mm', inch: 'lbf/in', filePerInch: N_PER_LBF / MM_PER_INCH },
  force: { file: 'N', inch: 'lbf', filePerInch: N_PER_LBF },
  torque: { file: 'N·m', inch: 'lbf·ft', filePerInch: NM_PER_LBF_FT },
  angularRate: { file: 'N·m/°', inch: 'lbf·ft/°', filePerInch: NM_PER_LBF_FT },
};

/** A value in the file's unit (mm, deg, %, N/mm, N, N·m) in the display unit, as a number. */
export function quantityToUnit(v: number, q: QuantityKind, u: LengthUnit): number {
  if (u === 'mm') return v;
  const f = QUANTITY_UNITS[q].filePerInch;
  return f === 1 ? v : v / f;
}

/** A display value back to the file's unit. */
export function unitToQuantity(v: number, q: QuantityKind, u: LengthUnit): number {
  return u === 'mm' ? v : v * QUANTITY_UNITS[q].filePerInch;
}

/** The display unit of a quantity kind. */
export function quantityUnitOf(q: QuantityKind, u: LengthUnit): string {
  return u === 'in' ? QUANTITY_UNITS[q].inch : QUANTITY_UNITS[q].file;
}

/** The unit a quantity kind has in files, the API and the CSV export, whatever the user shows. */
export function quantityFileUnit(q: QuantityKind): string {
  return QUANTITY_UNITS[q].file;
}
