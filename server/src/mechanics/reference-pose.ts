// The reference pose: walk the joint tree from the base with every joint at its angle, then close
// the loops by Gauss-Newton with Levenberg-Marquardt damping on the passive tree joints (degrees
// of freedom and fixed joints held). What is left open is reported as the gap at the joint that
// closes the loop.
import { DenseLu } from "./dense-lu";
import { placeTree, relativeAngle, worldPointFromQ, wrapNear, type JointGraph } from "./joint-graph";
import { distance } from "./plane";

/** Loops whose pivots still miss by more than this at the reference pose are open: 1 um is far
 * below any workshop tolerance and far above the solver's round-off (about 1e-12 m). */
export const LOOP_GAP_TOLERANCE = 1e-6;
/** An angle mismatch at a held loop-closing joint above this is open too (1e-6 rad = 0.2"). */
export const LOOP_ANGLE_TOLERANCE = 1e-6;
/** Damped least-squares iterations: loops close in a handful; the cap only stops a hopeless case. */
const CLOSE_MAX_ITERATIONS = 200;
/** Forward-difference step for the closure Jacobian, rad (about sqrt of machine epsilon). */
const CLOSE_DIFF_STEP = 1e-7;

export interface LoopGap {
  /** Position of the closing joint in graph.joints. */
  joint: number;
  /** Distance between the joint's two pivot points, m. */
  gap: number;
  /** Angle mismatch of a held closing joint, rad (0 for passive ones). */
  angleMismatch: number;
}

export interface ReferencePose {
  q: Float64Array;
  /** Every joint's angle after closing (tree joints solved, closing joints measured). */
  angles: Float64Array;
  gaps: LoopGap[];
}

function isHeld(mode: string): boolean {
  return mode === "range" || mode === "fixed";
}

export function referencePose(graph: JointGraph, lengthScale: number): ReferencePose {
  const angles = Float64Array.from(graph.joints, (j) => j.angle);
  const q = new Float64Array(graph.bodyIds.length * 3);
  const unknowns = graph.tree.filter((t) => graph.joints[t.joint]!.mode === "passive").map((t) => t.joint);
  const closing = graph.closing;
  const heldClosing = closing.filter((c) => isHeld(graph.joints[c]!.mode));
  const m = 2 * closing.length + heldClosing.length;

  const residual = (out: Float64Array): number => {
    placeTree(graph, angles, q);
    let k = 0;
    let sum = 0;
    for (const c of closing) {
      const j = graph.joints[c]!;
      const wp = worldPointFromQ(q, graph.parent[c]!, j.parentPoint.x, j.parentPoint.y);
      const wc = worldPointFromQ(q, graph.child[c]!, j.childPoint.x, j.childPoint.y);
      out[k++] = wp.x - wc.x;
      out[k++] = wp.y - wc.y;
    }
    for (const c of heldClosing) {
      const j = graph.joints[c]!;
      // Angle residuals weighted by a length so that metres and radians compare.
      out[k++] =
        (wrapNear(relativeAngle(q, graph.parent[c]!, graph.child[c]!), j.angle) - j.angle) * lengthScale;
    }
    for (let i = 0; i < m; i++) sum += out[i]! * out[i]!;
    return sum;
  };

  const r = new Float64Array(m);
  let cost = residual(r);
  const nu = unknowns.length;
  if (m > 0 && nu > 0 && cost > 0) {
    const jac = new Float64Array(m * nu);
    const rTrial = new Float64Array(m);
    const normal = new Float64Array(nu * nu);
    const grad = new Float64Array(nu);
    const step = new Float64Array(nu);
    const saved = new Float64Array(nu);
    const lu = new DenseLu(nu);
    let mu = 1e-3;
    for (let it = 0; it < CLOSE_MAX_ITERATIONS && cost > 1e-30; it++) {
      for (let u = 0; u < nu; u++) {
        const a = unknowns[u]!;
        const keep = angles[a]!;
        angles[a] = keep + CLOSE_DIFF_STEP;
        residual(rTrial);
        angles[a] = keep;
        for (let i = 0; i < m; i++) jac[i * nu + u] = (rTrial[i]! - r[i]!) / CLOSE_DIFF_STEP;
      }
      for (let a = 0; a < nu; a++) {
        let g = 0;
        for (let i = 0; i < m; i++) g += jac[i * nu + a]! * r[i]!;
        grad[a] = -g;
        for (let b = 0; b < nu; b++) {
          let s = 0;
          for (let i = 0; i < m; i++) s += jac[i * nu + a]! * jac[i * nu + b]!;
          normal[a * nu + b] = s;
        }
      }
      let improved = false;
      while (mu < 1e12) {
        const damped = Float64Array.from(normal);
        for (let a = 0; a < nu; a++)
          damped[a * nu + a]! += mu * (normal[a * nu + a]! + lengthScale * lengthScale * 1e-6);
        if (!lu.factor(damped)) {
          mu *= 10;
          continue;
        }
        lu.solve(grad, step);
        for (let a = 0; a < nu; a++) {
          saved[a] = angles[unknowns[a]!]!;
          angles[unknowns[a]!] = saved[a]! + step[a]!;
        }
        const trial = residual(rTrial);
        if (trial < cost) {
          cost = trial;
          r.set(rTrial);
          mu = Math.max(mu / 3, 1e-12);
          improved = true;
          break;
        }
        for (let a = 0; a < nu; a++) angles[unknowns[a]!] = saved[a]!;
        mu *= 4;
      }
      if (!improved) break;
    }
    residual(r);
  }
  placeTree(graph, angles, q);
  const gaps: LoopGap[] = closing.map((c) => {
    const j = graph.joints[c]!;
    const wp = worldPointFromQ(q, graph.parent[c]!, j.parentPoint.x, j.parentPoint.y);
    const wc = worldPointFromQ(q, graph.child[c]!, j.childPoint.x, j.childPoint.y);
    const rel = relativeAngle(q, graph.parent[c]!, graph.child[c]!);
    angles[c] = wrapNear(rel, j.angle);
    return {
      joint: c,
      gap: distance(wc, wp),
      angleMismatch: isHeld(j.mode) ? Math.abs(wrapNear(rel, j.angle) - j.angle) : 0,
    };
  });
  return { q, angles, gaps };
}
