/**
 * Finding a steered solid front axle (docs/design/steered-front-axle.md): the axle carrying both wheel centres,
 * and on each side a knuckle turning about its kingpin, a `hinge` whose two axis points are on the axle; a tie
 * rod (a `tie-rod` from one knuckle to the other); a drag link (a `tie-rod` from a frame point, the pitman
 * arm's ball, to a knuckle's steering arm); the pitman arm (`pitmanArm`: the box pivot, a second point on the
 * box's output axis, the ball). Found from the points and members, never from `layout`. The solver needs none
 * of this (the kingpins are hinges, the rods distance constraints); it is the plan for the readings and the
 * steer sweep.
 */
import { kingpinReading } from '../../metrics/kingpin';
import { FRAME_SLOT, type BodyModel, type HingeConstraint, type LinkageModel, type PointModel } from '../../model';
import type { KingpinReading } from '../../types';
import { vecSub } from '../../vec';

export type Side = 'left' | 'right';

/** One knuckle on its kingpin. */
export interface AxleKnuckle {
  side: Side;
  body: BodyModel;
  /** the kingpin's axle points, lower then upper */
  kingpin: [PointModel, PointModel];
  /** the wheel centre on the axle (the sketch's `wheels`) */
  wheel: PointModel;
  /**
   * the knuckle's own copy of the wheel centre (not a sketch point): where the wheel is as the knuckle turns, for
   * the steer sweep's contact patch and turning radius
   */
  spindle: PointModel;
}

/** A rod's two ends. */
export interface RodEnds {
  member: string;
  a: PointModel;
  b: PointModel;
}

export interface SteeredAxlePlan {
  axle: BodyModel;
  left: AxleKnuckle;
  right: AxleKnuckle;
  /** the tie rod between the knuckles: `a` on the left knuckle, `b` on the right; null without one */
  tieRod: RodEnds | null;
  /** the drag link: `a` the frame end (the pitman ball), `b` on a knuckle (`side`'s); null without one */
  dragLink: (RodEnds & { side: Side }) | null;
  /** the left kingpin at ride (caster change is measured from its caster) */
  rideKingpin: KingpinReading | null;
}

const RODS = new Set(['link', 'tie-rod', 'lateral-rod']);

function knuckleOf(model: LinkageModel, axle: BodyModel, side: Side): AxleKnuckle | null {
  const body = model.bodyById.get(`knuckle-${side}`);
  if (!body) return null;
  const hinge = model.constraints.find(
    (c): c is HingeConstraint => c.type === 'hinge' && c.slot === body.slot && c.axisSlot === axle.slot,
  );
  if (!hinge) return null;
  const a = model.points.get(hinge.member.a)!;
  const b = model.points.get(hinge.member.b)!;
  const wheel = side === 'left' ? model.wheelLeft : model.wheelRight;
  const spindle: PointModel = {
    id: `${wheel.id}@${body.id}`,
    index: -1,
    slot: body.slot,
    ride: wheel.ride,
    local: vecSub(wheel.ride, body.reference),
  };
  return { side, body, kingpin: a.ride.z <= b.ride.z ? [a, b] : [b, a], wheel, spindle };
}

/** The plan, or null when the wheels are not on one axle with a knuckle on a kingpin each side. */
export function steeredAxlePlanBuild(model: LinkageModel): SteeredAxlePlan | null {
  const axle = model.axle;
  if (!axle) return null;
  const left = knuckleOf(model, axle, 'left');
  const right = knuckleOf(model, axle, 'right');
  if (!left || !right) return null;
  let tieRod: SteeredAxlePlan['tieRod'] = null;
  let dragLink: SteeredAxlePlan['dragLink'] = null;
  for (const m of model.sketch.members) {
    if (!RODS.has(m.kind)) continue;
    const a = model.points.get(m.a)!;
    const b = model.points.get(m.b)!;
    const on = (p: PointModel, k: AxleKnuckle) => p.slot === k.body.slot;
    if (!tieRod && on(a, left) && on(b, right)) tieRod = { member: m.id, a, b };
    else if (!tieRod && on(a, right) && on(b, left)) tieRod = { member: m.id, a: b, b: a };
    else if (!dragLink && m.kind === 'tie-rod') {
      for (const k of [left, right]) {
        if (a.slot === FRAME_SLOT && on(b, k)) dragLink = { member: m.id, a, b, side: k.side };
        else if (b.slot === FRAME_SLOT && on(a, k)) dragLink = { member: m.id, a: b, b: a, side: k.side };
      }
    }
  }
  const [lo, hi] = left.kingpin;
  return {
    axle,
    left,
    right,
    tieRod,
    dragLink,
    rideKingpin: kingpinReading(lo.ride, hi.ride, left.wheel.ride, 0, 'left'),
  };
}
