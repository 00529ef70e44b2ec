/** Small 3-vector helpers (mm unless said otherwise). Plain objects: they go into results. */
import { vecDistance, type Vec3 } from '../vec3';

// The vector type and the distance have one definition (shared/vec3), which the schema may use too.
export { vecDistance, type Vec3 };

export const vec = (x: number, y: number, z: number): Vec3 => ({ x, y, z });
export const vecSub = (a: Vec3, b: Vec3): Vec3 => ({ x: a.x - b.x, y: a.y - b.y, z: a.z - b.z });
export const vecAdd = (a: Vec3, b: Vec3): Vec3 => ({ x: a.x + b.x, y: a.y + b.y, z: a.z + b.z });
export const vecScale = (a: Vec3, k: number): Vec3 => ({ x: a.x * k, y: a.y * k, z: a.z * k });
export const vecDot = (a: Vec3, b: Vec3): number => a.x * b.x + a.y * b.y + a.z * b.z;
export const vecCross = (a: Vec3, b: Vec3): Vec3 => ({
  x: a.y * b.z - a.z * b.y,
  y: a.z * b.x - a.x * b.z,
  z: a.x * b.y - a.y * b.x,
});
export const vecLength = (a: Vec3): number => Math.hypot(a.x, a.y, a.z);
export const vecMid = (a: Vec3, b: Vec3): Vec3 => ({ x: (a.x + b.x) / 2, y: (a.y + b.y) / 2, z: (a.z + b.z) / 2 });

/** Angle between two directions in radians, in [0, π]; atan2 form stays accurate near 0 and π. */
export function vecAngle(a: Vec3, b: Vec3): number {
  return Math.atan2(vecLength(vecCross(a, b)), vecDot(a, b));
}
