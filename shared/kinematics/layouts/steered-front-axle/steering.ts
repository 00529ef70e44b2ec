/**
 * The steered front axle's steering: the pitman arm (`pitmanArm`) swings its ball about the box's output axis,
 * the drag link carries it to a knuckle's steering arm, the tie rod to the other knuckle; each knuckle turns
 * about its kingpin on the axle. Each missing part is named by the field to fill in, so that the sketch still
 * sweeps heave and roll while the steer sweep says what it lacks.
 */
import { FRAME_SLOT, type LinkageModel, type PointModel } from '../../model';
import type { SteerLinkage, SteerSide } from '../../steer/linkage';
import { pitmanInput } from '../../steer/pitman';
import type { AxleKnuckle, SteeredAxlePlan } from './plan';

const NO_SWEEP = 'so there is no steer sweep; the heave and roll sweeps are not affected.';

type PitmanKey = 'pivot' | 'axis' | 'ball';

const WHAT: Record<PitmanKey, string> = {
  pivot: "box pivot (the frame point where the steering box's output shaft carries the arm)",
  axis: "box axis point (a second frame point on the box's output shaft)",
  ball: "ball (the frame point where the drag link starts, at the arm's end)",
};

/** One of the pitman arm's frame points; a sentence naming the field when it is missing or not on the frame. */
function pitmanPoint(model: LinkageModel, key: PitmanKey): PointModel | string {
  const id = model.sketch.pitmanArm?.[key];
  const field = `pitmanArm.${key}`;
  if (id === undefined) return `${field}: the pitman arm has no ${WHAT[key]}, ${NO_SWEEP}`;
  const p = model.points.get(id);
  if (!p) return `${field}: no point '${id}', ${NO_SWEEP}`;
  if (p.slot !== FRAME_SLOT) return `${field}: '${id}' must be on the frame (the steering box is), ${NO_SWEEP}`;
  return p;
}

function sideOf(k: AxleKnuckle, outer: PointModel, inner: PointModel, member: string): SteerSide {
  return { side: k.side, body: k.body, wheel: k.spindle, axis: k.kingpin, tieRod: { member, inner, outer } };
}

/** The steering of a steered-axle plan; a sentence naming what is missing; null without the plan. */
export function steeredAxleSteering(model: LinkageModel, plan: SteeredAxlePlan | null): SteerLinkage | string | null {
  if (!plan) return null;
  if (!model.sketch.pitmanArm)
    return `pitmanArm: the knuckles on the axle have no pitman arm to turn them (pivot, axis and ball), ${NO_SWEEP}`;
  const pts: Partial<Record<PitmanKey, PointModel>> = {};
  for (const key of ['pivot', 'axis', 'ball'] as const) {
    const p = pitmanPoint(model, key);
    if (typeof p === 'string') return p;
    pts[key] = p;
  }
  const { pivot, axis, ball } = pts as Record<PitmanKey, PointModel>;
  const drag = plan.dragLink;
  if (!drag || drag.a !== ball)
    return `pitmanArm.ball: no drag link (a tie-rod member) runs from '${ball.id}' to a knuckle's steering arm, ${NO_SWEEP}`;
  if (!plan.tieRod)
    return `members: no tie rod (a tie-rod member) joins the two knuckles, so one wheel would not follow the other; ${NO_SWEEP}`;
  const input = pitmanInput(pivot, axis, ball);
  if (typeof input === 'string') return input;
  const { a, b, member } = plan.tieRod;
  return {
    input,
    left: sideOf(plan.left, a, b, member),
    right: sideOf(plan.right, b, a, member),
    dragLink: { member: drag.member, ball, arm: drag.b, side: drag.side },
  };
}
