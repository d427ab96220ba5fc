// Statics by Lagrange multipliers against virtual work (holding torque = dV/dtheta of the total
// potential energy, by central differences) on seeded random linkages, and the free-body balance
// of every body from the listed loads; force laws against their published forms.
import { describe, expect, it } from "vitest";
import type { ArmModel, Spring } from "../../server/src/model/types";
import type { Pose } from "../../server/src/mechanics/types";
import { solveSweep } from "../../server/src/mechanics/sweep";
import { bodyLoads, resultant } from "../../server/src/mechanics/body-loads";
import { elasticCordTension, gasStrutTension } from "../../server/src/mechanics/forces";
import { ArmBuilder, deg, G0, seededRandom } from "./arm-builder";
import { springDofValue, sumOverSprings } from "../../server/src/mechanics/spring-table";

function world(pose: Pose, model: ArmModel, body: string, p: { x: number; y: number }) {
  if (body === model.bodies[0]!.id) return p;
  const b = pose.bodies[body]!;
  return {
    x: b.x + Math.cos(b.phi) * p.x - Math.sin(b.phi) * p.y,
    y: b.y + Math.sin(b.phi) * p.x + Math.cos(b.phi) * p.y,
  };
}

/** Potential energy of a spring, by integrating its published force law over its length. */
function springEnergy(model: ArmModel, s: Spring, pose: Pose): number {
  if (s.kind === "torsion") {
    const j = model.joints.find((x) => x.id === s.joint)!;
    const turn = pose.jointAngles[j.id]! - j.angle;
    // T = k (theta - theta_ref) - preload: V = k turn^2 / 2 - preload turn
    return (s.rate * turn * turn) / 2 - s.preloadTorque * turn;
  }
  const A = world(pose, model, s.a.body, s.a.point);
  const B = world(pose, model, s.b.body, s.b.point);
  const L = Math.hypot(B.x - A.x, B.y - A.y);
  switch (s.kind) {
    case "extension": {
      const x = Math.max(0, L - s.freeLength);
      return s.initialTension * x + (s.rate * x * x) / 2;
    }
    case "zero_length":
      return s.initialTension * L + (s.rate * L * L) / 2;
    case "elastic": {
      // Treloar 3rd ed.: F = G A0 (s - s^-2); V = G A0 L0 (s^2/2 + 1/s - 3/2)
      const st = L / s.freeLength;
      const G = model.materials[s.material]!.shearModulus;
      return st > 1 ? G * s.area * s.freeLength * ((st * st) / 2 + 1 / st - 1.5) : 0;
    }
    case "gas": {
      // Push F1 (1 + (p - 1) x / stroke) over stroke position x = Le - L: V = F1 (x + (p - 1) x^2 / (2 stroke))
      const x = s.extendedLength - L;
      return s.force * (x + ((s.progression - 1) * x * x) / (2 * s.stroke));
    }
  }
}

function potential(model: ArmModel, pose: Pose): number {
  let v = 0;
  for (const b of model.bodies)
    if (b.kind !== "base") v += b.mass * G0 * world(pose, model, b.id, b.centreOfMass).y;
  for (const p of model.payloads) {
    const at = world(pose, model, p.body, p.point);
    v += p.mass * G0 * at.y - (p.force?.x ?? 0) * at.x - (p.force?.y ?? 0) * at.y;
  }
  for (const s of model.springs) v += springEnergy(model, s, pose);
  return v;
}

/** A random arm: either an open chain of two or three links or a four-bar with a tail, with
 * every kind of spring and a payload with a steady force. */
function randomArm(seed: number): ArmModel {
  const rnd = seededRandom(seed);
  const u = (lo: number, hi: number) => lo + (hi - lo) * rnd();
  const b = new ArmBuilder("ground", { anchor: { x: u(-0.05, 0.05), y: u(0.05, 0.12) } });
  const fourBar = seed % 2 === 0;
  if (!fourBar) {
    const n = 2 + (seed % 3 === 0 ? 1 : 0);
    let parent = "ground";
    let at = { x: 0, y: 0 };
    for (let i = 0; i < n; i++) {
      const len = u(0.15, 0.35);
      b.link(`l${i}`, len, u(0.05, 0.6), { com: { x: u(0.2, 0.8) * len, y: u(-0.02, 0.02) } });
      b.joint(`j${i}`, parent, at, `l${i}`, { x: 0, y: 0 }, u(-0.8, 0.8), { range: [-2, 2] });
      parent = `l${i}`;
      at = { x: len, y: u(-0.01, 0.01) };
    }
    b.payload("tool", parent, { x: at.x + u(0, 0.05), y: u(-0.05, 0.05) }, u(0.1, 1), {
      force: { x: u(-2, 2), y: u(-3, 1) },
    });
  } else {
    const [a, c, d] = [u(0.04, 0.06), u(0.12, 0.16), u(0.15, 0.18)];
    const cb = u(0.14, 0.17);
    const th2 = u(0.5, 2.5);
    // Assemble approximately; the solver closes the loop.
    const A = { x: a * Math.cos(th2), y: a * Math.sin(th2) };
    const e = Math.hypot(d - A.x, A.y);
    const along = (cb * cb - c * c + e * e) / (2 * e);
    const h = Math.sqrt(Math.max(0, cb * cb - along * along));
    const ux = (d - A.x) / e;
    const uy = -A.y / e;
    const B = { x: A.x + along * ux - h * uy, y: A.y + along * uy + h * ux };
    const th3 = Math.atan2(B.y - A.y, B.x - A.x);
    const th4 = Math.atan2(B.y, B.x - d);
    b.link("crank", a, u(0.02, 0.1))
      .link("coupler", cb, u(0.05, 0.3), { com: { x: cb * u(0.3, 0.7), y: u(-0.03, 0.03) } })
      .link("rocker", c, u(0.05, 0.2));
    b.joint("crank", "ground", { x: 0, y: 0 }, "crank", { x: 0, y: 0 }, th2, { range: [0, 3] })
      .joint("coupler_pin", "crank", { x: a, y: 0 }, "coupler", { x: 0, y: 0 }, th3 - th2 + 0.02, "passive")
      .joint("rocker", "ground", { x: d, y: 0 }, "rocker", { x: 0, y: 0 }, th4 - 0.02, "passive")
      .joint("rocker_pin", "coupler", { x: cb, y: 0 }, "rocker", { x: c, y: 0 }, th4 - th3, "passive");
    b.link("tail", 0.2, u(0.05, 0.2)).joint(
      "wrist",
      "coupler",
      { x: cb / 2, y: 0.01 },
      "tail",
      { x: 0, y: 0 },
      u(-1, 1),
      { range: [-2, 2] },
    );
    b.payload("tool", "tail", { x: 0.2, y: u(-0.03, 0.03) }, u(0.1, 0.8), {
      force: { x: u(-2, 2), y: u(-3, 1) },
    });
  }
  const bodies = b.model.bodies.filter((x) => x.kind !== "base").map((x) => x.id);
  const pick = () => bodies[Math.floor(rnd() * bodies.length)]!;
  const anchor = b.model.bodies[0]!.points["anchor"]!;
  b.zeroLength("zl", ["ground", anchor], [pick(), { x: u(0.02, 0.1), y: 0 }], u(100, 900), u(0, 5));
  b.extension(
    "ext",
    ["ground", { x: u(-0.1, 0), y: u(0.15, 0.3) }],
    [pick(), { x: u(0.02, 0.12), y: 0 }],
    u(100, 800),
    0.01,
    u(0, 8),
  );
  b.elastic(
    "cord",
    ["ground", { x: u(0.05, 0.15), y: u(0.15, 0.3) }],
    [pick(), { x: u(0.02, 0.12), y: 0 }],
    0.03,
    u(5e-6, 3e-5),
  );
  b.gas(
    "strut",
    ["ground", { x: u(-0.1, 0.1), y: u(-0.3, -0.2) }],
    [pick(), { x: u(0.05, 0.12), y: 0 }],
    u(20, 60),
    u(1.1, 1.5),
    0.6,
    0.9,
  );
  const jointWithDof = b.model.joints.find((j) => j.mode === "range")!;
  b.torsion("coil", jointWithDof.id, u(0.05, 0.5), u(-0.3, 0.3));
  const model = b.build();
  // Place the cord's free length and the strut's stroke about their reference lengths so that
  // the cord is taut and the strut within its stroke (where the energies above hold).
  const first = solveSweep({ ...model, sweep: { steps: 2, grid: false } }).reference!;
  for (const s of model.springs) {
    if (s.kind === "elastic") s.freeLength = 0.6 * first.springs[s.id]!.length;
    if (s.kind === "gas") {
      s.extendedLength = first.springs[s.id]!.length + 0.04;
      s.stroke = 0.08;
    }
  }
  return model;
}

describe("holding torque equals dV/dtheta (virtual work)", () => {
  for (const seed of [1, 2, 3, 4, 5, 6, 7, 8]) {
    it(`random linkage ${seed}`, () => {
      const model = randomArm(seed);
      const h = 1e-4;
      // Sweep each dof alone over ref +- h in 3 steps: the middle pose is the reference.
      for (const j of model.joints) if (j.mode === "range") j.range = [j.angle - h, j.angle + h];
      model.sweep = { steps: 3, grid: false };
      const sweep = solveSweep(model);
      expect(sweep.findings).toEqual([]);
      // The cord and the strut must act (taut / within stroke) for the test to mean anything.
      const ref = sweep.reference!;
      expect(ref.cases[0]!.springForce["cord"]).toBeGreaterThan(0);
      expect(ref.cases[0]!.springForce["strut"]).toBeLessThan(0);
      sweep.dofs.forEach((dof, d) => {
        const lo = sweep.poses[3 * d]!;
        const mid = sweep.poses[3 * d + 1]!;
        const hi = sweep.poses[3 * d + 2]!;
        const dVdTheta = (potential(model, hi) - potential(model, lo)) / (2 * h);
        // Principle of virtual work (e.g. Haug 1989, ch. 6; docs/formulas.md, statics of the arm): tau = dV/dtheta
        expect(mid.cases[0]!.holdingTorque[dof.id]).toBeCloseTo(dVdTheta, 5);
      });
    });
  }
});

/** Gravity potential of the bodies and the payloads (payload masses as given), J. */
function gravityPotential(model: ArmModel, pose: Pose, payloadMass: Record<string, number>): number {
  let v = 0;
  for (const b of model.bodies)
    if (b.kind !== "base") v += b.mass * G0 * world(pose, model, b.id, b.centreOfMass).y;
  for (const p of model.payloads)
    v += (payloadMass[p.id] ?? p.mass) * G0 * world(pose, model, p.body, p.point).y;
  return v;
}

/** Potential of the payloads' steady forces, J: -F . p. */
function loadPotential(model: ArmModel, pose: Pose): number {
  let v = 0;
  for (const p of model.payloads) {
    const at = world(pose, model, p.body, p.point);
    v -= (p.force?.x ?? 0) * at.x + (p.force?.y ?? 0) * at.y;
  }
  return v;
}

describe("the holding torque's parts equal dV/dtheta of their own potentials", () => {
  for (const seed of [1, 2, 5, 6]) {
    it(`random linkage ${seed}: gravity, each spring and the steady load, in every load case`, () => {
      const model = randomArm(seed);
      const tool = model.payloads[0]!;
      tool.massRange = [0.5 * tool.mass, 1.5 * tool.mass];
      const h = 1e-4;
      for (const j of model.joints) if (j.mode === "range") j.range = [j.angle - h, j.angle + h];
      model.sweep = { steps: 3, grid: false };
      const sweep = solveSweep(model);
      expect(sweep.findings).toEqual([]);
      expect(sweep.loadCases).toHaveLength(3);
      sweep.dofs.forEach((dof, d) => {
        const lo = sweep.poses[3 * d]!;
        const mid = sweep.poses[3 * d + 1]!;
        const hi = sweep.poses[3 * d + 2]!;
        const slope = (v: (p: Pose) => number) => (v(hi) - v(lo)) / (2 * h);
        for (const s of model.springs) {
          // Principle of virtual work (Haug 1989, ch. 6): each spring's part is dV_spring/dtheta
          expect(springDofValue(mid.springTorque, s.id, dof.id)).toBeCloseTo(
            slope((p) => springEnergy(model, s, p)),
            5,
          );
        }
        // The same principle for the steady forces: their part is d(-F . p)/dtheta
        const load = slope((p) => loadPotential(model, p));
        sweep.loadCases.forEach((lc, c) => {
          const statics = mid.cases[c]!;
          // and for gravity at this case's masses: d(sum m g y)/dtheta
          expect(statics.gravityTorque![dof.id]).toBeCloseTo(
            slope((p) => gravityPotential(model, p, lc.payloadMass)),
            5,
          );
          expect(statics.loadTorque![dof.id]).toBeCloseTo(load, 5);
          const springs = sumOverSprings(mid.springTorque!, dof.id);
          // The parts of one linear system's right-hand side add up to its solution (superposition).
          expect(statics.gravityTorque![dof.id]! + springs + statics.loadTorque![dof.id]!).toBeCloseTo(
            statics.holdingTorque[dof.id]!,
            9,
          );
        });
      });
    });
  }
});

describe("free-body balance of every body", () => {
  for (const seed of [11, 12, 13, 14, 15, 16]) {
    it(`random linkage ${seed}: forces and moments of each body sum to zero`, () => {
      const model = randomArm(seed);
      model.sweep = { steps: 5, grid: true };
      const sweep = solveSweep(model);
      expect(sweep.poses.length).toBeGreaterThan(0);
      let checked = 0;
      for (const pose of sweep.poses) {
        for (const body of model.bodies) {
          if (body.kind === "base") continue;
          const loads = bodyLoads(model, sweep, pose, 0, body.id);
          const r = resultant(loads, { x: 0.37, y: -0.21 });
          const scale = Math.max(1, ...loads.map((l) => Math.hypot(l.force.x, l.force.y)));
          // Newton's first law for a body at rest: sum of forces = 0 and sum of moments = 0 (any statics text)
          expect(Math.hypot(r.force.x, r.force.y) / scale).toBeLessThan(1e-9);
          expect(Math.abs(r.moment) / scale).toBeLessThan(1e-9);
          checked++;
        }
      }
      expect(checked).toBeGreaterThan(10);
    });
  }

  it("gives the pin of a single link the weight it carries", () => {
    const m = 0.7;
    const model = new ArmBuilder()
      .link("arm", 0.3, m)
      .joint("shoulder", "ground", { x: 0, y: 0 }, "arm", { x: 0, y: 0 }, deg(20), { range: [0, 1] })
      .sweep(3)
      .build();
    const sweep = solveSweep(model);
    for (const pose of sweep.poses) {
      // Equilibrium of the link: the pivot pushes up with its weight m g
      expect(pose.cases[0]!.reactions["shoulder"]!.y).toBeCloseTo(m * G0, 10);
      expect(pose.cases[0]!.reactions["shoulder"]!.x).toBeCloseTo(0, 10);
    }
  });
});

describe("force laws", () => {
  it("neo-Hookean cord matches Treloar's worked numbers for a 6 x 3 mm bore tube", () => {
    const A0 = (Math.PI / 4) * (0.006 ** 2 - 0.003 ** 2);
    const G = 0.4e6;
    const L0 = 0.1;
    // docs/formulas.md: tube 6 x 3 mm bore, A0 = 21.21 mm^2
    expect(A0 * 1e6).toBeCloseTo(21.21, 2);
    const worked: [number, number][] = [
      [1.5, 8.954],
      [2, 14.84],
      [3, 24.5],
    ];
    for (const [lambda, force] of worked) {
      const F = elasticCordTension({ freeLength: L0, area: A0 }, G, lambda * L0);
      // Treloar, The Physics of Rubber Elasticity, 3rd ed. (1975): F = G A0 (lambda - lambda^-2)
      expect(F).toBeCloseTo(G * A0 * (lambda - lambda ** -2), 9);
      // docs/formulas.md worked values 8.954, 14.84, 24.50 N (three or four figures)
      expect(Math.abs(F - force) / force).toBeLessThan(6e-4);
    }
    // Slack below its free length
    expect(elasticCordTension({ freeLength: L0, area: A0 }, G, 0.9 * L0)).toBe(0);
  });

  it("gas strut pushes with force linear in stroke from F1 to progression x F1", () => {
    const s = { force: 100, progression: 1.3, stroke: 0.06, extendedLength: 0.18 };
    // Common practice, no source: a gas spring's force rises linearly over its stroke to its progression
    expect(gasStrutTension(s, 0.18)).toBeCloseTo(-100, 12);
    expect(gasStrutTension(s, 0.12)).toBeCloseTo(-130, 12);
    expect(gasStrutTension(s, 0.15)).toBeCloseTo(-115, 12);
  });
});

describe("hand force with two degrees of freedom", () => {
  it("is the payload's weight, straight up, for a massless two-link arm (away from straight)", () => {
    const mass = 0.9;
    const [l1, l2] = [0.3, 0.25];
    const model = new ArmBuilder()
      .link("upper", l1, 0)
      .link("fore", l2, 0)
      .joint("shoulder", "ground", { x: 0, y: 0 }, "upper", { x: 0, y: 0 }, deg(40), {
        range: [deg(10), deg(70)],
      })
      .joint("elbow", "upper", { x: l1, y: 0 }, "fore", { x: 0, y: 0 }, deg(-90), {
        range: [deg(-120), deg(-60)],
      })
      .payload("tool", "fore", { x: l2, y: 0 }, mass)
      .sweep(5)
      .build();
    const sweep = solveSweep(model);
    expect(sweep.poses.length).toBe(25);
    for (const pose of sweep.poses) {
      const t1 = pose.angles["shoulder"]!;
      const t12 = t1 + pose.angles["elbow"]!;
      // Jacobian of the planar two-link arm (Craig, Introduction to Robotics, 3rd ed., ch. 5)
      const J = pose.payloadJacobian!["tool"]!;
      expect(J["shoulder"]!.x).toBeCloseTo(-l1 * Math.sin(t1) - l2 * Math.sin(t12), 10);
      expect(J["elbow"]!.y).toBeCloseTo(l2 * Math.cos(t12), 10);
      const st = pose.cases[0]!;
      const F = st.handForceVector!["tool"]!;
      // Statics: J^T F = tau, and a hand that replaces the weight of a point mass on massless links pushes m g up
      expect(J["shoulder"]!.x * F.x + J["shoulder"]!.y * F.y).toBeCloseTo(st.holdingTorque["shoulder"]!, 9);
      expect(J["elbow"]!.x * F.x + J["elbow"]!.y * F.y).toBeCloseTo(st.holdingTorque["elbow"]!, 9);
      expect(F.x).toBeCloseTo(0, 9);
      expect(F.y).toBeCloseTo(mass * G0, 9);
    }
  });
});

describe("torsion spring at a pivot", () => {
  it("adds its torque T = k (theta - theta_ref) - preload to the holding torque (it acts -T on the child)", () => {
    const [mass, len, k, preload, ref] = [0.4, 0.2, 0.5, 0.3, deg(10)];
    const model = new ArmBuilder()
      .link("arm", len, 0)
      .joint("tilt", "ground", { x: 0, y: 0 }, "arm", { x: 0, y: 0 }, ref, { range: [deg(-40), deg(60)] })
      .torsion("coil", "tilt", k, preload)
      .payload("lens", "arm", { x: len, y: 0 }, mass)
      .sweep(11)
      .build();
    const sweep = solveSweep(model);
    for (const pose of sweep.poses) {
      const th = pose.angles["tilt"]!;
      const T = k * (th - ref) - preload;
      // Statics of a pivoting link with a torsion spring (virtual work): the hand supplies m g l cos(theta) + T
      expect(pose.cases[0]!.holdingTorque["tilt"]).toBeCloseTo(mass * G0 * len * Math.cos(th) + T, 10);
      expect(pose.cases[0]!.springForce["coil"]).toBeCloseTo(T, 12);
      // Wind-up angle from free: T / k
      expect(pose.springs["coil"]!.windUp).toBeCloseTo(T / k, 12);
    }
  });
});
