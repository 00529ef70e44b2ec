/**
 * Reading a typed sweep load (axle torque in N·m, link-load limit in N): a plain number within
 * the file's bounds, or empty where the field may be left unset. The error names the problem.
 */
export interface SweepNumberRule {
  name: string;
  unit: string;
  min: number;
  max: number;
  /** the minimum itself is not allowed (a limit must be above zero) */
  exclusiveMin?: boolean;
  /** empty text clears the field */
  allowEmpty: boolean;
  /** how the bounds are written in a refusal (as they are, by default) */
  bound?: (v: number) => string;
}

export type SweepNumberParse = { ok: true; value: number | undefined } | { ok: false; error: string };

export function parseSweepNumber(text: string, rule: SweepNumberRule): SweepNumberParse {
  const t = text
    .trim()
    .replace(/\s+/g, '')
    .replace(/\u2212/g, '-');
  if (t === '')
    return rule.allowEmpty
      ? { ok: true, value: undefined }
      : { ok: false, error: `${rule.name} needs a number (${rule.unit}).` };
  const v = Number(t);
  if (!Number.isFinite(v))
    return { ok: false, error: `${rule.name}: "${text.trim()}" is not a number (${rule.unit}).` };
  const low = rule.exclusiveMin ? v <= rule.min : v < rule.min;
  if (low || v > rule.max) {
    const b = rule.bound ?? String;
    const lo = rule.exclusiveMin ? `above ${b(rule.min)}` : `at least ${b(rule.min)}`;
    return { ok: false, error: `${rule.name} must be ${lo} and at most ${b(rule.max)} ${rule.unit}.` };
  }
  return { ok: true, value: v };
}
