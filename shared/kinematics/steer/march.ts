/**
 * Marching the steering input (a rack, or a pitman arm) out from centre, as march.ts marches heave: each row
 * starts from the last solved one plus its sensitivity to the input times the step (with the row before, a
 * cubic through both: predict.ts), then the least-squares solve corrects it, with the body held at ride
 * height. A row that fails is retried in sub-steps; if it still fails the steering has reached a limit (a tie
 * rod and its steering arm in line), found to a fraction of a millimetre (or degree) by bisection.
 */
import { driveApply } from '../drive';
import { BRANCH_JUMP_LIMIT_MM, LOCKUP_BIND_LIMIT_MM, LOCKUP_RESIDUAL_TOLERANCE_MM, RETRY_SUBSTEPS } from '../march';
import type { MarchContext } from '../march';
import { constraintRows, type PointModel } from '../model';
import { POSE_ROLL, POSE_SIZE } from '../pose';
import { BodyRotations, pointPlace, residualsEvaluate, residualWorkCreate, type ResidualWork } from '../residuals';
import { ROTATION_SCALE_MM } from '../solve';
import { predictPose } from './predict';
import { steerInputPoints, steerInputSet, steerInputVelocity, type SteerInput, type SteerLinkage } from './linkage';

/**
 * mm (a radian counted as ROTATION_SCALE_MM): the steer march's chord limit (solve.ts, CHORD_STEP_MM). Toward
 * lock the predictor's error grows to about a millimetre while each row's first step leaves the pose within
 * micrometres; a step of this size changes the Jacobian by about (step / link length), under 1 %, so the
 * following steps on the first factorisation still gain orders of magnitude each and stop on the solver's
 * own tolerance, without a second factorisation.
 */
export const STEER_CHORD_STEP_MM = 1;

/** Bisection steps that close in on the limit: a 5 mm (or 5°) step ends within 5 µm (or 0.005°) of it. */
export const LIMIT_BISECTION_STEPS = 10;

/**
 * One solved steer row: the input's position (`at`: mm of rack, degrees of pitman arm), the pose (mm, rad), its
 * sensitivity to the input (per mm, or per degree).
 */
export interface InputSolved {
  at: number;
  state: Float64Array;
  rate: Float64Array;
  /** mm, largest absolute residual */
  bind: number;
}

/** A distance row whose end the input moves: its residual index, the constraint's two ends, which end is the input's. */
interface RackRow {
  row: number;
  a: PointModel;
  b: PointModel;
  sign: 1 | -1;
}

/** The input march's context: the sweep's solver and the input's rows of the residual. */
export interface InputContext {
  ctx: MarchContext;
  linkage: SteerLinkage;
  input: SteerInput;
  rows: RackRow[];
  rot: BodyRotations;
  dr: Float64Array;
  place: Float64Array;
  /** the predicted state of the row being solved (scratch) */
  predicted: Float64Array;
  /** scratch of the first row's corrected predictor: residual work, residuals (mm) and the correction */
  work: ResidualWork;
  r: Float64Array;
  correction: Float64Array;
}

export function inputContextBuild(ctx: MarchContext, linkage: SteerLinkage): InputContext {
  const input = linkage.input;
  const onRack = new Set(steerInputPoints(input).map((p) => p.point));
  const rows: RackRow[] = [];
  let row = 0;
  for (const c of ctx.model.constraints) {
    if (c.type === 'distance' && (onRack.has(c.a) || onRack.has(c.b)))
      rows.push({ row, a: c.a, b: c.b, sign: onRack.has(c.a) ? 1 : -1 });
    row += constraintRows(c);
  }
  // One set of rotation buffers serves the input's rate and the corrected predictor: each fills it before use,
  // and a sweep allocates its scratch once, so every buffer fewer is time saved on each sweep.
  const work = residualWorkCreate(ctx.model);
  return {
    ctx,
    linkage,
    input,
    rows,
    rot: work.rot,
    dr: new Float64Array(ctx.model.residualCount),
    place: new Float64Array(6),
    predicted: new Float64Array(ctx.model.stateSize),
    work,
    r: new Float64Array(ctx.model.residualCount),
    correction: new Float64Array(ctx.model.stateSize),
  };
}

/**
 * d(state)/d(input) at a solved state: the input moves a distance row's end at velocity u (mm per mm of rack,
 * or per degree of pitman arm), so ∂r/∂input = ±(unit vector along the member) · u, and the solver turns that
 * into the pose's rate.
 */
function inputRate(rc: InputContext, state: Float64Array, at: number, out: Float64Array): void {
  const { ctx, input, rows, rot, dr, place } = rc;
  const u = steerInputVelocity(input, at);
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

function scaledDistance(rc: InputContext, a: Float64Array, b: Float64Array): number {
  let d = 0;
  for (const c of rc.ctx.drive.free) {
    const s = Math.abs(a[c] - b[c]) * (c % POSE_SIZE >= POSE_ROLL ? ROTATION_SCALE_MM : 1);
    if (s > d) d = s;
  }
  return d;
}

/**
 * Solves the row at input `to` from a solved row (the cubic predictor of predict.ts with `before`); null if it
 * fails. `correct`: the solver's factorisation is `from`'s (inputStart leaves it so), and the first-order
 * predictor gets one chord step with it (below).
 */
function stepInput(
  rc: InputContext,
  from: InputSolved,
  to: number,
  before: InputSolved | null = null,
  correct = false,
): InputSolved | null {
  const { model, drive, solver, redundancy } = rc.ctx;
  const delta = to - from.at;
  const state = new Float64Array(from.state);
  if (before && from.at !== before.at) predictPose(drive.free, before, from, to, state);
  else for (const c of drive.free) state[c] += from.rate[c] * delta;
  driveApply(model, state, 0, 0);
  steerInputSet(rc.input, to);
  if (correct) chordCorrect(rc, state);
  const predicted = rc.predicted;
  predicted.set(state);
  const outcome = solver.solve(state, STEER_CHORD_STEP_MM);
  if (!outcome.converged) return null;
  const limit = redundancy === 0 ? LOCKUP_RESIDUAL_TOLERANCE_MM : LOCKUP_BIND_LIMIT_MM;
  if (!(outcome.maxResidual <= limit)) return null;
  if (scaledDistance(rc, state, predicted) > BRANCH_JUMP_LIMIT_MM) return null;
  const rate = new Float64Array(model.stateSize);
  inputRate(rc, state, to, rate);
  for (let i = 0; i < rate.length; i++) if (!Number.isFinite(rate[i])) return null;
  return { at: to, state, rate, bind: outcome.maxResidual };
}

/**
 * One chord (simplified Newton) step on a first-order prediction, with the factorisation the solver holds (the
 * row it was predicted from): a residual evaluation and a back substitution, where a prediction whose error is
 * above the solver's chord limit costs an extra factorisation inside the solve. The solve still decides the
 * row, to its own tolerance; this only moves its starting guess.
 */
function chordCorrect(rc: InputContext, state: Float64Array): void {
  const { ctx, work, r, correction } = rc;
  residualsEvaluate(ctx.model, state, work, r, null);
  ctx.solver.sensitivityToResiduals(r, correction);
  for (const c of ctx.drive.free) state[c] += correction[c];
}

/** The centred row (input 0) from the solved ride row's state, with its rate to the input. */
export function inputStart(rc: InputContext, rideState: Float64Array): InputSolved {
  steerInputSet(rc.input, 0);
  const state = new Float64Array(rideState);
  const outcome = rc.ctx.solver.solve(state);
  const rate = new Float64Array(rc.ctx.model.stateSize);
  inputRate(rc, state, 0, rate);
  return { at: 0, state, rate, bind: outcome.maxResidual };
}

export interface InputMarchOutcome {
  rows: InputSolved[];
  /** the limit, when the march stopped before the end: the furthest row solved by bisection toward the failed value */
  limit: InputSolved | null;
  /** the input value that failed (mm, or degrees); null when the march went the whole way */
  failedAt: number | null;
}

/**
 * Marches from `start` through `values` (ordered away from centre), stopping at the steering's limit. `before`:
 * a solved row on the other side of `start` (the first row of the march the other way), so that the first row
 * too gets the cubic predictor; without it, the first row's linear prediction gets a chord step (chordCorrect),
 * which needs the solver to hold `start`'s factorisation (as inputStart leaves it).
 */
export function marchInput(
  rc: InputContext,
  start: InputSolved,
  values: readonly number[],
  before: InputSolved | null = null,
): InputMarchOutcome {
  const rows: InputSolved[] = [];
  let prev = start;
  for (const v of values) {
    const next = stepInput(rc, prev, v, before, prev === start) ?? subSteps(rc, prev, v);
    if (!next) return { rows, limit: bisectLimit(rc, prev, v), failedAt: v };
    rows.push(next);
    before = prev;
    prev = next;
  }
  return { rows, limit: null, failedAt: null };
}

/** Near a toggle the predictor overshoots before the linkage is at its limit: the row reached in sub-steps. */
function subSteps(rc: InputContext, from: InputSolved, to: number): InputSolved | null {
  let sub: InputSolved | null = from;
  for (let k = 1; k <= RETRY_SUBSTEPS && sub; k++)
    sub = stepInput(rc, sub, from.at + ((to - from.at) * k) / RETRY_SUBSTEPS);
  return sub;
}

/** The furthest solvable row between a solved row and an input value that fails. */
function bisectLimit(rc: InputContext, good: InputSolved, bad: number): InputSolved {
  let best = good;
  let fail = bad;
  for (let i = 0; i < LIMIT_BISECTION_STEPS; i++) {
    const mid = 0.5 * (best.at + fail);
    const next = stepInput(rc, best, mid) ?? subSteps(rc, best, mid);
    if (next) best = next;
    else fail = mid;
  }
  return best;
}
