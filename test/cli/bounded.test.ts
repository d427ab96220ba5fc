// Bounded work in the `poise` command (issue 16; docs/robustness.md, "Limits"): inputs a slip of
// the keyboard or a generator script can produce end in bounded time and memory with a finding
// that names the limit, where they used to run for minutes, without end, or out of memory. The
// test timeout is the hang detector; no time is asserted (speed targets live in the benchmark).
import { beforeAll, describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { readFileSync, statSync, symlinkSync, writeFileSync } from "node:fs";
import { basename, dirname, join } from "node:path";
import { ensureBuilt, poise, ROOT, specFile, type CliResult } from "./run-cli";
import { boomSpec, linkChainSpec, unconnectedLinksSpec } from "../fuzz/shapes";
import { MAX_SOLVED_BODIES, MAX_SPEC_CHARS } from "../../server/src/limits";

beforeAll(() => ensureBuilt());

const LINE = /^(.+):(\d+):(\d+): (error|warning|information|hint) ([a-z]+\.[a-z-]+): (.+)$/;

function findings(
  r: CliResult,
): { line: number; column: number; severity: string; code: string; message: string }[] {
  return r.stdout
    .split("\n")
    .map((l) => LINE.exec(l))
    .filter((m): m is RegExpExecArray => m !== null)
    .map((m) => ({ line: +m[2]!, column: +m[3]!, severity: m[4]!, code: m[5]!, message: m[6]! }));
}

/** 1-based line and column of the first `needle` in `text`. */
function where(text: string, needle: string): { line: number; column: number } {
  const at = text.indexOf(needle);
  const before = text.slice(0, at);
  return { line: before.split("\n").length, column: at - before.lastIndexOf("\n") };
}

/** The command under a small heap, as a machine with little memory would run it. */
function poiseInHeap(heapMb: number, ...args: string[]): CliResult {
  const r = spawnSync(
    process.execPath,
    [`--max-old-space-size=${heapMb}`, join(ROOT, "bin", "poise.js"), ...args],
    {
      cwd: ROOT,
      encoding: "utf8",
      timeout: 120_000,
      maxBuffer: 64 * 1024 * 1024,
    },
  );
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

describe("angles past a turn (issue 16, 1)", () => {
  it("refuses `angle 1e9 deg` at the value instead of walking to it for minutes", () => {
    const text = boomSpec("1e9 deg", "-30 deg .. 40 deg");
    const r = poise("check", specFile("huge-angle.poise", text));
    expect(r.status).toBe(1);
    const f = findings(r).find((x) => x.code === "value.impossible");
    expect(f).toMatchObject({ ...where(text, "1e9 deg"), severity: "error" });
    expect(f!.message).toContain("-360 deg .. 360 deg");
  }, 60_000);

  it("refuses a range end of 1e14 deg in check, sweep and report alike", () => {
    const text = boomSpec("0 deg", "-30 deg .. 1e14 deg");
    const file = specFile("huge-range.poise", text);
    for (const command of ["check", "sweep", "report"]) {
      const r = poise(command, file);
      expect(r.status, `${command}: ${r.stderr}`).toBe(1);
    }
    expect(findings(poise("check", file))).toContainEqual(
      expect.objectContaining({ ...where(text, "1e14 deg"), code: "value.impossible" }),
    );
  }, 120_000);

  it("still sweeps a range of a full turn either way", () => {
    const r = poise("sweep", specFile("full-turn.poise", boomSpec("0 deg", "-360 deg .. 360 deg")));
    const table = JSON.parse(r.stdout) as { poses: { angles: { shoulder: number } }[] };
    const angles = table.poses.map((p) => p.angles.shoulder);
    expect(Math.min(...angles)).toBe(-360);
    expect(Math.max(...angles)).toBe(360);
  }, 60_000);
});

describe("ten thousand unconnected links (issue 16, 2)", () => {
  it("are checked in a 256 MB heap (the clearance pairs no longer grow with the square)", () => {
    const r = poiseInHeap(256, "check", specFile("unconnected.poise", unconnectedLinksSpec(10_000)));
    expect(r.stderr).not.toMatch(/heap|allocation failed/i);
    expect(r.status).toBe(0);
    expect(findings(r).filter((f) => f.code === "body.unconnected")).toHaveLength(10_000);
  }, 120_000);
});

describe("a long fixed chain (issue 16, 3 and 4)", () => {
  it("is solved up to the body limit, with a finding on the first body left out", () => {
    const text = linkChainSpec(2000);
    const r = poiseInHeap(512, "check", specFile("long-chain.poise", text));
    expect(r.status).toBe(1);
    const all = findings(r);
    const limit = all.filter((f) => f.code === "analysis.limit");
    expect(limit).toHaveLength(1);
    // The first body past the limit is the link declared as l200 (l0 is the first).
    expect(limit[0]).toMatchObject(where(text, `l${MAX_SOLVED_BODIES} {`));
    expect(limit[0]!.message).toContain(`${MAX_SOLVED_BODIES}`);
    // ... and the part that fits is checked: the links nearest the base carry the whole chain.
    expect(all.some((f) => f.code === "strength.overstress" && f.line < where(text, "l1 {").line)).toBe(true);
  }, 120_000);

  it("sweeps the bodies that fit", () => {
    const r = poiseInHeap(512, "sweep", specFile("long-chain.poise", linkChainSpec(2000)));
    const table = JSON.parse(r.stdout) as { poses: { bodies: Record<string, unknown> }[] };
    expect(table.poses).toHaveLength(1);
    // the base and the moving bodies the solver takes
    expect(Object.keys(table.poses[0]!.bodies)).toHaveLength(1 + MAX_SOLVED_BODIES);
  }, 120_000);
});

describe("the report of a grid of many degrees of freedom (issue 16, 8)", () => {
  it("draws a thinned set of poses: a page of a few megabytes, not ninety", () => {
    const dir = specFile("dofs.poise", linkChainSpec(12, 12));
    const out = dir.replace(/dofs\.poise$/, "dofs.html");
    const r = poiseInHeap(384, "report", dir, "-o", out);
    expect(r.status, r.stderr).toBe(1); // the chain cannot be balanced by hand force alone
    const size = statSync(out).size;
    // The page's bound (docs/robustness.md): 2,500 poses and 200 payload paths at most.
    expect(size).toBeLessThan(8 * 1024 * 1024);
    expect(readFileSync(out, "utf8")).toContain("<svg");
  }, 120_000);
});

describe("output never replaces a spec (issue 16, 9)", () => {
  it("refuses to write the report over the spec it reads, by any path to it", () => {
    const file = specFile("s.poise", boomSpec("0 deg", "-30 deg .. 40 deg"));
    const before = readFileSync(file, "utf8");
    for (const target of [
      file,
      join(dirname(file), ".", "s.poise"),
      join(dirname(file), "..", basename(dirname(file)), "s.poise"),
    ]) {
      const r = poise("report", file, "-o", target);
      expect(r.status).toBe(2);
      expect(r.stderr).toContain("will not write the page over");
    }
    const link = join(dirname(file), "link.html");
    symlinkSync(file, link);
    expect(poise("report", file, "-o", link).status).toBe(2);
    expect(readFileSync(file, "utf8")).toBe(before);
  }, 60_000);

  it("refuses to write it over another spec, and writes an .html beside them", () => {
    const file = specFile("s.poise", boomSpec("0 deg", "-30 deg .. 40 deg"));
    const other = join(dirname(file), "other.poise");
    writeFileSync(other, "# another spec\n");
    expect(poise("report", file, "-o", other).status).toBe(2);
    expect(readFileSync(other, "utf8")).toBe("# another spec\n");
    const page = join(dirname(file), "s.html");
    expect(poise("report", file, "-o", page).status).toBe(1); // written; the boom alone is unbalanced
    expect(readFileSync(page, "utf8")).toMatch(/^<!DOCTYPE html>/i);
  }, 60_000);
});

describe("inputs past the size limit (issue 16, 10)", () => {
  it("refuses /dev/zero after reading one byte past 1 MiB", () => {
    const r = poiseInHeap(128, "check", "/dev/zero");
    expect(r.status).toBe(2);
    expect(r.stderr).toContain(`larger than ${MAX_SPEC_CHARS.toLocaleString("en-US")} bytes`);
  }, 60_000);

  it("reads a spec of exactly 1 MiB and refuses one byte more, in every command", () => {
    const fits = specFile(
      "fits.poise",
      `${boomSpec("0 deg", "-30 deg .. 40 deg")}`.padEnd(MAX_SPEC_CHARS, " "),
    );
    const read = poise("check", fits);
    expect(read.status).toBe(1);
    expect(read.stdout).toContain("balance.unbalanced"); // read and analysed: nothing holds the boom up
    const over = specFile("over.poise", " ".repeat(MAX_SPEC_CHARS + 1));
    for (const command of ["check", "sweep", "report"]) {
      const r = poise(command, over);
      expect(r.status, command).toBe(2);
      expect(r.stderr).toContain("the limit for one spec");
    }
  }, 120_000);
});
