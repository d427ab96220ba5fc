// Kinematics of closed loops against Freudenstein's equation, and the findings for loops that do
// not close, ranges a linkage cannot reach and joints nothing holds.
import { describe, expect, it } from "vitest";
import { solveSweep } from "../../server/src/mechanics/sweep";
import { ArmBuilder, deg } from "./arm-builder";

/** Open-branch assembly of a four-bar at input angle th2 (circle intersection, upper point). */
function assemble(a: number, b: number, c: number, d: number, th2: number) {
  const A = { x: a * Math.cos(th2), y: a * Math.sin(th2) };
  const ex = d - A.x;
  const ey = -A.y;
  const e = Math.hypot(ex, ey);
  const along = (b * b - c * c + e * e) / (2 * e);
  const h = Math.sqrt(Math.max(0, b * b - along * along));
  const ux = ex / e;
  const uy = ey / e;
  const B = { x: A.x + along * ux - h * uy, y: A.y + along * uy + h * ux };
  return { th3: Math.atan2(B.y - A.y, B.x - A.x), th4: Math.atan2(B.y, B.x - d) };
}

function fourBar(
  a: number,
  b: number,
  c: number,
  d: number,
  th2: number,
  mode: { input: "crank" | "rocker"; range: [number, number] },
  guessError = deg(3),
) {
  const g = assemble(a, b, c, d, th2);
  return new ArmBuilder()
    .link("crank", a, 0.05)
    .link("coupler", b, 0.1)
    .link("rocker", c, 0.08)
    .joint(
      "crank",
      "ground",
      { x: 0, y: 0 },
      "crank",
      { x: 0, y: 0 },
      th2,
      mode.input === "crank" ? { range: mode.range } : "passive",
    )
    .joint(
      "coupler_pin",
      "crank",
      { x: a, y: 0 },
      "coupler",
      { x: 0, y: 0 },
      g.th3 - th2 + guessError,
      "passive",
    )
    .joint(
      "rocker",
      "ground",
      { x: d, y: 0 },
      "rocker",
      { x: 0, y: 0 },
      mode.input === "rocker" ? g.th4 : g.th4 - guessError,
      mode.input === "rocker" ? { range: mode.range } : "passive",
    )
    .joint("rocker_pin", "coupler", { x: b, y: 0 }, "rocker", { x: c, y: 0 }, g.th4 - g.th3, "passive");
}

describe("four-bar crank-rocker (Freudenstein 1955)", () => {
  const [a, b, c, d] = [0.05, 0.15, 0.12, 0.16];
  it("is a Grashof crank-rocker", () => {
    // Grashof's condition s + l <= p + q, shortest link the input: the crank turns fully (Freudenstein 1955 / Grashof)
    expect(a + d <= b + c).toBe(true);
  });

  it("follows Freudenstein's equation over the whole input turn", () => {
    const model = fourBar(a, b, c, d, deg(0), { input: "crank", range: [deg(0), deg(350)] })
      .sweep(36)
      .build();
    const sweep = solveSweep(model);
    expect(sweep.findings).toEqual([]);
    expect(sweep.poses.length).toBe(36);
    const K1 = d / a;
    const K2 = d / c;
    const K3 = (a * a - b * b + c * c + d * d) / (2 * a * c);
    for (const pose of sweep.poses) {
      const th2 = pose.angles["crank"]!;
      const th4 = pose.bodies["rocker"]!.phi;
      // Freudenstein, Trans. ASME 77 (1955): K1 cos(th4) - K2 cos(th2) + K3 = cos(th2 - th4)
      expect(K1 * Math.cos(th4) - K2 * Math.cos(th2) + K3 - Math.cos(th2 - th4)).toBeCloseTo(0, 7);
      // Same branch as the assembly (circle intersection) all the way round
      expect(Math.cos(th4 - assemble(a, b, c, d, th2).th4)).toBeCloseTo(1, 9);
    }
  });

  it("reports where a rocker driven past its toggle locks", () => {
    // Driving the rocker: it reaches only while |B - O2| <= a + b and >= b - a. At |B - O2| = b - a
    // (crank and coupler folded): cos(th4) = ((b - a)^2 - d^2 - c^2) / (2 d c) (triangle O2 O4 B).
    const lock = Math.acos(((b - a) ** 2 - d * d - c * c) / (2 * d * c));
    const model = fourBar(a, b, c, d, deg(0), { input: "rocker", range: [deg(100), deg(160)] }, deg(0));
    const g = assemble(a, b, c, d, deg(0));
    model.model.joints[2]!.angle = g.th4;
    const sweep = solveSweep(model.sweep(13).build());
    const found = sweep.findings.filter((f) => f.code === "geometry.cannot-reach");
    expect(found.length).toBe(1);
    expect(found[0]!.data.subject).toBe("rocker");
    // Law of cosines in the triangle of ground, rocker and folded crank + coupler (plane geometry)
    expect(Math.abs(found[0]!.data.lockAngle! - lock)).toBeLessThan(deg(0.05));
    expect(found[0]!.span).toEqual(model.model.joints[2]!.origin.properties["range"]);
    // Poses below the lock are still solved
    expect(sweep.poses.every((p) => p.angles["rocker"]! <= lock + 1e-9)).toBe(true);
    expect(sweep.poses.length).toBeGreaterThan(5);
  });

  it("reports a loop that cannot close, with the gap between the circles", () => {
    // Rocker too short to reach the coupler with the crank pointing away (th2 = 180 deg): the
    // coupler's far end stays on a circle of radius b about A = (-a, 0), the rocker's on one of
    // radius c about O4; the nearest they come is |A O4| - b - c (plane geometry).
    const short = 0.02;
    const model = new ArmBuilder()
      .link("crank", a, 0)
      .link("coupler", b, 0)
      .link("rocker", short, 0)
      .joint("crank", "ground", { x: 0, y: 0 }, "crank", { x: 0, y: 0 }, deg(180), {
        range: [deg(170), deg(190)],
      })
      .joint("coupler_pin", "crank", { x: a, y: 0 }, "coupler", { x: 0, y: 0 }, deg(-170), "passive")
      .joint("rocker", "ground", { x: d, y: 0 }, "rocker", { x: 0, y: 0 }, deg(170), "passive")
      .joint("rocker_pin", "coupler", { x: b, y: 0 }, "rocker", { x: short, y: 0 }, deg(0), "passive")
      .build();
    const sweep = solveSweep(model);
    const open = sweep.findings.filter((f) => f.code === "geometry.loop-open");
    expect(open.length).toBe(1);
    expect(open[0]!.data.subject).toBe("rocker_pin");
    // Distance between two circles: |centres| - r1 - r2
    expect(open[0]!.data!["gap"] as number).toBeCloseTo(a + d - b - short, 6);
    expect(open[0]!.message).toContain("40 mm");
    expect(sweep.poses).toEqual([]);
  });
});

describe("dead points", () => {
  it("stops a parallelogram where its bars line up with the uprights", () => {
    // At 90 deg the bars lie along the spacing line: the four pivots are collinear and the stage
    // can fold either way (change point of a parallelogram linkage; plane geometry).
    const model = new ArmBuilder()
      .parallelogram(
        "reach",
        "ground",
        { x: 0, y: 0 },
        {
          length: 0.3,
          spacing: 0.04,
          angle: deg(60),
          range: [deg(40), deg(130)],
          barMass: 0.1,
          headMass: 0.1,
        },
      )
      .sweep(7)
      .build();
    const sweep = solveSweep(model);
    const locks = sweep.findings.filter((f) => f.code === "geometry.cannot-reach");
    expect(locks.length).toBe(1);
    expect(locks[0]!.data!["deadPoint"]).toBe(true);
    expect(Math.abs((locks[0]!.data!["lockAngle"] as number) - deg(90))).toBeLessThan(deg(0.05));
    expect(sweep.poses.map((p) => Math.round((p.angles["reach"]! * 180) / Math.PI))).toEqual([
      40, 55, 70, 85,
    ]);
  });
});

describe("dead point at the reference pose", () => {
  it("reports the stage's range, not a free joint, when the reference itself lines the pivots up", () => {
    // Bars at 90 deg along the spacing line: all four pivots collinear (plane geometry), the
    // constraint Jacobian is singular there though the stage is a one-dof linkage elsewhere.
    const model = new ArmBuilder()
      .parallelogram(
        "reach",
        "ground",
        { x: 0, y: 0 },
        {
          length: 0.25,
          spacing: 0.04,
          angle: deg(90),
          range: [deg(80), deg(100)],
          barMass: 0.1,
          headMass: 0.1,
        },
      )
      .build();
    const sweep = solveSweep(model);
    expect(sweep.findings.map((f) => f.code)).toEqual(["geometry.cannot-reach"]);
    expect(sweep.findings[0]!.span).toEqual(model.joints[0]!.origin.properties["range"]);
    expect(sweep.poses).toEqual([]);
  });
});

describe("mobility", () => {
  it("reports a passive joint that no loop holds and still solves the rest", () => {
    const model = new ArmBuilder()
      .link("upper", 0.3, 0.2)
      .link("fore", 0.25, 0.1)
      .joint("shoulder", "ground", { x: 0, y: 0 }, "upper", { x: 0, y: 0 }, deg(30), {
        range: [deg(0), deg(60)],
      })
      .joint("elbow", "upper", { x: 0.3, y: 0 }, "fore", { x: 0, y: 0 }, deg(-40), "passive")
      .sweep(5)
      .build();
    const sweep = solveSweep(model);
    const unheld = sweep.findings.filter((f) => f.code === "joint.unheld");
    expect(unheld.map((f) => f.data.subject)).toEqual(["elbow"]);
    expect(sweep.poses.length).toBe(5);
    // Held at its angle: the relative angle stays -40 deg
    for (const p of sweep.poses) expect(p.jointAngles["elbow"]).toBeCloseTo(deg(-40), 12);
  });

  it("reports a degree of freedom that its loop already fixes", () => {
    const [a, b, c, d] = [0.05, 0.15, 0.12, 0.16];
    const model = fourBar(a, b, c, d, deg(40), { input: "crank", range: [deg(0), deg(80)] }, 0).build();
    const g = assemble(a, b, c, d, deg(40));
    const rocker = model.joints[2]!;
    rocker.mode = "range";
    rocker.range = [g.th4 - 0.1, g.th4 + 0.1];
    const sweep = solveSweep(model);
    const locked = sweep.findings.filter((f) => f.code === "geometry.cannot-reach");
    expect(locked.map((f) => f.data.subject)).toEqual(["rocker"]);
    expect(sweep.dofs.map((d) => d.id)).toEqual(["crank"]);
  });
});

describe("sweep layout", () => {
  it("visits a grid with both ends included, last dof fastest", () => {
    const model = new ArmBuilder()
      .link("upper", 0.3, 0.2)
      .link("fore", 0.25, 0.1)
      .joint("shoulder", "ground", { x: 0, y: 0 }, "upper", { x: 0, y: 0 }, deg(30), {
        range: [deg(-60), deg(60)],
      })
      .joint("elbow", "upper", { x: 0.3, y: 0 }, "fore", { x: 0, y: 0 }, deg(-40), {
        range: [deg(-90), deg(0)],
      })
      .sweep(5)
      .build();
    const sweep = solveSweep(model);
    expect(sweep.poses.length).toBe(25);
    // docs/language.md: `steps 5` over -60 deg .. 60 deg visits -60, -30, 0, 30, 60
    expect(
      sweep.poses
        .filter((p) => p.angles["elbow"] === deg(-90))
        .map((p) => Math.round((p.angles["shoulder"]! * 180) / Math.PI)),
    ).toEqual([-60, -30, 0, 30, 60]);
    expect(sweep.poses[1]!.angles["shoulder"]).toBe(deg(-60));
    expect(sweep.poses[1]!.angles["elbow"]).toBeCloseTo(deg(-67.5), 12);
    const alone = solveSweep({ ...model, sweep: { steps: 5, grid: false } });
    expect(alone.poses.length).toBe(10);
    expect(alone.poses.slice(0, 5).every((p) => p.angles["elbow"] === deg(-40))).toBe(true);
  });

  it("caps a grid over 20,000 poses with a finding", () => {
    const b = new ArmBuilder().link("l1", 0.2, 0.1).link("l2", 0.2, 0.1).link("l3", 0.2, 0.1);
    b.joint("j1", "ground", { x: 0, y: 0 }, "l1", { x: 0, y: 0 }, 0, { range: [0, 0.2] })
      .joint("j2", "l1", { x: 0.2, y: 0 }, "l2", { x: 0, y: 0 }, 0, { range: [0, 0.2] })
      .joint("j3", "l2", { x: 0.2, y: 0 }, "l3", { x: 0, y: 0 }, 0, { range: [0, 0.2] })
      .sweep(37);
    const sweep = solveSweep(b.build());
    // conventions.md: the grid is capped at 20,000 poses total; floor(20000^(1/3)) = 27 steps
    expect(sweep.findings.map((f) => f.code)).toEqual(["sweep.capped"]);
    expect(sweep.steps).toBe(27);
    expect(sweep.poses.length).toBe(27 ** 3);
  });

  it("stops at the deadline with partial results", () => {
    const model = new ArmBuilder()
      .link("arm", 0.3, 0.2)
      .joint("shoulder", "ground", { x: 0, y: 0 }, "arm", { x: 0, y: 0 }, 0, { range: [-1, 1] })
      .sweep(101)
      .build();
    const sweep = solveSweep(model, { deadline: performance.now() - 1 });
    expect(sweep.findings.map((f) => f.code)).toEqual(["analysis.budget"]);
    expect(sweep.poses.length).toBe(0);
    expect(sweep.reference).toBeDefined();
  });
});
