/**
 * A steering box's pitman arm as the steer sweep's input: the arm's ball (a frame point, where the drag link
 * starts) swung about the box's output axis. The axis runs through the box pivot, along the line to a second
 * point on the shaft; it is oriented so that a positive swing moves the ball toward the vehicle's left (+y), as
 * positive rack travel does. The ball is a frame point because the box holds the arm still while the axle moves:
 * the heave and roll sweeps see a fixed ball, and the steer sweep moves it in the model (as the rack moves its
 * points), so no new body or constraint kind was needed.
 */
import { MIN_MEMBER_LENGTH_MM } from '../../schema/sketchVocabulary';
import type { PointModel } from '../model';
import { vec, vecCross, vecDot, vecLength, vecScale, vecSub, type Vec3 } from '../vec';

const DEG = Math.PI / 180;
const NO_SWEEP = 'there is no steer sweep; the heave and roll sweeps are not affected.';

export interface PitmanInput {
  kind: 'pitman';
  /** the arm's ball (the drag link's frame end), and where it sits straight ahead (mm) */
  ball: { point: PointModel; centre: Vec3 };
  /** mm, the box pivot: where the output axis carries the arm */
  pivot: Vec3;
  /** unit vector of the output axis; a positive swing turns the ball about it by the right-hand rule */
  axis: Vec3;
  /** mm, the arm's length: the ball's distance from the output axis */
  length: number;
}

/** The ball's offset from the pivot turned by `deg` about the axis (Rodrigues' rotation formula). */
function turned(input: PitmanInput, deg: number): Vec3 {
  const u = input.axis;
  const v = vecSub(input.ball.centre, input.pivot);
  const c = Math.cos(deg * DEG);
  const s = Math.sin(deg * DEG);
  const w = vecCross(u, v);
  const k = vecDot(u, v) * (1 - c);
  return vec(v.x * c + w.x * s + u.x * k, v.y * c + w.y * s + u.y * k, v.z * c + w.z * s + u.z * k);
}

/**
 * The pitman input from the box pivot, a second point on the output axis and the ball (mm, ride); a sentence
 * naming the field when the three draw no arm.
 */
export function pitmanInput(pivot: PointModel, axisPoint: PointModel, ball: PointModel): PitmanInput | string {
  const d = vecSub(axisPoint.ride, pivot.ride);
  const dl = vecLength(d);
  if (!(dl >= MIN_MEMBER_LENGTH_MM))
    return `pitmanArm.axis: '${axisPoint.id}' is at the box pivot '${pivot.id}', so they draw no output axis: ${NO_SWEEP}`;
  let axis = vecScale(d, 1 / dl);
  const r = vecSub(ball.ride, pivot.ride);
  const across = vecSub(r, vecScale(axis, vecDot(r, axis)));
  const length = vecLength(across);
  if (!(length >= MIN_MEMBER_LENGTH_MM))
    return `pitmanArm.ball: '${ball.id}' lies on the box's output axis, so the pitman arm has no length: ${NO_SWEEP}`;
  // A positive swing moves the ball toward +y (the rack's sense); an arm whose ball swings square to y keeps the axis as drawn.
  if (vecCross(axis, across).y < 0) axis = vecScale(axis, -1);
  return {
    kind: 'pitman',
    ball: { point: ball, centre: vec(ball.ride.x, ball.ride.y, ball.ride.z) },
    pivot: vec(pivot.ride.x, pivot.ride.y, pivot.ride.z),
    axis,
    length,
  };
}

/** Swings the arm to `deg` from straight ahead: the ball's position in the model (0 puts it back). */
export function pitmanSet(input: PitmanInput, deg: number): void {
  const v = turned(input, deg);
  const at = vec(input.pivot.x + v.x, input.pivot.y + v.y, input.pivot.z + v.z);
  input.ball.point.ride = at;
  input.ball.point.local = at;
}

/** mm per degree: the ball's velocity at `deg`, (u × r) · π/180. */
export function pitmanVelocity(input: PitmanInput, deg: number): Vec3 {
  return vecScale(vecCross(input.axis, turned(input, deg)), DEG);
}
