// Bad input never breaks the drawing or the report: every cut of every sample (a half-typed spec)
// analyses, builds a view model, draws every pose and renders a report without throwing.
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { analyse } from "../../server/src/analysis";
import { buildViewModel } from "../../server/src/view/build-view-model";
import { renderReportHtml } from "../../server/src/view/report-page";
import { renderArmSvg } from "../../server/src/view/draw-arm";

/** Cuts per sample: spread over the text, enough to land inside every kind of declaration. */
const CUTS = 12;
/** A coarse sweep keeps 48 analyses inside a few seconds; the view does not care how fine. */
const STEPS = 5;

describe("view and report on half-typed specs", () => {
  for (const name of ["camera-arm", "engraver-arm", "magnifier-arm", "mistakes"]) {
    it(`every cut of ${name}`, () => {
      const text = readFileSync(`samples/${name}.poise`, "utf8");
      for (let i = 1; i <= CUTS; i++) {
        const cut = text.slice(0, Math.round((text.length * i) / CUTS));
        const vm = buildViewModel(analyse(cut, { stepsOverride: STEPS }));
        for (let p = 0; p < Math.max(1, vm.poses.length); p++)
          expect(renderArmSvg(vm, p)).toMatch(/^<svg[\s\S]*<\/svg>$/);
        const html = renderReportHtml(vm, { file: `${name}.poise` });
        expect(html).toContain("</html>");
        // Whatever the text, the JSON the panel is sent survives a round trip.
        expect(JSON.parse(JSON.stringify(vm)).version).toBe(2);
      }
    });
  }
});
