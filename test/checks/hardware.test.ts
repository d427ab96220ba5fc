// The hardware checks on whole arms: each expected figure is computed here from the published
// formula and the loads the sweep found at each pose (a spring's pull, a joint's reaction and
// locked moment), independently of the check's own code path.
import { describe, expect, it } from "vitest";
import { analyse, type Analysis } from "../../server/src/analysis";
import { isCode } from "../../server/src/findings/finding";
import { builtinMaterials } from "../../server/src/model/materials";

const mats = builtinMaterials();
const figure = (a: Analysis, id: string, label: string) =>
  a.readouts[id]?.figures.find((f) => f.label === label)?.value;

/** An arm whose boom carries a spring lug screwed to its top face (hook at 12 mm above the axis),
 * with other hardware swapped in by the caller. */
const arm = (parts: { lug?: string; joint?: string; spring?: string; extra?: string }) => `arm "hardware" {
  base bench {
    point top (0 mm, 250 mm)
    point anchor (-40 mm, 262 mm)
  }
  link boom {
    length 300 mm
    section rect 20 mm x 10 mm
    material pla
    point lug (100 mm, 12 mm)
  }
  joint shoulder {
    connects bench.top to boom.start
    range -20 deg .. 20 deg
    ${parts.joint ?? ""}
  }
  spring lift {
    zero_length
    between bench.anchor and boom.lug
    rate 1.5 N/mm
    hook_fastening lug
    ${parts.spring ?? ""}
  }
  payload lamp {
    mass 600 g
    at boom.end
  }
  fastening lug { ${parts.lug ?? "screws 2 x 3 mm; into pla; engagement 6 mm; spacing 10 mm"} }
  sweep { steps 9 }
  ${parts.extra ?? ""}
}`;

/** The spring's pull on the boom at every pose, in the boom's frame: along and across its axis. */
function hookLoads(a: Analysis): { along: number; across: number }[] {
  return a.sweep!.poses.map((pose) => {
    const st = pose.springs["lift"]!;
    const T = pose.cases[0]!.springForce["lift"]!;
    const ux = (st.a.x - st.b.x) / st.length;
    const uy = (st.a.y - st.b.y) / st.length;
    const phi = pose.bodies["boom"]!.phi;
    const fx = T * ux;
    const fy = T * uy;
    return {
      along: Math.cos(phi) * fx + Math.sin(phi) * fy,
      across: -Math.sin(phi) * fx + Math.cos(phi) * fy,
    };
  });
}

describe("strength.fastening", () => {
  it("a lug's screws in PLA: prying about the lug's edge and thread stripping (FED-STD-H28/2, Shigley ch. 8)", () => {
    const a = analyse(arm({ lug: "screws 2 x 3 mm; into pla; engagement 3 mm; spacing 10 mm" }));
    const d = 3e-3;
    const P = 0.5e-3; // ISO 261 coarse pitch of M3
    const S = 10e-3;
    const h = 12e-3; // the hook's height above the boom's axis: the lever
    // FED-STD-H28/2 appendix A, internal thread with basic dimensions: pi n Le d [1/(2n) +
    // 0.57735 (d - d2)], d2 = d - 0.649519 P; a formed thread counts 60 % of its engagement
    // (common practice); PLA's teeth shear across its layers at 0.577 of the layer strength
    const Le = 0.6 * 3e-3;
    const area = Math.PI * (1 / P) * Le * d * (P / 2 + 0.57735 * 0.649519 * P);
    const strip = area * 0.577 * mats.pla!.layerStrength!;
    // Shigley ch. 8, a bracket tipping about its edge: F_i = P / n + M c_i / sum c^2, the edge
    // half a spacing beyond the outer screw (c = S/2, 3S/2), M = along x lever
    const c = [S / 2, (3 * S) / 2];
    const sumC2 = c[0]! ** 2 + c[1]! ** 2;
    let least = Infinity;
    for (const l of hookLoads(a)) {
      const T = Math.max(l.across, 0) / 2 + (Math.abs(l.along) * h * c[1]!) / sumC2;
      least = Math.min(least, strip / T);
    }
    const f = a.findings.find(isCode("strength.fastening"));
    expect(figure(a, "lug", "at the hook of spring lift: safety factor")).toBeCloseTo(least, 6);
    // the spring runs nearly along the boom: its pull pries the lug and strips the screws
    expect(least).toBeLessThan(2);
    expect(f?.data.check).toBe("thread stripping");
    expect(f?.data.safety).toBeCloseTo(least, 6);
    expect(f?.span).toEqual(a.model!.springs[0]!.origin.properties["hook_fastening"]);
  });

  it("a fixed joint held by two bolts through the plane: the group's shear (Shigley ch. 8)", () => {
    const text = arm({
      extra: `link tip {
    length 80 mm
    mass 20 g
  }
  joint wrist {
    connects boom.end to tip.start
    angle -40 deg
    fixed
    fastening wrist_bolts
  }
  payload pen {
    mass 300 g
    at tip.end
  }
  fastening wrist_bolts { bolts 2 x 4 mm steel_8_8; spacing 12 mm }`,
    });
    const a = analyse(text);
    const S = 12e-3;
    const d = 4e-3;
    const P = 0.7e-3;
    // root area (pi/4) d3^2, d3 = d - 1.226869 P (ISO 724); von Mises sqrt(3) tau against the proof
    // strength of class 8.8 (ISO 898-1: 580 MPa)
    const Ar = (Math.PI / 4) * (d - 1.226869 * P) ** 2;
    let least = Infinity;
    for (const pose of a.sweep!.poses) {
      const R = pose.cases[0]!.reactions["wrist"]!;
      const M = pose.cases[0]!.lockedTorque["wrist"]!;
      const phi = pose.bodies["tip"]!.phi;
      const along = Math.cos(phi) * R.x + Math.sin(phi) * R.y;
      const across = -Math.sin(phi) * R.x + Math.cos(phi) * R.y;
      // primary V / 2 on each bolt, secondary M r / sum r^2 = M / S at right angles to the row
      const worst = Math.max(
        Math.hypot(along / 2, across / 2 + M / S),
        Math.hypot(along / 2, across / 2 - M / S),
      );
      least = Math.min(least, 580e6 / (Math.sqrt(3) * (worst / Ar)));
    }
    expect(figure(a, "wrist_bolts", "at joint wrist: safety factor")! / least).toBeCloseTo(1, 5);
  });

  it("one screw cannot hold a fixed joint's moment", () => {
    const text = arm({
      extra: `link tip {
    length 80 mm
    mass 20 g
  }
  joint wrist {
    connects boom.end to tip.start
    fixed
    fastening one_screw
  }
  fastening one_screw { screws 1 x 4 mm; into pla; engagement 8 mm }`,
    });
    const f = analyse(text).findings.find(isCode("strength.fastening"))!;
    expect(f.data.check).toBe("cannot hold a moment");
    expect(f.message).toMatch(/one screw cannot hold the moment/);
  });

  it("glue on the lug: shear and peel over the bond, with the peel caution", () => {
    const a = analyse(arm({ lug: "adhesive epoxy; area 200 mm^2" }));
    const A = 200e-6;
    const side = Math.sqrt(A);
    const h = 12e-3;
    let least = Infinity;
    for (const l of hookLoads(a)) {
      // mean lap shear F / A; the pull and prying moment across a square bond: P / A + 6 M / a^3
      const tau = Math.abs(l.along) / A;
      const sigma = Math.max(l.across, 0) / A + (6 * Math.abs(l.along) * h) / side ** 3;
      least = Math.min(least, 15e6 / Math.max(tau, sigma));
    }
    expect(figure(a, "lug", "at the hook of spring lift: safety factor")).toBeCloseTo(least, 6);
    expect(a.readouts["lug"]!.notes.join(" ")).toMatch(/peel/);
  });
});

describe("strength.bearing", () => {
  it("a plain bearing at the joint: p = F / (d L) at the largest reaction, against PETG's layer strength", () => {
    const a = analyse(
      arm({ joint: "bearing sleeve", extra: "bearing sleeve { bore 6 mm; length 8 mm; material petg }" }),
    );
    let largest = 0;
    for (const pose of a.sweep!.poses) {
      const R = pose.cases[0]!.reactions["shoulder"]!;
      largest = Math.max(largest, Math.hypot(R.x, R.y));
    }
    const p = largest / (6e-3 * 8e-3);
    expect(figure(a, "sleeve", "at shoulder: bore pressure")).toBeCloseTo(p, 0);
    expect(figure(a, "shoulder", "bearing safety factor")).toBeCloseTo(mats.petg!.layerStrength! / p, 9);
  });

  it("a bought bearing at the joint: ISO 76, P0 = Fr for a pure radial load, s0 = C0 / P0", () => {
    const a = analyse(arm({ joint: "bearing bought", extra: "bearing bought { static_rating 100 N }" }));
    let largest = 0;
    for (const pose of a.sweep!.poses) {
      const R = pose.cases[0]!.reactions["shoulder"]!;
      largest = Math.max(largest, Math.hypot(R.x, R.y));
    }
    // ISO 76: P0 = max(0.6 Fr + 0.5 Fa, Fr) = Fr without axial load
    expect(figure(a, "shoulder", "bearing safety factor")).toBeCloseTo(100 / largest, 9);
    const f = a.findings.find(isCode("strength.bearing"));
    if (100 / largest < 2) expect(f?.data.check).toBe("static rating");
  });
});

describe("strength.spring-end", () => {
  const coilArm = (extra: string) =>
    arm({}).replace(
      "    zero_length\n    between bench.anchor and boom.lug\n    rate 1.5 N/mm",
      `    extension\n    between bench.anchor and boom.lug\n    wire 1.4 mm\n    coil 10 mm\n    coils 12\n    material music_wire\n    free_length 30 mm\n${extra}`,
    );

  it("hook bending at the largest pull: Shigley 10th ed. eq. 10-34 against 75 % of S_ut (table 10-7)", () => {
    const a = analyse(coilArm(""));
    let Fmax = 0;
    for (const pose of a.sweep!.poses) Fmax = Math.max(Fmax, Math.abs(pose.cases[0]!.springForce["lift"]!));
    const d = 1.4e-3;
    const D = 10e-3;
    // default hook: r1 = D / 2, so C1 = D / d
    const C1 = D / d;
    const KA = (4 * C1 * C1 - C1 - 1) / (4 * C1 * (C1 - 1));
    const sigmaA = Fmax * ((KA * 16 * D) / (Math.PI * d ** 3) + 4 / (Math.PI * d * d));
    // Shigley table 10-4: music wire S_ut = 2211 / d^0.145 MPa, d in mm
    const Sut = (2211 / 1.4 ** 0.145) * 1e6;
    expect(figure(a, "lift", "hook bending stress")).toBeCloseTo(sigmaA, 0);
    expect(figure(a, "lift", "hook bending safety factor")).toBeCloseTo((0.75 * Sut) / sigmaA, 9);
  });

  it("a free length shorter than the solid body and its hooks", () => {
    const a = analyse(coilArm("").replace("free_length 30 mm", "free_length 20 mm"));
    const f = a.findings.filter(isCode("strength.spring-end")).find((x) => x.data.check === "body room")!;
    // Shigley section 10-11: L0 = 2 (D - d) + (Nb + 1) d
    expect(f.data.shortest).toBeCloseTo(2 * (10e-3 - 1.4e-3) + 13 * 1.4e-3, 12);
    expect(f.span).toEqual(a.model!.springs[0]!.origin.properties["free_length"]);
  });

  it("initial tension beyond what can be wound is a warning", () => {
    const a = analyse(coilArm("    initial_tension 60 N\n"));
    const f = a.findings
      .filter(isCode("strength.spring-end"))
      .find((x) => x.data.check === "initial tension")!;
    expect(f.severity).toBe("warning");
    // Shigley section 10-11: the preferred range's top, 33 500 / exp(0.105 C) + 1000 (4 - (C - 3)/6.5) psi
    const C = 10 / 1.4;
    const psi = (0.45359237 * 9.80665) / 0.0254 ** 2;
    expect(f.data.allowable).toBeCloseTo((33500 / Math.exp(0.105 * C) + 1000 * (4 - (C - 3) / 6.5)) * psi, 0);
  });

  it("a torsion spring's wire: sigma = K_i 32 M / (pi d^3) at its largest torque (Shigley section 10-12)", () => {
    const text = arm({}).replace(
      /  spring lift \{[\s\S]*?\n  \}\n/,
      `  spring coil {
    torsion
    at shoulder
    rate 0.02 N*m/deg
    preload 60 deg
    wire 2 mm
    coil 16 mm
    material music_wire
  }
`,
    );
    const a = analyse(
      text.replace("fastening lug { screws 2 x 3 mm; into pla; engagement 6 mm; spacing 10 mm }", ""),
    );
    let M = 0;
    for (const pose of a.sweep!.poses) M = Math.max(M, Math.abs(pose.cases[0]!.springForce["coil"]!));
    const C = 8;
    const Ki = (4 * C * C - C - 1) / (4 * C * (C - 1));
    const sigma = (Ki * 32 * M) / (Math.PI * 0.002 ** 3);
    expect(figure(a, "coil", "wire bending stress")).toBeCloseTo(sigma, 0);
    // music wire: S_y = 0.78 S_ut for torsion springs (Shigley section 10-12, from memory)
    expect(figure(a, "coil", "wire safety factor")).toBeCloseTo(
      (0.78 * (2211 / 2 ** 0.145) * 1e6) / sigma,
      9,
    );
  });
});
