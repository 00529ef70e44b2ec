/**
 * Finding the double wishbones of a sketch (docs/sketch-format.md): on each knuckle that carries
 * a wheel, an upper and a lower wishbone, each two `link`s of that `group` from two frame
 * pivots to one ball-joint point on the knuckle (or an arm body `<group>-arm-<side>` on a `hinge`
 * with a `ball-joint` to the knuckle), and a `tie-rod` from the frame (the rack
 * end) to the knuckle (the steering arm). Found from the points and members, never from
 * `layout`. The solver needs none of this (the five links are plain distance constraints on
 * the knuckle, a wheel carrier); it is the plan for the double-wishbone metrics.
 */
import type { Sketch } from '../../../schema/sketch';
import { DEFAULT_FRONT_BRAKE_SHARE_PERCENT } from '../../../schema/sketchVocabulary';
import { kingpinReading } from '../../metrics/kingpin';
import type { KingpinReading } from '../../types';
import type { BodyModel, LinkageModel, PointModel } from '../../model';
import { FRAME_SLOT } from '../../model';

export type WishboneGroup = 'upper' | 'lower';

/** One wishbone: two inner pivots on the frame and the ball joint on the knuckle. */
export interface WishboneArm {
  group: WishboneGroup;
  inner: [PointModel, PointModel];
  joint: PointModel;
  /** ids of its two links, or of its hinge and ball joint when the wishbone is an arm body */
  members: [string, string];
  /** the arm body, when the wishbone is one (`upper-arm-left`…); null for two links */
  arm: BodyModel | null;
}

/** The tie rod: inner end on the frame (rack end), outer end on the knuckle (steering arm). */
export interface TieRodPlan {
  member: string;
  inner: PointModel;
  outer: PointModel;
}

/** One side's knuckle with its wishbones. */
export interface WishboneSide {
  side: 'left' | 'right';
  body: BodyModel;
  wheel: PointModel;
  upper: WishboneArm;
  lower: WishboneArm;
  tieRod: TieRodPlan | null;
  /** the kingpin axis at ride (caster change is measured from its caster) */
  rideKingpin: KingpinReading | null;
}

export interface WishbonePlan {
  left: WishboneSide;
  /** null when the right knuckle has no complete pair of wishbones (no roll centre in roll rows) */
  right: WishboneSide | null;
  /** % of braking on the front axle (the file's, or the default) */
  frontBrakeShare: number;
  cgHeight: number;
  wheelbase: number;
}

const KNUCKLES = new Set(['knuckle-left', 'knuckle-right']);

/**
 * A wishbone as an arm body: the hinge of `<group>-arm-<side>` gives the inner pivots, its ball joint's arm point
 * the joint (the knuckle is held there).
 */
function armBodyOf(sketch: Sketch, model: LinkageModel, body: BodyModel, group: WishboneGroup): WishboneArm | null {
  const side = body.id.endsWith('-left') ? 'left' : 'right';
  const arm = model.bodyById.get(`${group}-arm-${side}`);
  if (!arm) return null;
  const hinge = sketch.members.find((m) => m.kind === 'hinge' && m.body === arm.id);
  const ball = sketch.members.find(
    (m) =>
      m.kind === 'ball-joint' && model.points.get(m.a)!.slot === arm.slot && model.points.get(m.b)!.slot === body.slot,
  );
  if (!hinge || !ball) return null;
  return {
    group,
    inner: [model.points.get(hinge.a)!, model.points.get(hinge.b)!],
    joint: model.points.get(ball.a)!,
    members: [hinge.id, ball.id],
    arm,
  };
}

function armOf(sketch: Sketch, model: LinkageModel, body: BodyModel, group: WishboneGroup): WishboneArm | null {
  const asBody = armBodyOf(sketch, model, body, group);
  if (asBody) return asBody;
  const byJoint = new Map<string, { inner: PointModel; member: string }[]>();
  for (const m of sketch.members) {
    if (m.kind !== 'link' || m.group !== group) continue;
    const a = model.points.get(m.a)!;
    const b = model.points.get(m.b)!;
    const [frame, knuckle] = a.slot === FRAME_SLOT ? [a, b] : [b, a];
    if (frame.slot !== FRAME_SLOT || knuckle.slot !== body.slot) continue;
    const list = byJoint.get(knuckle.id) ?? [];
    list.push({ inner: frame, member: m.id });
    byJoint.set(knuckle.id, list);
  }
  for (const [jointId, list] of byJoint) {
    if (list.length !== 2) continue;
    return {
      group,
      inner: [list[0].inner, list[1].inner],
      joint: model.points.get(jointId)!,
      members: [list[0].member, list[1].member],
      arm: null,
    };
  }
  return null;
}

function tieRodOf(sketch: Sketch, model: LinkageModel, body: BodyModel): TieRodPlan | null {
  for (const m of sketch.members) {
    if (m.kind !== 'tie-rod') continue;
    const a = model.points.get(m.a)!;
    const b = model.points.get(m.b)!;
    if (a.slot === FRAME_SLOT && b.slot === body.slot) return { member: m.id, inner: a, outer: b };
    if (b.slot === FRAME_SLOT && a.slot === body.slot) return { member: m.id, inner: b, outer: a };
  }
  return null;
}

function sideOf(model: LinkageModel, side: 'left' | 'right'): WishboneSide | null {
  const wheel = side === 'left' ? model.wheelLeft : model.wheelRight;
  if (wheel.slot === FRAME_SLOT) return null;
  const body = model.bodies[wheel.slot];
  if (body.role !== 'wheel-carrier' || !KNUCKLES.has(body.id)) return null;
  const upper = armOf(model.sketch, model, body, 'upper');
  const lower = armOf(model.sketch, model, body, 'lower');
  if (!upper || !lower) return null;
  const rideKingpin = kingpinReading(lower.joint.ride, upper.joint.ride, wheel.ride, 0, side);
  return { side, body, wheel, upper, lower, tieRod: tieRodOf(model.sketch, model, body), rideKingpin };
}

/** The knuckle whose wheel is on `side`, if it is a knuckle (for the "no wishbones" warning). */
export function knuckleCarrying(model: LinkageModel, side: 'left' | 'right'): BodyModel | null {
  const wheel = side === 'left' ? model.wheelLeft : model.wheelRight;
  if (wheel.slot === FRAME_SLOT) return null;
  const body = model.bodies[wheel.slot];
  return KNUCKLES.has(body.id) ? body : null;
}

/** The double-wishbone plan, or null when the left wheel is not on a knuckle with both wishbones. */
export function wishbonePlanBuild(model: LinkageModel): WishbonePlan | null {
  const left = sideOf(model, 'left');
  if (!left) return null;
  const v = model.sketch.vehicle;
  return {
    left,
    right: sideOf(model, 'right'),
    frontBrakeShare: v.frontBrakeShare ?? DEFAULT_FRONT_BRAKE_SHARE_PERCENT,
    cgHeight: v.cgHeight,
    wheelbase: v.wheelbase,
  };
}
