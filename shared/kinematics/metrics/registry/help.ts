/**
 * A quantity's help in words, from its registry entry alone: what it is, its sign convention,
 * and for a quantity whose sign reads differently at the two ends of the vehicle, what positive
 * means at this sketch's end. The readout, plots, targets and build sheet all show these words.
 */
import type { AxleEnd } from './types';

/** What the help is made of: the fields every registry entry (metric, member, wind-up) has. */
export interface Explained {
  definition: string;
  sign: string;
  axleSense?: Record<AxleEnd, string>;
}

/** Where a sketch's suspension sits: `vehicle.axle` when it says 'front' or 'rear', else the rear. */
export function axleEndOf(vehicle: unknown): AxleEnd {
  const axle = typeof vehicle === 'object' && vehicle !== null ? (vehicle as { axle?: unknown }).axle : undefined;
  return axle === 'front' ? 'front' : 'rear';
}

/** The definition, then the sign convention (and where it is measured from) as a sentence of its own, then what positive means at `end`. */
export function metricHelp(entry: Explained, end: AxleEnd = 'rear'): string {
  const sign = entry.sign.charAt(0).toUpperCase() + entry.sign.slice(1);
  const parts = [entry.definition, `Convention: ${sign}${sign.endsWith('.') ? '' : '.'}`];
  if (entry.axleSense) parts.push(entry.axleSense[end]);
  return parts.join(' ');
}
