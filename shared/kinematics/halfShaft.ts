/**
 * Half-shafts from a frame-mounted drive unit to independent wheels (sketch `halfShafts`):
 * length, plunge from ride, and the two joints' operating angles in 3-D (the compound angle,
 * docs/references.md), read with the same formula as the driveshaft (metrics/driveline.ts: the
 * inner joint takes the drive unit's output axis, the outer joint the wheel's spin axis).
 */
import type { Sketch } from '../schema/sketch';
import { cleanZero } from './clean';
import type { LayoutReader, PlacePoint } from './layouts/types';
import { drivelineReading } from './metrics/driveline';
import type { PointModel } from './model';
import type { HalfShaftReading, HalfShaftReadings } from './types';
import { vecDistance, type Vec3 } from './vec';

export interface HalfShaftPlan {
  side: 'left' | 'right';
  inner: PointModel;
  innerAxis: PointModel;
  outer: PointModel;
  outerAxis: PointModel;
  /** mm */
  rideLength: number;
}

export function halfShaftPlanBuild(sketch: Sketch, points: Map<string, PointModel>): HalfShaftPlan[] {
  const out: HalfShaftPlan[] = [];
  for (const side of ['left', 'right'] as const) {
    const h = sketch.halfShafts?.[side];
    if (!h) continue;
    const inner = points.get(h.inner)!,
      outer = points.get(h.outer)!;
    out.push({
      side,
      inner,
      innerAxis: points.get(h.innerAxis)!,
      outer,
      outerAxis: points.get(h.outerAxis)!,
      rideLength: vecDistance(inner.ride, outer.ride),
    });
  }
  return out;
}

/** Readings of every half-shaft at one row; undefined when the sketch has none. */
export function halfShaftReadings(
  plans: HalfShaftPlan[],
  at: (p: PointModel) => Vec3,
  clean: (v: number) => number,
): HalfShaftReadings | undefined {
  if (plans.length === 0) return undefined;
  const out: HalfShaftReadings = {};
  for (const h of plans) {
    // The inner axis point lies inboard, so inner − innerAxis points out into the joint, as the
    // gearbox shaft does for the driveshaft; the outer axis point lies outboard, as the pinion's does.
    const r = drivelineReading(at(h.inner), at(h.innerAxis), at(h.outer), at(h.outerAxis), h.rideLength);
    const reading: HalfShaftReading = {
      length: r.length,
      plunge: clean(r.plunge),
      innerAngle: clean(r.outputAngle),
      outerAngle: clean(r.pinionAngle),
    };
    out[h.side] = reading;
  }
  return out;
}

/** The half-shaft readings (rows.ts): present when the sketch has half-shafts, whatever its layout. */
export const halfShaftReader: LayoutReader = {
  name: 'half-shafts',
  plan(model) {
    const plans = halfShaftPlanBuild(model.sketch, model.points);
    if (plans.length === 0) return null;
    const halfShafts = (at: PlacePoint) => ({ halfShafts: halfShaftReadings(plans, at, cleanZero) });
    return { heave: halfShafts, roll: halfShafts };
  },
};
