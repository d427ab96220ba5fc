// The preview page on the samples through the whole pipeline (analyse → view model → page):
// every sample draws, a grid of two degrees of freedom gets two sliders that each pose their own
// stage, failing parts are marked. Screenshots of each go to test-artifacts/.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { analyse } from "../../server/src/analysis";
import { buildViewModel } from "../../server/src/view/build-view-model";
import type { ViewModel } from "../../server/src/view/view-model";
import { ARTIFACTS } from "./browser";
import { openPreview, type Preview } from "./preview-harness";
import { labelClashes } from "./label-clashes";

const viewOf = (name: string): ViewModel =>
  buildViewModel(analyse(readFileSync(`samples/${name}.poise`, "utf8")));
let preview: Preview;

beforeAll(async () => {
  preview = await openPreview();
}, 60000);

afterAll(async () => {
  await preview?.browser.close();
});

describe("preview of the samples", () => {
  for (const name of ["camera-arm", "engraver-arm", "magnifier-arm", "mistakes"]) {
    it(`shows ${name}`, async () => {
      const vm = viewOf(name);
      await preview.show(vm, `file:///work/${name}.poise`);
      const { page } = preview;
      expect(await page.locator("svg.arm-drawing").count()).toBe(1);
      expect(await page.locator("#sliders input[type=range]").count()).toBe(vm.dofs.length);
      expect(await page.locator("ul.findings li").count()).toBe(vm.findings.length);
      // The figures over the range (deflection, tilt, frequency...) show whether they pass or not.
      if (vm.results) expect(await page.locator("table.figures tbody tr").count()).toBeGreaterThan(0);
      // Every part the findings mark as failing is marked in the drawing, if it is drawn at all.
      for (const part of vm.parts.filter((p) => p.status === "error" && vm.poses.length)) {
        expect(
          await page.locator(`svg.arm-drawing .flag[data-part="${part.id}"][data-status="error"]`).count(),
          part.id,
        ).toBe(1);
      }
      // The drawing's and the plots' labels, as Chromium lays them out: none on another, none cut.
      expect(await labelClashes(page)).toEqual([]);
      await page.screenshot({ path: `${ARTIFACTS}/preview-${name}.png`, fullPage: true });
    });
  }

  it("poses each stage of a two-stage arm with its own slider", async () => {
    const vm = viewOf("engraver-arm");
    expect(vm.dofs.map((d) => d.id)).toEqual(["inner", "outer"]);
    await preview.show(vm, "file:///work/engraver-arm.poise");
    const { page } = preview;
    const inner = () => page.getAttribute('[data-body="inner.lower"] polyline.centre', "points");
    const outer = () => page.getAttribute('[data-body="outer.lower"] polyline.centre', "points");
    const [inner0, outer0] = [await inner(), await outer()];
    await page.locator('input[data-dof="outer"]').fill("0");
    // Moving the outer stage leaves the inner bars where they were.
    expect(await inner()).toBe(inner0);
    expect(await outer()).not.toBe(outer0);
    const outer1 = await outer();
    await page.locator('input[data-dof="inner"]').fill("0");
    // Moving the inner stage carries the outer one with it.
    expect(await inner()).not.toBe(inner0);
    expect(await outer()).not.toBe(outer1);
    // The plots against each dof are there.
    for (const d of ["inner", "outer"])
      expect(
        await page.locator(`svg[data-plot="torque-${d}"] polyline[data-series="net"]`).count(),
      ).toBeGreaterThan(0);
    await page.screenshot({ path: `${ARTIFACTS}/preview-engraver-arm-posed.png`, fullPage: true });
    expect(await page.evaluate("window.__violations")).toEqual([]);
    expect(preview.browser.blocked).toEqual([]);
  });
});
