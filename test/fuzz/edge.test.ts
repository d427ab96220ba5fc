// Numeric edge cases (test/fixtures/edge/): besides the findings their markers expect (checked by
// test/fixtures.test.ts), each must satisfy every robustness property, at the fuzzing density
// and at the spec's own: no fault, findings inside the text, no NaN or infinity in any figure.
// Cases the owners' code does not handle yet wait in edge/pending/ (*.poise.pending, out of the
// fixture runner), each with a `# pending:` line saying what is still wrong.
import { describe, expect, it } from "vitest";
import { existsSync, readFileSync, readdirSync } from "node:fs";
import { join } from "node:path";
import { analyse } from "../../server/src/analysis";
import { checkAnalysis, checkText } from "./properties";

const dir = join(__dirname, "..", "fixtures", "edge");
const ready = readdirSync(dir)
  .filter((f) => f.endsWith(".poise"))
  .sort();
const pending = (existsSync(join(dir, "pending")) ? readdirSync(join(dir, "pending")) : [])
  .filter((f) => f.endsWith(".poise.pending"))
  .sort();

describe("numeric edge cases", () => {
  it("there are edge cases, and each marks at least one finding", () => {
    expect(ready.length + pending.length).toBeGreaterThanOrEqual(10);
    for (const f of ready)
      expect(readFileSync(join(dir, f), "utf8"), f).toMatch(
        /^\s*#\s*\^+\s+(error|warning|information|hint)\s/m,
      );
  });
  for (const f of ready) {
    it(`${f}: robust at 3 steps and at the spec's own density`, () => {
      const text = readFileSync(join(dir, f), "utf8");
      expect(checkText(text, { alwaysDeterminism: true })).toEqual([]);
      expect(checkAnalysis(analyse(text, { budgetMs: 20_000 }), text)).toEqual([]);
    });
  }
  for (const f of pending) {
    const text = readFileSync(join(dir, "pending", f), "utf8");
    const why = /^#\s*pending:\s*(.+)$/m.exec(text)?.[1] ?? "no reason given";
    it.skip(`pending ${f}: ${why}`, () => {
      expect(checkText(text)).toEqual([]);
    });
  }
});
