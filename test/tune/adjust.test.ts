// `adjust` lines: the setting per payload mass against the exact zero-free-length condition
// (docs/formulas.md), and the masses no setting in the travel balances.
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { analyse } from "../../server/src/analysis";
import { buildResults } from "../../server/src/checks/results";
import { ADJUST_MASSES } from "../../server/src/tune/adjust";

/** Standard gravity, m/s^2 (SI Brochure, 9th ed.; the language's default `gravity`). */
const G0 = 9.80665;
const SLOT = readFileSync(join(__dirname, "..", "fixtures", "checks", "adjust-slot.poise"), "utf8");

describe("adjust", () => {
  const a = analyse(SLOT);
  const figures = a.readouts["lift"]!.figures;
  const [k, b, l] = [500, 0.1, 0.4];
  const [lo, hi] = [0.3, 1.2];
  const masses = Array.from({ length: ADJUST_MASSES }, (_, i) => lo + ((hi - lo) * i) / (ADJUST_MASSES - 1));
  // The slot runs from 20 mm to 80 mm above the pivot (y 620 .. 680 mm, pivot at 600 mm)
  const [aLo, aHi] = [0.02, 0.08];

  it("gives each mass the anchor height of k a b = m g l, where the slot reaches it", () => {
    for (const m of masses) {
      const grams = Math.round(m * 1000);
      const y = figures.find((f) => f.label === `setting of anchor y for tool at ${grams} g`)!;
      // Streit and Gilmore 1989 (docs/formulas.md): a = m g l / (k b), clamped to the slot's travel
      const ideal = (m * G0 * l) / (k * b);
      expect(y.value - 0.6, `${grams} g`).toBeCloseTo(Math.min(aHi, Math.max(aLo, ideal)), 6);
      const worst = figures.find((f) => f.label === `worst hand force at that setting (tool at ${grams} g)`)!;
      // The residual (m g l - k a b) cos(theta) / l, worst at theta = 0
      const a = Math.min(aHi, Math.max(aLo, ideal));
      expect(worst.value, `${grams} g`).toBeCloseTo(Math.abs(m * G0 * l - k * a * b) / l, 5);
    }
  });

  it("says which masses the travel cannot balance", () => {
    const f = a.findings.find((x) => x.code === "balance.out-of-travel")!;
    expect(f).toBeDefined();
    if (f.code !== "balance.out-of-travel") return;
    // Unbalanced where the residual at the slot's end passes `require balance 1 N`
    const bad = masses.filter(
      (m) => Math.abs(m * G0 * l - k * Math.min(aHi, (m * G0 * l) / (k * b)) * b) / l > 1,
    );
    expect(f.data.masses).toEqual([[bad[0], bad[bad.length - 1]]]);
    expect(f.data.payload).toBe("tool");
    expect(SLOT.slice(f.span.start, f.span.end)).toBe("adjust anchor (0 mm, 620 mm) .. (0 mm, 680 mm)");
  });

  it("puts the table in the results record", () => {
    const rec = buildResults(a);
    const lift = rec.sections["springs"]!["lift"]!;
    expect(lift["anchor_y_at_300g"]!.value).toBeCloseTo(0.6 + (0.3 * G0 * l) / (k * b), 6);
    expect(lift["hand_force_at_1200g"]!.limit).toBe(1);
  });
});
