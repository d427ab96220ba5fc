// The design search end to end (docs/tuning.md): from a spec's text, the values of what
// its `tune` lines free that make the worst hand force over every pose and payload mass least
// while every other check still passes; each candidate is written into the text in the spec's own
// units and the edited text analysed again, and only a design whose re-analysis is no worse than
// the present one is offered. The re-analysis is passed in (`analyse`): this folder sits below the
// analysis that runs it. Pure: no IO; bounded by evaluations and the cooperative stop.
import type { SyntaxTree } from "../syntax/ast";
import type { ArmModel, Spring } from "../model/types";
import type { SweepResult } from "../mechanics/types";
import type { Finding } from "../findings/finding";
import type { TextEdit } from "../findings/fix";
import type { Readouts } from "../checks/readout";
import { solveSweep } from "../mechanics/sweep";
import { withStop, cancelled } from "../stop";
import { applyValues, searchVariables, type Variable } from "./variables";
import { HandForceMeasure, type Measure } from "./evaluate";
import { minimise } from "./search";
import { nearestStock, stockWithin } from "./wire-sizes";
import { anglePreloadsOf, applyEdits, tunedEdits, type WrittenValue } from "./write";

/** What the search reads of an analysis (the core's `Analysis` fits). */
export interface TuneAnalysis {
  text: string;
  tree: SyntaxTree;
  model?: ArmModel;
  sweep?: SweepResult;
  findings: readonly Finding[];
  readouts: Readouts;
}

export type Analyse = (text: string, options: { budgetMs?: number; cancel?: Int32Array }) => TuneAnalysis;

export interface TuneOptions {
  analyse: Analyse;
  /** The present text's analysis, when the caller has it already. */
  before?: TuneAnalysis;
  /** Wall-clock budget of the whole search and its re-checks, ms. */
  budgetMs?: number;
  cancel?: Int32Array;
  /** Now and then: the fraction done and what is going on. */
  progress?: (fraction: number, message: string) => void;
  /** The most designs the search measures (default SEARCH_EVALUATIONS). */
  maxEvaluations?: number;
}

export interface TunedSpring {
  id: string;
  values: (WrittenValue & { before: number; after: number; dimension: string; axis?: "x" | "y" })[];
}

export interface TuneResult {
  /** Whether a design better than the present one was found and passed its re-check. */
  improved: boolean;
  /** Why not, in a sentence (nothing to tune, the spec cannot be analysed, nothing better). */
  reason?: string;
  variables: Variable[];
  springs: TunedSpring[];
  /** Worst hand force over every pose and payload mass, N: now, and with the tuned values (both
   * from a full analysis). */
  worstBefore?: number;
  worstAfter?: number;
  edits: TextEdit[];
  /** The analysis of the tuned text (when improved). */
  after?: TuneAnalysis;
  /** Limits the best design found still breaks (when it could not keep them). */
  broken: string[];
  /** The cooperative stop (budget or cancel) cut the search short. */
  stopped: boolean;
  cancelled: boolean;
  evaluations: number;
}

/** Designs measured by one search: each costs a pass over the search sweep's poses (well under a
 * millisecond on a bench arm), so this bounds a search to seconds. */
export const SEARCH_EVALUATIONS = 4000;
/** Steps per degree of freedom of the search's own sweep (at most; the spec's own density when
 * lower). The re-check runs at the spec's own density. */
const SEARCH_STEPS = 19;
/** Candidates analysed in full before giving up: each is a whole analysis. */
const RECHECKS = 5;
/** A re-checked worst hand force must be this much lower to count as better, N (a hundredth of
 * a newton is below what a hand feels: common practice, no source). */
const IMPROVEMENT_N = 0.005;

/** Weight of the hand force as if no pivot had friction in the search's score: a tie-break only
 * (a thousandth), so that of designs friction holds alike the search takes the one that leans on
 * friction least, without trading away any hand force the balance check counts (docs/tuning.md). */
const FREE_TIE_BREAK = 1e-3;

/** Worst hand force over every pose, load case and payload of an analysis, N. */
export function worstHandForce(sweep: SweepResult | undefined): number | undefined {
  if (!sweep || sweep.poses.length === 0) return undefined;
  let w = 0;
  for (const pose of sweep.poses)
    for (const c of pose.cases) for (const v of Object.values(c.handForce)) w = Math.max(w, v);
  return w;
}

function emptyResult(reason: string, extra: Partial<TuneResult> = {}): TuneResult {
  return {
    improved: false,
    reason,
    variables: [],
    springs: [],
    edits: [],
    broken: [],
    stopped: false,
    cancelled: false,
    evaluations: 0,
    ...extra,
  };
}

export function tuneDesign(text: string, options: TuneOptions): TuneResult {
  const deadline = options.budgetMs !== undefined ? performance.now() + options.budgetMs : Infinity;
  const { value, stopped } = withStop(deadline, options.cancel, () => tuneWithin(text, options, deadline));
  return {
    ...value,
    stopped: value.stopped || stopped,
    cancelled: value.cancelled || cancelledFlag(options.cancel),
  };
}

function cancelledFlag(cancel: Int32Array | undefined): boolean {
  return cancel !== undefined && Atomics.load(cancel, 0) !== 0;
}

function leftMs(deadline: number): number | undefined {
  return Number.isFinite(deadline) ? Math.max(1, deadline - performance.now()) : undefined;
}

function tuneWithin(text: string, options: TuneOptions, deadline: number): TuneResult {
  const progress = options.progress ?? (() => {});
  progress(0, "analysing the present design");
  const before = options.before ?? options.analyse(text, budgetOf(deadline, options.cancel));
  const model = before.model;
  if (!model || !before.sweep || before.sweep.poses.length === 0) {
    const errors = before.findings.filter((f) => f.severity === "error");
    return emptyResult(
      errors.length > 0
        ? `the spec has errors that stop the analysis (first: ${errors[0]!.message})`
        : "the arm could not be solved over its range",
    );
  }
  const anglePreloads = anglePreloadsOf(before.tree);
  const variables = searchVariables(model, anglePreloads).filter((v) => v.hi > v.lo || v.integer);
  const worstBefore = worstHandForce(before.sweep);
  if (variables.length === 0)
    return emptyResult(
      model.springs.length === 0
        ? "the arm has no spring to tune"
        : "no `tune` line frees anything the search can change",
      { worstBefore },
    );
  const tunedIds = [...new Set(variables.map((v) => v.spring))];
  const tunedSprings = tunedIds.map((id) => model.springs.find((s) => s.id === id)!);

  progress(0.02, "sweeping the range for the search");
  const sweep = solveSweep(model, { quickSteps: SEARCH_STEPS, bodyVelocities: true, deadline });
  if (sweep.poses.length === 0)
    return emptyResult("the arm could not be solved over its range", { worstBefore });
  const measure = new HandForceMeasure(model, sweep, tunedSprings);
  // A coil's wire is wound from stock: each candidate is measured with its wire rounded to the
  // nearest stock diameter within the bounds (none within them: the value as searched).
  const stock = variables.map((v) => (v.what === "wire" ? stockWithin(v.lo, v.hi) : []));
  const toStock = (x: readonly number[]): number[] =>
    x.map((xi, i) => (stock[i]!.length > 0 ? nearestStock(xi, stock[i]!) : xi));
  const springsAt = (x: readonly number[]): Spring[] =>
    tunedSprings.map((s) => applyValues(model, s, variables, toStock(x), anglePreloads));
  const now = measure.measure(tunedSprings);
  // A broken limit costs more than any hand force it could buy.
  const penalty = 100 * (now.worst + model.gravity * totalMass(model) + 1);
  const score = (m: Measure) => m.worst + FREE_TIE_BREAK * m.worstFree + penalty * m.violation;

  const result = minimise((x) => score(measure.measure(springsAt(x))), boxOf(variables), {
    maxEvaluations: options.maxEvaluations ?? SEARCH_EVALUATIONS,
    starts: 6 + 2 * variables.length,
    localSearches: 3,
    progress: (f) => progress(0.05 + 0.8 * f, "searching"),
  });
  const wasCancelled = cancelled() || cancelledFlag(options.cancel);
  if (wasCancelled)
    return emptyResult("cancelled", {
      variables,
      worstBefore,
      cancelled: true,
      stopped: true,
      evaluations: result.evaluations,
    });

  // Candidates: the best, the other local optima, and the best pulled halfway back toward the
  // present design (a smaller change often keeps a check the full one breaks).
  const present = variables.map((v) => clampTo(v, v.current));
  const halfway = result.best.map((x, i) => roundIf(variables[i]!, (x + present[i]!) / 2));
  const candidates = [result.best, ...result.others.map((o) => o.point), halfway]
    .map(toStock)
    .filter((c, i, all) => all.findIndex((d) => d.every((x, k) => x === c[k])) === i);
  let broken = measure.measure(springsAt(result.best)).broken;
  let tried = 0;
  for (const c of candidates) {
    if (tried >= RECHECKS) break;
    const m = measure.measure(springsAt(c));
    if (m.violation > 0 && now.violation === 0) continue;
    if (!(m.worst < now.worst - IMPROVEMENT_N / 2)) continue;
    const w = tunedEdits(text, before.tree, variables, c);
    if (!w) continue;
    tried++;
    progress(0.85 + 0.03 * tried, "re-checking the tuned design");
    const edited = applyEdits(text, w.edits);
    const after = options.analyse(edited, budgetOf(deadline, options.cancel));
    const worstAfter = worstHandForce(after.sweep);
    const verdict = compare(before, after, worstBefore, worstAfter);
    if (verdict) {
      broken = [verdict];
      continue;
    }
    progress(1, "done");
    return {
      improved: true,
      variables,
      springs: tunedSpringsOf(tunedIds, variables, c, w.written),
      ...(worstBefore !== undefined ? { worstBefore } : {}),
      ...(worstAfter !== undefined ? { worstAfter } : {}),
      edits: w.edits,
      after,
      broken: [],
      stopped: result.stopped,
      cancelled: false,
      evaluations: result.evaluations,
    };
  }
  progress(1, "done");
  return emptyResult(
    result.stopped
      ? "the search reached its time budget before it found a better design that passes its re-check"
      : broken.length > 0
        ? `no better design within the bounds keeps every check: ${broken.join("; ")}`
        : "no design within the bounds has a lower worst hand force than the present one",
    { variables, worstBefore, broken, stopped: result.stopped, evaluations: result.evaluations },
  );
}

function budgetOf(
  deadline: number,
  cancel: Int32Array | undefined,
): { budgetMs?: number; cancel?: Int32Array } {
  const ms = leftMs(deadline);
  return { ...(ms !== undefined ? { budgetMs: ms } : {}), ...(cancel ? { cancel } : {}) };
}

function totalMass(model: ArmModel): number {
  return (
    model.bodies.reduce((m, b) => m + b.mass, 0) +
    model.payloads.reduce((m, p) => m + (p.massRange?.[1] ?? p.mass), 0)
  );
}

function clampTo(v: Variable, x: number): number {
  return roundIf(v, Math.min(v.hi, Math.max(v.lo, x)));
}

function roundIf(v: Variable, x: number): number {
  return v.integer ? Math.round(x) : x;
}

function boxOf(vars: readonly Variable[]) {
  return {
    lo: vars.map((v) => v.lo),
    hi: vars.map((v) => v.hi),
    integer: vars.map((v) => v.integer ?? false),
    start: vars.map((v) => clampTo(v, v.current)),
  };
}

function tunedSpringsOf(
  ids: readonly string[],
  vars: readonly Variable[],
  values: readonly number[],
  written: readonly WrittenValue[],
): TunedSpring[] {
  return ids.map((id) => ({
    id,
    values: vars.flatMap((v, i) => {
      if (v.spring !== id) return [];
      const w = written.find((x) => x.spring === id && x.what === v.what);
      return [
        {
          spring: id,
          what: v.what,
          text: w?.text ?? "",
          before: v.current,
          after: values[i]!,
          dimension: v.dimension,
          ...(v.axis ? { axis: v.axis } : {}),
        },
      ];
    }),
  }));
}

/** Why the tuned design's analysis is worse than the present one (undefined: it is not): a
 * finding of error or warning severity it has and the present design has not (by code and part),
 * a part's safety that falls below the requirement or further below it, or no lower worst hand
 * force. */
export function compare(
  before: TuneAnalysis,
  after: TuneAnalysis,
  worstBefore: number | undefined,
  worstAfter: number | undefined,
): string | undefined {
  if (!after.sweep || after.sweep.poses.length === 0) return "the tuned arm cannot be solved";
  // A finding by its code, its part and, where it has one, which check of the part (a hook, the
  // body, a pin): a tuned spring that trades one failing check of a part for another is worse.
  const key = (f: Finding) => {
    const d = f.data as { subject?: string; check?: string };
    return `${f.code}|${d.subject ?? ""}|${d.check ?? ""}`;
  };
  const counts = (fs: readonly Finding[]) => {
    const m = new Map<string, number>();
    for (const f of fs)
      if (f.severity === "error" || f.severity === "warning") m.set(key(f), (m.get(key(f)) ?? 0) + 1);
    return m;
  };
  const was = counts(before.findings);
  for (const [k, n] of counts(after.findings)) {
    if (k.startsWith("balance.unbalanced|")) continue; // judged by the hand force below
    if (n > (was.get(k) ?? 0)) {
      const f = after.findings.find((x) => key(x) === k)!;
      return `it would add ${f.code}: ${f.message}`;
    }
  }
  const required = before.model?.require.safety ?? 1;
  for (const [id, r] of Object.entries(after.readouts)) {
    const a = r.worstSafety?.value;
    const b = before.readouts[id]?.worstSafety?.value;
    if (a === undefined || b === undefined) continue;
    if (a < Math.min(b, required) * (1 - 1e-6))
      return `${id}'s safety would fall from ${b.toFixed(2)} to ${a.toFixed(2)}`;
  }
  if (worstBefore !== undefined && worstAfter !== undefined && !(worstAfter < worstBefore - IMPROVEMENT_N))
    return `the worst hand force would not fall (${worstBefore.toFixed(2)} N now, ${worstAfter.toFixed(2)} N tuned)`;
  return undefined;
}

export { applyEdits } from "./write";
