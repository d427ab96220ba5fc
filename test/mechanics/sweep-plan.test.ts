// The sweep planner: the spec's own density, and the quick pass while typing at the setting's
// steps per degree of freedom, fewer where the work would pass the budget, never more than the
// spec's own; 0 means no quick pass. Both read from the model.
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { analyse } from "../../server/src/analysis";
import type { ArmModel } from "../../server/src/model/types";
import { buildLinkage } from "../../server/src/mechanics/linkage";
import {
  loadCases,
  MAX_GRID_POSES,
  planSweep,
  QUICK_WORK_BUDGET,
} from "../../server/src/mechanics/sweep-plan";
import { chainSpec } from "../fuzz/big-spec";
import { MAX_POSE_BODIES } from "../../server/src/limits";
import { ArmBuilder, deg } from "./arm-builder";

const text = (name: string) => readFileSync(join(__dirname, "..", "..", "samples", `${name}.poise`), "utf8");
const modelOf = (spec: string): ArmModel => analyse(spec, { modelOnly: true }).model!;
const linkageOf = (model: ArmModel) => buildLinkage(model)!;
/** Work of one pose: each body checked once per load case (the budget's unit). */
const work = (model: ArmModel) => model.bodies.length * loadCases(model).length;

describe("the sweep planner", () => {
  it("plans the spec's own density by default", () => {
    const camera = modelOf(text("camera-arm"));
    const steps = Number(/steps (\d+)/.exec(text("camera-arm"))![1]);
    expect(planSweep(linkageOf(camera))).toMatchObject({
      steps,
      grid: false,
      poses: steps,
      caps: [],
      quick: false,
    });
  });

  it("keeps the quick pass's steps where the work stays small", () => {
    const camera = modelOf(text("camera-arm"));
    const plan = planSweep(linkageOf(camera), { quickSteps: 13 });
    expect(plan).toMatchObject({ steps: 13, quick: true, poses: 13 });
    expect(13 * work(camera)).toBeLessThanOrEqual(QUICK_WORK_BUDGET);
  });

  it("thins a quick grid to the budget", () => {
    // The engraver: two stages with ranges and a payload mass range (three load cases).
    const engraver = modelOf(text("engraver-arm"));
    expect(linkageOf(engraver).dofs).toHaveLength(2);
    expect(loadCases(engraver)).toHaveLength(3);
    const thinned = planSweep(linkageOf(engraver), { quickSteps: 13 });
    expect(thinned.quick).toBe(true);
    expect(thinned.steps ** 2 * work(engraver)).toBeLessThanOrEqual(QUICK_WORK_BUDGET);
    expect((thinned.steps + 1) ** 2 * work(engraver)).toBeGreaterThan(QUICK_WORK_BUDGET);
    // Three links, three degrees of freedom, one load case.
    const b = new ArmBuilder();
    let parent = b.baseId;
    for (const id of ["a", "b", "c"]) {
      b.link(id, 0.1, 0.1).joint(
        id,
        parent,
        { x: parent === b.baseId ? 0 : 0.1, y: 0 },
        id,
        { x: 0, y: 0 },
        0,
        {
          range: [deg(-10), deg(10)],
        },
      );
      parent = id;
    }
    const three = b.sweep(37).build();
    const plan = planSweep(linkageOf(three), { quickSteps: 13 });
    expect(plan.steps ** 3 * 4).toBeLessThanOrEqual(QUICK_WORK_BUDGET);
    expect((plan.steps + 1) ** 3 * 4).toBeGreaterThan(QUICK_WORK_BUDGET);
  });

  it("counts each degree of freedom alone where even a grid of 2 steps would be capped", () => {
    // The generated chain asks for `grid off`; with the grid on it is swept each alone anyway.
    const chain = modelOf(chainSpec({ bodies: 60 }).replace("grid off", "grid on"));
    const dofs = linkageOf(chain).dofs.length;
    expect(2 ** dofs).toBeGreaterThan(MAX_GRID_POSES);
    const own = planSweep(linkageOf(chain));
    expect(own).toMatchObject({ grid: false, caps: [{ kind: "each-alone", limit: "grid" }] });
    // Each degree of freedom alone: dofs x steps poses of every body.
    const quick = planSweep(linkageOf(chain), { quickSteps: 13 });
    expect(dofs * quick.steps * work(chain)).toBeLessThanOrEqual(QUICK_WORK_BUDGET);
    expect(dofs * (quick.steps + 1) * work(chain)).toBeGreaterThan(QUICK_WORK_BUDGET);
  });

  it("keeps poses times moving bodies within MAX_POSE_BODIES", () => {
    // A chain of stages (a parallelogram of three bodies and a link each, one degree of freedom)
    // swept each alone at 2001 steps: lowered until dofs x steps x bodies fits the limit.
    const long = linkageOf(modelOf(chainSpec({ bodies: 60, steps: 2001 })));
    const dofs = long.dofs.length;
    const bodies = long.graph.bodyIds.length;
    const plan = planSweep(long);
    expect(plan.caps).toEqual([
      { kind: "fewer-steps", limit: "pose-bodies", requested: 2001, used: plan.steps },
    ]);
    expect(dofs * plan.steps * bodies).toBeLessThanOrEqual(MAX_POSE_BODIES);
    expect(dofs * (plan.steps + 1) * bodies).toBeGreaterThan(MAX_POSE_BODIES);
    // 14 stages in a grid: 2^14 poses are within the grid limit, but times 56 bodies past the
    // pose-bodies one even at 2 steps each: each degree of freedom alone.
    const grid = linkageOf(modelOf(chainSpec({ bodies: 56 }).replace("grid off", "grid on")));
    expect(2 ** grid.dofs.length).toBeLessThanOrEqual(MAX_GRID_POSES);
    expect(2 ** grid.dofs.length * grid.graph.bodyIds.length).toBeGreaterThan(MAX_POSE_BODIES);
    expect(planSweep(grid)).toMatchObject({
      grid: false,
      caps: [{ kind: "each-alone", limit: "pose-bodies" }],
    });
  });

  it("never asks for more than the spec, nor anything when the quick pass is off (0)", () => {
    const camera = modelOf(text("camera-arm").replace(/steps \d+/, "steps 5"));
    expect(planSweep(linkageOf(camera), { quickSteps: 13 })).toMatchObject({ steps: 5, quick: false });
    const own = planSweep(linkageOf(modelOf(text("camera-arm"))));
    expect(planSweep(linkageOf(modelOf(text("camera-arm"))), { quickSteps: 0 })).toEqual(own);
  });

  it("gives an arm that turns a quick pass even at its own density (its heading search is thinned)", () => {
    // The two-stage sample: a swivel between its stages, 11 steps a degree of freedom in a grid,
    // within the quick pass's budget, so the steps stay the spec's own.
    const turning = text("two-stage-arm");
    const own = Number(/steps (\d+)/.exec(turning)![1]);
    const plan = planSweep(linkageOf(modelOf(turning)), { quickSteps: 13 });
    expect(plan).toMatchObject({ steps: own, quick: true });
    // The same arm with its barrel fixed: nothing to thin, so no quick pass.
    const locked = turning.replace(
      /swivel barrel \{[^}]*\}/,
      "joint barrel {\n    connects first.head to block.start\n    fixed\n  }",
    );
    expect(planSweep(linkageOf(modelOf(locked)), { quickSteps: 13 })).toMatchObject({
      steps: own,
      quick: false,
    });
    // Without a quick pass asked for, the full analysis.
    expect(planSweep(linkageOf(modelOf(turning)), { quickSteps: 0 }).quick).toBe(false);
    expect(planSweep(linkageOf(modelOf(turning))).quick).toBe(false);
  });

  it("is what the sweep runs: a quick pass says so in its result", () => {
    const quick = analyse(text("camera-arm"), { quickSteps: 13 }).sweep!;
    expect(quick.steps).toBe(13);
    expect(quick.quick).toBe(true);
    expect(analyse(text("camera-arm"), { quickSteps: 0 }).sweep!.quick).toBeUndefined();
  });
});
