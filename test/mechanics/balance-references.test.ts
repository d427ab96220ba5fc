// Holding torque of spring-balanced pivoting links and parallelogram stages against published
// closed forms (docs/formulas.md, "Gravity balancing").
import { describe, expect, it } from "vitest";
import { solveSweep } from "../../server/src/mechanics/sweep";
import { ArmBuilder, deg, G0 } from "./arm-builder";

describe("zero-free-length balance of a pivoting link", () => {
  it("holds with no torque at any angle when k a b = m g l", () => {
    const m = 1.2;
    const l = 0.35;
    const a = 0.06;
    const b = 0.12;
    const k = (m * G0 * l) / (a * b);
    const model = new ArmBuilder("post", { pivot: { x: 0, y: 0.3 }, anchor: { x: 0, y: 0.3 + a } })
      .link("arm", 0.4, 0)
      .joint("shoulder", "post", { x: 0, y: 0.3 }, "arm", { x: 0, y: 0 }, deg(10), {
        range: [deg(-80), deg(80)],
      })
      .zeroLength("lift", ["post", { x: 0, y: 0.3 + a }], ["arm", { x: b, y: 0 }], k)
      .payload("lamp", "arm", { x: l, y: 0 }, m)
      .sweep(33)
      .build();
    const sweep = solveSweep(model);
    expect(sweep.findings).toEqual([]);
    expect(sweep.poses.length).toBe(33);
    for (const pose of sweep.poses) {
      // Streit and Gilmore, ASME J. Mech. Trans. Autom. Des. 111 (1989): tau = (m g l - k a b) cos(theta) = 0
      expect(Math.abs(pose.cases[0]!.holdingTorque["shoulder"]!)).toBeLessThan(1e-9);
    }
  });

  it("without the spring needs m g l cos(theta)", () => {
    const m = 0.8;
    const l = 0.3;
    const model = new ArmBuilder()
      .link("arm", 0.3, 0)
      .joint("shoulder", "ground", { x: 0, y: 0 }, "arm", { x: 0, y: 0 }, 0, { range: [deg(-60), deg(60)] })
      .payload("p", "arm", { x: l, y: 0 }, m)
      .sweep(13)
      .build();
    const sweep = solveSweep(model);
    for (const pose of sweep.poses) {
      const th = pose.angles["shoulder"]!;
      // Statics of a pivoting link (any mechanics text, e.g. Meriam and Kraige, Statics, ch. 3): tau = m g l cos(theta)
      expect(pose.cases[0]!.holdingTorque["shoulder"]).toBeCloseTo(m * G0 * l * Math.cos(th), 10);
      // Hand force at the payload: |tau| / |dp/dtheta| = |tau| / l (docs/formulas.md, statics of the arm)
      expect(pose.cases[0]!.handForce["p"]).toBeCloseTo(Math.abs(m * G0 * l * Math.cos(th)) / l, 9);
    }
  });
});

describe("finite free length spring on a pivoting link (Herder 2001)", () => {
  const m = 1;
  const l = 0.4;
  const a = 0.05;
  const b = 0.1;
  const k = (m * G0 * l) / (a * b);
  const L0 = 0.03;
  const model = (Fi: number) =>
    new ArmBuilder("post", { anchor: { x: 0, y: a } })
      .link("arm", 0.45, 0)
      .joint("shoulder", "post", { x: 0, y: 0 }, "arm", { x: 0, y: 0 }, deg(0), {
        range: [deg(-60), deg(60)],
      })
      .extension("lift", ["post", { x: 0, y: a }], ["arm", { x: b, y: 0 }], k, L0, Fi)
      .payload("weight", "arm", { x: l, y: 0 }, m)
      .sweep(25)
      .build();

  it("matches tau = m g l cos(theta) - (Fi + k (L - L0)) a b cos(theta) / L over the range", () => {
    const Fi = 5;
    const sweep = solveSweep(model(Fi));
    expect(sweep.poses.length).toBe(25);
    for (const pose of sweep.poses) {
      const th = pose.angles["shoulder"]!;
      const L = Math.sqrt(a * a + b * b - 2 * a * b * Math.sin(th));
      // Herder, "Energy-free systems", PhD thesis TU Delft 2001: holding torque of a link with a real extension spring
      const expected = m * G0 * l * Math.cos(th) - ((Fi + k * (L - L0)) * a * b * Math.cos(th)) / L;
      expect(pose.cases[0]!.holdingTorque["shoulder"]).toBeCloseTo(expected, 9);
      expect(pose.springs["lift"]!.length).toBeCloseTo(L, 12);
    }
  });

  it("gives the worked residuals 0.7478, 0.8290, 0.3186 N m at psi = 30, 90, 150 deg", () => {
    const Fi = 5;
    const psis = [30, 90, 150];
    const worked = [0.7478, 0.829, 0.3186];
    const m2 = model(Fi);
    // psi from the upward vertical: theta = 90 deg - psi; sweep exactly those three angles.
    m2.joints[0]!.range = [deg(90 - 150), deg(90 - 30)];
    m2.sweep = { steps: 3, grid: true };
    const sweep = solveSweep(m2);
    const byPsi = new Map(
      sweep.poses.map((p) => [Math.round(90 - (p.angles["shoulder"]! * 180) / Math.PI), p]),
    );
    psis.forEach((psi, i) => {
      const pose = byPsi.get(psi)!;
      const L = Math.sqrt(a * a + b * b - 2 * a * b * Math.cos(deg(psi)));
      // Herder 2001 / Deepak and Ananthasuresh, J. Mech. Des. 134 (2012): residual (k L0 - Fi) a b cos(theta) / L
      const residual = ((k * L0 - Fi) * a * b * Math.sin(deg(psi))) / L;
      expect(pose.cases[0]!.holdingTorque["shoulder"]).toBeCloseTo(residual, 9);
      // docs/formulas.md worked values (Herder 2001 geometry, k = 784.5 N/m): 0.7478, 0.8290, 0.3186 N m
      expect(pose.cases[0]!.holdingTorque["shoulder"]).toBeCloseTo(worked[i]!, 3);
    });
  });

  it("balances exactly with an effective zero free length, Fi = k L0", () => {
    const sweep = solveSweep(model(k * L0));
    // Herder 2001: with k a b = m g l and Fi = k L0 the residual is zero everywhere
    for (const pose of sweep.poses)
      expect(Math.abs(pose.cases[0]!.holdingTorque["shoulder"]!)).toBeLessThan(1e-9);
  });
});

describe("parallelogram stage (Agrawal and Fattah 2004)", () => {
  const L = 0.35;
  const barMass = 0.08;
  const headMass = 0.05;
  const payload = 0.6;
  const stage = (withSpring: boolean, payloadAt = { x: 0.03, y: -0.06 }) => {
    const b = new ArmBuilder("clamp", { pivot: { x: 0, y: 0.3 }, anchor: { x: 0, y: 0.35 } })
      .parallelogram(
        "reach",
        "clamp",
        { x: 0, y: 0.3 },
        {
          length: L,
          spacing: 0.04,
          angle: deg(10),
          range: [deg(-30), deg(45)],
          barMass,
          headMass,
          headCom: { x: 0.01, y: 0.02 },
        },
      )
      .payload("camera", "reach.head", payloadAt, payload)
      .sweep(16);
    const M = (payload + headMass) * G0 * L + 2 * barMass * G0 * (L / 2);
    if (withSpring)
      b.zeroLength("lift", ["clamp", { x: 0, y: 0.35 }], ["reach.lower", { x: 0.1, y: 0 }], M / (0.05 * 0.1));
    return b.build();
  };

  it("has the holding torque of one link carrying everything at the stage length, and a head that does not turn", () => {
    const sweep = solveSweep(stage(false));
    expect(sweep.findings).toEqual([]);
    expect(sweep.poses.length).toBe(16);
    for (const pose of sweep.poses) {
      const th = pose.angles["reach"]!;
      // Agrawal and Fattah, Mech. Mach. Theory 39 (2004): M = (m_payload + m_head) g L cos(theta) + 2 m_bar g (L/2) cos(theta)
      const M = ((payload + headMass) * G0 * L + 2 * barMass * G0 * (L / 2)) * Math.cos(th);
      expect(pose.cases[0]!.holdingTorque["reach"]).toBeCloseTo(M, 9);
      // Same source: the head translates without rotating
      expect(Math.abs(pose.bodies["reach.head"]!.phi)).toBeLessThan(1e-10);
    }
    // docs/formulas.md worked value: M = 2.506 cos(theta) N m for these masses
    const ref = sweep.reference!;
    expect(ref.cases[0]!.holdingTorque["reach"]! / Math.cos(deg(10))).toBeCloseTo(2.506, 3);
  });

  it("does not depend on where the payload sits on the head", () => {
    const a = solveSweep(stage(false, { x: 0.03, y: -0.06 }));
    const b = solveSweep(stage(false, { x: 0.2, y: 0.1 }));
    // Agrawal and Fattah 2004: the payload's offset on the head is carried as axial bar forces, not pivot torque
    a.poses.forEach((p, i) =>
      expect(p.cases[0]!.holdingTorque["reach"]).toBeCloseTo(
        b.poses[i]!.cases[0]!.holdingTorque["reach"]!,
        9,
      ),
    );
  });

  it("is balanced by a zero-free-length spring of k = M / (a b) = 501.1 N/m", () => {
    const model = stage(true);
    const k = (model.springs[0] as { rate: number }).rate;
    // docs/formulas.md worked value (Agrawal and Fattah 2004 geometry, a = 0.05 m, b = 0.10 m): k = 501.1 N/m
    expect(k).toBeCloseTo(501.1, 1);
    const sweep = solveSweep(model);
    // Streit and Gilmore 1989 applied to the stage's gravity moment: zero holding torque everywhere
    for (const pose of sweep.poses)
      expect(Math.abs(pose.cases[0]!.holdingTorque["reach"]!)).toBeLessThan(1e-9);
  });
});
