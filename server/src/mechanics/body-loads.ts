// Every load acting on one body at a solved pose, for the strength checks: gravity at its centre
// of mass, payload weight and steady forces, spring hook forces, torsion spring couples, joint
// reactions (the parent's force on the child, and its opposite on the parent), and the holding
// and locking couples at degrees of freedom and locked joints. For any body but the base, the
// forces and the moments of one pose and load case sum to zero (the base's support is not listed).
import type { ArmModel, Body, Joint, Payload, Spring, Vec2 } from "../model/types";
import type { Pose, SweepResult } from "./types";
import type { BeamPointLoad } from "./structure/beam";
import { toWorld } from "./plane";
import { atJoint } from "../model/spring-kinds";

export type LoadKind =
  "gravity" | "payload" | "payload-force" | "spring" | "torsion" | "reaction" | "holding" | "locked";

export interface AppliedLoad {
  kind: LoadKind;
  /** The body, payload, spring or joint the load comes from. */
  id: string;
  /** Where it acts, world, m (for a pure couple: the joint's pivot). */
  point: Vec2;
  /** Force, world, N (zero for a couple). */
  force: Vec2;
  /** Pure couple, N*m, CCW positive (zero for a force). */
  couple: number;
}

/** What touches each body, indexed once per model (the strength checks ask for every body at
 * every pose and load case). Models are values: nothing changes them once built. */
interface BodyIndex {
  bodies: Map<string, Body>;
  payloads: Map<string, Payload[]>;
  springEnds: Map<string, { spring: Spring; end: "a" | "b" }[]>;
  torsions: Map<string, { spring: Spring; joint: Joint; side: 1 | -1 }[]>;
  joints: Map<string, { joint: Joint; side: 1 | -1 }[]>;
}
const indexes = new WeakMap<ArmModel, BodyIndex>();

function push<T>(map: Map<string, T[]>, key: string, value: T): void {
  const list = map.get(key);
  if (list) list.push(value);
  else map.set(key, [value]);
}

function bodyIndex(model: ArmModel): BodyIndex {
  let ix = indexes.get(model);
  if (ix) return ix;
  ix = {
    bodies: new Map(model.bodies.map((b) => [b.id, b])),
    payloads: new Map(),
    springEnds: new Map(),
    torsions: new Map(),
    joints: new Map(),
  };
  for (const p of model.payloads) push(ix.payloads, p.body, p);
  const jointsById = new Map(model.joints.map((j) => [j.id, j]));
  for (const s of model.springs) {
    if (atJoint(s)) {
      const j = jointsById.get(s.joint);
      if (!j) continue;
      push(ix.torsions, j.parent, { spring: s, joint: j, side: 1 });
      push(ix.torsions, j.child, { spring: s, joint: j, side: -1 });
      continue;
    }
    push(ix.springEnds, s.a.body, { spring: s, end: "a" });
    push(ix.springEnds, s.b.body, { spring: s, end: "b" });
  }
  for (const j of model.joints) {
    push(ix.joints, j.child, { joint: j, side: 1 });
    if (j.parent !== j.child) push(ix.joints, j.parent, { joint: j, side: -1 });
  }
  indexes.set(model, ix);
  return ix;
}

/** World position of a body's local point at a pose (the base's frame is the world). */
export function worldPoint(pose: Pose, bodyId: string, localPoint: Vec2, model: ArmModel): Vec2 {
  const body = bodyIndex(model).bodies.get(bodyId);
  if (body?.kind === "base") return { x: localPoint.x, y: localPoint.y };
  const bp = pose.bodies[bodyId];
  if (!bp) return { x: NaN, y: NaN };
  return toWorld(bp, localPoint);
}

export function bodyLoads(
  model: ArmModel,
  sweep: Pick<SweepResult, "loadCases" | "dofs">,
  pose: Pose,
  caseIndex: number,
  bodyId: string,
): AppliedLoad[] {
  const loads: AppliedLoad[] = [];
  const statics = pose.cases[caseIndex];
  const loadCase = sweep.loadCases[caseIndex];
  if (!statics || !loadCase || !pose.bodies[bodyId]) return loads;
  const ix = bodyIndex(model);
  const g = model.gravity;
  const zero = { x: 0, y: 0 };
  const body = ix.bodies.get(bodyId);
  if (body && body.mass !== 0 && body.kind !== "base") {
    loads.push({
      kind: "gravity",
      id: body.id,
      point: worldPoint(pose, bodyId, body.centreOfMass, model),
      force: { x: 0, y: -body.mass * g },
      couple: 0,
    });
  }
  for (const p of ix.payloads.get(bodyId) ?? []) {
    const at = worldPoint(pose, bodyId, p.point, model);
    const mass = loadCase.payloadMass[p.id] ?? p.mass;
    loads.push({ kind: "payload", id: p.id, point: at, force: { x: 0, y: -mass * g }, couple: 0 });
    if ((p.force && (p.force.x !== 0 || p.force.y !== 0)) || p.torque?.z)
      loads.push({
        kind: "payload-force",
        id: p.id,
        point: at,
        force: { x: p.force?.x ?? 0, y: p.force?.y ?? 0 },
        couple: p.torque?.z ?? 0,
      });
  }
  for (const t of ix.torsions.get(bodyId) ?? []) {
    const state = pose.springs[t.spring.id];
    const torque = statics.springForce[t.spring.id];
    if (!state || torque === undefined) continue;
    // The spring applies T to the parent and -T to the child.
    loads.push({ kind: "torsion", id: t.spring.id, point: state.a, force: zero, couple: t.side * torque });
  }
  for (const { spring: s, end } of ix.springEnds.get(bodyId) ?? []) {
    const state = pose.springs[s.id];
    const force = statics.springForce[s.id];
    if (!state || force === undefined || !hookForce(state, force, end, HOOK)) continue;
    loads.push({
      kind: "spring",
      id: s.id,
      point: end === "a" ? state.a : state.b,
      force: { x: HOOK.x, y: HOOK.y },
      couple: 0,
    });
  }
  for (const { joint: j, side } of ix.joints.get(bodyId) ?? []) {
    const r = statics.reactions[j.id];
    if (!r) continue;
    const pivot =
      side === 1
        ? worldPoint(pose, j.child, j.childPoint, model)
        : worldPoint(pose, j.parent, j.parentPoint, model);
    loads.push({
      kind: "reaction",
      id: j.id,
      point: pivot,
      force: { x: side * r.x, y: side * r.y },
      couple: 0,
    });
    // A dof's id is its joint's id (conventions).
    const hold = statics.holdingTorque[j.id];
    if (hold !== undefined && sweep.dofs.some((d) => d.jointId === j.id))
      loads.push({ kind: "holding", id: j.id, point: pivot, force: zero, couple: side * hold });
    const locked = statics.lockedTorque[j.id];
    if (locked !== undefined)
      loads.push({ kind: "locked", id: j.id, point: pivot, force: zero, couple: side * locked });
  }
  return loads;
}

/** What loads one body, resolved once from the model's index (the strength check asks at every
 * pose and load case). */
export interface BeamLoadSources {
  bodyId: string;
  /** The base's points are world points as given (worldPoint). */
  base: boolean;
  payloads: readonly Payload[];
  torsions: readonly { spring: Spring; joint: Joint; side: 1 | -1 }[];
  springEnds: readonly { spring: Spring; end: "a" | "b" }[];
  joints: readonly { joint: Joint; side: 1 | -1 }[];
}

const NONE: readonly never[] = [];

export function beamLoadSources(model: ArmModel, bodyId: string): BeamLoadSources {
  const ix = bodyIndex(model);
  return {
    bodyId,
    base: ix.bodies.get(bodyId)?.kind === "base",
    payloads: ix.payloads.get(bodyId) ?? NONE,
    torsions: ix.torsions.get(bodyId) ?? NONE,
    springEnds: ix.springEnds.get(bodyId) ?? NONE,
    joints: ix.joints.get(bodyId) ?? NONE,
  };
}

/** The loads of `bodyLoads` except the body's own weight, in the body's local axes, written into
 * `out` (grown as needed, its objects reused) in the same order and with the same arithmetic as
 * mapping `bodyLoads` through the body's rotation: the strength check's hot loop (every beam at
 * every pose and load case) without an object per load. `sources` are the body's
 * (beamLoadSources), `bp` its place at the pose (pose.bodies of its id). Returns how many were
 * written. */
export function localBeamLoads(
  sources: BeamLoadSources,
  g: number,
  loadCases: SweepResult["loadCases"],
  dofJoints: ReadonlySet<string>,
  pose: Pose,
  caseIndex: number,
  bp: { x: number; y: number; phi: number },
  out: BeamPointLoad[],
): number {
  const statics = pose.cases[caseIndex];
  const loadCase = loadCases[caseIndex];
  if (!statics || !loadCase) return 0;
  const c = Math.cos(bp.phi);
  const s = Math.sin(bp.phi);
  // World points of this body's local points as worldPoint gives them (the base: as given),
  // worldX and worldY written out; indexed loops: for-of and calls are dear in the untuned tier.
  const base = sources.base;
  const ox = bp.x;
  const oy = bp.y;
  let n = 0;
  const { payloads, torsions, springEnds, joints } = sources;
  for (let k = 0; k < payloads.length; k++) {
    const p = payloads[k]!;
    const lx = p.point.x;
    const ly = p.point.y;
    const px = base ? lx : ox + c * lx - s * ly;
    const py = base ? ly : oy + s * lx + c * ly;
    const mass = loadCase.payloadMass[p.id] ?? p.mass;
    n = putLocalLoad(out, n, bp, c, s, px, py, 0, -mass * g, 0);
    if ((p.force && (p.force.x !== 0 || p.force.y !== 0)) || p.torque?.z)
      n = putLocalLoad(out, n, bp, c, s, px, py, p.force?.x ?? 0, p.force?.y ?? 0, p.torque?.z ?? 0);
  }
  for (let k = 0; k < torsions.length; k++) {
    const t = torsions[k]!;
    const state = pose.springs[t.spring.id];
    const torque = statics.springForce[t.spring.id];
    if (!state || torque === undefined) continue;
    n = putLocalLoad(out, n, bp, c, s, state.a.x, state.a.y, 0, 0, t.side * torque);
  }
  for (let k = 0; k < springEnds.length; k++) {
    const { spring: sp, end } = springEnds[k]!;
    const state = pose.springs[sp.id];
    const force = statics.springForce[sp.id];
    if (!state || force === undefined || !hookForce(state, force, end, HOOK)) continue;
    const at = end === "a" ? state.a : state.b;
    n = putLocalLoad(out, n, bp, c, s, at.x, at.y, HOOK.x, HOOK.y, 0);
  }
  const { reactions, holdingTorque, lockedTorque } = statics;
  for (let k = 0; k < joints.length; k++) {
    const { joint: j, side } = joints[k]!;
    const r = reactions[j.id];
    if (!r) continue;
    // The pivot on this body: its child point when it is the child, else its parent point.
    const lp = side === 1 ? j.childPoint : j.parentPoint;
    const px = base ? lp.x : ox + c * lp.x - s * lp.y;
    const py = base ? lp.y : oy + s * lp.x + c * lp.y;
    n = putLocalLoad(out, n, bp, c, s, px, py, side * r.x, side * r.y, 0);
    const hold = holdingTorque[j.id];
    if (hold !== undefined && dofJoints.has(j.id))
      n = putLocalLoad(out, n, bp, c, s, px, py, 0, 0, side * hold);
    const locked = lockedTorque[j.id];
    if (locked !== undefined) n = putLocalLoad(out, n, bp, c, s, px, py, 0, 0, side * locked);
  }
  return n;
}

/** Scratch for hookForce: both load lists read it at once, so no object per spring end. */
const HOOK = { x: 0, y: 0 };

/** The force a spring of tension `force` puts on the body at its `end` hook (tension pulls each
 * hook toward the other), written into `out`; false when the hooks meet and it has no direction. */
function hookForce(
  state: { a: Vec2; b: Vec2 },
  force: number,
  end: "a" | "b",
  out: { x: number; y: number },
): boolean {
  const dx = state.b.x - state.a.x;
  const dy = state.b.y - state.a.y;
  const len = Math.hypot(dx, dy);
  if (!(len > 0)) return false;
  const ux = (force * dx) / len;
  const uy = (force * dy) / len;
  out.x = end === "a" ? ux : -ux;
  out.y = end === "a" ? uy : -uy;
  return true;
}

/** Writes one world load (at px, py) as a local beam load at out[n]; returns n + 1. */
function putLocalLoad(
  out: BeamPointLoad[],
  n: number,
  bp: { x: number; y: number },
  c: number,
  s: number,
  px: number,
  py: number,
  forceX: number,
  forceY: number,
  couple: number,
): number {
  const dx = px - bp.x;
  const dy = py - bp.y;
  let l = out[n];
  if (!l) out[n] = l = { s: 0, offset: 0, fx: 0, fy: 0, couple: 0 };
  // unturnedX and unturnedY written out (a call each is dear in the untuned tier)
  l.s = c * dx + s * dy;
  l.offset = -s * dx + c * dy;
  l.fx = c * forceX + s * forceY;
  l.fy = -s * forceX + c * forceY;
  l.couple = couple;
  return n + 1;
}

/** Resultant force and moment about a point of a list of loads. */
export function resultant(loads: readonly AppliedLoad[], about: Vec2): { force: Vec2; moment: number } {
  let fx = 0;
  let fy = 0;
  let m = 0;
  for (const l of loads) {
    fx += l.force.x;
    fy += l.force.y;
    m += (l.point.x - about.x) * l.force.y - (l.point.y - about.y) * l.force.x + l.couple;
  }
  return { force: { x: fx, y: fy }, moment: m };
}
