// Headless Chromium for the page tests: Debian's /usr/bin/chromium (CI must apt-get install
// chromium), a fresh profile per run, and every network request blocked except the in-memory
// files a test serves itself under a made-up origin.
import { chromium, type BrowserContext } from "playwright-core";
import { mkdtempSync, mkdirSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";

export const CHROMIUM = "/usr/bin/chromium";
export const ARTIFACTS = "test-artifacts";
const ARGS = [
  "--headless",
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
];

export interface Served {
  body: string | Buffer;
  contentType: string;
}

export interface Browser {
  context: BrowserContext;
  /** Every URL the pages asked for that was not served (and so was aborted). */
  blocked: string[];
  close(): Promise<void>;
}

/** `files` maps full URLs (e.g. http://preview.test/page.html) to what to answer. */
export async function openBrowser(
  files: Record<string, Served>,
  options: { javaScriptEnabled?: boolean } = {},
): Promise<Browser> {
  const profile = mkdtempSync(join(tmpdir(), "counterpoise-chromium-"));
  mkdirSync(ARTIFACTS, { recursive: true });
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    args: ARGS,
    javaScriptEnabled: options.javaScriptEnabled ?? true,
    viewport: { width: 900, height: 1400 },
    deviceScaleFactor: 1,
  });
  const blocked: string[] = [];
  await context.route("**/*", (route) => {
    const url = route.request().url();
    const file = files[url];
    if (file) return route.fulfill({ status: 200, body: file.body, contentType: file.contentType });
    blocked.push(url);
    return route.abort("blockedbyclient");
  });
  return {
    context,
    blocked,
    async close() {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}
