// How densely to sweep while the user types: the spec's own density is for the pause after
// typing; while typing, the grid is kept to a few hundred poses so diagnostics follow keystrokes.
import type { SyntaxTree } from "../syntax/ast";
import { SWEEP_DEFAULTS } from "../model/schema";
import { MAX_GRID_POSES } from "../mechanics/sweep";

/** Poses times bodies one while-typing run may visit: a pose costs roughly in proportion to the
 * bodies checked in it. Common practice, no source: about 300 poses of a ten-body arm, which keeps
 * a run near the 50 ms a keystroke can wait. */
export const TYPING_BODY_POSE_BUDGET = 3000;

interface SweepShape {
  dofs: number;
  /** The base, links, and three per parallelogram (bars and head). */
  bodies: number;
  steps: number;
  grid: boolean;
  /** Load cases the statics and checks repeat for: 1, plus both ends of each payload mass range. */
  loadCases: number;
}

/** Degrees of freedom (joints and parallelograms with a `range`, not `fixed`), the spec's steps
 * and whether it sweeps the grid, read from the syntax tree. */
export function sweepShape(tree: SyntaxTree): SweepShape {
  const shape: SweepShape = {
    dofs: 0,
    bodies: 0,
    steps: SWEEP_DEFAULTS.steps,
    grid: SWEEP_DEFAULTS.grid,
    loadCases: 1,
  };
  for (const d of tree.arms[0]?.declarations ?? []) {
    const keys = new Set(d.properties.map((p) => p.key.text));
    shape.bodies +=
      d.keyword.text === "parallelogram" ? 3 : d.keyword.text === "link" || d.keyword.text === "base" ? 1 : 0;
    if (
      (d.keyword.text === "joint" || d.keyword.text === "parallelogram") &&
      keys.has("range") &&
      !keys.has("fixed")
    )
      shape.dofs++;
    if (d.keyword.text === "payload" && keys.has("range")) shape.loadCases += 2;
    if (d.keyword.text !== "sweep") continue;
    for (const p of d.properties) {
      const v = p.values[0];
      if (p.key.text === "steps" && v?.kind === "quantity") shape.steps = v.value;
      if (p.key.text === "grid" && v?.kind === "reference") shape.grid = v.parts[0]?.text !== "off";
    }
  }
  return shape;
}

/** Poses a sweep visits at `steps` per degree of freedom (as the solver plans it: a grid unless
 * even 2 steps each would pass its cap, then each degree of freedom alone). */
function posesAt(shape: SweepShape, steps: number): number {
  const grid = shape.grid && shape.dofs > 1 && 2 ** shape.dofs <= MAX_GRID_POSES;
  return grid ? Math.min(steps ** shape.dofs, MAX_GRID_POSES) : Math.max(1, shape.dofs) * steps;
}

/** The steps per degree of freedom for a while-typing run, or undefined to keep the spec's own:
 * at most `settingSteps`, fewer if the grid would pass the typing budget, never more than the
 * spec asks for. */
export function typingSteps(tree: SyntaxTree, settingSteps: number): number | undefined {
  if (settingSteps <= 0) return undefined;
  const shape = sweepShape(tree);
  let steps = Math.max(2, Math.floor(settingSteps));
  // each load case repeats the statics and the checks over every pose
  const work = Math.max(1, shape.bodies) * shape.loadCases;
  while (steps > 2 && posesAt(shape, steps) * work > TYPING_BODY_POSE_BUDGET) steps--;
  return steps < shape.steps ? steps : undefined;
}
