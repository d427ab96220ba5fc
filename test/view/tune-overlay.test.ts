// The tune run's overlay on the drawing (docs/tuning.md, "The preview"), from the core: the view
// model carries the search's own result (the tuned anchor, the tuned design's hand force at every
// pose) and the present design's anchor locus, each checked against the pivoting link's closed
// form with a zero-free-length spring (docs/formulas.md); the drawing, the hand-force plot and
// the report page show them, named in words.
import { describe, expect, it } from "vitest";
import { analyse } from "../../server/src/analysis";
import { tuneDesign } from "../../server/src/tune/index";
import { tunePreview } from "../../server/src/tune/preview";
import { buildViewModel, withTuneOverlay } from "../../server/src/view/index";
import { renderArmSvg } from "../../server/src/view/draw-arm";
import { handForcePlot } from "../../server/src/view/plots";
import { reportHtml } from "../../server/src/cli/report";

/** Standard gravity, m/s^2 (SI Brochure, 9th ed.; the language's default `gravity`). */
const G0 = 9.80665;
import { A, B, K, L, M, TUNED_PIVOT } from "./tuned-pivot";

/** Signed hand force of the pivoting link with a zero-free-length spring from a above the pivot
 * to b along the link: (m g l - k a b) cos(theta) / l, positive where it sinks (docs/formulas.md). */
const handForce = (a: number, theta: number) => ((M * G0 * L - K * a * B) * Math.cos(theta)) / L;

describe("tune overlay", () => {
  const before = analyse(TUNED_PIVOT);
  const run = tuneDesign(TUNED_PIVOT, { analyse, before });
  const preview = tunePreview(before, run)!;
  const vm = withTuneOverlay(buildViewModel(before), preview, "present");

  it("carries the search's tuned anchor and the tuned design's hand force at every pose", () => {
    expect(run.improved).toBe(true);
    const found = run.springs[0]!.values.filter((v) => v.what === "anchor");
    // x is fixed by the bounds (0 to 0): not a variable
    const x = found.find((v) => v.axis === "x")?.after ?? 0;
    const y = found.find((v) => v.axis === "y")!.after;
    const lift = vm.tune!.springs.find((s) => s.id === "lift")!;
    expect(lift.moved).toBe(true);
    expect(lift.other![0]).toEqual({ body: "post", local: [x, y] });
    // The best the bounds allow is their top: 40 mm above the pivot
    expect(y).toBeCloseTo(0.34, 9);
    vm.poses.forEach((pose, i) => {
      expect(vm.tune!.otherHandForce[i]!.weight).toBeCloseTo(handForce(y - 0.3, pose.angles[0]!), 3);
      // and the drawn design's own curve is the present one
      expect(pose.handForce.weight![0]).toBeCloseTo(handForce(A, pose.angles[0]!), 3);
    });
    expect(vm.tune!.worstBefore).toBeCloseTo(handForce(A, 0), 6);
    expect(vm.tune!.worstAfter).toBeCloseTo(handForce(0.04, 0), 6);
  });

  it("finds the present rate's exact anchor: k a b = m g l, straight above the pivot", () => {
    const locus = vm.tune!.locus.find((l) => l.spring === "lift")!;
    expect(locus.body).toBe("post");
    expect(locus.pivot).toEqual([0, 0.3]);
    expect(locus.exact.length).toBeGreaterThan(0);
    // Streit and Gilmore 1989; Herder 2001 (docs/formulas.md)
    for (const [px, py] of locus.exact) {
      expect(Math.abs(px)).toBeLessThan(1e-9);
      expect(Math.abs((K * (py - 0.3) * B) / (M * G0 * L) - 1)).toBeLessThan(1e-6);
    }
    // At the reference pose (theta = 0) the arm floats wherever k (B x A) = m g l: a = m g l / (k b)
    // at any x, the hook lying on the x axis
    for (const line of locus.atReference)
      for (const [, py] of line) expect((K * B * (py - 0.3)) / (M * G0 * L)).toBeCloseTo(1, 6);
  });

  it("draws the tuned spring dashed beside the present one, the locus, and names them", () => {
    const svg = renderArmSvg(vm, vm.referencePose);
    expect(svg).toContain(`class="tuned-spring" data-spring="lift"`);
    expect(svg).toMatch(/class="locus" data-spring="lift"/);
    expect(svg).toMatch(/class="locus-exact" data-spring="lift"/);
    expect(svg).toContain("lift as tuned: anchor");
    expect(svg).toContain("lift&#39;s anchor here balances every pose at its present rate");
    // The small drawings leave it out
    expect(renderArmSvg(vm, vm.referencePose, { tuneOverlay: false })).not.toContain("tuned-spring");
    // Without a run, nothing of it
    expect(renderArmSvg(buildViewModel(before), vm.referencePose)).not.toContain("tune");
  });

  it("plots the tuned design's hand force beside the present one", () => {
    const plot = handForcePlot(vm, 0, vm.referencePose);
    const names = plot.series.map((s) => s.name);
    expect(names).toEqual(["weight now", "weight as tuned"]);
    const tuned = plot.series[1]!;
    expect(tuned.points.length).toBe(vm.poses.length);
    for (const [deg, force] of tuned.points)
      expect(force).toBeCloseTo(handForce(0.04, (deg * Math.PI) / 180), 3);
  });

  it("says where no anchor balances every pose", () => {
    const text = TUNED_PIVOT.replace("zero_length", "extension").replace(
      `rate ${K / 1000} N/mm`,
      `rate ${K / 1000} N/mm\n    free_length 20 mm`,
    );
    const an = analyse(text);
    const r = tuneDesign(text, { analyse, before: an });
    expect(r.reason).toBeUndefined();
    const view = withTuneOverlay(buildViewModel(an), tunePreview(an, r)!, "present");
    expect(view.tune!.locus[0]!.exact).toEqual([]);
    expect(renderArmSvg(view, view.referencePose)).toContain(
      "no anchor place in reach balances every pose at lift&#39;s present rate",
    );
  });

  it("shows the run on the report page of a spec with tune lines", () => {
    const { html } = reportHtml(TUNED_PIVOT, "pivot.poise");
    expect(html).toContain(`class="note tune-note"`);
    expect(html).toContain("tuned-spring");
    expect(html).toContain("weight as tuned");
  });
});
