/**
 * The one 3-vector of Arcwright and the distance between two of them, for every part that needs them:
 * the kinematics, the schema's checks, the board and the build sheet. Plain objects in mm, on the sketch
 * file's axes. Further vector helpers live in shared/kinematics/vec.
 */
import type { Mm } from './units';

export interface Vec3 {
  x: Mm;
  y: Mm;
  z: Mm;
}

/** Straight-line distance between two points (mm). */
export const vecDistance = (a: Vec3, b: Vec3): Mm => Math.hypot(a.x - b.x, a.y - b.y, a.z - b.z);
