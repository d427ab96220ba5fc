// The blocks of the joint graph (mechanics/joint-blocks.ts) against their definition: two joints
// lie in one block exactly when some simple cycle passes through both, and a joint on no cycle is
// a block of its own (Harary, Graph Theory, 1969, ch. 3, theorem 3.3). Checked by enumerating the
// cycles of small random multigraphs; and the linkage built block by block on a long chain.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { jointBlocks } from "../../server/src/mechanics/joint-blocks";
import { buildLinkage } from "../../server/src/mechanics/linkage";
import { buildModel } from "../../server/src/model/build";
import { parse } from "../../server/src/syntax/parser";
import { linkChainSpec } from "../fuzz/shapes";

/** Blocks by definition: union the joints of every simple cycle (an edge set in which every node
 * has degree two and which is connected). Exponential, for graphs of a few edges only. */
function blocksByCycles(nodes: number, ends: [number, number][]): number[] {
  const root = ends.map((_, i) => i);
  const find = (i: number): number => (root[i] === i ? i : (root[i] = find(root[i]!)));
  for (let subset = 1; subset < 1 << ends.length; subset++) {
    const edges = ends.map((_, i) => i).filter((i) => subset & (1 << i));
    const degree = new Array<number>(nodes).fill(0);
    for (const e of edges) for (const v of ends[e]!) degree[v]!++;
    if (degree.some((d) => d !== 0 && d !== 2)) continue;
    // connected?
    const reached = new Set([ends[edges[0]!]![0]]);
    for (let grew = true; grew;) {
      grew = false;
      for (const e of edges) {
        const [a, b] = ends[e]!;
        if (reached.has(a) !== reached.has(b)) {
          reached.add(a).add(b);
          grew = true;
        }
      }
    }
    if (edges.some((e) => !reached.has(ends[e]![0]))) continue;
    for (const e of edges) root[find(e)] = find(edges[0]!);
  }
  return ends.map((_, i) => find(i));
}

const graphArb = fc.integer({ min: 1, max: 6 }).chain((bodies) =>
  fc.record({
    bodies: fc.constant(bodies),
    // node `bodies` is the base (index -1 for jointBlocks); every body reached through a tree first
    tree: fc.tuple(...Array.from({ length: bodies }, (_, b) => fc.integer({ min: -1, max: b - 1 }))),
    extra: fc.array(
      fc.tuple(fc.integer({ min: -1, max: bodies - 1 }), fc.integer({ min: 0, max: bodies - 1 })),
      {
        maxLength: 4,
      },
    ),
  }),
);

describe("joint blocks", () => {
  it("put two joints in one block exactly when a cycle runs through both", () => {
    fc.assert(
      fc.property(graphArb, ({ bodies, tree, extra }) => {
        const pairs: [number, number][] = [
          ...tree.map((p, b) => [p, b] as [number, number]),
          ...extra.filter(([p, c]) => p !== c),
        ];
        const parent = Int32Array.from(pairs, ([p]) => p);
        const child = Int32Array.from(pairs, ([, c]) => c);
        const blocks = jointBlocks(bodies, parent, child);
        const node = (b: number) => (b < 0 ? bodies : b);
        const expected = blocksByCycles(
          bodies + 1,
          pairs.map(([p, c]) => [node(p), node(c)]),
        );
        for (let e = 0; e < pairs.length; e++)
          for (let f = 0; f < pairs.length; f++)
            expect(blocks.blockOf[e] === blocks.blockOf[f], `joints ${e} and ${f}`).toBe(
              expected[e] === expected[f],
            );
        // A block's root is one of its bodies (or the base) and is left out of its columns.
        for (let e = 0; e < pairs.length; e++) {
          const b = blocks.blockOf[e]!;
          const root = blocks.root[b]!;
          expect(
            root === -1 || pairs.some(([p, c], f) => blocks.blockOf[f] === b && (p === root || c === root)),
          ).toBe(true);
          expect(blocks.bodies[b]).not.toContain(root);
        }
      }),
      { numRuns: 300, seed: 16 },
    );
  });

  it("make each joint of a chain a block of its own", () => {
    const n = 5000;
    const parent = Int32Array.from({ length: n }, (_, i) => i - 1);
    const child = Int32Array.from({ length: n }, (_, i) => i);
    const blocks = jointBlocks(n, parent, child);
    expect(new Set(blocks.blockOf).size).toBe(n);
    expect(blocks.bodies.every((b) => b.length === 1)).toBe(true);
  });

  it("let the linkage keep every row of a long fixed chain (one drive and two pivot rows per joint)", () => {
    const text = linkChainSpec(150);
    const model = buildModel(parse(text), text).model!;
    const linkage = buildLinkage(model)!;
    expect(linkage.ok).toBe(true);
    expect(linkage.dofs).toHaveLength(0);
    expect(linkage.driveKind.filter((k) => k === "fixed")).toHaveLength(150);
    expect([...linkage.revRow].every((r) => r >= 0)).toBe(true);
  });
});
