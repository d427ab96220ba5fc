// Runs one check family on a hand-built model and sweep (test helper).
import type { ArmModel } from "../../server/src/model/types";
import type { SweepResult } from "../../server/src/mechanics/types";
import type { CheckContext, CheckFamily } from "../../server/src/checks/index";

export function runFamily(family: CheckFamily, model: ArmModel, sweep: SweepResult): CheckContext {
  const ctx: CheckContext = { model, sweep, options: { deadline: Infinity }, findings: [], readouts: {} };
  family(ctx);
  return ctx;
}

export function figure(ctx: CheckContext, id: string, label: string): number | undefined {
  return ctx.readouts[id]?.figures.find((f) => f.label === label)?.value;
}
