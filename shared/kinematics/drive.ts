/**
 * What a sweep imposes. A row is set by two numbers, heave travel (mm) and roll (deg);
 * the heave sweep holds roll at 0, the roll sweep holds travel at 0, the grid varies both.
 * - solid axle: z = travel, roll = roll (docs/sketch-format.md);
 * - wheel carrier (arm, knuckle): its wheel centre's z = travel ± halfTrack·tan(roll),
 *   left side up for positive roll, as the axle's wheels would move;
 * - free bodies: nothing imposed (a body of one point: its rotation, which moves nothing, is held).
 */
import { degToRad } from '../units';
import type { BodyModel, LinkageModel } from './model';
import { POSE_ROLL, POSE_SIZE, POSE_Z } from './pose';

export interface Drive {
  /** 1 where a state coordinate is imposed */
  imposed: Uint8Array;
  /** indices of the solved coordinates, in state order */
  free: Int32Array;
}

/** The error for a body role the sweep does not know how to drive. */
function unknownRoleError(role: never): Error {
  return new Error(`The sweep has no drive for a body of role '${String(role)}'.`);
}

/** Marks the coordinates the sweep imposes on body `b` in `imposed`. */
function imposeOn(imposed: Uint8Array, b: BodyModel): void {
  const o = b.slot * POSE_SIZE;
  switch (b.role) {
    case 'axle':
      imposed[o + POSE_Z] = 1;
      imposed[o + POSE_ROLL] = 1;
      return;
    case 'wheel-carrier':
      imposed[o + POSE_Z] = 1;
      return;
    case 'free':
      if (b.pointCount <= 1) {
        // A body of one point (a shackle's swinging eye): its rotation moves nothing, so it is held.
        imposed[o + POSE_ROLL] = 1;
        imposed[o + POSE_ROLL + 1] = 1;
        imposed[o + POSE_ROLL + 2] = 1;
      }
      return;
    default:
      throw unknownRoleError(b.role);
  }
}

export function driveBuild(model: LinkageModel): Drive {
  const imposed = new Uint8Array(model.stateSize);
  for (const b of model.bodies) imposeOn(imposed, b);
  const free: number[] = [];
  for (let i = 0; i < model.stateSize; i++) if (!imposed[i]) free.push(i);
  return { imposed, free: Int32Array.from(free) };
}

/** Writes the imposed coordinates for (travel mm, roll deg) into `state` (mm, rad). */
export function driveApply(model: LinkageModel, state: Float64Array, travel: number, rollDeg: number): void {
  const roll = degToRad(rollDeg);
  for (const b of model.bodies) {
    const o = b.slot * POSE_SIZE;
    switch (b.role) {
      case 'axle':
        state[o + POSE_Z] = travel;
        state[o + POSE_ROLL] = roll;
        break;
      case 'wheel-carrier': {
        const sign = b.side === 'left' ? 1 : -1;
        state[o + POSE_Z] = travel + sign * b.halfTrack * Math.tan(roll);
        break;
      }
      case 'free':
        break;
      default:
        throw unknownRoleError(b.role);
    }
  }
}

/**
 * Writes d(imposed coordinates)/d(parameter) into `rate` (zero elsewhere): per mm of travel
 * (`wrt` = 'travel') or per degree of roll (`wrt` = 'roll').
 */
export function driveRate(model: LinkageModel, rate: Float64Array, wrt: 'travel' | 'roll', rollDeg: number): void {
  rate.fill(0);
  const perDeg = Math.PI / 180;
  const roll = degToRad(rollDeg);
  for (const b of model.bodies) {
    const o = b.slot * POSE_SIZE;
    switch (b.role) {
      case 'axle':
        if (wrt === 'travel') rate[o + POSE_Z] = 1;
        else rate[o + POSE_ROLL] = perDeg;
        break;
      case 'wheel-carrier': {
        const sign = b.side === 'left' ? 1 : -1;
        const sec = 1 / Math.cos(roll);
        rate[o + POSE_Z] = wrt === 'travel' ? 1 : sign * b.halfTrack * sec * sec * perDeg;
        break;
      }
      case 'free':
        break;
      default:
        throw unknownRoleError(b.role);
    }
  }
}
