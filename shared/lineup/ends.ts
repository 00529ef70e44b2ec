/**
 * Which variants of a line-up are matched with which. A front suspension and a rear one sit at
 * opposite ends of the frame and never share a bracket on a real platform, so unless the user asks
 * for it, front layouts are matched only with front layouts and rear with rear.
 */
import type { Sketch } from '../schema/sketch';
import type { AxleEnd } from '../schema/sketchVocabulary';

/**
 * The end of the vehicle a sketch's suspension sits at: a double wishbone is a front layout (its
 * knuckle steers; the board shows its front view), a solid axle the vehicle block puts at the front
 * (`vehicle.axle`) is a front one, anything else is at the rear, as the sketch format reads an absent `vehicle.axle`.
 */
export function suspensionEnd(sketch: Pick<Sketch, 'layout' | 'vehicle'>): AxleEnd {
  if (sketch.layout === 'double-wishbone') return 'front';
  return sketch.vehicle.axle === 'front' ? 'front' : 'rear';
}

export interface MatchGroup {
  /** the end its variants sit at, or null when front and rear are matched together */
  end: AxleEnd | null;
  /** the variants' places in the line-up, in order */
  variants: number[];
}

/**
 * The groups of variants matched together: all of them when `acrossEnds` or when they all sit at
 * one end; otherwise the rear ones and the front ones apart (rear first, the usual platform question).
 */
export function matchGroups(ends: readonly AxleEnd[], acrossEnds: boolean): MatchGroup[] {
  const all = ends.map((_, i) => i);
  const oneEnd = new Set(ends).size <= 1;
  if (acrossEnds || oneEnd) return [{ end: oneEnd ? (ends[0] ?? null) : null, variants: all }];
  return (['rear', 'front'] as const).map((end) => ({ end, variants: all.filter((i) => ends[i] === end) }));
}
