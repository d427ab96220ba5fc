// Runs every check family over a solved sweep. Each family lives in its own file and is listed
// here once.
import type { ArmModel } from "../model/types";
import type { SweepResult } from "../mechanics/types";
import type { Finding } from "../findings/finding";
import type { Readouts } from "./readout";
import { balanceChecks } from "./balance";
import { checkStrength } from "./strength";
import { checkSpringStrength } from "./spring-strength";
import { checkSpringEnds } from "./spring-ends";
import { checkBearings } from "./bearings";
import { checkFastenings } from "./fastenings";
import { checkGeometry } from "./geometry";
import { checkSpringLeverage } from "./spring-leverage";
import { checkTipping } from "./tipping";
import { checkStiffness } from "./stiffness";
import { checkSwivels } from "./swivels";
import { checkSwivelBearings } from "./swivel-bearings";
import { checkAgedCase, type AgedReadouts } from "./aged";
import type { SolveOptions } from "../mechanics/sweep";

export interface CheckOptions {
  /** performance.now() value past which checks should stop early. */
  deadline: number;
  /** The sweep's density, for the aged case's own sweep (the spec's own when absent). */
  solve?: Omit<SolveOptions, "deadline">;
}

export interface CheckContext {
  model: ArmModel;
  sweep: SweepResult;
  options: CheckOptions;
  findings: Finding[];
  readouts: Readouts;
  /** The aged case's own readouts, when the spec states one (checks/aged.ts). */
  aged?: AgedReadouts;
}

export type CheckFamily = (ctx: CheckContext) => void;

/** Filled in by the check families (balance, strength, geometry, stiffness, ...). */
const FAMILIES: CheckFamily[] = [
  balanceChecks,
  checkStrength,
  checkSpringStrength,
  checkSpringEnds,
  checkBearings,
  checkFastenings,
  checkGeometry,
  checkSpringLeverage,
  checkTipping,
  checkStiffness,
  checkSwivels,
  checkSwivelBearings,
];

export function runChecks(
  model: ArmModel,
  sweep: SweepResult,
  options: CheckOptions,
): { findings: Finding[]; readouts: Readouts; aged?: AgedReadouts } {
  const ctx: CheckContext = { model, sweep, options, findings: [], readouts: {} };
  for (const family of FAMILIES) family(ctx);
  // The aged case last: it solves the arm again and repeats no finding the arm as built has.
  checkAgedCase(ctx, options.solve ?? {});
  return { findings: ctx.findings, readouts: ctx.readouts, ...(ctx.aged ? { aged: ctx.aged } : {}) };
}
