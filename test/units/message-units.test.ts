// Units follow the spec (issue 10 item 7): a spec written in inches and pounds gets its messages,
// report and results in US customary units; a number written without a unit there is offered
// inches; `2 lb` where a force belongs is offered `lbf`; `poise sweep` names its fixed units.
import { describe, expect, it } from "vitest";
import { analyse } from "../../server/src/analysis";
import { isCode } from "../../server/src/findings/finding";
import { modelFixes } from "../../server/src/model/fixes";
import { reportHtml } from "../../server/src/cli/report";
import { resultsOf } from "../../server/src/cli/results";
import { sweepCsv, sweepTable } from "../../server/src/cli/sweep";
import { PENDULUM_TEXT } from "../view/pendulum-fixture";
import { INCH_TEXT } from "./inch-boom";

// Exact definitions (NIST SP 811, appendix B): 1 in = 0.0254 m, 1 lb = 0.45359237 kg,
// 1 lbf = 0.45359237 kg x 9.80665 m/s^2 = 4.4482216152605 N.
const LBF_N = 0.45359237 * 9.80665;

describe("messages follow the spec's units", () => {
  it("a spec in inches and pounds says its hand force in lbf", () => {
    const a = analyse(INCH_TEXT);
    expect(a.units).toBe("us");
    const f = a.findings.find(isCode("balance.unbalanced"));
    expect(f, a.findings.map((x) => x.message).join("\n")).toBeDefined();
    // Pivoting link with a zero-free-length spring (Streit and Gilmore 1989; docs/formulas.md):
    // tau = (m g l - k a b) cos(theta), hand force |tau| / l, largest at theta = 0:
    // (2 lbf x 16 in - 3 lbf/in x 2 in x 4 in) / 16 in = 0.5 lbf.
    const expected = (2 * 16 - 3 * 2 * 4) / 16;
    const m = /takes ([\d.]+) lbf/.exec(f!.message);
    expect(m, f!.message).not.toBeNull();
    expect(Number(m![1])).toBeCloseTo(expected, 3);
    // The figure itself stays SI in the data: 0.5 lbf in newtons.
    expect(f!.data.worstHandForce).toBeCloseTo(expected * LBF_N, 6);
    expect(f!.message).not.toMatch(/\d N\b/);
  });

  it("a spec in millimetres keeps newtons, and a reader may ask for the other system", () => {
    const si = analyse(PENDULUM_TEXT).findings.find(isCode("balance.unbalanced"))!;
    expect(si.message).toMatch(/takes [\d.]+ N\b/);
    const us = analyse(PENDULUM_TEXT, { units: "us" }).findings.find(isCode("balance.unbalanced"))!;
    const n = Number(/takes ([\d.]+) N\b/.exec(si.message)![1]);
    const lbf = Number(/takes ([\d.]+) lbf/.exec(us.message)![1]);
    // The same force: newtons over 4.4482216152605 (NIST SP 811), to the figures shown.
    expect(lbf).toBeCloseTo(n / LBF_N, 3);
  });

  it("the report and the results record of an inch spec are in US units unless asked otherwise", () => {
    expect(reportHtml(INCH_TEXT, "boom.poise").html).toMatch(/takes [\d.]+ lbf/);
    expect(reportHtml(INCH_TEXT, "boom.poise", "si").html).toMatch(/takes [\d.]+ N\b/);
    const r = resultsOf(INCH_TEXT);
    expect(r.units).toBe("us");
    expect((r.json as { units: Record<string, string> }).units.force).toBe("lbf");
  });
});

describe("unit suggestions follow the spec's units", () => {
  it("a missing unit in an inch spec is offered inches, and the fix writes them", () => {
    const text = INCH_TEXT.replace("length 16 in", "length 16");
    const a = analyse(text);
    const f = a.findings.find(isCode("unit.missing"))!;
    expect(f.message).toContain("e.g. 16 in");
    const [fix] = modelFixes(text, a.tree, { code: f.code, span: f.span, data: f.data });
    expect(fix!.edits[0]!.newText).toBe(" in");
  });

  it("a missing unit in a millimetre spec is still offered millimetres", () => {
    const text = PENDULUM_TEXT.replace("length 400 mm", "length 400");
    const f = analyse(text).findings.find(isCode("unit.missing"))!;
    expect(f.message).toContain("e.g. 400 mm");
  });

  it("`2 lb` written where a force belongs is offered lbf", () => {
    const text = INCH_TEXT.replace("rate 3 lbf/in", "rate 3 lbf/in\n    initial_tension 2 lb");
    const a = analyse(text);
    const f = a.findings.find(isCode("unit.wrong-dimension"))!;
    expect(f, a.findings.map((x) => `${x.code}: ${x.message}`).join("\n")).toBeDefined();
    expect(f.message).toContain("2 lbf");
    expect(text.slice(f.span.start, f.span.end)).toBe("lb");
    const [fix] = modelFixes(text, a.tree, { code: f.code, span: f.span, data: f.data });
    expect(fix!.edits[0]!.newText).toBe("lbf");
    // Applied, it reads: the force is 2 lbf.
    const fixed = text.slice(0, f.span.start) + "lbf" + text.slice(f.span.end);
    expect(analyse(fixed).findings.filter((x) => x.code.startsWith("unit."))).toEqual([]);
  });
});

describe("poise sweep names its fixed units", () => {
  it("JSON under `units`, CSV in brackets after each column's path", () => {
    const sweep = analyse(PENDULUM_TEXT).sweep!;
    const table = sweepTable(sweep);
    expect(table.units).toEqual({ angle: "deg", length: "mm", force: "N", torque: "N*m" });
    const header = sweepCsv(table).split("\n")[0]!.split(",");
    expect(header).toEqual(
      expect.arrayContaining([
        "angles/shoulder [deg]",
        "bodies/boom/x [mm]",
        "bodies/boom/angle [deg]",
        "holding_torque/shoulder [N*m]",
        "hand_force/lamp [N]",
        "reactions/shoulder/y [N]",
        "springs/lift/length [mm]",
        "springs/lift/force [N]",
      ]),
    );
  });
});
