// The loaded arm at one pose as a plane frame (mechanics.md section 7): links and bars as frame
// elements, pins as tied translations with released rotations, degrees of freedom and fixed
// joints as locked rotations, springs as axial members with their tangent rate, the base fixed.
// Masses are lumped at nodes (translation only; rotary inertia of bodies and payloads ignored).
import type { ArmModel, Body, Spring, Vec2 } from "../../model/types";
import type { Pose, PoseStatics } from "../types";
import { sectionProperties } from "../../model/section";
import { PlaneFrame } from "./frame";
import { worldPoint } from "../body-loads";
import { atJoint, springKind } from "../../model/spring-kinds";

/** Elements per link at least, so its mass spreads along it and its bending shape shows in the
 * lowest mode (4 lumped elements put a cantilever's first frequency within about 1 %). */
const MIN_ELEMENTS_PER_LINK = 4;
/** Parts without a section (heads, links given only a mass) are modelled this much stiffer than
 * the stiffest real member: rigid for all practical purposes, yet well conditioned. */
const RIGID_FACTOR = 1e4;
/** Stations closer than this along a link are one node (0.001 mm). */
const STATION_MERGE_M = 1e-6;

export interface ArmFrame {
  frame: PlaneFrame;
  payloadNode: Record<string, number>;
  /** The node at each link's `end` point. */
  endNode: Record<string, number>;
  /** Body id of each element; undefined for rigid offsets and parts without a section. */
  elementBody: (string | undefined)[];
}

/** Tangent rate dT/dL of a two-point spring at `length`, N/m (its kind's law; 0 for a spring
 * that acts at a joint, which the frame takes as a rotational spring instead). */
export function springTangentRate(model: ArmModel, spring: Spring, length: number): number {
  return atJoint(spring) ? 0 : springKind(spring).tangentRate(spring, length, model);
}

function interestPoints(model: ArmModel, body: Body): Vec2[] {
  const pts: Vec2[] = [];
  for (const j of model.joints) {
    if (j.parent === body.id) pts.push(j.parentPoint);
    if (j.child === body.id) pts.push(j.childPoint);
  }
  for (const s of model.springs) {
    if (atJoint(s)) continue;
    if (s.a.body === body.id) pts.push(s.a.point);
    if (s.b.body === body.id) pts.push(s.b.point);
  }
  for (const p of model.payloads) if (p.body === body.id) pts.push(p.point);
  return pts;
}

/** Builds the frame of the arm at `pose` with the loads of `statics` (spring tensions) and the
 * given payload masses. */
export function buildArmFrame(
  model: ArmModel,
  pose: Pose,
  statics: PoseStatics | undefined,
  payloadMass: Record<string, number>,
): ArmFrame {
  const frame = new PlaneFrame();
  const g = model.gravity;
  const nodes = new Map<string, number>();
  const key = (body: string, p: Vec2) => `${body}|${p.x.toFixed(7)}|${p.y.toFixed(7)}`;
  // a point on a link's axis within the merge distance of a station is that station's node
  const stationsOf = new Map<string, number[]>();
  const snap = (body: Body, p: Vec2): Vec2 => {
    const st = stationsOf.get(body.id);
    if (!st || Math.abs(p.y) > STATION_MERGE_M) return p;
    for (const s of st) if (Math.abs(s - p.x) <= STATION_MERGE_M) return { x: s, y: 0 };
    return p;
  };
  const nodeAt = (body: Body, raw: Vec2): number => {
    const p = snap(body, raw);
    const k = key(body.id, p);
    let n = nodes.get(k);
    if (n === undefined) {
      const w = worldPoint(pose, body.id, p, model);
      n = frame.addNode(w.x, w.y);
      nodes.set(k, n);
      if (body.kind === "base") frame.fix(n);
    }
    return n;
  };
  let maxEA = 0;
  let maxEI = 0;
  const real = new Map<string, { EA: number; EI: number }>();
  for (const b of model.bodies) {
    if ((b.kind !== "link" && b.kind !== "bar") || !b.section || !b.material) continue;
    const mat = model.materials[b.material];
    if (!mat) continue;
    const sp = sectionProperties(b.section);
    const r = { EA: mat.modulus * sp.area, EI: mat.modulus * sp.secondMoment };
    real.set(b.id, r);
    maxEA = Math.max(maxEA, r.EA);
    maxEI = Math.max(maxEI, r.EI);
  }
  // a metre of 1 GPa, 10 mm square stock, for arms with no real section at all
  const rigid = { EA: RIGID_FACTOR * (maxEA || 1e5), EI: RIGID_FACTOR * (maxEI || 1) };
  const elementBody: (string | undefined)[] = [];
  const element = (i: number, j: number, props: { EA: number; EI: number }, body: string | undefined) => {
    if (i === j) return;
    if (Math.hypot(frame.x[j]! - frame.x[i]!, frame.y[j]! - frame.y[i]!) <= STATION_MERGE_M) {
      // two points of one body at the same place: one node in effect
      frame.tieTranslations(i, j);
      frame.tieRotations(i, j);
      return;
    }
    frame.addElement(i, j, props.EA, props.EI);
    elementBody.push(body);
  };
  const lump = (node: number, mass: number) => {
    if (!(mass > 0)) return;
    frame.addMass(node, mass);
    frame.addLoad(node, 0, -mass * g);
  };
  const endNode: Record<string, number> = {};

  const placed = (id: string) => id === model.base?.bodyId || pose.bodies[id] !== undefined;
  for (const body of model.bodies) {
    if (!placed(body.id)) continue;
    const pts = interestPoints(model, body);
    if (body.kind === "base") {
      for (const p of pts) nodeAt(body, p);
      continue;
    }
    if (body.length > 0) {
      const L = body.length;
      const raw = [0, L, ...pts.map((p) => Math.max(0, Math.min(L, p.x)))];
      for (let k = 1; k < MIN_ELEMENTS_PER_LINK; k++) raw.push((k * L) / MIN_ELEMENTS_PER_LINK);
      raw.sort((a, b) => a - b);
      const stations: number[] = [];
      for (const s of raw)
        if (stations.length === 0 || s - stations[stations.length - 1]! > STATION_MERGE_M) stations.push(s);
      stationsOf.set(body.id, stations);
      const axis = stations.map((s) => nodeAt(body, { x: s, y: 0 }));
      const props = real.get(body.id);
      for (let k = 0; k + 1 < axis.length; k++) {
        element(axis[k]!, axis[k + 1]!, props ?? rigid, props ? body.id : undefined);
        const share = (body.mass * (stations[k + 1]! - stations[k]!)) / L / 2;
        lump(axis[k]!, share);
        lump(axis[k + 1]!, share);
      }
      for (const p of pts) {
        const s = Math.max(0, Math.min(L, p.x));
        if (Math.hypot(p.x - s, p.y) <= STATION_MERGE_M) continue;
        element(nodeAt(body, { x: s, y: 0 }), nodeAt(body, p), rigid, undefined);
      }
      endNode[body.id] = nodeAt(body, { x: L, y: 0 });
    } else {
      const o = nodeAt(body, { x: 0, y: 0 });
      for (const p of [...pts, body.centreOfMass]) element(o, nodeAt(body, p), rigid, undefined);
      lump(nodeAt(body, body.centreOfMass), body.mass);
    }
  }
  const bodyById = new Map(model.bodies.map((b) => [b.id, b]));
  for (const j of model.joints) {
    const parent = bodyById.get(j.parent);
    const child = bodyById.get(j.child);
    if (!parent || !child || !placed(parent.id) || !placed(child.id)) continue;
    const a = nodeAt(parent, j.parentPoint);
    const b = nodeAt(child, j.childPoint);
    frame.tieTranslations(a, b);
    if (j.mode !== "passive") frame.tieRotations(a, b);
  }
  for (const sp of model.springs) {
    if (atJoint(sp)) {
      const j = model.joints.find((jj) => jj.id === sp.joint);
      const parent = j && bodyById.get(j.parent);
      const child = j && bodyById.get(j.child);
      if (j && parent && child && j.mode === "passive")
        frame.addRotationalSpring(nodeAt(parent, j.parentPoint), nodeAt(child, j.childPoint), sp.rate);
      continue;
    }
    const A = bodyById.get(sp.a.body);
    const B = bodyById.get(sp.b.body);
    if (!A || !B || !placed(A.id) || !placed(B.id)) continue;
    const na = nodeAt(A, sp.a.point);
    const nb = nodeAt(B, sp.b.point);
    const dx = frame.x[nb]! - frame.x[na]!;
    const dy = frame.y[nb]! - frame.y[na]!;
    const L = Math.hypot(dx, dy);
    if (!(L > 0)) continue;
    frame.addAxialSpring(na, nb, springTangentRate(model, sp, L));
    const T = statics?.springForce[sp.id] ?? 0;
    frame.addLoad(na, (T * dx) / L, (T * dy) / L);
    frame.addLoad(nb, (-T * dx) / L, (-T * dy) / L);
  }
  const payloadNode: Record<string, number> = {};
  for (const p of model.payloads) {
    const body = bodyById.get(p.body);
    if (!body || !placed(body.id)) continue;
    const n = nodeAt(body, p.point);
    payloadNode[p.id] = n;
    const m = payloadMass[p.id] ?? p.mass;
    lump(n, m);
    if (p.force) frame.addLoad(n, p.force.x, p.force.y);
  }
  return { frame, payloadNode, endNode, elementBody };
}
