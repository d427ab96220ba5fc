// The pin quick fix on the whole pipeline: a pin of a weak material fails `require safety`; the
// fix writes the smallest size of the standard series (common practice, no source) whose
// re-analysis has no pin finding, and the size below it in the series still fails.
import { describe, expect, it } from "vitest";
import { analyse } from "../../server/src/analysis";
import { parse } from "../../server/src/syntax/parser";
import { isCode } from "../../server/src/findings/finding";
import { STANDARD_PIN_DIAMETERS_M, widenPinFix } from "../../server/src/checks/strength-fixes";
import { PENDULUM_TEXT } from "../view/pendulum-fixture";

const WEAK_PIN = PENDULUM_TEXT.replace(
  "  base post {",
  "  material soft_pin {\n    density 1.2 g/cm^3\n    modulus 1 GPa\n    strength 5 MPa\n  }\n  base post {",
).replace("pin 3 mm steel_1018", "pin 2 mm soft_pin");

const withPin = (mm: number) => WEAK_PIN.replace("pin 2 mm soft_pin", `pin ${mm} mm soft_pin`);
const pinFails = (text: string) =>
  analyse(text).findings.some((f) => f.code === "strength.overstress" && f.data.check === "pin");

describe("widen a pin", () => {
  it("picks the smallest standard diameter that passes", () => {
    const analysis = analyse(WEAK_PIN);
    const pinFinding = analysis.findings
      .filter(isCode("strength.overstress"))
      .find((f) => f.data.check === "pin");
    expect(pinFinding, analysis.findings.map((f) => `${f.code}: ${f.message}`).join("\n")).toBeDefined();
    const fix = widenPinFix(WEAK_PIN, parse(WEAK_PIN), pinFinding!.data, analyse)!;
    expect(fix).toBeDefined();
    const mm = Number(/^([\d.]+) mm$/.exec(fix.edits[0]!.newText)![1]);
    const series = STANDARD_PIN_DIAMETERS_M.map((d) => Math.round(d * 1e4) / 10);
    expect(series).toContain(mm);
    expect(fix.title).toContain(`${mm} mm`);
    // It passes ...
    expect(pinFails(withPin(mm))).toBe(false);
    // ... and the next smaller standard size (if above the original 2 mm) does not.
    const smaller = series[series.indexOf(mm) - 1]!;
    if (smaller > 2) expect(pinFails(withPin(smaller))).toBe(true);
  });
});
