// The aged load case (`aged { after T }`): the arm after a time under load, rubber cords relaxed
// and printed parts crept (model/ageing.ts), solved over the same range and held to the same
// balance and stiffness requirements. Its findings carry the codes of those checks and say they
// are about the aged case; where the arm as built already has that finding at the same words,
// the aged one becomes related information of it instead. Its figures join the payloads' and springs' readouts, labelled aged.
import type { ArmModel } from "../model/types";
import type { Finding } from "../findings/finding";
import { solveSweep, type SolveOptions } from "../mechanics/sweep";
import { agedFactors, agedModel, durationWords, type AgedFactors } from "../model/ageing";
import { pastDeadline } from "../stop";
import type { CheckContext } from "./index";
import { balanceChecks } from "./balance";
import { checkStiffness } from "./stiffness";
import { addFigures, type Figure, type Readouts } from "./readout";

/** The aged case's readouts as its own checks wrote them (results tags kept), for the results
 * record's `aged` section. */
export interface AgedReadouts {
  /** How long the load was held, s. */
  afterS: number;
  readouts: Readouts;
}

/** Runs the aged case when the model states one; adds its findings and figures to `ctx`. */
export function checkAgedCase(ctx: CheckContext, solve: SolveOptions): void {
  const aged = ctx.model.aged;
  // A quick pass while typing leaves it to the full pass that follows (sweep.quick says one is
  // still to run): it would double the typing-time work of every spec that states one.
  if (!aged || ctx.sweep.quick || pastDeadline(ctx.options.deadline)) return;
  const factors = agedFactors(aged);
  const model = agedModel(ctx.model, factors);
  const sweep = solveSweep(model, { ...solve, deadline: ctx.options.deadline });
  if (sweep.poses.length === 0) return;
  const agedCtx: CheckContext = { model, sweep, options: ctx.options, findings: [], readouts: {} };
  balanceChecks(agedCtx);
  checkStiffness(agedCtx);
  const words = agedCaseWords(ctx.model, factors);
  const at = aged.origin.properties["after"] ?? aged.origin.declaration;
  for (const f of agedCtx.findings) {
    const asBuilt = ctx.findings.find((g) => g.code === f.code && sameSpan(g, f));
    // Already a finding of the arm as built: the aged figures go with it, one finding at the words.
    // (a new array: findings of one check may share theirs)
    if (asBuilt)
      asBuilt.related = [...asBuilt.related, { span: at, message: `Aged case, ${words}: ${f.message}` }];
    else ctx.findings.push(agedFinding(f, words, at, factors.afterS));
  }
  addAgedFigures(ctx, agedCtx.readouts, factors);
  ctx.aged = { afterS: factors.afterS, readouts: agedCtx.readouts };
}

/** "after 1 year (rubber cords' force 17 % lower, printed parts 49 % less stiff)". */
export function agedCaseWords(model: ArmModel, f: AgedFactors): string {
  const changes: string[] = [];
  if (model.springs.some((s) => s.kind === "elastic"))
    changes.push(`rubber cords' force ${percent(f.cordForceLost)} lower`);
  if (Object.values(model.materials).some((m) => m.printed && usedByBody(model, m.id)))
    changes.push(`printed parts ${percent(f.printStiffnessLost)} less stiff`);
  return `after ${durationWords(f.afterS)}${changes.length ? ` (${changes.join(", ")})` : " (nothing in this arm ages by the rules: no rubber cord, no printed part)"}`;
}

function usedByBody(model: ArmModel, material: string): boolean {
  return model.bodies.some((b) => b.material === material);
}

function percent(share: number): string {
  return `${Number((share * 100).toPrecision(2))} %`;
}

function sameSpan(a: Finding, b: Finding): boolean {
  return a.span.start === b.span.start && a.span.end === b.span.end;
}

/** The aged case's finding: its message says so, it points back at the `after` line, and a
 * balance finding loses its best fit (a fit to the aged arm is not one to build: the quick fix
 * is offered on the arm as built). */
function agedFinding(f: Finding, words: string, after: Finding["span"], afterS: number): Finding {
  const data: Record<string, unknown> = { ...f.data, agedAfter: afterS };
  if (f.code === "balance.unbalanced") {
    delete data["best"];
    delete data["worstHandForceBefore"];
    delete data["worstHandForceAfter"];
  }
  return {
    ...f,
    message: `Aged case, ${words}: ${f.message}`,
    related: [...f.related, { span: after, message: "the aged case stated here" }],
    data: data as Finding["data"],
  } as Finding;
}

/** The aged payloads' figures held to a requirement (hand force, deflection, tilt, frequency)
 * and the cords' force range, labelled aged, on the readouts of the arm as built; the aged
 * figures fill no key of the results record (the arm as built does). */
function addAgedFigures(ctx: CheckContext, aged: Readouts, f: AgedFactors): void {
  const tag = `aged ${durationWords(f.afterS)}`;
  const label = (fig: Figure): Figure => {
    const { result: _result, ...rest } = fig;
    return { ...rest, label: `${fig.label}, ${tag}` };
  };
  for (const r of Object.values(aged)) {
    if (r.kind === "payload" || r.kind === "base") {
      const figures = r.figures.filter((fig) => fig.result).map(label);
      if (figures.length) addFigures(ctx.readouts, r.id, r.kind, figures);
    }
  }
  for (const s of ctx.model.springs) {
    if (s.kind !== "elastic") continue;
    const range = aged[s.id]?.figures.find((fig) => fig.label === "force range");
    addFigures(ctx.readouts, s.id, "spring", range ? [label(range)] : [], [
      `Aged case after ${durationWords(f.afterS)}: the cord's force is taken ${percent(f.cordForceLost)} lower${f.cordFromRule ? " (rubber relaxes about 3 % a tenfold of time, from memory: docs/checks.md)" : " (the aged case's relaxation)"}.`,
    ]);
  }
  for (const b of ctx.model.bodies) {
    if (!b.material || !ctx.model.materials[b.material]?.printed) continue;
    addFigures(
      ctx.readouts,
      b.id,
      b.kind === "link" ? "link" : b.kind,
      [],
      [
        `Aged case after ${durationWords(f.afterS)}: printed, so its stiffness is taken ${percent(f.printStiffnessLost)} lower${f.printFromRule ? " (creep by Findley's power law, values from memory: docs/checks.md)" : " (the aged case's creep)"}.`,
      ],
    );
  }
}
