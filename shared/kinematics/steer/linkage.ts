/**
 * What a steered layout hands the steer sweep: the steering input (the frame points it moves and
 * how), and on each side the body carrying the wheel, its steering axis and its tie rod. A layout's
 * reader supplies it (`LayoutReader.steering`); the sweep never looks at `layout`. The rack is the
 * one input so far: the line through the two tie rods' inner ends, moved along itself.
 */
import { MIN_MEMBER_LENGTH_MM } from '../../schema/sketchVocabulary';
import type { BodyModel, PointModel } from '../model';
import { vec, vecLength, vecScale, vecSub, type Vec3 } from '../vec';

/** One side of a steered front. */
export interface SteerSide {
  side: 'left' | 'right';
  /** the body carrying the wheel (the knuckle) */
  body: BodyModel;
  wheel: PointModel;
  /** two points on the steering axis, lower then upper (the ball joints) */
  axis: [PointModel, PointModel];
  /** the tie rod: `inner` moved by the input, `outer` on the steering arm */
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

export interface SteerLinkage {
  input: RackInput;
  left: SteerSide;
  right: SteerSide;
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
