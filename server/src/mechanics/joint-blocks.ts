// The blocks (biconnected components) of the joint graph, the base counted as one more node: two
// joints share a block when a closed loop runs through both. Every block but those at the base
// hangs from the rest by one body, its root. A joint's constraint rows are unchanged by a rigid
// motion of its two bodies, so in coordinates relative to the root a hanging block's rows touch
// its other bodies only: which rows are independent can be decided block by block, on the columns
// of its bodies less the root, and a long chain is many blocks of one joint each, not one square
// problem of the whole arm.
// Method: Tarjan's biconnected components with an edge stack (Tarjan 1972, "Depth-first search and
// linear graph algorithms", SIAM J. Comput. 1(2)), walked without recursion so a chain of any
// length cannot overflow the stack.

export interface JointBlocks {
  /** Block of each joint. */
  blockOf: Int32Array;
  /** Moving bodies (coordinate indices) of each block, its root and the base left out, in
   * first-seen order. */
  bodies: number[][];
  /** The body each block hangs from (-1: the base). */
  root: Int32Array;
  /** Position of each joint's parent and child among its block's bodies (-1: the base or the
   * block's root, whose columns the block does not carry). */
  localParent: Int32Array;
  localChild: Int32Array;
}

/** `parent[j]`, `child[j]`: the bodies joint j connects (coordinate index, -1 the base). */
export function jointBlocks(bodyCount: number, parent: Int32Array, child: Int32Array): JointBlocks {
  const edges = parent.length;
  const groundNode = bodyCount;
  const node = (b: number) => (b < 0 ? groundNode : b);
  const nodes = bodyCount + 1;
  // Adjacency as compressed lists.
  const degree = new Int32Array(nodes + 1);
  for (let e = 0; e < edges; e++) {
    degree[node(parent[e]!) + 1]!++;
    degree[node(child[e]!) + 1]!++;
  }
  for (let v = 0; v < nodes; v++) degree[v + 1]! += degree[v]!;
  const adjacent = new Int32Array(2 * edges);
  const fill = degree.slice(0, nodes);
  for (let e = 0; e < edges; e++) {
    adjacent[fill[node(parent[e]!)]!++] = e;
    adjacent[fill[node(child[e]!)]!++] = e;
  }
  const other = (e: number, v: number) => {
    const a = node(parent[e]!);
    return a === v ? node(child[e]!) : a;
  };

  const discovered = new Int32Array(nodes).fill(-1);
  const low = new Int32Array(nodes);
  const blockOf = new Int32Array(edges).fill(-1);
  let blocks = 0;
  const rootOf: number[] = [];
  let time = 0;
  const edgeStack: number[] = [];
  // Depth-first frames: node, the edge it was reached by, and the next adjacency position.
  const frameNode: number[] = [];
  const frameEdge: number[] = [];
  const frameNext: number[] = [];
  for (let start = nodes - 1; start >= 0; start--) {
    // the ground first (it is the last node), then whatever it does not reach
    if (discovered[start]! >= 0) continue;
    discovered[start] = low[start] = time++;
    frameNode.push(start);
    frameEdge.push(-1);
    frameNext.push(degree[start]!);
    while (frameNode.length > 0) {
      const top = frameNode.length - 1;
      const v = frameNode[top]!;
      if (frameNext[top]! < degree[v + 1]!) {
        const e = adjacent[frameNext[top]!++]!;
        if (e === frameEdge[top]) continue;
        const w = other(e, v);
        if (discovered[w]! < 0) {
          edgeStack.push(e);
          discovered[w] = low[w] = time++;
          frameNode.push(w);
          frameEdge.push(e);
          frameNext.push(degree[w]!);
        } else if (discovered[w]! < discovered[v]!) {
          edgeStack.push(e); // a back edge, met first from its lower end
          low[v] = Math.min(low[v]!, discovered[w]!);
        }
        continue;
      }
      const reachedBy = frameEdge[top]!;
      frameNode.pop();
      frameEdge.pop();
      frameNext.pop();
      if (reachedBy < 0) continue;
      const u = frameNode[top - 1]!;
      low[u] = Math.min(low[u]!, low[v]!);
      if (low[v]! >= discovered[u]!) {
        // u separates v's subtree: the edges stacked since the tree edge u-v are one block
        for (;;) {
          const e = edgeStack.pop()!;
          blockOf[e] = blocks;
          if (e === reachedBy) break;
        }
        rootOf.push(u === groundNode ? -1 : u);
        blocks++;
      }
    }
  }

  // Local body numbering, block by block (edges visited grouped by block, so a body met in
  // another block in between is numbered again for this one).
  const bodies: number[][] = Array.from({ length: blocks }, () => []);
  const localParent = new Int32Array(edges);
  const localChild = new Int32Array(edges);
  const byBlock = Array.from({ length: edges }, (_, e) => e).sort(
    (a, b) => blockOf[a]! - blockOf[b]! || a - b,
  );
  const seenIn = new Int32Array(bodyCount).fill(-1);
  const localIndex = new Int32Array(bodyCount);
  for (const e of byBlock) {
    const b = blockOf[e]!;
    const local = (body: number): number => {
      if (body < 0 || body === rootOf[b]) return -1;
      if (seenIn[body] !== b) {
        seenIn[body] = b;
        localIndex[body] = bodies[b]!.length;
        bodies[b]!.push(body);
      }
      return localIndex[body]!;
    };
    localParent[e] = local(parent[e]!);
    localChild[e] = local(child[e]!);
  }
  return { blockOf, bodies, root: Int32Array.from(rootOf), localParent, localChild };
}
