// Bearings, fastenings and spring ends where a designer reads the figures (issue 12): `poise
// results` in cli.md's shape (parts with check "bearing" and "hook", the `fastenings` key), the
// report's safety table, and the readouts a hover shows; each the same least safety factor as
// the finding that checks it, on the printed lamp arm whose hardware fails first.
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { analyse } from "../../server/src/analysis";
import { resultsOf } from "../../server/src/cli/results";
import { reportPage } from "../../server/src/view/index";

const file = join(__dirname, "..", "fixtures", "checks", "hardware.poise");
const text = readFileSync(file, "utf8");
const analysis = analyse(text);
const { json } = resultsOf(text, "si");
const parts = json["parts"] as Record<string, { safety: number; check: string; where?: string }>;

/** The least safety factor a finding of `code` about `subject` reports. */
function leastSafety(code: string, subject: string, fastening?: string): number {
  const safeties = analysis.findings
    .filter((f) => f.code === code && f.data.subject === subject)
    .filter((f) => !fastening || (f.data as { fastening?: string }).fastening === fastening)
    .map((f) => (f.data as { safety?: number }).safety)
    .filter((s): s is number => s !== undefined);
  return Math.min(...safeties);
}

describe("hardware in poise results, the report and the readouts", () => {
  it("a bearing and the joint that turns on it are parts with check bearing (cli.md)", () => {
    expect(parts["ring"]).toMatchObject({ check: "bearing" });
    expect(parts["shoulder"]).toMatchObject({ check: "bearing" });
    expect(parts["shoulder"]!.safety).toBeCloseTo(leastSafety("strength.bearing", "shoulder"), 4);
  });

  it("a spring whose hook fails first is a part with check hook", () => {
    expect(parts["lift"]).toMatchObject({ check: "hook" });
    expect(parts["lift"]!.safety).toBeCloseTo(leastSafety("strength.spring-end", "lift"), 4);
  });

  it("a fastening has its least safety under the fastenings key", () => {
    const fastenings = json["fastenings"] as Record<string, { safety: number }>;
    expect(fastenings["lug_screws"]!.safety).toBeCloseTo(
      leastSafety("strength.fastening", "lift", "lug_screws"),
      4, // the JSON rounds figures to 6 significant digits
    );
  });

  it("the report's safety table has a row for the bearing, the fastening and the spring end", () => {
    const html = reportPage(analysis, { file: "hardware.poise" });
    const table = /<table class="safety">[\s\S]*?<\/table>/.exec(html)![0];
    for (const id of ["ring", "shoulder", "lift", "lug_screws"]) expect(table).toContain(`>${id}<`);
    expect(table).toMatch(/thread stripping/);
  });

  it("the readouts a hover shows: a bearing, a fastening and a spring end each give their least safety", () => {
    expect(analysis.readouts["ring"]!.kind).toBe("bearing");
    expect(analysis.readouts["lug_screws"]!.kind).toBe("fastening");
    expect(analysis.readouts["lug_screws"]!.worstSafety!.value).toBeCloseTo(
      leastSafety("strength.fastening", "lift", "lug_screws"),
      6,
    );
    expect(analysis.readouts["lift"]!.worstSafety!.what).toMatch(/^hook/);
  });
});
