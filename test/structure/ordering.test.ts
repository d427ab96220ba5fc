// The equation numbering that keeps a frame's skyline narrow (reverse Cuthill-McKee,
// server/src/mechanics/structure/ordering.ts): a permutation, the bandwidths George and Liu prove
// for it on a path and a ladder numbered at random, and a cantilever whose nodes are added out of
// order solving as Roark says with a skyline as short as if they were added in order.
import { describe, expect, it } from "vitest";
import { graphOfGroups, reverseCuthillMcKee } from "../../server/src/mechanics/structure/ordering";
import { SpaceFrame, type MemberProperties } from "../../server/src/mechanics/structure/space-frame";
import { sectionProperties } from "../../server/src/model/section";
import type { Section } from "../../server/src/model/types";

/** A repeatable shuffle of 0 .. n-1 (a linear congruential walk). */
function shuffled(n: number, seed: number): number[] {
  const out = Array.from({ length: n }, (_, i) => i);
  let s = seed;
  for (let i = n - 1; i > 0; i--) {
    s = (s * 1103515245 + 12345) % 2147483648;
    const j = s % (i + 1);
    [out[i], out[j]] = [out[j]!, out[i]!];
  }
  return out;
}

function bandwidth(edges: [number, number][], order: Int32Array): number {
  const number = new Int32Array(order.length);
  order.forEach((v, k) => (number[v] = k));
  return Math.max(...edges.map(([a, b]) => Math.abs(number[a]! - number[b]!)));
}

describe("reverse Cuthill-McKee", () => {
  it("numbers every vertex once, including separate components and lone vertices", () => {
    const g = graphOfGroups(7, [
      [0, 3],
      [3, 5],
      [1, 6],
    ]);
    const order = reverseCuthillMcKee(g);
    expect([...order].sort()).toEqual([0, 1, 2, 3, 4, 5, 6]);
  });

  it("a path numbered at random gets bandwidth 1, a ladder at most 3", () => {
    const n = 40;
    const label = shuffled(n, 7);
    const path: [number, number][] = [];
    for (let k = 0; k + 1 < n; k++) path.push([label[k]!, label[k + 1]!]);
    // George and Liu (1981), ch. 4: the Cuthill-McKee numbering of a level structure of width w
    // has bandwidth at most 2 w - 1; a path's levels from an end have width 1
    expect(bandwidth(path, reverseCuthillMcKee(graphOfGroups(n, path)))).toBe(1);
    const rungs = 20;
    const at = shuffled(2 * rungs, 11);
    const ladder: [number, number][] = [];
    for (let k = 0; k < rungs; k++) {
      ladder.push([at[2 * k]!, at[2 * k + 1]!]);
      if (k + 1 < rungs) ladder.push([at[2 * k]!, at[2 * k + 2]!], [at[2 * k + 1]!, at[2 * k + 3]!]);
    }
    // the same bound: a ladder's levels from a corner have width 2
    expect(bandwidth(ladder, reverseCuthillMcKee(graphOfGroups(2 * rungs, ladder)))).toBeLessThanOrEqual(3);
  });
});

describe("a frame whose nodes are added out of order", () => {
  // 6061-T6 (docs/materials.md: ASM Handbook vol. 2, from memory); G = E / (2 (1 + nu)), nu = 0.33
  const E = 68.9e9;
  const G = E / (2 * 1.33);
  const bar: Section = { shape: "rect", depth: 0.02, width: 0.006 };
  const s = sectionProperties(bar);
  const props: MemberProperties = {
    axialRigidity: E * s.area,
    torsionalRigidity: G * s.torsionConstant,
    bendingRigidityY: E * s.secondMomentAcross,
    bendingRigidityZ: E * s.secondMoment,
    massPerLength: 0,
    rotaryInertiaPerLength: 0,
  };
  const L = 0.6;
  const P = 10;
  const count = 24;

  /** A cantilever along x in `count` members, its stations added in `order`; the tip node and
   * the entries its factor stores. */
  function cantilever(order: number[]) {
    const frame = new SpaceFrame();
    const node = new Array<number>(count + 1);
    for (const k of order) node[k] = frame.addNode({ x: (L * k) / count, y: 0, z: 0 });
    frame.fix(node[0]!);
    for (let k = 0; k < count; k++) frame.addMember(node[k]!, node[k + 1]!, props, { x: 0, y: 0, z: 1 });
    frame.addLoad(node[count]!, { x: 0, y: -P, z: 0 });
    return { frame, tip: node[count]! };
  }

  it("deflects as Roark says, with as short a skyline as in order", () => {
    const scrambled = cantilever(shuffled(count + 1, 3));
    const inOrder = cantilever(Array.from({ length: count + 1 }, (_, k) => k));
    const u = scrambled.frame.solveStatic()!.displacement(scrambled.tip);
    // Roark 8th ed., table 8.1 case 1a: W l^3 / (3 E I)
    const expected = (P * L ** 3) / (3 * E * s.secondMoment);
    expect(Math.abs(-u.translation.y - expected) / expected).toBeLessThan(1e-9);
    // numbered along the bar, each of the 6 count equations reaches back at most one node (12
    // entries a row): the skyline holds no more than 12 per equation, scrambled or not
    expect(scrambled.frame.storedEntries()).toBeLessThanOrEqual(12 * 6 * count);
    expect(scrambled.frame.storedEntries()).toBe(inOrder.frame.storedEntries());
  });
});
