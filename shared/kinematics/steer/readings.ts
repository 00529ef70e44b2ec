/**
 * What a steer row reports from the two wheels' steer angles (deg, positive toward the vehicle's left):
 * - Ackermann %: the inner wheel's angle against the ideal one for the outer wheel's. The ideal is the
 *   Ackermann condition cot(δo) − cot(δi) = t / L (both wheels rolling about one point on the rear axle
 *   line; t the distance between the steering axes at the ground, L the wheelbase): Gillespie,
 *   "Fundamentals of Vehicle Dynamics", SAE 1992, ch. 8 (from memory, unverified), solved for the inner
 *   angle as δi = atan(L / (L / tan δo − t)). Ackermann % = 100 · (δi − δo) / (δi,ideal − δo): 100 is
 *   true Ackermann, 0 parallel steer, negative the inner wheel turning less than the outer.
 * - the turning radius: from the turning centre, where the outer wheel's axle line in the ground meets the
 *   rear axle line, to the outer wheel's contact patch (plain plane geometry).
 * Straight ahead neither is defined: null, never NaN or infinity.
 */
import type { Deg, Mm } from '../../units';

const DEG = Math.PI / 180;

/** Below this (deg) the outer wheel counts as straight ahead: no turn, no Ackermann, no radius. */
export const STRAIGHT_AHEAD_DEG = 1e-6;

/** Which way the pair turns and which wheel is inner: +1 left (the left wheel inner), −1 right, 0 straight. */
export function turnSense(leftSteer: Deg, rightSteer: Deg): 1 | -1 | 0 {
  const sum = leftSteer + rightSteer;
  return Math.abs(sum) < 2 * STRAIGHT_AHEAD_DEG ? 0 : sum > 0 ? 1 : -1;
}

/** The inner and outer wheels' angles (deg) as turned toward the turn (both normally positive); null straight ahead. */
export function innerOuter(leftSteer: Deg, rightSteer: Deg): { inner: Deg; outer: Deg; sense: 1 | -1 } | null {
  const sense = turnSense(leftSteer, rightSteer);
  if (sense === 0) return null;
  return sense > 0 ? { inner: leftSteer, outer: rightSteer, sense } : { inner: -rightSteer, outer: -leftSteer, sense };
}

/**
 * deg, the inner wheel's angle the Ackermann condition asks for with the outer wheel at `outer` (deg),
 * wheelbase `L` and steering axes `t` apart at the ground (mm); null straight ahead.
 */
export function idealInner(outer: Deg, L: Mm, t: Mm): Deg | null {
  if (!(Math.abs(outer) > STRAIGHT_AHEAD_DEG)) return null;
  // atan2 keeps the answer right past 90° (L / tan δo < t: a very tight lock), where atan would fold it back.
  const v = Math.atan2(L, L / Math.tan(outer * DEG) - t) / DEG;
  return Number.isFinite(v) ? v : null;
}

/** %, 100 · (inner − outer) / (ideal inner − outer); null straight ahead or where the ideal equals the outer angle. */
export function ackermannPercent(inner: Deg, outer: Deg, L: Mm, t: Mm): number | null {
  const ideal = idealInner(outer, L, t);
  if (ideal === null) return null;
  const span = ideal - outer;
  if (!(Math.abs(span) > STRAIGHT_AHEAD_DEG)) return null;
  const v = (100 * (inner - outer)) / span;
  return Number.isFinite(v) ? v : null;
}

/**
 * mm, the turning radius to the outer wheel's contact patch `patch` (ground-plane x, y), the outer wheel
 * steered `outerSteer` (deg, signed as yaw), the rear axle line at x = `rearX`; null straight ahead.
 */
export function turningRadius(patch: { x: Mm; y: Mm }, outerSteer: Deg, rearX: Mm): Mm | null {
  const s = Math.sin(outerSteer * DEG);
  if (!(Math.abs(outerSteer) > STRAIGHT_AHEAD_DEG)) return null;
  // The axle line through the patch runs along (−sin δ, cos δ); it meets x = rearX after (patch.x − rearX) / sin δ.
  const along = (patch.x - rearX) / s;
  const v = Math.abs(along);
  return Number.isFinite(v) ? v : null;
}
