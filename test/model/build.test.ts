// The model builder: values in SI, parallelogram expansion per the conventions, derived values
// (link mass, coil rate, preload torque), defaults, and the mobility rule for unheld joints.
import { describe, expect, test } from "vitest";
import { parse } from "../../server/src/syntax/parser";
import { buildModel } from "../../server/src/model/build";
import { REQUIREMENT_DEFAULTS, SWEEP_DEFAULTS } from "../../server/src/model/schema";
import { analyseMobility } from "../../server/src/model/mobility";

const build = (text: string) => buildModel(parse(text), text);
const errorsOf = (text: string) => build(text).findings.filter((f) => f.severity === "error");
const DEG = Math.PI / 180;
const MM = 1e-3;

const STAGE = `arm "stage" {
  gravity 9.81 m/s^2
  base bench {
    mass 3.5 kg
    footprint 220 mm x 180 mm
    point pivot (0 mm, 300 mm)
    point anchor (0 mm, 390 mm)
  }
  parallelogram reach {
    on bench.pivot
    length 350 mm
    spacing 40 mm
    angle 10 deg
    range -30 deg .. 45 deg
    bars tube 12 mm x 1.5 mm aluminium_6061_t6
    head_mass 50 g
    pins 5 mm steel_1018
    shear double
    friction 0.05 N*m
  }
  spring lift {
    zero_length
    between bench.anchor and reach.lower(100 mm, 0 mm)
    rate 0.30 N/mm
  }
  payload camera {
    mass 600 g
    at reach.head(30 mm, -60 mm)
  }
}
`;

describe("parallelogram expansion (conventions.md)", () => {
  const { model, findings } = build(STAGE);
  test("builds without findings", () => {
    expect(findings).toEqual([]);
    expect(model!.gravity).toBe(9.81);
  });
  test("bodies NAME.lower, NAME.upper, NAME.head", () => {
    expect(model!.bodies.map((b) => b.id)).toEqual(["bench", "reach.lower", "reach.upper", "reach.head"]);
    const lower = model!.bodies[1]!;
    expect(lower.kind).toBe("bar");
    expect(lower.length).toBeCloseTo(0.35, 12);
    expect(lower.points.end!.x).toBeCloseTo(0.35, 12);
    expect(lower.points.end!.y).toBe(0);
    // Bar mass = tube area x length x density: A = pi/4 (D^2 - d^2) (Roark 8th ed., section properties)
    const area = (Math.PI / 4) * (0.012 ** 2 - 0.009 ** 2);
    expect(lower.mass).toBeCloseTo(area * 0.35 * 2700, 9);
    const head = model!.bodies[3]!;
    expect(head.kind).toBe("head");
    expect(head.mass).toBeCloseTo(0.05, 12);
    expect(head.points).toEqual({ lower_pivot: { x: 0, y: 0 }, upper_pivot: { x: 0, y: 0.04 } });
  });
  test("four joints with the conventions' points, modes and assembly guesses", () => {
    const j = Object.fromEntries(model!.joints.map((x) => [x.id, x]));
    expect(Object.keys(j)).toEqual(["reach", "reach.upper_root", "reach.lower_far", "reach.upper_far"]);
    expect(j.reach).toMatchObject({
      parent: "bench",
      child: "reach.lower",
      parentPoint: { x: 0, y: 0.3 },
      childPoint: { x: 0, y: 0 },
      mode: "range",
    });
    expect(j.reach!.range![0]).toBeCloseTo(-30 * DEG, 12);
    expect(j.reach!.range![1]).toBeCloseTo(45 * DEG, 12);
    expect(j.reach!.angle).toBeCloseTo(10 * DEG, 12);
    expect(j.reach!.friction).toBeCloseTo(0.05, 12);
    // Upper root pivot = root point + (0, spacing) in the parent's frame
    expect(j["reach.upper_root"]!.parentPoint.x).toBeCloseTo(0, 12);
    expect(j["reach.upper_root"]!.parentPoint.y).toBeCloseTo(0.34, 12);
    expect(j["reach.upper_root"]).toMatchObject({ child: "reach.upper", mode: "passive" });
    expect(j["reach.upper_root"]!.angle).toBeCloseTo(10 * DEG, 12);
    expect(j["reach.lower_far"]).toMatchObject({
      parent: "reach.lower",
      child: "reach.head",
      childPoint: { x: 0, y: 0 },
      mode: "passive",
    });
    expect(j["reach.lower_far"]!.parentPoint.x).toBeCloseTo(0.35, 12);
    expect(j["reach.lower_far"]!.angle).toBeCloseTo(-10 * DEG, 12);
    expect(j["reach.upper_far"]).toMatchObject({
      parent: "reach.upper",
      child: "reach.head",
      childPoint: { x: 0, y: 0.04 },
      mode: "passive",
    });
    // Pins on every joint, friction on the lower root only
    for (const x of Object.values(j))
      expect(x.pin).toEqual({ diameter: 0.005, material: "steel_1018", shearPlanes: 2 });
    expect(j["reach.upper_root"]!.friction).toBeUndefined();
  });
  test("the parallelogram record", () => {
    expect(model!.parallelograms[0]).toMatchObject({
      id: "reach",
      parent: "bench",
      rootPoint: { x: 0, y: 0.3 },
      joints: {
        lowerRoot: "reach",
        upperRoot: "reach.upper_root",
        lowerFar: "reach.lower_far",
        upperFar: "reach.upper_far",
      },
      bodies: { lower: "reach.lower", upper: "reach.upper", head: "reach.head" },
    });
    expect(model!.parallelograms[0]!.upperLength).toBeCloseTo(0.35, 12);
  });
  test("attachments and payload", () => {
    const s = model!.springs[0]!;
    expect(s.kind).toBe("zero_length");
    if (s.kind === "zero_length") {
      expect(s.a).toMatchObject({ body: "bench", point: { x: 0, y: 0.39 }, pointName: "anchor" });
      expect(s.b.body).toBe("reach.lower");
      expect(s.b.point.x).toBeCloseTo(0.1, 12);
      // 0.30 N/mm = 300 N/m
      expect(s.rate).toBeCloseTo(300, 9);
    }
    expect(model!.payloads[0]).toMatchObject({ id: "camera", body: "reach.head", mass: 0.6 });
    expect(model!.payloads[0]!.point.y).toBeCloseTo(-0.06, 12);
  });
  test("base", () => {
    expect(model!.base).toEqual({
      bodyId: "bench",
      mass: 3.5,
      footprint: { width: 0.22, depth: 0.18 },
      yaw: false,
      surface: 0,
    });
  });
});

describe("derived values", () => {
  test("link mass = section area x length x density, unless `mass`", () => {
    const text = `arm "a" {
  base b { point top (0 mm, 0 mm) }
  link boom {
    length 300 mm
    section rect 15 mm x 5 mm
    material pla
  }
  link light {
    length 300 mm
    mass 0 g
  }
  joint j { connects b.top to boom.start; range 0 deg .. 10 deg }
  joint k { connects boom.end to light.start; fixed }
}`;
    const { model, findings } = build(text);
    expect(findings).toEqual([]);
    // rect: A = b h (Roark 8th ed.); PLA 1.24 g/cm^3 (Tymrak et al. 2014, from memory)
    expect(model!.bodies[1]!.mass).toBeCloseTo(0.015 * 0.005 * 0.3 * 1240, 12);
    expect(model!.bodies[1]!.centreOfMass).toEqual({ x: 0.15, y: 0 });
    expect(model!.bodies[1]!.holeThickness).toBeCloseTo(0.005, 12);
    expect(model!.bodies[2]).toMatchObject({ mass: 0, massGiven: true });
    expect(model!.joints[1]!.mode).toBe("fixed");
  });

  test("extension spring rate from the coil: k = G d^4 / (8 D^3 Na), Na = Nb + G/E (Shigley ch. 10)", () => {
    const text = `arm "a" {
  base b { point top (0 mm, 0 mm); point hook (0 mm, 50 mm) }
  link boom { length 300 mm; mass 100 g }
  joint j { connects b.top to boom.start; range 0 deg .. 10 deg }
  spring s {
    extension
    between b.hook and boom.end
    wire 1.2 mm
    coil 9.6 mm
    coils 20
    material music_wire
    free_length 40 mm
    initial_tension 5 N
  }
}`;
    const { model, findings } = build(text);
    expect(findings).toEqual([]);
    const s = model!.springs[0]!;
    // Music wire G = 81.7 GPa, E = 200 GPa (Shigley table 10-5); worked value 1173 N/m
    const G = 81.7e9,
      E = 200e9;
    if (s.kind !== "extension") throw new Error("kind");
    expect(s.rate).toBeCloseTo((G * 1.2e-3 ** 4) / (8 * 9.6e-3 ** 3 * (20 + G / E)), 9);
    expect(s.rate).toBeCloseTo(1173, 0);
    expect(s.coil).toEqual({
      wireDiameter: 1.2e-3,
      meanDiameter: 9.6e-3,
      bodyCoils: 20,
      material: "music_wire",
    });
    expect(s.initialTension).toBe(5);
  });

  test("torsion preload as an angle becomes rate x angle; at a parallelogram means its lower root", () => {
    const text = STAGE.replace(
      "  payload camera",
      `  spring coil {
    torsion
    at reach
    rate 0.004 N*m/deg
    preload 30 deg
  }
  spring wound {
    torsion
    at reach
    rate 0.2 N*m/rad
    preload 0.1 N*m
  }
  payload camera`,
    );
    const { model, findings } = build(text);
    expect(findings).toEqual([]);
    const [, coil, wound] = model!.springs;
    if (coil!.kind !== "torsion" || wound!.kind !== "torsion") throw new Error("kind");
    // 0.004 N*m/deg = 0.004 x 180/pi N*m/rad; preload torque = rate x angle = 0.12 N*m
    expect(coil!.rate).toBeCloseTo(0.004 / DEG, 12);
    expect(coil!.preloadTorque).toBeCloseTo(0.004 * 30, 12);
    expect(coil!.joint).toBe("reach");
    expect(wound!.preloadTorque).toBeCloseTo(0.1, 12);
  });

  test("elastic cord tube area: A0 = pi/4 (OD^2 - ID^2); Treloar worked tube 6 x 3 mm bore gives 21.21 mm^2", () => {
    const text = STAGE.replace("    zero_length\n", "    elastic\n").replace(
      "    rate 0.30 N/mm\n",
      "    free_length 50 mm\n    tube 6 mm x 1.5 mm\n    material natural_latex\n",
    );
    const { model, findings } = build(text);
    expect(findings).toEqual([]);
    const s = model!.springs[0]!;
    if (s.kind !== "elastic") throw new Error("kind");
    expect(s.area / MM ** 2).toBeCloseTo(21.21, 2);
  });
});

describe("defaults and caps", () => {
  test("requirements take REQUIREMENT_DEFAULTS; per-payload limits", () => {
    const { model } = build(STAGE);
    expect(model!.require).toMatchObject({
      balance: { default: REQUIREMENT_DEFAULTS.balanceN, byPayload: {} },
      safety: 2,
      frequency: 4,
      tipping: 1.5,
      clearance: 0.003,
    });
    const withReq = build(
      STAGE.replace(
        "  payload camera",
        "  require {\n    balance 1.5 N at camera\n    balance 2 N\n    safety 2.5\n    tilt 1 deg at camera\n  }\n  payload camera",
      ),
    );
    expect(withReq.findings).toEqual([]);
    expect(withReq.model!.require.balance).toEqual({ default: 2, byPayload: { camera: 1.5 } });
    expect(withReq.model!.require.safety).toBe(2.5);
    expect(withReq.model!.require.tilt.byPayload.camera).toBeCloseTo(DEG, 12);
  });
  test("sweep defaults; steps capped at maxSteps with sweep.capped", () => {
    expect(build(STAGE).model!.sweep).toEqual({ steps: SWEEP_DEFAULTS.steps, grid: true });
    const capped = build(
      STAGE.replace("  payload camera", "  sweep {\n    steps 99999\n    grid off\n  }\n  payload camera"),
    );
    expect(capped.findings.map((f) => f.code)).toEqual(["sweep.capped"]);
    expect(capped.model!.sweep).toMatchObject({
      steps: SWEEP_DEFAULTS.maxSteps,
      requestedSteps: 99999,
      grid: false,
    });
  });
});

describe("best effort with errors", () => {
  test("the model keeps what can be built; findings point at the words", () => {
    const text = STAGE.replace("rate 0.30 N/mm", "rate 0.30 N").replace("mass 600 g", "mass 600");
    const { model, findings } = build(text);
    expect(findings.map((f) => [f.code, text.slice(f.span.start, f.span.end)])).toEqual([
      ["unit.wrong-dimension", "N"],
      ["unit.missing", "600"],
    ]);
    expect(model!.bodies).toHaveLength(4);
    // The spring stays (its hooks resolve) with 0 for the rate it could not read.
    expect(model!.springs).toHaveLength(1);
    expect(model!.springs[0]).toMatchObject({ id: "lift", rate: 0 });
    expect(model!.payloads[0]).toMatchObject({ id: "camera", mass: 0 });
  });
  test("origins keep the spans of declarations, names and properties", () => {
    const { model } = build(STAGE);
    const lift = model!.springs[0]!;
    expect(STAGE.slice(lift.origin.name!.start, lift.origin.name!.end)).toBe("lift");
    expect(STAGE.slice(lift.origin.properties.rate!.start, lift.origin.properties.rate!.end)).toBe(
      "rate 0.30 N/mm",
    );
    expect(model!.bodies[1]!.origin.generatedBy).toBe("reach");
  });
  test("no arm: arm.missing; second arm: arm.second", () => {
    expect(errorsOf("# nothing\n").map((f) => f.code)).toEqual(["arm.missing"]);
    expect(errorsOf('arm "a" {\n base b {}\n}\narm "b" {\n}\n').map((f) => f.code)).toEqual(["arm.second"]);
  });
  test("a spring with two kinds, or none", () => {
    const two = STAGE.replace("    zero_length\n", "    zero_length\n    extension\n");
    expect(errorsOf(two).map((f) => f.code)).toContain("property.conflict");
  });
});

describe("mobility (Gruebler-Kutzbach per biconnected block)", () => {
  const j = (id: string, parent: string, child: string, passive: boolean) => ({ id, parent, child, passive });
  test("an open chain: a passive joint is unheld, a driven one is not", () => {
    const r = analyseMobility(["g", "a", "b"], "g", [j("s", "g", "a", false), j("e", "a", "b", true)]);
    expect(r.unheld).toEqual([{ passiveJoints: ["e"], mobility: 1 }]);
    expect(r.unconnected).toEqual([]);
  });
  test("a four-bar: mobility 3 (4 - 1) - 2 x 4 = 1, held by one driven joint", () => {
    const fourBar = (drivenFirst: boolean) => [
      j("a", "g", "l1", !drivenFirst),
      j("b", "g", "l2", true),
      j("c", "l1", "h", true),
      j("d", "l2", "h", true),
    ];
    expect(analyseMobility(["g", "l1", "l2", "h"], "g", fourBar(true)).unheld).toEqual([]);
    expect(analyseMobility(["g", "l1", "l2", "h"], "g", fourBar(false)).unheld).toEqual([
      { passiveJoints: ["a", "b", "c", "d"], mobility: 1 },
    ]);
  });
  test("a passive tail after a held loop is still unheld; unconnected bodies are listed", () => {
    const joints = [
      j("a", "g", "l1", false),
      j("b", "g", "l2", true),
      j("c", "l1", "h", true),
      j("d", "l2", "h", true),
      j("t", "h", "tail", true),
    ];
    const r = analyseMobility(["g", "l1", "l2", "h", "tail", "loose"], "g", joints);
    expect(r.unheld).toEqual([{ passiveJoints: ["t"], mobility: 1 }]);
    expect(r.unconnected).toEqual(["loose"]);
  });
  test("a triangle of passive joints is rigid: 3 (3 - 1) - 2 x 3 = 0", () => {
    const r = analyseMobility(["g", "a", "b"], "g", [
      j("x", "g", "a", true),
      j("y", "a", "b", true),
      j("z", "b", "g", true),
    ]);
    expect(r.unheld).toEqual([]);
  });
});

describe("one finding per mistake, at the word", () => {
  const base = `  base foot { point top (0 mm, 100 mm); point hook (0 mm, 150 mm) }
  link boom { length 300 mm; mass 100 g }
  joint sh { connects foot.top to boom.start; range 0 deg .. 30 deg }
  parallelogram reach { on boom.end; length 200 mm; spacing 30 mm; range 0 deg .. 10 deg; bars rect 10 mm x 4 mm petg }
`;
  const cases: [string, string, string][] = [
    ["joint j2 { connects foot.top boom.end; fixed }", "value.invalid", "boom.end"],
    [
      "spring s { extension\n between foot.hook boom.end\n rate 1 N/mm\n free_length 20 mm }",
      "value.invalid",
      "boom.end",
    ],
    ["payload p { mass 1 kg; at reach.lowr(1 mm, 0 mm) }", "name.unknown", "lowr"],
    ["payload p { mass 1 kg; at reach }", "value.invalid", "reach"],
    ["payload p { mass 1 kg; at sh }", "value.invalid", "sh"],
    ["payload p { mass 1 kg; at boom.end(1 mm, 0 mm) }", "value.invalid", "(1 mm, 0 mm)"],
    ["spring s { gas\n between foot.hook and boom.end }", "property.missing", "s"],
    ["spring s { torsion\n at boom\n rate 2 N*m/rad }", "value.invalid", "boom"],
    [
      "spring s { extension\n between foot.hook and boom.end\n rate 2 N*m/rad\n free_length 20 mm }",
      "unit.wrong-dimension",
      "N*m/rad",
    ],
    ["sweep { grid maybe }", "value.invalid", "maybe"],
  ];
  for (const [decl, code, word] of cases) {
    test(`${code} on \`${word}\` in ${decl.split("\n")[0]}`, () => {
      const text = `arm "x" {\n${base}  ${decl}\n}\n`;
      const declStart = text.indexOf(decl);
      const at = text.indexOf(word, declStart + (word === "s" ? 7 : 0));
      const findings = build(text).findings.filter((f) => f.severity === "error");
      expect(findings.map((f) => [f.code, text.slice(f.span.start, f.span.end)])).toEqual([[code, word]]);
      expect(findings[0]!.span.start).toBe(at);
    });
  }
});
