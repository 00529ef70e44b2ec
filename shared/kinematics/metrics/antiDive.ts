/**
 * Anti-dive of a front suspension under braking (outboard brakes: the brake reaction goes into
 * the knuckle, so the line runs from the tyre contact patch through the side-view instant
 * centre of the knuckle's motion):
 *   %anti-dive = (front brake share) · tanθ · (wheelbase / cgHeight) · 100,
 * θ the angle of that line above the ground, rising rearward towards the instant centre
 * (Milliken & Milliken, Race Car Vehicle Dynamics, ch. 17, "anti-dive"; Gillespie,
 * Fundamentals of Vehicle Dynamics, ch. 7 — formula form from memory, unverified).
 * 100 % means the braking load transfer is carried by the links alone and the front does
 * not dive.
 */
import type { SidePoint } from '../types';
import { ANTI_SQUAT_MIN_RUN_MM } from './antiSquat';

/**
 * @param ic side-view instant centre (mm) or null when the wishbone lines are parallel in side view
 * @param cp contact patch (mm): x of the wheel centre, z of the ground
 * @param frontBrakeShare % of the braking force on the front axle
 * @param parallelSlope dz/dx of the (parallel) side-view lines when `ic` is null
 * @returns % anti-dive, or null when not defined
 */
export function antiDivePercent(
  ic: SidePoint | null,
  cp: SidePoint,
  frontBrakeShare: number,
  cgHeight: number,
  wheelbase: number,
  parallelSlope: number | null = null,
): number | null {
  let tan: number;
  if (ic) {
    // The instant centre of a front knuckle lies behind the patch for anti-dive: run rearward.
    const run = cp.x - ic.x;
    if (Math.abs(run) < ANTI_SQUAT_MIN_RUN_MM) return null;
    tan = (ic.z - cp.z) / run;
  } else if (parallelSlope !== null && Number.isFinite(parallelSlope)) {
    // Rising rearward is a negative dz/dx.
    tan = -parallelSlope;
  } else {
    return null;
  }
  const v = frontBrakeShare * tan * (wheelbase / cgHeight);
  return Number.isFinite(v) ? v : null;
}
