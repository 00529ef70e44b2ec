/**
 * Editing target bands as the user types them: numbers in the user's unit, an empty box
 * for an open end. A box that does not hold a number, or a band whose lower end is above
 * its upper end, is refused with a message and changes nothing.
 */
import type { LengthUnit, QuantityKind } from '../../shared/units';
import { fixed, fromDisplay, quantityUnit, toDisplay } from '../../shared/display/format';
import type { TargetBand, Targets } from '../../shared/display/targets';
import type { TargetMetric } from '../../shared/schema/boardFields';
import { targetEntries } from '../../shared/kinematics/metrics/registry';

/** The fields of a band the editor sets (the band's type also keeps unknown keys of a file). */
export type BandField = 'min' | 'max' | 'from' | 'to';

/** The unit a band field is typed in: the metric's own, except a heave window (travel, a length) or roll window (deg). */
export function fieldUnit(metric: TargetMetric, field: BandField, u: LengthUnit): string {
  const spec = targetEntries[metric];
  if (field === 'from' || field === 'to') return spec.sweep === 'roll' ? '°' : u;
  return quantityUnit(spec.quantity, u);
}

function fieldQuantity(metric: TargetMetric, field: BandField): QuantityKind {
  const spec = targetEntries[metric];
  if (field === 'from' || field === 'to') return spec.sweep === 'roll' ? ('angle' as const) : ('length' as const);
  return spec.quantity;
}

/**
 * A band end given in the file's unit (mm, deg, %, N/mm, N, N·m) as its box shows it in the user's unit:
 * three digits for inches (a thousandth of an inch is 0.0254 mm), two for the rest.
 */
export function bandValueText(v: number, q: QuantityKind, u: LengthUnit): string {
  const shown = toDisplay(v, q, u);
  return String(+fixed(shown, q === 'length' && u === 'in' ? 3 : 2).replace('\u2212', '-'));
}

/** A band end typed in the user's unit, in the file's unit (what the sketch stores). */
export function bandValueFromTyped(n: number, q: QuantityKind, u: LengthUnit): number {
  return fromDisplay(n, q, u);
}

/** A band field's value as the input box shows it ('' for an open end). */
export function fieldText(targets: Targets, metric: TargetMetric, field: BandField, u: LengthUnit): string {
  const v = targets[metric]?.[field];
  if (v === undefined) return '';
  return bandValueText(v, fieldQuantity(metric, field), u);
}

export type EditOutcome = { ok: true; targets: Targets } | { ok: false; error: string };

/** The targets with one field set from typed text, or the reason it cannot be. */
export function editTarget(
  targets: Targets,
  metric: TargetMetric,
  field: BandField,
  text: string,
  u: LengthUnit,
): EditOutcome {
  const t = text.trim().replace(',', '.').replace('\u2212', '-');
  const band: TargetBand = { ...(targets[metric] ?? {}) };
  if (t === '') delete band[field];
  else {
    const n = Number(t);
    if (!Number.isFinite(n)) return { ok: false, error: `“${text.trim()}” is not a number.` };
    band[field] = bandValueFromTyped(n, fieldQuantity(metric, field), u);
  }
  if (band.min !== undefined && band.max !== undefined && band.min > band.max)
    return { ok: false, error: 'The lower end is above the upper end.' };
  if (band.from !== undefined && band.to !== undefined && band.from > band.to)
    return { ok: false, error: 'The window starts after it ends.' };
  const next: Targets = { ...targets };
  if (Object.keys(band).length === 0) delete next[metric];
  else next[metric] = band;
  return { ok: true, targets: next };
}
