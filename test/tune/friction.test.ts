// The design search honours pivot friction as the balance check does (docs/tuning.md, "What it
// minimises"): a pose that friction holds needs no hand, so the search's measure of a design is
// the hand force beyond friction, the same figure balance.unbalanced judges; checked against the
// pivoting link with Coulomb friction at the pivot (docs/formulas.md), computed here.
import { describe, expect, it } from "vitest";
import { analyse } from "../../server/src/analysis";
import { tuneDesign, worstHandForce } from "../../server/src/tune/index";
import { HandForceMeasure } from "../../server/src/tune/evaluate";
import { solveSweep } from "../../server/src/mechanics/sweep";

/** Standard gravity, m/s^2 (SI Brochure, 9th ed.; the language's default `gravity`). */
const G0 = 9.80665;

/** A massless boom pivoting at (0, 300 mm) with friction f, carrying m (or a range) at l, a
 * zero-free-length spring of rate k from a above the pivot to b along the boom. */
function spec(o: { a: number; b: number; l: number; mass: string; k: number; f: number; tune?: string }) {
  return `# Invented for the tests: a stiff pivot that holds part of the weight by friction.
arm "Stiff pivot" {
  base post {
    point pivot (0 mm, 300 mm)
    point anchor (0 mm, ${300 + o.a * 1000} mm)
  }
  link boom {
    length ${o.l * 1000 + 50} mm
    mass 0 kg
  }
  joint shoulder {
    connects post.pivot to boom.start
    range -60 deg .. 60 deg
    friction ${o.f} N*m
  }
  spring lift {
    zero_length
    between post.anchor and boom(${o.b * 1000} mm, 0 mm)
    rate ${o.k / 1000} N/mm${o.tune ? `\n    ${o.tune}` : ""}
  }
  payload weight {
    mass ${o.mass}
    at boom(${o.l * 1000} mm, 0 mm)
  }
  require {
    balance 0.5 N
  }
}
`;
}

/** Worst hand force beyond friction of the pivoting link: the residual torque
 * (m g l - k a b) cos(theta), less the friction f, over the lever l, worst at theta = 0
 * (docs/formulas.md, gravity balancing; friction holds up to f either way). */
const beyondFriction = (m: number, k: number, a: number, b: number, l: number, f: number) =>
  Math.max(0, Math.abs(m * G0 * l - k * a * b) - f) / l;

describe("the search honours friction", () => {
  it("measures a design by the hand force beyond friction, as the balance check does", () => {
    const o = { a: 0.05, b: 0.1, l: 0.4, mass: "1 kg", k: 500, f: 0.6 };
    const an = analyse(spec(o));
    const sweep = solveSweep(an.model!, { bodyVelocities: true });
    const m = new HandForceMeasure(an.model!, sweep, an.model!.springs).measure(an.model!.springs);
    expect(m.worst).toBeCloseTo(beyondFriction(1, o.k, o.a, o.b, o.l, o.f), 6);
    // the sweep's own figure, which balance.unbalanced reads
    expect(m.worst).toBeCloseTo(worstHandForce(sweep)!, 9);
    // and without friction's help, for the tie-break
    expect(m.worstFree).toBeCloseTo(beyondFriction(1, o.k, o.a, o.b, o.l, 0), 6);
  });

  it("counts a friction-held design as balanced and offers no change to it", () => {
    // Residual torque m g l - k a b = 3.92 - 2.5 = 1.42 N*m, friction 1.5 N*m: held everywhere
    const o = { a: 0.05, b: 0.1, l: 0.4, mass: "1 kg", k: 500, f: 1.5, tune: "tune rate 0.1 N/mm .. 2 N/mm" };
    expect(beyondFriction(1, o.k, o.a, o.b, o.l, o.f)).toBe(0);
    const text = spec(o);
    const before = analyse(text);
    expect(before.findings.map((f) => f.code)).not.toContain("balance.unbalanced");
    const r = tuneDesign(text, { analyse, before });
    expect(r.worstBefore).toBe(0);
    expect(r.improved).toBe(false);
    expect(r.reason).toContain("no design within the bounds has a lower worst hand force");
  });

  it("leans on friction only where it must: over a mass range, the least worst force beyond it", () => {
    // Masses 0.6 .. 1.4 kg: the best rate balances the middle mass, k a b = m_mid g l, and the
    // worst hand force beyond friction is ((m_hi - m_lo) g l / 2 - f) / l (docs/formulas.md)
    const o = { a: 0.05, b: 0.1, l: 0.4, mass: "1 kg\n    range 0.6 kg .. 1.4 kg", k: 500, f: 0.3 };
    const text = spec({ ...o, tune: "tune rate 0.1 N/mm .. 2 N/mm" });
    const r = tuneDesign(text, { analyse });
    expect(r.improved).toBe(true);
    const k = r.springs[0]!.values[0]!.after;
    expect(k).toBeCloseTo((1 * G0 * o.l) / (o.a * o.b), -1);
    expect(r.worstAfter!).toBeCloseTo(((0.8 * G0 * o.l) / 2 - o.f) / o.l, 2);
  });
});
