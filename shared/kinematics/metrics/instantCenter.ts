/**
 * Side-view (x–z) instant centre: where the lines of the left side's upper and lower links
 * cross (docs/sketch-format.md). A single central link stands for its group.
 */
import type { Sketch, SketchMember } from '../../schema/sketch';
import type { SidePoint } from '../types';
import type { Vec3 } from '../vec';

/** Lines whose directions differ by less than this sine are parallel. */
export const PARALLEL_SINE_TOLERANCE = 1e-9;
/**
 * An instant centre farther than this (mm, 1 km) from the origin is reported as "parallel"
 * (null): nearly parallel links put it anywhere along a line, and a number of that size on
 * a readout means nothing more than "very far".
 */
export const INSTANT_CENTER_FAR_LIMIT_MM = 1_000_000;

/** Crossing of two lines in a plane, each through two points (u, v); null when parallel. */
export function lineCrossing2d(
  a1u: number,
  a1v: number,
  a2u: number,
  a2v: number,
  b1u: number,
  b1v: number,
  b2u: number,
  b2v: number,
): { u: number; v: number } | null {
  const du = a2u - a1u,
    dv = a2v - a1v;
  const eu = b2u - b1u,
    ev = b2v - b1v;
  const la = Math.hypot(du, dv),
    lb = Math.hypot(eu, ev);
  if (!(la > 0) || !(lb > 0)) return null;
  const cross = du * ev - dv * eu;
  if (Math.abs(cross) < PARALLEL_SINE_TOLERANCE * la * lb) return null;
  const t = ((b1u - a1u) * ev - (b1v - a1v) * eu) / cross;
  return { u: a1u + t * du, v: a1v + t * dv };
}

/** Side-view crossing of two 3-D segments' projections (x–z); null when parallel or very far. */
export function sideViewCrossing(a1: Vec3, a2: Vec3, b1: Vec3, b2: Vec3): SidePoint | null {
  const c = lineCrossing2d(a1.x, a1.z, a2.x, a2.z, b1.x, b1.z, b2.x, b2.z);
  if (!c || Math.hypot(c.u, c.v) > INSTANT_CENTER_FAR_LIMIT_MM) return null;
  return { x: c.u, z: c.v };
}

/**
 * The link that stands for `group` on the left side: the first left link (mean y > 0) of
 * the group, or, if none is on the left, the one nearest the centreline (a central link).
 */
export function leftGroupLink(sketch: Sketch, group: 'upper' | 'lower'): SketchMember | null {
  const byId = new Map(sketch.points.map((p) => [p.id, p]));
  const candidates = sketch.members.filter((m) => m.kind === 'link' && m.group === group);
  const meanY = (m: SketchMember) => (byId.get(m.a)!.y + byId.get(m.b)!.y) / 2;
  const left = candidates.find((m) => meanY(m) > 0);
  if (left) return left;
  let best: SketchMember | null = null;
  for (const m of candidates) if (!best || Math.abs(meanY(m)) < Math.abs(meanY(best))) best = m;
  return best;
}
