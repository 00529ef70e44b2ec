/**
 * The note for a steered front axle whose wheels steer over bumps (`warnings`): when the bump steer over the
 * heave sweep is larger than BUMP_STEER_NOTE_DEG, it names the drag link and the track bar, how far apart their
 * front-view angles are and how much their lengths differ, the classic cause (docs/design/steered-front-axle.md).
 */
import type { LinkageModel, PointModel } from '../../model';
import type { HeaveRow } from '../../types';
import { radToDeg } from '../../../units';
import type { SteeredAxlePlan } from './plan';

/**
 * deg: bump steer of either wheel over the travel beyond which the note is given. A driver feels a wheel steering
 * by itself over bumps of about this much; common practice, no published source.
 */
export const BUMP_STEER_NOTE_DEG = 0.5;

/** deg, a rod's front-view (y–z) angle from level, read from its left end to its right end. */
function frontViewAngle(a: PointModel, b: PointModel): number {
  const [l, r] = a.ride.y >= b.ride.y ? [a, b] : [b, a];
  return radToDeg(Math.atan2(r.ride.z - l.ride.z, l.ride.y - r.ride.y));
}

const rodLength = (a: PointModel, b: PointModel) =>
  Math.hypot(a.ride.x - b.ride.x, a.ride.y - b.ride.y, a.ride.z - b.ride.z);

export function steeredAxleNotes(model: LinkageModel, plan: SteeredAxlePlan, heave: HeaveRow[]): string[] {
  let worst: { value: number; travel: number; side: 'left' | 'right' } | null = null;
  for (const row of heave) {
    if (!row.wheelSteer) continue;
    for (const side of ['left', 'right'] as const) {
      const v = row.wheelSteer[side];
      if (!worst || Math.abs(v) > Math.abs(worst.value)) worst = { value: v, travel: row.travel, side };
    }
  }
  if (!worst || !(Math.abs(worst.value) > BUMP_STEER_NOTE_DEG)) return [];
  const steer =
    `The wheels steer by themselves over bumps: the ${worst.side} wheel turns ${worst.value.toFixed(2)}° ` +
    `at ${worst.travel} mm of travel.`;
  const rod = model.sketch.members.find((m) => m.kind === 'lateral-rod');
  const drag = plan.dragLink;
  if (!rod || !drag) return [steer];
  const ra = model.points.get(rod.a)!;
  const rb = model.points.get(rod.b)!;
  const angle = frontViewAngle(drag.a, drag.b) - frontViewAngle(ra, rb);
  const longer = rodLength(drag.a, drag.b) - rodLength(ra, rb);
  return [
    `${steer} The drag link '${drag.member}' and the track bar '${rod.id}' are ${Math.abs(angle).toFixed(1)}° apart in ` +
      `front view and differ by ${Math.abs(longer).toFixed(0)} mm in length; parallel rods of equal length do not steer the wheels.`,
  ];
}
