// Pins and joint bearings loaded in three dimensions (issue 11): an invented cantilevered L of two
// weightless links, the first level from a post and the second hanging down from its end, both
// joints locked and pinned, a mass at the tip pushed sideways (across the drawing plane). The
// space frame's load through each pin is checked against the statics of the parts beyond it, and
// the pin's and the bearing's safety against Shigley's formulas with the moment across the pin
// carried as a couple; then the knuckle arm, whose second link swings sideways on a swivel.
import { describe, expect, it } from "vitest";
import { analyse } from "../../server/src/analysis";
import { checkStrength } from "../../server/src/checks/strength";
import { columnCriticalLoad } from "../../server/src/mechanics/structure/column";
import { checkBearings } from "../../server/src/checks/bearings";
import { buildArmFrame } from "../../server/src/mechanics/structure/arm-frame";
import { jointWrench, pinLoadOf } from "../../server/src/mechanics/structure/joint-wrench";
import type { ArmModel, Bearing, Pin } from "../../server/src/model/types";
import { sectionProperties } from "../../server/src/model/section";
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
import { knuckleArm, L2, P } from "../structure/knuckle-fixture";
import { figure, runFamily } from "./check-context";

const La = 0.3; // m, the level link
const Lb = 0.2; // m, the hanging link
const m = 2; // kg at the tip
const W = m * G;
const F = 6; // N across the plane, towards the reader
const bar = { shape: "rect" as const, depth: 0.02, width: 0.008 };
const d = 0.006; // m, the pins
const steel = MATERIALS["steel_1018"]!;
const al = MATERIALS["aluminium_6061_t6"]!;

function lArm(
  opts: { across?: number; shear?: 1 | 2; bearing?: Bearing; section?: Parameters<typeof linkBody>[2] } = {},
): ArmModel {
  const pin: Pin = { diameter: d, material: "steel_1018", shearPlanes: opts.shear ?? 2 };
  const post = baseBody("post", { top: { x: 0, y: 0.4 } });
  const a = linkBody("a", La, opts.section ?? bar, "aluminium_6061_t6");
  const b = linkBody("b", Lb, opts.section ?? bar, "aluminium_6061_t6");
  // the model gives a link with a section a hole as thick as its width (a tube: both walls)
  for (const body of [a, b]) body.holeThickness = sectionProperties(body.section!).width;
  for (const body of [a, b]) Object.assign(body, { mass: 0, massGiven: true });
  const model = armModel({
    bodies: [post, a, b],
    joints: [
      joint("shoulder", "post", { x: 0, y: 0.4 }, "a", 0, "fixed", { pin }),
      joint("elbow", "a", { x: La, y: 0 }, "b", -Math.PI / 2, "fixed", {
        pin,
        ...(opts.bearing ? { bearing: opts.bearing.id } : {}),
      }),
    ],
    payloads: [payload("tip", "b", { x: Lb, y: 0 }, m, opts.across ? { forceAcross: opts.across } : {})],
  });
  if (opts.bearing) model.bearings = { [opts.bearing.id]: opts.bearing };
  return model;
}

/** The wrench of the tip's loads (weight down, F towards the reader) about a point, as the parent
 * passes it on: force and moment to hold them, split along the pin axis z and across it. Statics
 * of a rigid body in space, sum F = 0 and sum r x F = 0 (Beer and Johnston, Vector Mechanics for
 * Engineers: Statics, ch. 4). */
function byStatics(r: { x: number; y: number; z: number }, across: number) {
  const f = { x: 0, y: -W, z: across };
  const M = { x: r.y * f.z - r.z * f.y, y: r.z * f.x - r.x * f.z, z: r.x * f.y - r.y * f.x };
  return {
    radial: Math.hypot(f.x, f.y),
    axial: Math.abs(f.z),
    momentAcross: Math.hypot(M.x, M.y),
    momentAbout: Math.abs(M.z),
  };
}

const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-12);

describe("the load through a pin, from the space frame", () => {
  it("equals the statics of the parts beyond it (a statically determinate chain)", () => {
    const model = lArm({ across: F });
    const sweep = treeSweep(model, [{}]);
    const pose = sweep.poses[0]!;
    const af = buildArmFrame(model, pose, pose.cases[0], { tip: m });
    const sol = af.frame.solveStatic()!;
    // the tip from the shoulder: La along, Lb down; from the elbow: Lb down
    const cases = [
      ["shoulder", byStatics({ x: La, y: -Lb, z: 0 }, F)],
      ["elbow", byStatics({ x: 0, y: -Lb, z: 0 }, F)],
    ] as const;
    for (const [id, expected] of cases) {
      const got = pinLoadOf(jointWrench(af, sol, id)!);
      // to a millionth of the load and of its moment on the whole L (the elbow's moment about its
      // axis is nought)
      const force = W + F;
      const moment = force * (La + Lb);
      expect(Math.abs(got.radial - expected.radial)).toBeLessThan(1e-6 * force);
      expect(Math.abs(got.axial - expected.axial)).toBeLessThan(1e-6 * force);
      expect(Math.abs(got.momentAcross - expected.momentAcross)).toBeLessThan(1e-6 * moment);
      expect(Math.abs(got.momentAbout - expected.momentAbout)).toBeLessThan(1e-6 * moment);
      expect(expected.momentAcross).toBeGreaterThan(0.05 * moment);
    }
  });
});

describe("a pin loaded across the plane", () => {
  const A = (Math.PI * d * d) / 4;
  // the elbow carries the tip's weight across its axis and F Lb across it as a couple
  const { radial: Fr, momentAcross: M } = byStatics({ x: 0, y: -Lb, z: 0 }, F);
  const t = bar.width; // each link's wall the pin passes through

  it("double shear: the couple as shear forces M / t at the two planes, the holes tilted by it", () => {
    const ctx = runFamily(checkStrength, lArm({ across: F }), treeSweep(lArm({ across: F }), [{}]));
    // Shigley 10th ed., section 5-5: S_sy = 0.577 S_y; average shear V / A in the more loaded of
    // the two planes, V = Fr / 2 + M / t (the couple's arm: the thinner wall between the planes)
    const tau = (Fr / 2 + M / t) / A;
    // bearing on the d x t projected area with the pressure varying linearly along a rigid pin:
    // F / (d t) + 6 M / (d t^2) (common practice, no source), against the weaker of pin and link
    const sigma = Fr / (d * t) + (6 * M) / (d * t * t);
    const expected = Math.min((0.577 * steel.strength) / tau, Math.min(steel.strength, al.strength) / sigma);
    expect(rel(figure(ctx, "elbow", "pin safety factor")!, expected)).toBeLessThan(1e-9);
    // the figures out of the plane: F along the pin, F Lb across it (statics above)
    expect(rel(figure(ctx, "elbow", "largest force along the pin")!, F)).toBeLessThan(1e-6);
    expect(rel(figure(ctx, "elbow", "largest moment across the pin")!, F * Lb)).toBeLessThan(1e-6);
    // the shoulder's couple: F times the tip's whole lever in the plane
    expect(
      rel(figure(ctx, "shoulder", "largest moment across the pin")!, F * Math.hypot(La, Lb)),
    ).toBeLessThan(1e-6);
    const f = ctx.findings.find((x) => x.code === "strength.overstress" && x.data?.["subject"] === "elbow");
    if (f) expect(f.message).toMatch(/across its axis|tilted in the hole/);
  });

  it("single shear: the couple bends the pin at its one plane, combined with the shear by von Mises", () => {
    const model = lArm({ across: F, shear: 1 });
    const ctx = runFamily(checkStrength, model, treeSweep(model, [{}]));
    // Shigley 10th ed., table A-18: the section modulus of a solid round pi d^3 / 32; eq. 5-15:
    // sigma' = sqrt(sigma^2 + 3 tau^2) against S_y
    const sigmaBend = (32 * M) / (Math.PI * d ** 3);
    const tau = Fr / A;
    const pinSafety = steel.strength / Math.sqrt(sigmaBend ** 2 + 3 * tau ** 2);
    const sigmaHole = Fr / (d * t) + (6 * M) / (d * t * t);
    const expected = Math.min(pinSafety, Math.min(steel.strength, al.strength) / sigmaHole);
    expect(rel(figure(ctx, "elbow", "pin safety factor")!, expected)).toBeLessThan(1e-9);
  });

  it("through tubes: each tube's two walls take the couple at their spacing", () => {
    const tube = { shape: "tube" as const, outerDiameter: 0.02, wall: 0.002 };
    const model = lArm({ across: F, section: tube });
    const ctx = runFamily(checkStrength, model, treeSweep(model, [{}]));
    const spacing = tube.outerDiameter - tube.wall; // between the walls' mid-planes
    // Shigley 10th ed., section 5-5; the couple's arm the walls' spacing
    const tau = (Fr / 2 + M / spacing) / A;
    // each wall w thick: the force shared by two, the couple M / spacing on one (common practice)
    const sigma = Fr / (2 * d * tube.wall) + M / spacing / (d * tube.wall);
    const expected = Math.min((0.577 * steel.strength) / tau, Math.min(steel.strength, al.strength) / sigma);
    expect(rel(figure(ctx, "elbow", "pin safety factor")!, expected)).toBeLessThan(1e-9);
  });

  it("in the plane alone the pin keeps its planar figures (no couple, no new figures)", () => {
    const model = lArm();
    const ctx = runFamily(checkStrength, model, treeSweep(model, [{}]));
    // Shigley 10th ed., section 5-5 and the bearing stress F / (d t)
    const expected = Math.min(
      (0.577 * steel.strength) / (W / (2 * A)),
      Math.min(steel.strength, al.strength) / (W / (d * t)),
    );
    expect(figure(ctx, "elbow", "pin safety factor")).toBe(expected);
    expect(figure(ctx, "elbow", "largest moment across the pin")).toBeUndefined();
    expect(figure(ctx, "elbow", "largest force along the pin")).toBeUndefined();
  });
});

describe("a joint's bearing loaded across the plane", () => {
  it("a plain bearing: the moment across the pin tilts it in its bore", () => {
    const bore = 0.006;
    const length = 0.012;
    const bearing: Bearing = {
      id: "sleeve",
      kind: "plain",
      bore,
      length,
      material: "aluminium_6061_t6",
      origin: origin("bore", "length", "material"),
    };
    const model = lArm({ across: F, bearing });
    const ctx = runFamily(checkBearings, model, treeSweep(model, [{}]));
    const { radial: Fr, momentAcross: M } = byStatics({ x: 0, y: -Lb, z: 0 }, F);
    // bore pressure F / (d L) plus 6 M / (d L^2) for the tilting moment (docs/checks.md, Bearings:
    // pressure varying linearly along a rigid pin; common practice, no source)
    const p = Fr / (bore * length) + (6 * M) / (bore * length * length);
    expect(rel(figure(ctx, "elbow", "bearing safety factor")!, al.strength / p)).toBeLessThan(1e-6);
    expect(rel(figure(ctx, "elbow", "largest tilting moment on its bearing")!, F * Lb)).toBeLessThan(1e-6);
  });
});

describe("a stage swung sideways on a swivel", () => {
  it("the root pin carries the turned stage's moment as a couple, largest at a quarter turn", () => {
    const model = knuckleArm();
    const shoulder = model.joints.find((j) => j.id === "shoulder")!;
    shoulder.pin = { diameter: d, material: "steel_1018", shearPlanes: 2 };
    const ctx = runFamily(checkStrength, model, treeSweep(model, [{}]));
    // weightless links and the tip load P: turned by h the tip sits L2 sin h across the plane, so
    // the moment across the root pin (about the boom's axis) is P L2 |sin h|, largest at 90 deg
    // (statics, Beer and Johnston ch. 4); the heading search visits 90 deg
    expect(rel(figure(ctx, "shoulder", "largest moment across the pin")!, P * L2)).toBeLessThan(1e-6);
  });
});

describe("a bar pushed by a stage swung back over it", () => {
  // An invented level parallelogram, locked, with a weightless reach on a swivel at its head and
  // 1 kg at the reach's end. Its upper bar is a two-force member (pinned at both ends, loads only
  // across it): the head's moments about the lower far pin give its axial force,
  // P (Lc cos h) / s, in tension with the reach straight out and in compression with it turned
  // back (h = 180 deg), which the planar sweep never sees.
  const Lc = 0.4;
  const s = 0.05;
  const L = 0.3;
  const text = `# Invented: a locked parallelogram with a reach that swings all the way round.
arm "Reach swung back" {
  base post {
    point root (0 mm, 300 mm)
  }
  parallelogram stage {
    on post.root
    length ${L * 1000} mm
    spacing ${s * 1000} mm
    angle 0 deg
    fixed
    bars rect 10 mm x 4 mm aluminium_6061_t6
    head_mass 0 g
    pins 5 mm steel_1018
    shear double
  }
  link reach {
    length ${Lc * 1000} mm
    mass 0 g
  }
  swivel knuckle {
    connects stage.head to reach.start
  }
  payload tool {
    mass 1 kg
    at reach.end
  }
}
`;
  it("meets the column's critical load at the heading that compresses it (Shigley, columns)", () => {
    const a = analyse(text);
    const buckling = a.readouts["stage.upper"]?.figures.find((f) => f.label === "buckling safety factor");
    expect(buckling, JSON.stringify(a.findings.map((f) => f.message))).toBeDefined();
    const P = 1 * G;
    // statics of the head about the lower far pin (Beer and Johnston ch. 4), h = 180 deg
    const compression = (P * Lc) / s;
    // Shigley 10th ed., section 4-16 (Euler, pinned ends K = 1) and 4-17 (Johnson), about the bar's
    // weaker axis: I = depth width^3 / 12 of the 10 x 4 mm flat
    const depth = 0.01;
    const width = 0.004;
    const col = columnCriticalLoad(al.modulus, depth * width, (depth * width ** 3) / 12, al.strength, L);
    expect(col.method).toBe("Euler");
    const euler = (Math.PI ** 2 * al.modulus * ((depth * width ** 3) / 12)) / (L * L);
    expect(rel(buckling!.value, euler / compression)).toBeLessThan(1e-3);
    // -180 and 180 deg are the same heading
    expect(buckling!.where).toMatch(/knuckle turned -?180 deg/);
  });
});
