/**
 * A steering trapezoid solved by hand, for the steer checks: kingpins vertical at y = ±700 through both ball
 * joints, steering arms level at z = 300 from the kingpin to (−150, ±660), tie rods 360 mm level to the rack ends
 * at (−150, ±300): a planar four-bar each side, whose knuckle angle is the closed-form root of
 * a·cos θ + b·sin θ = c (the tie rod's length; plane geometry).
 */
import { DEG } from './rigidPose';
import type { WishboneRig } from './wishboneRigs';

export const trapezoid: WishboneRig = {
  wheel: [800, 350],
  lowerInner: [400, 150],
  lowerJoint: [700, 150],
  upperInner: [450, 550],
  upperJoint: [700, 550],
  tieRodX: -150,
  tieRodInner: [300, 300],
  tieRodOuter: [660, 300],
};
export const KINGPIN_Y = 700;

/** deg, the knuckle's angle about its vertical kingpin with the rack at `rack` (closed form, branch through 0). */
export function trapezoidAngle(side: 1 | -1, rack: number): number {
  const k = [0, side * KINGPIN_Y];
  const d = [-150, side * (660 - KINGPIN_Y)];
  const q = [-150, side * 300 + rack];
  const L = 360;
  const e = [k[0] - q[0], k[1] - q[1]];
  // |e + Rθ d|² = L²  ⇒  a cos θ + b sin θ = c
  const a = e[0] * d[0] + e[1] * d[1];
  const b = e[1] * d[0] - e[0] * d[1];
  const c = (L * L - (e[0] ** 2 + e[1] ** 2) - (d[0] ** 2 + d[1] ** 2)) / 2;
  const phi = Math.atan2(b, a);
  const spread = Math.acos(c / Math.hypot(a, b));
  const roots = [phi + spread, phi - spread].map((t) => Math.atan2(Math.sin(t), Math.cos(t)));
  return roots.reduce((x, y) => (Math.abs(y) < Math.abs(x) ? y : x)) / DEG;
}
