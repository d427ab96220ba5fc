// The sweep: every degree of freedom across its range (the grid of all of them, or each alone
// with the others at reference), kinematics and statics at every pose, for every load case.
import type { ArmModel } from "../model/types";
import type { LoadCase, Pose, SweepResult } from "./types";
import { finding, type Finding } from "../findings/finding";
import { SWEEP_DEFAULTS } from "../model/schema";
import { buildLinkage } from "./linkage";
import { PoseSolver, type SavedFactors } from "./pose-solver";
import { formatAngle } from "./format";
import { pastDeadline } from "../stop";
import { MAX_POSE_BODIES } from "../limits";

export interface SolveOptions {
  stepsOverride?: number;
  /** performance.now() value past which the sweep stops early (partial result). */
  deadline?: number;
}

/** The grid of several degrees of freedom is capped at this many poses (conventions). */
export const MAX_GRID_POSES = 20000;

/** Load cases: nominal masses first, then the low and high end of each payload's mass range. */
export function loadCases(model: ArmModel): LoadCase[] {
  const nominal: Record<string, number> = {};
  for (const p of model.payloads) nominal[p.id] = p.mass;
  const cases: LoadCase[] = [{ id: "nominal", label: "nominal masses", payloadMass: nominal }];
  for (const p of model.payloads) {
    if (!p.massRange) continue;
    const [lo, hi] = p.massRange;
    cases.push({
      id: `${p.id}.low`,
      label: `${p.id} at ${(lo * 1000).toFixed(0)} g`,
      payloadMass: { ...nominal, [p.id]: lo },
    });
    cases.push({
      id: `${p.id}.high`,
      label: `${p.id} at ${(hi * 1000).toFixed(0)} g`,
      payloadMass: { ...nominal, [p.id]: hi },
    });
  }
  return cases;
}

/** Sample angles of a range, both ends included. */
export function rangeSamples(range: [number, number], steps: number): number[] {
  const [lo, hi] = range;
  if (hi === lo || steps < 2) return [lo];
  return Array.from({ length: steps }, (_, i) => (i === steps - 1 ? hi : lo + ((hi - lo) * i) / (steps - 1)));
}

interface SweepNode {
  angles: Float64Array;
  /** Node it continues from (-1: the reference pose). */
  pred: number;
  /** Position in the output order. */
  output: number;
}

function nearestIndex(samples: number[], value: number): number {
  let best = 0;
  for (let i = 1; i < samples.length; i++)
    if (Math.abs(samples[i]! - value) < Math.abs(samples[best]! - value)) best = i;
  return best;
}

/** Indices outward from r: r, r+1 .. last, r-1 .. 0 (so each pose continues from a neighbour). */
function outward(r: number, count: number): number[] {
  const out = [r];
  for (let x = r + 1; x < count; x++) out.push(x);
  for (let x = r - 1; x >= 0; x--) out.push(x);
  return out;
}

/** Grid poses, solved outward from the sample nearest the reference in every dof. */
function planGrid(samples: number[][], reference: number[]): SweepNode[] {
  const k = samples.length;
  const r = samples.map((s, d) => nearestIndex(s, reference[d]!));
  const strides = samples.map((_, d) => samples.slice(d + 1).reduce((p, s) => p * s.length, 1));
  const idx = new Int32Array(k);
  const nodes: SweepNode[] = [];
  const block = (d: number, pred: number): number => {
    if (d === k) {
      let output = 0;
      for (let e = 0; e < k; e++) output += idx[e]! * strides[e]!;
      nodes.push({ angles: Float64Array.from(samples, (s, e) => s[idx[e]!]!), pred, output });
      return nodes.length - 1;
    }
    const entries = new Map<number, number>();
    for (const x of outward(r[d]!, samples[d]!.length)) {
      idx[d] = x;
      const p = x === r[d] ? pred : entries.get(x > r[d]! ? x - 1 : x + 1)!;
      entries.set(x, block(d + 1, p));
    }
    idx[d] = r[d]!;
    return entries.get(r[d]!)!;
  };
  block(0, -1);
  return nodes;
}

/** Each dof alone, the others at their reference angle. */
function planEachAlone(samples: number[][], reference: number[]): SweepNode[] {
  const nodes: SweepNode[] = [];
  let offset = 0;
  samples.forEach((s, d) => {
    const r = nearestIndex(s, reference[d]!);
    const made = new Map<number, number>();
    for (const x of outward(r, s.length)) {
      const angles = Float64Array.from(reference);
      angles[d] = s[x]!;
      const pred = x === r ? -1 : made.get(x > r ? x - 1 : x + 1)!;
      nodes.push({ angles, pred, output: offset + x });
      made.set(x, nodes.length - 1);
    }
    offset += s.length;
  });
  return nodes;
}

/** Fewer steps per degree of freedom when poses times moving bodies would pass MAX_POSE_BODIES,
 * with a finding. */
function capPoseBodies(
  model: ArmModel,
  dofCount: number,
  bodies: number,
  steps: number,
  grid: boolean,
  findings: Finding[],
): number {
  const poses = (s: number) => (grid ? s ** dofCount : s * dofCount);
  if (poses(steps) * bodies <= MAX_POSE_BODIES) return steps;
  const perDof = MAX_POSE_BODIES / bodies;
  const capped = Math.max(
    2,
    grid ? Math.floor(perDof ** (1 / dofCount) + 1e-9) : Math.floor(perDof / dofCount),
  );
  findings.push(
    finding(
      "sweep.capped",
      model.sweep?.origin?.properties["steps"] ?? model.sweep?.origin?.declaration ?? model.span,
      `${steps} steps per degree of freedom would make ${(poses(steps) * bodies).toLocaleString("en-US")} poses times moving bodies (${bodies} bodies), past the limit of ${MAX_POSE_BODIES.toLocaleString("en-US")}; the sweep takes ${capped} steps each.`,
      { data: { requested: steps, used: capped, limit: MAX_POSE_BODIES } },
    ),
  );
  return capped;
}

export function solveSweep(model: ArmModel, options: SolveOptions = {}): SweepResult {
  const findings: Finding[] = [];
  const cases = loadCases(model);
  const grid = model.sweep?.grid ?? SWEEP_DEFAULTS.grid;
  const linkage = buildLinkage(model);
  if (!linkage) return { dofs: [], loadCases: cases, poses: [], steps: 0, grid, findings };
  findings.push(...linkage.findings);
  const dofs = linkage.dofs;
  if (!linkage.ok) return { dofs, loadCases: cases, poses: [], steps: 0, grid, findings };

  const solver = new PoseSolver(linkage, cases);
  const refAngles = Float64Array.from(dofs, (d) => d.reference);
  if (!solver.setCurrent(linkage.qReference, refAngles)) {
    const j = linkage.graph.joints[linkage.driveJoint[linkage.dofDrive[0] ?? 0] ?? 0];
    findings.push(
      finding(
        "geometry.cannot-reach",
        j ? (j.origin.name ?? j.origin.declaration) : model.span,
        "The linkage is locked at its reference pose (its constraint Jacobian is singular there): it cannot move from it.",
        { data: j ? { subject: j.id } : {} },
      ),
    );
    return { dofs, loadCases: cases, poses: [], steps: 0, grid, findings };
  }
  const reference = solver.record(-1);
  if (dofs.length === 0) {
    return {
      dofs,
      loadCases: cases,
      reference,
      poses: [{ ...reference, index: 0 }],
      steps: 1,
      grid,
      findings,
    };
  }

  let steps = Math.round(options.stepsOverride ?? model.sweep?.steps ?? SWEEP_DEFAULTS.steps);
  steps = Math.min(Math.max(steps, 2), SWEEP_DEFAULTS.maxSteps);
  let useGrid = grid && dofs.length > 1;
  const bodies = linkage.graph.bodyIds.length;
  if (useGrid && 2 ** dofs.length > MAX_GRID_POSES) {
    useGrid = false;
    findings.push(
      finding(
        "sweep.capped",
        model.sweep?.origin?.properties["grid"] ?? model.sweep?.origin?.declaration ?? model.span,
        `A grid of ${dofs.length} degrees of freedom would exceed ${MAX_GRID_POSES} poses even at 2 steps each; each one is swept alone instead, the others at their reference angle.`,
        { data: { requested: steps, used: steps, grid: false } },
      ),
    );
  } else if (useGrid && 2 ** dofs.length * bodies > MAX_POSE_BODIES) {
    useGrid = false;
    findings.push(
      finding(
        "sweep.capped",
        model.sweep?.origin?.properties["grid"] ?? model.sweep?.origin?.declaration ?? model.span,
        `A grid of ${dofs.length} degrees of freedom over ${bodies} moving bodies would pass ${MAX_POSE_BODIES.toLocaleString("en-US")} poses times bodies even at 2 steps each; each one is swept alone instead, the others at their reference angle.`,
        { data: { requested: steps, used: steps, grid: false, limit: MAX_POSE_BODIES } },
      ),
    );
  } else if (useGrid && steps ** dofs.length > MAX_GRID_POSES) {
    const capped = Math.max(2, Math.floor(MAX_GRID_POSES ** (1 / dofs.length) + 1e-9));
    findings.push(
      finding(
        "sweep.capped",
        model.sweep?.origin?.properties["steps"] ?? model.sweep?.origin?.declaration ?? model.span,
        `The grid of ${dofs.length} degrees of freedom at ${steps} steps each would be ${steps ** dofs.length} poses; it is capped at ${capped} steps each (${capped ** dofs.length} poses, limit ${MAX_GRID_POSES}).`,
        { data: { requested: steps, used: capped } },
      ),
    );
    steps = capped;
  }
  steps = capPoseBodies(model, dofs.length, bodies, steps, useGrid, findings);
  const samples = dofs.map((d) => rangeSamples(d.range, steps));
  const reference0 = dofs.map((d) => d.reference);
  const nodes = useGrid ? planGrid(samples, reference0) : planEachAlone(samples, reference0);

  const deadline = options.deadline ?? Infinity;
  const solvedQ: (Float64Array | undefined)[] = new Array(nodes.length);
  const out: (Pose | undefined)[] = [];
  const reported = new Set<string>();
  let current = -1;
  const from = new Float64Array(dofs.length);
  // Poses several nodes continue from, not each straight after it: their factors are kept until
  // the last of those nodes, so coming back to them costs no factorization (the same factors).
  const lastChild = new Int32Array(nodes.length + 1).fill(-1);
  const comeBack = new Uint8Array(nodes.length + 1);
  for (let i = 0; i < nodes.length; i++) {
    const p = nodes[i]!.pred;
    lastChild[p + 1] = i;
    if (p !== i - 1) comeBack[p + 1] = 1;
  }
  const saved = new Map<number, SavedFactors>();
  if (comeBack[0]) saved.set(-1, solver.saveCurrent());
  const budgetStop = () => {
    const solved = out.filter(Boolean).length;
    findings.push(
      finding(
        "analysis.budget",
        model.span,
        `The sweep stopped at its time budget after ${solved} of ${nodes.length} poses; results are partial.`,
        {
          data: { solved, planned: nodes.length },
        },
      ),
    );
  };
  for (let i = 0; i < nodes.length; i++) {
    if (pastDeadline(deadline)) {
      budgetStop();
      break;
    }
    const node = nodes[i]!;
    if (node.pred >= 0 && !solvedQ[node.pred]) continue; // beyond a lock: unreachable this way
    if (current !== node.pred) {
      const q = node.pred >= 0 ? solvedQ[node.pred]! : linkage.qReference;
      const a = node.pred >= 0 ? nodes[node.pred]!.angles : refAngles;
      const kept = saved.get(node.pred);
      if (kept) solver.restoreCurrent(q, a, kept);
      else if (!solver.setCurrent(q, a)) continue;
    }
    if (lastChild[node.pred + 1] === i) saved.delete(node.pred);
    from.set(solver.angles);
    if (solver.moveTo(node.angles, deadline)) {
      solvedQ[i] = Float64Array.from(solver.q);
      out[node.output] = solver.record(node.output);
      if (comeBack[i + 1] && lastChild[i + 1] > i) saved.set(i, solver.saveCurrent());
      current = i;
      continue;
    }
    current = -2; // the solver now sits at the lock, not at a node
    if (solver.timedOut) {
      budgetStop();
      break;
    }
    let moved = 0;
    for (let d = 1; d < dofs.length; d++)
      if (Math.abs(node.angles[d]! - from[d]!) > Math.abs(node.angles[moved]! - from[moved]!)) moved = d;
    const dir = node.angles[moved]! > from[moved]! ? "up" : "down";
    const key = `${moved}:${dir}`;
    if (reported.has(key)) continue;
    reported.add(key);
    const dof = dofs[moved]!;
    const joint = linkage.graph.joints.find((j) => j.id === dof.jointId)!;
    const lock = solver.angles[moved]!;
    const others = dofs
      .map((d, e) => (e === moved ? "" : `${d.id} at ${formatAngle(solver.angles[e]!)}`))
      .filter(Boolean)
      .join(", ");
    findings.push(
      finding(
        "geometry.cannot-reach",
        joint.origin.properties["range"] ?? joint.origin.name ?? joint.origin.declaration,
        `Joint ${joint.id} locks at ${formatAngle(lock)}${others ? ` (with ${others})` : ""}${solver.deadPoint ? ", a dead point where its pivots line up and it can fold either way" : ""}: the linkage cannot reach ${formatAngle(node.angles[moved]!)} and beyond, inside its range ${formatAngle(dof.range[0])} .. ${formatAngle(dof.range[1])}.`,
        { data: { subject: joint.id, lockAngle: lock, direction: dir, deadPoint: solver.deadPoint } },
      ),
    );
  }
  const poses = out.filter((p): p is Pose => p !== undefined);
  poses.forEach((p, i) => (p.index = i));
  return { dofs, loadCases: cases, reference, poses, steps, grid: useGrid, findings };
}
