/**
 * The steer sweep's input as the board shows it, whatever moves the wheels: a rack (mm of travel along the
 * line through the tie rods' inner ends) or another input a layout names in `steer.input` (each row then
 * carries its position under that name). The label, unit and sign words come from the registry's steer entry
 * of the same name, so a new input needs no change here.
 */
import type { SteerResult, SteerRow } from '../kinematics/types';
import { metricEntry, type MetricEntry } from '../kinematics/metrics/registry';
import type { LengthUnit, QuantityKind } from '../units';
import { fixed, showLength } from './format';

export interface SteerInput {
  /** the rows' field holding the input's position (`rack`, …) */
  key: string;
  /** what it is, as the registry names it ("Rack travel") */
  label: string;
  /** length (mm) or angle (deg) */
  quantity: QuantityKind;
  /** the registry's help for it, when it has an entry */
  entry: MetricEntry<'steer'> | null;
}

/** The registry's steer entry of that name; null for an input the registry does not name yet. */
function registryEntry(key: string): MetricEntry<'steer'> | null {
  try {
    return metricEntry({ sweep: 'steer', key });
  } catch {
    return null;
  }
}

/** The input of a steer result; null when there is no steer sweep to show (no rows). */
export function steerInputOf(steer: SteerResult | undefined | null): SteerInput | null {
  if (!steer || steer.rows.length === 0) return null;
  const key = String(steer.input);
  const entry = registryEntry(key);
  return {
    key,
    // An input the registry does not name yet: an angle unless it is the rack.
    label: entry?.label ?? `${key.charAt(0).toUpperCase()}${key.slice(1)} angle`,
    quantity: entry?.quantity ?? (key === 'rack' ? 'length' : 'angle'),
    entry,
  };
}

/** A row's input position (mm of rack, deg of an arm…); 0 when the row does not carry it. */
export function steerAt(row: Pick<SteerRow, 'rack' | 'pitman'>, input: SteerInput): number {
  const v = (row as unknown as Record<string, unknown>)[input.key];
  return typeof v === 'number' && Number.isFinite(v) ? v : 0;
}

/** Where the input reaches each way: the first and last rows' positions. */
export function steerReach(steer: SteerResult, input: SteerInput): { min: number; max: number } {
  const rows = steer.rows;
  return rows.length
    ? { min: steerAt(rows[0], input), max: steerAt(rows[rows.length - 1], input) }
    : { min: 0, max: 0 };
}

/** A steer position in words: "straight ahead", or the input's travel from centre with its sign ("+60.0 mm rack", "−7.5° pitman arm"). */
export function showSteerPosition(at: number, input: SteerInput, u: LengthUnit): string {
  if (Math.abs(at) < 1e-9) return 'straight ahead';
  const amount = input.quantity === 'length' ? showLength(at, u, undefined, true).text : `${fixed(at, 1, true)}°`;
  // The degree sign already says it is an angle: "−7.5° pitman arm", short enough for the slider's value column.
  const name = input.key === 'rack' ? 'rack' : input.label.toLowerCase().replace(/ angle$/, '');
  return `${amount} ${name}`;
}
