// Sparse LU factorisation with partial pivoting, P A = L U, for the pose solver's constraint
// Jacobians: each row touches at most two bodies, so 97 % of a long chain's matrix is zero, and a
// dense factor and dense triangular solves spend nearly all their time on zeros. Left-looking
// (Gilbert and Peierls 1988): column k of L and U comes from a sparse triangular solve with the
// columns already factored, whose non-zero pattern is found first by a depth-first search, so the
// work is proportional to the arithmetic done on non-zeros (Davis, Direct Methods for Sparse
// Linear Systems, SIAM 2006, sections 3.2 and 6.3). The columns keep their order: bodies are
// numbered along the walk from the base, so the fill stays near the chain's own structure.
// It does the dense algorithm's arithmetic (Golub and Van Loan, Matrix Computations, 4th ed.,
// algorithm 3.4.1) on the non-zeros only, in the same order and with the same pivots (the largest
// entry, the first row in the dense algorithm's row order on a tie), so the numbers are the dense
// factor's to the last bit: updates are applied in pivot order, and the solves run over rows and
// columns in ascending order as the dense loops do.

/** A pivot smaller than this fraction of the largest entry marks the matrix as singular: the
 * Jacobian mixes metres and radians, so entries span about 1e-3..1e3; 1e-10 sits far below any
 * well-posed linkage yet well above round-off (1e-16 x entries). */
export const SINGULAR_PIVOT_RATIO = 1e-10;

/** A square matrix in compressed columns: the rows of column j are rowIndex[colStart[j] ..
 * colStart[j + 1] - 1], with their values at the same places. */
export interface SparseColumns {
  n: number;
  colStart: Int32Array;
  rowIndex: Int32Array;
  values: Float64Array;
}

export class SparseLu {
  readonly n: number;
  /** L by columns, unit diagonal first in each column, then the rows below it in ascending
   * (pivot) order. */
  private lStart: Int32Array;
  private lRow: Int32Array;
  private lVal: Float64Array;
  /** U by columns, rows in ascending order, the diagonal last. */
  private uStart: Int32Array;
  private uRow: Int32Array;
  private uVal: Float64Array;
  /** U by rows, columns in ascending order, the diagonal first (the backward solve's order). */
  private urStart: Int32Array;
  private urCol: Int32Array;
  private urVal: Float64Array;
  /** Row i of A is row pinv[i] of P A. */
  private readonly pinv: Int32Array;
  /** The dense algorithm's row order while factoring: the row at each position, the position of
   * each row (ties between pivots go to the first, as there). */
  private readonly rowAt: Int32Array;
  private readonly positionOf: Int32Array;
  /** Row chosen as pivot of each column so far. */
  private readonly pivotRowOf: Int32Array;
  private readonly x: Float64Array;
  private readonly work: Float64Array;
  /** The depth-first search's output (reach, from `top` to n - 1) and its stack. */
  private readonly reach: Int32Array;
  private readonly stack: Int32Array;
  private readonly edge: Int32Array;
  private readonly mark: Int32Array;
  private readonly order: Int32Array;
  private stamp = 0;
  /** How many columns of L the last solveColumn applied (their indices sorted in `order`). */
  private pivotalCount = 0;
  /** Each column's pattern from the last factorization (its reach, then its pivotal columns in
   * order, at patternStart[k]..; the reach's length in reachLength[k]) and the pivot row it took.
   * A column's pattern depends only on A's structure and the pivots of the columns before it, so
   * while a factorization of the same structure takes the same pivots (the sweep's next pose,
   * nearly always) each column's pattern is copied instead of searched for again. */
  private patternStart: Int32Array;
  private patternStore: Int32Array;
  private readonly reachLength: Int32Array;
  private readonly patternPivotRow: Int32Array;
  /** Leading columns whose stored pattern fits the matrix structure below. */
  private patternColumns = 0;
  private patternColStart?: Int32Array;
  private patternRowIndex?: Int32Array;
  /** Smallest |pivot| over the largest |entry| of the last factorization (0 when singular). */
  pivotRatio = 0;
  /** Sign of the determinant of the last factored matrix (+1 or -1; 0 when singular): a change
   * between two poses means a singular configuration lies between them. */
  determinantSign = 0;

  constructor(n: number, expectedNonZeros = 8 * n) {
    this.n = n;
    const cap = Math.max(expectedNonZeros, n, 1);
    this.lStart = new Int32Array(n + 1);
    this.lRow = new Int32Array(cap);
    this.lVal = new Float64Array(cap);
    this.uStart = new Int32Array(n + 1);
    this.uRow = new Int32Array(cap);
    this.uVal = new Float64Array(cap);
    this.urStart = new Int32Array(n + 1);
    this.urCol = new Int32Array(cap);
    this.urVal = new Float64Array(cap);
    this.pinv = new Int32Array(n);
    this.rowAt = new Int32Array(n);
    this.positionOf = new Int32Array(n);
    this.pivotRowOf = new Int32Array(n);
    this.x = new Float64Array(n);
    this.work = new Float64Array(n);
    this.reach = new Int32Array(n);
    this.stack = new Int32Array(n);
    this.edge = new Int32Array(n);
    this.mark = new Int32Array(n);
    this.order = new Int32Array(n);
    this.patternStart = new Int32Array(n + 1);
    this.patternStore = new Int32Array(2 * cap);
    this.reachLength = new Int32Array(n);
    this.patternPivotRow = new Int32Array(n);
  }

  /** Drops the stored column patterns: the next factor searches every column afresh (the
   * benchmark times a factorisation from scratch against one that reuses them). */
  forgetPatterns(): void {
    this.patternColumns = 0;
  }

  /** Non-zeros held in L and U (the bench compares them with n^2). */
  get nonZeros(): number {
    return this.lStart[this.n]! + this.uStart[this.n]!;
  }

  /** Factors `a` (left untouched). False when the matrix is singular. */
  factor(a: SparseColumns): boolean {
    const n = this.n;
    const { colStart, values } = a;
    const pinv = this.pinv;
    const x = this.x;
    pinv.fill(-1);
    let scale = 0;
    for (let p = 0; p < colStart[n]!; p++) {
      const v = Math.abs(values[p]!);
      if (!(v <= scale)) {
        if (!Number.isFinite(v)) return this.singular();
        scale = v;
      }
    }
    if (n === 0) {
      this.pivotRatio = 1;
      this.determinantSign = 1;
      return true;
    }
    if (scale === 0) return this.singular();
    for (let i = 0; i < n; i++) this.rowAt[i] = this.positionOf[i] = i;
    // Stored patterns serve while the structure is the same and the pivots repeat.
    let storedColumns =
      a.colStart === this.patternColStart && a.rowIndex === this.patternRowIndex ? this.patternColumns : 0;
    this.patternColumns = 0;
    this.patternColStart = a.colStart;
    this.patternRowIndex = a.rowIndex;
    let lnz = 0;
    let unz = 0;
    let minPivot = Infinity;
    let sign = 1;
    for (let k = 0; k < n; k++) {
      this.lStart[k] = lnz;
      this.uStart[k] = unz;
      // Room for a full column of each before this one is written.
      if (lnz + n > this.lRow.length) this.growL(2 * this.lRow.length + n);
      if (unz + n > this.uRow.length) this.growU(2 * this.uRow.length + n);
      const top = k < storedColumns ? this.storedPattern(k) : this.searchPattern(a, k);
      this.applyColumnsOfL(a, k, top);
      const reach = this.reach;
      let pivotRow = -1;
      let best = 0;
      for (let p = top; p < n; p++) {
        const i = reach[p]!;
        if (pinv[i]! >= 0) continue;
        const v = Math.abs(x[i]!);
        if (v > best || (v === best && v > 0 && this.positionOf[i]! < this.positionOf[pivotRow]!)) {
          best = v;
          pivotRow = i;
        }
      }
      if (pivotRow < 0) {
        for (let p = top; p < n; p++) x[reach[p]!] = 0;
        return this.singular();
      }
      // U's column k: the rows already pivoted, in pivot order (solveColumn sorted them).
      for (let m = 0; m < this.pivotalCount; m++) {
        const col = this.order[m]!;
        this.uRow[unz] = col;
        this.uVal[unz++] = x[this.pivotRowOf[col]!]!;
      }
      const pivot = x[pivotRow]!;
      if (pivot < 0) sign = -sign;
      if (best < minPivot) minPivot = best;
      this.uRow[unz] = k;
      this.uVal[unz++] = pivot;
      pinv[pivotRow] = k;
      this.pivotRowOf[k] = pivotRow;
      if (k < storedColumns && pivotRow !== this.patternPivotRow[k]) storedColumns = k + 1;
      this.patternPivotRow[k] = pivotRow;
      const displaced = this.rowAt[k]!;
      const from = this.positionOf[pivotRow]!;
      if (displaced !== pivotRow) {
        sign = -sign;
        this.rowAt[from] = displaced;
        this.positionOf[displaced] = from;
        this.rowAt[k] = pivotRow;
        this.positionOf[pivotRow] = k;
      }
      this.lRow[lnz] = pivotRow;
      this.lVal[lnz++] = 1;
      for (let p = top; p < n; p++) {
        const i = reach[p]!;
        if (pinv[i]! < 0) {
          this.lRow[lnz] = i;
          this.lVal[lnz++] = x[i]! / pivot;
        }
        x[i] = 0;
      }
    }
    this.lStart[n] = lnz;
    this.uStart[n] = unz;
    this.patternColumns = n;
    for (let p = 0; p < lnz; p++) this.lRow[p] = pinv[this.lRow[p]!]!;
    this.sortColumnsOfL();
    this.buildRowsOfU();
    this.pivotRatio = minPivot / scale;
    this.determinantSign = sign;
    return this.pivotRatio > SINGULAR_PIVOT_RATIO;
  }

  private singular(): boolean {
    this.pivotRatio = 0;
    this.determinantSign = 0;
    return false;
  }

  /** Column k's pattern found afresh: the rows x = L \ A(:, k) can reach, at reach[top .. n - 1],
   * and the columns of L to apply, in pivot order (in `order`); stored for the next
   * factorization. Returns top. */
  private searchPattern(a: SparseColumns, k: number): number {
    const top = this.reachOf(a, k);
    const n = this.n;
    const reach = this.reach;
    const order = this.order;
    let count = 0;
    for (let p = top; p < n; p++) {
      const col = this.pinv[reach[p]!]!;
      if (col < 0) continue;
      // Insertion into ascending order: a column has a few pivotal entries.
      let q = count++;
      while (q > 0 && order[q - 1]! > col) {
        order[q] = order[q - 1]!;
        q--;
      }
      order[q] = col;
    }
    this.pivotalCount = count;
    const length = n - top;
    const at = this.patternStart[k]!;
    if (at + length + count > this.patternStore.length)
      this.patternStore = grownInt(this.patternStore, 2 * (at + length + count));
    this.patternStore.set(reach.subarray(top, n), at);
    this.patternStore.set(order.subarray(0, count), at + length);
    this.reachLength[k] = length;
    this.patternStart[k + 1] = at + length + count;
    return top;
  }

  /** Column k's pattern as the last factorization stored it (see patternStart). Returns top. */
  private storedPattern(k: number): number {
    const n = this.n;
    const at = this.patternStart[k]!;
    const length = this.reachLength[k]!;
    const count = this.patternStart[k + 1]! - at - length;
    const top = n - length;
    const store = this.patternStore;
    for (let m = 0; m < length; m++) this.reach[top + m] = store[at + m]!;
    for (let m = 0; m < count; m++) this.order[m] = store[at + length + m]!;
    this.pivotalCount = count;
    return top;
  }

  /** x = L \ A(:, k) on column k's pattern. The columns of L are applied in pivot order, as the
   * dense algorithm's updates come, so each entry sees the same subtractions in the same order. */
  private applyColumnsOfL(a: SparseColumns, k: number, top: number): void {
    const x = this.x;
    const reach = this.reach;
    const n = this.n;
    for (let p = top; p < n; p++) x[reach[p]!] = 0;
    for (let p = a.colStart[k]!; p < a.colStart[k + 1]!; p++) x[a.rowIndex[p]!] = a.values[p]!;
    const order = this.order;
    for (let m = 0; m < this.pivotalCount; m++) {
      const col = order[m]!;
      // L's diagonal is 1: no division.
      const xj = x[this.pivotRowOf[col]!]!;
      if (xj === 0) continue;
      for (let p = this.lStart[col]! + 1; p < this.lStart[col + 1]!; p++)
        x[this.lRow[p]!]! -= this.lVal[p]! * xj;
    }
  }

  /** The rows a sparse solve with the columns of L factored so far can reach from column k of A,
   * at reach[top .. n - 1] (a depth-first search without recursion). */
  private reachOf(a: SparseColumns, k: number): number {
    const n = this.n;
    const mark = this.mark;
    const stamp = ++this.stamp;
    const reach = this.reach;
    const stack = this.stack;
    const edge = this.edge;
    let top = n;
    for (let p0 = a.colStart[k]!; p0 < a.colStart[k + 1]!; p0++) {
      const start = a.rowIndex[p0]!;
      if (mark[start] === stamp) continue;
      let head = 0;
      stack[0] = start;
      while (head >= 0) {
        const j = stack[head]!;
        const col = this.pinv[j]!;
        if (mark[j] !== stamp) {
          mark[j] = stamp;
          edge[head] = col < 0 ? 0 : this.lStart[col]! + 1;
        }
        let done = true;
        const end = col < 0 ? 0 : this.lStart[col + 1]!;
        for (let p = edge[head]!; p < end; p++) {
          const i = this.lRow[p]!;
          if (mark[i] === stamp) continue;
          edge[head] = p + 1;
          stack[++head] = i;
          done = false;
          break;
        }
        if (done) {
          head--;
          reach[--top] = j;
        }
      }
    }
    return top;
  }

  /** Sorts the rows below the unit diagonal of each column of L into ascending (pivot) order,
   * as the transposed solve's dense loop takes them. Columns are short (a few entries), so an
   * insertion sort. */
  private sortColumnsOfL(): void {
    const { lStart, lRow, lVal } = this;
    for (let j = 0; j < this.n; j++) {
      const end = lStart[j + 1]!;
      for (let p = lStart[j]! + 2; p < end; p++) {
        const row = lRow[p]!;
        const value = lVal[p]!;
        let q = p - 1;
        while (q > lStart[j]! && lRow[q]! > row) {
          lRow[q + 1] = lRow[q]!;
          lVal[q + 1] = lVal[q]!;
          q--;
        }
        lRow[q + 1] = row;
        lVal[q + 1] = value;
      }
    }
  }

  private buildRowsOfU(): void {
    const nnz = this.uStart[this.n]!;
    if (this.urCol.length < nnz) {
      this.urCol = new Int32Array(2 * nnz);
      this.urVal = new Float64Array(2 * nnz);
    }
    transpose(this.n, this.uStart, this.uRow, this.uVal, this.urStart, this.urCol, this.urVal);
  }

  private growL(size: number): void {
    this.lRow = grownInt(this.lRow, size);
    this.lVal = grownFloat(this.lVal, size);
  }

  private growU(size: number): void {
    this.uRow = grownInt(this.uRow, size);
    this.uVal = grownFloat(this.uVal, size);
  }

  /** Makes this the factorization `other` holds (same size): a stored pose's factors reused
   * instead of factoring the same matrix again. */
  copyFrom(other: SparseLu): void {
    const n = this.n;
    const lnz = other.lStart[n]!;
    const unz = other.uStart[n]!;
    if (this.lRow.length < lnz) this.growL(lnz);
    if (this.uRow.length < unz) this.growU(unz);
    if (this.urCol.length < unz) {
      this.urCol = new Int32Array(unz);
      this.urVal = new Float64Array(unz);
    }
    this.lStart.set(other.lStart);
    this.uStart.set(other.uStart);
    this.urStart.set(other.urStart);
    this.lRow.set(other.lRow.subarray(0, lnz));
    this.lVal.set(other.lVal.subarray(0, lnz));
    this.uRow.set(other.uRow.subarray(0, unz));
    this.uVal.set(other.uVal.subarray(0, unz));
    this.urCol.set(other.urCol.subarray(0, unz));
    this.urVal.set(other.urVal.subarray(0, unz));
    this.pinv.set(other.pinv);
    this.pivotRatio = other.pivotRatio;
    this.determinantSign = other.determinantSign;
  }

  /** A copy to solve with later (a saved pose's factors). */
  clone(): SparseLu {
    const n = this.n;
    const copy = new SparseLu(n, Math.max(this.lStart[n]!, this.uStart[n]!));
    copy.copyFrom(this);
    return copy;
  }

  /** Solves A x = b (x may be b): L U x = P b. */
  solve(b: Float64Array, x: Float64Array): void {
    const n = this.n;
    const w = this.work;
    const { lStart, lRow, lVal, urStart, urCol, urVal } = this;
    for (let i = 0; i < n; i++) w[this.pinv[i]!] = b[i]!;
    for (let j = 0; j < n; j++) {
      const wj = w[j]!;
      if (wj === 0) continue;
      for (let p = lStart[j]! + 1; p < lStart[j + 1]!; p++) w[lRow[p]!]! -= lVal[p]! * wj;
    }
    for (let i = n - 1; i >= 0; i--) {
      const diagonal = urStart[i]!;
      let s = w[i]!;
      for (let p = diagonal + 1; p < urStart[i + 1]!; p++) s -= urVal[p]! * w[urCol[p]!]!;
      w[i] = s / urVal[diagonal]!;
    }
    for (let i = 0; i < n; i++) x[i] = w[i]!;
  }

  /** Solves A^T x = b (x may be b): A^T = U^T L^T P, so U^T z = b, L^T y = z, x = P^T y. */
  solveTransposed(b: Float64Array, x: Float64Array): void {
    const n = this.n;
    const w = this.work;
    const { lStart, lRow, lVal, uStart, uRow, uVal } = this;
    for (let j = 0; j < n; j++) {
      const last = uStart[j + 1]! - 1;
      let s = b[j]!;
      for (let p = uStart[j]!; p < last; p++) s -= uVal[p]! * w[uRow[p]!]!;
      w[j] = s / uVal[last]!;
    }
    for (let j = n - 1; j >= 0; j--) {
      let s = w[j]!;
      for (let p = lStart[j]! + 1; p < lStart[j + 1]!; p++) s -= lVal[p]! * w[lRow[p]!]!;
      w[j] = s;
    }
    for (let i = 0; i < n; i++) x[i] = w[this.pinv[i]!]!;
  }
}

/** The transpose of an n x n matrix in compressed columns, as compressed columns of the
 * transpose (compressed rows of the matrix), each in ascending order: a counting sort. */
function transpose(
  n: number,
  start: Int32Array,
  idx: Int32Array,
  val: Float64Array,
  tStart: Int32Array,
  tIdx: Int32Array,
  tVal: Float64Array,
): void {
  const nnz = start[n]!;
  tStart.fill(0);
  for (let p = 0; p < nnz; p++) tStart[idx[p]! + 1]!++;
  for (let i = 0; i < n; i++) tStart[i + 1]! += tStart[i]!;
  // tStart[i] is now where row i starts; fill, advancing a cursor per row.
  for (let j = 0; j < n; j++) {
    for (let p = start[j]!; p < start[j + 1]!; p++) {
      const i = idx[p]!;
      const q = tStart[i]!++;
      tIdx[q] = j;
      tVal[q] = val[p]!;
    }
  }
  // Shift the cursors back into starts.
  for (let i = n; i > 0; i--) tStart[i] = tStart[i - 1]!;
  tStart[0] = 0;
}

function grownInt(a: Int32Array, size: number): Int32Array {
  const b = new Int32Array(size);
  b.set(a);
  return b;
}

function grownFloat(a: Float64Array, size: number): Float64Array {
  const b = new Float64Array(size);
  b.set(a);
  return b;
}
