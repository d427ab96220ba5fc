// Bounded analysis per document, with a runner under the test's control: keystrokes debounce to
// one run of the latest text, a run of a text already changed is cancelled at once (cancelling is
// cooperative and keeps the worker), a run past its hard limit still yields the text's findings,
// and figures stay available from the last good analysis while the text is broken.
import { describe, expect, it } from "vitest";
import type { Analysis, AnalysisOptions } from "../../server/src/analysis";
import type { AnalysisRunner, RunHandle, RunOutcome, ViewOutcome } from "../../server/src/lsp/session/runner";
import { AnalysisScheduler, type PublishedAnalysis } from "../../server/src/lsp/session/scheduler";
import { DEFAULT_SETTINGS, type Settings } from "../../server/src/lsp/session/settings";
import type { ArmModel } from "../../server/src/model/types";
import type { SweepResult } from "../../server/src/mechanics/types";

interface FakeRun {
  text: string;
  options: AnalysisOptions;
  hardLimitMs: number;
  startedAt: number;
  cancelled: boolean;
  finish(outcome: RunOutcome): void;
}

class FakeRunner implements AnalysisRunner {
  readonly runs: FakeRun[] = [];
  run(text: string, options: AnalysisOptions, hardLimitMs: number): RunHandle {
    let finish!: (o: RunOutcome) => void;
    const outcome = new Promise<RunOutcome>((resolve) => (finish = resolve));
    const run: FakeRun = {
      text,
      options,
      hardLimitMs,
      startedAt: performance.now(),
      cancelled: false,
      finish,
    };
    this.runs.push(run);
    return {
      outcome,
      started: () => run.startedAt,
      cancel: () => {
        run.cancelled = true;
        finish({ kind: "cancelled" });
      },
    };
  }
  readonly views: { text: string; options: AnalysisOptions }[] = [];
  view(text: string, options: AnalysisOptions): Promise<ViewOutcome> {
    this.views.push({ text, options });
    return Promise.resolve({ kind: "failed", message: "no views here" });
  }
  dispose(): void {}
}

function analysisOf(text: string, withModel = true): Analysis {
  return {
    text,
    tree: { arms: [], comments: [], errors: [] },
    ...(withModel ? { model: { title: text } as unknown as ArmModel } : {}),
    findings: [],
    readouts: {},
    timings: { parse: 0, model: 0, solve: 0, checks: 0 },
  };
}

function setUp(settings: Partial<Settings> = {}) {
  const runner = new FakeRunner();
  const published: PublishedAnalysis[] = [];
  const s: Settings = { ...DEFAULT_SETTINGS, diagnosticsDelayMs: 5, stepsWhileTyping: 0, ...settings };
  const scheduler = new AnalysisScheduler(
    runner,
    () => s,
    (p) => published.push(p),
  );
  return { runner, published, scheduler };
}

const tick = (ms = 0) => new Promise((r) => setTimeout(r, ms));
async function until(test: () => boolean, what: string): Promise<void> {
  for (let i = 0; i < 400; i++) {
    if (test()) return;
    await tick(5);
  }
  throw new Error(`timed out waiting for ${what}`);
}

describe("analysis scheduler", () => {
  it("debounces a burst of keystrokes into one run of the latest text", async () => {
    const { runner, published, scheduler } = setUp();
    scheduler.update("u", 1, "a", "typing");
    scheduler.update("u", 2, "ab", "typing");
    scheduler.update("u", 3, "abc", "typing");
    await until(() => runner.runs.length > 0, "a run");
    await tick(20);
    expect(runner.runs.map((r) => r.text)).toEqual(["abc"]);
    runner.runs[0]!.finish({ kind: "done", analysis: analysisOf("abc") });
    await until(() => published.length > 0, "publication");
    expect(published.map((p) => p.version)).toEqual([3]);
    scheduler.dispose();
  });

  it("cancels the run of a text that changed, however young, and runs the new text", async () => {
    const { runner, published, scheduler } = setUp();
    scheduler.update("u", 1, "old", "full", true);
    await until(() => runner.runs.length === 1, "first run");
    scheduler.update("u", 2, "new", "full", true);
    // Cancelling costs the worker nothing: the stale run is not left to finish.
    expect(runner.runs[0]!.cancelled).toBe(true);
    await until(() => runner.runs.length === 2, "second run");
    expect(runner.runs[1]!.text).toBe("new");
    runner.runs[0]!.finish({ kind: "done", analysis: analysisOf("old") }); // too late: ignored
    runner.runs[1]!.finish({ kind: "done", analysis: analysisOf("new") });
    await until(() => published.length > 0, "publication");
    expect(published.map((p) => [p.version, p.analysis.text])).toEqual([[2, "new"]]);
    scheduler.dispose();
  });

  it("asks for the drawing of a published analysis with the options it was run with", async () => {
    const { runner, published, scheduler } = setUp({ analysisBudgetMs: 700 });
    scheduler.update("u", 1, "arm", "full", true);
    await until(() => runner.runs.length === 1, "run");
    runner.runs[0]!.finish({ kind: "done", analysis: analysisOf("arm") });
    await until(() => published.length === 1, "publication");
    await scheduler.viewModel(published[0]!.analysis, { units: "si" });
    expect(runner.views).toEqual([{ text: "arm", options: runner.runs[0]!.options }]);
    scheduler.dispose();
  });

  it("after a run hits its hard limit, still publishes the text's own findings and says why", async () => {
    const { runner, published, scheduler } = setUp({ analysisBudgetMs: 500 });
    scheduler.update("u", 1, "heavy", "full", true);
    await until(() => runner.runs.length === 1, "run");
    // The budget goes to the core; the hard stop sits beyond it.
    expect(runner.runs[0]!.options.budgetMs).toBe(500);
    expect(runner.runs[0]!.hardLimitMs).toBeGreaterThan(500);
    runner.runs[0]!.finish({ kind: "timeout" });
    await until(() => runner.runs.length === 2, "model-only run");
    expect(runner.runs[1]!.options.modelOnly).toBe(true);
    runner.runs[1]!.finish({ kind: "done", analysis: analysisOf("heavy") });
    await until(() => published.length > 0, "publication");
    expect(published[0]!.analysis.findings.map((f) => f.code)).toEqual(["analysis.budget"]);
    scheduler.dispose();
  });

  it("asks for a quick pass only while typing, and the spec's own density after a quick pass", async () => {
    const runner = new FakeRunner();
    const s: Settings = { ...DEFAULT_SETTINGS, diagnosticsDelayMs: 1, stepsWhileTyping: 9 };
    const scheduler = new AnalysisScheduler(
      runner,
      () => s,
      () => undefined,
    );
    const runsOf = (text: string) => runner.runs.filter((r) => r.text === text);
    scheduler.update("plain", 1, "plain", "full", true);
    scheduler.update("quick", 1, "quick", "full", true);
    await until(() => runner.runs.length === 2, "open runs");
    for (const r of runner.runs) expect(r.options.quickSteps).toBeUndefined();
    for (const r of runner.runs) r.finish({ kind: "done", analysis: analysisOf(r.text) });
    scheduler.update("plain", 2, "plain ", "typing");
    scheduler.update("quick", 2, "quick ", "typing");
    await until(() => runner.runs.length === 4, "typing runs");
    for (const r of runner.runs.slice(2)) expect(r.options.quickSteps).toBe(9);
    // The sweep planner ran the quick text at fewer steps than its own (sweep.quick), and the
    // plain one at its own density (the spec asks for fewer, or the budget allows all).
    runsOf("plain ")[0]!.finish({ kind: "done", analysis: analysisOf("plain ") });
    const quick = { ...analysisOf("quick "), sweep: { quick: true } as SweepResult };
    runsOf("quick ")[0]!.finish({ kind: "done", analysis: quick });
    await until(() => runsOf("quick ").length === 2, "the full run after the quick pass");
    expect(runsOf("quick ")[1]!.options.quickSteps).toBeUndefined();
    // Both idle timers started together: the plain text's would have fired by now.
    await tick(50);
    expect(runsOf("plain ")).toHaveLength(1);
    scheduler.dispose();
  });

  it("keeps the last analysis with a model for figures while the text does not build one", async () => {
    const { runner, published, scheduler } = setUp();
    scheduler.update("u", 1, "good", "full", true);
    await until(() => runner.runs.length === 1, "run");
    runner.runs[0]!.finish({ kind: "done", analysis: analysisOf("good") });
    await until(() => published.length === 1, "first publication");
    scheduler.update("u", 2, "bro", "typing");
    // While the new run is under way, the figures still come from the good one.
    expect(scheduler.current("u")).toBeUndefined();
    expect(scheduler.latest("u")?.text).toBe("good");
    await until(() => runner.runs.length === 2, "second run");
    runner.runs[1]!.finish({ kind: "done", analysis: analysisOf("bro", false) });
    await until(() => published.length === 2, "second publication");
    expect(scheduler.current("u")?.text).toBe("bro");
    expect(scheduler.latest("u")?.text).toBe("good");
    scheduler.dispose();
  });
});
