// Small dense symmetric linear algebra on row-major Float64Arrays: Cholesky factorisation and
// solves, and the cyclic Jacobi eigenvalue method (Golub and Van Loan, Matrix Computations,
// 4th ed., 4.2 and 8.5). The arm frames have at most a few hundred unknowns.

/** A pivot below this share of the largest diagonal term means the matrix is singular for our
 * purpose (a mechanism in the frame): double precision keeps about 1e-16 relative, and the
 * stiff "rigid" members are 1e4 stiffer than real ones, so 1e-12 leaves room. */
export const SINGULAR_PIVOT_RATIO = 1e-12;

/** First column of each row's lower triangle holding a non-zero, for the factor of the last
 * choleskyFactor call (the row's profile: a frame numbered along the arm is nearly banded). */
let profileStart = new Int32Array(64);

/** In-place Cholesky A = L L^T of the n x n matrix (lower triangle used and overwritten).
 * Returns false when A is not positive definite.
 * Left of a row's first non-zero, L stays exactly +0 (every sum there starts at +0 and takes
 * away only signed zeros), so those terms are skipped: the same numbers, bit for bit, in a
 * fraction of the work. A matrix holding a -0 in its lower triangle (where that argument does
 * not hold) takes the full loops. */
export function choleskyFactor(a: Float64Array, n: number): boolean {
  let maxDiag = 0;
  for (let i = 0; i < n; i++) maxDiag = Math.max(maxDiag, Math.abs(a[i * n + i]!));
  const floor = maxDiag * SINGULAR_PIVOT_RATIO;
  if (profileStart.length < n) profileStart = new Int32Array(2 * n);
  const f = profileStart;
  let negativeZero = false;
  for (let i = 0; i < n; i++) {
    let k = 0;
    while (k < i && a[i * n + k] === 0) k++;
    f[i] = k;
    for (let m = 0; m <= i; m++) if (a[i * n + m] === 0 && 1 / a[i * n + m]! < 0) negativeZero = true;
  }
  if (negativeZero) for (let i = 0; i < n; i++) f[i] = 0;
  for (let j = 0; j < n; j++) {
    let d = a[j * n + j]!;
    for (let k = f[j]!; k < j; k++) d -= a[j * n + k]! * a[j * n + k]!;
    if (!(d > floor)) return false;
    const ljj = Math.sqrt(d);
    a[j * n + j] = ljj;
    for (let i = j + 1; i < n; i++) {
      // Row i is zero up to its profile: its L entries there stay +0.
      if (j < f[i]!) continue;
      let s = a[i * n + j]!;
      for (let k = Math.max(f[i]!, f[j]!); k < j; k++) s -= a[i * n + k]! * a[j * n + k]!;
      a[i * n + j] = s / ljj;
    }
  }
  return true;
}

/** Solves L L^T x = b in place (b becomes x), with the factor from choleskyFactor. */
export function choleskySolve(l: Float64Array, n: number, b: Float64Array): void {
  for (let i = 0; i < n; i++) {
    let s = b[i]!;
    for (let k = 0; k < i; k++) s -= l[i * n + k]! * b[k]!;
    b[i] = s / l[i * n + i]!;
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = b[i]!;
    for (let k = i + 1; k < n; k++) s -= l[k * n + i]! * b[k]!;
    b[i] = s / l[i * n + i]!;
  }
}

/** Off-diagonal mass below this share of the diagonal ends the Jacobi sweeps: eigenvalues are
 * then correct to about this relative accuracy squared. */
const JACOBI_OFF_DIAGONAL_RATIO = 1e-12;
/** Cyclic Jacobi converges quadratically; 60 sweeps is far beyond what any frame here needs. */
const JACOBI_MAX_SWEEPS = 60;

/** Eigenvalues (ascending) and eigenvectors (columns of `vectors`, row-major n x n) of the
 * symmetric matrix `a` (destroyed) by cyclic Jacobi rotations. */
export function symmetricEigen(a: Float64Array, n: number): { values: Float64Array; vectors: Float64Array } {
  const v = new Float64Array(n * n);
  for (let i = 0; i < n; i++) v[i * n + i] = 1;
  let diagNorm = 0;
  for (let i = 0; i < n; i++) diagNorm += a[i * n + i]! ** 2;
  for (let sweep = 0; sweep < JACOBI_MAX_SWEEPS; sweep++) {
    let off = 0;
    for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) off += a[i * n + j]! ** 2;
    if (off <= JACOBI_OFF_DIAGONAL_RATIO * JACOBI_OFF_DIAGONAL_RATIO * diagNorm || off === 0) break;
    for (let p = 0; p < n; p++) {
      for (let q = p + 1; q < n; q++) {
        const apq = a[p * n + q]!;
        if (apq === 0) continue;
        const app = a[p * n + p]!;
        const aqq = a[q * n + q]!;
        const theta = (aqq - app) / (2 * apq);
        const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1);
        const s = t * c;
        for (let k = 0; k < n; k++) {
          const akp = a[k * n + p]!;
          const akq = a[k * n + q]!;
          a[k * n + p] = c * akp - s * akq;
          a[k * n + q] = s * akp + c * akq;
        }
        for (let k = 0; k < n; k++) {
          const apk = a[p * n + k]!;
          const aqk = a[q * n + k]!;
          a[p * n + k] = c * apk - s * aqk;
          a[q * n + k] = s * apk + c * aqk;
        }
        for (let k = 0; k < n; k++) {
          const vkp = v[k * n + p]!;
          const vkq = v[k * n + q]!;
          v[k * n + p] = c * vkp - s * vkq;
          v[k * n + q] = s * vkp + c * vkq;
        }
      }
    }
  }
  const order = Array.from({ length: n }, (_, i) => i).sort((i, j) => a[i * n + i]! - a[j * n + j]!);
  const values = new Float64Array(n);
  const vectors = new Float64Array(n * n);
  order.forEach((src, dst) => {
    values[dst] = a[src * n + src]!;
    for (let k = 0; k < n; k++) vectors[k * n + dst] = v[k * n + src]!;
  });
  return { values, vectors };
}

/** Inverse iteration stops when the Rayleigh quotient changes by less than this share: the
 * quotient's error is the square of the vector's, so 1e-12 leaves eigenvalues exact to print. */
const INVERSE_ITERATION_TOLERANCE = 1e-12;
/** Well-separated lowest modes converge in tens of steps; past this the modes are too close
 * for inverse iteration and the full Jacobi method decides. */
const INVERSE_ITERATION_MAX_STEPS = 300;

/** Smallest eigenvalue of the symmetric positive definite matrix `a` (n x n, not modified) by
 * inverse iteration with the Rayleigh quotient (Golub and Van Loan, 4th ed., 8.2.2); falls
 * back to cyclic Jacobi when it does not settle. Undefined when `a` is not positive definite. */
export function lowestEigenvalue(a: Float64Array, n: number): number | undefined {
  const l = Float64Array.from(a);
  if (!choleskyFactor(l, n)) return undefined;
  const x = new Float64Array(n);
  // a start with a share of every mode: uneven weights avoid symmetry with the frame's modes
  for (let i = 0; i < n; i++) x[i] = 1 + 0.37 * Math.sin(1.3 * i + 0.2);
  let previous = Infinity;
  const y = new Float64Array(n);
  for (let step = 0; step < INVERSE_ITERATION_MAX_STEPS; step++) {
    let norm = 0;
    for (let i = 0; i < n; i++) norm += x[i]! * x[i]!;
    norm = Math.sqrt(norm);
    for (let i = 0; i < n; i++) y[i] = x[i]! / norm;
    x.set(y);
    choleskySolve(l, n, x); // x = A^-1 y
    // Rayleigh quotient of the new vector: (x^T A x) / (x^T x) = (x^T y) / (x^T x)
    let xy = 0;
    let xx = 0;
    for (let i = 0; i < n; i++) {
      xy += x[i]! * y[i]!;
      xx += x[i]! * x[i]!;
    }
    const rq = xy / xx;
    if (Math.abs(rq - previous) <= INVERSE_ITERATION_TOLERANCE * Math.abs(rq)) return rq;
    previous = rq;
  }
  const { values } = symmetricEigen(Float64Array.from(a), n);
  return values[0];
}
