/**
 * What a steered layout hands the steer sweep: the steering input (the frame points it moves and
 * how), and on each side the body carrying the wheel, its steering axis and its tie rod. A layout's
 * reader supplies it (`LayoutReader.steering`); the sweep never looks at `layout`. Two inputs: a rack
 * (the line through the two tie rods' inner ends, moved along itself, mm) and a pitman arm (its ball
 * swung about the steering box's output axis, degrees; pitman.ts).
 */
import { MIN_MEMBER_LENGTH_MM } from '../../schema/sketchVocabulary';
import type { BodyModel, PointModel } from '../model';
import { vec, vecLength, vecScale, vecSub, type Vec3 } from '../vec';
import { pitmanSet, pitmanVelocity, type PitmanInput } from './pitman';

/** One side of a steered front. */
export interface SteerSide {
  side: 'left' | 'right';
  /** the body carrying the wheel (the knuckle) */
  body: BodyModel;
  wheel: PointModel;
  /** two points on the steering axis, lower then upper (the ball joints) */
  axis: [PointModel, PointModel];
  /**
   * the tie rod: `outer` on this side's steering arm, `inner` its other end (moved by a rack; on a solid axle the
   * other knuckle's arm)
   */
  tieRod: { member: string; inner: PointModel; outer: PointModel };
}

/** The rack: frame points moved together along one line (mm). */
export interface RackInput {
  kind: 'rack';
  /** the frame points the rack carries, and where each sits with the rack centred */
  points: { point: PointModel; centre: Vec3 }[];
  /** unit vector of positive rack travel (toward the vehicle's left) */
  direction: Vec3;
}

export type SteerInput = RackInput | PitmanInput;

/**
 * A pitman arm's drag link (addition): from the arm's ball (`ball`, a frame point the input swings) to the
 * steering arm of one knuckle (`arm`, on `side`'s body). The lock also looks for it in line with either arm.
 */
export interface DragLink {
  member: string;
  ball: PointModel;
  arm: PointModel;
  side: 'left' | 'right';
}

export interface SteerLinkage {
  input: SteerInput;
  left: SteerSide;
  right: SteerSide;
  /** the drag link, when the input is a pitman arm */
  dragLink?: DragLink;
}

/** The frame points an input moves, each with where it sits straight ahead. */
export function steerInputPoints(input: SteerInput): { point: PointModel; centre: Vec3 }[] {
  return input.kind === 'rack' ? input.points : [input.ball];
}

/**
 * Moves the input to `at` (mm of rack, degrees of pitman arm): its frame points' positions in the model. The
 * solver reads a frame point where the model places it, so this is what the steer sweep imposes;
 * `steerInputSet(input, 0)` puts them back where the sketch has them.
 */
export function steerInputSet(input: SteerInput, at: number): void {
  if (input.kind === 'rack') rackSet(input, at);
  else pitmanSet(input, at);
}

/** A row's field holding the input's position: `{ rack }` (mm) or `{ pitman }` (degrees). */
export function steerInputField(input: SteerInput, at: number): { rack: number } | { pitman: number } {
  return input.kind === 'rack' ? { rack: at } : { pitman: at };
}

/** mm per unit of input (mm of rack, degree of pitman arm): how fast the input moves its frame point at `at`. */
export function steerInputVelocity(input: SteerInput, at: number): Vec3 {
  return input.kind === 'rack' ? input.direction : pitmanVelocity(input, at);
}

/**
 * The rack through the two tie rods' inner ends, positive toward +y; a sentence naming the problem
 * when the two ends are at one place (no line).
 */
export function rackInput(left: PointModel, right: PointModel): RackInput | string {
  const d = vecSub(left.ride, right.ride);
  const len = vecLength(d);
  if (!(len >= MIN_MEMBER_LENGTH_MM))
    return `sweep.steer: the tie rods' inner ends '${left.id}' and '${right.id}' are at one place, so they draw no rack line; no steer sweep.`;
  const u = vecScale(d, (d.y < 0 ? -1 : 1) / len);
  return {
    kind: 'rack',
    points: [left, right].map((point) => ({ point, centre: vec(point.ride.x, point.ride.y, point.ride.z) })),
    direction: u,
  };
}

/**
 * Moves the rack to `travel` (mm): its frame points' positions in the model. The solver reads a frame
 * point where the model places it, so this is what the steer sweep imposes; `rackSet(input, 0)` puts
 * them back where the sketch has them.
 */
export function rackSet(input: RackInput, travel: number): void {
  const u = input.direction;
  for (const { point, centre } of input.points) {
    const at = vec(centre.x + travel * u.x, centre.y + travel * u.y, centre.z + travel * u.z);
    point.ride = at;
    point.local = at;
  }
}
