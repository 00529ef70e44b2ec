/**
 * A steer row from a solved pose: each wheel's steer angle (the heading of the line where its wheel plane
 * meets the ground, from its spin axis, as the heave rows' toe), then Ackermann % and the turning radius
 * (readings.ts). The ground is level at ride height, `vehicle.tireRadius` below the wheel centres.
 */
import { cleanZero } from '../clean';
import { contactPoint } from '../metrics/ground';
import { toeOfAxis } from '../metrics/wheel';
import type { LinkageModel } from '../model';
import { mat3Apply, poseFromState, rotationSetCreate, rotationSetFill, POSE_ROLL, POSE_SIZE } from '../pose';
import { BodyRotations, pointPlace } from '../residuals';
import type { BodyPoses, SteerRow } from '../types';
import { vec, type Vec3 } from '../vec';
import { steerInputField, type SteerLinkage, type SteerSide } from './linkage';
import type { InputSolved } from './march';
import { ackermannPercent, innerOuter, turningRadius } from './readings';

/** What every row of one sweep shares: the wheelbase, the ground's height and the rear axle line. */
export interface SteerRowPlan {
  model: LinkageModel;
  linkage: SteerLinkage;
  /** mm */
  wheelbase: number;
  tireRadius: number;
  /** mm, the ground's z (the wheel centres' ride height less the tyre radius) */
  groundZ: number;
  /** mm, x of the rear axle line: the front wheel centres' ride x less the wheelbase */
  rearX: number;
  rot: BodyRotations;
  place: Float64Array;
}

/** `rot`: rotation buffers to fill for each row (the march's, once it is done), else new ones. */
export function steerRowPlanBuild(
  model: LinkageModel,
  linkage: SteerLinkage,
  rot = new BodyRotations(model.bodies.length),
): SteerRowPlan {
  const v = model.sketch.vehicle;
  const wl = linkage.left.wheel.ride;
  const wr = linkage.right.wheel.ride;
  return {
    model,
    linkage,
    wheelbase: v.wheelbase,
    tireRadius: v.tireRadius,
    groundZ: (wl.z + wr.z) / 2 - v.tireRadius,
    rearX: (wl.x + wr.x) / 2 - v.wheelbase,
    rot,
    place: new Float64Array(3),
  };
}

const spinScratch = rotationSetCreate();
const spinOut = new Float64Array(3);

/** What a steer angle is read from: the body carrying the wheel, and its side. */
type SteeredBody = Pick<SteerSide, 'body' | 'side'>;

/** The wheel's outward spin axis (unit) in the state. */
function spinAxis(state: Float64Array, s: SteeredBody): Vec3 {
  const o = s.body.slot * POSE_SIZE + POSE_ROLL;
  rotationSetFill(spinScratch, state[o], state[o + 1], state[o + 2]);
  mat3Apply(spinScratch, 0, 0, s.side === 'left' ? 1 : -1, 0, spinOut, 0);
  return vec(spinOut[0], spinOut[1], spinOut[2]);
}

/**
 * deg, a wheel's steer angle: positive toward the vehicle's left (yaw). A left wheel toed in points its
 * nose right, so its steer angle is minus its toe; a right wheel toed in points left.
 */
export function steerAngle(state: Float64Array, s: SteeredBody): number {
  const toe = toeOfAxis(spinAxis(state, s), s.side);
  return s.side === 'left' ? -toe : toe;
}

function placed(plan: SteerRowPlan, state: Float64Array, p: SteerSide['wheel']): Vec3 {
  pointPlace(plan.model, p, state, plan.rot, plan.place, 0);
  return vec(plan.place[0], plan.place[1], plan.place[2]);
}

/** Where a steering axis meets the ground (mm, x and y); null for an axis lying level. */
function axisAtGround(plan: SteerRowPlan, state: Float64Array, s: SteerSide): { x: number; y: number } | null {
  const lo = placed(plan, state, s.axis[0]);
  const hi = placed(plan, state, s.axis[1]);
  const rise = hi.z - lo.z;
  if (!(Math.abs(rise) > 1e-6)) return null;
  const k = (plan.groundZ - lo.z) / rise;
  return { x: lo.x + k * (hi.x - lo.x), y: lo.y + k * (hi.y - lo.y) };
}

/** mm, the distance between the two steering axes where they meet the ground; null when one lies level. */
export function axesApart(plan: SteerRowPlan, state: Float64Array): number | null {
  plan.rot.update(state);
  const l = axisAtGround(plan, state, plan.linkage.left);
  const r = axisAtGround(plan, state, plan.linkage.right);
  return l && r ? Math.hypot(l.x - r.x, l.y - r.y) : null;
}

function bodiesOf(model: LinkageModel, state: Float64Array): BodyPoses {
  const out: BodyPoses = {};
  for (const b of model.bodies) {
    const p = poseFromState(state, b.slot);
    out[b.id] = {
      x: cleanZero(p.x),
      y: cleanZero(p.y),
      z: cleanZero(p.z),
      roll: cleanZero(p.roll),
      pitch: cleanZero(p.pitch),
      yaw: cleanZero(p.yaw),
    };
  }
  return out;
}

export function steerRowBuild(plan: SteerRowPlan, solved: InputSolved): SteerRow {
  const { state } = solved;
  const { left, right } = plan.linkage;
  const leftSteer = steerAngle(state, left);
  const rightSteer = steerAngle(state, right);
  let ackermann: number | null = null;
  let radius: number | null = null;
  const io = innerOuter(leftSteer, rightSteer);
  if (io) {
    const t = axesApart(plan, state);
    if (t !== null) ackermann = ackermannPercent(io.inner, io.outer, plan.wheelbase, t);
    const outer = io.sense > 0 ? right : left;
    plan.rot.update(state);
    const patch = contactPoint(
      { centre: placed(plan, state, outer.wheel), axis: spinAxis(state, outer) },
      vec(0, 0, 1),
      plan.tireRadius,
    );
    if (patch) radius = turningRadius(patch, io.sense > 0 ? rightSteer : leftSteer, plan.rearX);
  }
  // Object.assign onto the input's field, not an object spread: the spread of an object literal takes V8's slow
  // path, several microseconds a row, as much as the rest of the row's readings together.
  return Object.assign(steerInputField(plan.linkage.input, solved.at), {
    leftSteer: cleanZero(leftSteer),
    rightSteer: cleanZero(rightSteer),
    ackermann: ackermann === null ? null : cleanZero(ackermann),
    turningRadius: radius,
    bind: solved.bind,
    bodies: bodiesOf(plan.model, state),
  });
}
