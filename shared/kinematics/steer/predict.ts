/**
 * The steer march's predictor: the pose at the next input value from the two rows solved last, by cubic Hermite
 * extrapolation through their poses and their rates to the input.
 *
 * Toward lock the wheels turn faster and faster with the input: the inner tie rod swings toward its steering arm's
 * line, where the input's travel stops growing with the knuckle's turn. A cubic in the input falls short there
 * (a tenth of a millimetre, then a millimetre off at lock, a Newton step more a row). The pose and the input are
 * both smoother functions of the coordinate that moves fastest (the inner knuckle's turn), so the cubic is taken in
 * that coordinate, the guide, and the input's value fixes where on it the next row lies: the local
 * parametrisation of continuation methods (E. L. Allgower and K. Georg, "Numerical Continuation Methods: An
 * Introduction", Springer 1990; from memory, unverified). Where the guide does not move steadily between the two
 * rows, or the input cannot be matched on its cubic, the cubic is taken in the input as before.
 */
import { POSE_ROLL, POSE_SIZE } from '../pose';
import { ROTATION_SCALE_MM } from '../solve';

/** A solved row as the predictor reads it: the input's value, the pose (mm, rad) and its rate to the input. */
export interface PredictorRow {
  at: number;
  state: Float64Array;
  rate: Float64Array;
}

/** Newton steps that find the guide's value for the input; the cubic is monotone near the rows, so a few do. */
const GUIDE_NEWTON_STEPS = 8;
/** The guide's value (as a fraction of its step between the rows) is found when a Newton step is below this. */
const GUIDE_TOLERANCE = 1e-12;

/**
 * The cubic Hermite through (0, y0) and (1, y1) with slopes d0 and d1 (per unit u), at u; and its slope. The
 * predictor extrapolates (u past 1).
 */
function hermite(u: number, y0: number, d0: number, y1: number, d1: number): number {
  const u2 = u * u,
    u3 = u2 * u;
  return (2 * u3 - 3 * u2 + 1) * y0 + (u3 - 2 * u2 + u) * d0 + (3 * u2 - 2 * u3) * y1 + (u3 - u2) * d1;
}

function hermiteSlope(u: number, y0: number, d0: number, y1: number, d1: number): number {
  const u2 = u * u;
  return (6 * u2 - 6 * u) * y0 + (3 * u2 - 4 * u + 1) * d0 + (6 * u - 6 * u2) * y1 + (3 * u2 - 2 * u) * d1;
}

/** The free coordinate moving fastest for the rate `rate` (a radian counted as ROTATION_SCALE_MM). */
function fastestCoordinate(free: Int32Array, rate: Float64Array): number {
  let best = free[0];
  let speed = -1;
  for (const c of free) {
    const s = Math.abs(rate[c]) * (c % POSE_SIZE >= POSE_ROLL ? ROTATION_SCALE_MM : 1);
    if (s > speed) {
      speed = s;
      best = c;
    }
  }
  return best;
}

/**
 * Where (u: 0 at `before`, 1 at `from`) the input's cubic in guide coordinate `g` reaches `to`; null when the guide
 * does not move steadily between the rows (its rate changes sign, or is zero) or Newton does not settle.
 */
function guideAt(g: number, before: PredictorRow, from: PredictorRow, to: number): number | null {
  const step = from.state[g] - before.state[g];
  const span = from.at - before.at;
  // The input's slopes along the guide, per unit u: (dinput/dguide) · (the guide's step).
  const d0 = step / before.rate[g];
  const d1 = step / from.rate[g];
  if (!(d0 / span > 0 && d1 / span > 0)) return null;
  let u = 1 + (to - from.at) / d1;
  for (let k = 0; k < GUIDE_NEWTON_STEPS; k++) {
    const slope = hermiteSlope(u, before.at, d0, from.at, d1);
    const du = (hermite(u, before.at, d0, from.at, d1) - to) / slope;
    if (!Number.isFinite(du)) return null;
    u -= du;
    if (Math.abs(du) < GUIDE_TOLERANCE) return u;
  }
  return null;
}

/**
 * Writes into `out` (its free coordinates) the pose predicted at input `to` from the rows `before` and `from`
 * (solved in that order, `to` beyond `from`).
 */
export function predictPose(
  free: Int32Array,
  before: PredictorRow,
  from: PredictorRow,
  to: number,
  out: Float64Array,
): void {
  const g = fastestCoordinate(free, from.rate);
  const u = guideAt(g, before, from, to);
  if (u !== null) {
    // Each coordinate's slope along the guide is its rate over the guide's rate.
    const step = from.state[g] - before.state[g];
    const s0 = step / before.rate[g];
    const s1 = step / from.rate[g];
    for (const c of free) out[c] = hermite(u, before.state[c], s0 * before.rate[c], from.state[c], s1 * from.rate[c]);
    return;
  }
  const span = from.at - before.at;
  const t = (to - before.at) / span;
  for (const c of free) out[c] = hermite(t, before.state[c], span * before.rate[c], from.state[c], span * from.rate[c]);
}
