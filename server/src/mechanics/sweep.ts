// PLACEHOLDER until the solver lands.
import type { ArmModel } from "../model/types";
import type { SweepResult } from "./types";
export interface SolveOptions {
  stepsOverride?: number;
  /** performance.now() value past which the sweep stops early (partial result). */
  deadline?: number;
}
export function solveSweep(_model: ArmModel, _options: SolveOptions = {}): SweepResult {
  return { dofs: [], loadCases: [], poses: [], steps: 0, grid: false, findings: [] };
}
