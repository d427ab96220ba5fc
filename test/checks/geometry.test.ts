// Geometry checks: spring toggle (lever arm a b cos(theta) / L, docs/formulas.md), slack extension
// springs, parallelogram head tilt from unequal bars (loop closure solved here by bisection),
// clearance between bodies and to the bench.
import { describe, expect, it } from "vitest";
import { checkGeometry, leverArm, segmentDistance } from "../../server/src/checks/geometry";
import { solveSweep } from "../../server/src/mechanics/sweep";
import type { ExtensionSpring } from "../../server/src/model/types";
import { ArmBuilder, deg } from "../mechanics/arm-builder";
import { armModel, baseBody, joint, linkBody, origin, payload, treeSweep } from "../structure/arm-fixture";
import { runFamily } from "./check-context";

const rect = { shape: "rect" as const, depth: 0.02, width: 0.005 };

/** A boom on a pivot at the origin, spring from an anchor `a` above the pivot to `b` along the boom. */
function springBoom(a: number, b: number, freeLength: number) {
  const base = baseBody("post", { pivot: { x: 0, y: 0 }, anchor: { x: 0, y: a } });
  const boom = linkBody("boom", 0.3, rect, "aluminium_6061_t6");
  const spring: ExtensionSpring = {
    id: "lift",
    kind: "extension",
    a: { body: "post", point: { x: 0, y: a }, span: { start: 0, end: 1 } },
    b: { body: "boom", point: { x: b, y: 0 }, span: { start: 0, end: 1 } },
    rate: 500,
    freeLength,
    initialTension: 1,
    origin: origin("between", "rate", "free_length"),
  };
  const model = armModel({
    bodies: [base, boom],
    joints: [joint("shoulder", "post", { x: 0, y: 0 }, "boom", 0, "range", { range: [-1, 1.55] })],
    springs: [spring],
  });
  model.base = { bodyId: "post", mass: 0, yaw: false, surface: -1 };
  return model;
}

describe("spring toggle", () => {
  it("lever arm of a spring about the pivot", () => {
    // docs/formulas.md (gravity balancing): the lever arm is a b cos(theta) / L with
    // L = sqrt(a^2 + b^2 - 2 a b sin(theta))
    const a = 0.05;
    const b = 0.1;
    const t = 0.7;
    const L = Math.sqrt(a * a + b * b - 2 * a * b * Math.sin(t));
    expect(leverArm({ x: 0, y: a }, { x: b * Math.cos(t), y: b * Math.sin(t) }, { x: 0, y: 0 })).toBeCloseTo(
      (a * b * Math.cos(t)) / L,
      12,
    );
  });

  it("flags the pose where the line of action nearly passes through the pivot", () => {
    const model = springBoom(0.05, 0.1, 0.03);
    const ctx = runFamily(
      checkGeometry,
      model,
      treeSweep(model, [{ shoulder: 0 }, { shoulder: 1.0 }, { shoulder: 1.55 }]),
    );
    const f = ctx.findings.find((x) => x.code === "geometry.spring-toggle")!;
    expect(f.span).toEqual(model.springs[0]!.origin.properties["between"]);
    const t = 1.55;
    const L = Math.sqrt(0.05 ** 2 + 0.1 ** 2 - 2 * 0.05 * 0.1 * Math.sin(t));
    // docs/formulas.md: lever arm a b cos(theta) / L at the worst pose
    expect(f.data!["leverArm"]).toBeCloseTo((0.05 * 0.1 * Math.cos(t)) / L, 12);
    expect(f.message).toContain("shoulder 88.81 deg");
  });

  it("stays quiet while the lever arm is healthy", () => {
    const model = springBoom(0.05, 0.1, 0.03);
    const ctx = runFamily(
      checkGeometry,
      model,
      treeSweep(model, [{ shoulder: -1 }, { shoulder: 0 }, { shoulder: 1.0 }]),
    );
    expect(ctx.findings.filter((x) => x.code === "geometry.spring-toggle")).toEqual([]);
  });
});

describe("slack spring", () => {
  it("reports the poses where an extension spring is at or below its free length", () => {
    const model = springBoom(0.05, 0.1, 0.12);
    const ctx = runFamily(
      checkGeometry,
      model,
      treeSweep(model, [{ shoulder: -0.5 }, { shoulder: 0 }, { shoulder: 0.5 }]),
    );
    const f = ctx.findings.find((x) => x.code === "geometry.spring-slack")!;
    // geometry: L(theta) = sqrt(a^2 + b^2 - 2 a b sin theta) = 131.5, 111.8, 85.7 mm against 120 mm
    expect(f.data!["poses"]).toBe(2);
    expect(f.span).toEqual(model.springs[0]!.origin.properties["free_length"]);
  });
});

describe("head tilt of a parallelogram with unequal bars", () => {
  it("matches the loop closure", () => {
    const L = 0.32;
    const Lu = 0.322;
    const s = 0.024;
    const model = new ArmBuilder("clamp", { pivot: { x: 0, y: 0.2 } })
      .parallelogram(
        "stage",
        "clamp",
        { x: 0, y: 0.2 },
        {
          length: L,
          upperLength: Lu,
          spacing: s,
          angle: 0,
          range: [deg(-35), deg(35)],
          barMass: 0.01,
          headMass: 0,
        },
      )
      .sweep(15)
      .build();
    model.require.tilt.default = deg(0.5);
    const sweep = solveSweep(model);
    const ctx = runFamily(checkGeometry, model, sweep);
    // Loop closure: lower far pivot at L (cos t, sin t), head turned by psi, its upper pivot at
    // that point + s (-sin psi, cos psi), which must lie Lu from the upper root (0, s).
    const headAngle = (t: number) => {
      const gap = (psi: number) =>
        Math.hypot(L * Math.cos(t) - s * Math.sin(psi), L * Math.sin(t) + s * Math.cos(psi) - s) - Lu;
      let lo = -0.5;
      let hi = 0.5; // branch near psi = 0; gap(lo) > 0 > gap(hi)
      for (let k = 0; k < 200; k++) {
        const mid = (lo + hi) / 2;
        if (gap(mid) > 0) lo = mid;
        else hi = mid;
      }
      return (lo + hi) / 2;
    };
    const angles = Array.from({ length: 15 }, (_, k) => deg(-35 + 5 * k)).map(headAngle);
    const change = Math.max(...angles) - Math.min(...angles);
    const f = ctx.findings.find((x) => x.code === "geometry.tilt")!;
    expect(f).toBeDefined();
    expect(f.data!["change"]).toBeCloseTo(change, 6);
    expect(f.span).toEqual(
      model.parallelograms[0]!.origin.properties["upper_length"] ?? model.parallelograms[0]!.origin.name,
    );
  });

  it("equal bars on the base keep the head level", () => {
    const model = new ArmBuilder("clamp", { pivot: { x: 0, y: 0.2 } })
      .parallelogram(
        "stage",
        "clamp",
        { x: 0, y: 0.2 },
        { length: 0.3, spacing: 0.03, angle: 0, range: [deg(-30), deg(30)], barMass: 0.01, headMass: 0 },
      )
      .sweep(7)
      .build();
    const ctx = runFamily(checkGeometry, model, solveSweep(model));
    expect(ctx.findings.filter((x) => x.code === "geometry.tilt")).toEqual([]);
  });
});

describe("clearance", () => {
  it("segment distance", () => {
    // plane geometry: parallel segments 1 apart; crossing segments touch
    expect(segmentDistance({ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 0, y: 1 }, { x: 1, y: 1 })).toBeCloseTo(
      1,
      12,
    );
    expect(segmentDistance({ x: 0, y: 0 }, { x: 1, y: 1 }, { x: 0, y: 1 }, { x: 1, y: 0 })).toBe(0);
  });

  it("a payload and a link below the bench", () => {
    const base = baseBody("post", { pivot: { x: 0, y: 0.1 } });
    const boom = linkBody("boom", 0.3, rect, "aluminium_6061_t6");
    const model = armModel({
      bodies: [base, boom],
      joints: [joint("shoulder", "post", { x: 0, y: 0.1 }, "boom", 0, "range")],
      payloads: [payload("lamp", "boom", { x: 0.3, y: 0 }, 0.1)],
    });
    const ctx = runFamily(checkGeometry, model, treeSweep(model, [{ shoulder: 0 }, { shoulder: -0.5 }]));
    const below = ctx.findings.filter((x) => x.code === "geometry.clearance");
    // geometry: the boom's end is at 0.1 - 0.3 sin(0.5) = -43.8 mm; its edge half the 20 mm depth lower
    const end = 0.3 * Math.sin(0.5) - 0.1;
    expect(below.find((f) => f.message.startsWith("payload lamp"))!.data!["below"]).toBeCloseTo(end, 12);
    expect(below.find((f) => f.message.startsWith("link boom"))!.data!["below"]).toBeCloseTo(end + 0.01, 12);
    expect(below.find((f) => f.message.startsWith("payload lamp"))!.message).toContain(
      "43.83 mm below the bench surface at shoulder -28.65 deg",
    );
  });

  it("a link that stays above the bench but closer than require clearance", () => {
    const base = baseBody("post", { pivot: { x: 0, y: 0.1 } });
    const boom = linkBody("boom", 0.3, rect, "aluminium_6061_t6");
    const model = armModel({
      bodies: [base, boom],
      joints: [joint("shoulder", "post", { x: 0, y: 0.1 }, "boom", 0, "range")],
      payloads: [payload("lamp", "boom", { x: 0.3, y: 0 }, 0.1)],
    });
    // plane geometry: at -0.3 rad the end is 0.1 - 0.3 sin(0.3) = 11.3 mm up; its lower edge half the
    // 20 mm depth lower, 1.3 mm above the bench: inside the default 3 mm clearance, not below it
    const ctx = runFamily(checkGeometry, model, treeSweep(model, [{ shoulder: 0 }, { shoulder: -0.3 }]));
    const near = ctx.findings.filter((x) => x.code === "geometry.clearance");
    const gap = 0.1 - 0.3 * Math.sin(0.3) - 0.01;
    expect(near).toHaveLength(1);
    expect(near[0]!.message).toMatch(/^link boom comes within 1\.3\d* mm of the bench surface/);
    expect(near[0]!.data!["below"]).toBeCloseTo(-gap, 12);
  });

  it("two links that cross", () => {
    const base = baseBody("post", { a: { x: 0, y: 0.1 }, b: { x: 0.2, y: 0.1 } });
    const m = armModel({
      bodies: [
        base,
        linkBody("one", 0.3, rect, "aluminium_6061_t6"),
        linkBody("two", 0.3, rect, "aluminium_6061_t6"),
      ],
      joints: [
        joint("ja", "post", { x: 0, y: 0.1 }, "one", 0.3, "range"),
        joint("jb", "post", { x: 0.2, y: 0.1 }, "two", Math.PI - 0.3, "range"),
      ],
    });
    const ctx = runFamily(checkGeometry, m, treeSweep(m, [{}]));
    expect(ctx.findings.some((x) => x.code === "geometry.clearance" && x.message.includes("runs into"))).toBe(
      true,
    );
  });
});

describe("toggle of a textbook balancer", () => {
  it("a zero-free-length spring reaching the vertical is not a toggle: the gravity torque vanishes there too", () => {
    // Streit and Gilmore (1989): k a b = m g l balances m at l for every angle; at the vertical
    // both the spring's lever arm and the gravity torque are zero
    const m = 1;
    const l = 0.4;
    const a = 0.05;
    const b = 0.1;
    const model = new ArmBuilder("post", { pivot: { x: 0, y: 0.3 }, top: { x: 0, y: 0.3 + a } })
      .link("boom", l, 0)
      .joint("shoulder", "post", { x: 0, y: 0.3 }, "boom", { x: 0, y: 0 }, 0, { range: [deg(0), deg(90)] })
      .zeroLength(
        "lift",
        ["post", { x: 0, y: 0.3 + a }],
        ["boom", { x: b, y: 0 }],
        (m * 9.80665 * l) / (a * b),
      )
      .payload("lamp", "boom", { x: l, y: 0 }, m)
      .sweep(19)
      .build();
    const ctx = runFamily(checkGeometry, model, solveSweep(model));
    expect(ctx.findings.filter((f) => f.code === "geometry.spring-toggle")).toEqual([]);
  });
});

describe("head tilt from a root that turns, and shared pivots", () => {
  it("a stage on a turning mast turns its head with the mast", () => {
    const model = new ArmBuilder("foot", { pivot: { x: 0, y: 0.1 } })
      .link("mast", 0.2, 0.1)
      .joint("swing", "foot", { x: 0, y: 0.1 }, "mast", { x: 0, y: 0 }, 0, { range: [deg(-10), deg(10)] })
      .parallelogram(
        "reach",
        "mast",
        { x: 0.2, y: 0 },
        { length: 0.3, spacing: 0.03, angle: 0, range: [deg(-20), deg(20)], barMass: 0.01, headMass: 0 },
      )
      .sweep(5)
      .build();
    const ctx = runFamily(checkGeometry, model, solveSweep(model));
    const f = ctx.findings.find((x) => x.code === "geometry.tilt")!;
    // equal bars keep the head parallel to its root, the mast, which turns through 20 deg
    expect(f.data!["change"]).toBeCloseTo(deg(20), 9);
    expect(f.message).toContain("its root, mast, turns over the range");
  });

  it("a link pinned at a parallelogram's far pivot does not clash with the bar ending there", () => {
    const model = new ArmBuilder("clamp", { pivot: { x: 0, y: 0.3 } })
      .parallelogram(
        "stage",
        "clamp",
        { x: 0, y: 0.3 },
        { length: 0.3, spacing: 0.03, angle: 0, range: [deg(-20), deg(20)], barMass: 0.01, headMass: 0 },
      )
      .link("lens_arm", 0.09, 0.005)
      .joint("tilt", "stage.head", { x: 0, y: 0 }, "lens_arm", { x: 0, y: 0 }, deg(-60), "fixed")
      .sweep(5)
      .build();
    const ctx = runFamily(checkGeometry, model, solveSweep(model));
    expect(ctx.findings.filter((x) => x.code === "geometry.clearance")).toEqual([]);
  });
});
