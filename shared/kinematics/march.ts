/**
 * Marching a sweep out from ride height: each row starts from the previous row's pose
 * plus its first-order sensitivity times the step (a predictor), then the least-squares
 * solve corrects it. A row that fails is retried in sub-steps; if it still fails the
 * linkage has reached a limit (lock-up) and the march stops there, never inventing a row.
 */
import type { Drive } from './drive';
import * as driveModule from './drive';
import type { LinkageModel } from './model';
import * as pose from './pose';
import type { PoseSolver } from './solve';
import * as solveModule from './solve';

/**
 * Module-local copies of imported bindings used in the inner loop: under the CommonJS interop
 * Node runs this code with (tsx: server, command line, bench) every use of an imported
 * binding is a getter call on the module's exports, about a tenth of a sweep's profile.
 */
const driveApply = driveModule.driveApply;
const driveRate = driveModule.driveRate;
const POSE_ROLL = pose.POSE_ROLL;
const POSE_SIZE = pose.POSE_SIZE;
const ROTATION_SCALE_MM = solveModule.ROTATION_SCALE_MM;

/**
 * Exactly determined linkage: a residual above this (mm) means the links cannot be
 * assembled at that travel (past a toggle, or out of reach). Well above the solver's
 * round-off, well below anything a drawing could mean.
 */
export const LOCKUP_RESIDUAL_TOLERANCE_MM = 0.01;
/**
 * Over-constrained linkage: bind (mm) above this is not something bushings or rod ends
 * absorb; the linkage is treated as locked. Common practice, no published source.
 */
export const LOCKUP_BIND_LIMIT_MM = 20;
/**
 * The corrector may move the pose at most this far (mm, a radian counted as
 * ROTATION_SCALE_MM) from the predictor; more means it jumped to another assembly of the
 * linkage (the other branch of a four-bar), not the one the sweep is following.
 */
export const BRANCH_JUMP_LIMIT_MM = 10;
/** A failed row is retried as this many equal sub-steps before it counts as lock-up. */
export const RETRY_SUBSTEPS = 8;

export interface SolvedRow {
  /** mm */
  travel: number;
  /** deg */
  roll: number;
  /** pose state (mm, rad) */
  state: Float64Array;
  /** d(state)/d(sweep parameter) at this row, the parameter being the one marched */
  rate: Float64Array;
  /** mm, largest absolute residual */
  bind: number;
}

export interface MarchOutcome {
  rows: SolvedRow[];
  /** the parameter value where the linkage locked, or null if the march went the whole way */
  lockedAt: number | null;
}

export interface MarchContext {
  model: LinkageModel;
  drive: Drive;
  solver: PoseSolver;
  /** m − rank at ride: 0 for an exactly determined linkage */
  redundancy: number;
}

/** Which parameter a march varies, the other being held. */
export type MarchParameter = 'travel' | 'roll';

function scaledDistance(drive: Drive, a: Float64Array, b: Float64Array): number {
  let d = 0;
  for (const c of drive.free) {
    const s = Math.abs(a[c] - b[c]) * (c % POSE_SIZE >= POSE_ROLL ? ROTATION_SCALE_MM : 1);
    if (s > d) d = s;
  }
  return d;
}

const paramOf = (row: SolvedRow, param: MarchParameter) => (param === 'travel' ? row.travel : row.roll);

/** Scratch of `stepTo` (synchronous, so one pair serves every call): the predicted state and the imposed rate. */
const stepScratch = { predicted: new Float64Array(0), imposedRate: new Float64Array(0) };

function stepScratchFor(size: number): typeof stepScratch {
  if (stepScratch.predicted.length !== size) {
    stepScratch.predicted = new Float64Array(size);
    stepScratch.imposedRate = new Float64Array(size);
  }
  return stepScratch;
}

/**
 * Solves the row at parameter value `to` from a solved row; null if it fails. With the row
 * before `from` given, the predictor is second order (the change of the sensitivity between
 * the two rows estimates the path's curvature), which saves a Newton step a row.
 */
function stepTo(
  ctx: MarchContext,
  from: SolvedRow,
  param: MarchParameter,
  to: number,
  before: SolvedRow | null = null,
): SolvedRow | null {
  const { model, drive, solver } = ctx;
  const travel = param === 'travel' ? to : from.travel;
  const roll = param === 'roll' ? to : from.roll;
  const delta = to - paramOf(from, param);
  const state = new Float64Array(from.state);
  const span = before ? paramOf(from, param) - paramOf(before, param) : 0;
  if (before && span !== 0) {
    const k = (0.5 * delta * delta) / span;
    for (const c of drive.free) state[c] += from.rate[c] * delta + (from.rate[c] - before.rate[c]) * k;
  } else {
    for (const c of drive.free) state[c] += from.rate[c] * delta;
  }
  driveApply(model, state, travel, roll);
  const { predicted, imposedRate } = stepScratchFor(model.stateSize);
  predicted.set(state);
  const outcome = solver.solve(state);
  if (!outcome.converged) return null;
  const limit = ctx.redundancy === 0 ? LOCKUP_RESIDUAL_TOLERANCE_MM : LOCKUP_BIND_LIMIT_MM;
  if (!(outcome.maxResidual <= limit)) return null;
  if (scaledDistance(drive, state, predicted) > BRANCH_JUMP_LIMIT_MM) return null;
  const rate = new Float64Array(model.stateSize);
  driveRate(model, imposedRate, param, roll);
  solver.sensitivity(imposedRate, rate);
  for (let i = 0; i < rate.length; i++) if (!Number.isFinite(rate[i])) return null;
  return { travel, roll, state, rate, bind: outcome.maxResidual };
}

/** Solves the ride row (travel 0, roll 0), with the sensitivity to `param`. */
export function solveStart(
  ctx: MarchContext,
  param: MarchParameter,
  travel = 0,
  roll = 0,
  guess?: Float64Array,
): SolvedRow | null {
  const { model, solver } = ctx;
  const state = guess ? new Float64Array(guess) : new Float64Array(model.stateSize);
  driveApply(model, state, travel, roll);
  const outcome = solver.solve(state);
  if (!outcome.converged) return null;
  const limit = ctx.redundancy === 0 ? LOCKUP_RESIDUAL_TOLERANCE_MM : LOCKUP_BIND_LIMIT_MM;
  if (!(outcome.maxResidual <= limit)) return null;
  const rate = new Float64Array(model.stateSize);
  const imposedRate = new Float64Array(model.stateSize);
  driveRate(model, imposedRate, param, roll);
  solver.sensitivity(imposedRate, rate);
  return { travel, roll, state, rate, bind: outcome.maxResidual };
}

/** Re-derives a solved row's sensitivity for another parameter (e.g. roll from a heave row). */
export function rowRateFor(ctx: MarchContext, row: SolvedRow, param: MarchParameter): SolvedRow {
  const { model, solver } = ctx;
  const state = new Float64Array(row.state);
  solver.solve(state);
  solver.refactor();
  const rate = new Float64Array(model.stateSize);
  const imposedRate = new Float64Array(model.stateSize);
  driveRate(model, imposedRate, param, row.roll);
  solver.sensitivity(imposedRate, rate);
  return { ...row, state, rate };
}

/** Marches from `start` through `values` (ordered away from the start), stopping at lock-up. */
export function march(
  ctx: MarchContext,
  start: SolvedRow,
  param: MarchParameter,
  values: readonly number[],
): MarchOutcome {
  const rows: SolvedRow[] = [];
  let prev = start;
  let before: SolvedRow | null = null;
  for (const v of values) {
    let next = stepTo(ctx, prev, param, v, before);
    if (!next) {
      // Retry in sub-steps: near a toggle the predictor overshoots before the linkage is at its limit.
      const from = param === 'travel' ? prev.travel : prev.roll;
      let sub: SolvedRow | null = prev;
      for (let k = 1; k <= RETRY_SUBSTEPS && sub; k++) {
        sub = stepTo(ctx, sub, param, from + ((v - from) * k) / RETRY_SUBSTEPS);
      }
      next = sub;
    }
    if (!next) return { rows, lockedAt: v };
    rows.push(next);
    before = prev;
    prev = next;
  }
  return { rows, lockedAt: null };
}
