/**
 * Anti-lift of a solid axle (brakes on the axle, drive torque reacted in its housing: the line
 * runs from the tyre contact patch through the side-view instant centre), by the side-view
 * instant centre method (Milliken & Milliken, Race Car Vehicle Dynamics, ch. 17, anti-lift;
 * formula forms from memory, unverified):
 * - a rear axle in braking: %anti-lift = (rear brake share) · tanθ · (wheelbase / cgHeight),
 *   θ the line's angle above the ground rising forward to the instant centre (the anti-squat line);
 * - a front axle under power: %anti-lift = (front drive share) · tanθ · (wheelbase / cgHeight),
 *   θ rising rearward (the anti-dive line, metrics/antiDive.ts). The sweep takes the whole tractive
 *   force on the axle swept (share 100 %), as anti-squat does for a rear axle.
 * 100 % means the load transfer at that axle is carried by the links alone: the end does not rise.
 */
import type { SidePoint } from '../types';
import { antiDivePercent } from './antiDive';
import { antiSquatPercent } from './antiSquat';

/** %, of the tractive force on the axle swept when it is the only driven one (see the comment above). */
export const DRIVEN_AXLE_SHARE_PERCENT = 100;

/**
 * Anti-lift of a rear solid axle in braking.
 * @param rearBrakeShare % of the braking force on the rear axle (100 − the front share)
 * @param parallelSlope dz/dx of the (parallel) side-view link lines when `ic` is null
 * @returns % anti-lift, or null when not defined
 */
export function rearAntiLiftBrakingPercent(
  ic: SidePoint | null,
  cp: SidePoint,
  rearBrakeShare: number,
  cgHeight: number,
  wheelbase: number,
  parallelSlope: number | null = null,
): number | null {
  // The anti-squat ratio is tanθ·L/h in %; braking carries the rear share of it.
  const full = antiSquatPercent(ic, cp, cgHeight, wheelbase, parallelSlope);
  if (full === null) return null;
  const v = (full * rearBrakeShare) / 100;
  return Number.isFinite(v) ? v : null;
}

/**
 * Anti-lift of a front solid axle under power, the axle taking the whole tractive force.
 * @returns % anti-lift, or null when not defined
 */
export function frontAntiLiftPowerPercent(
  ic: SidePoint | null,
  cp: SidePoint,
  cgHeight: number,
  wheelbase: number,
  parallelSlope: number | null = null,
): number | null {
  // Same line and ratio as anti-dive, with the drive share in place of the brake share.
  return antiDivePercent(ic, cp, DRIVEN_AXLE_SHARE_PERCENT, cgHeight, wheelbase, parallelSlope);
}
