// Replays every recorded fuzz failure (test/fuzz/failures/) as a regression test: the robustness
// properties must hold on the input now. Open (unfixed, reported) ones are listed as skipped.
import { describe, expect, it } from "vitest";
import { readFileSync, readdirSync } from "node:fs";
import { join } from "node:path";
import { checkText } from "./properties";
import { LARGE_BUDGET_MS } from "./campaign";

const dir = join(__dirname, "failures");
const files = readdirSync(dir)
  .filter((f) => f.endsWith(".json") || f.endsWith(".poise"))
  .sort();

interface Recorded {
  text: string;
  property?: string;
  /** The fuzz family it came from; the large shapes are checked under their budget. */
  family?: string;
  open?: boolean;
}

function load(file: string): Recorded {
  const raw = readFileSync(join(dir, file), "utf8");
  return file.endsWith(".poise") ? { text: raw } : (JSON.parse(raw) as Recorded);
}

describe("recorded fuzz failures", () => {
  it("every failure file holds a text to replay", () => {
    for (const f of files) expect(typeof load(f).text, f).toBe("string");
  });
  for (const f of files) {
    const rec = load(f);
    it.skipIf(rec.open === true)(`${f}${rec.open ? " (open bug, reported)" : ""}`, () => {
      const options = rec.family === "large" ? { budgetMs: LARGE_BUDGET_MS } : { alwaysDeterminism: true };
      expect(checkText(rec.text, options)).toEqual([]);
    });
  }
});
