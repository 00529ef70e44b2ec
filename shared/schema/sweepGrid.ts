/**
 * How many rows a sweep grid holds. The schema refuses a sketch whose sweep would
 * produce too many rows, and the kinematics marches the same grid (shared/kinematics/grid.ts),
 * so the count lives on the schema side: the schema never imports the kinematics.
 */

/** Two grid values closer than this (in the sweep's own unit) count as one. */
export const GRID_MERGE_TOLERANCE = 1e-9;

/** Number of values on one side of 0 reaching `limit` (> 0) by `step` (> 0), ends included. */
export function sideCount(limit: number, step: number): number {
  if (!(limit > GRID_MERGE_TOLERANCE)) return 0;
  const whole = Math.floor(limit / step + GRID_MERGE_TOLERANCE);
  const onGrid = Math.abs(whole * step - limit) <= GRID_MERGE_TOLERANCE * Math.max(1, limit);
  return whole + (onGrid ? 0 : 1);
}

/** Rows a sweep from `lo` (≤ 0) to `hi` (≥ 0) by `step` produces, ride row included. */
export function gridCount(lo: number, hi: number, step: number): number {
  if (!(step > 0) || !Number.isFinite(lo) || !Number.isFinite(hi)) return Number.POSITIVE_INFINITY;
  return 1 + sideCount(hi, step) + sideCount(-lo, step);
}
