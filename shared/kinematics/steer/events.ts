/**
 * The steering's lock each way, as an event: where the input travel asked for ends (`steer-lock`), or,
 * first, where a rod and the arm it pushes come into line (`steer-toggle`: past it the input cannot push the
 * arm round any further, so the travel asked for is beyond the linkage's reach). The rods and arms: each tie
 * rod with its steering arm, and for a pitman arm also the drag link with its steering arm and the pitman arm
 * with the drag link. A limit with none in line is `steer-lock-up`. A toggle is judged in the plane square to
 * the axis the arm turns about (the steering axis, or the box's output axis).
 */
import type { LinkageModel, PointModel } from '../model';
import { BodyRotations, pointPlace } from '../residuals';
import type { SteerEvent } from '../types';
import { vec, vecAngle, vecDot, vecLength, vecScale, vecSub, type Vec3 } from '../vec';
import { steerInputSet, type SteerLinkage, type SteerSide } from './linkage';
import type { InputSolved } from './march';
import { steerAngle } from './rows';

/**
 * deg: at the limit a rod within this of its arm's line counts as in line. The bisection leaves the limit a
 * few µm of rack short of the toggle, where the angle is still a few degrees off.
 */
export const TOGGLE_ANGLE_DEG = 10;

const deg = (v: number) => `${v > 0 ? '+' : ''}${v.toFixed(1)}°`;

/** deg, the angle between an arm and a rod (0 in line either way), both square to the axis `axis` (unit). */
function inLineAngle(axis: Vec3, arm: Vec3, rod: Vec3): number {
  const square = (v: Vec3) => vecSub(v, vecScale(axis, vecDot(v, axis)));
  const a = (vecAngle(square(arm), square(rod)) * 180) / Math.PI;
  return Math.min(a, 180 - a);
}

function placer(model: LinkageModel, state: Float64Array): (p: PointModel) => Vec3 {
  const rot = new BodyRotations(model.bodies.length);
  rot.update(state);
  const out = new Float64Array(3);
  return (p) => {
    pointPlace(model, p, state, rot, out, 0);
    return vec(out[0], out[1], out[2]);
  };
}

/** A side's steering axis (unit, lower to upper) and its lower point, placed. */
function steeringAxis(at: (p: PointModel) => Vec3, s: SteerSide): { lo: Vec3; axis: Vec3 } {
  const lo = at(s.axis[0]);
  const raw = vecSub(at(s.axis[1]), lo);
  return { lo, axis: vecScale(raw, 1 / vecLength(raw)) };
}

/** deg, how far a side's tie rod is from its steering arm's line (0 in line either way), square to the steering axis. */
export function tieRodArmAngle(model: LinkageModel, state: Float64Array, s: SteerSide): number {
  const at = placer(model, state);
  const { lo, axis } = steeringAxis(at, s);
  const outer = at(s.tieRod.outer);
  return inLineAngle(axis, vecSub(outer, lo), vecSub(at(s.tieRod.inner), outer));
}

interface InLine {
  part: NonNullable<SteerEvent['part']>;
  side: 'left' | 'right';
  angle: number;
}

/** Every rod and arm pair of the linkage and how far each is from in line (deg). */
function inLineAngles(model: LinkageModel, linkage: SteerLinkage, state: Float64Array): InLine[] {
  const out: InLine[] = (['left', 'right'] as const).map((side) => ({
    part: 'tie-rod',
    side,
    angle: tieRodArmAngle(model, state, linkage[side]),
  }));
  const drag = linkage.dragLink;
  const input = linkage.input;
  if (drag && input.kind === 'pitman') {
    const at = placer(model, state);
    const { lo, axis } = steeringAxis(at, linkage[drag.side]);
    const arm = at(drag.arm);
    const ball = at(drag.ball);
    out.push({ part: 'drag-link', side: drag.side, angle: inLineAngle(axis, vecSub(arm, lo), vecSub(ball, arm)) });
    out.push({
      part: 'pitman-arm',
      side: drag.side,
      angle: inLineAngle(input.axis, vecSub(ball, input.pivot), vecSub(arm, ball)),
    });
  }
  return out;
}

const partWords: Record<InLine['part'], (side: string) => string> = {
  'tie-rod': (side) => `the ${side} tie rod and steering arm`,
  'drag-link': (side) => `the drag link and the ${side} steering arm`,
  'pitman-arm': () => 'the pitman arm and the drag link',
};

/** The lock event of one direction of the march; leaves the input at the event's position. */
export function lockEvent(
  model: LinkageModel,
  linkage: SteerLinkage,
  asked: number,
  reached: InputSolved,
  limit: InputSolved | null,
): SteerEvent {
  const at = limit ?? reached;
  const rack = linkage.input.kind === 'rack';
  const field = `sweep.steer.${linkage.input.kind}`;
  const show = (v: number) => (rack ? `${v > 0 ? '+' : ''}${Number(v.toFixed(1))} mm` : deg(v));
  const of = rack ? 'of rack' : 'of pitman arm';
  // The input's points where the input is at that row (the march leaves them wherever it stopped).
  steerInputSet(linkage.input, at.at);
  const leftSteer = steerAngle(at.state, linkage.left);
  const rightSteer = steerAngle(at.state, linkage.right);
  const wheels = `left wheel ${deg(leftSteer)}, right wheel ${deg(rightSteer)}`;
  if (!limit)
    return {
      kind: 'steer-lock',
      sweep: 'steer',
      at: at.at,
      leftSteer,
      rightSteer,
      message: `Steering lock at ${show(at.at)} ${of} (the end of ${field}): ${wheels}.`,
    };
  const inLine = inLineAngles(model, linkage, at.state).reduce((a, b) => (b.angle < a.angle ? b : a));
  const stops = `the steer sweep stops at ${show(reached.at)}`;
  const reach = rack ? "the tie rods' reach" : "the steering linkage's reach";
  if (inLine.angle <= TOGGLE_ANGLE_DEG)
    return {
      kind: 'steer-toggle',
      sweep: 'steer',
      at: at.at,
      side: inLine.side,
      ...(rack ? {} : { part: inLine.part }),
      leftSteer,
      rightSteer,
      message:
        `${field}: ${show(asked)} is past ${reach}: ${partWords[inLine.part](inLine.side)} ` +
        `come into line at ${show(at.at)} (${wheels}); ${stops}.`,
    };
  return {
    kind: 'steer-lock-up',
    sweep: 'steer',
    at: at.at,
    leftSteer,
    rightSteer,
    message:
      `${field}: the linkage cannot follow the ${rack ? 'rack' : 'pitman arm'} past ${show(at.at)} of the ` +
      `${show(asked)} asked for (${wheels}); ${stops}.`,
  };
}
