// The design search (docs/tuning.md) against the published exact conditions of
// gravity balance (docs/formulas.md): it must find them where they exist, and keep what the checks
// keep (friction that holds).
import { describe, expect, it } from "vitest";
import { analyse } from "../../server/src/analysis";
import { tuneDesign, worstHandForce } from "../../server/src/tune/index";
import { applyEdits } from "../../server/src/tune/write";
import { HandForceMeasure } from "../../server/src/tune/evaluate";
import { solveSweep } from "../../server/src/mechanics/sweep";
import { pivotSpec } from "./pivot-spec";

/** Standard gravity, m/s^2 (SI Brochure, 9th ed.; the language's default `gravity`). */
const G0 = 9.80665;

describe("design search", () => {
  it("finds k a b = m g l for a pivot with a zero-free-length spring", () => {
    const [a, b, l, m] = [0.05, 0.1, 0.4, 1];
    const text = pivotSpec({
      a: 50,
      b: 100,
      l: 400,
      m,
      rate: "0.5 N/mm",
      tune: "tune rate 0.1 N/mm .. 2 N/mm",
    });
    const r = tuneDesign(text, { analyse });
    expect(r.improved).toBe(true);
    const rate = r.springs[0]!.values.find((v) => v.what === "rate")!;
    // Streit and Gilmore 1989; Herder 2001 (docs/formulas.md): exact balance iff k a b = m g l
    expect(rate.after).toBeCloseTo((m * G0 * l) / (a * b), 1);
    expect(Math.abs(rate.after / ((m * G0 * l) / (a * b)) - 1)).toBeLessThan(1e-6);
    // Written in the spec's own unit (N/mm), to four figures: 784.5 N/m
    expect(rate.text).toBe(`${Number(((m * G0 * l) / (a * b) / 1000).toPrecision(4))} N/mm`);
    const tuned = applyEdits(text, r.edits);
    expect(tuned).toContain(`rate ${rate.text}\n`);
    expect(tuned).toContain("tune rate 0.1 N/mm .. 2 N/mm"); // the tuning line stays
    expect(r.worstAfter!).toBeLessThan(0.01);
    expect(analyse(tuned).findings.filter((f) => f.severity === "error")).toEqual([]);
  });

  it("finds the anchor height a = m g l / (k b) when the anchor is what is freed", () => {
    const [b, l, m, k] = [0.1, 0.4, 0.8, 600];
    const text = pivotSpec({
      a: 30,
      b: 100,
      l: 400,
      m,
      rate: "0.6 N/mm",
      tune: "tune anchor (0 mm, 310 mm) .. (0 mm, 400 mm)",
    });
    const r = tuneDesign(text, { analyse });
    expect(r.improved).toBe(true);
    const y = r.springs[0]!.values.find((v) => v.what === "anchor" && v.axis === "y")!;
    // k a b = m g l (Streit and Gilmore 1989), anchor a above the pivot at y = 300 mm
    expect(y.after - 0.3).toBeCloseTo((m * G0 * l) / (k * b), 6);
    // The named anchor point is used by the spring alone: its `point` line is moved
    expect(applyEdits(text, r.edits)).toContain(
      `point anchor (0 mm, ${Number((y.after * 1000).toPrecision(4))} mm)`,
    );
  });

  it("finds the parallelogram's rate of docs/formulas.md (Agrawal and Fattah 2004)", () => {
    // Worked case: L = 0.35 m, bars 0.080 kg each, head 0.050 kg, payload 0.600 kg, a = 0.05 m,
    // b = 0.10 m. Bars rect 10 mm x 4 mm of a declared material whose density makes 0.080 kg.
    const [L, bar, head, payload, a, b] = [0.35, 0.08, 0.05, 0.6, 0.05, 0.1];
    const density = bar / (0.01 * 0.004 * L);
    const text = `# Invented for the tests: the worked parallelogram of docs/formulas.md.
arm "Stage" {
  material dense { density ${density} kg/m^3; modulus 70 GPa; strength 200 MPa }
  base clamp {
    point pivot (0 mm, 300 mm)
    point anchor (0 mm, 350 mm)
  }
  parallelogram reach {
    on clamp.pivot
    length 350 mm
    spacing 40 mm
    angle 10 deg
    range -30 deg .. 45 deg
    bars rect 10 mm x 4 mm dense
    head_mass 50 g
  }
  spring lift {
    zero_length
    between clamp.anchor and reach.lower(100 mm, 0 mm)
    rate 0.3 N/mm
    tune rate 0.05 N/mm .. 2 N/mm
  }
  payload camera {
    mass 600 g
    at reach.head(30 mm, -60 mm)
  }
}
`;
    const before = analyse(text);
    expect(before.model!.bodies.find((x) => x.id === "reach.lower")!.mass).toBeCloseTo(bar, 9);
    const r = tuneDesign(text, { analyse, before });
    expect(r.improved).toBe(true);
    // Agrawal and Fattah 2004 (docs/formulas.md): M = g (L (m_payload + m_head) + 2 m_bar L / 2) cos(theta),
    // balanced by k a b = M / cos(theta)
    const k = (G0 * (L * (payload + head) + 2 * bar * (L / 2))) / (a * b);
    expect(Math.abs(r.springs[0]!.values[0]!.after / k - 1)).toBeLessThan(1e-6);
    expect(k).toBeCloseTo(501.1, 1); // the worked value itself
  });

  it("measures the present design as the sweep does (the measure's own check)", () => {
    const text = pivotSpec({
      a: 50,
      b: 100,
      l: 400,
      m: 1,
      rate: "0.5 N/mm",
      tune: "tune rate 0.1 N/mm .. 2 N/mm",
    });
    const an = analyse(text);
    const sweep = solveSweep(an.model!, { bodyVelocities: true });
    const measure = new HandForceMeasure(an.model!, sweep, an.model!.springs);
    // The springs as they are: the worst hand force of the checks' own sweep
    expect(measure.measure(an.model!.springs).worst).toBeCloseTo(worstHandForce(sweep)!, 9);
    // Residual torque (m g l - k a b) cos(theta) over the lever l: worst at theta = 0 (docs/formulas.md)
    expect(measure.measure(an.model!.springs).worst).toBeCloseTo((1 * G0 * 0.4 - 500 * 0.05 * 0.1) / 0.4, 6);
  });

  /** Two links: the payload at the elbow, a light forearm held by the elbow's friction, and a
   * spring from the post across both joints to the forearm just past the elbow. */
  function elbowSpec(friction: string) {
    return `# Invented for the tests: a payload at an elbow whose forearm only friction holds.
arm "Elbow" {
  base post {
    point pivot (0 mm, 300 mm)
    point anchor (0 mm, 340 mm)
  }
  link upper {
    length 300 mm
    mass 0 kg
  }
  link fore {
    length 150 mm
    mass 50 g
  }
  joint shoulder {
    connects post.pivot to upper.start
    range -30 deg .. 30 deg
  }
  joint elbow {
    connects upper.end to fore.start
    angle -60 deg
    range -80 deg .. -40 deg${friction}
  }
  spring lift {
    zero_length
    between post.anchor and fore(2 mm, 0 mm)
    rate 0.1 N/mm
    tune rate 0.05 N/mm .. 3 N/mm
    tune anchor (-40 mm, 310 mm) .. (40 mm, 420 mm)
    tune hook (0 mm, 0 mm) .. (60 mm, 0 mm)
  }
  payload weight {
    mass 0.5 kg
    at upper.end
  }
}
`;
  }
  const elbowPeak = (text: string) =>
    Math.max(
      ...analyse(text).sweep!.poses.flatMap((p) => p.cases.map((c) => Math.abs(c.holdingTorque["elbow"]!))),
    );

  it("keeps a friction-held joint holding where it held before", () => {
    const FRICTION = 0.09; // N*m, between the present design's elbow torque and the free optimum's
    // Free of the friction, the best design loads the elbow past that friction (the case binds)...
    const free = elbowSpec("");
    expect(elbowPeak(free)).toBeLessThan(FRICTION);
    const loose = tuneDesign(free, { analyse });
    expect(loose.improved).toBe(true);
    expect(elbowPeak(applyEdits(free, loose.edits))).toBeGreaterThan(FRICTION);
    // ...held by friction, the search keeps every holding torque at the elbow within it
    // (docs/checks.md, balance: balance.drifts where the holding torque exceeds the friction)
    const held = elbowSpec(`\n    friction ${FRICTION} N*m`);
    const r = tuneDesign(held, { analyse });
    expect(r.improved).toBe(true);
    const tuned = applyEdits(held, r.edits);
    expect(elbowPeak(tuned)).toBeLessThanOrEqual(FRICTION);
    expect(analyse(tuned).findings.map((f) => f.code)).not.toContain("balance.drifts");
    expect(r.worstAfter!).toBeLessThan(r.worstBefore! / 10);
  });

  it("tunes several springs at once: a stage's spring and a torsion spring at the elbow on its head", () => {
    const text = `# Invented for the tests: two springs, two joints.
arm "Two springs" {
  base post {
    point pivot (0 mm, 300 mm)
    point anchor (0 mm, 350 mm)
  }
  parallelogram reach {
    on post.pivot
    length 300 mm
    spacing 40 mm
    range -30 deg .. 30 deg
    bars rect 10 mm x 4 mm pla
  }
  link fore {
    length 200 mm
    mass 0 kg
  }
  joint elbow {
    connects reach.head to fore.start
    range -30 deg .. 30 deg
  }
  spring lift {
    zero_length
    between post.anchor and reach.lower(100 mm, 0 mm)
    rate 0.3 N/mm
    tune rate 0.05 N/mm .. 3 N/mm
  }
  spring wrist {
    torsion
    at elbow
    rate 0.001 N*m/deg
    preload 0 N*m
    tune rate 0.0001 N*m/deg .. 0.05 N*m/deg
    tune preload -2 N*m .. 2 N*m
  }
  payload weight {
    mass 0.4 kg
    at fore.end
  }
}
`;
    const r = tuneDesign(text, { analyse });
    expect(r.improved).toBe(true);
    expect(r.springs.map((s) => s.id).sort()).toEqual(["lift", "wrist"]);
    // Both springs change, and the worst hand force falls by far
    for (const s of r.springs)
      expect(s.values.some((v) => Math.abs(v.after / v.before - 1) > 0.01)).toBe(true);
    expect(r.worstAfter!).toBeLessThan(r.worstBefore! / 5);
  });

  it("stops at once when cancelled, and says so", () => {
    const text = pivotSpec({
      a: 50,
      b: 100,
      l: 400,
      m: 1,
      rate: "0.5 N/mm",
      tune: "tune rate 0.1 N/mm .. 2 N/mm",
    });
    const cancel = new Int32Array(new SharedArrayBuffer(4));
    const before = analyse(text);
    Atomics.store(cancel, 0, 1);
    const r = tuneDesign(text, { analyse, before, cancel });
    expect(r.cancelled).toBe(true);
    expect(r.improved).toBe(false);
    expect(r.evaluations).toBe(0);
  });
});
