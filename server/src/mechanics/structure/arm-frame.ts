// The loaded arm at one pose as a space frame (docs/checks.md, Stiffness and vibration, Swivels): links and bars as
// members (at least four each) with torsion and bending both ways, their own weight as
// work-equivalent loads and their mass as consistent mass; pins as joints free to turn about their
// axis only; degrees of freedom and fixed joints welded (held by hand or brake); springs as axial
// members with their tangent rate and their tension as a pair of loads; the base fixed. Parts
// without a section (heads, links given only a mass) and every point off a bar's axis (a spring
// hook a few mm to the side) are rigid, as exact constraints: no stiff stand-in member to spoil
// the conditioning. The arm's plane is the global x-y plane (y up), its pins along z; each swivel's
// heading turns what it carries about its axis (headings.ts), pins and sections with it.
import type { ArmModel, Body, Spring, Vec2 } from "../../model/types";
import type { Pose, PoseStatics } from "../types";
import { sectionProperties } from "../../model/section";
import { SpaceFrame, type MemberProperties, type Vec3 } from "./space-frame";
import { Placement, type Headings } from "../headings";
import { atJoint, springKind } from "../../model/spring-kinds";

/** Members per link at least: cubic members with work-equivalent loads give a bar's deflection
 * under its own weight exact at the nodes with any number, and with consistent mass two put a
 * cantilever's first frequency within 0.05 % (one would be 0.5 % high). */
const MIN_ELEMENTS_PER_LINK = 2;
/** Stations closer than this along a link are one node (0.001 mm). */
const STATION_MERGE_M = 1e-6;
/** The pin axis of the arm's plane (global z). */
const PLANE_NORMAL: Vec3 = { x: 0, y: 0, z: 1 };

export interface ArmFrame {
  frame: SpaceFrame;
  payloadNode: Record<string, number>;
  /** The node at each link's `end` point. */
  endNode: Record<string, number>;
  /** Body id of each member; undefined for the mass carriers of rigid parts. */
  memberBody: (string | undefined)[];
  /** Each joint's two nodes (on its parent and on its child) and its pin axis as turned, by joint
   * id, for the joint's load (joint-wrench.ts). */
  joints: Record<string, { parent: number; child: number; axis: Vec3 }>;
  /** The rigid group of each node: nodes tied by rigid offsets (one rigid part, a hook off a
   * bar's axis) share the lowest node's index. */
  rigidGroup: Int32Array;
  /** How many joint ends and supports each rigid group holds, by group. */
  groupAttachments: Map<number, number>;
}

export interface ArmFrameOptions {
  /** Hold every node's out-of-plane translation and rotations: the plane frame, the special case
   * of an arm that does not turn (for tests that compare the two). */
  planar?: boolean;
  /** Each swivel's heading (absent: 0, the drawing plane). */
  headings?: Headings;
  /** Leave out the working loads' parts out of the drawing plane (`forceAcross`, a torque's x and
   * y): the plane's own loads. */
  inPlaneLoadsOnly?: boolean;
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

/** Member properties of a link or bar with a section and a material; its mass per length is the
 * model's (a given `mass` counts), the rotary inertia scaled with it. */
function memberProperties(model: ArmModel, body: Body): MemberProperties | undefined {
  if ((body.kind !== "link" && body.kind !== "bar") || !body.section || !body.material) return undefined;
  const mat = model.materials[body.material];
  if (!mat || !(body.length > 0)) return undefined;
  const sp = sectionProperties(body.section);
  const massPerLength = body.mass / body.length;
  return {
    axialRigidity: mat.modulus * sp.area,
    torsionalRigidity: mat.shearModulus * sp.torsionConstant,
    bendingRigidityY: mat.modulus * sp.secondMomentAcross,
    bendingRigidityZ: mat.modulus * sp.secondMoment,
    massPerLength,
    rotaryInertiaPerLength: sp.area > 0 ? (massPerLength * sp.polarMoment) / sp.area : 0,
  };
}

/** The arm's frame at one pose and headings before any load case's loads: its stiffness, its
 * own weight and the rigid parts' masses. The load cases of the pose add theirs to a copy
 * (loadArmFrame), sharing one factorisation. */
export interface ArmStructure extends Omit<ArmFrame, "frame"> {
  /** The frame with the loads every load case has (never solved itself: copies are). */
  frame: SpaceFrame;
  /** The two-point springs the frame holds, in the model's order: their hook nodes and the line
   * between them, for their tensions. */
  springLines: { id: string; na: number; nb: number; d: Vec3; length: number }[];
  /** Each payload's body, for its working loads' directions. */
  payloadBody: Record<string, string>;
  placement: Placement;
}

/** Builds the frame of the arm at `pose` with the loads of `statics` (spring tensions) and the
 * given payload masses. */
export function buildArmFrame(
  model: ArmModel,
  pose: Pose,
  statics: PoseStatics | undefined,
  payloadMass: Record<string, number>,
  options: ArmFrameOptions = {},
): ArmFrame {
  return loadArmFrame(model, armStructure(model, pose, options), statics, payloadMass, options);
}

/** The frame of `structure` under one load case: the spring tensions of `statics`, the payloads'
 * weights at the given masses and their working loads, added in the order buildArmFrame always
 * added them (so the figures are the same to the last bit). */
export function loadArmFrame(
  model: ArmModel,
  structure: ArmStructure,
  statics: PoseStatics | undefined,
  payloadMass: Record<string, number>,
  options: Pick<ArmFrameOptions, "inPlaneLoadsOnly"> = {},
): ArmFrame {
  const frame = new SpaceFrame(structure.frame);
  const g = model.gravity;
  for (const { id, na, nb, d, length: L } of structure.springLines) {
    const T = statics?.springForce[id] ?? 0;
    frame.addLoad(na, { x: (T * d.x) / L, y: (T * d.y) / L, z: (T * d.z) / L });
    frame.addLoad(nb, { x: (-T * d.x) / L, y: (-T * d.y) / L, z: (-T * d.z) / L });
  }
  const placement = structure.placement;
  for (const p of model.payloads) {
    const n = structure.payloadNode[p.id];
    const bodyId = structure.payloadBody[p.id];
    if (n === undefined || bodyId === undefined) continue;
    const mass = payloadMass[p.id] ?? p.mass;
    if (mass > 0) {
      frame.addMass(n, mass);
      frame.addLoad(n, { x: 0, y: -mass * g, z: 0 });
    }
    // a working force is written in the drawing's axes and turns with the payload's stage
    const across = options.inPlaneLoadsOnly ? 0 : (p.forceAcross ?? 0);
    const t = p.torque ? (options.inPlaneLoadsOnly ? { x: 0, y: 0, z: p.torque.z } : p.torque) : undefined;
    if (p.force || across || t)
      frame.addLoad(
        n,
        placement.direction(bodyId, { x: p.force?.x ?? 0, y: p.force?.y ?? 0, z: across }),
        t ? placement.direction(bodyId, t) : undefined,
      );
  }
  const { springLines: _, payloadBody: __, placement: ___, ...parts } = structure;
  return { ...parts, frame };
}

/** One step of building an arm's frame, in the order the frame is given them (the constraints'
 * elimination and every sum depend on that order). Nodes are numbered in the order of the "node"
 * steps. */
type LayoutStep =
  | { op: "node"; bodyId: string; local: Vec2; base: boolean }
  | { op: "member"; i: number; j: number; props: MemberProperties; bodyId: string }
  | { op: "massOnly"; i: number; j: number; massPerLength: number }
  | { op: "rigid"; master: number; slave: number }
  | { op: "lump"; node: number; mass: number }
  | { op: "joint"; id: string; a: number; b: number; parentId: string; pinned: boolean }
  | { op: "rotationalSpring"; a: number; b: number; rate: number; parentId: string }
  | { op: "axialSpring"; na: number; nb: number; spring: Spring };

/** What an arm's frame is made of, the same at every pose and heading of a sweep: its nodes
 * (which body and local point), members, rigid parts, joints and springs, and what is read off
 * by node number. Only the placement (where each node is, which way each pin points) and the
 * springs' tangent rates differ between poses. */
interface ArmLayout {
  steps: LayoutStep[];
  payloadNode: Record<string, number>;
  payloadBody: Record<string, string>;
  endNode: Record<string, number>;
  memberBody: (string | undefined)[];
  rigidGroup: Int32Array;
  groupAttachments: Map<number, number>;
}

/** Layouts by model, then by which bodies the pose places and whether the frame is planar. */
const layouts = new WeakMap<ArmModel, Map<string, ArmLayout>>();

function layoutFor(model: ArmModel, pose: Pose, planar: boolean): ArmLayout {
  const placed = (id: string) => id === model.base?.bodyId || pose.bodies[id] !== undefined;
  let byKey = layouts.get(model);
  if (!byKey) layouts.set(model, (byKey = new Map()));
  let key = planar ? "p" : "s";
  for (const b of model.bodies) key += placed(b.id) ? "1" : "0";
  let layout = byKey.get(key);
  if (!layout) byKey.set(key, (layout = armLayout(model, placed)));
  return layout;
}

/** The layout of the arm's frame over the bodies `placed` says are there. */
function armLayout(model: ArmModel, placed: (id: string) => boolean): ArmLayout {
  const steps: LayoutStep[] = [];
  let nodeCount = 0;
  const nodes = new Map<string, number>();
  const fixedNodes: number[] = [];
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
      n = nodeCount++;
      steps.push({ op: "node", bodyId: body.id, local: p, base: body.kind === "base" });
      nodes.set(k, n);
      if (body.kind === "base") fixedNodes.push(n);
    }
    return n;
  };
  /** `slave` rigidly carried by `master` (two points of one rigid part, or a hook off an axis);
   * two points of one body at the same place are one node in effect. */
  const groupParent: number[] = [];
  const groupOf = (n: number): number => {
    while (groupParent[n] !== undefined && groupParent[n] !== n) n = groupParent[n]!;
    return n;
  };
  const rigid = (master: number, slave: number) => {
    if (master === slave) return;
    steps.push({ op: "rigid", master, slave });
    const a = groupOf(master);
    const b = groupOf(slave);
    if (a !== b) groupParent[Math.max(a, b)] = Math.min(a, b);
  };
  const memberBody: (string | undefined)[] = [];
  const lump = (node: number, mass: number) => {
    if (mass > 0) steps.push({ op: "lump", node, mass });
  };
  const endNode: Record<string, number> = {};

  for (const body of model.bodies) {
    if (!placed(body.id)) continue;
    const pts = interestPoints(model, body);
    if (body.kind === "base") {
      for (const p of pts) nodeAt(body, p);
      continue;
    }
    const props = memberProperties(model, body);
    if (body.length > 0 && props) {
      const L = body.length;
      const raw = [0, L, ...pts.map((p) => Math.max(0, Math.min(L, p.x)))];
      for (let k = 1; k < MIN_ELEMENTS_PER_LINK; k++) raw.push((k * L) / MIN_ELEMENTS_PER_LINK);
      raw.sort((a, b) => a - b);
      const stations: number[] = [];
      for (const s of raw)
        if (stations.length === 0 || s - stations[stations.length - 1]! > STATION_MERGE_M) stations.push(s);
      stationsOf.set(body.id, stations);
      const axis = stations.map((s) => nodeAt(body, { x: s, y: 0 }));
      for (let k = 0; k + 1 < axis.length; k++) {
        steps.push({ op: "member", i: axis[k]!, j: axis[k + 1]!, props, bodyId: body.id });
        memberBody.push(body.id);
      }
      for (const p of pts) {
        const s = Math.max(0, Math.min(L, p.x));
        rigid(nodeAt(body, { x: s, y: 0 }), nodeAt(body, p));
      }
      endNode[body.id] = nodeAt(body, { x: L, y: 0 });
    } else if (body.length > 0) {
      // a link given only a mass: rigid, its mass spread evenly from start to end
      const o = nodeAt(body, { x: 0, y: 0 });
      const end = nodeAt(body, { x: body.length, y: 0 });
      rigid(o, end);
      for (const p of pts) rigid(o, nodeAt(body, p));
      if (body.mass > 0) {
        steps.push({ op: "massOnly", i: o, j: end, massPerLength: body.mass / body.length });
        memberBody.push(undefined);
      }
      endNode[body.id] = end;
    } else {
      const o = nodeAt(body, { x: 0, y: 0 });
      for (const p of [...pts, body.centreOfMass]) rigid(o, nodeAt(body, p));
      lump(nodeAt(body, body.centreOfMass), body.mass);
    }
  }
  const bodyById = new Map(model.bodies.map((b) => [b.id, b]));
  const jointEnds: [number, number][] = [];
  for (const j of model.joints) {
    const parent = bodyById.get(j.parent);
    const child = bodyById.get(j.child);
    if (!parent || !child || !placed(parent.id) || !placed(child.id)) continue;
    const a = nodeAt(parent, j.parentPoint);
    const b = nodeAt(child, j.childPoint);
    jointEnds.push([a, b]);
    // a swivel is held at its heading like any degree of freedom (by hand, brake or friction)
    steps.push({ op: "joint", id: j.id, a, b, parentId: parent.id, pinned: j.mode === "passive" });
  }
  for (const sp of model.springs) {
    if (atJoint(sp)) {
      const j = model.joints.find((jj) => jj.id === sp.joint);
      const parent = j && bodyById.get(j.parent);
      const child = j && bodyById.get(j.child);
      if (j && parent && child && j.mode === "passive")
        steps.push({
          op: "rotationalSpring",
          a: nodeAt(parent, j.parentPoint),
          b: nodeAt(child, j.childPoint),
          rate: sp.rate,
          parentId: parent.id,
        });
      continue;
    }
    const A = bodyById.get(sp.a.body);
    const B = bodyById.get(sp.b.body);
    if (!A || !B || !placed(A.id) || !placed(B.id)) continue;
    steps.push({ op: "axialSpring", na: nodeAt(A, sp.a.point), nb: nodeAt(B, sp.b.point), spring: sp });
  }
  const payloadNode: Record<string, number> = {};
  const payloadBody: Record<string, string> = {};
  for (const p of model.payloads) {
    const body = bodyById.get(p.body);
    if (!body || !placed(body.id)) continue;
    payloadNode[p.id] = nodeAt(body, p.point);
    payloadBody[p.id] = body.id;
  }
  const rigidGroup = new Int32Array(nodeCount);
  const groupAttachments = new Map<number, number>();
  const attach = (n: number) => {
    const g = groupOf(n);
    groupAttachments.set(g, (groupAttachments.get(g) ?? 0) + 1);
  };
  for (let n = 0; n < nodeCount; n++) rigidGroup[n] = groupOf(n);
  for (const [a, b] of jointEnds) (attach(a), attach(b));
  for (const n of fixedNodes) attach(n);
  return { steps, payloadNode, payloadBody, endNode, memberBody, rigidGroup, groupAttachments };
}

/** The arm's frame at `pose` and the given headings with the loads every load case has
 * (ArmStructure): its layout (the same at every pose) placed at the pose. */
export function armStructure(
  model: ArmModel,
  pose: Pose,
  options: Pick<ArmFrameOptions, "planar" | "headings"> = {},
): ArmStructure {
  const layout = layoutFor(model, pose, options.planar === true);
  const frame = new SpaceFrame();
  const g = model.gravity;
  const placement = new Placement(model, pose, options.headings);
  /** The pins' axis for a body: the drawing plane's normal, turned with its swivels. */
  const normalOf = (bodyId: string) => placement.direction(bodyId, PLANE_NORMAL);
  const joints: ArmFrame["joints"] = {};
  const springLines: ArmStructure["springLines"] = [];
  for (const step of layout.steps) {
    switch (step.op) {
      case "node": {
        const n = frame.addNode(placement.point(step.bodyId, step.local));
        if (step.base) frame.fix(n);
        else if (options.planar) for (const dof of [2, 3, 4]) frame.hold(n, dof);
        break;
      }
      case "member": {
        const index = frame.addMember(step.i, step.j, step.props, normalOf(step.bodyId));
        frame.addMemberLoad(index, { x: 0, y: -step.props.massPerLength * g, z: 0 });
        break;
      }
      case "massOnly": {
        const index = frame.addMassOnlyMember(step.i, step.j, step.massPerLength);
        frame.addMemberLoad(index, { x: 0, y: -step.massPerLength * g, z: 0 });
        break;
      }
      case "rigid":
        frame.rigidOffset(step.master, step.slave);
        break;
      case "lump":
        frame.addMass(step.node, step.mass);
        frame.addLoad(step.node, { x: 0, y: -step.mass * g, z: 0 });
        break;
      case "joint": {
        const axis = normalOf(step.parentId);
        joints[step.id] = { parent: step.a, child: step.b, axis };
        if (step.pinned) frame.pin(step.a, step.b, axis);
        else frame.weld(step.a, step.b);
        break;
      }
      case "rotationalSpring":
        frame.addRotationalSpring(step.a, step.b, step.rate, normalOf(step.parentId));
        break;
      case "axialSpring": {
        const pa = frame.nodes[step.na]!;
        const pb = frame.nodes[step.nb]!;
        const d = { x: pb.x - pa.x, y: pb.y - pa.y, z: pb.z - pa.z };
        const L = Math.hypot(d.x, d.y, d.z);
        if (!(L > 0)) break;
        frame.addAxialSpring(step.na, step.nb, springTangentRate(model, step.spring, L));
        springLines.push({ id: step.spring.id, na: step.na, nb: step.nb, d, length: L });
        break;
      }
    }
  }
  return {
    frame,
    payloadNode: layout.payloadNode,
    endNode: layout.endNode,
    memberBody: layout.memberBody,
    joints,
    rigidGroup: layout.rigidGroup,
    groupAttachments: layout.groupAttachments,
    springLines,
    payloadBody: layout.payloadBody,
    placement,
  };
}
