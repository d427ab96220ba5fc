// Hand-built arm models and solved poses for the structure and check tests, independent of the
// parser and the solver: forward kinematics on the joint tree and tree statics (each joint's
// reaction and torque balance everything beyond it). Trees only: no closed loops.
import type {
  ArmModel,
  Body,
  Joint,
  Material,
  Origin,
  Payload,
  Section,
  Spring,
  Vec2,
} from "../../server/src/model/types";
import type { Pose, PoseStatics, SweepResult } from "../../server/src/mechanics/types";
import { REQUIREMENT_DEFAULTS } from "../../server/src/model/schema";
import { sectionProperties } from "../../server/src/model/section";
import { springTension, torsionSpringTorque } from "../../server/src/mechanics/forces";

/** Standard gravity (3rd CGPM 1901; SI Brochure, 9th ed.). */
export const G = 9.80665;

let nextOffset = 0;
/** A distinct span per call, so tests can tell which words a finding points at. */
export function origin(...keys: string[]): Origin {
  const start = (nextOffset += 100);
  const properties: Record<string, { start: number; end: number }> = {};
  keys.forEach((k, i) => (properties[k] = { start: start + 10 * (i + 1), end: start + 10 * (i + 1) + 5 }));
  return { declaration: { start, end: start + 99 }, name: { start: start + 1, end: start + 5 }, properties };
}

/** Typical values, docs/materials.md (sources there; several "from memory"). */
export const MATERIALS: Record<string, Material> = {
  aluminium_6061_t6: {
    id: "aluminium_6061_t6",
    density: 2700,
    modulus: 68.9e9,
    shearModulus: 26e9,
    poisson: 0.33,
    strength: 276e6,
    printed: false,
    builtin: true,
  },
  steel_1018: {
    id: "steel_1018",
    density: 7870,
    modulus: 207e9,
    shearModulus: 79.3e9,
    poisson: 0.3,
    strength: 370e6,
    printed: false,
    builtin: true,
  },
  petg: {
    id: "petg",
    density: 1270,
    modulus: 2.0e9,
    shearModulus: 0.74e9,
    poisson: 0.35,
    strength: 45e6,
    layerStrength: 22.5e6,
    printed: true,
    builtin: true,
  },
  music_wire: {
    id: "music_wire",
    density: 7850,
    modulus: 200e9,
    shearModulus: 81.7e9,
    poisson: 0.3,
    strength: 2153e6,
    printed: false,
    builtin: true,
  },
};

export function linkBody(
  id: string,
  length: number,
  section: Section,
  material: string,
  kind: "link" | "bar" = "link",
  points: Record<string, Vec2> = {},
): Body {
  const mass = sectionProperties(section).area * length * MATERIALS[material]!.density;
  return {
    id,
    kind,
    length,
    section,
    material,
    mass,
    massGiven: false,
    centreOfMass: { x: length / 2, y: 0 },
    points: { start: { x: 0, y: 0 }, end: { x: length, y: 0 }, ...points },
    origin: origin("length", "section", "material", "holes"),
  };
}

export function baseBody(id: string, points: Record<string, Vec2>): Body {
  return {
    id,
    kind: "base",
    length: 0,
    mass: 0,
    massGiven: true,
    centreOfMass: { x: 0, y: 0 },
    points,
    origin: origin("mass", "footprint"),
  };
}

export function joint(
  id: string,
  parent: string,
  parentPoint: Vec2,
  child: string,
  angle: number,
  mode: Joint["mode"],
  extra: Partial<Joint> = {},
): Joint {
  return {
    id,
    parent,
    child,
    parentPoint,
    childPoint: { x: 0, y: 0 },
    angle,
    mode,
    ...(mode === "range" ? { range: [angle - 0.5, angle + 0.5] as [number, number] } : {}),
    origin: origin("connects", "angle", "range", "pin", "friction"),
    ...extra,
  };
}

export function payload(
  id: string,
  body: string,
  point: Vec2,
  mass: number,
  extra: Partial<Payload> = {},
): Payload {
  return { id, body, point, mass, origin: origin("mass", "at", "force"), ...extra };
}

export function armModel(parts: {
  bodies: Body[];
  joints: Joint[];
  springs?: Spring[];
  payloads?: Payload[];
  base?: ArmModel["base"];
}): ArmModel {
  const baseId = parts.bodies.find((b) => b.kind === "base")!.id;
  return {
    title: "fixture",
    gravity: G,
    base: parts.base ?? { bodyId: baseId, mass: 0, yaw: false, surface: 0 },
    bodies: parts.bodies,
    joints: parts.joints,
    parallelograms: [],
    springs: parts.springs ?? [],
    payloads: parts.payloads ?? [],
    materials: MATERIALS,
    bearings: {},
    fastenings: {},
    require: {
      balance: { default: REQUIREMENT_DEFAULTS.balanceN, byPayload: {} },
      safety: REQUIREMENT_DEFAULTS.safety,
      tilt: { default: REQUIREMENT_DEFAULTS.tiltRad, byPayload: {} },
      deflection: { default: REQUIREMENT_DEFAULTS.deflectionM, byPayload: {} },
      frequency: REQUIREMENT_DEFAULTS.frequencyHz,
      tipping: REQUIREMENT_DEFAULTS.tipping,
      clearance: REQUIREMENT_DEFAULTS.clearanceM,
      origin: origin("balance", "safety", "tilt", "deflection", "frequency", "tipping", "clearance"),
    },
    sweep: { steps: 5, grid: true },
    span: { start: 0, end: 100000 },
  };
}

function world(p: { x: number; y: number; phi: number }, local: Vec2): Vec2 {
  const c = Math.cos(p.phi);
  const s = Math.sin(p.phi);
  return { x: p.x + c * local.x - s * local.y, y: p.y + s * local.x + c * local.y };
}

/** Spring force by the mechanics core's force laws (torsion: T = preload + k (theta - theta_ref),
 * +T on the parent, -T on the child). */
function springForceOf(model: ArmModel, sp: Spring, length: number, angle: number): number {
  return sp.kind === "torsion" ? torsionSpringTorque(sp, angle, 0) : springTension(model, sp, length);
}

/** Solves one pose of a tree-shaped arm: joint angles (default: each joint's `angle`). */
export function treePose(
  model: ArmModel,
  angles: Record<string, number> = {},
  index = 0,
  payloadMass: Record<string, number> = {},
): Pose {
  const baseId = model.base!.bodyId;
  const bodies: Pose["bodies"] = { [baseId]: { x: 0, y: 0, phi: 0 } };
  const jointAngles: Record<string, number> = {};
  const placed = new Set([baseId]);
  let progress = true;
  while (progress) {
    progress = false;
    for (const j of model.joints) {
      if (!placed.has(j.parent) || placed.has(j.child)) continue;
      const a = angles[j.id] ?? j.angle;
      jointAngles[j.id] = a;
      const pp = bodies[j.parent]!;
      const pivot = world(pp, j.parentPoint);
      const phi = pp.phi + a;
      const c = Math.cos(phi);
      const s = Math.sin(phi);
      bodies[j.child] = {
        x: pivot.x - (c * j.childPoint.x - s * j.childPoint.y),
        y: pivot.y - (s * j.childPoint.x + c * j.childPoint.y),
        phi,
      };
      placed.add(j.child);
      progress = true;
    }
  }
  const springs: Pose["springs"] = {};
  const springForce: Record<string, number> = {};
  for (const sp of model.springs) {
    if (sp.kind === "torsion") {
      const j = model.joints.find((x) => x.id === sp.joint)!;
      const p = world(bodies[j.parent]!, j.parentPoint);
      springs[sp.id] = { length: NaN, a: p, b: p, windUp: (jointAngles[j.id] ?? j.angle) - j.angle };
      springForce[sp.id] = springForceOf(model, sp, NaN, (jointAngles[j.id] ?? j.angle) - j.angle);
      continue;
    }
    const a = world(bodies[sp.a.body]!, sp.a.point);
    const b = world(bodies[sp.b.body]!, sp.b.point);
    const length = Math.hypot(b.x - a.x, b.y - a.y);
    springs[sp.id] = { length, a, b };
    springForce[sp.id] = springForceOf(model, sp, length, 0);
  }
  // Tree statics: the joint into a subtree balances every external load on the subtree.
  const subtree = (childId: string): Set<string> => {
    const set = new Set([childId]);
    let grew = true;
    while (grew) {
      grew = false;
      for (const j of model.joints)
        if (set.has(j.parent) && !set.has(j.child)) (set.add(j.child), (grew = true));
    }
    return set;
  };
  const reactions: Record<string, Vec2> = {};
  const holdingTorque: Record<string, number> = {};
  const lockedTorque: Record<string, number> = {};
  for (const j of model.joints) {
    const set = subtree(j.child);
    const pivot = world(bodies[j.parent]!, j.parentPoint);
    let fx = 0;
    let fy = 0;
    let m = 0;
    const add = (p: Vec2, f: Vec2, couple = 0) => {
      fx += f.x;
      fy += f.y;
      m += (p.x - pivot.x) * f.y - (p.y - pivot.y) * f.x + couple;
    };
    for (const b of model.bodies)
      if (set.has(b.id)) add(world(bodies[b.id]!, b.centreOfMass), { x: 0, y: -b.mass * model.gravity });
    for (const p of model.payloads)
      if (set.has(p.body))
        add(world(bodies[p.body]!, p.point), {
          x: p.force?.x ?? 0,
          y: -(payloadMass[p.id] ?? p.mass) * model.gravity + (p.force?.y ?? 0),
        });
    for (const sp of model.springs) {
      const T = springForce[sp.id]!;
      if (sp.kind === "torsion") {
        if (sp.joint === j.id) add(pivot, { x: 0, y: 0 }, -T);
        continue;
      }
      const st = springs[sp.id]!;
      const ux = (st.b.x - st.a.x) / st.length;
      const uy = (st.b.y - st.a.y) / st.length;
      const inA = set.has(sp.a.body);
      const inB = set.has(sp.b.body);
      if (inA && !inB) add(st.a, { x: T * ux, y: T * uy });
      if (inB && !inA) add(st.b, { x: -T * ux, y: -T * uy });
    }
    reactions[j.id] = { x: -fx, y: -fy };
    if (j.mode === "fixed") lockedTorque[j.id] = -m;
    else if (j.mode === "range") holdingTorque[j.id] = -m;
  }
  const statics: PoseStatics = { holdingTorque, handForce: {}, reactions, lockedTorque, springForce };
  const dofAngles: Record<string, number> = {};
  for (const j of model.joints) if (j.mode === "range") dofAngles[j.id] = jointAngles[j.id]!;
  // the base is the world frame, not a pose entry (as the solver reports it)
  delete bodies[baseId];
  return { index, angles: dofAngles, jointAngles, bodies, springs, cases: [statics] };
}

/** A sweep result over the given joint-angle sets (the first is also the reference pose). */
export function treeSweep(model: ArmModel, angleSets: Record<string, number>[]): SweepResult {
  const poses = angleSets.map((a, i) => treePose(model, a, i));
  const dofs = model.joints
    .filter((j) => j.mode === "range")
    .map((j) => ({ id: j.id, jointId: j.id, range: j.range!, reference: j.angle }));
  return {
    dofs,
    loadCases: [
      {
        id: "nominal",
        label: "nominal",
        payloadMass: Object.fromEntries(model.payloads.map((p) => [p.id, p.mass])),
      },
    ],
    reference: treePose(model, {}, -1),
    poses,
    steps: angleSets.length,
    grid: false,
    findings: [],
  };
}
