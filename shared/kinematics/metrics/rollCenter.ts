/**
 * Roll-centre height of a solid axle.
 * - With a lateral rod: z where the rod's rear-view (y–z) line crosses y = 0 (docs/sketch-format.md;
 *   Heisler, Advanced Vehicle Technology, fig. 10.28).
 * - Without one (a triangulated four-link): the roll axis joins the plan-view crossing of the
 *   upper links to that of the lower links (or runs parallel to the lower links when they
 *   are parallel in plan view); the roll centre is its height above the axle's reference
 *   point. Common practice for four-link rear axles, no published source cited here.
 */
import type { Vec3 } from '../vec';
import { lineCrossing2d } from './instantCenter';

/** Rear-view crossing of the rod line with y = 0; null when the rod is (nearly) vertical. */
export function rollCenterFromRod(a: Vec3, b: Vec3): number | null {
  const dy = b.y - a.y;
  if (Math.abs(dy) < 1e-9 * Math.max(1, Math.abs(b.z - a.z))) return null;
  const z = a.z + ((0 - a.y) * (b.z - a.z)) / dy;
  return Number.isFinite(z) ? z : null;
}

/** A point of the roll-axis construction, or a direction when the pair is parallel in plan view. */
type AxisPart = { point: Vec3 } | { direction: Vec3 };

/** Plan-view (x–y) crossing of two links (each [frame end, axle end]); its height averages the two lines' z there. */
function planCrossing(l1: [Vec3, Vec3], l2: [Vec3, Vec3]): AxisPart | null {
  const c = lineCrossing2d(l1[0].x, l1[0].y, l1[1].x, l1[1].y, l2[0].x, l2[0].y, l2[1].x, l2[1].y);
  const zAt = (l: [Vec3, Vec3], x: number, y: number) => {
    const dx = l[1].x - l[0].x,
      dy = l[1].y - l[0].y;
    const t = Math.abs(dx) >= Math.abs(dy) ? (x - l[0].x) / dx : (y - l[0].y) / dy;
    return l[0].z + t * (l[1].z - l[0].z);
  };
  if (c) return { point: { x: c.u, y: c.v, z: (zAt(l1, c.u, c.v) + zAt(l2, c.u, c.v)) / 2 } };
  const d = {
    x: l1[1].x - l1[0].x + (l2[1].x - l2[0].x),
    y: l1[1].y - l1[0].y + (l2[1].y - l2[0].y),
    z: l1[1].z - l1[0].z + (l2[1].z - l2[0].z),
  };
  return { direction: d };
}

/** Roll-axis height (mm) at the fore-aft station `x` from upper and lower link pairs; null when not defined. */
export function rollCenterFromLinkPairs(
  uppers: [[Vec3, Vec3], [Vec3, Vec3]],
  lowers: [[Vec3, Vec3], [Vec3, Vec3]],
  x: number,
): number | null {
  const u = planCrossing(uppers[0], uppers[1]);
  const l = planCrossing(lowers[0], lowers[1]);
  if (!u || !l) return null;
  let p: Vec3, d: Vec3;
  if ('point' in u && 'point' in l) {
    p = u.point;
    d = { x: l.point.x - u.point.x, y: l.point.y - u.point.y, z: l.point.z - u.point.z };
  } else if ('point' in u && 'direction' in l) {
    p = u.point;
    d = l.direction;
  } else if ('point' in l && 'direction' in u) {
    p = l.point;
    d = u.direction;
  } else {
    return null;
  }
  if (Math.abs(d.x) < 1e-9 * Math.hypot(d.x, d.y, d.z)) return null;
  const z = p.z + ((x - p.x) * d.z) / d.x;
  return Number.isFinite(z) ? z : null;
}
