// A change to the design, re-checked before anyone is offered it: apply its text edits to a copy,
// analyse the copy, and compare the two designs. A change is worse when it adds an error, raises
// the worst hand force, makes a joint that friction held drift, or cannot be checked at all. The
// quick fixes go through here (`checkedFixes`); anything else that proposes a design (a search)
// may use `recheckEdits` and `compareDesigns` the same way.
import { analyse, type Analysis } from "./analysis";
import type { Code } from "./findings/codes";
import type { FixRequest, TextEdit, TextFix } from "./findings/fix";
import { fixesFor } from "./fixes";

/** What the comparison reads of one analysis. */
export interface DesignGauge {
  /** The arm was solved over its range (a sweep exists). */
  solved: boolean;
  /** Every check ran (no budget stop, no internal fault). */
  complete: boolean;
  /** Each error, by a key that survives edits elsewhere in the text: code and subject. */
  errors: Set<string>;
  /** The largest hand force over every pose, load case and payload, N (beyond friction). */
  worstHandForce: number;
  /** Joints with friction, and those of them that drift somewhere in the range. */
  frictionJoints: Set<string>;
  driftingJoints: Set<string>;
}

/** Codes of the text and the model: the only errors a text that cannot be solved can have, so
 * the only ones to compare when the text before a change could not be solved. */
const FRONT_CODE = /^(syntax|unit|name|property|value|arm|declaration|base|payload|spring|joint|body)\./;

/** A rise of the worst hand force below this is round-off, not a worse design: a millinewton,
 * or a millionth of the force (common practice, no source). */
const HAND_FORCE_TOLERANCE_N = 1e-3;
const HAND_FORCE_TOLERANCE_REL = 1e-6;

const INCOMPLETE: readonly Code[] = ["analysis.budget", "analysis.internal"];

export function gaugeOf(analysis: Pick<Analysis, "findings" | "sweep" | "model">): DesignGauge {
  let worst = 0;
  for (const pose of analysis.sweep?.poses ?? [])
    for (const c of pose.cases)
      for (const f of Object.values(c.handForce))
        if (Number.isFinite(f)) worst = Math.max(worst, Math.abs(f));
  const errors = new Set<string>();
  const drifting = new Set<string>();
  for (const f of analysis.findings) {
    const subject = (f.data as { subject?: string } | undefined)?.subject ?? "";
    if (f.severity === "error") errors.add(`${f.code} ${subject}`);
    if (f.code === "balance.drifts") drifting.add(f.data.subject);
  }
  return {
    solved: !!analysis.sweep,
    complete: !analysis.findings.some((f) => INCOMPLETE.includes(f.code)),
    errors,
    worstHandForce: worst,
    frictionJoints: new Set(
      (analysis.model?.joints ?? []).filter((j) => (j.friction ?? 0) > 0).map((j) => j.id),
    ),
    driftingJoints: drifting,
  };
}

/** Why `after` is a worse design than `before`, in words (empty when it is not worse). */
export function compareDesigns(before: DesignGauge, after: DesignGauge): string[] {
  const reasons: string[] = [];
  if (!after.complete) reasons.push("the changed design could not be checked in time");
  if (before.solved && !after.solved) reasons.push("the changed arm can no longer be solved");
  const added = [...after.errors].filter(
    (e) => !before.errors.has(e) && (before.solved || FRONT_CODE.test(e)),
  );
  if (added.length > 0)
    reasons.push(`it adds ${added.length === 1 ? "an error" : "errors"} (${added.join(", ")})`);
  if (before.solved && after.solved) {
    const allowed = before.worstHandForce * (1 + HAND_FORCE_TOLERANCE_REL) + HAND_FORCE_TOLERANCE_N;
    if (after.worstHandForce > allowed)
      reasons.push(
        `it raises the worst hand force from ${before.worstHandForce.toFixed(2)} N to ${after.worstHandForce.toFixed(2)} N`,
      );
    const newlyDrifting = [...after.driftingJoints].filter(
      (j) => before.frictionJoints.has(j) && !before.driftingJoints.has(j),
    );
    if (newlyDrifting.length > 0)
      reasons.push(
        `${newlyDrifting.join(", ")}, held by friction before, would turn on ${newlyDrifting.length === 1 ? "its" : "their"} own`,
      );
  }
  return reasons;
}

/** The text with the edits applied (edits at offsets of `text`, not overlapping). */
export function applyEdits(text: string, edits: readonly TextEdit[]): string {
  const sorted = [...edits].sort((a, b) => b.span.start - a.span.start);
  let out = text;
  for (const e of sorted) out = out.slice(0, e.span.start) + e.newText + out.slice(e.span.end);
  return out;
}

export interface RecheckOptions {
  /** Time for every analysis of the re-check together, ms. */
  budgetMs: number;
  /** Analyses a text (the core's `analyse`; a test may count the calls). */
  analyseText?: (text: string, options: { budgetMs: number }) => Analysis;
  /** The text's own analysis when the caller has it (the worker keeps its last ones). */
  current?: Analysis;
  /** A flag another thread raises to stop the re-check (stop.ts): nothing is offered then. */
  cancel?: Int32Array;
}

export interface Verdict {
  /** Why the change is worse; empty when it may be offered. */
  reasons: string[];
  after?: DesignGauge;
}

/** Applies the edits to a copy of the text, analyses it within the time left, and compares. */
export function recheckEdits(
  text: string,
  edits: readonly TextEdit[],
  before: DesignGauge,
  deadline: number,
  analyseText: NonNullable<RecheckOptions["analyseText"]> = analyse,
): Verdict {
  const left = deadline - performance.now();
  if (left <= 0) return { reasons: ["no time was left to check it"] };
  const after = gaugeOf(analyseText(applyEdits(text, edits), { budgetMs: left }));
  return { reasons: compareDesigns(before, after), after };
}

/** The fixes of each request that survive the re-check, in the order asked. The text is
 * analysed once as it stands, then once per candidate fix; what the time does not cover is not
 * offered. */
export function checkedFixes(
  text: string,
  requests: readonly FixRequest[],
  options: RecheckOptions,
): TextFix[][] {
  const cancel = options.cancel;
  const analyseText =
    options.analyseText ??
    ((t: string, o: { budgetMs: number }) => analyse(t, cancel ? { ...o, cancel } : o));
  const deadline = performance.now() + options.budgetMs;
  const current = options.current ?? analyseText(text, { budgetMs: options.budgetMs });
  const before = gaugeOf(current);
  const seen = new Map<string, boolean>();
  const cancelled = () => !!cancel && Atomics.load(cancel, 0) !== 0;
  return requests.map((req) =>
    fixesFor(text, current.tree, req, analyseText).filter((fix) => {
      const key = JSON.stringify(fix.edits);
      let ok = seen.get(key);
      if (ok === undefined) {
        ok =
          recheckEdits(text, fix.edits, before, deadline, analyseText).reasons.length === 0 && !cancelled();
        seen.set(key, ok);
      }
      return ok;
    }),
  );
}
