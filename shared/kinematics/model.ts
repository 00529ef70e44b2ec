/**
 * The linkage model the solver works on, built once per sweep from a validated sketch:
 * a list of moving bodies (each with a slot of six pose unknowns and a reference point),
 * the points placed on them, and the constraints between them. Layouts differ only in
 * which bodies and constraints they bring; the solver never looks at `layout`.
 */
import type { MovingBodyId, Sketch, SketchMember } from '../schema/sketch';
import { rigidMemberKinds } from '../schema/sketchVocabulary';
import { vec, vecCross, vecDot, vecLength, vecMid, vecScale, vecSub, type Vec3 } from './vec';
import { POSE_SIZE } from './pose';
import {
  leafSpringConstraints,
  type BendingConstraint,
  type PlanarConstraint,
} from './layouts/leaf-spring/constraints';

/** Frame points have no slot. */
export const FRAME_SLOT = -1;

/**
 * How the sweep drives a body:
 * - `axle`: a solid axle; z (travel) and roll are imposed, x, y, pitch, yaw solved.
 * - `wheel-carrier`: an arm or knuckle carrying a wheel centre (its reference point);
 *   z of the wheel centre is imposed, the other five solved.
 * - `free`: everything solved (e.g. a shackle body carried along by its links).
 */
export type BodyRole = 'axle' | 'wheel-carrier' | 'free';

export interface BodyModel {
  id: MovingBodyId;
  slot: number;
  role: BodyRole;
  /** mm, ride position of the pose origin */
  reference: Vec3;
  /** which side a wheel carrier is on (for the roll sweep); null for the axle and free bodies */
  side: 'left' | 'right' | null;
  /** mm, |y| of the wheel centre of a wheel carrier: the lever of body roll at that wheel */
  halfTrack: number;
  /**
   * how many sketch points are on the body, a hinge's two axis points included (one point: its rotation moves
   * nothing, so the sweep holds it)
   */
  pointCount: number;
}

export interface PointModel {
  id: string;
  /** position in the sketch's point list */
  index: number;
  slot: number;
  /** mm, position at ride */
  ride: Vec3;
  /** mm, ride position minus the body's reference point (world position for frame points) */
  local: Vec3;
}

/** A member of fixed length with a spherical joint at each end: one residual, mm. */
export interface DistanceConstraint {
  type: 'distance';
  member: SketchMember;
  a: PointModel;
  b: PointModel;
  /** mm, ride length */
  length: number;
}

/**
 * A hinge: the arm body turns about the axis a→b, on the frame (an arm's pivots) or on a moving body (a knuckle's
 * kingpin axis on the axle). Five residuals (mm): the arm's copy of point a stays on a (three), its copy of b stays
 * on the axis line through b (the two components across the axis, which turn with the axis body), so a consistent
 * hinge adds no spurious redundancy.
 */
export interface HingeConstraint {
  type: 'hinge';
  member: SketchMember;
  slot: number;
  /** the body carrying the axis points: FRAME_SLOT, or a moving body's slot (a knuckle's axle) */
  axisSlot: number;
  /** mm, the axis points at ride */
  axisA: Vec3;
  axisB: Vec3;
  /** mm, the axis points less the axis body's reference point (the ride positions on the frame) */
  axisLocalA: Vec3;
  axisLocalB: Vec3;
  localA: Vec3;
  localB: Vec3;
  /** unit vectors across the axis, at ride (in the axis body's axes) */
  across1: Vec3;
  across2: Vec3;
}

/**
 * A ball joint (spherical joint): the wishbone arm's point a and the knuckle's copy of that place (b, with the
 * ride position of a) stay together. Three residuals (mm), the components of pA − pB.
 */
export interface CoincidentConstraint {
  type: 'coincident';
  member: SketchMember;
  a: PointModel;
  b: PointModel;
}

export type Constraint =
  | DistanceConstraint
  | HingeConstraint
  | CoincidentConstraint
  | PlanarConstraint<PointModel>
  | BendingConstraint<PointModel>;

/** The error for a constraint of a kind the model does not know (built by something other than linkageModelBuild). */
export function unknownConstraintError(c: never): Error {
  const kind = (c as { type?: unknown } | null)?.type;
  return new Error(`The solver has no residual for a constraint of kind '${String(kind)}'.`);
}

/** Residual rows of a constraint. */
export function constraintRows(c: Constraint): number {
  switch (c.type) {
    case 'hinge':
      return 5;
    case 'coincident':
      return 3;
    case 'distance':
    case 'planar':
    case 'bending':
      return 1;
    default:
      throw unknownConstraintError(c);
  }
}

/** Slots of the moving bodies a constraint's rows depend on (frame points have none). */
export function constraintSlots(c: Constraint): number[] {
  switch (c.type) {
    case 'hinge':
      return c.axisSlot === FRAME_SLOT ? [c.slot] : [c.slot, c.axisSlot];
    case 'distance':
    case 'coincident':
      return [c.a.slot, c.b.slot].filter((s) => s !== FRAME_SLOT);
    case 'planar':
      return [...new Set(c.pairs.flatMap((p) => [p.a.slot, p.b.slot]))].filter((s) => s !== FRAME_SLOT);
    case 'bending':
      return [c.axleSlot, c.eye.slot].filter((s) => s !== FRAME_SLOT);
    default:
      throw unknownConstraintError(c);
  }
}

export interface LinkageModel {
  sketch: Sketch;
  bodies: BodyModel[];
  bodyById: Map<MovingBodyId, BodyModel>;
  points: Map<string, PointModel>;
  constraints: Constraint[];
  /** total residual rows */
  residualCount: number;
  /** 6 × number of bodies */
  stateSize: number;
  wheelLeft: PointModel;
  wheelRight: PointModel;
  /** the solid axle, if the sketch has one */
  axle: BodyModel | null;
  /**
   * 1 for a soft row (a leaf spring's bend, layouts/leaf-spring/constraints.ts): it settles what the hard rows leave
   * free, is not a length mismatch, and so counts neither as bind nor towards lock-up
   */
  softRows: Uint8Array;
}

function bodyReference(sketch: Sketch, body: MovingBodyId): Vec3 {
  const pts = sketch.points.filter((p) => p.body === body);
  const wl = sketch.points.find((p) => p.id === sketch.wheels.left);
  const wr = sketch.points.find((p) => p.id === sketch.wheels.right);
  // docs/sketch-format.md: the axle reference point is the midpoint of the two wheel centres.
  if (wl && wr && wl.body === body && wr.body === body) return vecMid(wl, wr);
  const wheel = [wl, wr].find((w) => w && w.body === body);
  if (wheel) return vec(wheel.x, wheel.y, wheel.z);
  const n = pts.length || 1;
  return vec(
    pts.reduce((s, p) => s + p.x, 0) / n,
    pts.reduce((s, p) => s + p.y, 0) / n,
    pts.reduce((s, p) => s + p.z, 0) / n,
  );
}

/** Moving bodies of a sketch in a fixed order, each with its reference point (mm, ride). */
export function sketchBodyReferences(sketch: Sketch): Map<MovingBodyId, Vec3> {
  const out = new Map<MovingBodyId, Vec3>();
  for (const p of sketch.points) {
    if (p.body !== 'frame' && !out.has(p.body)) out.set(p.body, bodyReference(sketch, p.body));
  }
  return out;
}

function unitAcross(axis: Vec3): [Vec3, Vec3] {
  const u = vecScale(axis, 1 / vecLength(axis));
  // Any vector not parallel to the axis seeds the pair.
  const seed = Math.abs(u.x) < 0.9 ? vec(1, 0, 0) : vec(0, 1, 0);
  const e1raw = vecSub(seed, vecScale(u, vecDot(seed, u)));
  const e1 = vecScale(e1raw, 1 / vecLength(e1raw));
  return [e1, vecCross(u, e1)];
}

/** Builds the model of a validated sketch. */
export function linkageModelBuild(sketch: Sketch): LinkageModel {
  const refs = sketchBodyReferences(sketch);
  const wl = sketch.points.find((p) => p.id === sketch.wheels.left)!;
  const wr = sketch.points.find((p) => p.id === sketch.wheels.right)!;
  const bodies: BodyModel[] = [];
  for (const [id, reference] of refs) {
    const carriesLeft = wl.body === id;
    const carriesRight = wr.body === id;
    let role: BodyRole = 'free';
    let side: BodyModel['side'] = null;
    let halfTrack = 0;
    if (carriesLeft && carriesRight) role = 'axle';
    else if (carriesLeft || carriesRight) {
      role = 'wheel-carrier';
      side = carriesLeft ? 'left' : 'right';
      halfTrack = Math.abs((carriesLeft ? wl : wr).y);
    }
    // A hinge's two axis points count too: the body carries copies of them, so its rotation moves something.
    const hinges = sketch.members.filter((m) => m.kind === 'hinge' && m.body === id).length;
    const pointCount = sketch.points.filter((p) => p.body === id).length + 2 * hinges;
    bodies.push({ id, slot: bodies.length, role, reference, side, halfTrack, pointCount });
  }
  const bodyById = new Map(bodies.map((b) => [b.id, b]));
  const points = new Map<string, PointModel>();
  for (const p of sketch.points) {
    const ride = vec(p.x, p.y, p.z);
    const body = p.body === 'frame' ? undefined : bodyById.get(p.body);
    points.set(p.id, {
      id: p.id,
      index: points.size,
      slot: body ? body.slot : FRAME_SLOT,
      ride,
      local: body ? vecSub(ride, body.reference) : ride,
    });
  }
  const constraints: Constraint[] = [];
  for (const m of sketch.members) {
    const a = points.get(m.a)!;
    const b = points.get(m.b)!;
    // A leaf half holds its length like a link (layouts/leaf-spring/constraints.ts adds its bend and plane).
    if (rigidMemberKinds.includes(m.kind) || m.kind === 'leaf-half') {
      constraints.push({ type: 'distance', member: m, a, b, length: vecLength(vecSub(a.ride, b.ride)) });
    } else if (m.kind === 'ball-joint') {
      // The joint is at the arm's point: the knuckle carries its own copy of that place.
      const knuckle = b.slot === FRAME_SLOT ? null : bodies[b.slot];
      const held = { ...b, ride: a.ride, local: knuckle ? vecSub(a.ride, knuckle.reference) : a.ride };
      constraints.push({ type: 'coincident', member: m, a, b: held });
    } else if (m.kind === 'hinge') {
      const body = bodyById.get(m.body);
      if (!body) continue;
      const [across1, across2] = unitAcross(vecSub(b.ride, a.ride));
      constraints.push({
        type: 'hinge',
        member: m,
        slot: body.slot,
        axisSlot: a.slot,
        axisA: a.ride,
        axisB: b.ride,
        axisLocalA: a.local,
        axisLocalB: b.local,
        localA: vecSub(a.ride, body.reference),
        localB: vecSub(b.ride, body.reference),
        across1,
        across2,
      });
    }
  }
  const axle = bodies.find((b) => b.role === 'axle') ?? null;
  const isShackle = (slot: number) => slot >= 0 && bodies[slot].id.startsWith('shackle-');
  constraints.push(...leafSpringConstraints(sketch, points, axle ? axle.slot : null, isShackle));
  const residualCount = constraints.reduce((s, c) => s + constraintRows(c), 0);
  const softRows = new Uint8Array(residualCount);
  let row = 0;
  for (const c of constraints) {
    if (c.type === 'bending') softRows[row] = 1;
    row += constraintRows(c);
  }
  return {
    sketch,
    bodies,
    bodyById,
    points,
    constraints,
    residualCount,
    stateSize: bodies.length * POSE_SIZE,
    wheelLeft: points.get(wl.id)!,
    wheelRight: points.get(wr.id)!,
    axle,
    softRows,
  };
}
