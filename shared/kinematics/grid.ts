/**
 * The values a sweep visits. Heave rows are the multiples of `step` between `droop` and
 * `bump`, plus the two ends themselves when they are not multiples; so travel 0 (ride
 * height, where the sweep starts marching) is always a row. Roll rows work the same way
 * between −roll and +roll. With the default −150..150 by 5 this gives 61 rows.
 */
import { GRID_MERGE_TOLERANCE, sideCount } from '../schema/sweepGrid';

/** Grid values are rounded to 1e-9 of their unit (far below any step a sketch can ask for). */
const GRID_ROUNDING = 1e9;

/**
 * Outward marching order from 0: the positive side first, then the negative side,
 * each ordered away from 0. Both lists exclude 0 itself.
 */
export interface MarchPlan {
  /** 0 < v1 < v2 < … ≤ hi */
  up: number[];
  /** 0 > v1 > v2 > … ≥ lo */
  down: number[];
}

function side(limit: number, step: number): number[] {
  const out: number[] = [];
  const n = sideCount(limit, step);
  for (let k = 1; k <= n; k++) out.push(Math.min(k * step, limit));
  // Round multiples of the step so that rows read 5, 10, … rather than 15.000000000000002.
  return out.map((v) =>
    Math.abs(v - limit) <= GRID_MERGE_TOLERANCE ? limit : Math.round(v * GRID_ROUNDING) / GRID_ROUNDING,
  );
}

/** The outward plan for a sweep from `lo` (≤ 0) to `hi` (≥ 0) by `step` (> 0). */
export function marchPlan(lo: number, hi: number, step: number): MarchPlan {
  return { up: side(hi, step), down: side(-lo, step).map((v) => -v) };
}
