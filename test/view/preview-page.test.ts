// The preview webview page in headless Chromium, outside the editor: the real HTML shell with its
// content-security policy, the real bundled page script, a stand-in for the editor's webview API,
// and a hand-built analysis (test/view/pendulum-fixture.ts). Screenshots go to test-artifacts/.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { buildViewModel } from "../../server/src/view/build-view-model";
import type { ViewModel } from "../../server/src/view/view-model";
import { ARTIFACTS, type Browser } from "./browser";
import { openPreview } from "./preview-harness";
import { pendulumAnalysis } from "./pendulum-fixture";

let browser: Browser;
let page: Page;
const vm: ViewModel = buildViewModel(pendulumAnalysis());

beforeAll(async () => {
  const preview = await openPreview();
  browser = preview.browser;
  page = preview.page;
  await preview.show(vm, "file:///work/pendulum.poise");
  await page.waitForSelector("svg.arm-drawing");
}, 60000);

afterAll(async () => {
  await browser?.close();
});

const boomPoints = () => page.getAttribute('[data-body="boom"] polyline.centre', "points");

describe("preview page", () => {
  it("draws the arm with the failing pivot marked and names the trouble", async () => {
    expect(await page.textContent("#title")).toBe("Test pendulum");
    expect(await page.locator('[data-joint="shoulder"][data-status="error"]').count()).toBe(1);
    expect(await page.locator('.flag[data-part="shoulder"]').count()).toBe(1);
    expect(await page.locator('[data-spring="lift"][data-kind="zero_length"]').count()).toBe(1);
    expect(await page.locator('g.payload[data-payload="lamp"]').count()).toBe(1);
    await page.screenshot({ path: `${ARTIFACTS}/preview-pendulum.png`, fullPage: true });
  });

  it("poses the drawing from the slider: the boom's coordinates change", async () => {
    const before = await boomPoints();
    const slider = page.locator('input[data-dof="shoulder"]');
    await slider.fill(String(vm.dofs[0]!.values.length - 1));
    const after = await boomPoints();
    expect(after).not.toBe(before);
    expect(await page.textContent("#dof-0-value")).toBe("60.0°");
    // The boom's far end at 60 deg: (l cos 60, -(y0 + l sin 60)) in SVG coordinates (y down).
    const [, end] = after!.split(" ");
    const [x, y] = end!.split(",").map(Number);
    expect(x).toBeCloseTo(400 * Math.cos(Math.PI / 3), 1);
    expect(y).toBeCloseTo(-(300 + 400 * Math.sin(Math.PI / 3)), 1);
    // The plots' marker follows the pose.
    const marker = await page.getAttribute('svg[data-plot="torque-shoulder"] line.marker', "x1");
    await slider.fill("0");
    expect(await page.getAttribute('svg[data-plot="torque-shoulder"] line.marker', "x1")).not.toBe(marker);
    await page.screenshot({ path: `${ARTIFACTS}/preview-pendulum-low.png`, fullPage: true });
  });

  it("plots gravity, spring and net torque and the hand force with its band", async () => {
    for (const s of ["gravity", "springs", "net"])
      expect(
        await page.locator(`svg[data-plot="torque-shoulder"] polyline[data-series="${s}"]`).count(),
      ).toBeGreaterThan(0);
    expect(await page.locator('svg[data-plot="hand-shoulder"] polyline[data-series="lamp"]').count()).toBe(1);
    expect(await page.locator('svg[data-plot="hand-shoulder"] rect.band').count()).toBe(1);
    const points = (await page.getAttribute(
      'svg[data-plot="torque-shoulder"] polyline[data-series="net"]',
      "points",
    ))!.split(" ");
    expect(points.length).toBe(vm.poses.length);
  });

  it("lists every safety factor, the failing one marked", async () => {
    expect(await page.locator("table.safety tbody tr").count()).toBe(2);
    expect(await page.locator('table.safety tr.fail[data-part="shoulder"]').count()).toBe(1);
  });

  it("asks the editor to reveal a part's declaration when it is clicked", async () => {
    await page.click('g.payload[data-payload="lamp"] circle');
    const sent = (await page.evaluate("window.__sent.filter((m) => m.type === 'reveal')")) as {
      partId?: string;
      range?: unknown;
    }[];
    expect(sent.at(-1)?.partId).toBe("lamp");
    expect(sent.at(-1)?.range).toEqual(vm.parts.find((p) => p.id === "lamp")!.range);
  });

  it("reveals a diagnostic's own words when it is clicked in the list", async () => {
    await page.click('ul.findings li[data-finding="1"]');
    const sent = (await page.evaluate("window.__sent.filter((m) => m.type === 'reveal')")) as {
      range?: unknown;
    }[];
    expect(sent.at(-1)?.range).toEqual(vm.findings[1]!.range);
  });

  it("shows the model's limits and the safety cautions", async () => {
    const limits = (await page.textContent("#limits"))!;
    expect(limits).toContain("No fatigue life");
    const cautions = (await page.textContent("#cautions"))!;
    expect(cautions).toMatch(/clear of the arm's swing/);
    expect(cautions).toMatch(/reduced height/);
  });

  it("runs under its content-security policy and fetches nothing else", async () => {
    expect(await page.evaluate("window.__violations")).toEqual([]);
    expect(browser.blocked).toEqual([]);
  });
});
