// Golden record of what every sample and fixture yields: findings (code, severity, span, message,
// related), readouts, and the report page of each sample in both unit systems. A refactor must
// leave these unchanged; a change of behaviour updates them on purpose:
//   UPDATE_GOLDEN=1 npx vitest run test/golden.test.ts   (then read the diff of test/golden/)
// Numbers are compared to 1e-9 relative so that a reordered sum does not count as a change; the
// report is compared whole (its figures are already rounded for display).
import { describe, expect, test } from "vitest";
import { createHash } from "node:crypto";
import { mkdirSync, readdirSync, readFileSync, statSync, writeFileSync, existsSync } from "node:fs";
import { join, relative } from "node:path";
import { analyse } from "../server/src/analysis";
import { reportHtml } from "../server/src/cli/report";

const ROOT = join(__dirname, "..");
const GOLDEN = join(__dirname, "golden");
const ARTIFACTS = join(ROOT, "test-artifacts", "golden");
const UPDATE = process.env.UPDATE_GOLDEN === "1";

function poiseFiles(dir: string): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir).sort()) {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) out.push(...poiseFiles(path));
    else if (name.endsWith(".poise")) out.push(path);
  }
  return out;
}

const files = [...poiseFiles(join(ROOT, "samples")), ...poiseFiles(join(__dirname, "fixtures"))];
const samples = poiseFiles(join(ROOT, "samples"));

function goldenName(path: string): string {
  return relative(ROOT, path)
    .replace(/[\\/]/g, "__")
    .replace(/\.poise$/, ".json");
}

function recordOf(path: string): unknown {
  const text = readFileSync(path, "utf8");
  const modelOnly = /^#\s*fixture:\s*model-only\s*$/m.test(text);
  const analysis = analyse(text, modelOnly ? { modelOnly: true } : {});
  const findings = analysis.findings.map((f) => ({
    code: f.code,
    severity: f.severity,
    span: f.span,
    message: f.message,
    related: f.related,
  }));
  return JSON.parse(JSON.stringify({ findings, readouts: analysis.readouts }));
}

function sha256(text: string): string {
  return createHash("sha256").update(text).digest("hex");
}

/** Deep equality with numbers to 1e-9 relative; returns the first path that differs. */
function firstDifference(a: unknown, b: unknown, path = "$"): string | undefined {
  if (typeof a === "number" && typeof b === "number") {
    const scale = Math.max(1e-300, Math.abs(a), Math.abs(b));
    return a === b || Math.abs(a - b) <= 1e-9 * scale ? undefined : `${path}: ${a} != ${b}`;
  }
  if (a === null || b === null || typeof a !== "object" || typeof b !== "object") {
    return a === b ? undefined : `${path}: ${JSON.stringify(a)} != ${JSON.stringify(b)}`;
  }
  if (Array.isArray(a) !== Array.isArray(b)) return `${path}: array vs object`;
  const keys = new Set([...Object.keys(a), ...Object.keys(b)]);
  for (const k of keys) {
    const d = firstDifference(
      (a as Record<string, unknown>)[k],
      (b as Record<string, unknown>)[k],
      `${path}.${k}`,
    );
    if (d) return d;
  }
  return undefined;
}

describe("golden record", () => {
  test.each(files.map((f) => [relative(ROOT, f), f]))(
    "%s: findings and readouts unchanged",
    (_name, path) => {
      const actual = recordOf(path);
      const goldenPath = join(GOLDEN, goldenName(path));
      if (UPDATE || !existsSync(goldenPath)) {
        mkdirSync(GOLDEN, { recursive: true });
        writeFileSync(goldenPath, `${JSON.stringify(actual, null, 1)}\n`);
        if (!UPDATE) throw new Error(`no golden record for ${goldenName(path)}: written now, run again`);
        return;
      }
      const expected: unknown = JSON.parse(readFileSync(goldenPath, "utf8"));
      expect(firstDifference(actual, expected)).toBeUndefined();
    },
  );

  test("each sample's report page is unchanged, in SI and US units", () => {
    const hashesPath = join(GOLDEN, "reports.json");
    const actual: Record<string, string> = {};
    for (const path of samples) {
      const text = readFileSync(path, "utf8");
      for (const units of ["si", "us"] as const) {
        const name = `${relative(ROOT, path)} (${units})`;
        const { html } = reportHtml(text, relative(ROOT, path), units);
        actual[name] = sha256(html);
        mkdirSync(ARTIFACTS, { recursive: true });
        writeFileSync(join(ARTIFACTS, `${goldenName(path).replace(/\.json$/, "")}.${units}.html`), html);
      }
    }
    if (UPDATE || !existsSync(hashesPath)) {
      mkdirSync(GOLDEN, { recursive: true });
      writeFileSync(hashesPath, `${JSON.stringify(actual, null, 1)}\n`);
      if (!UPDATE) throw new Error("no golden report hashes: written now, run again");
      return;
    }
    // On a difference the pages just made are in test-artifacts/golden/ to compare with the
    // same pages built on the commit before.
    expect(actual).toEqual(JSON.parse(readFileSync(hashesPath, "utf8")));
  });
});
