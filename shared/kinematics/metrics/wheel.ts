/**
 * Attitude of an independent wheel from the pose of the body that carries it (a trailing
 * arm or a knuckle), as changes from ride (docs/sketch-format.md, trailing-arm and
 * double-wishbone heave rows):
 * - `camberChange` (deg, rear view, positive when the top of the wheel leans out),
 * - `toeChange` (deg, top view, positive toe-in),
 * - `trackChange` (mm, change of the wheel centre's distance from y = 0),
 * - `foreAftShift` (mm, change of the wheel centre's x).
 *
 * Camber and toe are read off the wheel's spin axis only, so the wheel turning about its
 * own axis (an arm pitching about a hinge parallel to y) changes neither. The spin axis at
 * ride is the body's lateral axis unless the caller gives it (a sketch has no static
 * camber or toe field; with one, pass its ride axis and the changes stay changes).
 * Plain geometry: the rear-view angle of the outward spin axis below the horizontal is
 * the camber (the wheel plane is perpendicular to that axis), its top-view angle ahead of
 * the lateral is the toe-in.
 */
import * as units from '../../units';
import type { Deg, Mm } from '../../units';
import * as poseModule from '../pose';
import type { Pose } from '../types';
import * as vectors from '../vec';
import type { Vec3 } from '../vec';

/**
 * Module-local copies of imported bindings (under the CommonJS interop Node runs this code
 * with, every use of an imported binding is a getter call; this runs at every row).
 */
const degToRad = units.degToRad;
const radToDeg = units.radToDeg;
const mat3Apply = poseModule.mat3Apply;
const rotationSetFill = poseModule.rotationSetFill;
const vec = vectors.vec;

/** Scratch of `wheelAttitude` (synchronous, so one set serves every call): rotation set and a 3-vector. */
const attitudeRotation = poseModule.rotationSetCreate();
const attitudeOut = new Float64Array(3);

export type WheelSide = 'left' | 'right';

/** Changes of an independent wheel's attitude from ride. */
export interface WheelAttitude {
  /** deg, rear view, positive when the top of the wheel leans out */
  camberChange: Deg;
  /** deg, top view, positive toe-in */
  toeChange: Deg;
  /** mm, change of the wheel centre's distance from y = 0 (positive: the track widens) */
  trackChange: Mm;
  /** mm, change of the wheel centre's x (positive forward) */
  foreAftShift: Mm;
}

/** Unit spin axis pointing out of the vehicle at ride when none is given: +y on the left, −y on the right. */
export function outwardAxis(side: WheelSide): Vec3 {
  return vec(0, side === 'left' ? 1 : -1, 0);
}

/** Camber (deg, rear view, top out positive) of a wheel whose outward spin axis is `n` (any length). */
export function camberOfAxis(n: Vec3, side: WheelSide): Deg {
  const s = side === 'left' ? 1 : -1;
  // Top of the wheel leaning out tips the outward axis below the horizontal.
  return radToDeg(Math.atan2(-n.z, s * n.y));
}

/** Toe (deg, top view, toe-in positive) of a wheel whose outward spin axis is `n` (any length). */
export function toeOfAxis(n: Vec3, side: WheelSide): Deg {
  const s = side === 'left' ? 1 : -1;
  // Toe-in turns the front of the wheel inward, which swings the outward axis forward.
  return radToDeg(Math.atan2(n.x, s * n.y));
}

/**
 * Attitude changes of a wheel from ride.
 * @param pose the carrying body's pose (mm, deg) about `reference`
 * @param reference mm, the body's reference point at ride (the wheel centre for arms and knuckles)
 * @param rideCentre mm, the wheel centre at ride
 * @param side which side the wheel is on (sets the outward direction and the toe-in sign)
 * @param rideSpinAxis outward spin axis at ride (any length); default the lateral axis
 */
export function wheelAttitude(
  pose: Pose,
  reference: Vec3,
  rideCentre: Vec3,
  side: WheelSide,
  rideSpinAxis: Vec3 = outwardAxis(side),
): WheelAttitude {
  const rs = attitudeRotation;
  rotationSetFill(rs, degToRad(pose.roll), degToRad(pose.pitch), degToRad(pose.yaw));
  const out = attitudeOut;
  mat3Apply(rs, 0, rideSpinAxis.x, rideSpinAxis.y, rideSpinAxis.z, out, 0);
  const axis = vec(out[0], out[1], out[2]);
  mat3Apply(rs, 0, rideCentre.x - reference.x, rideCentre.y - reference.y, rideCentre.z - reference.z, out, 0);
  const centre = vec(reference.x + pose.x + out[0], reference.y + pose.y + out[1], reference.z + pose.z + out[2]);
  return {
    camberChange: camberOfAxis(axis, side) - camberOfAxis(rideSpinAxis, side),
    toeChange: toeOfAxis(axis, side) - toeOfAxis(rideSpinAxis, side),
    trackChange: Math.abs(centre.y) - Math.abs(rideCentre.y),
    foreAftShift: centre.x - rideCentre.x,
  };
}
