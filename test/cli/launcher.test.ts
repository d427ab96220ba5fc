// The `poise` launcher (bin/poise.js) runs the bundle with the code cache the build leaves beside
// it, and without it, or with a cache that does not fit, says the same: the cache changes speed,
// never results. Each case runs a copy of bin/ and dist/ in a temporary folder.
import { beforeAll, describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import {
  copyFileSync,
  existsSync,
  mkdirSync,
  mkdtempSync,
  readFileSync,
  rmSync,
  writeFileSync,
} from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { ensureBuilt, ROOT } from "./run-cli";

const SAMPLE = join(ROOT, "samples", "engraver-arm.poise");

/** A copy of the launcher and the bundle (with the build's cache), to spoil without touching dist/. */
function copyOfCommand(): { launcher: string; cache: string } {
  const dir = mkdtempSync(join(tmpdir(), "poise-launcher-"));
  mkdirSync(join(dir, "bin"));
  mkdirSync(join(dir, "dist"));
  copyFileSync(join(ROOT, "bin", "poise.js"), join(dir, "bin", "poise.js"));
  copyFileSync(join(ROOT, "dist", "cli.js"), join(dir, "dist", "cli.js"));
  copyFileSync(join(ROOT, "dist", "cli.code-cache"), join(dir, "dist", "cli.code-cache"));
  return { launcher: join(dir, "bin", "poise.js"), cache: join(dir, "dist", "cli.code-cache") };
}

function check(launcher: string): { status: number | null; stdout: string; cacheSays: string } {
  const r = spawnSync(process.execPath, [launcher, "check", SAMPLE], {
    encoding: "utf8",
    env: { ...process.env, POISE_CODE_CACHE: "report" },
    timeout: 60_000,
  });
  return { status: r.status, stdout: r.stdout, cacheSays: r.stderr.trim() };
}

/** The launcher at `launcher` says what the bundle says without it, and this of its cache. */
function expectSameCheckSaying(launcher: string, cacheSays: string): void {
  const run = check(launcher);
  expect(run.cacheSays).toBe(cacheSays);
  expect(run.stdout).toBe(checkWithoutLauncher());
}

/** What the bundle says run directly by Node, with no launcher and no cache. */
function checkWithoutLauncher(): string {
  return spawnSync(process.execPath, [join(ROOT, "dist", "cli.js"), "check", SAMPLE], { encoding: "utf8" })
    .stdout;
}

beforeAll(() => ensureBuilt());

describe("the poise launcher's code cache", () => {
  it("is built beside the bundle and used", () => {
    expect(existsSync(join(ROOT, "dist", "cli.code-cache"))).toBe(true);
    const run = check(join(ROOT, "bin", "poise.js"));
    expect(run.cacheSays).toBe("poise: code cache used");
    expect(run.status).toBe(1); // the engraver sample has an error (its too-strong cable)
    expect(run.stdout).toBe(checkWithoutLauncher());
  });

  it("is left alone when it was built for another bundle", () => {
    const { launcher, cache } = copyOfCommand();
    const bytes = readFileSync(cache);
    bytes.write("0".repeat(64), 0, "latin1"); // another bundle's id
    writeFileSync(cache, bytes);
    expectSameCheckSaying(launcher, "poise: code cache not used: built for another bundle");
  });

  it("is left alone when V8 refuses it", () => {
    const { launcher, cache } = copyOfCommand();
    const bytes = readFileSync(cache);
    // Spoil V8's own header and checksum region, after the bundle id.
    for (let i = 64; i < 160; i++) bytes[i] = bytes[i]! ^ 0xff;
    writeFileSync(cache, bytes);
    expectSameCheckSaying(launcher, "poise: code cache refused by V8");
  });

  it("is not needed", () => {
    const { launcher, cache } = copyOfCommand();
    rmSync(cache);
    expectSameCheckSaying(launcher, "poise: code cache not used: none beside the bundle");
  });
});
