// Runs every fixture under test/fixtures/: each expected finding is a marker comment under the
// line it points at, carets under the exact columns of its range:
//     length 250
//   #        ^^^ error unit.missing
// A fixture fails on a finding without a marker and on a marker without a finding.
// Header lines: `# fixture: model-only` stops after the model (syntax and model findings only);
// `# expect: SEVERITY CODE` expects a finding anywhere (for files without a line to mark).
import { describe, expect, test } from "vitest";
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative } from "node:path";
import { analyse } from "../server/src/analysis";
import { LineIndex } from "../server/src/syntax/span";

const ROOT = join(__dirname, "fixtures");
const MARKER = /^(\s*#\s*?)(\s*)(\^+)\s+(error|warning|information|hint)\s+([\w.-]+)\s*$/;
const WHOLE_FILE = /^#\s*expect:\s*(error|warning|information|hint)\s+([\w.-]+)\s*$/;

interface Expected {
  line: number;
  start: number;
  end: number;
  severity: string;
  code: string;
  text: string;
}

function fixtureFiles(dir: string): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir).sort()) {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) out.push(...fixtureFiles(path));
    else if (name.endsWith(".poise")) out.push(path);
  }
  return out;
}

function readMarkers(text: string): {
  expected: Expected[];
  anywhere: { severity: string; code: string }[];
  modelOnly: boolean;
} {
  const lines = text.split(/\r\n|\r|\n/);
  const expected: Expected[] = [];
  const anywhere: { severity: string; code: string }[] = [];
  let target = -1;
  for (const [i, line] of lines.entries()) {
    const m = MARKER.exec(line);
    if (m) {
      const start = line.indexOf("^");
      expected.push({
        line: target,
        start,
        end: start + m[3]!.length,
        severity: m[4]!,
        code: m[5]!,
        text: line.trim(),
      });
      continue;
    }
    const w = WHOLE_FILE.exec(line);
    if (w) anywhere.push({ severity: w[1]!, code: w[2]! });
    target = i;
  }
  return { expected, anywhere, modelOnly: /^#\s*fixture:\s*model-only\s*$/m.test(text) };
}

const files = fixtureFiles(ROOT);

describe("fixtures", () => {
  test("there are fixtures", () => {
    expect(files.length).toBeGreaterThan(10);
  });
  for (const file of files) {
    test(relative(ROOT, file), () => {
      const text = readFileSync(file, "utf8");
      const { expected, anywhere, modelOnly } = readMarkers(text);
      const analysis = analyse(text, { modelOnly, budgetMs: 20000 });
      const index = new LineIndex(text);
      const unmatched = [...expected];
      const unmarked: string[] = [];
      const wanted = [...anywhere];
      for (const f of analysis.findings) {
        const s = index.position(f.span.start);
        const e = index.position(f.span.end);
        // A span running past its line is marked to the end of that line.
        const endCol =
          e.line === s.line
            ? e.character
            : Math.max(s.character + 1, (text.split(/\r\n|\r|\n/)[s.line] ?? "").length);
        const width = Math.max(1, endCol - s.character);
        const i = unmatched.findIndex(
          (m) =>
            m.line === s.line &&
            m.start === s.character &&
            m.end === s.character + width &&
            m.code === f.code &&
            m.severity === f.severity,
        );
        if (i >= 0) {
          unmatched.splice(i, 1);
          continue;
        }
        const w = wanted.findIndex((m) => m.code === f.code && m.severity === f.severity);
        if (w >= 0) {
          wanted.splice(w, 1);
          continue;
        }
        unmarked.push(`${s.line + 1}:${s.character + 1}-${endCol + 1} ${f.severity} ${f.code}: ${f.message}`);
      }
      const missing = [
        ...unmatched.map((m) => `line ${m.line + 1} cols ${m.start + 1}-${m.end}: ${m.severity} ${m.code}`),
        ...wanted.map((m) => `anywhere: ${m.severity} ${m.code}`),
      ];
      expect({ unmarked, missing }).toEqual({ unmarked: [], missing: [] });
    });
  }
});
