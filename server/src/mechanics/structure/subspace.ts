// The lowest eigenpairs of K phi = lambda M phi (K positive definite, M symmetric positive
// semi-definite, both dense) by subspace iteration with a Rayleigh-Ritz step (Bathe, Finite Element
// Procedures, 2nd ed., 11.6). A block of vectors converges at the rate lambda_p / lambda_(q+1), so
// two nearly equal lowest modes (a round bar bends alike up and sideways) still settle quickly,
// where single-vector inverse iteration would crawl.
import { symmetricEigen } from "./dense";

/** Relative change of the wanted eigenvalues between steps that ends the iteration: Ritz values
 * converge from above at twice the rate of the vectors, so this leaves them exact to print. */
const SUBSPACE_TOLERANCE = 1e-10;
/** Vectors carried beyond the wanted ones: the convergence rate is lambda_p / lambda_(p+4), so a
 * pair or three of nearly equal low modes (bending up and sideways, a twist) do not stall it. */
const EXTRA_VECTORS = 3;
/** Past this many steps the current Ritz values (upper bounds) are returned. */
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

/** The generalized problem through its operations: `solve` turns b into K^-1 b in place,
 * `multiplyMass` writes M x into y; the diagonals pick the starting vectors. */
export interface EigenProblem {
  n: number;
  solve(b: Float64Array): void;
  multiplyMass(x: Float64Array, y: Float64Array): void;
  stiffnessDiagonal: Float64Array;
  massDiagonal: Float64Array;
  /** Starting vectors that resemble the low modes (e.g. rigid movements along each axis, whose
   * first step gives the static shapes under a steady acceleration: Rayleigh's shapes), used
   * before the mass-diagonal and unit ones. */
  start?: Float64Array[];
}

/** The `wanted` lowest modes; undefined when M carries no mass at all. */
export function lowestModes(problem: EigenProblem, wanted: number): Modes | undefined {
  const { n, massDiagonal, stiffnessDiagonal } = problem;
  const massive: number[] = [];
  for (let i = 0; i < n; i++) if (massDiagonal[i]! > 0) massive.push(i);
  if (massive.length === 0) return undefined;
  const q = Math.min(massive.length, wanted + EXTRA_VECTORS);
  const p = Math.min(wanted, q);
  // Starting vectors: the caller's, then (Bathe 11.6.3) the mass diagonal and unit vectors where
  // m_ii / k_ii is largest (the dofs most likely to move in the low modes).
  let X: Float64Array[] = (problem.start ?? []).slice(0, q - 1);
  // one vector with a share of every mode, so that no mode is missed by symmetry (Bathe 11.6.3
  // uses a random one; uneven deterministic weights serve and keep the results repeatable)
  X.push(Float64Array.from({ length: n }, (_, i) => 1 + 0.37 * Math.sin(1.3 * i + 0.2)));
  if (X.length < q) X.push(Float64Array.from(massDiagonal) as Float64Array);
  const ranked = massive
    .map((i) => ({ i, r: massDiagonal[i]! / Math.max(stiffnessDiagonal[i]!, Number.MIN_VALUE) }))
    .sort((a, b) => b.r - a.r);
  for (let c = 0; X.length < q && c < ranked.length; c++) {
    const v = new Float64Array(n);
    v[ranked[c]!.i] = 1;
    X.push(v);
  }
  let previous: number[] = [];
  let result: Modes | undefined;
  // M X for the current X: computed once, then carried (M Xbar Q is M of the next X)
  let Y: Float64Array[] = X.map((x) => {
    const y = new Float64Array(n);
    problem.multiplyMass(x, y);
    return y;
  });
  for (let step = 0; step < SUBSPACE_MAX_STEPS; step++) {
    const m = Y.length;
    const Xbar = Y.map((y) => {
      const z = Float64Array.from(y);
      problem.solve(z); // K Xbar = M X
      return z;
    });
    const MXbar = Xbar.map((x) => {
      const y = new Float64Array(n);
      problem.multiplyMass(x, y);
      return y;
    });
    const Kr = new Float64Array(m * m);
    const Mr = new Float64Array(m * m);
    for (let a = 0; a < m; a++)
      for (let b = a; b < m; b++) {
        Kr[a * m + b] = Kr[b * m + a] = dot(Xbar[a]!, Y[b]!, n);
        Mr[a * m + b] = Mr[b * m + a] = dot(Xbar[a]!, MXbar[b]!, n);
      }
    const ritz = reducedProblem(Kr, Mr, m);
    if (!ritz) return result;
    X = ritz.vectors.map((coef) => combine(Xbar, coef, n));
    Y = ritz.vectors.map((coef) => combine(MXbar, coef, n));
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

/** sum_a coef[a] vectors[a] */
function combine(vectors: Float64Array[], coef: number[], n: number): Float64Array {
  const v = new Float64Array(n);
  for (let a = 0; a < vectors.length; a++) {
    const c = coef[a]!;
    const x = vectors[a]!;
    if (c !== 0) for (let i = 0; i < n; i++) v[i] = v[i]! + c * x[i]!;
  }
  return v;
}

function dot(a: Float64Array, b: Float64Array, n: number): number {
  let s = 0;
  for (let i = 0; i < n; i++) s += a[i]! * b[i]!;
  return s;
}
