// A small dense LU factorization with partial pivoting (row interchanges), PA = LU, for the
// square constraint Jacobians of the pose solver: solves with the matrix and with its transpose.
// Method: Golub and Van Loan, Matrix Computations, 4th ed., algorithm 3.4.1.

/** A pivot smaller than this fraction of the largest entry marks the matrix as singular: the
 * Jacobian mixes metres and radians, so entries span about 1e-3..1e3; 1e-10 sits far below any
 * well-posed linkage yet well above round-off (1e-16 x entries). */
export const SINGULAR_PIVOT_RATIO = 1e-10;

export class DenseLu {
  readonly n: number;
  /** L (unit lower, below the diagonal) and U (on and above it), row-major. */
  readonly lu: Float64Array;
  /** Row i of PA is row perm[i] of A. */
  readonly perm: Int32Array;
  private readonly work: Float64Array;
  /** Columns right of the pivot where the pivot row is non-zero (constraint Jacobians are
   * sparse: each row touches at most two bodies, so skipping zeros saves most of the work). */
  private readonly cols: Int32Array;
  /** Smallest |pivot| over the largest |entry| of the last factorization (0 when singular). */
  pivotRatio = 0;
  /** Sign of the determinant of the last factored matrix (+1 or -1; 0 when singular): a change
   * between two poses means a singular configuration lies between them. */
  determinantSign = 0;

  constructor(n: number) {
    this.n = n;
    this.lu = new Float64Array(n * n);
    this.perm = new Int32Array(n);
    this.work = new Float64Array(n);
    this.cols = new Int32Array(n);
  }

  /** Factors `a` (row-major n x n, left untouched). False when the matrix is singular. */
  factor(a: Float64Array): boolean {
    const n = this.n;
    const lu = this.lu;
    const perm = this.perm;
    lu.set(a.subarray(0, n * n));
    let scale = 0;
    for (let i = 0; i < n * n; i++) {
      const v = Math.abs(lu[i]!);
      if (v > scale) scale = v;
    }
    for (let i = 0; i < n; i++) perm[i] = i;
    if (n === 0) {
      this.pivotRatio = 1;
      return true;
    }
    if (scale === 0 || !Number.isFinite(scale)) {
      this.pivotRatio = 0;
      return false;
    }
    let minPivot = Infinity;
    let sign = 1;
    for (let k = 0; k < n; k++) {
      let p = k;
      let best = Math.abs(lu[k * n + k]!);
      for (let i = k + 1; i < n; i++) {
        const v = Math.abs(lu[i * n + k]!);
        if (v > best) {
          best = v;
          p = i;
        }
      }
      if (best === 0) {
        this.pivotRatio = 0;
        this.determinantSign = 0;
        return false;
      }
      if (p !== k) {
        for (let j = 0; j < n; j++) {
          const t = lu[k * n + j]!;
          lu[k * n + j] = lu[p * n + j]!;
          lu[p * n + j] = t;
        }
        const t = perm[k]!;
        perm[k] = perm[p]!;
        perm[p] = t;
        sign = -sign;
      }
      const pivot = lu[k * n + k]!;
      if (pivot < 0) sign = -sign;
      if (best < minPivot) minPivot = best;
      const cols = this.cols;
      let nnz = 0;
      for (let j = k + 1; j < n; j++) if (lu[k * n + j] !== 0) cols[nnz++] = j;
      for (let i = k + 1; i < n; i++) {
        const e = lu[i * n + k]!;
        if (e === 0) continue;
        const f = e / pivot;
        lu[i * n + k] = f;
        const ro = i * n;
        const ko = k * n;
        for (let t = 0; t < nnz; t++) {
          const j = cols[t]!;
          lu[ro + j]! -= f * lu[ko + j]!;
        }
      }
    }
    this.pivotRatio = minPivot / scale;
    this.determinantSign = sign;
    return this.pivotRatio > SINGULAR_PIVOT_RATIO;
  }

  /** Makes this the factorization `other` holds (same size): a stored pose's factors reused
   * instead of factoring the same matrix again. */
  copyFrom(other: DenseLu): void {
    this.lu.set(other.lu);
    this.perm.set(other.perm);
    this.pivotRatio = other.pivotRatio;
    this.determinantSign = other.determinantSign;
  }

  /** Solves A x = b (x may be b). */
  solve(b: Float64Array, x: Float64Array): void {
    const n = this.n;
    const lu = this.lu;
    const w = this.work;
    for (let i = 0; i < n; i++) w[i] = b[this.perm[i]!]!;
    for (let i = 1; i < n; i++) {
      let s = w[i]!;
      for (let j = 0; j < i; j++) s -= lu[i * n + j]! * w[j]!;
      w[i] = s;
    }
    for (let i = n - 1; i >= 0; i--) {
      let s = w[i]!;
      for (let j = i + 1; j < n; j++) s -= lu[i * n + j]! * w[j]!;
      w[i] = s / lu[i * n + i]!;
    }
    for (let i = 0; i < n; i++) x[i] = w[i]!;
  }

  /** Solves A^T x = b (x may be b): A^T = U^T L^T P, so U^T z = b, L^T y = z, x = P^T y. */
  solveTransposed(b: Float64Array, x: Float64Array): void {
    const n = this.n;
    const lu = this.lu;
    const w = this.work;
    for (let i = 0; i < n; i++) {
      let s = b[i]!;
      for (let j = 0; j < i; j++) s -= lu[j * n + i]! * w[j]!;
      w[i] = s / lu[i * n + i]!;
    }
    for (let i = n - 1; i >= 0; i--) {
      let s = w[i]!;
      for (let j = i + 1; j < n; j++) s -= lu[j * n + i]! * w[j]!;
      w[i] = s;
    }
    for (let i = 0; i < n; i++) x[this.perm[i]!] = w[i]!;
  }
}
