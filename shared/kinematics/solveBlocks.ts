/**
 * The linear least-squares step of the pose solve, split into independent blocks. Bodies that
 * no constraint joins (the two knuckles of a double wishbone, the two arms of a trailing-arm
 * layout) give a block-diagonal Jacobian; each block is factored and solved on its own, which
 * is the same answer as the whole system (the blocks do not share a row or a column) at a
 * fraction of the cost (QR is cubic in the block size). A linkage that is one block (a solid
 * axle) is solved exactly as before, as one matrix. The factorisation is householderQr.ts (ml-matrix's
 * arithmetic, without its per-entry and per-call allocation costs).
 */
import { HouseholderQr } from './householderQr';
import type { LinkageModel } from './model';
import { constraintRows, constraintSlots } from './model';
import { POSE_SIZE } from './pose';

/** Residual rows and free columns (indices into the solver's free list) that only meet each other. */
export interface SolveBlock {
  rows: Int32Array;
  cols: Int32Array;
}

/** Groups the residual rows and free columns by the bodies the constraints join (union–find over bodies). */
export function solveBlocksBuild(model: LinkageModel, free: Int32Array): SolveBlock[] {
  const parent = model.bodies.map((_, i) => i);
  const root = (i: number): number => (parent[i] === i ? i : (parent[i] = root(parent[i])));
  const slotsOf = constraintSlots;
  for (const c of model.constraints) {
    const s = slotsOf(c);
    for (let k = 1; k < s.length; k++) parent[root(s[k])] = root(s[0]);
  }
  const rows = new Map<number, number[]>();
  const cols = new Map<number, number[]>();
  let row = 0;
  for (const c of model.constraints) {
    const count = constraintRows(c);
    const key = root(slotsOf(c)[0]);
    const list = rows.get(key) ?? [];
    for (let k = 0; k < count; k++) list.push(row + k);
    rows.set(key, list);
    row += count;
  }
  free.forEach((c, j) => {
    const key = root(Math.floor(c / POSE_SIZE));
    const list = cols.get(key) ?? [];
    list.push(j);
    cols.set(key, list);
  });
  return [...cols.entries()].map(([key, cs]) => ({
    rows: Int32Array.from(rows.get(key) ?? []),
    cols: Int32Array.from(cs),
  }));
}

interface BlockWork extends SolveBlock {
  /** the factorisation, with room for the damping rows */
  qr: HouseholderQr;
  colNorm: Float64Array;
  factored: boolean;
  /** rows of the factored matrix in use (with or without the damping rows) */
  used: number;
  /** the block's columns are all zero (nothing constrains its bodies): its step is zero */
  empty: boolean;
}

/** Factorisations of [J_free ; damping rows] block by block, reused between steps. */
export class BlockedLeastSquares {
  private readonly blocks: BlockWork[];

  constructor(blocks: SolveBlock[]) {
    this.blocks = blocks.map((b) => {
      const m = b.rows.length,
        n = b.cols.length;
      return {
        ...b,
        qr: new HouseholderQr(m + n, n),
        colNorm: new Float64Array(n),
        factored: false,
        used: 0,
        empty: true,
      };
    });
  }

  get count(): number {
    return this.blocks.length;
  }

  /**
   * Factors every block of J (row-major, `stateSize` columns; `free` maps a block column to
   * its state index) with Levenberg–Marquardt `damping` and, when `regularize`, Tikhonov rows
   * of `regularizationRelative` × the block's largest column norm². False when every column is
   * zero or a block is singular (a linkage at a toggle, without damping rows).
   */
  factor(
    J: Float64Array,
    stateSize: number,
    free: Int32Array,
    damping: number,
    regularize: boolean,
    regularizationRelative: number,
  ): boolean {
    let any = false;
    for (const b of this.blocks) {
      b.factored = false;
      const m = b.rows.length,
        n = b.cols.length;
      const augmented = damping > 0 || regularize || m < n;
      const A = b.qr.a;
      b.used = augmented ? m + n : m;
      let maxNorm = 0;
      for (let j = 0; j < n; j++) {
        const c = free[b.cols[j]];
        let s = 0;
        for (let i = 0; i < m; i++) {
          const v = J[b.rows[i] * stateSize + c];
          A[i * n + j] = v;
          s += v * v;
        }
        b.colNorm[j] = s;
        if (s > maxNorm) maxNorm = s;
      }
      b.empty = !(maxNorm > 0);
      if (b.empty) continue;
      if (augmented) {
        const mu = regularize || m < n ? regularizationRelative * maxNorm : 0;
        for (let j = 0; j < n; j++) {
          for (let k = 0; k < n; k++) A[(m + j) * n + k] = 0;
          A[(m + j) * n + j] = Math.sqrt(damping * b.colNorm[j] + mu);
        }
      }
      if (!b.qr.factor(b.used)) return false;
      b.factored = true;
      any = true;
    }
    return any;
  }

  /** Solves the factored blocks for the right-hand side [sign·rhs; 0]; writes the step of every free column into `out`. */
  solve(rhs: Float64Array, sign: number, out: Float64Array): void {
    for (const b of this.blocks) {
      if (b.empty || !b.factored) {
        for (const j of b.cols) out[j] = 0;
        continue;
      }
      const m = b.rows.length;
      const x = b.qr.x;
      for (let i = 0; i < m; i++) x[i] = sign * rhs[b.rows[i]];
      for (let i = m; i < b.used; i++) x[i] = 0;
      b.qr.solve();
      for (let j = 0; j < b.cols.length; j++) out[b.cols[j]] = x[j];
    }
  }
}
