// Opens the real preview page (HTML shell, bundled page script, style sheet) in headless Chromium
// with a stand-in for the editor's webview API, and posts view models to it.
import { build } from "esbuild";
import { readFileSync } from "node:fs";
import type { Page } from "playwright-core";
import { previewHtml } from "../../client/src/preview-html";
import type { ViewModel } from "../../server/src/view/view-model";
import { openBrowser, type Browser } from "./browser";

const ORIGIN = "http://preview.test";
const NONCE = "testnonce0123456789abcdefghijklmn";

async function pageScript(): Promise<string> {
  const out = await build({
    entryPoints: ["client/media/preview-page.ts"],
    bundle: true,
    write: false,
    platform: "browser",
    format: "iife",
    target: "es2020",
    logLevel: "silent",
  });
  return out.outputFiles[0]!.text;
}

export interface Preview {
  browser: Browser;
  page: Page;
  show(vm: ViewModel, uri?: string): Promise<void>;
}

/** `state`: what the webview's getState returns at first, as the editor keeps it for a panel
 * hidden and shown again or restored after a reload; setState replaces it (`window.__state`). */
export async function openPreview(state?: unknown): Promise<Preview> {
  const html = previewHtml({
    cspSource: ORIGIN,
    nonce: NONCE,
    scriptUri: `${ORIGIN}/dist/preview-page.js`,
    styleUri: `${ORIGIN}/media/preview.css`,
  });
  const browser = await openBrowser({
    [`${ORIGIN}/index.html`]: { body: html, contentType: "text/html" },
    [`${ORIGIN}/dist/preview-page.js`]: { body: await pageScript(), contentType: "text/javascript" },
    [`${ORIGIN}/media/preview.css`]: {
      body: readFileSync("client/media/preview.css"),
      contentType: "text/css",
    },
  });
  const page = await browser.context.newPage();
  // Runs in the page (as text: the test's own type-check has no DOM library).
  await page.addInitScript({
    content: `
      window.__sent = [];
      window.__violations = [];
      document.addEventListener("securitypolicyviolation", (e) => window.__violations.push(e.violatedDirective + " " + e.blockedURI));
      window.__state = ${JSON.stringify(state ?? null)} ?? undefined;
      window.acquireVsCodeApi = () => ({ postMessage: (m) => window.__sent.push(m), getState: () => window.__state, setState: (s) => { window.__state = s; } });`,
  });
  await page.goto(`${ORIGIN}/index.html`);
  await page.waitForFunction("window.__sent.some((m) => m.type === 'ready')");
  return {
    browser,
    page,
    async show(vm, uri = "file:///work/arm.poise") {
      await page.evaluate(
        `window.postMessage({ type: "view", model: ${JSON.stringify(vm)}, uri: ${JSON.stringify(uri)} }, "*")`,
      );
      await page.waitForFunction(
        `document.getElementById("title").textContent === ${JSON.stringify(vm.title)}`,
      );
    },
  };
}
