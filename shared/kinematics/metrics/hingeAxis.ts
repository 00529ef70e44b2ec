/**
 * Instant centres of an arm turning about a fixed hinge axis. A body with one fixed axis has
 * that axis as its instant axis, so its instant centre in any view plane is where the axis
 * pierces the plane (plain geometry; docs/sketch-format.md, trailing-arm layouts):
 * - side view: the vertical fore-aft plane through the wheel centre (y = wheel y);
 * - rear view: the vertical cross plane through the wheel centre (x = wheel x).
 * The rear-view line from the contact patch through that centre crosses y = 0 at the roll
 * centre, as for any independent suspension (the construction docs/sketch-format.md gives for
 * double wishbones); an axis parallel to the cross plane (a pure trailing arm) puts the
 * centre at infinity along the axis, and the line from the patch runs parallel to the axis.
 */
import type { Vec3 } from '../vec';
import { INSTANT_CENTER_FAR_LIMIT_MM, PARALLEL_SINE_TOLERANCE, lineCrossing2d } from './instantCenter';

/** A point or, for a centre at infinity, a direction, in one view plane (u across, v up; mm). */
export type ViewTarget = { point: { u: number; v: number } } | { direction: { u: number; v: number } };

/**
 * Where the axis through `a` and `b` pierces the plane `coord` = `level` (mm): the view
 * coordinates (u, v) of the crossing — (x, z) for a cut at constant y, (y, z) for a cut at
 * constant x — or the axis' direction in the view when it runs parallel to the plane (or
 * pierces it farther than INSTANT_CENTER_FAR_LIMIT_MM away).
 */
export function axisInView(a: Vec3, b: Vec3, coord: 'x' | 'y', level: number): ViewTarget | null {
  const d = { x: b.x - a.x, y: b.y - a.y, z: b.z - a.z };
  const len = Math.hypot(d.x, d.y, d.z);
  if (!(len > 0)) return null;
  const across = coord === 'y' ? d.x : d.y;
  const along = coord === 'y' ? d.y : d.x;
  if (Math.abs(along) >= PARALLEL_SINE_TOLERANCE * len) {
    const t = (level - (coord === 'y' ? a.y : a.x)) / along;
    const u = (coord === 'y' ? a.x : a.y) + t * across;
    const v = a.z + t * d.z;
    if (Math.hypot(u, v) <= INSTANT_CENTER_FAR_LIMIT_MM) return { point: { u, v } };
  }
  if (Math.hypot(across, d.z) < PARALLEL_SINE_TOLERANCE * len) return null;
  return { direction: { u: across, v: d.z } };
}

/** The line from `from` towards a view target, as a point and a direction; null when it has no direction. */
export function lineToward(
  from: { u: number; v: number },
  target: ViewTarget,
): { u: number; v: number; du: number; dv: number } | null {
  const du = 'point' in target ? target.point.u - from.u : target.direction.u;
  const dv = 'point' in target ? target.point.v - from.v : target.direction.v;
  if (Math.hypot(du, dv) === 0) return null;
  return { u: from.u, v: from.v, du, dv };
}

/** Height (v) where a rear-view line crosses the centreline u = 0; null when the line is (nearly) vertical. */
export function lineAtCentreline(l: { u: number; v: number; du: number; dv: number }): number | null {
  if (Math.abs(l.du) < PARALLEL_SINE_TOLERANCE * Math.hypot(l.du, l.dv)) return null;
  const v = l.v + ((0 - l.u) * l.dv) / l.du;
  return Number.isFinite(v) && Math.abs(v) <= INSTANT_CENTER_FAR_LIMIT_MM ? v : null;
}

/** Crossing of two view lines; null when parallel or farther than INSTANT_CENTER_FAR_LIMIT_MM. */
export function viewLinesCross(
  p: { u: number; v: number; du: number; dv: number },
  q: { u: number; v: number; du: number; dv: number },
): { u: number; v: number } | null {
  const c = lineCrossing2d(p.u, p.v, p.u + p.du, p.v + p.dv, q.u, q.v, q.u + q.du, q.v + q.dv);
  return c && Math.hypot(c.u, c.v) <= INSTANT_CENTER_FAR_LIMIT_MM ? c : null;
}
