// The one entry to the core: text → { tree, model, sweep, findings, readouts }.
// Pure: takes a string, returns values; no IO, no editor or protocol types.
import { parse } from "./syntax/parser";
import { buildModel } from "./model/build";
import { solveSweep } from "./mechanics/sweep";
import { runChecks } from "./checks/index";
import type { AgedReadouts } from "./checks/aged";
import type { SyntaxTree } from "./syntax/ast";
import type { ArmModel } from "./model/types";
import type { SweepResult } from "./mechanics/types";
import type { Finding } from "./findings/finding";
import { finding } from "./findings/finding";
import type { Readouts } from "./checks/readout";
import type { SymbolTable } from "./model/symbols";
import { MAX_SPEC_CHARS } from "./limits";
import { withStop } from "./stop";
import { inMessageUnits } from "./units/format";
import type { UnitSystem } from "./units/unit-table";
import { writtenUnitSystem } from "./model/written-units";
import { adjustChecks } from "./tune/adjust";

/** The result types the shells read (so they need not reach into the layers for them). */
export type { Pose, SweepResult } from "./mechanics/types";

export interface AnalysisOptions {
  /** Overrides the spec's `sweep steps` (a fixed density for tests and tools). */
  stepsOverride?: number;
  /** A quick pass (while typing): at most this many steps per degree of freedom, fewer where the
   * sweep planner's work budget asks; 0 or absent: the spec's own density (mechanics/sweep-plan.ts). */
  quickSteps?: number;
  /** Wall-clock budget for solving and checking, ms; past it the results are partial. */
  budgetMs?: number;
  /** The system messages are written in; by default the one the spec is written in
   * (model/written-units.ts). */
  units?: UnitSystem;
  /** Stop after building the model (syntax and model findings only). */
  modelOnly?: boolean;
  /** A flag another thread raises (non-zero at index 0, over a SharedArrayBuffer) to cancel the
   * run: it then stops at the next place that looks at the budget (stop.ts). */
  cancel?: Int32Array;
}

export interface Analysis {
  text: string;
  tree: SyntaxTree;
  model?: ArmModel;
  /** Every declaration and reference, for outline, go-to-definition, references and rename. */
  symbols?: SymbolTable;
  sweep?: SweepResult;
  findings: Finding[];
  readouts: Readouts;
  /** The aged case's readouts, when the spec states one. */
  aged?: AgedReadouts;
  /** The system its messages are written in (the reader's choice, else the spec's own). */
  units?: UnitSystem;
  /** Milliseconds spent in each phase. */
  timings: { parse: number; model: number; solve: number; checks: number };
}

/** Findings of these codes mean the model cannot be solved meaningfully. */
function blocksSolving(findings: readonly Finding[]): boolean {
  return findings.some((f) => f.severity === "error" && f.code !== "balance.unbalanced");
}

export function analyse(text: string, options: AnalysisOptions = {}): Analysis {
  if (text.length > MAX_SPEC_CHARS) return refusedAsTooLong(text);
  // The budget counts from the start: reading a long text uses it too.
  const deadline = options.budgetMs !== undefined ? performance.now() + options.budgetMs : Infinity;
  const { value, stopped } = withStop(deadline, options.cancel, () => analyseWithin(text, options, deadline));
  if (stopped && !value.findings.some((f) => f.code === "analysis.budget")) {
    // A phase that cannot stop midway (reading, building, placing) used up the budget and the
    // checks were cut short: say so, or the editor would show nothing amiss.
    value.findings.push(
      finding(
        "analysis.budget",
        value.model?.span ?? { start: 0, end: 0 },
        `The analysis reached its time budget of ${Math.round(options.budgetMs ?? 0)} ms before every check had run; results are partial.`,
        { data: { budgetMs: options.budgetMs } },
      ),
    );
  }
  return value;
}

/** A text past MAX_SPEC_CHARS is not read at all: one finding, at the character past the limit. */
function refusedAsTooLong(text: string): Analysis {
  const at = { start: MAX_SPEC_CHARS, end: MAX_SPEC_CHARS + 1 };
  return {
    text,
    tree: { arms: [], comments: [], errors: [] },
    findings: [
      finding(
        "analysis.limit",
        at,
        `The text is ${text.length.toLocaleString("en-US")} characters long, past the limit of ${MAX_SPEC_CHARS.toLocaleString("en-US")} (1 MiB) for one spec: it is not analysed. Split it, or remove what an arm does not need.`,
        { data: { limit: MAX_SPEC_CHARS, length: text.length } },
      ),
    ],
    readouts: {},
    timings: { parse: 0, model: 0, solve: 0, checks: 0 },
  };
}

function analyseWithin(text: string, options: AnalysisOptions, deadline: number): Analysis {
  const timings = { parse: 0, model: 0, solve: 0, checks: 0 };
  const findings: Finding[] = [];
  let t = performance.now();
  const tree = parse(text);
  // Stopped while reading (cancelled, or out of time): nothing more to say about an unread text
  // than the budget finding analyse() adds.
  if (tree.stopped)
    return { text, tree, findings, readouts: {}, timings: { ...timings, parse: performance.now() - t } };
  for (const e of tree.errors) {
    const subject = declarationNameAt(tree, e.span.start);
    findings.push(finding("syntax.error", e.span, e.message, { data: subject ? { subject } : {} }));
  }
  timings.parse = performance.now() - t;
  // Messages in the system the reader asked for, else the one the spec is written in.
  const units = options.units ?? writtenUnitSystem(tree);
  const result = inMessageUnits(units, () => analyseTree(text, tree, findings, timings, options, deadline));
  result.units = units;
  return result;
}

/** Builds, solves and checks a parsed text (its syntax findings already in `findings`). */
function analyseTree(
  text: string,
  tree: SyntaxTree,
  findings: Finding[],
  timings: Analysis["timings"],
  options: AnalysisOptions,
  deadline: number,
): Analysis {
  let t = performance.now();
  const built = guard(() => buildModel(tree, text), findings, "building the model");
  timings.model = performance.now() - t;
  const result: Analysis = { text, tree, findings, readouts: {}, timings };
  if (!built) return result;
  findings.push(...built.findings);
  result.symbols = built.symbols;
  if (!built.model) return result;
  result.model = built.model;
  if (options.modelOnly || blocksSolving(findings)) return result;

  t = performance.now();
  const density = {
    ...(options.stepsOverride !== undefined ? { stepsOverride: options.stepsOverride } : {}),
    ...(options.quickSteps !== undefined ? { quickSteps: options.quickSteps } : {}),
  };
  const sweep = guard(
    () =>
      solveSweep(built.model!, {
        ...density,
        deadline,
        // An adjuster that moves a spring's end needs the bodies' velocities (tune/adjust.ts).
        bodyVelocities: built.model!.springs.some((s) =>
          s.tunings?.some((t) => t.mode === "adjust" && t.region),
        ),
      }),
    findings,
    "solving the poses",
  );
  timings.solve = performance.now() - t;
  if (!sweep) return result;
  result.sweep = sweep;
  findings.push(...sweep.findings);

  t = performance.now();
  const checked = guard(
    () => runChecks(built.model!, sweep, { deadline, solve: density }),
    findings,
    "running the checks",
  );
  timings.checks = performance.now() - t;
  if (checked) {
    findings.push(...checked.findings);
    result.readouts = checked.readouts;
    if (checked.aged) result.aged = checked.aged;
    // `adjust` lines: the setting per payload mass, and the masses no setting balances.
    const adjusted = guard(
      () => adjustChecks(built.model!, sweep, checked.readouts, deadline),
      findings,
      "finding the adjusters' settings",
    );
    if (adjusted) findings.push(...adjusted);
  }
  return result;
}

/** The name of the innermost declaration whose text holds `offset`: what a syntax error there is
 * about (the parser knows declarations, not parts; a name that builds no part names none). */
function declarationNameAt(tree: SyntaxTree, offset: number): string | undefined {
  let best: { name: string; size: number } | undefined;
  for (const arm of tree.arms)
    for (const d of arm.declarations) {
      const { start, end } = d.span;
      if (
        d.name &&
        offset >= start &&
        offset < Math.max(end, start + 1) &&
        (!best || end - start < best.size)
      )
        best = { name: d.name.text, size: end - start };
    }
  return best?.name;
}

/** Runs a phase; an exception becomes an `analysis.internal` finding instead of a crash. */
function guard<T>(phase: () => T, findings: Finding[], what: string): T | undefined {
  try {
    return phase();
  } catch (err) {
    const detail = err instanceof Error ? err.message : String(err);
    findings.push(
      finding("analysis.internal", { start: 0, end: 0 }, `Internal fault while ${what}: ${detail}`),
    );
    return undefined;
  }
}
