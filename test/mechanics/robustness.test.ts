// The solver never throws and always returns, whatever the linkage: degenerate lengths,
// coincident pivots, huge ranges, loops that cannot close, springs of zero length.
import { describe, expect, it } from "vitest";
import { solveSweep } from "../../server/src/mechanics/sweep";
import { balanceChecks } from "../../server/src/checks/balance";
import type { CheckContext } from "../../server/src/checks/index";
import { ArmBuilder, seededRandom } from "./arm-builder";

function wildArm(seed: number) {
  const rnd = seededRandom(seed);
  const pick = <T>(xs: T[]) => xs[Math.floor(rnd() * xs.length)]!;
  const len = () => pick([0, 1e-9, 0.05, 0.3, 2, 1e3]);
  const ang = () => pick([0, Math.PI / 2, -Math.PI, 1e-12, 3 * (rnd() - 0.5)]);
  const b = new ArmBuilder();
  const ids = ["ground"];
  const count = 1 + Math.floor(rnd() * 5);
  for (let i = 0; i < count; i++) {
    const id = `b${i}`;
    const l = len();
    b.link(id, l, pick([0, 0.1, 5]));
    const parent = pick(ids);
    const mode = pick<"passive" | "fixed" | { range: [number, number] }>([
      "passive",
      "fixed",
      { range: [-1, 1] },
      { range: [-100, 100] },
      { range: [0.5, 0.5] },
    ]);
    b.joint(`j${i}`, parent, { x: len(), y: 0 }, id, { x: 0, y: 0 }, ang(), mode);
    ids.push(id);
  }
  // Extra joints close loops between random bodies (often impossible ones).
  const loops = Math.floor(rnd() * 3);
  for (let k = 0; k < loops; k++)
    b.joint(
      `c${k}`,
      pick(ids),
      { x: len(), y: len() },
      pick(ids),
      { x: len(), y: 0 },
      ang(),
      pick(["passive", "fixed", { range: [-1, 1] }] as const),
    );
  b.zeroLength("z", [pick(ids), { x: 0, y: 0 }], [pick(ids), { x: 0, y: 0 }], pick([0, 100, 1e9]));
  b.extension(
    "e",
    [pick(ids), { x: len(), y: 0 }],
    [pick(ids), { x: 0, y: len() }],
    300,
    pick([0, 0.05, 10]),
    3,
  );
  b.gas("g", [pick(ids), { x: 0, y: 0 }], [pick(ids), { x: len(), y: 0 }], 50, 1.3, pick([0, 0.05]), 0.2);
  b.torsion("t", `j0`, 0.1, 0.2);
  b.payload("p", pick(ids), { x: len(), y: 0 }, pick([0, 1]), { massRange: [0, 2] });
  return b.sweep(pick([2, 5, 37]), rnd() < 0.5).build();
}

describe("robustness", () => {
  it("returns for 150 degenerate linkages without throwing", () => {
    for (let seed = 1; seed <= 150; seed++) {
      const model = wildArm(seed);
      const start = performance.now();
      const sweep = solveSweep(model, { deadline: start + 300 });
      const ctx: CheckContext = {
        model,
        sweep,
        options: { deadline: start + 600 },
        findings: [],
        readouts: {},
      };
      balanceChecks(ctx);
      for (const pose of sweep.poses)
        for (const c of pose.cases)
          for (const v of Object.values(c.holdingTorque)) expect(Number.isNaN(v), `seed ${seed}`).toBe(false);
      // The budget holds within a margin (the checks stop between parts, not inside one).
      expect(performance.now() - start, `seed ${seed}`).toBeLessThan(3000);
    }
  });
});
