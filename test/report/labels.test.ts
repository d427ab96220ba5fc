// The labels of every drawing and plot in every sample's report, measured in a real browser
// (Chromium lays the text out with its own fonts, not the estimate the drawing code uses): no two
// text boxes of one figure intersect, and none leaves its figure. The drawing's flags name the
// trouble in words, never a rule code; the reference pose is drawn at the written angles.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readdirSync, readFileSync } from "node:fs";
import type { Page } from "playwright-core";
import { labelClashes } from "../view/label-clashes";
import { analyse } from "../../server/src/analysis";
import { buildViewModel } from "../../server/src/view/build-view-model";
import { renderReportHtml } from "../../server/src/view/report-page";
import { CODES } from "../../server/src/findings/codes";
import { ARTIFACTS, openBrowser, type Browser } from "../view/browser";
import { reportHtml } from "../../server/src/cli/report";
import { TUNED_PIVOT } from "../view/tuned-pivot";

const ORIGIN = "http://labels.test";
const SAMPLES = readdirSync("samples")
  .filter((f) => f.endsWith(".poise"))
  .map((f) => f.replace(/\.poise$/, ""));
const pages: Record<string, string> = {};
for (const name of SAMPLES) {
  const analysis = analyse(readFileSync(`samples/${name}.poise`, "utf8"));
  for (const units of ["si", "us"] as const)
    pages[`${name}-${units}`] = renderReportHtml(buildViewModel(analysis, { units }), {
      file: `samples/${name}.poise`,
    });
}

// A spec with `tune` lines: the page lays the search's design over the drawing, with its legend
// and labels, and the tuned curves on the plots.
for (const units of ["si", "us"] as const)
  pages[`tuned-pivot-${units}`] = reportHtml(TUNED_PIVOT, "tuned-pivot.poise", units).html;

let browser: Browser;
let page: Page;

beforeAll(async () => {
  browser = await openBrowser(
    Object.fromEntries(
      Object.entries(pages).map(([k, body]) => [`${ORIGIN}/${k}.html`, { body, contentType: "text/html" }]),
    ),
    { javaScriptEnabled: true },
  );
  page = await browser.context.newPage();
}, 60000);

afterAll(async () => {
  await browser?.close();
});

describe("report labels, measured in the browser", () => {
  for (const key of Object.keys(pages)) {
    it(`${key}: no label overlaps another or leaves its figure`, async () => {
      await page.goto(`${ORIGIN}/${key}.html`);
      expect(await page.locator("svg").count()).toBeGreaterThan(0);
      expect(await labelClashes(page)).toEqual([]);
      if (key.endsWith("-si"))
        await page.screenshot({ path: `${ARTIFACTS}/labels-${key}.png`, fullPage: true });
    });
  }

  it("flags name the trouble in words, never a rule code", async () => {
    await page.goto(`${ORIGIN}/lamp-arm-si.html`);
    const flags = await page.locator("svg.arm-drawing .flag-label").allTextContents();
    expect(flags.length).toBeGreaterThan(0);
    for (const flag of flags) for (const code of Object.keys(CODES)) expect(flag).not.toContain(code);
    const words = Object.values(CODES).map((c) => c.words);
    for (const flag of flags)
      expect(
        words.some((w) => flag.includes(w)),
        flag,
      ).toBe(true);
  });
});
