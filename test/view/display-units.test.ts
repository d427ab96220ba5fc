// Figures in the reader's unit system: the view model stays SI; the plots, tables and labels
// convert through units/format by the exact definitions.
import { describe, expect, it } from "vitest";
import { buildViewModel } from "../../server/src/view/build-view-model";
import { handForcePlot, torquePlot } from "../../server/src/view/plots";
import { poseSummaryHtml } from "../../server/src/view/tables";
import { renderArmSvg } from "../../server/src/view/draw-arm";
import { pendulumAnalysis } from "./pendulum-fixture";

// NIST SP 811 (appendix B): 1 lbf = 0.45359237 kg x 9.80665 m/s^2; 1 in = 0.0254 m.
const LBF_N = 0.45359237 * 9.80665;
const LBF_IN_NM = LBF_N * 0.0254;

describe("US customary display", () => {
  const si = buildViewModel(pendulumAnalysis());
  const us = buildViewModel(pendulumAnalysis(), { units: "us" });

  it("keeps the model's numbers in SI display units", () => {
    expect(us.poses).toEqual(si.poses);
  });

  it("plots torque in lbf*in and hand force in lbf, with the band converted", () => {
    const tSi = torquePlot(si, 0, 0).series.find((s) => s.name === "net")!.points;
    const tUs = torquePlot(us, 0, 0).series.find((s) => s.name === "net")!.points;
    tUs.forEach(([, y], i) => expect(y).toBeCloseTo(tSi[i]![1] / LBF_IN_NM, 6));
    const hand = handForcePlot(us, 0, 0);
    expect(hand.yLabel).toContain("lbf");
    // require balance defaults to 1 N (schema REQUIREMENT_DEFAULTS) in the fixture.
    expect(hand.band!.to).toBeCloseTo(1 / LBF_N, 9);
  });

  it("labels the tables, the payload and the scale bar in US units", () => {
    expect(poseSummaryHtml(us)).toContain("lbf·in");
    const svg = renderArmSvg(us, us.referencePose);
    // 1 kg = 1 / 0.45359237 lb = 2.205 lb.
    expect(svg).toContain("lamp 2.205 lb");
    expect(svg).toMatch(/>\d+(\.\d+)? in<\/text>/);
  });
});
