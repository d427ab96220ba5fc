// The anchor locus of the preview (docs/tuning.md, "The preview") against the exact condition of
// zero-free-length balance (docs/formulas.md): the points that balance at every pose obey
// k a b = m g l, and every point of the reference-pose curve makes the holding torque vanish
// there, both computed here from the closed form of the pivoting link.
import { describe, expect, it } from "vitest";
import { analyse } from "../../server/src/analysis";
import { anchorLocus, type AnchorLocus } from "../../server/src/tune/locus";
import { solveSweep } from "../../server/src/mechanics/sweep";
import { pivotSpec } from "./pivot-spec";

/** Standard gravity, m/s^2 (SI Brochure, 9th ed.; the language's default `gravity`). */
const G0 = 9.80665;

function locusOf(text: string): AnchorLocus {
  const an = analyse(text);
  const sweep = solveSweep(an.model!, { quickSteps: 19, bodyVelocities: true });
  const l = anchorLocus(an.model!, sweep, an.model!.springs[0]!);
  if ("reason" in l) throw new Error(l.reason);
  return l;
}

describe("anchor locus", () => {
  it("finds the exact balance point of a zero-free-length spring on a pivot: k a b = m g l", () => {
    const [b, l, m, k] = [0.1, 0.4, 1, 500];
    const l0 = locusOf(pivotSpec({ a: 50, b: 100, l: 400, m, rate: "0.5 N/mm" }));
    expect(l0.exact.length).toBeGreaterThan(0);
    // Streit and Gilmore 1989; Herder 2001 (docs/formulas.md): exact balance iff the anchor is on
    // the vertical through the pivot at a distance a with k a b = m g l
    for (const p of l0.exact) {
      const a = Math.hypot(p.x - 0, p.y - 0.3);
      expect(Math.abs((k * a * b) / (m * G0 * l) - 1)).toBeLessThan(1e-6);
      expect(Math.abs(p.x)).toBeLessThan(1e-9);
      expect(p.y).toBeGreaterThan(0.3);
    }
  });

  it("draws where the arm floats at the reference pose: k (b x a) = m g l cos(theta)", () => {
    const [b, l, m, k] = [0.1, 0.4, 1, 500];
    const theta = (20 * Math.PI) / 180;
    const l0 = locusOf(pivotSpec({ a: 50, b: 100, l: 400, m, rate: "0.5 N/mm", angle: "20 deg" }));
    const points = l0.atReference.flat();
    expect(points.length).toBeGreaterThan(50);
    // Zero-free-length spring: force k (A - B) on the hook B, torque about the pivot k (B x A);
    // the weight's torque m g l cos(theta) (docs/formulas.md, gravity balancing)
    const hook = { x: b * Math.cos(theta), y: b * Math.sin(theta) };
    for (const p of points) {
      const ax = p.x;
      const ay = p.y - 0.3;
      const springTorque = k * (hook.x * ay - hook.y * ax);
      expect(springTorque).toBeCloseTo(m * G0 * l * Math.cos(theta), 6);
    }
    // The exact point lies on that line too, straight above the pivot
    expect(l0.exact.length).toBeGreaterThan(0);
    for (const p of l0.exact) expect(Math.abs((k * (p.y - 0.3) * b) / (m * G0 * l) - 1)).toBeLessThan(1e-6);
  });

  it("finds no exact point when the spring cannot balance the link anywhere in reach", () => {
    // An extension spring of free length 120 mm: exact balance needs a zero free length
    // (docs/formulas.md, gravity balancing; docs/tuning.md, "The preview")
    const text = pivotSpec({ a: 50, b: 100, l: 400, m: 1, rate: "0.5 N/mm" })
      .replace("zero_length", "extension")
      .replace("rate 0.5 N/mm", "rate 0.5 N/mm\n    free_length 120 mm");
    const l0 = locusOf(text);
    expect(l0.exact).toEqual([]);
  });
});
