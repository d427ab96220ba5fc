// What the checks of one run share (checks/frame-structures.ts, checks/swivel-load-table.ts): the
// frame structure at a representative pose and heading set, built once for the turned pass and the
// stiffness check, and the swivels' loads at each pose and case, worked out once for the swivels'
// figures and their bearings. A shared result must be what each check would compute on its own:
// here against the functions they call (armStructure, swivelLoadsOverHeadings), on the two-stage
// sample, whose barrel turns.
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { analyse } from "../../server/src/analysis";
import type { CheckContext } from "../../server/src/checks/index";
import { structureAt } from "../../server/src/checks/frame-structures";
import { swivelLoadsAt } from "../../server/src/checks/swivel-load-table";
import { representativePoses } from "../../server/src/checks/stiffness";
import { payloadMasses } from "../../server/src/checks/part-words";
import { headingCombinations, headingSets } from "../../server/src/mechanics/headings";
import { swivelLoadsOverHeadings } from "../../server/src/mechanics/swivel-loads";
import { armStructure, loadArmFrame } from "../../server/src/mechanics/structure/arm-frame";

const spec = readFileSync(join(__dirname, "..", "..", "samples", "two-stage-arm.poise"), "utf8");

function context(): CheckContext {
  const a = analyse(spec);
  return { model: a.model!, sweep: a.sweep!, options: { deadline: Infinity }, findings: [], readouts: {} };
}

describe("what the checks of one run share", () => {
  it("one frame structure per representative pose and heading set, solving as a fresh one does", () => {
    const ctx = context();
    const pose = representativePoses(ctx.sweep)[0]!;
    const sets = headingSets(ctx.model);
    expect(sets.length).toBeGreaterThan(2);
    const turned = sets[2]!;
    const first = structureAt(ctx, pose, turned);
    // the same headings written anew (another check's list) find the same structure
    expect(structureAt(ctx, pose, { ...turned })).toBe(first);
    expect(structureAt(ctx, pose, {})).not.toBe(first);
    // another run keeps its own
    expect(structureAt(context(), pose, turned)).not.toBe(first);
    // a pose the stiffness check does not visit is not kept
    const other = ctx.sweep.poses.find((p) => !representativePoses(ctx.sweep).includes(p))!;
    expect(structureAt(ctx, other, turned)).not.toBe(structureAt(ctx, other, turned));
    // the kept structure, solved after another frame of it was, gives a fresh one's displacements
    const masses = payloadMasses(ctx.model, ctx.sweep, 0);
    loadArmFrame(ctx.model, first, pose.cases[0], masses).frame.solveStatic();
    const shared = loadArmFrame(ctx.model, first, pose.cases[0], masses).frame.solveStatic()!;
    const fresh = loadArmFrame(
      ctx.model,
      armStructure(ctx.model, pose, { headings: turned }),
      pose.cases[0],
      masses,
    ).frame.solveStatic()!;
    const node = first.payloadNode["tool"]!;
    expect(shared.displacement(node)).toEqual(fresh.displacement(node));
  });

  it("the swivels' loads at each pose and case, the first time and the second as computed afresh", () => {
    const ctx = context();
    const sets = headingCombinations(ctx.model);
    for (const k of [0, 7, ctx.sweep.poses.length - 1]) {
      const pose = ctx.sweep.poses[k]!;
      for (let ci = 0; ci < pose.cases.length; ci++) {
        const direct = swivelLoadsOverHeadings(
          ctx.model,
          pose,
          payloadMasses(ctx.model, ctx.sweep, ci),
          sets,
        );
        expect(Object.keys(direct).length).toBeGreaterThan(0);
        expect(swivelLoadsAt(ctx, k, ci)).toEqual(direct);
        // the second reading comes from the kept numbers
        expect(swivelLoadsAt(ctx, k, ci)).toEqual(direct);
      }
    }
  });
});
