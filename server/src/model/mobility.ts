// Which passive joints nothing holds, by counting mobility (Gruebler-Kutzbach for planar revolute
// chains) block by block over the joint graph.
//
// Rule: bodies are vertices, joints edges. Split the edges into biconnected blocks (blocks meet
// only at single bodies, which pass rigid motion and nothing else, so the mobility of the whole is
// the sum over blocks). A block with v bodies, e joints and L = e - v + 1 independent loops has
// planar mobility 3 (v - 1) - 2 e = e - 3 L; each joint with a range or `fixed` is held, so the
// freedom left to the passive joints is M = p - 3 L (p passive joints). M > 0: the block can move
// with every held joint held: its passive joints are unheld. A bridge (a joint in no loop) is a
// block with L = 0: unheld exactly when it is passive. Special geometry can beat the count (a
// parallelogram with a redundant bar); the solver then reports the singular pose instead.

export interface MobilityJoint {
  id: string;
  parent: string;
  child: string;
  passive: boolean;
}

export interface UnheldBlock {
  /** Passive joints of the block, in input order. */
  passiveJoints: string[];
  /** Freedom left to them. */
  mobility: number;
}

export interface MobilityResult {
  unheld: UnheldBlock[];
  /** Bodies no chain of joints connects to the base. */
  unconnected: string[];
}

export function analyseMobility(
  bodyIds: readonly string[],
  baseId: string | undefined,
  joints: readonly MobilityJoint[],
): MobilityResult {
  const adjacency = new Map<string, { edge: number; other: string }[]>();
  for (const b of bodyIds) adjacency.set(b, []);
  joints.forEach((j, edge) => {
    adjacency.get(j.parent)?.push({ edge, other: j.child });
    adjacency.get(j.child)?.push({ edge, other: j.parent });
  });

  // Reachable from the base.
  const reached = new Set<string>();
  if (baseId !== undefined && adjacency.has(baseId)) {
    const queue = [baseId];
    reached.add(baseId);
    while (queue.length > 0) {
      const b = queue.pop()!;
      for (const { other } of adjacency.get(b) ?? [])
        if (!reached.has(other)) (reached.add(other), queue.push(other));
    }
  }
  const unconnected = bodyIds.filter((b) => !reached.has(b));

  // Biconnected blocks of the edges (Hopcroft and Tarjan, 1973), iteratively.
  const order = new Map<string, number>();
  const low = new Map<string, number>();
  const blocks: number[][] = [];
  const edgeStack: number[] = [];
  let counter = 0;
  const roots = baseId !== undefined && adjacency.has(baseId) ? [baseId, ...bodyIds] : [...bodyIds];
  for (const root of roots) {
    if (order.has(root)) continue;
    order.set(root, counter);
    low.set(root, counter++);
    const stack: { body: string; viaEdge: number; next: number }[] = [{ body: root, viaEdge: -1, next: 0 }];
    while (stack.length > 0) {
      const frame = stack[stack.length - 1]!;
      const list = adjacency.get(frame.body)!;
      if (frame.next < list.length) {
        const { edge, other } = list[frame.next++]!;
        if (edge === frame.viaEdge) continue;
        if (!order.has(other)) {
          edgeStack.push(edge);
          order.set(other, counter);
          low.set(other, counter++);
          stack.push({ body: other, viaEdge: edge, next: 0 });
        } else if (order.get(other)! < order.get(frame.body)!) {
          edgeStack.push(edge);
          low.set(frame.body, Math.min(low.get(frame.body)!, order.get(other)!));
        }
        continue;
      }
      stack.pop();
      const parent = stack[stack.length - 1];
      if (!parent) continue;
      low.set(parent.body, Math.min(low.get(parent.body)!, low.get(frame.body)!));
      if (low.get(frame.body)! >= order.get(parent.body)!) {
        const block: number[] = [];
        for (;;) {
          const e = edgeStack.pop()!;
          block.push(e);
          if (e === frame.viaEdge) break;
        }
        blocks.push(block);
      }
    }
  }

  const unheld: UnheldBlock[] = [];
  for (const block of blocks) {
    const vertices = new Set<string>();
    for (const e of block) (vertices.add(joints[e]!.parent), vertices.add(joints[e]!.child));
    const loops = block.length - vertices.size + 1;
    const passive = block.filter((e) => joints[e]!.passive).sort((a, b) => a - b);
    const mobility = passive.length - 3 * loops;
    if (mobility > 0) unheld.push({ passiveJoints: passive.map((e) => joints[e]!.id), mobility });
  }
  return { unheld, unconnected };
}
