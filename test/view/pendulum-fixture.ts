// A hand-built analysis of one pivoting link held by a zero-free-length spring (the geometry of
// Streit and Gilmore 1989), built from the published closed-form statics so that the view layer
// can be tested before (and independently of) the solver:
//   holding torque tau(theta) = (m g l - k a b) cos(theta)                (docs/formulas.md)
//   spring length  L = sqrt(a^2 + b^2 - 2 a b sin(theta)),  tension F = k L
//   hand force     |tau| / l  (one dof: |F| = |tau| / |dp/dtheta|, docs/formulas.md, statics of the arm)
import type { ArmModel, Body, Joint, Spring, Payload } from "../../server/src/model/types";
import type { Pose, SweepResult } from "../../server/src/mechanics/types";
import type { Finding } from "../../server/src/findings/finding";
import { finding } from "../../server/src/findings/finding";
import type { Readouts } from "../../server/src/checks/readout";
import type { Span } from "../../server/src/syntax/span";
import type { ViewInput } from "../../server/src/view/build-view-model";

export const G = 9.80665; // standard gravity, SI Brochure 9th ed.
export const M = 1.0; // payload, kg
export const L_ARM = 0.4; // payload lever l, m
export const A = 0.05; // anchor above the pivot, m
export const B = 0.1; // hook along the link, m
export const PIVOT_Y = 0.3;
export const K_BALANCED = (M * G * L_ARM) / (A * B);

export const PENDULUM_TEXT = `arm "Test pendulum" {
  base post {
    point pivot (0 mm, 300 mm)
    point anchor (0 mm, 350 mm)
  }
  link boom {
    length 400 mm
    section rect 20 mm x 6 mm
    mass 0 g
  }
  joint shoulder {
    connects post.pivot to boom.start
    angle 0 deg
    range -45 deg .. 60 deg
    pin 3 mm steel_1018
  }
  spring lift {
    zero_length
    between post.anchor and boom(100 mm, 0 mm)
    rate 0.55 N/mm
  }
  payload lamp {
    mass 1 kg
    at boom.end
  }
}
`;

/** Span of the n-th occurrence of `needle` in the text. */
export function spanOf(text: string, needle: string, nth = 0): Span {
  let at = -1;
  for (let i = 0; i <= nth; i++) at = text.indexOf(needle, at + 1);
  if (at < 0) throw new Error(`fixture text lacks ${needle}`);
  return { start: at, end: at + needle.length };
}

/** Span of a declaration `keyword name { ... }` up to its closing brace at two spaces' indent. */
function declSpan(text: string, head: string): Span {
  const start = text.indexOf(head);
  const end = text.indexOf("\n  }", start) + 4;
  return { start, end };
}

function origin(text: string, head: string, name: string, props: string[]) {
  const decl = declSpan(text, head);
  const properties: Record<string, Span> = {};
  for (const p of props) {
    const at = text.indexOf(`\n    ${p} `, decl.start);
    const lineEnd = text.indexOf("\n", at + 1);
    properties[p] = { start: at + 5, end: lineEnd };
  }
  const nameAt = text.indexOf(name, decl.start + head.indexOf(name) - 1);
  return { declaration: decl, name: { start: nameAt, end: nameAt + name.length }, properties };
}

export function pendulumModel(rate: number, text = PENDULUM_TEXT): ArmModel {
  const base: Body = {
    id: "post",
    kind: "base",
    length: 0,
    mass: 0,
    massGiven: false,
    centreOfMass: { x: 0, y: 0 },
    points: { pivot: { x: 0, y: PIVOT_Y }, anchor: { x: 0, y: PIVOT_Y + A } },
    origin: origin(text, "base post", "post", ["point"]),
  };
  const boom: Body = {
    id: "boom",
    kind: "link",
    length: L_ARM,
    section: { shape: "rect", depth: 0.02, width: 0.006 },
    mass: 0,
    massGiven: true,
    centreOfMass: { x: L_ARM / 2, y: 0 },
    points: { start: { x: 0, y: 0 }, end: { x: L_ARM, y: 0 } },
    origin: origin(text, "link boom", "boom", ["length", "section", "mass"]),
  };
  const shoulder: Joint = {
    id: "shoulder",
    parent: "post",
    child: "boom",
    parentPoint: { x: 0, y: PIVOT_Y },
    childPoint: { x: 0, y: 0 },
    parentPointName: "pivot",
    childPointName: "start",
    angle: 0,
    mode: "range",
    range: [(-45 * Math.PI) / 180, (60 * Math.PI) / 180],
    pin: { diameter: 0.003, material: "steel_1018", shearPlanes: 1 },
    origin: origin(text, "joint shoulder", "shoulder", ["connects", "angle", "range", "pin"]),
  };
  const lift: Spring = {
    id: "lift",
    kind: "zero_length",
    rate,
    initialTension: 0,
    a: {
      body: "post",
      point: { x: 0, y: PIVOT_Y + A },
      pointName: "anchor",
      span: spanOf(text, "post.anchor"),
    },
    b: { body: "boom", point: { x: B, y: 0 }, span: spanOf(text, "boom(100 mm, 0 mm)") },
    origin: origin(text, "spring lift", "lift", ["zero_length", "between", "rate"]),
  };
  const lamp: Payload = {
    id: "lamp",
    body: "boom",
    point: { x: L_ARM, y: 0 },
    mass: M,
    origin: origin(text, "payload lamp", "lamp", ["mass", "at"]),
  };
  return {
    title: "Test pendulum",
    gravity: G,
    base: { bodyId: "post", mass: 0, yaw: false, surface: 0 },
    bodies: [base, boom],
    joints: [shoulder],
    parallelograms: [],
    springs: [lift],
    payloads: [lamp],
    materials: {},
    bearings: {},
    fastenings: {},
    require: {
      balance: { default: 1, byPayload: {} },
      safety: 2,
      tilt: { default: 0.035, byPayload: {} },
      deflection: { default: 0.002, byPayload: {} },
      frequency: 4,
      tipping: 1.5,
      clearance: 0.003,
    },
    sweep: { steps: 22, grid: true },
    span: { start: 0, end: text.length },
  };
}

export function pendulumHoldingTorque(theta: number, rate: number): number {
  return (M * G * L_ARM - rate * A * B) * Math.cos(theta);
}

export function pendulumPose(index: number, theta: number, rate: number): Pose {
  const hook = { x: B * Math.cos(theta), y: PIVOT_Y + B * Math.sin(theta) };
  const anchor = { x: 0, y: PIVOT_Y + A };
  const length = Math.sqrt(A * A + B * B - 2 * A * B * Math.sin(theta));
  const tau = pendulumHoldingTorque(theta, rate);
  return {
    index,
    angles: { shoulder: theta },
    jointAngles: { shoulder: theta },
    bodies: { post: { x: 0, y: 0, phi: 0 }, boom: { x: 0, y: PIVOT_Y, phi: theta } },
    springs: { lift: { length, a: anchor, b: hook } },
    cases: [
      {
        holdingTorque: { shoulder: tau },
        handForce: { lamp: Math.abs(tau) / L_ARM },
        reactions: {},
        lockedTorque: {},
        springForce: { lift: rate * length },
        gravityTorque: { shoulder: M * G * L_ARM * Math.cos(theta) },
        loadTorque: { shoulder: 0 },
      },
    ],
    springTorque: {
      springIndex: new Map([["lift", 0]]),
      dofIndex: new Map([["shoulder", 0]]),
      values: Float64Array.of(-rate * A * B * Math.cos(theta)),
    },
  };
}

export function pendulumSweep(rate: number, steps = 22): SweepResult {
  const lo = (-45 * Math.PI) / 180;
  const hi = (60 * Math.PI) / 180;
  const poses = Array.from({ length: steps }, (_, i) =>
    pendulumPose(i, lo + ((hi - lo) * i) / (steps - 1), rate),
  );
  return {
    dofs: [{ id: "shoulder", jointId: "shoulder", range: [lo, hi], reference: 0 }],
    loadCases: [{ id: "nominal", label: "nominal", payloadMass: { lamp: M } }],
    reference: pendulumPose(0, 0, rate),
    poses,
    steps,
    grid: true,
    findings: [],
  };
}

/** An unbalanced (k at 55 % of balance) pendulum with a failing pin, as analyse() would return it. */
export function pendulumAnalysis(rate = 550): ViewInput {
  const text = PENDULUM_TEXT;
  const model = pendulumModel(rate, text);
  const sweep = pendulumSweep(rate);
  const worst = Math.max(...sweep.poses.map((p) => p.cases[0]!.handForce.lamp!));
  const findings: Finding[] = [
    finding(
      "balance.unbalanced",
      model.springs[0]!.origin.properties.rate!,
      `Holding lamp needs up to ${worst.toFixed(2)} N; the arm sinks.`,
      {
        data: {
          subject: "lift",
          payload: "lamp",
          spring: "lift",
          limit: 1,
          worstHandForce: worst,
          worstPose: {},
          sinks: true,
          worstHandForceBefore: worst,
          worstHandForceAfter: 0,
          best: { rate: K_BALANCED, initial_tension: 0 },
        },
      },
    ),
    finding(
      "strength.overstress",
      model.joints[0]!.origin.properties.pin!,
      "Pin of shoulder: safety factor 1.4 in shear, below 2.",
      {
        data: { subject: "shoulder", check: "pin", safety: 1.4, required: 2 },
      },
    ),
  ];
  const readouts: Readouts = {
    shoulder: {
      id: "shoulder",
      kind: "joint",
      figures: [],
      notes: [],
      worstSafety: { value: 1.4, what: "pin shear", where: "at shoulder -45 deg" },
    },
    boom: {
      id: "boom",
      kind: "link",
      figures: [],
      notes: [],
      worstSafety: { value: 6.2, what: "bending at start", where: "at shoulder 0 deg" },
    },
  };
  return { text, model, sweep, findings, readouts };
}
