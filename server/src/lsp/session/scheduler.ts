// Bounded analysis per document: debounce keystrokes, run only the latest text, cancel a run of a
// text already changed (cooperatively: the worker stays warm), and keep the last good analysis to
// answer hover and completion while a new run is under way.
import type { Analysis, AnalysisOptions } from "../../analysis";
import { finding } from "../../findings/finding";
import type { SyntaxTree } from "../../syntax/ast";
import type { AnalysisRunner, RunHandle, TuneHandle } from "./runner";
import { EDITOR_TUNE_BUDGET_MS } from "./tune-run";
import type { ViewModel, ViewOptions } from "../../view";
import type { Settings } from "./settings";
import { cacheKey } from "./analysis-cache";
import { reportFault } from "../safe";

/** After a quick while-typing run, the spec's own sweep density is run once typing pauses this
 * long. Common practice, no source: about the pause between typed phrases. */
const IDLE_FULL_RUN_MS = 1200;
/** The hard stop of a run beyond its cooperative budget (a hung phase): budget plus this. */
const HARD_LIMIT_MARGIN_MS = 2000;

export type Density = "typing" | "full";

export interface PublishedAnalysis {
  uri: string;
  version: number;
  analysis: Analysis;
}

interface DocEntry {
  uri: string;
  version: number;
  text: string;
  density: Density;
  debounce?: ReturnType<typeof setTimeout>;
  idle?: ReturnType<typeof setTimeout>;
  /** The run in flight; `options` keyed as the cache keys them (a settings change alters them). */
  running?: { version: number; density: Density; options: string; handle: RunHandle };
  /** The analysis of the current version, once it has arrived. */
  current?: Analysis;
  /** The newest analysis that built a model (answers hover figures while the text is broken). */
  lastGood?: Analysis;
  waiters: { version: number; resolve: (a: Analysis | undefined) => void }[];
}

/** What the drawing panel is sent: the view model, or why there is none. */
export type ViewResult = { view: ViewModel } | { failed: string } | undefined;

export class AnalysisScheduler {
  private readonly docs = new Map<string, DocEntry>();
  /** The options each published analysis was run with (to find it again in the worker). */
  private readonly optionsOf = new WeakMap<Analysis, AnalysisOptions>();

  constructor(
    private readonly runner: AnalysisRunner,
    private readonly settings: () => Settings,
    private readonly onAnalysed: (result: PublishedAnalysis) => void,
  ) {}

  /** A new text for a document: analysed after the debounce delay (0 for `immediate`). */
  update(uri: string, version: number, text: string, density: Density, immediate = false): void {
    let entry = this.docs.get(uri);
    if (!entry) {
      entry = { uri, version, text, density, waiters: [] };
      this.docs.set(uri, entry);
    }
    const changed = entry.text !== text || entry.version !== version;
    entry.version = version;
    entry.text = text;
    entry.density = density;
    if (changed) entry.current = undefined;
    this.clearTimers(entry);
    this.stopIfStale(entry);
    const delay = immediate ? 0 : this.settings().diagnosticsDelayMs;
    entry.debounce = setTimeout(() => this.safeStart(entry!), delay);
  }

  /** Runs the current text again at the spec's own density (e.g. on save). */
  refresh(uri: string): void {
    const entry = this.docs.get(uri);
    if (entry) this.update(uri, entry.version, entry.text, "full", true);
  }

  refreshAll(): void {
    for (const uri of this.docs.keys()) this.refresh(uri);
  }

  close(uri: string): void {
    const entry = this.docs.get(uri);
    if (!entry) return;
    this.clearTimers(entry);
    entry.running?.handle.cancel();
    for (const w of entry.waiters) w.resolve(undefined);
    this.docs.delete(uri);
  }

  /** The analysis of the document's current text, if it has arrived. */
  current(uri: string): Analysis | undefined {
    return this.docs.get(uri)?.current;
  }

  /** The best analysis to read figures from now: the current one, else the last that built a
   * model. */
  latest(uri: string): Analysis | undefined {
    const entry = this.docs.get(uri);
    if (!entry) return undefined;
    if (entry.current?.model) return entry.current;
    return entry.lastGood ?? entry.current;
  }

  /** Resolves with the analysis of `version` (or a later one) once it is published. */
  whenAnalysed(uri: string, version: number): Promise<Analysis | undefined> {
    const entry = this.docs.get(uri);
    if (!entry) return Promise.resolve(undefined);
    if (entry.current && entry.version >= version) return Promise.resolve(entry.current);
    return new Promise((resolve) => entry.waiters.push({ version, resolve }));
  }

  /** The view model of a published analysis, built off the request thread (in the worker, from
   * the analysis it made) within the analysis's hard limit. */
  async viewModel(analysis: Analysis, view: ViewOptions): Promise<ViewResult> {
    const options = this.optionsOf.get(analysis) ?? {};
    const outcome = await this.runner.view(analysis.text, options, view, this.hardLimit());
    if (outcome.kind === "done") return { view: outcome.view };
    if (outcome.kind === "timeout")
      return { failed: `the drawing was not ready within ${this.hardLimit()} ms` };
    if (outcome.kind === "failed") return { failed: outcome.message };
    return undefined;
  }

  /** The design search over `text` (the editor's tune command), in the worker like an analysis,
   * queued behind the run in progress; cancel it through the handle. */
  tune(text: string, onProgress: (fraction: number, message: string) => void): TuneHandle {
    const tune = this.runner.tune?.bind(this.runner);
    if (!tune)
      return {
        outcome: Promise.resolve({ kind: "failed", message: "this runner cannot tune" }),
        cancel: () => {},
      };
    // A little past the cooperative budget: the search stops at it and answers with the best so far.
    return tune(text, EDITOR_TUNE_BUDGET_MS, EDITOR_TUNE_BUDGET_MS + 5000, onProgress);
  }

  dispose(): void {
    for (const uri of [...this.docs.keys()]) this.close(uri);
    this.runner.dispose();
  }

  private hardLimit(): number {
    return this.settings().analysisBudgetMs + HARD_LIMIT_MARGIN_MS;
  }

  private clearTimers(entry: DocEntry): void {
    if (entry.debounce) clearTimeout(entry.debounce);
    if (entry.idle) clearTimeout(entry.idle);
    entry.debounce = entry.idle = undefined;
  }

  /** Cancels a run of an older text: its result would be dropped, and cancelling costs the worker
   * nothing (it notices its flag within milliseconds and stays warm). */
  private stopIfStale(entry: DocEntry): void {
    const run = entry.running;
    if (!run || run.version === entry.version) return;
    run.handle.cancel();
    entry.running = undefined;
  }

  private options(entry: DocEntry): AnalysisOptions {
    const s = this.settings();
    const options: AnalysisOptions = { budgetMs: s.analysisBudgetMs };
    // A chosen system writes the messages too; "auto" leaves them in the spec's own.
    if (s.displayUnits !== "auto") options.units = s.displayUnits;
    // The sweep planner decides from the model how dense a quick pass is, and whether it is one.
    if (entry.density === "typing") options.quickSteps = s.stepsWhileTyping;
    return options;
  }

  /** `start` from a timer: a fault is reported, never thrown into the event loop. */
  private safeStart(entry: DocEntry): void {
    try {
      this.start(entry);
    } catch (err) {
      reportFault("starting an analysis", err);
    }
  }

  private start(entry: DocEntry): void {
    entry.debounce = undefined;
    if (this.docs.get(entry.uri) !== entry) return;
    const version = entry.version;
    const density = entry.density;
    const options = this.options(entry);
    const optionsKey = cacheKey("", options);
    if (entry.running) {
      const same = entry.running;
      if (same.version === version && same.density === density && same.options === optionsKey) return;
      // A run of the same text at another density or with other settings, or of an older text: replaced.
      entry.running.handle.cancel();
      entry.running = undefined;
    }
    const hardLimit = (options.budgetMs ?? 0) + HARD_LIMIT_MARGIN_MS;
    const handle = this.runner.run(entry.text, options, hardLimit);
    entry.running = { version, density, options: optionsKey, handle };
    void handle.outcome.then(async (outcome) => {
      if (entry.running?.handle === handle) entry.running = undefined;
      if (this.docs.get(entry.uri) !== entry) return;
      if (outcome.kind === "cancelled") return this.startIfBehind(entry);
      let analysis: Analysis;
      if (outcome.kind === "done") {
        analysis = outcome.analysis;
        this.optionsOf.set(analysis, options);
      } else
        analysis = await this.fallbackAnalysis(
          entry.text,
          outcome.kind === "timeout" ? hardLimit : undefined,
          outcome.kind === "failed" ? outcome.message : undefined,
        );
      if (outcome.kind !== "done") this.optionsOf.set(analysis, { modelOnly: true });
      if (this.docs.get(entry.uri) !== entry) return;
      if (entry.version !== version) return this.startIfBehind(entry); // stale: drop it
      this.accept(entry, version, density, analysis);
    });
  }

  private startIfBehind(entry: DocEntry): void {
    // A pending timer (the debounce of newer keystrokes, or the grace re-check) starts it itself.
    if (!entry.running && !entry.debounce && !entry.current) this.start(entry);
  }

  private accept(entry: DocEntry, version: number, density: Density, analysis: Analysis): void {
    entry.current = analysis;
    if (analysis.model) entry.lastGood = analysis;
    const ready = entry.waiters.filter((w) => w.version <= version);
    entry.waiters = entry.waiters.filter((w) => w.version > version);
    for (const w of ready) w.resolve(analysis);
    this.onAnalysed({ uri: entry.uri, version, analysis });
    // A quick pass ran: the spec's own density follows once typing pauses.
    if (density === "typing" && analysis.sweep?.quick) {
      entry.idle = setTimeout(() => {
        entry.idle = undefined;
        if (entry.version === version && this.docs.get(entry.uri) === entry)
          this.update(entry.uri, version, entry.text, "full", true);
      }, IDLE_FULL_RUN_MS);
    }
  }

  /** After a run timed out or failed: the syntax and model findings at least, from a model-only
   * run under its own hard limit, plus a finding that says what happened. */
  private async fallbackAnalysis(
    text: string,
    timedOutAfterMs: number | undefined,
    failure: string | undefined,
  ): Promise<Analysis> {
    const limit = this.settings().analysisBudgetMs + HARD_LIMIT_MARGIN_MS;
    const outcome = await this.runner.run(text, { modelOnly: true }, limit).outcome;
    const base: Analysis =
      outcome.kind === "done"
        ? outcome.analysis
        : {
            text,
            tree: emptyTree(),
            findings: [],
            readouts: {},
            timings: { parse: 0, model: 0, solve: 0, checks: 0 },
          };
    const message =
      timedOutAfterMs !== undefined
        ? `The analysis was stopped after ${Math.round(timedOutAfterMs)} ms; only the text and model were checked. Raise counterpoise.analysisBudgetMs or lower the sweep steps.`
        : `The analysis failed (${failure ?? "unknown fault"}); only the text and model were checked. This is a bug in Counterpoise.`;
    const code = timedOutAfterMs !== undefined ? "analysis.budget" : "analysis.internal";
    return { ...base, findings: [...base.findings, finding(code, { start: 0, end: 0 }, message)] };
  }
}

function emptyTree(): SyntaxTree {
  return { arms: [], comments: [], errors: [] };
}
