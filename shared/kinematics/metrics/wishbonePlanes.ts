/**
 * The wishbone-plane construction of a double-wishbone knuckle (docs/sketch-format.md): each
 * wishbone is a plane through its two inner pivots and its ball joint; a vertical plane
 * through the wheel centre cuts the two wishbone planes in two lines, whose crossing is the
 * instant centre in that view.
 * - front view: the cross plane x = wheel centre x; lines in (y, z); the line from the
 *   contact patch through the crossing meets y = 0 at the roll centre;
 * - side view: the fore-aft plane y = wheel centre y; lines in (x, z) (used for anti-dive).
 * Plain plane geometry; the test in tests/reference/wishbone.test.ts repeats it by hand with
 * mathjs `intersect`.
 */
import type { Vec3 } from '../vec';
import { INSTANT_CENTER_FAR_LIMIT_MM, PARALLEL_SINE_TOLERANCE } from './instantCenter';

/** A line a·u + b·v = c in the two coordinates of a view (mm). */
export interface ViewLine {
  a: number;
  b: number;
  c: number;
}

/** A point in a view's two coordinates (mm): (y, z) in the front view, (x, z) in the side view. */
export interface ViewPoint {
  u: number;
  v: number;
}

/**
 * Where the plane through p1, p2, p3 (mm) cuts the vertical plane `cut` = `at`: 'x' gives the
 * line in (y, z), 'y' the line in (x, z). Null when the three points are in a line or their
 * plane is parallel to the cut (no line).
 */
export function planeLineInCut(p1: Vec3, p2: Vec3, p3: Vec3, cut: 'x' | 'y', at: number): ViewLine | null {
  const e1 = { x: p2.x - p1.x, y: p2.y - p1.y, z: p2.z - p1.z };
  const e2 = { x: p3.x - p1.x, y: p3.y - p1.y, z: p3.z - p1.z };
  const n = { x: e1.y * e2.z - e1.z * e2.y, y: e1.z * e2.x - e1.x * e2.z, z: e1.x * e2.y - e1.y * e2.x };
  const nLen = Math.hypot(n.x, n.y, n.z);
  if (!(nLen > PARALLEL_SINE_TOLERANCE * Math.hypot(e1.x, e1.y, e1.z) * Math.hypot(e2.x, e2.y, e2.z))) return null;
  // n · (p − p1) = 0 with p's cut coordinate fixed at `at`.
  const line =
    cut === 'x'
      ? { a: n.y, b: n.z, c: n.y * p1.y + n.z * p1.z - n.x * (at - p1.x) }
      : { a: n.x, b: n.z, c: n.x * p1.x + n.z * p1.z - n.y * (at - p1.y) };
  if (!(Math.hypot(line.a, line.b) > PARALLEL_SINE_TOLERANCE * nLen)) return null;
  return line;
}

/** Unit direction (u, v) of a view line. */
export function viewLineDirection(l: ViewLine): ViewPoint {
  const s = Math.hypot(l.a, l.b);
  return { u: -l.b / s, v: l.a / s };
}

/** Crossing of two view lines; null when parallel or farther than INSTANT_CENTER_FAR_LIMIT_MM. */
export function viewLinesCrossing(l1: ViewLine, l2: ViewLine): ViewPoint | null {
  const det = l1.a * l2.b - l2.a * l1.b;
  if (Math.abs(det) < PARALLEL_SINE_TOLERANCE * Math.hypot(l1.a, l1.b) * Math.hypot(l2.a, l2.b)) return null;
  const u = (l1.c * l2.b - l2.c * l1.b) / det;
  const v = (l1.a * l2.c - l2.a * l1.c) / det;
  if (!Number.isFinite(u) || !Number.isFinite(v) || Math.hypot(u, v) > INSTANT_CENTER_FAR_LIMIT_MM) return null;
  return { u, v };
}

/**
 * The line from the contact patch `cp` towards the instant centre: through `ic` when there is
 * one, else parallel to the two (parallel) wishbone lines, whose direction is `parallel`.
 * Returned as a point and a direction; null when neither is usable.
 */
export function patchLine(
  cp: ViewPoint,
  ic: ViewPoint | null,
  parallel: ViewLine | null,
): { point: ViewPoint; direction: ViewPoint } | null {
  if (ic) {
    const du = ic.u - cp.u,
      dv = ic.v - cp.v;
    const len = Math.hypot(du, dv);
    return len > 0 ? { point: cp, direction: { u: du / len, v: dv / len } } : null;
  }
  return parallel ? { point: cp, direction: viewLineDirection(parallel) } : null;
}

/** v where a line (point, direction) crosses u = 0; null when it runs along u = 0 or the crossing is very far. */
export function lineAtCentre(line: { point: ViewPoint; direction: ViewPoint }): number | null {
  const { point, direction } = line;
  if (Math.abs(direction.u) < PARALLEL_SINE_TOLERANCE) return null;
  const v = point.v - (point.u * direction.v) / direction.u;
  return Number.isFinite(v) && Math.abs(v) <= INSTANT_CENTER_FAR_LIMIT_MM ? v : null;
}

/** Crossing of two lines given as (point, direction); null when parallel or very far. */
export function linesCrossing(
  l1: { point: ViewPoint; direction: ViewPoint },
  l2: { point: ViewPoint; direction: ViewPoint },
): ViewPoint | null {
  const toLine = (l: { point: ViewPoint; direction: ViewPoint }): ViewLine => ({
    a: l.direction.v,
    b: -l.direction.u,
    c: l.direction.v * l.point.u - l.direction.u * l.point.v,
  });
  return viewLinesCrossing(toLine(l1), toLine(l2));
}
