/**
 * Reading a length typed by the user. A bare number is in the user's unit; a number may also
 * carry its own unit ("35 in", "890mm", "12.5\"", "8.9 cm"). A comma is read as the decimal
 * mark when there is no dot ("12,5"). Everything else is refused with a message, never
 * turned into NaN.
 */
import { MAX_COORDINATE_MM } from '../../../shared/schema/sketch';
import { MM_PER_INCH, mmToUnit, type LengthUnit, type Mm } from '../../../shared/units';

export type LengthParse = { ok: true; mm: Mm } | { ok: false; error: string };

const UNIT_FACTORS_MM: Record<string, number> = { mm: 1, cm: 10, in: MM_PER_INCH, '"': MM_PER_INCH };

const NUMBER_WITH_UNIT = /^([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:e[+-]?\d+)?)\s*(mm|cm|in|")?$/i;

export interface LengthRules {
  /** Smallest allowed value, mm (inclusive unless `exclusiveMin`). */
  min?: Mm;
  exclusiveMin?: boolean;
  /** Largest allowed value, mm. */
  max?: Mm;
}

/** Parses `text` as a length; `unit` is the one a bare number is in. */
export function parseLength(text: string, unit: LengthUnit, rules: LengthRules = {}): LengthParse {
  let t = text.trim();
  if (t === '') return { ok: false, error: 'Enter a number.' };
  if (!t.includes('.') && /^[+-]?\d+,\d+/.test(t)) t = t.replace(',', '.');
  const m = NUMBER_WITH_UNIT.exec(t);
  if (!m) return { ok: false, error: `“${text.trim()}” is not a number${unit === 'in' ? ' (inches)' : ' (mm)'}.` };
  const factor = m[2] ? UNIT_FACTORS_MM[m[2].toLowerCase()] : unit === 'in' ? MM_PER_INCH : 1;
  const mm = Number(m[1]) * factor;
  if (!Number.isFinite(mm)) return { ok: false, error: 'That number is too large.' };
  const min = rules.min ?? -MAX_COORDINATE_MM;
  const max = rules.max ?? MAX_COORDINATE_MM;
  const show = (v: Mm) => `${+mmToUnit(v, unit).toFixed(unit === 'in' ? 2 : 0)} ${unit}`;
  if (rules.exclusiveMin ? !(mm > min) : mm < min)
    return {
      ok: false,
      error: rules.exclusiveMin ? `Must be more than ${show(min)}.` : `Must be at least ${show(min)}.`,
    };
  if (mm > max) return { ok: false, error: `Must be at most ${show(max)}.` };
  return { ok: true, mm };
}

/** A length for an input box: in the user's unit, without the unit, trimmed of noise digits. */
export function lengthForInput(mm: Mm, unit: LengthUnit): string {
  const digits = unit === 'in' ? 3 : 1;
  const v = +mmToUnit(mm, unit).toFixed(digits);
  return String(Object.is(v, -0) ? 0 : v);
}
