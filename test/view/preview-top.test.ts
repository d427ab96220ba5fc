// The preview of an arm that turns, in headless Chromium: the top view under the side view and a
// heading slider per swivel that turns the payload about the swivel's axis in it.
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { analyse } from "../../server/src/analysis";
import { buildViewModel } from "../../server/src/view/build-view-model";
import { ARTIFACTS, type Browser } from "./browser";
import { openPreview } from "./preview-harness";

const text = readFileSync(new URL("../../samples/two-stage-arm.poise", import.meta.url), "utf8");
const vm = buildViewModel({ ...analyse(text), text });
let browser: Browser;
let page: Page;

beforeAll(async () => {
  const preview = await openPreview();
  browser = preview.browser;
  page = preview.page;
  await preview.show(vm, "file:///work/two-stage-arm.poise");
  await page.waitForSelector("svg.top-view");
}, 60000);

afterAll(async () => {
  await browser?.close();
});

const tool = () => page.locator('svg.top-view circle[data-part="tool"]');

describe("preview of an arm that turns", () => {
  it("turns the outer stage in the top view from the barrel's heading slider", async () => {
    const slider = page.locator("#heading-barrel");
    expect(await slider.count()).toBe(1);
    const x0 = Number(await tool().getAttribute("cx"));
    const z0 = Number(await tool().getAttribute("cy"));
    expect(z0).toBeCloseTo(0, 6);
    await slider.fill("90");
    const x1 = Number(await tool().getAttribute("cx"));
    const z1 = Number(await tool().getAttribute("cy"));
    // a quarter turn about the barrel's axis: the tool's lever from the axis now points away from
    // the reader (up in the top view), as long as before
    const barrel = vm.swivels!.find((s) => s.id === "barrel")!;
    const axisX = Number(await page.locator('svg.top-view circle[data-part="barrel"]').getAttribute("cx"));
    expect(x1).toBeCloseTo(axisX, 1);
    expect(-z1).toBeCloseTo(x0 - axisX, 1);
    expect(barrel.heading[1]).toBeGreaterThan(Math.PI / 2);
    await page.screenshot({ path: `${ARTIFACTS}/preview-two-stage-top.png`, fullPage: true });
  });

  it("keeps the headings in the panel's saved state, and a panel shown again turns to them", async () => {
    await page.locator("#heading-barrel").fill("60");
    const state = (await page.evaluate("window.__state")) as { headings?: Record<string, number> };
    // 60 deg in radians, the SI angle (SI Brochure, 9th ed., table 4)
    expect(state.headings?.["barrel"]).toBeCloseTo((60 * Math.PI) / 180, 9);
    const turned = { cx: await tool().getAttribute("cx"), cy: await tool().getAttribute("cy") };
    // the editor rebuilds a hidden panel's page (and a reloaded window's) from that state
    const again = await openPreview(state);
    try {
      await again.show(vm, "file:///work/two-stage-arm.poise");
      await again.page.waitForSelector("svg.top-view");
      expect(await again.page.locator("#heading-barrel").inputValue()).toBe("60");
      const t = again.page.locator('svg.top-view circle[data-part="tool"]');
      expect(await t.getAttribute("cx")).toBe(turned.cx);
      expect(await t.getAttribute("cy")).toBe(turned.cy);
    } finally {
      await again.browser.close();
    }
  });
});
