/**
 * Constraint residuals (mm) and their analytic Jacobian with respect to every pose
 * coordinate of every body (per mm for translations, per radian for rotations).
 * - distance (link, lateral rod, tie rod, shackle): r = |pA − pB| − L0,
 *   ∂r/∂q = u · (∂pA/∂q − ∂pB/∂q), u the unit vector from B to A;
 * - hinge: the arm's copies of the axis points stay on the frame axis;
 * - coincident (ball joint): r = pA − pB, three rows, ∂r/∂q = ∂pA/∂q − ∂pB/∂q;
 * - planar and bending (leaf springs, layouts/leaf-spring/constraints.ts): a pivot's y offset, and a
 *   leaf half's bend.
 * One function per constraint kind; residualsEvaluate switches over the kind, and a kind it
 * does not know is an error, never another kind's rows.
 * A point on a body is p = ref + t + R·local, so ∂p/∂t = I and ∂p/∂angle_k = (∂R/∂angle_k)·local.
 */
import type {
  CoincidentConstraint,
  Constraint,
  DistanceConstraint,
  HingeConstraint,
  LinkageModel,
  PointModel,
} from './model';
import type { BendingConstraint, PlanarConstraint } from './layouts/leaf-spring/constraints';
import {
  constraintRows as constraintRowsImported,
  FRAME_SLOT as FRAME_SLOT_IMPORTED,
  unknownConstraintError,
} from './model';
import * as pose from './pose';
import type { RotationSet } from './pose';

/**
 * Module-local copies of imported bindings used in the inner loop: under the CommonJS interop
 * Node runs this code with (tsx: server, command line, bench) every use of an imported
 * binding is a getter call on the module's exports, about a tenth of a sweep's profile.
 */
const FRAME_SLOT = FRAME_SLOT_IMPORTED;
const constraintRows = constraintRowsImported;
const mat3Apply = pose.mat3Apply;
const rotationSetFill = pose.rotationSetFill;
const POSE_ROLL = pose.POSE_ROLL;
const POSE_SIZE = pose.POSE_SIZE;

/** Below this (mm) a member's direction is undefined; only reachable by a wildly wrong trial pose. */
const DIRECTION_EPSILON_MM = 1e-12;

/** Rotation sets of every body for the given state, reused across calls. */
export class BodyRotations {
  readonly sets: RotationSet[];
  constructor(count: number) {
    this.sets = Array.from({ length: count }, () => new Float64Array(36));
  }
  update(state: Float64Array): void {
    for (let s = 0; s < this.sets.length; s++) {
      const o = s * POSE_SIZE;
      rotationSetFill(this.sets[s], state[o + POSE_ROLL], state[o + POSE_ROLL + 1], state[o + POSE_ROLL + 2]);
    }
  }
}

/** World position (mm) of a point for the state whose rotations are in `rot`; writes out[o..o+2]. */
export function pointPlace(
  model: LinkageModel,
  p: PointModel,
  state: Float64Array,
  rot: BodyRotations,
  out: Float64Array,
  o: number,
): void {
  if (p.slot === FRAME_SLOT) {
    out[o] = p.ride.x;
    out[o + 1] = p.ride.y;
    out[o + 2] = p.ride.z;
    return;
  }
  const body = model.bodies[p.slot];
  const so = p.slot * POSE_SIZE;
  mat3Apply(rot.sets[p.slot], 0, p.local.x, p.local.y, p.local.z, out, o);
  out[o] += body.reference.x + state[so];
  out[o + 1] += body.reference.y + state[so + 1];
  out[o + 2] += body.reference.z + state[so + 2];
}

/**
 * Velocity of a point (mm per unit parameter) for a state rate `dq` (per-coordinate
 * derivatives, mm and rad); writes out[o..o+2].
 */
export function pointVelocity(
  p: PointModel,
  dq: Float64Array,
  rot: BodyRotations,
  out: Float64Array,
  o: number,
  tmp: Float64Array,
): void {
  out[o] = 0;
  out[o + 1] = 0;
  out[o + 2] = 0;
  if (p.slot === FRAME_SLOT) return;
  const so = p.slot * POSE_SIZE;
  const rs = rot.sets[p.slot];
  out[o] = dq[so];
  out[o + 1] = dq[so + 1];
  out[o + 2] = dq[so + 2];
  for (let k = 0; k < 3; k++) {
    const w = dq[so + POSE_ROLL + k];
    if (w === 0) continue;
    mat3Apply(rs, 9 * (k + 1), p.local.x, p.local.y, p.local.z, tmp, 0);
    out[o] += w * tmp[0];
    out[o + 1] += w * tmp[1];
    out[o + 2] += w * tmp[2];
  }
}

/**
 * Adds `sign`·(e · ∂p/∂q) for a body point with local offset (lx, ly, lz) into row `row` of
 * the Jacobian J (row-major, `cols` columns).
 */
function addPointRow(
  J: Float64Array,
  row: number,
  cols: number,
  slot: number,
  rs: RotationSet,
  lx: number,
  ly: number,
  lz: number,
  ex: number,
  ey: number,
  ez: number,
  sign: number,
  tmp: Float64Array,
): void {
  const base = row * cols + slot * POSE_SIZE;
  J[base] += sign * ex;
  J[base + 1] += sign * ey;
  J[base + 2] += sign * ez;
  for (let k = 0; k < 3; k++) {
    mat3Apply(rs, 9 * (k + 1), lx, ly, lz, tmp, 0);
    J[base + 3 + k] += sign * (ex * tmp[0] + ey * tmp[1] + ez * tmp[2]);
  }
}

/** Scratch buffers of one evaluator. */
export interface ResidualWork {
  rot: BodyRotations;
  pts: Float64Array;
  tmp: Float64Array;
  /** a hinge's two across vectors where its axis body has them */
  hingeAcross: Float64Array;
}

export function residualWorkCreate(model: LinkageModel): ResidualWork {
  return {
    rot: new BodyRotations(model.bodies.length),
    pts: new Float64Array(6),
    tmp: new Float64Array(3),
    hingeAcross: new Float64Array(6),
  };
}

/** Residual rows of a distance constraint (one), and their Jacobian row when J is given. */
function distanceRows(
  model: LinkageModel,
  c: DistanceConstraint,
  state: Float64Array,
  work: ResidualWork,
  r: Float64Array,
  J: Float64Array | null,
  row: number,
): void {
  const { rot, pts, tmp } = work;
  const cols = model.stateSize;
  pointPlace(model, c.a, state, rot, pts, 0);
  pointPlace(model, c.b, state, rot, pts, 3);
  const dx = pts[0] - pts[3],
    dy = pts[1] - pts[4],
    dz = pts[2] - pts[5];
  const len = Math.sqrt(dx * dx + dy * dy + dz * dz);
  r[row] = len - c.length;
  if (!J) return;
  const inv = 1 / Math.max(len, DIRECTION_EPSILON_MM);
  const ux = dx * inv,
    uy = dy * inv,
    uz = dz * inv;
  if (c.a.slot !== FRAME_SLOT) {
    addPointRow(J, row, cols, c.a.slot, rot.sets[c.a.slot], c.a.local.x, c.a.local.y, c.a.local.z, ux, uy, uz, 1, tmp);
  }
  if (c.b.slot !== FRAME_SLOT) {
    addPointRow(J, row, cols, c.b.slot, rot.sets[c.b.slot], c.b.local.x, c.b.local.y, c.b.local.z, ux, uy, uz, -1, tmp);
  }
}

/** The planar row: the b points keep their ride y offsets from the a points on average (leaf-spring/constraints.ts). */
function planarRows(
  model: LinkageModel,
  c: PlanarConstraint<PointModel>,
  state: Float64Array,
  work: ResidualWork,
  r: Float64Array,
  J: Float64Array | null,
  row: number,
): void {
  const { rot, pts, tmp } = work;
  const cols = model.stateSize;
  const w = 1 / c.pairs.length;
  let sum = 0;
  for (const { a, b, offset } of c.pairs) {
    pointPlace(model, a, state, rot, pts, 0);
    pointPlace(model, b, state, rot, pts, 3);
    sum += pts[4] - pts[1] - offset;
    if (J) {
      if (a.slot !== FRAME_SLOT)
        addPointRow(J, row, cols, a.slot, rot.sets[a.slot], a.local.x, a.local.y, a.local.z, 0, w, 0, -1, tmp);
      if (b.slot !== FRAME_SLOT)
        addPointRow(J, row, cols, b.slot, rot.sets[b.slot], b.local.x, b.local.y, b.local.z, 0, w, 0, 1, tmp);
    }
  }
  r[row] = w * sum;
}

/**
 * The bending row of a leaf half: r = (w/ℓ)·[(R·e)·(p_eye − o) − e·pivot_local], o the axle's
 * reference point placed (leaf-spring/constraints.ts); (R·e)·(p_pivot − o) = e·pivot_local since
 * the pivot rides on the axle.
 */
function bendingRows(
  model: LinkageModel,
  c: BendingConstraint<PointModel>,
  state: Float64Array,
  work: ResidualWork,
  r: Float64Array,
  J: Float64Array | null,
  row: number,
): void {
  const { rot, pts, tmp } = work;
  const cols = model.stateSize;
  const so = c.axleSlot * POSE_SIZE;
  const axle = model.bodies[c.axleSlot];
  const rs = rot.sets[c.axleSlot];
  const e = c.across;
  mat3Apply(rs, 0, e.x, e.y, e.z, pts, 0);
  pointPlace(model, c.eye, state, rot, pts, 3);
  const dx = pts[3] - (axle.reference.x + state[so]);
  const dy = pts[4] - (axle.reference.y + state[so + 1]);
  const dz = pts[5] - (axle.reference.z + state[so + 2]);
  const k = c.weight / c.length;
  r[row] = k * (pts[0] * dx + pts[1] * dy + pts[2] * dz - c.acrossDotPivot);
  if (!J) return;
  const base = row * cols + so;
  J[base] -= k * pts[0];
  J[base + 1] -= k * pts[1];
  J[base + 2] -= k * pts[2];
  for (let a = 0; a < 3; a++) {
    mat3Apply(rs, 9 * (a + 1), e.x, e.y, e.z, tmp, 0);
    J[base + 3 + a] += k * (tmp[0] * dx + tmp[1] * dy + tmp[2] * dz);
  }
  if (c.eye.slot !== FRAME_SLOT) {
    const ex = k * pts[0],
      ey = k * pts[1],
      ez = k * pts[2];
    const l = c.eye.local;
    addPointRow(J, row, cols, c.eye.slot, rot.sets[c.eye.slot], l.x, l.y, l.z, ex, ey, ez, 1, tmp);
  }
}

/**
 * The five hinge rows: the arm's copy of axis point a stays on a, its copy of b on the axis line through b.
 * On a moving axis body (a knuckle's kingpin on the axle) the axis points are that body's and the across
 * vectors E = R·e turn with it: r = (p_b − q_b)·E, so ∂r/∂θ of the axis body also carries (p_b − q_b)·(∂R/∂θ)·e.
 */
function hingeRows(
  model: LinkageModel,
  c: HingeConstraint,
  state: Float64Array,
  work: ResidualWork,
  r: Float64Array,
  J: Float64Array | null,
  row: number,
): void {
  const { rot, pts, tmp } = work;
  const cols = model.stateSize;
  const body = model.bodies[c.slot];
  const so = c.slot * POSE_SIZE;
  const rs = rot.sets[c.slot];
  const moving = c.axisSlot !== FRAME_SLOT;
  // The axis points and across vectors where the axis body has them (the frame's: as drawn).
  let qax = c.axisA.x,
    qay = c.axisA.y,
    qaz = c.axisA.z,
    qbx = c.axisB.x,
    qby = c.axisB.y,
    qbz = c.axisB.z;
  const E = work.hingeAcross;
  if (moving) {
    const axis = model.bodies[c.axisSlot];
    const ao = c.axisSlot * POSE_SIZE;
    const ars = rot.sets[c.axisSlot];
    const ox = axis.reference.x + state[ao],
      oy = axis.reference.y + state[ao + 1],
      oz = axis.reference.z + state[ao + 2];
    mat3Apply(ars, 0, c.axisLocalA.x, c.axisLocalA.y, c.axisLocalA.z, E, 0);
    qax = ox + E[0];
    qay = oy + E[1];
    qaz = oz + E[2];
    mat3Apply(ars, 0, c.axisLocalB.x, c.axisLocalB.y, c.axisLocalB.z, E, 0);
    qbx = ox + E[0];
    qby = oy + E[1];
    qbz = oz + E[2];
    mat3Apply(ars, 0, c.across1.x, c.across1.y, c.across1.z, E, 0);
    mat3Apply(ars, 0, c.across2.x, c.across2.y, c.across2.z, E, 3);
  } else {
    E[0] = c.across1.x;
    E[1] = c.across1.y;
    E[2] = c.across1.z;
    E[3] = c.across2.x;
    E[4] = c.across2.y;
    E[5] = c.across2.z;
  }
  // Arm's copy of axis point a, placed.
  mat3Apply(rs, 0, c.localA.x, c.localA.y, c.localA.z, pts, 0);
  const ax = body.reference.x + state[so] + pts[0] - qax;
  const ay = body.reference.y + state[so + 1] + pts[1] - qay;
  const az = body.reference.z + state[so + 2] + pts[2] - qaz;
  mat3Apply(rs, 0, c.localB.x, c.localB.y, c.localB.z, pts, 3);
  const bx = body.reference.x + state[so] + pts[3] - qbx;
  const by = body.reference.y + state[so + 1] + pts[4] - qby;
  const bz = body.reference.z + state[so + 2] + pts[5] - qbz;
  r[row] = ax;
  r[row + 1] = ay;
  r[row + 2] = az;
  r[row + 3] = bx * E[0] + by * E[1] + bz * E[2];
  r[row + 4] = bx * E[3] + by * E[4] + bz * E[5];
  if (!J) return;
  const la = c.localA,
    lb = c.localB;
  addPointRow(J, row, cols, c.slot, rs, la.x, la.y, la.z, 1, 0, 0, 1, tmp);
  addPointRow(J, row + 1, cols, c.slot, rs, la.x, la.y, la.z, 0, 1, 0, 1, tmp);
  addPointRow(J, row + 2, cols, c.slot, rs, la.x, la.y, la.z, 0, 0, 1, 1, tmp);
  addPointRow(J, row + 3, cols, c.slot, rs, lb.x, lb.y, lb.z, E[0], E[1], E[2], 1, tmp);
  addPointRow(J, row + 4, cols, c.slot, rs, lb.x, lb.y, lb.z, E[3], E[4], E[5], 1, tmp);
  if (!moving) return;
  const as = c.axisSlot;
  const ars = rot.sets[as];
  const qa = c.axisLocalA,
    qb = c.axisLocalB;
  addPointRow(J, row, cols, as, ars, qa.x, qa.y, qa.z, 1, 0, 0, -1, tmp);
  addPointRow(J, row + 1, cols, as, ars, qa.x, qa.y, qa.z, 0, 1, 0, -1, tmp);
  addPointRow(J, row + 2, cols, as, ars, qa.x, qa.y, qa.z, 0, 0, 1, -1, tmp);
  addPointRow(J, row + 3, cols, as, ars, qb.x, qb.y, qb.z, E[0], E[1], E[2], -1, tmp);
  addPointRow(J, row + 4, cols, as, ars, qb.x, qb.y, qb.z, E[3], E[4], E[5], -1, tmp);
  // The across vectors turn with the axis body.
  const base = as * POSE_SIZE + POSE_ROLL;
  for (const [k, e] of [
    [3, c.across1],
    [4, c.across2],
  ] as const) {
    for (let a = 0; a < 3; a++) {
      mat3Apply(ars, 9 * (a + 1), e.x, e.y, e.z, tmp, 0);
      J[(row + k) * cols + base + a] += bx * tmp[0] + by * tmp[1] + bz * tmp[2];
    }
  }
}

/** The three ball-joint rows: the arm's point minus the knuckle's point, per axis. */
function coincidentRows(
  model: LinkageModel,
  c: CoincidentConstraint,
  state: Float64Array,
  work: ResidualWork,
  r: Float64Array,
  J: Float64Array | null,
  row: number,
): void {
  const { rot, pts, tmp } = work;
  const cols = model.stateSize;
  pointPlace(model, c.a, state, rot, pts, 0);
  pointPlace(model, c.b, state, rot, pts, 3);
  r[row] = pts[0] - pts[3];
  r[row + 1] = pts[1] - pts[4];
  r[row + 2] = pts[2] - pts[5];
  if (!J) return;
  for (const [p, sign] of [
    [c.a, 1],
    [c.b, -1],
  ] as const) {
    if (p.slot === FRAME_SLOT) continue;
    const rs = rot.sets[p.slot];
    const l = p.local;
    addPointRow(J, row, cols, p.slot, rs, l.x, l.y, l.z, 1, 0, 0, sign, tmp);
    addPointRow(J, row + 1, cols, p.slot, rs, l.x, l.y, l.z, 0, 1, 0, sign, tmp);
    addPointRow(J, row + 2, cols, p.slot, rs, l.x, l.y, l.z, 0, 0, 1, sign, tmp);
  }
}

/**
 * Evaluates the residuals r (length model.residualCount, mm) and, when J is given, the
 * full Jacobian (residualCount × stateSize, row-major) at `state`. Throws for a constraint
 * of a kind it does not know.
 */
export function residualsEvaluate(
  model: LinkageModel,
  state: Float64Array,
  work: ResidualWork,
  r: Float64Array,
  J: Float64Array | null,
): void {
  work.rot.update(state);
  if (J) J.fill(0);
  let row = 0;
  for (const c of model.constraints) {
    residualRows(model, c, state, work, r, J, row);
    row += constraintRows(c);
  }
}

/** The rows of one constraint, by its kind. */
function residualRows(
  model: LinkageModel,
  c: Constraint,
  state: Float64Array,
  work: ResidualWork,
  r: Float64Array,
  J: Float64Array | null,
  row: number,
): void {
  switch (c.type) {
    case 'distance':
      return distanceRows(model, c, state, work, r, J, row);
    case 'planar':
      return planarRows(model, c, state, work, r, J, row);
    case 'bending':
      return bendingRows(model, c, state, work, r, J, row);
    case 'hinge':
      return hingeRows(model, c, state, work, r, J, row);
    case 'coincident':
      return coincidentRows(model, c, state, work, r, J, row);
    default:
      throw unknownConstraintError(c);
  }
}
