/**
 * How the board writes sweep numbers: lengths, rates, forces and torques in the user's unit
 * system (mm, N/mm, N, N·m or in, lbf/in, lbf, lbf·ft), angles in degrees, anti-squat and
 * roll steer in %. A number that does not exist is "—" with the reason
 * beside it, never "NaN".
 */
import {
  formatLength,
  mmToUnit,
  quantityToUnit,
  quantityUnitOf,
  unitToQuantity,
  type LengthUnit,
  type Mm,
  type QuantityKind,
} from '../units';
import type { MetricEntry } from '../kinematics/metrics/registry';

/** Shown for a number that does not exist; the reason goes to the tooltip. */
export const MISSING = '—';

export interface Shown {
  text: string;
  /** why the number is missing (tooltip); absent when it is shown */
  reason?: string;
}

const MINUS = '\u2212';

/** Fixed digits with a true minus sign, and no "-0.0". */
export function fixed(v: number, digits: number, signed = false): string {
  let s = v.toFixed(digits);
  if (/^-0(\.0+)?$/.test(s)) s = s.slice(1);
  if (s.startsWith('-')) return MINUS + s.slice(1);
  return signed && v > 0 && Number(s) !== 0 ? `+${s}` : s;
}

function missing(reason: string): Shown {
  return { text: MISSING, reason };
}

/** A length in mm shown in the user's unit. */
export function showLength(
  v: Mm | null | undefined,
  u: LengthUnit,
  reason = 'not defined here',
  signed = false,
): Shown {
  if (v === null || v === undefined || !Number.isFinite(v)) return missing(reason);
  if (!signed) return { text: formatLength(v, u) };
  return { text: `${fixed(mmToUnit(v, u), u === 'in' ? 2 : 1, true)} ${u}` };
}

/** An angle in degrees. */
export function showAngle(
  v: number | null | undefined,
  reason = 'not defined here',
  signed = false,
  digits = 2,
): Shown {
  if (v === null || v === undefined || !Number.isFinite(v)) return missing(reason);
  return { text: `${fixed(v, digits, signed)}°` };
}

/** A percentage (anti-squat, roll steer). */
export function showPercent(v: number | null | undefined, reason = 'not defined here', signed = false): Shown {
  if (v === null || v === undefined || !Number.isFinite(v)) return missing(reason);
  return { text: `${fixed(v, 1, signed)} %` };
}

/** A plain ratio (motion ratio). */
export function showRatio(v: number | null | undefined, reason = 'not defined here'): Shown {
  if (v === null || v === undefined || !Number.isFinite(v)) return missing(reason);
  return { text: fixed(v, 3) };
}

/** A rate given in N/mm (wheel rate) in the user's unit system: N/mm or lbf/in. */
export function showRate(v: number | null | undefined, u: LengthUnit, reason = 'not defined here'): Shown {
  if (v === null || v === undefined || !Number.isFinite(v)) return missing(reason);
  return { text: `${fixed(quantityToUnit(v, 'rate', u), 1)} ${quantityUnitOf('rate', u)}` };
}

/** A force given in N in the user's unit system (N or lbf), whole units; tension positive where signed. */
export function showForce(
  v: number | null | undefined,
  u: LengthUnit,
  reason = 'not defined here',
  signed = false,
): Shown {
  if (v === null || v === undefined || !Number.isFinite(v)) return missing(reason);
  return { text: `${fixed(quantityToUnit(v, 'force', u), 0, signed)} ${quantityUnitOf('force', u)}` };
}

/** A torque given in N·m in the user's unit system (N·m or lbf·ft), whole units. */
export function showTorque(v: number | null | undefined, u: LengthUnit, reason = 'not defined here'): Shown {
  if (v === null || v === undefined || !Number.isFinite(v)) return missing(reason);
  return { text: `${fixed(quantityToUnit(v, 'torque', u), 0)} ${quantityUnitOf('torque', u)}` };
}

/** An angular rate given in N·m per degree (wind-up rate) in N·m/° or lbf·ft/°, whole units. */
export function showAngularRate(v: number | null | undefined, u: LengthUnit, reason = 'not defined here'): Shown {
  if (v === null || v === undefined || !Number.isFinite(v)) return missing(reason);
  return { text: `${fixed(quantityToUnit(v, 'angularRate', u), 0)} ${quantityUnitOf('angularRate', u)}` };
}

/** A value of a target metric (file unit) in the user's unit, angles to one digit. */
export function showQuantity(v: number | null | undefined, q: QuantityKind, u: LengthUnit, signed = false): Shown {
  if (q === 'length') return showLength(v, u, undefined, signed);
  if (q === 'angle') return showAngle(v, undefined, signed, 1);
  if (q === 'ratio') return showRatio(v);
  if (q === 'rate') return showRate(v, u);
  if (q === 'force') return showForce(v, u, undefined, signed);
  if (q === 'torque') return showTorque(v, u);
  if (q === 'angularRate') return showAngularRate(v, u);
  return showPercent(v, undefined, signed);
}

/**
 * A metric's value as the readout and the build sheet write it: with its sign when it is a
 * change from ride, angles to the registry's digits (two when it names none).
 */
export function showMetric(
  entry: Pick<MetricEntry, 'quantity' | 'signed' | 'digits'>,
  v: number | null | undefined,
  u: LengthUnit,
  reason?: string,
): Shown {
  const q = entry.quantity;
  if (q === 'length') return showLength(v, u, reason, entry.signed);
  if (q === 'angle') return showAngle(v, reason, entry.signed, entry.digits ?? 2);
  if (q === 'ratio') return showRatio(v, reason);
  if (q === 'rate') return showRate(v, u, reason);
  if (q === 'force') return showForce(v, u, reason, entry.signed);
  if (q === 'torque') return showTorque(v, u, reason);
  if (q === 'angularRate') return showAngularRate(v, u, reason);
  return showPercent(v, reason, entry.signed);
}

/** The display unit of a metric's quantity. */
export function quantityUnit(q: QuantityKind, u: LengthUnit): string {
  return quantityUnitOf(q, u);
}

/** A file value (mm, deg, %, N/mm, N, N·m) in the display unit, as a number (for plots and inputs). */
export function toDisplay(v: number, q: QuantityKind, u: LengthUnit): number {
  return quantityToUnit(v, q, u);
}

/** A display value back to the file unit. */
export function fromDisplay(v: number, q: QuantityKind, u: LengthUnit): number {
  return unitToQuantity(v, q, u);
}

/** Where on the sweep: "+45.0 mm bump", "−120.0 mm droop", "ride height", "+6.0° roll". */
export function showPosition(sweep: 'heave' | 'roll', at: number, u: LengthUnit): string {
  if (sweep === 'roll') return Math.abs(at) < 1e-9 ? 'no roll' : `${fixed(at, 1, true)}° roll`;
  if (Math.abs(at) < 1e-9) return 'ride height';
  return `${showLength(at, u, undefined, true).text} ${at > 0 ? 'bump' : 'droop'}`;
}
