// Symmetric matrices stored by rows from each row's first non-zero column to the diagonal (the
// skyline or profile): a frame numbered along the arm keeps every row short, so memory and the
// Cholesky factorisation grow with n b and n b^2 (b the row length), not n^2 and n^3 (Bathe,
// Finite Element Procedures, 2nd ed., 8.2.3, active-column storage, here by rows).

/** A pivot below this share of the largest diagonal term means the matrix is singular for our
 * purpose (a mechanism in the frame): double precision keeps about 1e-16 relative, so 1e-12
 * leaves room for a frame whose members differ a thousandfold in stiffness. */
export const SINGULAR_PIVOT_RATIO = 1e-12;

export class SkylineMatrix {
  /** First stored column of each row. */
  readonly first: Int32Array;
  /** Index in `data` of each row's first stored entry; offset[n] is the total. */
  readonly offset: Int32Array;
  readonly data: Float64Array;

  constructor(
    readonly n: number,
    first: Int32Array,
  ) {
    this.first = first;
    this.offset = new Int32Array(n + 1);
    for (let i = 0; i < n; i++) this.offset[i + 1] = this.offset[i]! + (i - first[i]! + 1);
    this.data = new Float64Array(this.offset[n]!);
  }

  /** Same profile, zero entries. */
  static like(m: SkylineMatrix): SkylineMatrix {
    return new SkylineMatrix(m.n, m.first);
  }

  /** Adds v at (i, j) (and so at (j, i)); (i, j) must lie inside the profile. */
  add(i: number, j: number, v: number): void {
    if (j > i) {
      const t = i;
      i = j;
      j = t;
    }
    const k = this.offset[i]! + j - this.first[i]!;
    this.data[k] = this.data[k]! + v;
  }

  get(i: number, j: number): number {
    if (j > i) {
      const t = i;
      i = j;
      j = t;
    }
    return j < this.first[i]! ? 0 : this.data[this.offset[i]! + j - this.first[i]!]!;
  }

  diagonal(): Float64Array {
    const d = new Float64Array(this.n);
    for (let i = 0; i < this.n; i++) d[i] = this.data[this.offset[i + 1]! - 1]!;
    return d;
  }

  /** y = A x. */
  multiply(x: Float64Array, y: Float64Array): void {
    y.fill(0);
    const { n, first, offset, data } = this;
    for (let i = 0; i < n; i++) {
      const f = first[i]!;
      const o = offset[i]! - f;
      const xi = x[i]!;
      let s = 0;
      for (let j = f; j < i; j++) {
        const a = data[o + j]!;
        s += a * x[j]!;
        y[j] = y[j]! + a * xi;
      }
      y[i] = y[i]! + s + data[o + i]! * xi;
    }
  }

  /** In-place Cholesky A = L L^T (row by row, within the profile: L keeps A's skyline). Returns
   * false when A is not positive definite (a pivot at or below SINGULAR_PIVOT_RATIO of the
   * largest diagonal term). */
  factor(): boolean {
    const { n, first, offset, data } = this;
    let maxDiag = 0;
    for (let i = 0; i < n; i++) maxDiag = Math.max(maxDiag, Math.abs(data[offset[i + 1]! - 1]!));
    const floor = maxDiag * SINGULAR_PIVOT_RATIO;
    for (let i = 0; i < n; i++) {
      const fi = first[i]!;
      const oi = offset[i]! - fi;
      for (let j = fi; j < i; j++) {
        const fj = first[j]!;
        const oj = offset[j]! - fj;
        let s = data[oi + j]!;
        for (let k = Math.max(fi, fj); k < j; k++) s -= data[oi + k]! * data[oj + k]!;
        data[oi + j] = s / data[oj + j]!;
      }
      let d = data[oi + i]!;
      for (let k = fi; k < i; k++) d -= data[oi + k]! * data[oi + k]!;
      if (!(d > floor)) return false;
      data[oi + i] = Math.sqrt(d);
    }
    return true;
  }

  /** Solves L L^T x = b in place (b becomes x), with this matrix factored. */
  solve(b: Float64Array): void {
    const { n, first, offset, data } = this;
    for (let i = 0; i < n; i++) {
      const f = first[i]!;
      const o = offset[i]! - f;
      let s = b[i]!;
      for (let k = f; k < i; k++) s -= data[o + k]! * b[k]!;
      b[i] = s / data[o + i]!;
    }
    for (let i = n - 1; i >= 0; i--) {
      const f = first[i]!;
      const o = offset[i]! - f;
      const xi = b[i]! / data[o + i]!;
      b[i] = xi;
      for (let k = f; k < i; k++) b[k] = b[k]! - data[o + k]! * xi;
    }
  }
}

/** A skyline matrix's non-zero entries below the diagonal, row by row (compressed rows), and its
 * diagonal: a frame's profile holds many exact zeros (in-plane and sideways dofs do not couple
 * while the arm does not turn, and a mass matrix couples only along each member), and in the
 * untuned tier each term skipped is work saved. Products and solves visit the same entries in the
 * same order as the skyline's own, less the zero terms (a zero term adds nothing to a finite sum). */
export class CompressedRows {
  readonly n: number;
  /** Row i's entries are at rowStart[i] .. rowStart[i+1]-1. */
  readonly rowStart: Int32Array;
  readonly column: Int32Array;
  readonly value: Float64Array;
  readonly diagonal: Float64Array;

  constructor(m: SkylineMatrix) {
    const { n, first, offset, data } = m;
    let count = 0;
    for (let i = 0; i < n; i++)
      for (let k = offset[i]!; k < offset[i + 1]! - 1; k++) if (data[k] !== 0) count++;
    this.n = n;
    this.rowStart = new Int32Array(n + 1);
    this.column = new Int32Array(count);
    this.value = new Float64Array(count);
    this.diagonal = new Float64Array(n);
    let p = 0;
    for (let i = 0; i < n; i++) {
      const o = offset[i]! - first[i]!;
      for (let j = first[i]!; j < i; j++) {
        const v = data[o + j]!;
        if (v === 0) continue;
        this.column[p] = j;
        this.value[p] = v;
        p++;
      }
      this.rowStart[i + 1] = p;
      this.diagonal[i] = data[o + i]!;
    }
  }

  /** y = A x (SkylineMatrix.multiply without the zero terms). */
  multiply(x: Float64Array, y: Float64Array): void {
    y.fill(0);
    const { n, rowStart, column, value, diagonal } = this;
    for (let i = 0; i < n; i++) {
      const xi = x[i]!;
      let s = 0;
      for (let p = rowStart[i]!; p < rowStart[i + 1]!; p++) {
        const j = column[p]!;
        const a = value[p]!;
        s += a * x[j]!;
        y[j] = y[j]! + a * xi;
      }
      y[i] = y[i]! + s + diagonal[i]! * xi;
    }
  }

  /** Solves L L^T x = b in place for the factor L these rows hold (SkylineMatrix.solve without the
   * zero terms). */
  solve(b: Float64Array): void {
    const { n, rowStart, column, value, diagonal } = this;
    for (let i = 0; i < n; i++) {
      let s = b[i]!;
      for (let p = rowStart[i]!; p < rowStart[i + 1]!; p++) s -= value[p]! * b[column[p]!]!;
      b[i] = s / diagonal[i]!;
    }
    for (let i = n - 1; i >= 0; i--) {
      const xi = b[i]! / diagonal[i]!;
      b[i] = xi;
      for (let p = rowStart[i]!; p < rowStart[i + 1]!; p++) {
        const k = column[p]!;
        b[k] = b[k]! - value[p]! * xi;
      }
    }
  }
}
