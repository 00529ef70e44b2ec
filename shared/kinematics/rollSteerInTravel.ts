/**
 * Roll steer through the travel: at each heave row, the axle's yaw per degree of a small roll
 * about that row's pose, in % (the roll sweep's 100 · yaw / roll, taken where roll → 0). A solid
 * axle's roll steer changes with heave (its links' side-view angles do), so one number at ride
 * height does not tell the whole story.
 *
 * It is read from the row's sensitivity to roll: the solver is already converged at the row, so
 * one factorisation and one back-substitution give d(state)/d(roll), about a third of a marched
 * row's cost. The heave rows are mirror-symmetric, so the yaw is odd in roll and the ratio at ±1°
 * differs from this slope only by a third-order term.
 */
import { rowRateFor, type MarchContext, type SolvedRow } from './march';
import { POSE_SIZE, POSE_YAW } from './pose';

const DEG_PER_RAD = 180 / Math.PI;

/**
 * % at each heave row (100 · d yaw / d roll, both in degrees), null where the sensitivity is not
 * finite. `axleSlot` is the axle body's slot; the rows' states are left as they are.
 */
export function rollSteerInTravel(ctx: MarchContext, rows: readonly SolvedRow[], axleSlot: number): (number | null)[] {
  const yaw = axleSlot * POSE_SIZE + POSE_YAW;
  return rows.map((row) => {
    // rad of yaw per degree of roll (drive.ts imposes the roll rate per degree).
    const perDeg = rowRateFor(ctx, row, 'roll').rate[yaw];
    const v = 100 * perDeg * DEG_PER_RAD;
    return Number.isFinite(v) ? v : null;
  });
}
