// The load a joint passes on in three dimensions, recovered from a solved space frame
// (docs/checks.md, Pins and holes): the constraint forces R = K u - f on the nodes of the rigid
// group that holds the joint's end on one side, summed about the joint's point. A rigid offset is a
// massless rigid link, so its forces on the nodes it ties cancel in that sum; what is left is the
// joint's own force and moment, provided no other joint or support holds that group. A pin carries
// the force across its axis as shear, the force along it on its head or clip, and the moment
// across its axis as a couple (the frame's pins hold the parts across the plane like a weld). SI.
import type { ArmFrame } from "./arm-frame";
import type { SpaceFrameSolution, Vec3 } from "./space-frame";

/** What the parent passes to the child through a joint, global axes. */
export interface JointWrench {
  /** N */
  force: Vec3;
  /** N*m, about the joint's point */
  moment: Vec3;
  /** The pin's axis as turned (unit). */
  axis: Vec3;
}

/** A joint's wrench split along and across its pin axis. */
export interface PinLoad {
  /** Force across the axis, N: the pin's shear and the holes' bearing. */
  radial: number;
  /** Force along the axis, N: pushes a part along the pin against its head, clip or neighbour. */
  axial: number;
  /** Moment across the axis, N*m: carried as a couple by the pin and its holes. */
  momentAcross: number;
  /** Moment about the axis, N*m: what holds a degree of freedom (nought at a free pin). */
  momentAbout: number;
}

/** Nodes of each rigid group, computed once per frame. */
const groupsCache = new WeakMap<ArmFrame, Map<number, number[]>>();
function groupNodes(af: ArmFrame, group: number): number[] {
  let byGroup = groupsCache.get(af);
  if (!byGroup) {
    byGroup = new Map();
    af.rigidGroup.forEach((g, n) => {
      const list = byGroup!.get(g);
      if (list) list.push(n);
      else byGroup!.set(g, [n]);
    });
    groupsCache.set(af, byGroup);
  }
  return byGroup.get(group) ?? [];
}

/** The wrench through joint `jointId`, or undefined when it cannot be told apart: both its ends sit
 * on rigid groups that other joints or a support hold too (two rigid parts joined, each carrying
 * other joints), or the joint is not in the frame. */
export function jointWrench(af: ArmFrame, sol: SpaceFrameSolution, jointId: string): JointWrench | undefined {
  const e = af.joints[jointId];
  if (!e) return undefined;
  const clean = (n: number) => af.groupAttachments.get(af.rigidGroup[n]!) === 1;
  // the child's side receives the wrench; the parent's side receives it reversed
  const side = clean(e.child)
    ? { node: e.child, sign: 1 }
    : clean(e.parent)
      ? { node: e.parent, sign: -1 }
      : undefined;
  if (!side) return undefined;
  const p = af.frame.nodes[e.child]!;
  const force = { x: 0, y: 0, z: 0 };
  const moment = { x: 0, y: 0, z: 0 };
  for (const n of groupNodes(af, af.rigidGroup[side.node]!)) {
    const r = sol.constraintForce(n);
    const x = af.frame.nodes[n]!;
    const d = { x: x.x - p.x, y: x.y - p.y, z: x.z - p.z };
    force.x += r[0]!;
    force.y += r[1]!;
    force.z += r[2]!;
    moment.x += r[3]! + d.y * r[2]! - d.z * r[1]!;
    moment.y += r[4]! + d.z * r[0]! - d.x * r[2]!;
    moment.z += r[5]! + d.x * r[1]! - d.y * r[0]!;
  }
  const s = side.sign;
  return {
    force: { x: s * force.x, y: s * force.y, z: s * force.z },
    moment: { x: s * moment.x, y: s * moment.y, z: s * moment.z },
    axis: e.axis,
  };
}

/** A wrench split along and across its axis. */
export function pinLoadOf(w: JointWrench): PinLoad {
  const a = w.axis;
  const n = Math.hypot(a.x, a.y, a.z);
  const u = { x: a.x / n, y: a.y / n, z: a.z / n };
  const split = (v: Vec3) => {
    const along = v.x * u.x + v.y * u.y + v.z * u.z;
    return {
      along,
      across: Math.hypot(v.x - along * u.x, v.y - along * u.y, v.z - along * u.z),
    };
  };
  const f = split(w.force);
  const m = split(w.moment);
  return {
    radial: f.across,
    axial: Math.abs(f.along),
    momentAcross: m.across,
    momentAbout: Math.abs(m.along),
  };
}
