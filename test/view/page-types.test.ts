// The webview script is outside the root type-check (it needs the browser's DOM types): check it
// with its own tsconfig here, so `npm test` catches a type error in it.
import { describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { join } from "node:path";

describe("webview script types", () => {
  it("client/media type-checks against the DOM library", () => {
    const tsc = join("node_modules", "typescript", "bin", "tsc");
    const r = spawnSync(process.execPath, [tsc, "-p", join("client", "media", "tsconfig.json"), "--noEmit"], {
      encoding: "utf8",
    });
    expect(r.stdout + r.stderr).toBe("");
    expect(r.status).toBe(0);
  }, 120000);
});
