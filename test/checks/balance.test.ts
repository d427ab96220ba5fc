// Balance checks and readouts against the published balancing conditions (docs/formulas.md).
import { describe, expect, it } from "vitest";
import type { ArmModel } from "../../server/src/model/types";
import { solveSweep } from "../../server/src/mechanics/sweep";
import { balanceChecks, subRanges } from "../../server/src/checks/balance";
import type { CheckContext } from "../../server/src/checks/index";
import { ArmBuilder, deg, G0 } from "../mechanics/arm-builder";

function check(model: ArmModel): CheckContext {
  const sweep = solveSweep(model);
  const ctx: CheckContext = { model, sweep, options: { deadline: Infinity }, findings: [], readouts: {} };
  balanceChecks(ctx);
  return ctx;
}

const m = 1;
const l = 0.4;
const a = 0.05;
const b = 0.1;
const L0 = 0.03;
function herderLink(rate: number, Fi: number, limit = 1) {
  return new ArmBuilder("post", { anchor: { x: 0, y: a } })
    .link("arm", 0.45, 0)
    .joint("shoulder", "post", { x: 0, y: 0 }, "arm", { x: 0, y: 0 }, 0, { range: [deg(-60), deg(60)] })
    .extension("lift", ["post", { x: 0, y: a }], ["arm", { x: b, y: 0 }], rate, L0, Fi)
    .payload("weight", "arm", { x: l, y: 0 }, m)
    .balance(limit)
    .sweep(25)
    .build();
}

describe("balance.unbalanced", () => {
  it("flags a spring with too little initial tension and finds the balancing rate and tension", () => {
    const k = (m * G0 * l) / (a * b);
    const model = herderLink(k, 5);
    const ctx = check(model);
    const f = ctx.findings.filter((x) => x.code === "balance.unbalanced");
    expect(f.length).toBe(1);
    expect(f[0]!.span).toEqual(model.springs[0]!.origin.properties["rate"]);
    // Herder 2001: residual (k L0 - Fi) a b cos(theta) / L > 0: the hand pushes up, the arm sinks
    expect(f[0]!.message).toContain("sinks");
    expect(f[0]!.related.length).toBe(2);
    const data = f[0]!.data!;
    // Herder 2001 (docs/formulas.md): exact balance needs k a b = m g l and Fi = k L0
    expect(data.best!["rate"]!).toBeCloseTo(k, 2);
    expect(data.best!["initial_tension"]!).toBeCloseTo(k * L0, 3);
    expect(data["worstHandForceAfter"] as number).toBeLessThan(1e-4);
    // Worst before: the largest residual torque over the range divided by the lever l (docs/formulas.md, statics of the arm)
    const worstTau = Math.max(
      ...solveSweep(model).poses.map((p) => {
        const th = p.angles["shoulder"]!;
        const L = Math.sqrt(a * a + b * b - 2 * a * b * Math.sin(th));
        return Math.abs(((k * L0 - 5) * a * b * Math.cos(th)) / L);
      }),
    );
    expect(data["worstHandForceBefore"] as number).toBeCloseTo(worstTau / l, 9);
  });

  it("offers no setting for a spring that pulls the wrong way where it is placed", () => {
    // Anchor straight below the pivot: the spring's torque k a b cos(theta) adds to gravity's
    // (Streit and Gilmore 1989 with a -> -a), so the best rate is zero.
    const model = new ArmBuilder("post")
      .link("arm", 0.45, 0)
      .joint("shoulder", "post", { x: 0, y: 0 }, "arm", { x: 0, y: 0 }, 0, { range: [deg(-60), deg(60)] })
      .zeroLength("lift", ["post", { x: 0, y: -a }], ["arm", { x: b, y: 0 }], 500)
      .payload("weight", "arm", { x: l, y: 0 }, m)
      .sweep(13)
      .build();
    const ctx = check(model);
    const f = ctx.findings.filter((x) => x.code === "balance.unbalanced");
    expect(f.length).toBe(1);
    expect(f[0]!.data.best).toBeUndefined();
    expect(f[0]!.message).toContain("move its anchor or hook");
    // Without the spring the worst hand force is the weight at the horizontal: m g (statics)
    expect(f[0]!.data!["worstHandForceAfter"] as number).toBeCloseTo(m * G0, 6);
  });

  it("stays quiet when the hand force is within the limit", () => {
    const k = (m * G0 * l) / (a * b);
    const ctx = check(herderLink(k, k * L0));
    expect(ctx.findings).toEqual([]);
  });

  it("reports on the payload when no spring acts", () => {
    const model = new ArmBuilder()
      .link("arm", 0.3, 0)
      .joint("shoulder", "ground", { x: 0, y: 0 }, "arm", { x: 0, y: 0 }, 0, { range: [deg(-30), deg(30)] })
      .payload("lamp", "arm", { x: 0.3, y: 0 }, 0.5)
      .sweep(7)
      .build();
    const ctx = check(model);
    const f = ctx.findings.filter((x) => x.code === "balance.unbalanced");
    expect(f.length).toBe(1);
    expect(f[0]!.span).toEqual(model.payloads[0]!.origin.properties["mass"]);
    // Hand force of an unsprung link at the payload: m g (horizontal, worst) = 4.903 N (statics)
    expect(f[0]!.data!["worstHandForce"] as number).toBeCloseTo(0.5 * G0, 9);
  });

  it("checks both ends of a payload mass range", () => {
    const k = (m * G0 * l) / (a * b);
    const model = herderLink(k, k * L0, 0.5);
    model.payloads[0]!.massRange = [0.8, 1.3];
    const ctx = check(model);
    const f = ctx.findings.filter((x) => x.code === "balance.unbalanced");
    expect(f.length).toBe(1);
    // With k a b = m_nominal g l, the heavy end leaves (1.3 - 1) g l cos(theta): hand force (0.3 g) at horizontal (Streit and Gilmore 1989)
    expect(f[0]!.data!["caseId"]).toBe("weight.high");
    expect(f[0]!.data!["worstHandForce"] as number).toBeCloseTo(0.3 * G0, 6);
    expect(f[0]!.message).toContain("sinks");
  });
});

describe("balance.drifts", () => {
  it("reports the sub-range where the holding torque beats the friction", () => {
    const mass = 0.5;
    const len = 0.3;
    const friction = 1.0;
    const model = new ArmBuilder()
      .link("arm", len, 0)
      .joint(
        "shoulder",
        "ground",
        { x: 0, y: 0 },
        "arm",
        { x: 0, y: 0 },
        0,
        { range: [deg(-80), deg(80)] },
        friction,
      )
      .payload("lamp", "arm", { x: len, y: 0 }, mass)
      .balance(100)
      .sweep(33)
      .build();
    const ctx = check(model);
    const f = ctx.findings.filter((x) => x.code === "balance.drifts");
    expect(f.length).toBe(1);
    expect(f[0]!.span).toEqual(model.joints[0]!.origin.properties["friction"]);
    // tau = m g l cos(theta) > friction for |theta| < acos(friction / (m g l)) (statics of a pivoting link)
    const limit = Math.acos(friction / (mass * G0 * len));
    const samples = Array.from({ length: 33 }, (_, i) => deg(-80) + (deg(160) * i) / 32);
    const inside = samples.filter((t) => Math.abs(t) < limit);
    const runs = f[0]!.data!["ranges"] as [number, number][];
    expect(runs.length).toBe(1);
    expect(runs[0]![0]).toBeCloseTo(inside[0]!, 12);
    expect(runs[0]![1]).toBeCloseTo(inside[inside.length - 1]!, 12);
    expect(f[0]!.message).toContain("clockwise");
  });

  it("groups sub-ranges", () => {
    // Plain bookkeeping, no source needed: consecutive sample values form one run
    expect(subRanges([1, 2, 3, 4, 5, 6], (v) => v === 2 || v === 3 || v === 6)).toEqual([
      [2, 3],
      [6, 6],
    ]);
  });
});

describe("readouts", () => {
  it("gives the zero-free-length ideal rate k = m g l / (a b) for a link", () => {
    const k = (m * G0 * l) / (a * b);
    const ctx = check(herderLink(400, 0, 100));
    const ideal = ctx.readouts["lift"]!.figures.find((x) => x.label.startsWith("ideal rate"))!;
    // Streit and Gilmore 1989: k a b = m g l
    expect(ideal.value).toBeCloseTo(k, 6);
  });

  it("gives the stage's ideal rate 501.1 N/m for the worked parallelogram", () => {
    const model = new ArmBuilder("clamp", { anchor: { x: 0, y: 0.35 } })
      .parallelogram(
        "reach",
        "clamp",
        { x: 0, y: 0.3 },
        {
          length: 0.35,
          spacing: 0.04,
          angle: deg(10),
          range: [deg(-30), deg(45)],
          barMass: 0.08,
          headMass: 0.05,
        },
      )
      .payload("camera", "reach.head", { x: 0.03, y: -0.06 }, 0.6)
      .extension("lift", ["clamp", { x: 0, y: 0.35 }], ["reach.lower", { x: 0.1, y: 0 }], 300, 0.02, 2)
      .balance(100)
      .sweep(16)
      .build();
    const ctx = check(model);
    const ideal = ctx.readouts["lift"]!.figures.find((x) => x.label.startsWith("ideal rate"))!;
    // Agrawal and Fattah 2004 (docs/formulas.md worked value): k = 501.1 N/m with a = 0.05 m, b = 0.10 m
    expect(ideal.value).toBeCloseTo(501.1, 1);
    expect(ctx.readouts["reach"]!.kind).toBe("parallelogram");
  });

  it("gives a payload's gravity torque about its joint and the hand force range", () => {
    const model = herderLink(400, 0, 100);
    model.joints[0]!.angle = deg(20);
    const ctx = check(model);
    const g = ctx.readouts["weight"]!.figures.find((x) => x.label === "gravity torque about shoulder")!;
    // Statics of a pivoting link: m g l cos(theta) at the reference angle
    expect(g.value).toBeCloseTo(m * G0 * l * Math.cos(deg(20)), 9);
    const joint = ctx.readouts["shoulder"]!.figures.map((x) => x.label);
    expect(joint).toEqual(
      expect.arrayContaining([
        "angle range",
        "holding torque, least",
        "holding torque, most",
        "largest reaction",
      ]),
    );
  });
});
