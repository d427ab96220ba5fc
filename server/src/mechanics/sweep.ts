// The sweep: every degree of freedom across its range (the grid of all of them, or each alone
// with the others at reference), kinematics and statics at every pose, for every load case.
import type { ArmModel } from "../model/types";
import type { Pose, SweepResult } from "./types";
import { finding, type Finding } from "../findings/finding";
import { SWEEP_DEFAULTS } from "../model/schema";
import { buildLinkage } from "./linkage";
import { PoseSolver, type SavedFactors } from "./pose-solver";
import { formatAngle } from "./format";
import { pastDeadline } from "../stop";
import { MAX_POSE_BODIES } from "../limits";
import {
  loadCases,
  planNodes,
  planSweep,
  MAX_GRID_POSES,
  type SweepCap,
  type SweepDensity,
  type SweepPlan,
} from "./sweep-plan";

export interface SolveOptions extends SweepDensity {
  /** performance.now() value past which the sweep stops early (partial result). */
  deadline?: number;
  /** Keep each body's velocity per dof in every pose (`Pose.bodyVelocities`): the design search
   * needs it; a sweep for the checks does not. */
  bodyVelocities?: boolean;
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

  const solver = new PoseSolver(linkage, cases, options.bodyVelocities ?? false);
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

  const plan = planSweep(linkage, options);
  const steps = plan.steps;
  for (const cap of plan.caps) findings.push(capFinding(model, dofs.length, plan, cap));
  const nodes = planNodes(plan, dofs);

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
  return {
    dofs,
    loadCases: cases,
    reference,
    poses,
    steps,
    grid: plan.grid,
    findings,
    ...(plan.quick ? { quick: true } : {}),
  };
}

/** The finding that says how a limit changed the sweep's plan. */
function capFinding(model: ArmModel, dofCount: number, plan: SweepPlan, cap: SweepCap): Finding {
  const where = (key: "grid" | "steps") =>
    model.sweep?.origin?.properties[key] ?? model.sweep?.origin?.declaration ?? model.span;
  const bodies = plan.movingBodies;
  const limit = MAX_POSE_BODIES.toLocaleString("en-US");
  if (cap.kind === "each-alone" && cap.limit === "grid")
    return finding(
      "sweep.capped",
      where("grid"),
      `A grid of ${dofCount} degrees of freedom would exceed ${MAX_GRID_POSES} poses even at 2 steps each; each one is swept alone instead, the others at their reference angle.`,
      { data: { requested: cap.steps, used: cap.steps, grid: false } },
    );
  if (cap.kind === "each-alone")
    return finding(
      "sweep.capped",
      where("grid"),
      `A grid of ${dofCount} degrees of freedom over ${bodies} moving bodies would pass ${limit} poses times bodies even at 2 steps each; each one is swept alone instead, the others at their reference angle.`,
      { data: { requested: cap.steps, used: cap.steps, grid: false, limit: MAX_POSE_BODIES } },
    );
  const { requested, used } = cap;
  if (cap.limit === "grid")
    return finding(
      "sweep.capped",
      where("steps"),
      `The grid of ${dofCount} degrees of freedom at ${requested} steps each would be ${requested ** dofCount} poses; it is capped at ${used} steps each (${used ** dofCount} poses, limit ${MAX_GRID_POSES}).`,
      { data: { requested, used } },
    );
  const poses = plan.grid ? requested ** dofCount : requested * dofCount;
  return finding(
    "sweep.capped",
    where("steps"),
    `${requested} steps per degree of freedom would make ${(poses * bodies).toLocaleString("en-US")} poses times moving bodies (${bodies} bodies), past the limit of ${limit}; the sweep takes ${used} steps each.`,
    { data: { requested, used, limit: MAX_POSE_BODIES } },
  );
}
