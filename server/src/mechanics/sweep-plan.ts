// The sweep planner, the one place that decides what the sweep visits: its load cases, how many
// steps per degree of freedom, the grid of all of them or each alone, and the order the poses are
// solved in. The spec's own density and the quick pass while typing (a lower density kept to a
// budget of work) are both planned here, from the model.
import type { ArmModel } from "../model/types";
import type { LoadCase } from "./types";
import type { Linkage } from "./linkage";
import { SWEEP_DEFAULTS } from "../model/schema";
import { MAX_POSE_BODIES } from "../limits";
import { formatResult, messageUnits } from "../units/format";
import { turningSwivels } from "./headings";

/** The grid of several degrees of freedom is capped at this many poses (conventions). */
export const MAX_GRID_POSES = 20000;

/** Poses times bodies times load cases one quick pass may visit: a pose costs roughly in
 * proportion to the bodies checked in it, once per load case. Common practice, no source: about
 * 300 poses of a ten-body arm, which keeps a run near the 50 ms a keystroke can wait. */
export const QUICK_WORK_BUDGET = 3000;

/** How densely to sweep, besides the spec's own `sweep` block. */
export interface SweepDensity {
  /** Steps per degree of freedom instead of the spec's (a fixed density for tests and tools). */
  stepsOverride?: number;
  /** A quick pass (while typing): at most this many steps per degree of freedom, fewer where the
   * poses times bodies times load cases would pass QUICK_WORK_BUDGET, never more than the spec's
   * own. 0 or absent: the spec's own density. */
  quickSteps?: number;
}

/** How a limit changed the plan: each dof swept alone (a grid would pass MAX_GRID_POSES, or
 * MAX_POSE_BODIES poses times moving bodies, even at 2 steps each), or fewer steps each (the grid
 * at the steps asked for would pass MAX_GRID_POSES; the poses times moving bodies, MAX_POSE_BODIES). */
export type SweepCap =
  | { kind: "each-alone"; limit: "grid" | "pose-bodies"; steps: number }
  | { kind: "fewer-steps"; limit: "grid" | "pose-bodies"; requested: number; used: number };

export interface SweepPlan {
  /** Steps per degree of freedom. */
  steps: number;
  /** The grid of every degree of freedom (else each alone, the others at their reference). */
  grid: boolean;
  /** Poses planned. */
  poses: number;
  /** Moving bodies the sweep solves (the pose-bodies limit counts them). */
  movingBodies: number;
  /** The limits that changed the plan, in the order they applied. */
  caps: SweepCap[];
  /** True when a quick pass planned less than the full analysis (fewer steps than the spec's own,
   * or the thinner heading search of an arm that turns): a full pass is still to come. */
  quick: boolean;
}

/** A payload mass in a load case's label: grams in SI (as the spec's masses usually are), else in
 * the system of this analysis's messages (units/format.ts messageUnits). */
function massWords(kg: number): string {
  const system = messageUnits();
  return system === "si" ? `${(kg * 1000).toFixed(0)} g` : formatResult(kg, "mass", system);
}

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
      label: `${p.id} at ${massWords(lo)}`,
      payloadMass: { ...nominal, [p.id]: lo },
    });
    cases.push({
      id: `${p.id}.high`,
      label: `${p.id} at ${massWords(hi)}`,
      payloadMass: { ...nominal, [p.id]: hi },
    });
  }
  return cases;
}

/** Whether a quick pass is asked for: the one place where 0 steps means "off". */
export function quickPassAsked(density: SweepDensity): boolean {
  return (density.quickSteps ?? 0) > 0;
}

/** Poses a sweep of `dofCount` degrees of freedom visits at `steps` each. */
function posesAt(dofCount: number, steps: number, grid: boolean): number {
  if (dofCount === 0) return 1;
  return grid ? Math.min(steps ** dofCount, MAX_GRID_POSES) : dofCount * steps;
}

/** The plan of a linkage's sweep, at the spec's density or the one asked for. */
export function planSweep(linkage: Linkage, density: SweepDensity = {}): SweepPlan {
  const model = linkage.model;
  const dofCount = linkage.dofs.length;
  const bodies = linkage.graph.bodyIds.length;
  const specGrid = model.sweep?.grid ?? SWEEP_DEFAULTS.grid;
  let steps = Math.round(density.stepsOverride ?? model.sweep?.steps ?? SWEEP_DEFAULTS.steps);
  steps = Math.min(Math.max(steps, 2), SWEEP_DEFAULTS.maxSteps);
  let grid = specGrid && dofCount > 1;
  // Even 2 steps each would pass a limit: each degree of freedom alone.
  const eachAlone: "grid" | "pose-bodies" | undefined = !grid
    ? undefined
    : 2 ** dofCount > MAX_GRID_POSES
      ? "grid"
      : 2 ** dofCount * bodies > MAX_POSE_BODIES
        ? "pose-bodies"
        : undefined;
  if (eachAlone) grid = false;

  let quick = false;
  if (quickPassAsked(density) && dofCount > 0) {
    const work = Math.max(1, model.bodies.length) * loadCases(model).length;
    let q = Math.max(2, Math.floor(density.quickSteps!));
    while (q > 2 && posesAt(dofCount, q, grid) * work > QUICK_WORK_BUDGET) q--;
    if (q < steps) {
      steps = q;
      quick = true;
    }
    // The quick pass also thins the swivels' heading search (docs/checks.md, "Headings
    // searched"), which multiplies the frame solves of an arm that turns: such an arm gets a quick
    // pass even at its own density, and its full search once typing pauses.
    if (turningSwivels(model).length > 0) quick = true;
  }

  const caps: SweepCap[] = [];
  if (eachAlone) caps.push({ kind: "each-alone", limit: eachAlone, steps });
  else if (grid && steps ** dofCount > MAX_GRID_POSES) {
    const capped = Math.max(2, Math.floor(MAX_GRID_POSES ** (1 / dofCount) + 1e-9));
    caps.push({ kind: "fewer-steps", limit: "grid", requested: steps, used: capped });
    steps = capped;
  }
  // Poses times moving bodies past their limit: fewer steps each.
  const poses = (s: number) => (grid ? s ** dofCount : s * dofCount);
  if (poses(steps) * bodies > MAX_POSE_BODIES) {
    const perDof = MAX_POSE_BODIES / bodies;
    const capped = Math.max(
      2,
      grid ? Math.floor(perDof ** (1 / dofCount) + 1e-9) : Math.floor(perDof / dofCount),
    );
    caps.push({ kind: "fewer-steps", limit: "pose-bodies", requested: steps, used: capped });
    steps = capped;
  }
  return { steps, grid, poses: posesAt(dofCount, steps, grid), movingBodies: bodies, caps, quick };
}

/** Sample angles of a range, both ends included. */
export function rangeSamples(range: [number, number], steps: number): number[] {
  const [lo, hi] = range;
  if (hi === lo || steps < 2) return [lo];
  return Array.from({ length: steps }, (_, i) => (i === steps - 1 ? hi : lo + ((hi - lo) * i) / (steps - 1)));
}

/** One pose to solve: its dof values, the pose it continues from and its place in the output. */
export interface SweepNode {
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

/** The poses of a plan in the order they are solved, each continuing from a solved neighbour. */
export function planNodes(
  plan: SweepPlan,
  dofs: readonly { range: [number, number]; reference: number }[],
): SweepNode[] {
  const samples = dofs.map((d) => rangeSamples(d.range, plan.steps));
  const reference = dofs.map((d) => d.reference);
  return plan.grid ? planGrid(samples, reference) : planEachAlone(samples, reference);
}
