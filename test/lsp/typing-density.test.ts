// The while-typing sweep density: the setting's steps per degree of freedom, fewer where the grid
// would pass the typing budget of poses, never more than the spec's own.
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { parse } from "../../server/src/syntax/parser";
import { sweepShape, typingSteps, TYPING_BODY_POSE_BUDGET } from "../../server/src/lsp/typing-density";
import { chainSpec } from "../fuzz/big-spec";

const sample = (name: string) =>
  parse(readFileSync(join(__dirname, "..", "..", "samples", `${name}.poise`), "utf8"));

describe("while-typing density", () => {
  it("reads the degrees of freedom, steps and grid of a spec", () => {
    // camera: the base and one parallelogram (three bodies) with a range; `sweep { steps 37 }`.
    expect(sweepShape(sample("camera-arm"))).toEqual({
      dofs: 1,
      bodies: 4,
      steps: 37,
      grid: true,
      loadCases: 1,
    });
    // engraver: two stages with ranges (the turret is fixed), its own `steps N`, `grid on`, and a
    // payload mass range: the nominal case plus both ends.
    const engraverSteps = Number(
      /steps (\d+)/.exec(
        readFileSync(join(__dirname, "..", "..", "samples", "engraver-arm.poise"), "utf8"),
      )![1],
    );
    expect(sweepShape(sample("engraver-arm"))).toMatchObject({
      dofs: 2,
      steps: engraverSteps,
      grid: true,
      loadCases: 3,
    });
  });

  it("keeps the setting where the grid stays small", () => {
    expect(typingSteps(sample("camera-arm"), 13)).toBe(13);
    // 13 poses of 4 bodies, well inside the budget.
    expect(13 * 4).toBeLessThanOrEqual(TYPING_BODY_POSE_BUDGET);
  });

  it("thins the grid of three degrees of freedom to the budget", () => {
    // Two engraver stages: steps^2 poses of its bodies in each of its three load cases, thinned
    // until they fit the budget.
    const engraver = sweepShape(sample("engraver-arm"));
    const work = engraver.bodies * engraver.loadCases;
    const thinned = typingSteps(sample("engraver-arm"), 13)!;
    expect(thinned ** 2 * work).toBeLessThanOrEqual(TYPING_BODY_POSE_BUDGET);
    expect((thinned + 1) ** 2 * work).toBeGreaterThan(TYPING_BODY_POSE_BUDGET);
    const three = parse(
      'arm "a" {\n base b {}\n link l {}\n joint a { range 0 deg .. 1 deg }\n joint b { range 0 deg .. 1 deg }\n joint c { range 0 deg .. 1 deg }\n}',
    );
    const steps = typingSteps(three, 13)!;
    expect(steps ** 3 * 2).toBeLessThanOrEqual(TYPING_BODY_POSE_BUDGET);
    expect((steps + 1) ** 3 * 2).toBeGreaterThan(TYPING_BODY_POSE_BUDGET);
  });

  it("counts each degree of freedom alone where even a grid of 2 steps would be capped", () => {
    const chain = parse(chainSpec({ bodies: 60 }));
    const { dofs, bodies } = sweepShape(chain);
    expect(2 ** dofs).toBeGreaterThan(20000);
    // `grid off`: each degree of freedom alone, so dofs x steps poses of every body.
    const steps = typingSteps(chain, 13)!;
    expect(dofs * steps * bodies).toBeLessThanOrEqual(TYPING_BODY_POSE_BUDGET);
    expect(dofs * (steps + 1) * bodies).toBeGreaterThan(TYPING_BODY_POSE_BUDGET);
  });

  it("never asks for more than the spec, nor anything when switched off", () => {
    expect(
      typingSteps(parse('arm "a" {\n joint a { range 0 deg .. 1 deg }\n sweep { steps 5 }\n}'), 13),
    ).toBeUndefined();
    expect(typingSteps(sample("camera-arm"), 0)).toBeUndefined();
  });
});
