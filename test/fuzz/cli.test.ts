// The `poise` command on fuzzed files: `check --json` and `sweep --json` exit 0 or 1 (never 2 on
// a file that exists, never a crash), print one JSON document, and every position lies in the file.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import fc from "fast-check";
import { existsSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { spawnSync } from "node:child_process";
import { familyArbitrary, type FamilyName } from "./campaign";
import { protocolLines } from "./lsp-client";

const root = join(__dirname, "..", "..");
const cli = join(root, "dist", "cli.js");
/** The command as a user runs it: the launcher over the bundle (bin/poise.js). */
const poise = join(root, "bin", "poise.js");
/** Files per family: each run of the command analyses them all at once. */
const PER_FAMILY = 12;

const samples = readdirSync(join(root, "samples"))
  .filter((f) => f.endsWith(".poise"))
  .map((f) => readFileSync(join(root, "samples", f), "utf8"));

let dir: string;
const files: { path: string; text: string }[] = [];

beforeAll(() => {
  if (!existsSync(cli)) {
    const r = spawnSync(process.execPath, [join(root, "scripts", "build.mjs")], {
      cwd: root,
      encoding: "utf8",
    });
    if (r.status !== 0) throw new Error(`build failed: ${r.stderr}`);
  }
  dir = mkdtempSync(join(tmpdir(), "poise-cli-fuzz-"));
  const families: FamilyName[] = ["valid", "nearly-valid", "byte-mutant", "junk"];
  families.forEach((family, i) => {
    fc.sample(familyArbitrary(family, samples), { seed: 777 + i, numRuns: PER_FAMILY }).forEach((text, k) => {
      const path = join(dir, `${family}-${k}.poise`);
      writeFileSync(path, text);
      files.push({ path, text });
    });
  });
}, 60_000);

afterAll(() => {
  if (dir) rmSync(dir, { recursive: true, force: true });
});

describe("poise on fuzzed files", () => {
  it("check --json: exit 0 or 1, one JSON array, every line and column inside its file", () => {
    const run = spawnSync(process.execPath, [poise, "check", "--json", ...files.map((f) => f.path)], {
      encoding: "utf8",
      timeout: 120_000,
      maxBuffer: 1 << 28,
    });
    expect(run.status === 0 || run.status === 1, `exit ${run.status}: ${run.stderr.slice(0, 2000)}`).toBe(
      true,
    );
    const entries = JSON.parse(run.stdout) as {
      file: string;
      line: number;
      column: number;
      endLine: number;
      endColumn: number;
      code: string;
    }[];
    expect(Array.isArray(entries)).toBe(true);
    const byPath = new Map(files.map((f) => [f.path, protocolLines(f.text)]));
    const outside: string[] = [];
    for (const e of entries) {
      const lines = byPath.get(e.file);
      if (!lines) {
        outside.push(`${e.file}: not one of the files given`);
        continue;
      }
      // 1-based lines and columns (docs/cli.md); a column may sit one past the line's last character.
      const ok = (line: number, col: number) =>
        Number.isInteger(line) &&
        Number.isInteger(col) &&
        line >= 1 &&
        line <= lines.length &&
        col >= 1 &&
        col <= lines[line - 1]!.length + 1;
      if (!ok(e.line, e.column) || !ok(e.endLine, e.endColumn))
        outside.push(`${e.file} ${e.code} at ${e.line}:${e.column}-${e.endLine}:${e.endColumn}`);
    }
    expect(outside).toEqual([]);
    // The valid specs produce findings too (warnings at least), so the array is not trivially empty.
    expect(entries.length).toBeGreaterThan(files.length / 4);
  }, 150_000);

  it("sweep --json on each valid file: exit 0 or 1 and a JSON pose table with no NaN", () => {
    for (const f of files.filter((x) => x.path.includes("/valid-")).slice(0, 6)) {
      const run = spawnSync(process.execPath, [poise, "sweep", "--json", f.path], {
        encoding: "utf8",
        timeout: 60_000,
        maxBuffer: 1 << 28,
      });
      expect(
        run.status === 0 || run.status === 1,
        `${f.path}: exit ${run.status}: ${run.stderr.slice(0, 1000)}`,
      ).toBe(true);
      // The table comes even when the spec has errors (exit 1), as long as it could be solved.
      if (run.stdout.trim()) {
        expect(run.stdout, f.path).not.toMatch(/\bNaN\b|Infinity/);
        const table = JSON.parse(run.stdout) as { dofs: string[]; poses: unknown[] };
        expect(Array.isArray(table.poses)).toBe(true);
      }
    }
  }, 150_000);
});
