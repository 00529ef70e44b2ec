/**
 * Pose maths. A pose is (x, y, z, roll, pitch, yaw): the translation of a body's
 * reference point from its ride position and the rotation R = Rz(yaw)·Ry(pitch)·Rx(roll)
 * about that point (docs/sketch-format.md; ISO 8855 signs). Inside the core a pose is six
 * numbers in a Float64Array slot, translations in mm and angles in radians.
 */
import { degToRad, radToDeg } from '../units';
import type { Pose } from './types';
import type { Vec3 } from './vec';

/** Offsets of the six pose coordinates inside a body's slot of the state vector. */
export const POSE_X = 0;
export const POSE_Y = 1;
export const POSE_Z = 2;
export const POSE_ROLL = 3;
export const POSE_PITCH = 4;
export const POSE_YAW = 5;
export const POSE_SIZE = 6;
export const POSE_COORD_NAMES = ['x', 'y', 'z', 'roll', 'pitch', 'yaw'] as const;

/**
 * A body's rotation and its three partial derivatives, row-major 3×3 each:
 * [R, ∂R/∂roll, ∂R/∂pitch, ∂R/∂yaw] in 36 numbers.
 */
export type RotationSet = Float64Array;

export function rotationSetCreate(): RotationSet {
  return new Float64Array(36);
}

/** Fills `out` with R(roll, pitch, yaw) (radians) and its partial derivatives (per radian). */
export function rotationSetFill(out: RotationSet, roll: number, pitch: number, yaw: number): void {
  const cr = Math.cos(roll),
    sr = Math.sin(roll);
  const cp = Math.cos(pitch),
    sp = Math.sin(pitch);
  const cy = Math.cos(yaw),
    sy = Math.sin(yaw);
  // R = Rz·Ry·Rx written out.
  out[0] = cy * cp;
  out[1] = cy * sp * sr - sy * cr;
  out[2] = cy * sp * cr + sy * sr;
  out[3] = sy * cp;
  out[4] = sy * sp * sr + cy * cr;
  out[5] = sy * sp * cr - cy * sr;
  out[6] = -sp;
  out[7] = cp * sr;
  out[8] = cp * cr;
  // ∂R/∂roll = Rz·Ry·∂Rx
  out[9] = 0;
  out[10] = cy * sp * cr + sy * sr;
  out[11] = -cy * sp * sr + sy * cr;
  out[12] = 0;
  out[13] = sy * sp * cr - cy * sr;
  out[14] = -sy * sp * sr - cy * cr;
  out[15] = 0;
  out[16] = cp * cr;
  out[17] = -cp * sr;
  // ∂R/∂pitch = Rz·∂Ry·Rx
  out[18] = -cy * sp;
  out[19] = cy * cp * sr;
  out[20] = cy * cp * cr;
  out[21] = -sy * sp;
  out[22] = sy * cp * sr;
  out[23] = sy * cp * cr;
  out[24] = -cp;
  out[25] = -sp * sr;
  out[26] = -sp * cr;
  // ∂R/∂yaw = ∂Rz·Ry·Rx
  out[27] = -sy * cp;
  out[28] = -sy * sp * sr - cy * cr;
  out[29] = -sy * sp * cr + cy * sr;
  out[30] = cy * cp;
  out[31] = cy * sp * sr - sy * cr;
  out[32] = cy * sp * cr + sy * sr;
  out[33] = 0;
  out[34] = 0;
  out[35] = 0;
}

/** Multiplies the 3×3 block at `offset` of `m` by (x, y, z); writes into out[o..o+2]. */
export function mat3Apply(
  m: Float64Array,
  offset: number,
  x: number,
  y: number,
  z: number,
  out: Float64Array,
  o: number,
): void {
  out[o] = m[offset] * x + m[offset + 1] * y + m[offset + 2] * z;
  out[o + 1] = m[offset + 3] * x + m[offset + 4] * y + m[offset + 5] * z;
  out[o + 2] = m[offset + 6] * x + m[offset + 7] * y + m[offset + 8] * z;
}

/** The zero pose (ride position). */
export function poseZero(): Pose {
  return { x: 0, y: 0, z: 0, roll: 0, pitch: 0, yaw: 0 };
}

/** Reads a body's slot of the state (mm, rad) as a Pose (mm, deg). */
export function poseFromState(state: Float64Array, slot: number): Pose {
  const o = slot * POSE_SIZE;
  return {
    x: state[o + POSE_X],
    y: state[o + POSE_Y],
    z: state[o + POSE_Z],
    roll: radToDeg(state[o + POSE_ROLL]),
    pitch: radToDeg(state[o + POSE_PITCH]),
    yaw: radToDeg(state[o + POSE_YAW]),
  };
}

/**
 * Places a point of a body, given at its ride position `p`, by the body's pose about the
 * body's reference point `ref` (all mm; pose angles in degrees).
 */
export function poseApply(pose: Pose, ref: Vec3, p: Vec3): Vec3 {
  const rs = rotationSetCreate();
  rotationSetFill(rs, degToRad(pose.roll), degToRad(pose.pitch), degToRad(pose.yaw));
  const out = new Float64Array(3);
  mat3Apply(rs, 0, p.x - ref.x, p.y - ref.y, p.z - ref.z, out, 0);
  return { x: ref.x + pose.x + out[0], y: ref.y + pose.y + out[1], z: ref.z + pose.z + out[2] };
}
