// Numbering of a frame's equations that keeps the skyline narrow: reverse Cuthill-McKee from a
// pseudo-peripheral start (George and Liu, Computer Solution of Large Sparse Positive Definite
// Systems, 1981, ch. 4). The arm's bodies are listed in the order the spec declares them (links
// first, then the stages), so raw node order can couple the first equation with the last and
// give rows hundreds of entries long; a breadth-first numbering along the arm gives rows of a few
// nodes' dofs, and the Cholesky factorisation's cost falls with the square of the row length.

/** A symmetric graph on vertices 0 .. n-1 in compressed rows: the neighbours of v are
 * adj[start[v]] .. adj[start[v+1]-1] (no self loops, no repeats). */
export interface Graph {
  n: number;
  start: Int32Array;
  adj: Int32Array;
}

/** The graph in which two vertices are joined when some group holds both (each group a clique:
 * the equations one member, spring or rigid part couples). */
export function graphOfGroups(n: number, groups: readonly (readonly number[])[]): Graph {
  const lists: number[][] = Array.from({ length: n }, () => []);
  for (const g of groups) for (const a of g) for (const b of g) if (a !== b) lists[a]!.push(b);
  const mark = new Int32Array(n).fill(-1);
  const start = new Int32Array(n + 1);
  const flat: number[] = [];
  for (let v = 0; v < n; v++) {
    for (const w of lists[v]!)
      if (mark[w] !== v) {
        mark[w] = v;
        flat.push(w);
      }
    start[v + 1] = flat.length;
  }
  return { n, start, adj: Int32Array.from(flat) };
}

function degree(g: Graph, v: number): number {
  return g.start[v + 1]! - g.start[v]!;
}

/** Breadth-first levels from `root` over unnumbered vertices (`done[v]` false): the visit order
 * and the index in it where the last level starts. */
function levels(g: Graph, root: number, done: Uint8Array, seen: Int32Array, stamp: number) {
  const order = [root];
  seen[root] = stamp;
  let levelStart = 0;
  let depth = 0;
  for (let head = 0; head < order.length;) {
    const end = order.length;
    levelStart = head;
    for (; head < end; head++) {
      const v = order[head]!;
      for (let k = g.start[v]!; k < g.start[v + 1]!; k++) {
        const w = g.adj[k]!;
        if (!done[w] && seen[w] !== stamp) {
          seen[w] = stamp;
          order.push(w);
        }
      }
    }
    depth++;
  }
  return { order, lastLevel: levelStart, depth };
}

/** A vertex far from the rest of its component (George and Liu's pseudo-peripheral node): start
 * at the least connected, move to the least connected vertex of the farthest level while the
 * level structure keeps getting deeper. */
function pseudoPeripheral(
  g: Graph,
  component: number[],
  done: Uint8Array,
  seen: Int32Array,
  stampFrom: number,
) {
  let root = component[0]!;
  for (const v of component) if (degree(g, v) < degree(g, root)) root = v;
  let stamp = stampFrom;
  let current = levels(g, root, done, seen, stamp++);
  for (let guard = 0; guard < 8; guard++) {
    let next = current.order[current.lastLevel]!;
    for (let i = current.lastLevel; i < current.order.length; i++) {
      const v = current.order[i]!;
      if (degree(g, v) < degree(g, next)) next = v;
    }
    const candidate = levels(g, next, done, seen, stamp++);
    if (candidate.depth <= current.depth) break;
    root = next;
    current = candidate;
  }
  return { root, stamp };
}

/** Reverse Cuthill-McKee: order[k] is the vertex numbered k. Each component is numbered from a
 * pseudo-peripheral vertex, neighbours in increasing degree (then index, so the order is
 * repeatable), and the whole numbering reversed. */
export function reverseCuthillMcKee(g: Graph): Int32Array {
  const { n } = g;
  const done = new Uint8Array(n);
  const seen = new Int32Array(n).fill(-1);
  const order: number[] = [];
  let stamp = 0;
  for (let s = 0; s < n; s++) {
    if (done[s]) continue;
    const component = levels(g, s, done, seen, stamp++).order;
    const start = pseudoPeripheral(g, component, done, seen, stamp);
    stamp = start.stamp;
    const from = order.length;
    order.push(start.root);
    done[start.root] = 1;
    for (let head = from; head < order.length; head++) {
      const v = order[head]!;
      const fresh: number[] = [];
      for (let k = g.start[v]!; k < g.start[v + 1]!; k++) {
        const w = g.adj[k]!;
        if (!done[w]) {
          done[w] = 1;
          fresh.push(w);
        }
      }
      fresh.sort((a, b) => degree(g, a) - degree(g, b) || a - b);
      for (const w of fresh) order.push(w);
    }
  }
  return Int32Array.from(order.reverse());
}
