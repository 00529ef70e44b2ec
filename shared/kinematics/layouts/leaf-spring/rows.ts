/**
 * Leaf-spring readings of one heave row (the sentences for the layout are in notes.ts):
 * - `shackleAngle`: the left shackle's side-view angle from the vertical through its hanger,
 *   positive when the spring eye lies rearward of the hanger;
 * - `rollCenterHeight`: the height of the left spring's seat on the axle — the leaves locate
 *   the axle sideways where they are clamped to it. Common practice, no published source.
 * - `instantCenter` and `antiSquat`: from the SAE three-link equivalent the model solves (each half a
 *   link from its eye to its pivot on the axle, the shackle the third link, the halves' bending
 *   settling the axle's pitch). The axle's side-view instant centre is the pole of its motion as the
 *   sweep moves it in heave: where the lines square to the velocities of two of its points (the front
 *   half's pivot and the seat) cross. It lies on the front half's line (its pivot swings about its
 *   eye) at the point the bending puts it. The spring energy's least point sets the pitch per mm of
 *   heave, and by reciprocity the same coupling sets the vertical force an axle torque gives, so this
 *   pole is the one anti-squat is read from (metrics/antiSquat.ts).
 */
import type { Sketch } from '../../../schema/sketch';
import type { SolvedRow } from '../../march';
import { antiSquatPercent } from '../../metrics/antiSquat';
import { sideViewCrossing } from '../../metrics/instantCenter';
import type { LinkageModel, PointModel } from '../../model';
import { BodyRotations, pointVelocity } from '../../residuals';
import type { HeaveRow, SidePoint } from '../../types';
import type { Vec3 } from '../../vec';

export interface LeafSpringPlan {
  /** the left spring's shackle: frame hanger and swinging eye; null without a shackle */
  shackle: { hanger: PointModel; eye: PointModel } | null;
  /** the left spring's seat on the axle */
  seat: PointModel | null;
  /** the sketch also has a lateral rod */
  lateralRod: boolean;
  /** the left spring's frame-eyed half: its pivot on the axle (the side-view pole); null without one */
  frontPivot: PointModel | null;
  /** the left wheel centre (the contact patch is under it) */
  wheelLeft: PointModel;
  /** mm, the anti-squat reference */
  cgHeight: number;
  wheelbase: number;
  /** rotations of the row being read (the point velocities need them) */
  rot: BodyRotations;
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
  // The left spring's frame-eyed half: its pivot on the axle has the seat's side (y) of the car.
  const front = halves.find((m) => {
    const eye = points.get(m.a)!;
    return eye.slot < 0 && seat !== null && Math.sign(points.get(m.b)!.ride.y) === Math.sign(seat.ride.y);
  });
  return {
    shackle,
    seat,
    lateralRod: sketch.members.some((m) => m.kind === 'lateral-rod'),
    frontPivot: front ? points.get(front.b)! : null,
    wheelLeft: model.wheelLeft,
    cgHeight: sketch.vehicle.cgHeight,
    wheelbase: sketch.vehicle.wheelbase,
    rot: new BodyRotations(model.bodies.length),
  };
}

/** Side-view angle (deg) of the line hanger → eye from the vertical, positive when the eye is rearward of the hanger. */
export function shackleAngle(hanger: Vec3, eye: Vec3): number {
  return (Math.atan2(hanger.x - eye.x, Math.abs(hanger.z - eye.z)) * 180) / Math.PI;
}

/**
 * The side-view pole of the axle's motion in heave: where the lines square to the side-view velocities
 * of `p` and `q` cross (the velocities from the row's sensitivity). With no pitch the lines are parallel:
 * `pole` is null and `slope` (dz/dx) their direction. Both null when the velocities vanish.
 */
function sideViewPole(
  plan: LeafSpringPlan,
  at: (p: PointModel) => Vec3,
  solved: SolvedRow,
  p: PointModel,
  q: PointModel,
): { pole: SidePoint | null; slope: number | null } {
  plan.rot.update(solved.state);
  const v = new Float64Array(6),
    tmp = new Float64Array(3);
  pointVelocity(p, solved.rate, plan.rot, v, 0, tmp);
  pointVelocity(q, solved.rate, plan.rot, v, 3, tmp);
  const pp = at(p),
    qq = at(q);
  // The line square to (vx, vz) through a point runs along (vz, −vx).
  const ends = (o: number, c: Vec3): [Vec3, Vec3] => [c, { x: c.x + v[o + 2], y: c.y, z: c.z - v[o] }];
  const [p1, p2] = ends(0, pp);
  const [q1, q2] = ends(3, qq);
  if (!(Math.hypot(v[0], v[2]) > 0) || !(Math.hypot(v[3], v[5]) > 0)) return { pole: null, slope: null };
  const pole = sideViewCrossing(p1, p2, q1, q2);
  return { pole, slope: pole || v[2] === 0 ? null : -v[0] / v[2] };
}

/** The leaf-spring fields of a heave row. */
export function leafSpringHeaveFields(
  plan: LeafSpringPlan,
  at: (p: PointModel) => Vec3,
  solved: SolvedRow,
  clean: (v: number) => number,
): Partial<HeaveRow> {
  const out: Partial<HeaveRow> = {};
  if (plan.shackle) out.shackleAngle = clean(shackleAngle(at(plan.shackle.hanger), at(plan.shackle.eye)));
  if (plan.seat && !plan.lateralRod) out.rollCenterHeight = clean(at(plan.seat).z);
  if (plan.frontPivot && plan.seat) {
    const { pole, slope } = sideViewPole(plan, at, solved, plan.frontPivot, plan.seat);
    const cp = { x: at(plan.wheelLeft).x, z: solved.travel };
    const antiSquat = antiSquatPercent(pole, cp, plan.cgHeight, plan.wheelbase, slope);
    out.instantCenter = pole ? { x: clean(pole.x), z: clean(pole.z) } : null;
    out.antiSquat = antiSquat === null ? null : clean(antiSquat);
  }
  return out;
}
