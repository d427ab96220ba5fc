// While typing, an arm that turns gets the quick pass (mechanics/sweep-plan.ts): its heading
// search thinned to the quarter turns and range ends, its turned pass at the pose that reaches
// farthest and at the ends and middle of each swivel's peak poses (checks/turned-loads.ts). The
// full analysis follows once typing pauses; until then the designer reads the quick pass, so on
// the turning samples it must find what the full analysis finds, at the same places: an error
// that vanished while typing and came back on a pause would read as fixed.
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { analyse } from "../../server/src/analysis";
import { DEFAULT_SETTINGS } from "../../server/src/lsp/session/settings";

const sample = (name: string) =>
  readFileSync(join(__dirname, "..", "..", "samples", `${name}.poise`), "utf8");
const where = (a: ReturnType<typeof analyse>) => a.findings.map((f) => `${f.code} at ${f.span.start}`).sort();

describe("the quick pass of an arm that turns", () => {
  it("two-stage-arm: the full analysis's findings, its two pin errors included, at the same places", () => {
    const text = sample("two-stage-arm");
    const quick = analyse(text, { quickSteps: DEFAULT_SETTINGS.stepsWhileTyping });
    expect(quick.sweep?.quick).toBe(true);
    const full = analyse(text);
    expect(full.findings.filter((f) => f.code === "strength.overstress")).toHaveLength(2);
    expect(where(quick)).toEqual(where(full));
  });

  it("two-stage-arm-fixed: nothing the full analysis does not find (it finds nothing)", () => {
    const text = sample("two-stage-arm-fixed");
    const quick = analyse(text, { quickSteps: DEFAULT_SETTINGS.stepsWhileTyping });
    expect(quick.sweep?.quick).toBe(true);
    expect(where(quick)).toEqual(where(analyse(text)));
  });
});
