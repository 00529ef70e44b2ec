/**
 * Least-squares pose solve: the free pose coordinates are moved until the constraint
 * residuals are as small as they can be (unweighted, residuals in mm), the imposed ones
 * held. Levenberg–Marquardt steps, each one a linear least-squares problem
 *   [ J_free ; diag(√(λ·d_j + μ)) ] · δ = [ −r ; 0 ]
 * solved by Householder QR (ml-matrix). The extra rows make the step well defined when the
 * linkage leaves a coordinate unlocated (rank-deficient J) and vanish from the answer at a
 * minimum (there Jᵀr = 0, so δ = 0 whatever the damping); over-constrained linkages
 * (more residuals than unknowns) need nothing special: QR gives their least-squares step.
 * Bodies that no constraint joins (the two knuckles of a double wishbone) are solved block by
 * block, each side on its own (solveBlocks.ts).
 */
import { Matrix, SingularValueDecomposition } from 'ml-matrix';
import type { Drive } from './drive';
import type { LinkageModel } from './model';
import * as pose from './pose';
import * as residuals from './residuals';
import { residualWorkCreate, type ResidualWork } from './residuals';
import { BlockedLeastSquares, solveBlocksBuild } from './solveBlocks';

/**
 * Module-local copies of imported bindings used in the inner loop: under the CommonJS interop
 * Node runs this code with (tsx: server, command line, bench) every use of an imported
 * binding is a getter call on the module's exports, about a tenth of a sweep's profile.
 */
const POSE_ROLL = pose.POSE_ROLL;
const POSE_SIZE = pose.POSE_SIZE;
const residualsEvaluate = residuals.residualsEvaluate;

/** A step of the Newton loop this far from converged means it is not converging. */
export const SOLVE_MAX_ITERATIONS = 40;
/**
 * Converged when the largest step (rotations counted at ROTATION_SCALE_MM lever) is below
 * this; the step is still applied, and Newton's quadratic convergence leaves the pose within
 * about (1e-6 mm)² / (link length) of the solution — far below the 0.1 mm / 0.02° promised.
 */
export const SOLVE_STEP_TOLERANCE_MM = 1e-6;
/**
 * After an undamped step shorter than this (mm) the next step reuses the factorisation of the
 * previous Jacobian (a chord, or simplified Newton, step): J has changed by about
 * (step / link length), so the iteration still converges by orders of magnitude a step and
 * stops on SOLVE_STEP_TOLERANCE_MM as before, one QR cheaper.
 */
export const CHORD_STEP_MM = 0.1;
/** A radian of rotation counts as this many mm when comparing steps: about half an axle's track. */
export const ROTATION_SCALE_MM = 1000;
/**
 * Tikhonov floor μ relative to the largest column norm² of J: keeps the step finite for an
 * unlocated coordinate, too small to slow the located ones.
 */
export const REGULARIZATION_RELATIVE = 1e-8;
/** Levenberg–Marquardt damping: first value after a failed step, growth factor, give-up value. */
export const DAMPING_START = 1e-4;
export const DAMPING_FACTOR = 10;
export const DAMPING_MAX = 1e8;
/** Damping below this is dropped (pure Gauss–Newton with the Tikhonov floor). */
export const DAMPING_DROP = 1e-9;
/**
 * Relative change of the cost (sum of squared residuals) below which an undamped step
 * counts as standing still: the pose is then within about 1e-5 × the residual of the
 * minimum, far inside the promised accuracy.
 */
export const COST_RELATIVE_TOLERANCE = 1e-10;
/** Relative singular-value threshold for the rank of the scaled Jacobian at ride. */
export const RANK_TOLERANCE_RELATIVE = 1e-9;

export interface SolveOutcome {
  converged: boolean;
  iterations: number;
  /** mm, largest absolute residual at the final state */
  maxResidual: number;
}

const isRotation = (stateIndex: number) => stateIndex % POSE_SIZE >= POSE_ROLL;

/** One solver per linkage and drive; all buffers are reused between rows. */
export class PoseSolver {
  readonly m: number;
  readonly n: number;
  private readonly model: LinkageModel;
  private readonly free: Int32Array;
  private readonly work: ResidualWork;
  private r: Float64Array;
  private J: Float64Array;
  private rTrial: Float64Array;
  private JTrial: Float64Array;
  private readonly trial: Float64Array;
  private readonly step: Float64Array;
  /** the step's linear least squares, one block per group of bodies the constraints join (solveBlocks.ts) */
  private readonly ls: BlockedLeastSquares;
  /**
   * Whether the Tikhonov rows are needed even without damping: true until the rank at ride
   * shows every free coordinate is located (then plain QR of J is both right and cheaper).
   */
  regularize = true;
  /** QR factorisations made so far (the benchmark prints them per row: the largest cost of a solve). */
  factorisations = 0;
  private factored = false;
  private qrIsUndamped = false;

  constructor(model: LinkageModel, drive: Drive) {
    this.model = model;
    this.free = drive.free;
    this.m = model.residualCount;
    this.n = drive.free.length;
    this.work = residualWorkCreate(model);
    this.r = new Float64Array(this.m);
    this.J = new Float64Array(this.m * model.stateSize);
    this.rTrial = new Float64Array(this.m);
    this.JTrial = new Float64Array(this.m * model.stateSize);
    this.trial = new Float64Array(model.stateSize);
    this.step = new Float64Array(this.n);
    this.ls = new BlockedLeastSquares(solveBlocksBuild(model, drive.free));
  }

  /** Residuals (mm) at the last solved state. */
  get residuals(): Float64Array {
    return this.r;
  }

  /** Largest absolute hard residual (mm): a soft row (a leaf spring's bend) is not a length mismatch. */
  private maxAbs(r: Float64Array): number {
    const soft = this.model.softRows;
    let v = 0;
    for (let i = 0; i < r.length; i++) if (!soft[i]) v = Math.max(v, Math.abs(r[i]));
    return v;
  }

  private cost(r: Float64Array): number {
    let c = 0;
    for (let i = 0; i < r.length; i++) c += r[i] * r[i];
    return c;
  }

  /** Fills [J_free; damping rows] (or J_free alone), block by block, and factors it. False when J is all zero or singular. */
  private factor(damping: number): boolean {
    this.factorisations++;
    this.factored = this.ls.factor(
      this.J,
      this.model.stateSize,
      this.free,
      damping,
      this.regularize,
      REGULARIZATION_RELATIVE,
    );
    this.qrIsUndamped = damping === 0;
    // Only an exactly singular J without damping rows fails here (a linkage at a toggle).
    return this.factored;
  }

  /** Solves the factored system for the right-hand side [rhs; 0]; writes the n unknowns. */
  private back(rhs: Float64Array, sign: number, out: Float64Array): void {
    this.ls.solve(rhs, sign, out);
  }

  /**
   * Moves the free coordinates of `state` (in place; imposed coordinates already set) to the
   * least-squares pose. The starting free coordinates are the initial guess. `chordStepMm`: after
   * an undamped step shorter than this the next reuses the factorisation (CHORD_STEP_MM unless a
   * march whose first steps are longer, but whose Jacobian changes slowly over them, says otherwise).
   */
  solve(state: Float64Array, chordStepMm = CHORD_STEP_MM): SolveOutcome {
    const { model, free, n, work, step } = this;
    residualsEvaluate(model, state, work, this.r, this.J);
    if (n === 0 || this.m === 0) {
      this.factored = false;
      return { converged: true, iterations: 0, maxResidual: this.maxAbs(this.r) };
    }
    let cost = this.cost(this.r);
    let damping = 0;
    let chord = false;
    for (let it = 1; it <= SOLVE_MAX_ITERATIONS; it++) {
      if (chord && damping === 0 && this.factored && this.qrIsUndamped) {
        // Reuse the last factorisation (see CHORD_STEP_MM).
      } else if (!this.factor(damping)) {
        if (damping === 0 && !this.regularize) {
          // Singular without damping rows: retry this iteration damped.
          damping = DAMPING_START;
          continue;
        }
        return { converged: true, iterations: it, maxResidual: this.maxAbs(this.r) };
      }
      this.back(this.r, -1, step);
      let size = 0;
      for (let j = 0; j < n; j++) {
        const s = Math.abs(step[j]) * (isRotation(free[j]) ? ROTATION_SCALE_MM : 1);
        if (!Number.isFinite(s)) return { converged: false, iterations: it, maxResidual: this.maxAbs(this.r) };
        if (s > size) size = s;
      }
      chord = damping === 0 && size < chordStepMm;
      if (size < SOLVE_STEP_TOLERANCE_MM) {
        // A damped step is short by construction; only an undamped short step means a minimum.
        if (damping > 0) {
          damping = 0;
          continue;
        }
        for (let j = 0; j < n; j++) state[free[j]] += step[j];
        residualsEvaluate(model, state, work, this.r, this.J);
        return { converged: true, iterations: it, maxResidual: this.maxAbs(this.r) };
      }
      this.trial.set(state);
      for (let j = 0; j < n; j++) this.trial[free[j]] += step[j];
      residualsEvaluate(model, this.trial, work, this.rTrial, this.JTrial);
      const trialCost = this.cost(this.rTrial);
      // An undamped step that no longer changes the cost beyond round-off: the least-squares
      // minimum of a linkage that binds (its residuals stay > 0, so steps shrink only linearly).
      const flat = damping === 0 && Math.abs(cost - trialCost) <= COST_RELATIVE_TOLERANCE * cost;
      if (trialCost <= cost) {
        state.set(this.trial);
        [this.r, this.rTrial] = [this.rTrial, this.r];
        [this.J, this.JTrial] = [this.JTrial, this.J];
        cost = trialCost;
        if (flat) return { converged: true, iterations: it, maxResidual: this.maxAbs(this.r) };
        damping = damping / DAMPING_FACTOR < DAMPING_DROP ? 0 : damping / DAMPING_FACTOR;
      } else if (flat) {
        return { converged: true, iterations: it, maxResidual: this.maxAbs(this.r) };
      } else {
        chord = false;
        damping = damping === 0 ? DAMPING_START : damping * DAMPING_FACTOR;
        if (damping > DAMPING_MAX) break;
      }
    }
    return { converged: false, iterations: SOLVE_MAX_ITERATIONS, maxResidual: this.maxAbs(this.r) };
  }

  /**
   * First-order sensitivity of the solved pose to the sweep parameter: given the rate of
   * the imposed coordinates (`rate`, full state length), writes d(state)/d(parameter) into
   * `out` (imposed rates copied, free ones from J_free·dq = −J·rate in the least-squares
   * sense). Uses the Jacobian of the last solve.
   */
  sensitivity(rate: Float64Array, out: Float64Array): void {
    const { model, free, n, m } = this;
    const cols = model.stateSize;
    out.set(rate);
    if (n === 0 || m === 0) return;
    const rhs = this.rTrial; // scratch of length m
    for (let i = 0; i < m; i++) {
      let s = 0;
      for (let c = 0; c < cols; c++) if (rate[c] !== 0) s += this.J[i * cols + c] * rate[c];
      rhs[i] = s;
    }
    if (!this.qrIsUndamped || !this.factored) {
      if (!this.factor(0)) return;
    }
    this.back(rhs, -1, this.step);
    for (let j = 0; j < n; j++) out[free[j]] = this.step[j];
  }

  /**
   * Sensitivity of the solved pose to a parameter that moves frame points rather than imposed
   * coordinates (the steer sweep's rack): `dr` is ∂r/∂parameter at the fixed pose (length m); writes
   * d(state)/d(parameter) into `out` (imposed coordinates 0, free ones from J_free·dq = −dr in the
   * least-squares sense). Uses the Jacobian of the last solve.
   */
  sensitivityToResiduals(dr: Float64Array, out: Float64Array): void {
    const { free, n, m } = this;
    out.fill(0);
    if (n === 0 || m === 0) return;
    if (!this.qrIsUndamped || !this.factored) {
      if (!this.factor(0)) return;
    }
    this.back(dr, -1, this.step);
    for (let j = 0; j < n; j++) out[free[j]] = this.step[j];
  }

  /** Forces a fresh factorisation at the current Jacobian before the next sensitivity. */
  refactor(): void {
    this.factor(0);
  }

  /**
   * Rank of the free Jacobian at the last solved state (columns scaled so that a radian
   * counts as ROTATION_SCALE_MM) and the null-space directions (unlocated motions) as
   * state-length vectors.
   */
  rankAnalysis(): { rank: number; nullSpace: Float64Array[] } {
    const { m, n, free } = this;
    const cols = this.model.stateSize;
    if (n === 0) return { rank: 0, nullSpace: [] };
    if (m === 0) {
      return {
        rank: 0,
        nullSpace: Array.from(free, (c) => {
          const v = new Float64Array(cols);
          v[c] = 1;
          return v;
        }),
      };
    }
    // Pad to at least n rows so the SVD sees a tall matrix and returns all n right vectors.
    const rows = Math.max(m, n);
    const S = new Matrix(rows, n);
    for (let i = 0; i < m; i++) {
      for (let j = 0; j < n; j++) {
        S.set(i, j, this.J[i * cols + free[j]] / (isRotation(free[j]) ? ROTATION_SCALE_MM : 1));
      }
    }
    const svd = new SingularValueDecomposition(S, { computeLeftSingularVectors: false });
    const sv = svd.diagonal;
    const top = Math.max(...sv);
    const V = svd.rightSingularVectors;
    let rank = 0;
    const nullSpace: Float64Array[] = [];
    for (let k = 0; k < n; k++) {
      if (top > 0 && sv[k] > RANK_TOLERANCE_RELATIVE * top) {
        rank++;
        continue;
      }
      const v = new Float64Array(cols);
      for (let j = 0; j < n; j++) v[free[j]] = V.get(j, k) / (isRotation(free[j]) ? ROTATION_SCALE_MM : 1);
      nullSpace.push(v);
    }
    return { rank, nullSpace };
  }
}
