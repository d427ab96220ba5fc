// Stiffness and vibration of whole arms through the frame model: a cantilevered link against
// Roark, a parallelogram stage derived by statics here, Rayleigh's tip-mass frequency.
import { describe, expect, it } from "vitest";
import { checkStiffness, representativePoses } from "../../server/src/checks/stiffness";
import { solveSweep } from "../../server/src/mechanics/sweep";
import { sectionProperties } from "../../server/src/model/section";
import { ArmBuilder, deg } from "../mechanics/arm-builder";
import {
  armModel,
  baseBody,
  G,
  joint,
  linkBody,
  MATERIALS,
  payload,
  treeSweep,
} from "../structure/arm-fixture";
import { figure, runFamily } from "./check-context";
import { tiltShares } from "../../server/src/mechanics/structure/tilt-share";
import * as math from "mathjs";

const E = MATERIALS["aluminium_6061_t6"]!.modulus;
const tube = { shape: "tube" as const, outerDiameter: 0.02, wall: 0.002 };
const L = 0.4;

function cantilever(payloadKg: number, linkMass?: number) {
  const base = baseBody("post", { top: { x: 0, y: 0.3 } });
  const boom = linkBody("boom", L, tube, "aluminium_6061_t6");
  if (linkMass !== undefined) Object.assign(boom, { mass: linkMass, massGiven: true });
  return armModel({
    bodies: [base, boom],
    joints: [joint("shoulder", "post", { x: 0, y: 0.3 }, "boom", 0, "range")],
    payloads: [payload("camera", "boom", { x: L, y: 0 }, payloadKg)],
  });
}

describe("cantilevered link with the shoulder held", () => {
  it("deflection and tilt at the payload (Roark table 8.1 case 1a)", () => {
    const P = 10;
    const model = cantilever(P / G, 0);
    model.require.deflection.default = 0.0005;
    const ctx = runFamily(checkStiffness, model, treeSweep(model, [{}]));
    const I = sectionProperties(tube).secondMoment;
    // Roark 8th ed., table 8.1 case 1a: W l^3 / (3 E I) (worked 0.6677 mm) and W l^2 / (2 E I)
    // (worked 2.504e-3 rad); the axial shortening is nil for a horizontal link
    expect(figure(ctx, "camera", "deflection under load")).toBeCloseTo((P * L ** 3) / (3 * E * I), 9);
    expect(figure(ctx, "camera", "elastic tilt")).toBeCloseTo((P * L ** 2) / (2 * E * I), 8);
    const f = ctx.findings.find((x) => x.code === "stiffness.deflection")!;
    expect(f.message).toContain("0.6677 mm");
    expect(f.span).toEqual(model.bodies[1]!.origin.properties["section"]);
  });

  it("lowest natural frequency with a tip mass (Rayleigh)", () => {
    const model = cantilever(0.5);
    model.require.frequency = 30;
    const ctx = runFamily(checkStiffness, model, treeSweep(model, [{}]));
    const I = sectionProperties(tube).secondMoment;
    const m = model.bodies[1]!.mass;
    // Rayleigh (Thomson and Dahleh, 5th ed., ch. 2): k = 3 E I / l^3, effective mass M + 33/140 m;
    // worked 26.78 Hz. Tolerance 1 %: the check meshes each link into only 4 lumped-mass
    // elements (enough when the tip mass dominates, as here: 0.5 kg against 0.12 kg).
    const rayleigh = Math.sqrt((3 * E * I) / L ** 3 / (0.5 + (33 / 140) * m)) / (2 * Math.PI);
    const f = figure(ctx, "camera", "lowest natural frequency of the arm")!;
    expect(Math.abs(f - rayleigh) / rayleigh).toBeLessThan(0.01);
    expect(ctx.findings.find((x) => x.code === "stiffness.low-frequency")!.message).toContain(
      "below the 30 Hz required",
    );
  });
});

describe("a bar under its own weight (issue 10 item 5)", () => {
  it("self-weight deflection (Roark) and first frequency (Blevins) within 0.5 %", () => {
    // no payload mass: the link's own weight only, spread along it by work-equivalent loads, and
    // its own mass as consistent mass
    const model = cantilever(0);
    const ctx = runFamily(checkStiffness, model, treeSweep(model, [{}]));
    const sp = sectionProperties(tube);
    const m = model.bodies[1]!.mass / L;
    const q = m * G;
    // Roark 8th ed., table 8.1 case 2a (uniform load, left end fixed): y_B = w l^4 / (8 E I)
    const roark = (q * L ** 4) / (8 * E * sp.secondMoment);
    expect(Math.abs(figure(ctx, "camera", "deflection under load")! - roark) / roark).toBeLessThan(0.005);
    // Blevins, Formulas for Natural Frequency and Mode Shape (1979), table 8-1, clamped-free:
    // f_1 = lambda_1^2 / (2 pi L^2) sqrt(E I / m), lambda_1 = 1.87510 (a tube bends alike both ways)
    const blevins = (1.8751 ** 2 / (2 * Math.PI * L * L)) * Math.sqrt((E * sp.secondMoment) / m);
    const f = figure(ctx, "post", "lowest natural frequency of the arm")!;
    expect(Math.abs(f - blevins) / blevins).toBeLessThan(0.005);
  });
});

describe("nothing goes missing in silence (issue 10 item 1)", () => {
  it("a joint nothing holds: an information finding on the payload and the required frequency", () => {
    const base = baseBody("post", { top: { x: 0, y: 0.3 } });
    const boom = linkBody("boom", L, tube, "aluminium_6061_t6");
    const model = armModel({
      bodies: [base, boom],
      joints: [joint("shoulder", "post", { x: 0, y: 0.3 }, "boom", 0, "passive")],
      payloads: [payload("camera", "boom", { x: L, y: 0 }, 0.5)],
    });
    const ctx = runFamily(checkStiffness, model, treeSweep(model, [{}]));
    const notComputed = ctx.findings.filter((f) => f.code === "stiffness.not-computed");
    expect(notComputed.map((f) => f.severity)).toEqual(["information", "information"]);
    expect(notComputed[0]!.span).toEqual(
      model.payloads[0]!.origin.name ?? model.payloads[0]!.origin.declaration,
    );
    expect(notComputed[0]!.message).toContain("payload camera");
    expect(notComputed[1]!.span).toEqual(model.require.origin!.properties["frequency"]);
    expect(figure(ctx, "camera", "deflection under load")).toBeUndefined();
  });
});

describe("parallelogram stage with its root held", () => {
  // Statics (derived here): with the lower root locked and every other pivot a pin, the upper bar
  // is a two-force member along itself, so with level bars it carries no vertical load: the
  // lower bar is a cantilever with tip load P (Roark case 1a): P L^3 / (3 E I). A payload x_p
  // beyond the far pivots puts a couple P x_p on the head, taken as equal and opposite bar forces
  // H = P x_p / s; the bars stretch and shorten by H L / (E A), which turns the head by
  // psi = 2 H L / (E A s) and lowers the payload by a further psi x_p.
  const Lb = 0.3;
  const s = 0.04;
  const bars = { shape: "rect" as const, depth: 0.02, width: 0.005 };
  function stage(payloadKg: number, xp: number) {
    const model = new ArmBuilder("clamp", { pivot: { x: 0, y: 0.3 } })
      .parallelogram(
        "reach",
        "clamp",
        { x: 0, y: 0.3 },
        { length: Lb, spacing: s, angle: 0, range: [deg(-30), deg(30)], barMass: 0, headMass: 0 },
      )
      .payload("tool", "reach.head", { x: xp, y: 0 }, payloadKg)
      .sweep(3)
      .build();
    for (const b of model.bodies)
      if (b.kind === "bar") Object.assign(b, { section: bars, material: "aluminium_6061_t6" });
    Object.assign(model.materials, MATERIALS);
    return model;
  }

  it("deflection and tilt at the head", () => {
    const P = 20;
    const xp = 0.05;
    const model = stage(P / G, xp);
    const sweep = solveSweep(model);
    const ctx = runFamily(checkStiffness, model, sweep);
    const sp = sectionProperties(bars);
    const H = (P * xp) / s;
    const psi = (2 * H * Lb) / (E * sp.area * s);
    const down = (P * Lb ** 3) / (3 * E * sp.secondMoment) + psi * xp;
    const along = (H * Lb) / (E * sp.area);
    // derived above; the reference pose (bars level) is the first representative pose, and
    // the ends of the range (bars at -30 and 30 deg) deflect less vertically
    expect(figure(ctx, "tool", "elastic tilt")).toBeGreaterThan(0);
    const ref = representativePoses(sweep)[0]!;
    expect(ref.angles["reach"]).toBeCloseTo(0, 12);
    const refCtx = runFamily(checkStiffness, model, { ...sweep, poses: [ref], dofs: [] });
    // the head is rigid (exact constraints), so the derivation holds to solver precision
    const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
    expect(rel(figure(refCtx, "tool", "deflection under load")!, Math.hypot(down, along))).toBeLessThan(1e-9);
    expect(rel(figure(refCtx, "tool", "elastic tilt")!, psi)).toBeLessThan(1e-9);
  });

  it("a heavy tool on slender bars sways sideways: stiffness.low-frequency on the bars", () => {
    const model = stage(2, 0);
    model.require.frequency = 20;
    const sweep = solveSweep(model);
    const ref = representativePoses(sweep)[0]!;
    const ctx = runFamily(checkStiffness, model, { ...sweep, poses: [ref], dofs: [] });
    const sp = sectionProperties(bars);
    const Gs = MATERIALS["aluminium_6061_t6"]!.shearModulus;
    // Derivation (direct stiffness by hand, McGuire et al. 2nd ed. ch. 4): out of the plane each
    // bar is a cantilever from its root pin (a pin frees only the turn about its own axis), whose
    // tip has stiffness (E I / L^3) [12, 6L; 6L, 4L^2] in (sideways w, turn about the vertical
    // psi) and G K / L in twist phi (I and K across the thin side, Roark). The rigid head joins
    // the tips: the upper tip moves w + s phi. In (w, psi, phi) at the lower tip, with
    // a = 12 E I / L^3, b = 6 E I / L^2, c = 4 E I / L, t = G K / L:
    // K = [[2a, 2b, a s], [2b, 2c, b s], [a s, b s, a s^2 + 2t]]; the 2 kg mass moves with w only,
    // so f = sqrt(1 / (m C_11)) / (2 pi) with C = K^-1 (mathjs inverts it).
    const EI = E * sp.secondMomentAcross;
    const a = (12 * EI) / Lb ** 3;
    const b = (6 * EI) / Lb ** 2;
    const c = (4 * EI) / Lb;
    const t = (Gs * sp.torsionConstant) / Lb;
    const C = math.inv([
      [2 * a, 2 * b, a * s],
      [2 * b, 2 * c, b * s],
      [a * s, b * s, a * s * s + 2 * t],
    ]);
    const sideways = Math.sqrt(1 / (2 * C[0]![0]!)) / (2 * Math.PI);
    // in the plane (derived above): k = 3 E I / L^3 for the lower bar (docs/formulas.md: mass on a
    // spring) is far stiffer with the bars' depth in the plane
    const inPlane = Math.sqrt((3 * E * sp.secondMoment) / Lb ** 3 / 2) / (2 * Math.PI);
    expect(sideways).toBeLessThan(inPlane);
    const got = ctx.findings.find((x) => x.code === "stiffness.low-frequency")!;
    if (got.code !== "stiffness.low-frequency") throw new Error("no frequency finding");
    // the derivation above, to solver precision
    expect(Math.abs(got.data.frequency - sideways) / sideways).toBeLessThan(1e-6);
    expect(got.data.direction).toBe("sideways");
    expect(got.message).toContain("sway sideways");
    expect(got.span).toEqual(
      model.parallelograms[0]!.origin.properties["bars"] ?? model.parallelograms[0]!.origin.name,
    );
  });
});

describe("which part gives most of the tilt (issue 10 item 8)", () => {
  // Two links in line, both joints held: a cantilever of two segments with the payload's weight
  // P at the tip. Unit-load method (e.g. Gere, Mechanics of Materials, energy methods; Roark 8th
  // ed., table 8.1 case 1a by superposition): the root segment turns the tip by
  // P L1 (L1 / 2 + L2) / (E I1), the outer one by P L2^2 / (2 E I2).
  const L1 = 0.3;
  const L2 = 0.25;
  const stiff = { shape: "tube" as const, outerDiameter: 0.025, wall: 0.003 };
  const slender = { shape: "tube" as const, outerDiameter: 0.012, wall: 0.001 };
  function twoLinks(outer: typeof stiff) {
    const base = baseBody("post", { top: { x: 0, y: 0.3 } });
    const inner = linkBody("inner", L1, stiff, "aluminium_6061_t6");
    const outerLink = linkBody("outer", L2, outer, "aluminium_6061_t6");
    for (const b of [inner, outerLink]) Object.assign(b, { mass: 0, massGiven: true });
    const model = armModel({
      bodies: [base, inner, outerLink],
      joints: [
        joint("shoulder", "post", { x: 0, y: 0.3 }, "inner", 0, "range"),
        joint("elbow", "inner", { x: L1, y: 0 }, "outer", 0, "range"),
      ],
      payloads: [payload("lamp", "outer", { x: L2, y: 0 }, 2)],
    });
    model.require.tilt.default = 1e-6;
    return model;
  }

  it("shares of each link by virtual work add up to the tip's rotation and match the closed form", () => {
    const model = twoLinks(slender);
    const sweep = treeSweep(model, [{}]);
    const pose = sweep.poses[0]!;
    const shares = tiltShares(model, pose, pose.cases[0], { lamp: 2 }, "lamp")!;
    const P = 2 * G;
    const I1 = sectionProperties(stiff).secondMoment;
    const I2 = sectionProperties(slender).secondMoment;
    // Unit-load method, per segment (see above)
    const inner = (P * L1 * (L1 / 2 + L2)) / (E * I1);
    const outer = (P * L2 ** 2) / (2 * E * I2);
    expect(Math.abs(shares.byBody.get("inner")!)).toBeCloseTo(inner, 9);
    expect(Math.abs(shares.byBody.get("outer")!)).toBeCloseTo(outer, 9);
    // Virtual work: the shares add up to the rotation (no springs here)
    expect(shares.byBody.get("inner")! + shares.byBody.get("outer")!).toBeCloseTo(shares.rotation, 12);
  });

  it("the tilt finding names the slender link, then the stiff one when the outer is stiffened", () => {
    for (const [outer, expected] of [
      [slender, "outer"],
      [stiff, "inner"],
    ] as const) {
      const model = twoLinks(outer);
      const ctx = runFamily(checkStiffness, model, treeSweep(model, [{}]));
      const f = ctx.findings.find((x) => x.code === "stiffness.tilt")!;
      expect(f.data.subject).toBe(expected);
      expect(f.message).toContain(`link ${expected} gives most of it`);
    }
  });
});
