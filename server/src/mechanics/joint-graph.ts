// The joint graph of an arm: which bodies the base reaches, the spanning tree walked from the
// base (each joint at its angle places the next body) and the joints that close loops.
import type { ArmModel, Joint } from "../model/types";
import { toWorld, turnedX, turnedY, worldX, worldY } from "./plane";

import { MAX_SOLVED_BODIES } from "../limits";

export interface JointGraph {
  baseId: string;
  /** Moving bodies reached from the base, in coordinate order. */
  bodyIds: string[];
  /** Body id to coordinate index; the base is -1. */
  bodyIndex: Map<string, number>;
  /** Joints between reached bodies, in model order. */
  joints: Joint[];
  parent: Int32Array;
  child: Int32Array;
  /** Joint positions (into `joints`) in tree-walk order, and whether walked parent to child. */
  tree: { joint: number; forward: boolean }[];
  /** Joint positions that close a loop. */
  closing: number[];
  /** Bodies the base reaches beyond MAX_SOLVED_BODIES: the first of them (in walk order) and
   * how many, left out of the graph. */
  leftOut?: { first: string; count: number };
}

export function jointGraph(model: ArmModel, maxBodies = MAX_SOLVED_BODIES): JointGraph | undefined {
  const base = model.bodies.find((b) => b.kind === "base");
  if (!base) return undefined;
  const known = new Set(model.bodies.map((b) => b.id));
  const usable = model.joints.filter(
    (j) => known.has(j.parent) && known.has(j.child) && j.parent !== j.child,
  );
  const incident = new Map<string, number[]>();
  usable.forEach((j, i) => {
    for (const id of [j.parent, j.child]) {
      const list = incident.get(id) ?? [];
      list.push(i);
      incident.set(id, list);
    }
  });
  const reached = new Set<string>([base.id]);
  const used = new Uint8Array(usable.length);
  const treeRaw: { joint: number; forward: boolean }[] = [];
  const closingRaw: number[] = [];
  const order: string[] = [];
  const beyond = new Set<string>();
  const beyondOrder: string[] = [];
  const queue = [base.id];
  for (let head = 0; head < queue.length; head++) {
    const u = queue[head]!;
    for (const ji of incident.get(u) ?? []) {
      if (used[ji]) continue;
      used[ji] = 1;
      const j = usable[ji]!;
      const forward = j.parent === u;
      const v = forward ? j.child : j.parent;
      if (reached.has(v)) {
        closingRaw.push(ji);
        continue;
      }
      if (order.length >= maxBodies) {
        // past the limit: counted, not taken (its joints stay out of the graph)
        used[ji] = 0;
        if (!beyond.has(v)) {
          beyond.add(v);
          beyondOrder.push(v);
        }
        continue;
      }
      reached.add(v);
      order.push(v);
      queue.push(v);
      treeRaw.push({ joint: ji, forward });
    }
  }
  if (beyondOrder.length > 0) countBeyond(incident, usable, reached, beyond, beyondOrder);
  // Keep only joints among reached bodies (all of them are, by construction of the walk).
  const keep = usable.map((_, i) => used[i] === 1);
  const remap = new Int32Array(usable.length).fill(-1);
  const joints: Joint[] = [];
  usable.forEach((j, i) => {
    if (keep[i]) {
      remap[i] = joints.length;
      joints.push(j);
    }
  });
  const bodyIds = model.bodies.filter((b) => b.id !== base.id && reached.has(b.id)).map((b) => b.id);
  const bodyIndex = new Map<string, number>([[base.id, -1]]);
  bodyIds.forEach((id, i) => bodyIndex.set(id, i));
  return {
    baseId: base.id,
    bodyIds,
    bodyIndex,
    joints,
    parent: Int32Array.from(joints, (j) => bodyIndex.get(j.parent)!),
    child: Int32Array.from(joints, (j) => bodyIndex.get(j.child)!),
    tree: treeRaw.map((t) => ({ joint: remap[t.joint]!, forward: t.forward })),
    closing: closingRaw.map((c) => remap[c]!),
    ...(beyondOrder.length > 0 ? { leftOut: { first: beyondOrder[0]!, count: beyond.size } } : {}),
  };
}

/** Every body reached through the ones left out, added to `beyond` (for the count). */
function countBeyond(
  incident: Map<string, number[]>,
  joints: readonly Joint[],
  reached: ReadonlySet<string>,
  beyond: Set<string>,
  start: readonly string[],
): void {
  const stack = [...start];
  while (stack.length > 0) {
    const u = stack.pop()!;
    for (const ji of incident.get(u) ?? []) {
      const j = joints[ji]!;
      const v = j.parent === u ? j.child : j.parent;
      if (reached.has(v) || beyond.has(v)) continue;
      beyond.add(v);
      stack.push(v);
    }
  }
}

/** Places every reached body by walking the tree with the given joint angles; q gets
 * (x, y, phi) per moving body. */
export function placeTree(graph: JointGraph, angles: Float64Array, q: Float64Array): void {
  for (const { joint, forward } of graph.tree) {
    const j = graph.joints[joint]!;
    const from = forward ? graph.parent[joint]! : graph.child[joint]!;
    const to = forward ? graph.child[joint]! : graph.parent[joint]!;
    const sFrom = forward ? j.parentPoint : j.childPoint;
    const sTo = forward ? j.childPoint : j.parentPoint;
    const xf = from >= 0 ? q[3 * from]! : 0;
    const yf = from >= 0 ? q[3 * from + 1]! : 0;
    const pf = from >= 0 ? q[3 * from + 2]! : 0;
    const pt = forward ? pf + angles[joint]! : pf - angles[joint]!;
    const cf = Math.cos(pf);
    const sf = Math.sin(pf);
    const wx = worldX(xf, cf, sf, sFrom.x, sFrom.y);
    const wy = worldY(yf, cf, sf, sFrom.x, sFrom.y);
    const ct = Math.cos(pt);
    const st = Math.sin(pt);
    q[3 * to] = wx - turnedX(ct, st, sTo.x, sTo.y);
    q[3 * to + 1] = wy - turnedY(ct, st, sTo.x, sTo.y);
    q[3 * to + 2] = pt;
  }
}

/** World position of a body's local point from q (base: local = world). */
export function worldPointFromQ(
  q: Float64Array,
  body: number,
  x: number,
  y: number,
): { x: number; y: number } {
  if (body < 0) return { x, y };
  return toWorld({ x: q[3 * body]!, y: q[3 * body + 1]!, phi: q[3 * body + 2]! }, { x, y });
}

/** Relative angle child minus parent from q. */
export function relativeAngle(q: Float64Array, parent: number, child: number): number {
  return (child >= 0 ? q[3 * child + 2]! : 0) - (parent >= 0 ? q[3 * parent + 2]! : 0);
}

/** An angle brought within pi of a reference angle. */
export function wrapNear(angle: number, near: number): number {
  const twoPi = 2 * Math.PI;
  return angle - twoPi * Math.round((angle - near) / twoPi);
}
