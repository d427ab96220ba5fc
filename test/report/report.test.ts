// `poise report`: the page renders with scripts switched off and nothing fetched, shows the
// drawing with the failing part marked, the plots, the tables, the limits and the cautions; the
// command's exit status follows docs/cli.md (0 no errors, 1 errors, 2 could not run).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync, readFileSync, existsSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { Page } from "playwright-core";
import { buildViewModel } from "../../server/src/view/build-view-model";
import { renderReportHtml } from "../../server/src/view/report-page";
import { MODEL_LIMITS, SAFETY_CAUTIONS } from "../../server/src/view/limits";
import { reportHtml, runReport } from "../../server/src/cli/report";
import { analyse } from "../../server/src/analysis";
import { ARTIFACTS, openBrowser, type Browser } from "../view/browser";
import { pendulumAnalysis } from "../view/pendulum-fixture";

const ORIGIN = "http://report.test";
const html = renderReportHtml(buildViewModel(pendulumAnalysis()), { file: "pendulum.poise" });
let browser: Browser;
let page: Page;

beforeAll(async () => {
  browser = await openBrowser(
    { [`${ORIGIN}/report.html`]: { body: html, contentType: "text/html" } },
    { javaScriptEnabled: false },
  );
  page = await browser.context.newPage();
  await page.goto(`${ORIGIN}/report.html`);
}, 60000);

afterAll(async () => {
  await browser?.close();
});

describe("report page", () => {
  it("is self-contained: no script, no external resource, nothing fetched", async () => {
    expect(html).not.toMatch(/<script/i);
    expect(html).not.toMatch(/\s(src|href)=/i);
    expect(browser.blocked).toEqual([]);
  });

  it("draws the arm with the failing part marked and both plots", async () => {
    expect(await page.locator("svg.arm-drawing").count()).toBeGreaterThanOrEqual(1);
    expect(await page.locator('.drawing [data-joint="shoulder"][data-status="error"]').count()).toBe(1);
    for (const s of ["gravity", "springs", "net"])
      expect(
        await page.locator(`svg[data-plot="torque-shoulder"] polyline[data-series="${s}"]`).count(),
      ).toBeGreaterThan(0);
    expect(await page.locator('svg[data-plot="hand-shoulder"] rect.band').count()).toBe(1);
    // The drawings at both ends of the range.
    expect(await page.locator(".ends figure").count()).toBe(2);
    await page.screenshot({ path: `${ARTIFACTS}/report-pendulum.png`, fullPage: true });
  });

  it("tabulates safety factors, diagnostics, the pose summary, limits and cautions", async () => {
    expect(await page.locator("table.safety tr.fail").count()).toBe(1);
    expect(await page.locator("ul.findings li.error").count()).toBe(2);
    expect(await page.locator("table.summary tbody tr").count()).toBeGreaterThan(2);
    expect(await page.locator("table.poses tbody tr").count()).toBeGreaterThan(5);
    const text = (await page.textContent("body"))!;
    for (const line of [...MODEL_LIMITS, ...SAFETY_CAUTIONS]) expect(text).toContain(line);
    expect(text).toMatch(/keep hands.*clear of the arm's swing/i);
    expect(text).toMatch(/reduced height/);
    expect(text).toMatch(/local codes/);
    expect(text).toMatch(/licensed/);
  });
});

describe("report of a sample through the whole pipeline", () => {
  it("marks the printed stage that fails and plots both degrees of freedom", async () => {
    const { html: magnifier, errors } = reportHtml(
      readFileSync("samples/magnifier-arm.poise", "utf8"),
      "samples/magnifier-arm.poise",
    );
    expect(errors).toBeGreaterThan(0);
    const other = await browser.context.newPage();
    await other.setContent(magnifier);
    expect(await other.locator('.drawing .flag[data-part="stage"][data-status="error"]').count()).toBe(1);
    expect(await other.locator(".drawing svg.arm-drawing").count()).toBe(1);
    for (const d of ["stage", "lens_tilt"])
      expect(
        await other.locator(`svg[data-plot="torque-${d}"] polyline[data-series="net"]`).count(),
      ).toBeGreaterThan(0);
    expect(await other.locator("table.safety tr.fail").count()).toBeGreaterThan(0);
    await other.screenshot({ path: `${ARTIFACTS}/report-magnifier-arm.png`, fullPage: true });
    await other.locator(".drawing").screenshot({ path: `${ARTIFACTS}/report-magnifier-arm-drawing.png` });
    await other.close();
    expect(browser.blocked).toEqual([]);
  });
});

describe("poise report command", () => {
  const dir = mkdtempSync(join(tmpdir(), "counterpoise-report-"));
  /** What the command writes to its streams (the tests read stderr). */
  const streams = () => {
    const err: string[] = [];
    return { out: () => undefined, err: (t: string) => void err.push(t), said: () => err.join("") };
  };
  const run = (args: string[]) => runReport(args, streams());

  it("writes US customary units on request", async () => {
    const out = join(dir, "camera-us.html");
    expect(run(["samples/camera-arm.poise", "--units", "us", "-o", out])).toBe(0);
    expect(readFileSync(out, "utf8")).toContain("lbf·in");
  });

  it("exits 2 when it cannot run", async () => {
    expect(run([])).toBe(2);
    expect(run(["--frobnicate", "samples/camera-arm.poise"])).toBe(2);
    const missing = streams();
    expect(runReport([join(dir, "no-such.poise")], missing)).toBe(2);
    expect(missing.said()).toContain("poise report: cannot read");
    expect(run(["samples/camera-arm.poise", "-o"])).toBe(2);
    expect(run(["samples/camera-arm.poise", "--units", "furlongs"])).toBe(2);
    const unwritable = streams();
    expect(
      runReport(["samples/camera-arm.poise", "-o", join(dir, "no-such-dir", "r.html")], unwritable),
    ).toBe(2);
    expect(unwritable.said()).toContain("poise report: cannot write");
  });

  it("shows deflection, tilt and frequency even when they pass (issue 10 item 8)", () => {
    // The lamp sample's stiffness passes: 1.15 mm against 2 mm, 15 Hz against 4 Hz.
    const { html: page } = reportHtml(readFileSync("samples/lamp-arm.poise", "utf8"), "lamp-arm.poise");
    const table = /<table class="figures">.*?<\/table>/s.exec(page)![0];
    for (const figure of ["hand force", "deflection", "tilt", "frequency", "tipping safety"])
      expect(table).toMatch(new RegExp(`<tr class="(ok|fail)"[^>]*><td>[^<]*</td><td>${figure}</td>`));
    expect(table).toMatch(
      /<tr class="ok"[^>]*><td>shade<\/td><td>deflection<\/td><td class="num">[\d.]+ mm<\/td><td>at most 2 mm/,
    );
    expect(table).toMatch(
      /<tr class="ok"><td>the arm<\/td><td>frequency<\/td><td class="num">[\d.]+ Hz<\/td><td>at least 4 Hz/,
    );
  });

  it("writes the page for every sample, exit 1 exactly when the spec has errors", async () => {
    for (const sample of ["camera-arm", "engraver-arm", "magnifier-arm", "mistakes"]) {
      const out = join(dir, `${sample}.html`);
      const file = `samples/${sample}.poise`;
      const code = run([file, "-o", out]);
      const errors = analyse(readFileSync(file, "utf8")).findings.filter(
        (f) => f.severity === "error",
      ).length;
      expect(code).toBe(errors > 0 ? 1 : 0);
      expect(existsSync(out)).toBe(true);
      const page = readFileSync(out, "utf8");
      expect(page).toContain("<!DOCTYPE html>");
      expect(page).toContain("Limits of the model");
    }
  });
});
