/**
 * Leaf-spring readings of one heave row (the sentences for the layout are in notes.ts):
 * - `shackleAngle`: the left shackle's side-view angle from the vertical through its hanger,
 *   positive when the spring eye lies rearward of the hanger;
 * - `rollCenterHeight`: the height of the left spring's seat on the axle — the leaves locate
 *   the axle sideways where they are clamped to it. Common practice, no published source.
 * The side-view instant centre and anti-squat of the link layouts do not apply: the spring's
 * bending, not a link pair, takes the axle torque (windUp.ts gives what it does).
 */
import type { Sketch } from '../../../schema/sketch';
import type { LinkageModel, PointModel } from '../../model';
import type { HeaveRow } from '../../types';
import type { Vec3 } from '../../vec';

export interface LeafSpringPlan {
  /** the left spring's shackle: frame hanger and swinging eye; null without a shackle */
  shackle: { hanger: PointModel; eye: PointModel } | null;
  /** the left spring's seat on the axle */
  seat: PointModel | null;
  /** the sketch also has a lateral rod */
  lateralRod: boolean;
}

/** Whether the sketch has leaf-spring halves (its axle is then located by the leaves, not by link groups). */
export function hasLeafSprings(sketch: Sketch): boolean {
  return sketch.members.some((m) => m.kind === 'leaf-half');
}

/** The plan when the sketch has leaf-spring halves; null otherwise. */
export function leafSpringPlanBuild(model: LinkageModel): LeafSpringPlan | null {
  const { sketch, points } = model;
  if (!hasLeafSprings(sketch)) return null;
  const halves = sketch.members.filter((m) => m.kind === 'leaf-half');
  const seats = [...new Set(halves.map((m) => (m.kind === 'leaf-half' ? m.seat : '')))].map((id) => points.get(id)!);
  // The left spring: the seat farthest to the left (largest y).
  const seat = seats.reduce<PointModel | null>((best, p) => (!best || p.ride.y > best.ride.y ? p : best), null);
  let shackle: LeafSpringPlan['shackle'] = null;
  for (const m of sketch.members) {
    if (m.kind !== 'shackle') continue;
    const a = points.get(m.a)!,
      b = points.get(m.b)!;
    const eye = [a, b].find((p) => p.slot >= 0 && model.bodies[p.slot].id === 'shackle-left');
    const hanger = eye === a ? b : a;
    if (eye && hanger.slot < 0) shackle = { hanger, eye };
  }
  return { shackle, seat, lateralRod: sketch.members.some((m) => m.kind === 'lateral-rod') };
}

/** Side-view angle (deg) of the line hanger → eye from the vertical, positive when the eye is rearward of the hanger. */
export function shackleAngle(hanger: Vec3, eye: Vec3): number {
  return (Math.atan2(hanger.x - eye.x, Math.abs(hanger.z - eye.z)) * 180) / Math.PI;
}

/** The leaf-spring fields of a heave row. */
export function leafSpringHeaveFields(
  plan: LeafSpringPlan,
  at: (p: PointModel) => Vec3,
  clean: (v: number) => number,
): Partial<HeaveRow> {
  const out: Partial<HeaveRow> = {};
  if (plan.shackle) out.shackleAngle = clean(shackleAngle(at(plan.shackle.hanger), at(plan.shackle.eye)));
  if (plan.seat && !plan.lateralRod) out.rollCenterHeight = clean(at(plan.seat).z);
  return out;
}
