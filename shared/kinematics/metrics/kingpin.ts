/**
 * The steering (kingpin) axis of a double-wishbone knuckle: the line from the lower to the
 * upper ball joint. Inclination and caster are its angles from the vertical in the front and
 * side views; scrub radius and trail are where it meets the ground, measured from the contact
 * patch (below the wheel centre, at the ground). Plain geometry; the sign conventions are the
 * trade's usual ones (positive inclination: top inboard; positive caster: top rearward;
 * positive scrub: the axis meets the ground inboard of the patch; positive trail: ahead of it).
 */
import { radToDeg } from '../../units';
import type { KingpinReading } from '../types';
import type { Vec3 } from '../vec';

/** Ball joints closer in height than this (mm) leave the axis (nearly) level: no angles. */
export const KINGPIN_MIN_RISE_MM = 1e-6;

/**
 * @param lower mm, lower ball joint
 * @param upper mm, upper ball joint
 * @param wheelCentre mm, the wheel centre (the contact patch is below it)
 * @param groundZ mm, ground height (0 at ride; in a heave row it has risen by the travel)
 * @param side which side the knuckle is on (inboard is −y on the left, +y on the right)
 */
export function kingpinReading(
  lower: Vec3,
  upper: Vec3,
  wheelCentre: Vec3,
  groundZ: number,
  side: 'left' | 'right',
): KingpinReading | null {
  const rise = upper.z - lower.z;
  if (!(rise > KINGPIN_MIN_RISE_MM)) return null;
  const s = side === 'left' ? 1 : -1;
  const t = (groundZ - lower.z) / rise;
  const ground = { x: lower.x + t * (upper.x - lower.x), y: lower.y + t * (upper.y - lower.y) };
  const out: KingpinReading = {
    inclination: radToDeg(Math.atan2(s * (lower.y - upper.y), rise)),
    caster: radToDeg(Math.atan2(lower.x - upper.x, rise)),
    scrubRadius: s * (wheelCentre.y - ground.y),
    trail: ground.x - wheelCentre.x,
  };
  return Object.values(out).every(Number.isFinite) ? out : null;
}

/** A kingpin reading for a result row: each value through the row's round-off cleaner (null stays null). */
export function kingpinForRow(kp: KingpinReading | null, clean: (v: number) => number): KingpinReading | null {
  return kp
    ? {
        inclination: clean(kp.inclination),
        caster: clean(kp.caster),
        scrubRadius: clean(kp.scrubRadius),
        trail: clean(kp.trail),
      }
    : null;
}
