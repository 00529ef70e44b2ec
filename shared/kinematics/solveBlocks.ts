/**
 * The linear least-squares step of the pose solve, split into independent blocks. Bodies that
 * no constraint joins (the two knuckles of a double wishbone, the two arms of a trailing-arm
 * layout) give a block-diagonal Jacobian; each block is factored and solved on its own, which
 * is the same answer as the whole system (the blocks do not share a row or a column) at a
 * fraction of the cost (QR is cubic in the block size). A linkage that is one block (a solid
 * axle) is solved exactly as before, as one matrix.
 */
import { Matrix, QrDecomposition } from 'ml-matrix';
import type { LinkageModel } from './model';
import { constraintRows, constraintSlots } from './model';
import { POSE_SIZE } from './pose';

/**
 * A Matrix whose clone copies row arrays directly into one copy it keeps. ml-matrix's
 * decompositions clone their input (QR its matrix, solve its right-hand side) through a
 * generator over every entry into a fresh matrix, which dominates the time of the small
 * systems solved here; the algebra stays ml-matrix's. The kept copy is overwritten by the
 * next clone, which is safe here: a block's factorisation of a matrix is dropped before that
 * matrix is factored again, and a solve's copy of its right-hand side is read (its first n
 * rows taken) before the next solve.
 */
export class WorkMatrix extends Matrix {
  private twin: WorkMatrix | null = null;

  override clone(): this {
    const out = (this.twin ??= new WorkMatrix(this.rows, this.columns)) as this;
    const from = (this as unknown as { data: Float64Array[] }).data;
    const to = (out as unknown as { data: Float64Array[] }).data;
    for (let i = 0; i < this.rows; i++) to[i].set(from[i]);
    return out;
  }
}

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
  aug: WorkMatrix;
  augRhs: WorkMatrix;
  plain: WorkMatrix;
  plainRhs: WorkMatrix;
  colNorm: Float64Array;
  qr: QrDecomposition | null;
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
        aug: new WorkMatrix(m + n, n),
        augRhs: new WorkMatrix(m + n, 1),
        plain: new WorkMatrix(Math.max(m, 1), n),
        plainRhs: new WorkMatrix(Math.max(m, 1), 1),
        colNorm: new Float64Array(n),
        qr: null,
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
      b.qr = null;
      const m = b.rows.length,
        n = b.cols.length;
      const augmented = damping > 0 || regularize || m < n;
      const A = augmented ? b.aug : b.plain;
      b.used = augmented ? m + n : m;
      let maxNorm = 0;
      for (let j = 0; j < n; j++) {
        const c = free[b.cols[j]];
        let s = 0;
        for (let i = 0; i < m; i++) {
          const v = J[b.rows[i] * stateSize + c];
          A.set(i, j, v);
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
          for (let k = 0; k < n; k++) A.set(m + j, k, 0);
          A.set(m + j, j, Math.sqrt(damping * b.colNorm[j] + mu));
        }
      }
      b.qr = new QrDecomposition(A);
      if (!b.qr.isFullRank()) {
        b.qr = null;
        return false;
      }
      any = true;
    }
    return any;
  }

  /** Solves the factored blocks for the right-hand side [sign·rhs; 0]; writes the step of every free column into `out`. */
  solve(rhs: Float64Array, sign: number, out: Float64Array): void {
    for (const b of this.blocks) {
      if (b.empty || !b.qr) {
        for (const j of b.cols) out[j] = 0;
        continue;
      }
      const m = b.rows.length;
      const B = b.used > m ? b.augRhs : b.plainRhs;
      for (let i = 0; i < m; i++) B.set(i, 0, sign * rhs[b.rows[i]]);
      for (let i = m; i < b.used; i++) B.set(i, 0, 0);
      const x = b.qr.solve(B);
      for (let j = 0; j < b.cols.length; j++) out[b.cols[j]] = x.get(j, 0);
    }
  }
}
