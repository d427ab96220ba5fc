// The lowest eigenpairs of K phi = lambda M phi (K positive definite, M symmetric positive
// semi-definite, both dense) by subspace iteration with a Rayleigh-Ritz step (Bathe, Finite Element
// Procedures, 2nd ed., 11.6). A block of vectors converges at the rate lambda_p / lambda_(q+1), so
// two nearly equal lowest modes (a round bar bends alike up and sideways) still settle quickly,
// where single-vector inverse iteration would crawl.
import { choleskySolve, symmetricEigen } from "./dense";

/** Relative change of the wanted eigenvalues between steps that ends the iteration: Ritz values
 * converge from above at twice the rate of the vectors, so this leaves them exact to print. */
const SUBSPACE_TOLERANCE = 1e-10;
/** With a block of p + 7 vectors the ratio lambda_p / lambda_(p+8) is small for any frame here;
 * past this many steps the current Ritz values (upper bounds) are returned. */
const SUBSPACE_MAX_STEPS = 200;
/** A Ritz vector whose M-norm is below this share of the largest is dropped (massless
 * directions cannot carry a mode). */
const RANK_RATIO = 1e-12;

export interface Modes {
  /** lambda = omega^2, ascending. */
  values: number[];
  /** Mode shapes, each of length n, M-normalised. */
  vectors: Float64Array[];
}

/** `factor` is K's Cholesky factor (from choleskyFactor), `mass` the dense n x n M, `kDiagonal`
 * K's diagonal (to pick starting vectors). Undefined when M carries no mass at all. */
export function lowestModes(
  factor: Float64Array,
  kDiagonal: Float64Array,
  mass: Float64Array,
  n: number,
  wanted: number,
): Modes | undefined {
  const massive: number[] = [];
  for (let i = 0; i < n; i++) if (mass[i * n + i]! > 0) massive.push(i);
  if (massive.length === 0) return undefined;
  const q = Math.min(massive.length, Math.max(2 * wanted, wanted + 7));
  const p = Math.min(wanted, q);
  // Starting vectors (Bathe 11.6.3): the mass diagonal, then unit vectors where m_ii / k_ii is
  // largest (the dofs most likely to move in the low modes).
  let X: Float64Array[] = [];
  X.push(Float64Array.from({ length: n }, (_, i) => mass[i * n + i]!));
  const ranked = massive
    .map((i) => ({ i, r: mass[i * n + i]! / Math.max(kDiagonal[i]!, Number.MIN_VALUE) }))
    .sort((a, b) => b.r - a.r);
  for (let c = 0; X.length < q && c < ranked.length; c++) {
    const v = new Float64Array(n);
    v[ranked[c]!.i] = 1;
    X.push(v);
  }
  let previous: number[] = [];
  let result: Modes | undefined;
  const MX = (x: Float64Array) => multiply(mass, x, n);
  for (let step = 0; step < SUBSPACE_MAX_STEPS; step++) {
    const Y = X.map(MX); // M X
    const Xbar = Y.map((y) => {
      const z = Float64Array.from(y);
      choleskySolve(factor, n, z); // K Xbar = M X
      return z;
    });
    const m = Xbar.length;
    const Kr = new Float64Array(m * m);
    const Mr = new Float64Array(m * m);
    const MXbar = Xbar.map(MX);
    for (let a = 0; a < m; a++)
      for (let b = a; b < m; b++) {
        Kr[a * m + b] = Kr[b * m + a] = dot(Xbar[a]!, Y[b]!, n);
        Mr[a * m + b] = Mr[b * m + a] = dot(Xbar[a]!, MXbar[b]!, n);
      }
    const ritz = reducedProblem(Kr, Mr, m);
    if (!ritz) return result;
    X = ritz.vectors.map((coef) => {
      const v = new Float64Array(n);
      for (let a = 0; a < m; a++) {
        const c = coef[a]!;
        if (c !== 0) for (let i = 0; i < n; i++) v[i] = v[i]! + c * Xbar[a]![i]!;
      }
      return v;
    });
    const values = ritz.values;
    result = { values: values.slice(0, p), vectors: X.slice(0, p) };
    const settled =
      previous.length >= p &&
      values.slice(0, p).every((v, i) => Math.abs(v - previous[i]!) <= SUBSPACE_TOLERANCE * Math.abs(v));
    if (settled) return result;
    previous = values;
  }
  return result;
}

/** Kr z = lambda Mr z for the small projected matrices, solved as Mr z = mu Kr z with mu =
 * 1 / lambda: the lowest modes are then the largest mu, which Jacobi finds to full relative
 * accuracy (the smallest of a wide spread would carry the largest's rounding). Both are first
 * scaled to a unit diagonal of Kr; Kr = V D V^T gives the basis S = V D^-1/2 over its range, and
 * S^T Mr S the mu. Eigenvectors as coefficient lists (M-normalised), values ascending. */
function reducedProblem(
  Kr: Float64Array,
  Mr: Float64Array,
  m: number,
): { values: number[]; vectors: number[][] } | undefined {
  const scaleOf = new Float64Array(m);
  for (let a = 0; a < m; a++) scaleOf[a] = Kr[a * m + a]! > 0 ? 1 / Math.sqrt(Kr[a * m + a]!) : 0;
  const Ks = new Float64Array(m * m);
  const Ms = new Float64Array(m * m);
  for (let a = 0; a < m; a++)
    for (let b = 0; b < m; b++) {
      Ks[a * m + b] = Kr[a * m + b]! * scaleOf[a]! * scaleOf[b]!;
      Ms[a * m + b] = Mr[a * m + b]! * scaleOf[a]! * scaleOf[b]!;
    }
  const ke = symmetricEigen(Ks, m);
  let largest = 0;
  for (let i = 0; i < m; i++) largest = Math.max(largest, ke.values[i]!);
  if (!(largest > 0)) return undefined;
  const keep: number[] = [];
  for (let i = 0; i < m; i++) if (ke.values[i]! > RANK_RATIO * largest) keep.push(i);
  const r = keep.length;
  const S = new Float64Array(m * r);
  keep.forEach((col, c) => {
    const w = 1 / Math.sqrt(ke.values[col]!);
    for (let a = 0; a < m; a++) S[a * r + c] = ke.vectors[a * m + col]! * w;
  });
  const A = new Float64Array(r * r);
  for (let c = 0; c < r; c++)
    for (let d = c; d < r; d++) {
      let s = 0;
      for (let a = 0; a < m; a++) {
        let t = 0;
        for (let b = 0; b < m; b++) t += Ms[a * m + b]! * S[b * r + d]!;
        s += S[a * r + c]! * t;
      }
      A[c * r + d] = A[d * r + c] = s;
    }
  const ae = symmetricEigen(A, r);
  let muMax = 0;
  for (let k = 0; k < r; k++) muMax = Math.max(muMax, ae.values[k]!);
  if (!(muMax > 0)) return undefined;
  const values: number[] = [];
  const vectors: number[][] = [];
  for (let k = r - 1; k >= 0; k--) {
    const mu = ae.values[k]!;
    if (!(mu > RANK_RATIO * muMax)) break;
    values.push(1 / mu);
    const norm = 1 / Math.sqrt(mu);
    const coef: number[] = [];
    for (let a = 0; a < m; a++) {
      let s = 0;
      for (let c = 0; c < r; c++) s += S[a * r + c]! * ae.vectors[c * r + k]!;
      coef.push(s * scaleOf[a]! * norm);
    }
    vectors.push(coef);
  }
  return { values, vectors };
}

function multiply(a: Float64Array, x: Float64Array, n: number): Float64Array {
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let s = 0;
    const row = i * n;
    for (let j = 0; j < n; j++) {
      const v = a[row + j]!;
      if (v !== 0) s += v * x[j]!;
    }
    y[i] = s;
  }
  return y;
}

function dot(a: Float64Array, b: Float64Array, n: number): number {
  let s = 0;
  for (let i = 0; i < n; i++) s += a[i]! * b[i]!;
  return s;
}
