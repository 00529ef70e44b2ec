/**
 * Marching the rack out from centre, as march.ts marches heave: each row starts from the last solved
 * one plus its sensitivity to the rack times the step (second order with the row before), then the
 * least-squares solve corrects it, with the wheel centres held at ride height. A row that fails is
 * retried in sub-steps; if it still fails the steering has reached a limit (a tie rod and its steering
 * arm in line), found to a fraction of a millimetre by bisection.
 */
import { driveApply } from '../drive';
import { BRANCH_JUMP_LIMIT_MM, LOCKUP_BIND_LIMIT_MM, LOCKUP_RESIDUAL_TOLERANCE_MM, RETRY_SUBSTEPS } from '../march';
import type { MarchContext } from '../march';
import { constraintRows, type PointModel } from '../model';
import { POSE_ROLL, POSE_SIZE } from '../pose';
import { BodyRotations, pointPlace } from '../residuals';
import { ROTATION_SCALE_MM } from '../solve';
import { rackSet, type RackInput, type SteerLinkage } from './linkage';

/** Bisection steps that close in on the limit: a 5 mm step ends within 5 µm of it. */
export const LIMIT_BISECTION_STEPS = 10;

/** One solved steer row: the rack travel (mm), the pose (mm, rad), its sensitivity to the rack (per mm). */
export interface RackSolved {
  rack: number;
  state: Float64Array;
  rate: Float64Array;
  /** mm, largest absolute residual */
  bind: number;
}

/** A distance row whose end rides on the rack: its residual index, the constraint's two ends, which end is the rack's. */
interface RackRow {
  row: number;
  a: PointModel;
  b: PointModel;
  sign: 1 | -1;
}

/** The rack march's context: the sweep's solver and the rack's rows of the residual. */
export interface RackContext {
  ctx: MarchContext;
  linkage: SteerLinkage;
  input: RackInput;
  rows: RackRow[];
  rot: BodyRotations;
  dr: Float64Array;
  place: Float64Array;
}

export function rackContextBuild(ctx: MarchContext, linkage: SteerLinkage): RackContext {
  const input = linkage.input;
  const onRack = new Set(input.points.map((p) => p.point));
  const rows: RackRow[] = [];
  let row = 0;
  for (const c of ctx.model.constraints) {
    if (c.type === 'distance' && (onRack.has(c.a) || onRack.has(c.b)))
      rows.push({ row, a: c.a, b: c.b, sign: onRack.has(c.a) ? 1 : -1 });
    row += constraintRows(c);
  }
  return {
    ctx,
    linkage,
    input,
    rows,
    rot: new BodyRotations(ctx.model.bodies.length),
    dr: new Float64Array(ctx.model.residualCount),
    place: new Float64Array(6),
  };
}

/**
 * d(state)/d(rack) at a solved state: the rack moves a distance row's end along the rack direction u, so
 * ∂r/∂rack = ±(unit vector along the member) · u, and the solver turns that into the pose's rate.
 */
function rackRate(rc: RackContext, state: Float64Array, out: Float64Array): void {
  const { ctx, input, rows, rot, dr, place } = rc;
  const u = input.direction;
  dr.fill(0);
  rot.update(state);
  for (const r of rows) {
    pointPlace(ctx.model, r.a, state, rot, place, 0);
    pointPlace(ctx.model, r.b, state, rot, place, 3);
    const dx = place[0] - place[3],
      dy = place[1] - place[4],
      dz = place[2] - place[5];
    const len = Math.hypot(dx, dy, dz);
    if (!(len > 0)) continue;
    dr[r.row] = (r.sign * (dx * u.x + dy * u.y + dz * u.z)) / len;
  }
  ctx.solver.sensitivityToResiduals(dr, out);
}

function scaledDistance(rc: RackContext, a: Float64Array, b: Float64Array): number {
  let d = 0;
  for (const c of rc.ctx.drive.free) {
    const s = Math.abs(a[c] - b[c]) * (c % POSE_SIZE >= POSE_ROLL ? ROTATION_SCALE_MM : 1);
    if (s > d) d = s;
  }
  return d;
}

/** Solves the row at rack `to` from a solved row (second-order predictor with `before`); null if it fails. */
function stepRack(rc: RackContext, from: RackSolved, to: number, before: RackSolved | null = null): RackSolved | null {
  const { model, drive, solver, redundancy } = rc.ctx;
  const delta = to - from.rack;
  const state = new Float64Array(from.state);
  const span = before ? from.rack - before.rack : 0;
  if (before && span !== 0) {
    // Cubic Hermite extrapolation through the two rows' poses and rates: steer turns faster and faster
    // toward lock, and the second-order predictor of march.ts leaves a Newton step more a row than this.
    const t = (to - before.rack) / span;
    const [h00, h10, h01, h11] = [
      2 * t ** 3 - 3 * t ** 2 + 1,
      t ** 3 - 2 * t ** 2 + t,
      -2 * t ** 3 + 3 * t ** 2,
      t ** 3 - t ** 2,
    ];
    for (const c of drive.free)
      state[c] = h00 * before.state[c] + h10 * span * before.rate[c] + h01 * from.state[c] + h11 * span * from.rate[c];
  } else {
    for (const c of drive.free) state[c] += from.rate[c] * delta;
  }
  driveApply(model, state, 0, 0);
  rackSet(rc.input, to);
  const predicted = new Float64Array(state);
  const outcome = solver.solve(state);
  if (!outcome.converged) return null;
  const limit = redundancy === 0 ? LOCKUP_RESIDUAL_TOLERANCE_MM : LOCKUP_BIND_LIMIT_MM;
  if (!(outcome.maxResidual <= limit)) return null;
  if (scaledDistance(rc, state, predicted) > BRANCH_JUMP_LIMIT_MM) return null;
  const rate = new Float64Array(model.stateSize);
  rackRate(rc, state, rate);
  for (let i = 0; i < rate.length; i++) if (!Number.isFinite(rate[i])) return null;
  return { rack: to, state, rate, bind: outcome.maxResidual };
}

/** The centred row (rack 0) from the solved ride row's state, with its rate to the rack. */
export function rackStart(rc: RackContext, rideState: Float64Array): RackSolved {
  rackSet(rc.input, 0);
  const state = new Float64Array(rideState);
  const outcome = rc.ctx.solver.solve(state);
  rc.ctx.solver.refactor();
  const rate = new Float64Array(rc.ctx.model.stateSize);
  rackRate(rc, state, rate);
  return { rack: 0, state, rate, bind: outcome.maxResidual };
}

export interface RackMarchOutcome {
  rows: RackSolved[];
  /** the limit, when the march stopped before the end: the furthest row solved by bisection toward the failed value */
  limit: RackSolved | null;
  /** the rack value that failed (mm); null when the march went the whole way */
  failedAt: number | null;
}

/** Marches from `start` through `values` (ordered away from centre), stopping at the steering's limit. */
export function marchRack(rc: RackContext, start: RackSolved, values: readonly number[]): RackMarchOutcome {
  const rows: RackSolved[] = [];
  let prev = start;
  let before: RackSolved | null = null;
  for (const v of values) {
    const next = stepRack(rc, prev, v, before) ?? subSteps(rc, prev, v);
    if (!next) return { rows, limit: bisectLimit(rc, prev, v), failedAt: v };
    rows.push(next);
    before = prev;
    prev = next;
  }
  return { rows, limit: null, failedAt: null };
}

/** Near a toggle the predictor overshoots before the linkage is at its limit: the row reached in sub-steps. */
function subSteps(rc: RackContext, from: RackSolved, to: number): RackSolved | null {
  let sub: RackSolved | null = from;
  for (let k = 1; k <= RETRY_SUBSTEPS && sub; k++)
    sub = stepRack(rc, sub, from.rack + ((to - from.rack) * k) / RETRY_SUBSTEPS);
  return sub;
}

/** The furthest solvable row between a solved row and a rack value that fails. */
function bisectLimit(rc: RackContext, good: RackSolved, bad: number): RackSolved {
  let best = good;
  let fail = bad;
  for (let i = 0; i < LIMIT_BISECTION_STEPS; i++) {
    const mid = 0.5 * (best.rack + fail);
    const next = stepRack(rc, best, mid) ?? subSteps(rc, best, mid);
    if (next) best = next;
    else fail = mid;
  }
  return best;
}
