/**
 * A number the user types in their unit system (a spring rate in N/mm or lbf/in, an axle torque
 * in N·m or lbf·ft, a load limit in N or lbf) and the file stores in its own (N/mm, N·m, N).
 * The box shows the stored value converted back; the bounds are the file's, written in the
 * user's unit when a typed number is refused.
 */
import { quantityToUnit, quantityUnitOf, unitToQuantity, type LengthUnit, type QuantityKind } from '../../shared/units';
import { parseSweepNumber, type SweepNumberParse, type SweepNumberRule } from './loadInput';

/** Digits an input box keeps of a converted value: a hundredth of a lbf/in, lbf or lbf·ft is well below any build's tolerance. */
const CONVERTED_DIGITS = 2;

/** The rule of a typed quantity: its name, its bounds in the file's unit, and whether it may be left empty. */
export type QuantityInputRule = Omit<SweepNumberRule, 'unit' | 'bound'>;

/** The file's value as its input box shows it: as stored in the file's units, rounded when converted. */
export function quantityInputText(v: number | undefined, q: QuantityKind, u: LengthUnit): string {
  if (v === undefined) return '';
  const shown = quantityToUnit(v, q, u);
  if (shown === v) return String(v);
  const rounded = +shown.toFixed(CONVERTED_DIGITS);
  return String(Object.is(rounded, -0) ? 0 : rounded);
}

/**
 * Typed text read as a quantity in the user's unit and returned in the file's unit. The bounds are
 * checked in the unit typed; a converted bound is written rounded toward zero, so a number typed
 * as the message says is always accepted.
 */
export function parseQuantityInput(
  text: string,
  rule: QuantityInputRule,
  q: QuantityKind,
  u: LengthUnit,
): SweepNumberParse {
  const min = quantityToUnit(rule.min, q, u);
  const max = quantityToUnit(rule.max, q, u);
  const converted = min !== rule.min || max !== rule.max;
  const r = parseSweepNumber(text, {
    ...rule,
    min,
    max,
    unit: quantityUnitOf(q, u),
    bound: converted ? (v) => String(Math.trunc(v * 10 ** CONVERTED_DIGITS) / 10 ** CONVERTED_DIGITS) : undefined,
  });
  if (!r.ok || r.value === undefined) return r;
  // Within the bounds as typed; the clamp only keeps a bound typed exactly from coming back a rounding past it.
  return { ok: true, value: Math.min(rule.max, Math.max(rule.min, unitToQuantity(r.value, q, u))) };
}
