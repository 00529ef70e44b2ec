/**
 * Householder QR of a small dense matrix held in one Float64Array (row-major), factored in place, and its
 * least-squares solve for one right-hand side. The arithmetic is ml-matrix's QrDecomposition's, operation for
 * operation and in the same order, so the answers are the same to the last bit; what differs is the storage:
 * ml-matrix reads and writes every entry through get/set on an array of rows, clones its input for each
 * factorisation and each solve, and allocates the answer, which for the pose solve's blocks (tens of rows)
 * costs several times the arithmetic. Here every buffer is allocated once and reused.
 */

/** sqrt(a² + b²) without overflow: ml-matrix's `hypotenuse`, kept identical so the norms are the same bits. */
function hypotenuse(a: number, b: number): number {
  if (Math.abs(a) > Math.abs(b)) {
    const r = b / a;
    return Math.abs(a) * Math.sqrt(1 + r * r);
  }
  if (b !== 0) {
    const r = a / b;
    return Math.abs(b) * Math.sqrt(1 + r * r);
  }
  return 0;
}

export class HouseholderQr {
  /** columns */
  readonly n: number;
  /** the largest row count this can factor */
  readonly capacity: number;
  /** rows of the matrix last factored */
  private m = 0;
  /** the matrix to factor, then its Householder vectors and R's upper part (row-major, n columns) */
  readonly a: Float64Array;
  private readonly rdiag: Float64Array;
  /** the right-hand side (first m entries, filled by the caller), overwritten by `solve` with the answer (first n) */
  readonly x: Float64Array;

  constructor(capacity: number, n: number) {
    this.capacity = capacity;
    this.n = n;
    this.a = new Float64Array(capacity * n);
    this.rdiag = new Float64Array(n);
    this.x = new Float64Array(capacity);
  }

  /**
   * Factors the first `m` rows of `a` (filled by the caller) in place. False when R has a zero on its
   * diagonal (ml-matrix's `isFullRank` false): then `solve` must not be called.
   */
  factor(m: number): boolean {
    const { a, n, rdiag } = this;
    this.m = m;
    for (let k = 0; k < n; k++) {
      let nrm = 0;
      for (let i = k; i < m; i++) nrm = hypotenuse(nrm, a[i * n + k]);
      if (nrm !== 0) {
        if (a[k * n + k] < 0) nrm = -nrm;
        for (let i = k; i < m; i++) a[i * n + k] = a[i * n + k] / nrm;
        a[k * n + k] = a[k * n + k] + 1;
        for (let j = k + 1; j < n; j++) {
          let s = 0;
          for (let i = k; i < m; i++) s += a[i * n + k] * a[i * n + j];
          s = -s / a[k * n + k];
          for (let i = k; i < m; i++) a[i * n + j] = a[i * n + j] + s * a[i * n + k];
        }
      }
      rdiag[k] = -nrm;
    }
    for (let k = 0; k < n; k++) if (rdiag[k] === 0) return false;
    return true;
  }

  /** The least-squares solution of A·x = b for the factored A: b in `x` (m entries), the n unknowns left in `x`. */
  solve(): void {
    const { a, n, rdiag, x, m } = this;
    for (let k = 0; k < n; k++) {
      let s = 0;
      for (let i = k; i < m; i++) s += a[i * n + k] * x[i];
      s = -s / a[k * n + k];
      for (let i = k; i < m; i++) x[i] = x[i] + s * a[i * n + k];
    }
    for (let k = n - 1; k >= 0; k--) {
      x[k] = x[k] / rdiag[k];
      for (let i = 0; i < k; i++) x[i] = x[i] - x[k] * a[i * n + k];
    }
  }
}
