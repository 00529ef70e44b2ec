/**
 * Leaf springs in the linkage model: the SAE three-link approximation (SAE AE-11 Spring
 * Design Manual; Blundell & Harty, Multibody Systems Approach to Vehicle Dynamics,
 * fig. 6.15 — docs/references.md, from memory, unverified). Each half of a spring is a link from
 * its eye (the frame hanger, or the shackle's lower eye) to a pivot on the rigid centre block
 * (the axle seat), and the shackle is the third link. The bodies and constraints it brings:
 * - `leaf-half`: its length (a distance constraint, like a link), and its bend at the axle
 *   pivot — a soft row weighted by √(torsional stiffness), so that where the links leave the
 *   axle's pitch free (they do: a five-bar chain per side), the least-squares solve picks the
 *   pose of least bending energy, as the real spring does;
 * - a leaf half or shackle whose eye end is on the frame swings in the fore-aft plane of that
 *   eye (bushed pins along y): its far end keeps its ride y offset (a planar row). This is the
 *   lateral assumption: the leaves locate the axle sideways, no lateral rod needed.
 * Torsional stiffness of a half: a cantilever of vertical rate k at its eye, replaced by a link
 * of length ℓ with a torsional spring at its root, has k_θ = k·ℓ² (moment k·δ·ℓ for a rotation
 * δ/ℓ). Only the ratio between the halves matters to the pose; the wind-up uses the rates
 * themselves (windUp.ts).
 */
import type { Sketch, SketchMember } from '../../../schema/sketch';
import { vec, vecLength, vecSub, type Vec3 } from '../../vec';

/**
 * mm per radian of bend for the stiffest half. Small against the hard rows (a link's row
 * moves by hundreds of mm per radian of axle pitch), so the lengths and planes hold to well
 * under 1e-3 mm while the bends settle the free pitch; large enough against the solver's
 * Tikhonov floor (REGULARIZATION_RELATIVE) that it converges in a few steps.
 */
export const BENDING_WEIGHT_MM = 1;

/** Minimal view of a placed point the leaf-spring constraints need (model.ts's PointModel). */
interface PointRef {
  slot: number;
  ride: Vec3;
  local: Vec3;
}

/**
 * Points `b` keep their ride y offsets from points `a` (mm) on average: one row,
 * r = mean(b.y − a.y − offset). One pair: a shackle swings in its hanger's fore-aft plane. Every
 * frame-eyed leaf half together: the leaves hold the axle sideways, the two springs alike — one
 * row, because the seats of a rolled axle come closer together by spread·(1 − cos roll), which
 * the leaves' twist and bushings take up, and a row per spring would call that bind.
 */
export interface PlanarConstraint<P extends PointRef = PointRef> {
  type: 'planar';
  member: SketchMember;
  pairs: { a: P; b: P; offset: number }[];
}

/**
 * Soft row: the bend of a leaf half at its axle pivot, r = w/ℓ · (R·e)·(p_eye − p_pivot), with e
 * the unit vector across the half in side view at ride, R the axle's rotation: w·sin(bend).
 */
export interface BendingConstraint<P extends PointRef = PointRef> {
  type: 'bending';
  member: SketchMember;
  eye: P;
  pivot: P;
  /** the axle's slot */
  axleSlot: number;
  /** unit, across the half in the side-view plane at ride (also the axle's local direction: R = I at ride) */
  across: Vec3;
  /** e · (pivot's local offset on the axle), mm */
  acrossDotPivot: number;
  /** mm, the half's ride length ℓ */
  length: number;
  /** mm per radian (BENDING_WEIGHT_MM × √(k_θ / k_θ of the stiffest half)) */
  weight: number;
}

/** The across direction of a half from pivot to eye in side view: ŷ × d, normalised; null when the half is along y. */
function acrossOf(d: Vec3): Vec3 | null {
  const e = vec(d.z, 0, -d.x);
  const n = vecLength(e);
  return n > 0 ? vec(e.x / n, 0, e.z / n) : null;
}

/**
 * The leaf-spring constraints of a sketch beyond the distance rows that every rigid member gets:
 * planar rows for frame-eyed halves and shackles, bending rows for halves. `isShackleBody` says
 * whether a slot is a shackle body (a shackle's planar row is added only when its other end is on one,
 * so a version 1 file's shackle between frame and axle keeps its old meaning).
 */
export function leafSpringConstraints<P extends PointRef>(
  sketch: Sketch,
  points: Map<string, P>,
  axleSlot: number | null,
  isShackleBody: (slot: number) => boolean,
): (PlanarConstraint<P> | BendingConstraint<P>)[] {
  const planar: PlanarConstraint<P>[] = [];
  const leaves: PlanarConstraint<P>['pairs'] = [];
  let firstLeaf: SketchMember | null = null;
  const bends: { m: SketchMember; eye: P; pivot: P; across: Vec3; length: number; stiffness: number }[] = [];
  for (const m of sketch.members) {
    const a = points.get(m.a)!,
      b = points.get(m.b)!;
    if (m.kind === 'shackle') {
      const frameEnd = a.slot < 0 ? a : b.slot < 0 ? b : null;
      const swinging = frameEnd === a ? b : a;
      if (frameEnd && isShackleBody(swinging.slot)) {
        planar.push({
          type: 'planar',
          member: m,
          pairs: [{ a: frameEnd, b: swinging, offset: swinging.ride.y - frameEnd.ride.y }],
        });
      }
    } else if (m.kind === 'leaf-half') {
      if (a.slot < 0) {
        leaves.push({ a, b, offset: b.ride.y - a.ride.y });
        firstLeaf ??= m;
      }
      const d = vecSub(a.ride, b.ride);
      const across = acrossOf(d);
      const length = vecLength(d);
      if (axleSlot === null || b.slot !== axleSlot || !across || !(length > 0)) continue;
      // k_θ = k·ℓ² (see above); a half without a rate counts as the stiffest.
      const stiffness = m.rate === undefined ? Number.POSITIVE_INFINITY : m.rate * length * length;
      bends.push({ m, eye: a, pivot: b, across, length, stiffness });
    }
  }
  if (firstLeaf) planar.push({ type: 'planar', member: firstLeaf, pairs: leaves });
  const finite = bends.map((x) => x.stiffness).filter((s) => Number.isFinite(s));
  const top = finite.length > 0 ? Math.max(...finite) : 1;
  const bending: BendingConstraint<P>[] = bends.map((x) => ({
    type: 'bending',
    member: x.m,
    eye: x.eye,
    pivot: x.pivot,
    axleSlot: axleSlot!,
    across: x.across,
    acrossDotPivot: x.across.x * x.pivot.local.x + x.across.y * x.pivot.local.y + x.across.z * x.pivot.local.z,
    length: x.length,
    weight: BENDING_WEIGHT_MM * (Number.isFinite(x.stiffness) ? Math.sqrt(x.stiffness / top) : 1),
  }));
  return [...planar, ...bending];
}
