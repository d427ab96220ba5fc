// How the analysis's cost grows with the number of swivels (issue 11): the two-stage sample with
// its barrel locked (0 swivels), as written (1), and with a turning wrist (2) and a turning tool
// clamp (3) added below its outer stage. The stiffness and strength passes solve one frame per
// heading searched, one swivel at a time, so they grow with the sum of the swivels' headings;
// tipping and the swivels' loads visit every combination, cheap sums that grow with the product
// until MAX_HEADING_COMBINATIONS, then one swivel at a time.
import { existsSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { analyse, type AnalysisOptions } from "../server/src/analysis";
import { headingCombinations, headingSets } from "../server/src/mechanics/headings";
import { turnedLoadsAt, turnedPassPoses } from "../server/src/checks/turned-loads";
import type { ArmModel } from "../server/src/model/types";
import type { SweepResult } from "../server/src/mechanics/types";

const WRIST = `
  link holder {
    length 40 mm
    mass 30 g
  }
  swivel wrist {
    connects second.head(30 mm, 0 mm) to holder.start
    heading -90 deg .. 90 deg
  }
`;
const CLAMP = `
  link clamp_block {
    length 20 mm
    mass 20 g
  }
  swivel clamp_turn {
    connects holder.end to clamp_block.start
    heading -60 deg .. 60 deg
  }
`;

/** The sample with `count` swivels (0 to 3), or undefined when the sample is missing. */
export function twoStageWithSwivels(root: string, count: number): string | undefined {
  const path = join(root, "samples", "two-stage-arm.poise");
  if (!existsSync(path)) return undefined;
  let text = readFileSync(path, "utf8");
  if (count === 0)
    return text.replace(
      /swivel barrel \{[^}]*\}/,
      "joint barrel {\n    connects first.head to block.start\n    fixed\n  }",
    );
  if (count >= 2) text = text.replace("  payload tool {", `${WRIST}\n  payload tool {`);
  if (count >= 3) text = text.replace("  payload tool {", `${CLAMP}\n  payload tool {`);
  const at = count >= 3 ? "clamp_block.end" : count >= 2 ? "holder.end" : undefined;
  return at ? text.replace(/at second\.head\(30 mm, -40 mm\)/, `at ${at}`) : text;
}

export function runSwivelCost(
  log: (line: string) => void,
  root: string,
  timeMs: (f: () => void) => number,
  typing: AnalysisOptions,
): boolean {
  for (let n = 0; n <= 3; n++) {
    const text = twoStageWithSwivels(root, n);
    if (!text) return (log("  samples/two-stage-arm.poise missing"), false);
    const a = analyse(text);
    const bad = a.findings.filter((f) => f.severity === "error");
    const sets = a.model ? headingSets(a.model).length : 0;
    const combos = a.model ? headingCombinations(a.model).length : 0;
    const full = timeMs(() => analyse(text));
    const quick = timeMs(() => analyse(text, typing));
    log(
      `  ${n} swivel${n === 1 ? "" : "s"}: ${full.toFixed(1)} ms (checks ${a.timings.checks.toFixed(1)}), while typing ${quick.toFixed(1)} ms; ${sets} heading sets one at a time, ${combos} combinations${bad.length ? `; ERRORS: ${bad.map((f) => f.code).join(", ")}` : ""}`,
    );
    if (n > 0 && a.model && a.sweep) log(`    ${turnedPassCost(a.model, a.sweep)}`);
  }
  return true;
}

/** The turned pass (strength with torsion, columns, pins and bearings in 3D) at the poses its
 * rule picks against every pose of the sweep (docs/checks.md, "Which poses each check visits"):
 * one run each, the frame solves being the cost. */
function turnedPassCost(model: ArmModel, sweep: SweepResult): string {
  const ctx = {
    model,
    sweep,
    options: { deadline: Infinity },
    findings: [],
    readouts: {},
  };
  const picked = turnedPassPoses(model, sweep);
  const once = (f: () => void) => {
    const t = performance.now();
    f();
    return performance.now() - t;
  };
  const rule = once(() => turnedLoadsAt(ctx, picked));
  const every = once(() => turnedLoadsAt(ctx, sweep.poses));
  return `turned pass: ${picked.length} poses by the rule ${rule.toFixed(0)} ms, every pose (${sweep.poses.length}) ${every.toFixed(0)} ms`;
}
