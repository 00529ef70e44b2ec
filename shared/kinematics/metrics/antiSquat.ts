/**
 * Anti-squat of a solid drive axle: the line from the tyre contact patch through the
 * side-view instant centre; %AS = 100 · tanθ / (h / L) (Milliken & Milliken, Race Car
 * Vehicle Dynamics, ch. 17; Gillespie, Fundamentals of Vehicle Dynamics, ch. 2 — formula
 * forms from memory, unverified), in the form of docs/sketch-format.md:
 *   100 · ((IC.z − cp.z) / (IC.x − cp.x)) / (cgHeight / wheelbase).
 */
import type { SidePoint } from '../types';

/** The instant centre closer than this (mm) fore-aft to the patch makes tanθ meaningless. */
export const ANTI_SQUAT_MIN_RUN_MM = 1e-6;

/**
 * Anti-squat in % from the contact patch `cp` (x, z; mm) and the instant centre `ic`.
 * When the links are parallel (`ic` null) the line runs parallel to them: pass their
 * side-view slope dz/dx as `parallelSlope`. Null when not defined.
 */
export function antiSquatPercent(
  ic: SidePoint | null,
  cp: SidePoint,
  cgHeight: number,
  wheelbase: number,
  parallelSlope: number | null = null,
): number | null {
  let tan: number;
  if (ic) {
    const run = ic.x - cp.x;
    if (Math.abs(run) < ANTI_SQUAT_MIN_RUN_MM) return null;
    tan = (ic.z - cp.z) / run;
  } else if (parallelSlope !== null && Number.isFinite(parallelSlope)) {
    tan = parallelSlope;
  } else {
    return null;
  }
  const v = (100 * tan) / (cgHeight / wheelbase);
  return Number.isFinite(v) ? v : null;
}
