/**
 * The steering's lock each way, as an event: where the rack travel asked for ends (`steer-lock`), or,
 * first, where a tie rod and its steering arm come into line (`steer-toggle`: past it the rack cannot
 * push the arm round any further, so the travel asked for is beyond the tie rods' reach). A limit with
 * neither in line is `steer-lock-up`. The toggle is judged in the plane square to the steering axis.
 */
import type { LinkageModel } from '../model';
import { BodyRotations, pointPlace } from '../residuals';
import type { SteerEvent } from '../types';
import { vec, vecAngle, vecDot, vecLength, vecScale, vecSub, type Vec3 } from '../vec';
import { rackSet, type SteerLinkage, type SteerSide } from './linkage';
import type { RackSolved } from './march';
import { steerAngle } from './rows';

/**
 * deg: at the limit a tie rod within this of its steering arm's line counts as in line. The bisection
 * leaves the limit a few µm of rack short of the toggle, where the angle is still a few degrees off.
 */
export const TOGGLE_ANGLE_DEG = 10;

const show = (v: number) => `${v > 0 ? '+' : ''}${Number(v.toFixed(1))} mm`;
const deg = (v: number) => `${v > 0 ? '+' : ''}${v.toFixed(1)}°`;

/** deg, how far a side's tie rod is from its steering arm's line (0 in line either way), square to the steering axis. */
export function tieRodArmAngle(model: LinkageModel, state: Float64Array, s: SteerSide): number {
  const rot = new BodyRotations(model.bodies.length);
  rot.update(state);
  const out = new Float64Array(3);
  const at = (p: SteerSide['wheel']): Vec3 => {
    pointPlace(model, p, state, rot, out, 0);
    return vec(out[0], out[1], out[2]);
  };
  const lo = at(s.axis[0]);
  const axisRaw = vecSub(at(s.axis[1]), lo);
  const axis = vecScale(axisRaw, 1 / vecLength(axisRaw));
  const square = (v: Vec3) => vecSub(v, vecScale(axis, vecDot(v, axis)));
  const outer = at(s.tieRod.outer);
  const arm = square(vecSub(outer, lo));
  const rod = square(vecSub(at(s.tieRod.inner), outer));
  const a = (vecAngle(arm, rod) * 180) / Math.PI;
  return Math.min(a, 180 - a);
}

/** The lock event of one direction of the march; leaves the rack at the event's travel. */
export function lockEvent(
  model: LinkageModel,
  linkage: SteerLinkage,
  asked: number,
  reached: RackSolved,
  limit: RackSolved | null,
): SteerEvent {
  const at = limit ?? reached;
  // The tie rods' inner ends where the rack is at that row (the march leaves them wherever it stopped).
  rackSet(linkage.input, at.rack);
  const leftSteer = steerAngle(at.state, linkage.left);
  const rightSteer = steerAngle(at.state, linkage.right);
  const wheels = `left wheel ${deg(leftSteer)}, right wheel ${deg(rightSteer)}`;
  if (!limit)
    return {
      kind: 'steer-lock',
      sweep: 'steer',
      at: at.rack,
      leftSteer,
      rightSteer,
      message: `Steering lock at ${show(at.rack)} of rack (the end of sweep.steer.rack): ${wheels}.`,
    };
  const angles = (['left', 'right'] as const).map((side) => ({
    side,
    angle: tieRodArmAngle(model, at.state, linkage[side]),
  }));
  const inLine = angles.reduce((a, b) => (b.angle < a.angle ? b : a));
  const stops = `the steer sweep stops at ${show(reached.rack)}`;
  if (inLine.angle <= TOGGLE_ANGLE_DEG)
    return {
      kind: 'steer-toggle',
      sweep: 'steer',
      at: at.rack,
      side: inLine.side,
      leftSteer,
      rightSteer,
      message:
        `sweep.steer.rack: ${show(asked)} is past the tie rods' reach: the ${inLine.side} tie rod and steering arm ` +
        `come into line at ${show(at.rack)} (${wheels}); ${stops}.`,
    };
  return {
    kind: 'steer-lock-up',
    sweep: 'steer',
    at: at.rack,
    leftSteer,
    rightSteer,
    message: `sweep.steer.rack: the linkage cannot follow the rack past ${show(at.rack)} of the ${show(asked)} asked for (${wheels}); ${stops}.`,
  };
}
