// The cyclic Jacobi eigenvalue method for small dense symmetric matrices, row-major
// Float64Arrays (Golub and Van Loan, Matrix Computations, 4th ed., 8.5): the projected problems
// of the frame's mode search, a few unknowns each.

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
