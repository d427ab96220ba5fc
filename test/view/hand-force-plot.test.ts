// The drawing's hand-force plot, signed and with the force friction does not hold (issue 14): on
// the pivoting link of test/checks/hand-force-friction.test.ts, the solid curve is the hand force
// beyond friction with its sign (+ the arm sinks) and the dashed one the force without friction,
// both against the closed form of docs/formulas.md (gravity balancing, Herder 2001) with Coulomb
// friction (common statics); the allowed band lies either side of zero.
import { describe, expect, it } from "vitest";
import { analyse } from "../../server/src/analysis";
import { buildViewModel } from "../../server/src/view/build-view-model";
import { handForcePlot } from "../../server/src/view/plots";

const G = 9.80665; // standard gravity (SI Brochure, 9th ed.)
const [m, l, a, b] = [1, 0.4, 0.05, 0.1];
// Under-balanced low in the range and over-balanced high: with C = Fi - k L0 > 0 the spring's
// F / L = k + C / L grows as it shortens; k a b is set so the two cancel at the horizontal.
const C = 20;
const L0 = 0.03;
const k = (m * G * l - (C * a * b) / Math.hypot(a, b)) / (a * b);
const Fi = C + k * L0;
const friction = 0.05;

const spec = `# Invented: a lamp boom whose spring holds it level but lets it sink low and rise high (issue 10 item 4).
arm "Boom with a stiff pivot" {
  base post {
    mass 20 kg
    footprint 400 mm x 400 mm
    point pivot (0 mm, 300 mm)
    point anchor (0 mm, ${300 + a * 1000} mm)
  }
  link boom {
    length ${l * 1000} mm
    mass 0 g
  }
  joint shoulder {
    connects post.pivot to boom.start
    angle 0 deg
    range -60 deg .. 60 deg
    friction ${friction} N*m
  }
  spring lift {
    extension
    between post.anchor and boom(${b * 1000} mm, 0 mm)
    rate ${k / 1000} N/mm
    free_length ${L0 * 1000} mm
    initial_tension ${Fi} N
  }
  payload lamp {
    mass ${m} kg
    at boom.end
  }
  require {
    balance 5 N
  }
}
`;

/** Holding torque of the pivoting link at theta (docs/formulas.md, gravity balancing). */
function holdingTorque(theta: number): number {
  const L = Math.sqrt(a * a + b * b - 2 * a * b * Math.sin(theta));
  return m * G * l * Math.cos(theta) - ((Fi + k * (L - L0)) * a * b * Math.cos(theta)) / L;
}

/** The hand force at the payload at theta: the holding torque beyond friction over the lever l,
 * signed as the torque (the link points right: tau > 0, the arm sinks, the hand lifts). */
const beyondFriction = (theta: number, f: number) => {
  const tau = holdingTorque(theta);
  return (Math.sign(tau) * Math.max(0, Math.abs(tau) - f)) / l;
};

describe("the hand-force plot", () => {
  const vm = buildViewModel(analyse(spec));
  const plot = handForcePlot(vm, 0, vm.referencePose);
  const rad = (deg: number) => (deg * Math.PI) / 180;

  it("plots the signed hand force beyond friction and, dashed, the force without it", () => {
    const solid = plot.series.find((s) => s.name === "lamp")!;
    const free = plot.series.find((s) => s.name === "lamp without friction")!;
    expect(free.dashed).toBe(true);
    expect(solid.points.length).toBeGreaterThan(10);
    for (const [deg, force] of solid.points) expect(force).toBeCloseTo(beyondFriction(rad(deg), friction), 3);
    for (const [deg, force] of free.points) expect(force).toBeCloseTo(beyondFriction(rad(deg), 0), 3);
    // Both signs occur: it sinks low in the range and rises high.
    expect(solid.points.some(([, f]) => f > 0.01) && solid.points.some(([, f]) => f < -0.01)).toBe(true);
  });

  it("draws the allowed hand force either side of zero", () => {
    expect(plot.band).toMatchObject({ from: -5, to: 5 });
  });
});
