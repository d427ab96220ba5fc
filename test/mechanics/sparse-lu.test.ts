// The sparse LU of the pose solver against mathjs's LU solve (an independent general-purpose
// library) and against the dense factor it replaces: the same solutions, the same determinant
// sign (against mathjs's determinant), and the dense factor's numbers to the last bit.
import { describe, expect, it } from "vitest";
import * as math from "mathjs";
import { SparseLu, type SparseColumns } from "../../server/src/mechanics/sparse-lu";
import { DenseLu } from "../../server/src/mechanics/dense-lu";
import { analyse } from "../../server/src/analysis";
import { buildLinkage } from "../../server/src/mechanics/linkage";
import { constraintJacobianInto, sparseJacobian, updateAngles } from "../../server/src/mechanics/constraints";
import { chainSpec } from "../fuzz/big-spec";

/** A pseudo-random sparse n x n matrix (row-major dense copy too), with exact ties (entries of
 * +-1, as a constraint Jacobian has) so that the pivot order's tie rule is exercised. */
function randomSparse(n: number, seed: number): { dense: Float64Array; sparse: SparseColumns } {
  let s = seed;
  const rnd = () => (s = (s * 1103515245 + 12345) >>> 0) / 4294967296;
  const dense = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    dense[i * n + i] = rnd() < 0.3 ? (rnd() < 0.5 ? 1 : -1) : rnd() - 0.5;
    for (let m = 0; m < 3; m++) {
      const j = Math.floor(rnd() * n);
      dense[i * n + j] = rnd() < 0.5 ? (rnd() < 0.5 ? 1 : -1) : 4 * (rnd() - 0.5);
    }
  }
  return { dense, sparse: toColumns(dense, n) };
}

function toColumns(dense: Float64Array, n: number): SparseColumns {
  const colStart = new Int32Array(n + 1);
  const rows: number[] = [];
  const values: number[] = [];
  for (let j = 0; j < n; j++) {
    for (let i = 0; i < n; i++) {
      const v = dense[i * n + j]!;
      if (v !== 0) {
        rows.push(i);
        values.push(v);
      }
    }
    colStart[j + 1] = rows.length;
  }
  return { n, colStart, rowIndex: Int32Array.from(rows), values: Float64Array.from(values) };
}

function asRows(dense: Float64Array, n: number): number[][] {
  return Array.from({ length: n }, (_, i) => Array.from(dense.subarray(i * n, (i + 1) * n)));
}

/** The sparse factor solves A x = b and A^T x = b to the dense factor's last bit. */
function expectSolvesOf(sparse: SparseLu, dense: DenseLu, n: number): void {
  const b = Float64Array.from({ length: n }, (_, i) => Math.cos(3 * i));
  const xs = new Float64Array(n);
  const xd = new Float64Array(n);
  sparse.solve(b, xs);
  dense.solve(b, xd);
  expect(Array.from(xs)).toEqual(Array.from(xd));
  sparse.solveTransposed(b, xs);
  dense.solveTransposed(b, xd);
  expect(Array.from(xs)).toEqual(Array.from(xd));
}

/** Sizes and seeds of the matrices checked against the dense factor to the last bit. */
const AGAINST_DENSE = [
  [12, 7],
  [40, 3],
  [90, 11],
] as const;

describe("sparse LU", () => {
  for (const [n, seed] of [
    [5, 1],
    [12, 7],
    [40, 3],
    [90, 11],
  ] as const) {
    it(`solves A x = b and A^T x = b as mathjs does (n = ${n})`, () => {
      const { dense, sparse } = randomSparse(n, seed);
      const lu = new SparseLu(n);
      const det = math.det(asRows(dense, n)) as number;
      // These seeds give regular matrices (a singular one would make the test say nothing).
      expect(Math.abs(det)).toBeGreaterThan(1e-6);
      expect(lu.factor(sparse)).toBe(true);
      const b = Float64Array.from({ length: n }, (_, i) => Math.sin(i + 1));
      const x = new Float64Array(n);
      lu.solve(b, x);
      // mathjs lusolve: LU decomposition with partial pivoting (Golub and Van Loan 3.4).
      const expected = (math.lusolve(asRows(dense, n), Array.from(b)) as number[][]).map((r) => r[0]!);
      for (let i = 0; i < n; i++) expect(x[i]).toBeCloseTo(expected[i]!, 8);
      lu.solveTransposed(b, x);
      const transposed = math.transpose(asRows(dense, n));
      const expectedT = (math.lusolve(transposed, Array.from(b)) as number[][]).map((r) => r[0]!);
      for (let i = 0; i < n; i++) expect(x[i]).toBeCloseTo(expectedT[i]!, 8);
      // The sign of det(A) from mathjs.
      expect(lu.determinantSign).toBe(Math.sign(det));
    });
  }

  it("gives the dense factor's numbers to the last bit, ties and all", () => {
    for (const [n, seed] of AGAINST_DENSE) {
      const { dense, sparse } = randomSparse(n, seed);
      const a = new SparseLu(n);
      const d = new DenseLu(n);
      expect(a.factor(sparse)).toBe(d.factor(dense));
      expect(a.determinantSign).toBe(d.determinantSign);
      expect(a.pivotRatio).toBe(d.pivotRatio);
      expectSolvesOf(a, d, n);
    }
  });

  it("keeps the dense factor's numbers when one factor serves matrices of the same structure in turn", () => {
    // The pose solver factors the same structure pose after pose, and the factor reuses each
    // column's pattern while the pivots repeat. New values that keep the pivots, then values that
    // change them (the same structure, each column's entries in reverse order of size), must
    // still give the dense factor (Golub and Van Loan 3.4.1) to the last bit.
    for (const [n, seed] of AGAINST_DENSE) {
      const { dense, sparse } = randomSparse(n, seed);
      const reused = new SparseLu(n);
      expect(reused.factor(sparse)).toBe(true);
      const scaled = Float64Array.from(dense, (v) => v * 1.25);
      const reversed = Float64Array.from(dense);
      for (let j = 0; j < n; j++) {
        const rows: number[] = [];
        for (let i = 0; i < n; i++) if (dense[i * n + j] !== 0) rows.push(i);
        rows.forEach((i, m) => (reversed[i * n + j] = dense[rows[rows.length - 1 - m]! * n + j]!));
      }
      for (const next of [scaled, reversed, dense]) {
        const values = toColumns(next, n).values;
        const d = new DenseLu(n);
        const ok = d.factor(next);
        expect(reused.factor({ ...sparse, values })).toBe(ok);
        if (!ok) continue;
        expect(reused.determinantSign).toBe(d.determinantSign);
        expectSolvesOf(reused, d, n);
      }
    }
  });

  it("factors a 60-body chain's constraint Jacobian with a few per cent of n^2 non-zeros", () => {
    const model = analyse(chainSpec({ bodies: 60 }), { modelOnly: true }).model!;
    const linkage = buildLinkage(model)!;
    const cs = linkage.cs;
    updateAngles(cs, linkage.qReference);
    const jac = sparseJacobian(cs);
    constraintJacobianInto(cs, jac);
    const n = cs.n;
    const lu = new SparseLu(n);
    expect(lu.factor(jac)).toBe(true);
    expect(lu.nonZeros).toBeLessThan(0.1 * n * n);
    const dense = new Float64Array(n * n);
    for (let j = 0; j < n; j++)
      for (let p = jac.colStart[j]!; p < jac.colStart[j + 1]!; p++)
        dense[jac.rowIndex[p]! * n + j] = jac.values[p]!;
    const b = Float64Array.from({ length: n }, (_, i) => (i % 7) - 3);
    const x = new Float64Array(n);
    lu.solve(b, x);
    const expected = (math.lusolve(asRows(dense, n), Array.from(b)) as number[][]).map((r) => r[0]!);
    for (let i = 0; i < n; i++) expect(x[i]).toBeCloseTo(expected[i]!, 6);
  });

  it("refuses a singular matrix and one holding a NaN", () => {
    const dense = Float64Array.of(1, 2, 2, 4);
    expect(new SparseLu(2).factor(toColumns(dense, 2))).toBe(false);
    const nan = Float64Array.of(1, 0, 0, NaN);
    const lu = new SparseLu(2);
    expect(lu.factor(toColumns(nan, 2))).toBe(false);
    expect(lu.determinantSign).toBe(0);
  });
});
