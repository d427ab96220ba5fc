// Profile (skyline) storage, Cholesky and solve against mathjs's general solver on a banded
// symmetric positive definite matrix with uneven row lengths, and a singular one refused.
import { describe, expect, it } from "vitest";
import * as math from "mathjs";
import { CompressedRows, SkylineMatrix } from "../../server/src/mechanics/structure/skyline";

describe("skyline matrix", () => {
  const n = 9;
  // rows reach back unevenly, as a frame's do
  const first = Int32Array.from([0, 0, 1, 0, 3, 2, 5, 6, 4]);
  const dense = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let i = 0; i < n; i++)
    for (let j = first[i]!; j < i; j++) dense[i]![j] = dense[j]![i] = Math.sin(1.7 * i + 0.3 * j) * 0.9;
  // diagonally dominant, hence positive definite (Gershgorin)
  for (let i = 0; i < n; i++)
    dense[i]![i] = 1 + dense[i]!.reduce((s, v, j) => s + (j === i ? 0 : Math.abs(v)), 0);

  it("multiplies, factors and solves like a dense solver", () => {
    const m = new SkylineMatrix(n, first);
    for (let i = 0; i < n; i++) for (let j = first[i]!; j <= i; j++) m.add(i, j, dense[i]![j]!);
    const x = Float64Array.from({ length: n }, (_, i) => Math.cos(i));
    const y = new Float64Array(n);
    m.multiply(x, y);
    // mathjs, general dense multiply and LU solve (independent of this code)
    const yRef = math.multiply(dense, Array.from(x)) as number[];
    y.forEach((v, i) => expect(v).toBeCloseTo(yRef[i]!, 12));
    expect(m.factor()).toBe(true);
    const b = Float64Array.from(y);
    m.solve(b);
    const ref = (math.lusolve(dense, yRef) as number[][]).map((r) => r[0]!);
    b.forEach((v, i) => expect(v).toBeCloseTo(ref[i]!, 10));
    b.forEach((v, i) => expect(v).toBeCloseTo(x[i]!, 10));
  });

  it("gives the same products and solves with its zeros left out (compressed rows)", () => {
    // the same matrix with every third entry below the diagonal zero, as a frame's profile has
    const sparse = dense.map((row, i) => row.map((v, j) => (j < i && (i + j) % 3 === 0 ? 0 : v)));
    for (let i = 0; i < n; i++) for (let j = 0; j < i; j++) sparse[j]![i] = sparse[i]![j]!;
    const m = new SkylineMatrix(n, first);
    for (let i = 0; i < n; i++) for (let j = first[i]!; j <= i; j++) m.add(i, j, sparse[i]![j]!);
    const x = Float64Array.from({ length: n }, (_, i) => Math.cos(i));
    const y = new Float64Array(n);
    const yRows = new Float64Array(n);
    m.multiply(x, y);
    new CompressedRows(m).multiply(x, yRows);
    // mathjs, general dense multiply (independent of this code)
    const yRef = math.multiply(sparse, Array.from(x)) as number[];
    yRows.forEach((v, i) => expect(v).toBeCloseTo(yRef[i]!, 12));
    // the same terms in the same order: the same numbers to the last bit
    expect(Array.from(yRows)).toEqual(Array.from(y));
    expect(m.factor()).toBe(true);
    const b = Float64Array.from(y);
    const bRows = Float64Array.from(y);
    m.solve(b);
    new CompressedRows(m).solve(bRows);
    expect(Array.from(bRows)).toEqual(Array.from(b));
    bRows.forEach((v, i) => expect(v).toBeCloseTo(x[i]!, 10));
  });

  it("refuses a singular matrix (a mechanism)", () => {
    // two equal rows: [[1, 1], [1, 1]] is singular
    const m = new SkylineMatrix(2, Int32Array.from([0, 0]));
    m.add(0, 0, 1);
    m.add(1, 0, 1);
    m.add(1, 1, 1);
    expect(m.factor()).toBe(false);
  });
});
