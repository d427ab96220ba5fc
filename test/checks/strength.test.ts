// Strength checks on hand-built arms: bending stress of a cantilevered link (Roark), buckling of
// a flagpole column (Shigley), pin shear (Shigley ch. 5), printed layer strength, spring body.
import { describe, expect, it } from "vitest";
import { checkStrength } from "../../server/src/checks/strength";
import { checkSpringStrength } from "../../server/src/checks/spring-strength";
import { sectionProperties } from "../../server/src/model/section";
import type { ExtensionSpring } from "../../server/src/model/types";
import { builtinMaterials } from "../../server/src/model/materials";
import { isCode } from "../../server/src/findings/finding";
import {
  armModel,
  baseBody,
  G,
  joint,
  linkBody,
  MATERIALS,
  origin,
  payload,
  treeSweep,
} from "../structure/arm-fixture";
import { figure, runFamily } from "./check-context";

const tube = { shape: "tube" as const, outerDiameter: 0.02, wall: 0.002 };
const L = 0.4;

function cantileverArm(payloadKg: number, pin?: { diameter: number; material: string; shearPlanes: 1 | 2 }) {
  const base = baseBody("post", { top: { x: 0, y: 0.3 } });
  const boom = linkBody("boom", L, tube, "aluminium_6061_t6");
  const j = joint("shoulder", "post", { x: 0, y: 0.3 }, "boom", 0, "fixed", pin ? { pin } : {});
  return armModel({
    bodies: [base, boom],
    joints: [j],
    payloads: [payload("camera", "boom", { x: L, y: 0 }, payloadKg)],
  });
}

describe("link bending", () => {
  it("cantilever root stress including the link's own weight", () => {
    const model = cantileverArm(20);
    const ctx = runFamily(checkStrength, model, treeSweep(model, [{}]));
    const sp = sectionProperties(tube);
    const boomMass = model.bodies[1]!.mass;
    // Roark 8th ed., table 8.1: end load W l (case 1a) plus uniform load w l^2 / 2 (case 2a)
    // at the root; sigma = M c / I
    const M = 20 * G * L + (boomMass * G * L) / 2;
    const expected = (M * sp.extremeFibre) / sp.secondMoment;
    expect(figure(ctx, "boom", "largest stress")).toBeCloseTo(expected, -1);
    // safety = strength / stress; 6061-T6 yield 276 MPa (ASM Handbook vol. 2, from memory)
    const safety = 276e6 / expected;
    expect(ctx.readouts["boom"]!.worstSafety!.value).toBeCloseTo(safety, 6);
    expect(safety).toBeLessThan(2);
    const f = ctx.findings.find((x) => x.code === "strength.overstress")!;
    expect(f.span).toEqual(model.bodies[1]!.origin.properties["section"]);
    expect(f.message).toContain("safety 1.");
    expect(f.message).toContain("< 2.00 required");
  });

  it("a light payload passes", () => {
    const model = cantileverArm(1);
    const ctx = runFamily(checkStrength, model, treeSweep(model, [{}]));
    expect(ctx.findings).toEqual([]);
  });

  it("a printed link in bending is held to its layer strength", () => {
    const model = cantileverArm(1);
    model.bodies[1] = { ...linkBody("boom", L, { shape: "rect", depth: 0.008, width: 0.004 }, "petg") };
    const ctx = runFamily(checkStrength, model, treeSweep(model, [{}]));
    const stress = figure(ctx, "boom", "largest stress")!;
    // docs/checks.md rule: printed bodies that bend use layer_strength (22.5 MPa for this petg)
    expect(ctx.readouts["boom"]!.worstSafety!.value).toBeCloseTo(
      MATERIALS["petg"]!.layerStrength! / stress,
      9,
    );
  });
});

describe("columns", () => {
  it("an upright rod with a mass on top buckles as a flagpole", () => {
    const rod = { shape: "rod" as const, diameter: 0.006 };
    const base = baseBody("foot", { top: { x: 0, y: 0 } });
    const mast = linkBody("mast", 0.5, rod, "aluminium_6061_t6");
    const model = armModel({
      bodies: [base, mast],
      joints: [joint("socket", "foot", { x: 0, y: 0 }, "mast", Math.PI / 2, "fixed")],
      payloads: [payload("lamp", "mast", { x: 0.5, y: 0 }, 3)],
    });
    const ctx = runFamily(checkStrength, model, treeSweep(model, [{}]));
    const sp = sectionProperties(rod);
    // Shigley ch. 4, eq. 4-43 with the fixed-free end condition (effective length 2 l):
    // P_cr = pi^2 E I / (2 l)^2; the compression is largest at the root: payload + mast weight
    const Pcr = (Math.PI ** 2 * 68.9e9 * sp.secondMoment) / (2 * 0.5) ** 2;
    const P = 3 * G + mast.mass * G;
    const f = ctx.findings.filter(isCode("strength.overstress")).find((x) => x.data.check === "buckling")!;
    expect(f).toBeDefined();
    expect(f.data!["safety"]).toBeCloseTo(Pcr / P, 6);
    expect(f.message).toContain("Euler");
  });
});

describe("pins", () => {
  it("single-shear pin of a fixed joint", () => {
    const model = cantileverArm(50, { diameter: 0.002, material: "steel_1018", shearPlanes: 1 });
    const ctx = runFamily(checkStrength, model, treeSweep(model, [{}]));
    const F = (50 + model.bodies[1]!.mass) * G; // statics: the pin carries all the weight
    // Shigley ch. 5: tau = F / (pi d^2 / 4), allowable 0.577 S_y (1018 CD: 370 MPa, table A-20)
    const tau = F / ((Math.PI * 0.002 ** 2) / 4);
    expect(figure(ctx, "shoulder", "pin shear stress")).toBeCloseTo(tau, 0);
    expect(figure(ctx, "shoulder", "pin safety factor")).toBeCloseTo((0.577 * 370e6) / tau, 6);
    const f = ctx.findings.find((x) => x.message.startsWith("pin of joint shoulder"))!;
    expect(f.message).toMatch(
      /single-shear stress .* safety 1\.\d\d < 2\.00 required \(reaction 4\d\d(\.\d)? N at the reference pose\)/,
    );
    expect(f.span).toEqual(model.joints[0]!.origin.properties["pin"]);
  });
});

describe("springs", () => {
  function springArm(maxLength: number) {
    const base = baseBody("post", { top: { x: 0, y: 0.3 }, anchor: { x: 0, y: 0.4 } });
    const boom = linkBody("boom", L, tube, "aluminium_6061_t6");
    const spring: ExtensionSpring = {
      id: "lift",
      kind: "extension",
      a: { body: "post", point: { x: 0, y: 0.4 }, span: { start: 0, end: 1 } },
      b: { body: "boom", point: { x: 0.2, y: 0 }, span: { start: 0, end: 1 } },
      rate: 1173,
      freeLength: 0.2,
      initialTension: 2,
      maxLength,
      coil: { wireDiameter: 0.0012, meanDiameter: 0.0096, bodyCoils: 20, material: "music_wire" },
      origin: origin("rate", "free_length", "max_length", "wire"),
    };
    return armModel({
      bodies: [base, boom],
      joints: [joint("shoulder", "post", { x: 0, y: 0.3 }, "boom", 0, "range")],
      springs: [spring],
    });
  }

  it("past max_length and the coil body stress", () => {
    const model = springArm(0.22);
    const sweep = treeSweep(model, [{ shoulder: -0.3 }, { shoulder: 0 }, { shoulder: 0.3 }]);
    const ctx = runFamily(checkSpringStrength, model, sweep);
    // longest at the lowest pose: hook 0.2 m out along the boom at -0.3 rad, anchor 0.1 m above the pivot
    const longest = Math.hypot(0.2 * Math.cos(-0.3), 0.1 - 0.2 * Math.sin(-0.3));
    const over = ctx.findings.find((f) => f.code === "strength.overstretch")!;
    expect(over.span).toEqual(model.springs[0]!.origin.properties["max_length"]);
    expect(over.data!["length"]).toBeCloseTo(longest, 12);
    // Shigley eq. 10-7 with K_B (eq. 10-5), C = 8: tau = K_B 8 F D / (pi d^3) at F = Fi + k (L - L0)
    const F = 2 + 1173 * (longest - 0.2);
    const KB = (4 * 8 + 2) / (4 * 8 - 3);
    const tau = (KB * 8 * F * 0.0096) / (Math.PI * 0.0012 ** 3);
    expect(figure(ctx, "lift", "body stress")).toBeCloseTo(tau, 0);
    // Shigley eq. 10-14, Table 10-4 (music wire) and Table 10-7 (0.45 S_ut, from memory)
    expect(figure(ctx, "lift", "body safety factor")).toBeCloseTo(
      (0.45 * (2211 / 1.2 ** 0.145) * 1e6) / tau,
      6,
    );
  });

  it("within max_length: no overstretch", () => {
    const model = springArm(0.5);
    const ctx = runFamily(
      checkSpringStrength,
      model,
      treeSweep(model, [{ shoulder: -0.3 }, { shoulder: 0.3 }]),
    );
    expect(ctx.findings.filter((f) => f.code === "strength.overstretch")).toEqual([]);
  });
});

describe("spring wire strength by size (issue 10 item 6)", () => {
  /** The springs arm above with the coil's wire and material swapped, the library loaded. */
  function wireArm(wireDiameter: number, meanDiameter: number, material: string, mats = builtinMaterials()) {
    const base = baseBody("post", { top: { x: 0, y: 0.3 }, anchor: { x: 0, y: 0.4 } });
    const boom = linkBody("boom", L, tube, "aluminium_6061_t6");
    const spring: ExtensionSpring = {
      id: "lift",
      kind: "extension",
      a: { body: "post", point: { x: 0, y: 0.4 }, span: { start: 0, end: 1 } },
      b: { body: "boom", point: { x: 0.2, y: 0 }, span: { start: 0, end: 1 } },
      rate: 3000,
      freeLength: 0.15,
      initialTension: 20,
      coil: { wireDiameter, meanDiameter, bodyCoils: 20, material },
      origin: origin("rate", "free_length", "wire"),
    };
    const model = armModel({
      bodies: [base, boom],
      joints: [joint("shoulder", "post", { x: 0, y: 0.3 }, "boom", 0, "range")],
      springs: [spring],
    });
    model.materials = { ...model.materials, ...mats };
    const ctx = runFamily(checkSpringStrength, model, treeSweep(model, [{ shoulder: 0 }]));
    const length = Math.hypot(0.2, 0.1);
    const F = 20 + 3000 * (length - 0.15);
    const C = meanDiameter / wireDiameter;
    // Shigley eq. 10-7 with the Bergstraesser factor (eq. 10-5)
    const tau = (((4 * C + 2) / (4 * C - 3)) * 8 * F * meanDiameter) / (Math.PI * wireDiameter ** 3);
    return { ctx, tau };
  }

  it("hard-drawn wire of 2.5 mm: S_ut = A / d^m at its own size, not at 1 mm", () => {
    const { ctx, tau } = wireArm(0.0025, 0.02, "hard_drawn_wire");
    // Shigley 9th-11th ed., eq. 10-14 and table 10-4: ASTM A227, A = 1783 MPa mm^m, m = 0.190;
    // table 10-7: body 45 % of S_ut
    const Sut = (1783 / 2.5 ** 0.19) * 1e6;
    expect(figure(ctx, "lift", "body safety factor")).toBeCloseTo((0.45 * Sut) / tau, 9);
    // the old figure credited the wire with S_ut at 1 mm, 2.5^0.19 = 1.19 times too strong
    expect(figure(ctx, "lift", "body safety factor")! * 2.5 ** 0.19).toBeCloseTo((0.45 * 1783e6) / tau, 6);
  });

  it("stainless wire: its own row of the table and the stainless share of S_ut", () => {
    const { ctx, tau } = wireArm(0.003, 0.024, "stainless_302_wire");
    // Shigley table 10-4: A313 (302) from 2.5 to 5 mm, A = 2065 MPa mm^m, m = 0.263;
    // table 10-7: austenitic stainless body 35 % of S_ut
    const Sut = (2065 / 3 ** 0.263) * 1e6;
    expect(figure(ctx, "lift", "body safety factor")).toBeCloseTo((0.35 * Sut) / tau, 9);
  });

  it("outside the table's sizes the readout says the strength is extrapolated", () => {
    const { ctx } = wireArm(0.0005, 0.004, "hard_drawn_wire");
    // Shigley table 10-4 lists hard-drawn wire from 0.7 mm
    expect(ctx.readouts["lift"]!.notes.join(" ")).toMatch(/outside the 0\.7-12\.7 mm of Shigley table 10-4/);
  });

  it("a declared material named like a wire keeps its own strength", () => {
    const mats = builtinMaterials();
    const own = { ...mats.music_wire!, id: "music_wire", builtin: false, strength: 1500e6 };
    const { ctx, tau } = wireArm(0.0025, 0.02, "music_wire", { ...mats, music_wire: own });
    // its own strength, with the carbon-steel body share of table 10-7 (45 %)
    expect(figure(ctx, "lift", "body safety factor")).toBeCloseTo((0.45 * 1500e6) / tau, 9);
  });
});

describe("hole bearing", () => {
  it("bearing stress in the link's wall at the largest reaction", () => {
    const model = cantileverArm(50, { diameter: 0.004, material: "steel_1018", shearPlanes: 2 });
    model.bodies[1]!.holeThickness = 0.003;
    const ctx = runFamily(checkStrength, model, treeSweep(model, [{}]));
    const F = (50 + model.bodies[1]!.mass) * G;
    // bearing stress F / (d t) (docs/formulas.md: 500 N on 4 mm in a 3 mm plate gives 41.67 MPa)
    expect(figure(ctx, "shoulder", "largest hole bearing stress")).toBeCloseTo(F / (0.004 * 0.003), 0);
    expect(500 / (0.004 * 0.003) / 1e6).toBeCloseTo(41.67, 2);
  });
});

describe("spring limits of the other kinds", () => {
  const base = () => baseBody("post", { top: { x: 0, y: 0.3 }, anchor: { x: 0, y: 0.4 } });
  const boom = () => linkBody("boom", L, tube, "aluminium_6061_t6");
  const shoulder = () => joint("shoulder", "post", { x: 0, y: 0.3 }, "boom", 0, "range");
  const hooks = {
    a: { body: "post", point: { x: 0, y: 0.4 }, span: { start: 0, end: 1 } },
    b: { body: "boom", point: { x: 0.2, y: 0 }, span: { start: 0, end: 1 } },
  };
  // hook-to-hook length at boom angle t: anchor 0.1 m above the pivot, hook 0.2 m along the boom
  const length = (t: number) => Math.hypot(0.2 * Math.cos(t), 0.1 - 0.2 * Math.sin(t));

  it("a cord stretched past max_stretch", () => {
    const model = armModel({
      bodies: [base(), boom()],
      joints: [shoulder()],
      springs: [
        {
          id: "cord",
          kind: "elastic",
          ...hooks,
          freeLength: 0.15,
          area: 2e-5,
          material: "petg",
          maxStretch: 1.4,
          origin: origin("max_stretch"),
        },
      ],
    });
    const ctx = runFamily(
      checkSpringStrength,
      model,
      treeSweep(model, [{ shoulder: -0.4 }, { shoulder: 0.4 }]),
    );
    const f = ctx.findings.find((x) => x.code === "strength.overstretch")!;
    // stretch = L / L0 at the lowest pose (the longest)
    expect(f.data!["stretch"]).toBeCloseTo(length(-0.4) / 0.15, 12);
    expect(f.span).toEqual(model.springs[0]!.origin.properties["max_stretch"]);
    expect(ctx.readouts["cord"]!.notes.some((n) => /creep/.test(n))).toBe(true);
  });

  it("a gas strut that would have to be shorter than fully compressed", () => {
    const model = armModel({
      bodies: [base(), boom()],
      joints: [shoulder()],
      springs: [
        {
          id: "strut",
          kind: "gas",
          ...hooks,
          force: 50,
          progression: 1.3,
          stroke: 0.05,
          extendedLength: 0.24,
          origin: origin("stroke", "extended_length"),
        },
      ],
    });
    const ctx = runFamily(
      checkSpringStrength,
      model,
      treeSweep(model, [{ shoulder: -0.2 }, { shoulder: 0.4 }]),
    );
    const f = ctx.findings
      .filter(isCode("strength.overstretch"))
      .find((x) => x.data.limitKey === "stroke" && x.message.includes("bottoms out"))!;
    // fully compressed length = extended length - stroke = 190 mm; the arm needs length(0.4)
    expect(length(0.4)).toBeLessThan(0.19);
    expect(f.data!["length"]).toBeCloseTo(length(0.4), 12);
    expect(f.data!["limit"]).toBeCloseTo(0.19, 12);
  });

  it("a torsion spring wound past max_angle", () => {
    const model = armModel({
      bodies: [base(), boom()],
      joints: [shoulder()],
      springs: [
        {
          id: "coil",
          kind: "torsion",
          joint: "shoulder",
          rate: 0.5,
          preloadTorque: 0,
          maxAngle: 0.3,
          origin: origin("max_angle"),
        },
      ],
    });
    const ctx = runFamily(
      checkSpringStrength,
      model,
      treeSweep(model, [{ shoulder: -0.2 }, { shoulder: 0.5 }]),
    );
    const f = ctx.findings.find((x) => x.code === "strength.overstretch")!;
    // wind-up from free = the joint's turn from its reference (no preload): 0.5 rad
    expect(f.data!["windUp"]).toBeCloseTo(0.5, 12);
  });
});

describe("printed material without a layer strength", () => {
  it("uses half the in-plane strength (docs/materials.md: 0.5, Ahn et al. 2002)", () => {
    const model = cantileverArm(1);
    model.materials = {
      ...model.materials,
      pla_plain: { ...MATERIALS["petg"]!, id: "pla_plain", layerStrength: undefined, strength: 50e6 },
    };
    model.bodies[1] = linkBody("boom", L, { shape: "rect", depth: 0.008, width: 0.004 }, "petg");
    model.bodies[1]!.material = "pla_plain";
    const ctx = runFamily(checkStrength, model, treeSweep(model, [{}]));
    expect(ctx.readouts["boom"]!.worstSafety!.value).toBeCloseTo(
      (0.5 * 50e6) / figure(ctx, "boom", "largest stress")!,
      9,
    );
  });
});
