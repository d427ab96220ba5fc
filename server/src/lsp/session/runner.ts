// Runs analyses one at a time, in a worker thread when the bundled worker is present (else in
// this thread). A run that is no longer wanted (a stale text) or past its hard limit is cancelled
// cooperatively: a flag in shared memory that the analysis reads wherever it looks at its budget
// (stop.ts), so it ends within milliseconds and the worker, with its compiled code, stays warm for
// the next run. Only a worker that does not answer the flag is terminated, as a last resort.
import { existsSync } from "node:fs";
import { join } from "node:path";
import { Worker } from "node:worker_threads";
import { analyse, type Analysis, type AnalysisOptions } from "../../analysis";
import { buildViewModel, type ViewModel, type ViewOptions } from "../../view";
import type { FixJob, WorkerReply, WorkerRequest } from "./worker-protocol";
import type { TextFix } from "../../findings/fix";
import { checkedFixes } from "../../recheck";
import { AnalysisCache } from "./analysis-cache";
import { runTune, type TuneReply } from "./tune-run";

export type RunOutcome =
  | { kind: "done"; analysis: Analysis }
  | { kind: "cancelled" }
  | { kind: "timeout" }
  | { kind: "failed"; message: string };

export type ViewOutcome =
  | { kind: "done"; view: ViewModel }
  | { kind: "cancelled" }
  | { kind: "timeout" }
  | { kind: "failed"; message: string };

export type TuneOutcome =
  | { kind: "done"; tune: TuneReply }
  | { kind: "cancelled" }
  | { kind: "timeout" }
  | { kind: "failed"; message: string };

export interface TuneHandle {
  readonly outcome: Promise<TuneOutcome>;
  cancel(): void;
}

export interface RunHandle {
  readonly outcome: Promise<RunOutcome>;
  /** performance.now() when the run reached the worker, until it settles. */
  readonly started: () => number | undefined;
  cancel(): void;
}

/** Re-checks quick fixes in the same queue as the analyses. */
export interface FixChecker {
  /** The fixes of each request that survive their re-check on copies of `text` (recheck.ts),
   * found off the request thread; undefined when the job failed, was cancelled or ran past the
   * hard limit (then none is offered). */
  checkFixes(
    text: string,
    options: AnalysisOptions,
    job: FixJob,
    hardLimitMs: number,
  ): Promise<TextFix[][] | undefined>;
}

export interface AnalysisRunner {
  run(text: string, options: AnalysisOptions, hardLimitMs: number): RunHandle;
  /** The view model of `text` analysed with `options` (reusing that analysis when the worker
   * still has it), built off the request thread. */
  view(text: string, options: AnalysisOptions, view: ViewOptions, hardLimitMs: number): Promise<ViewOutcome>;
  /** The design search over the text's `tune` lines, within `budgetMs` (cooperative) and
   * `hardLimitMs`, reporting progress now and then; cancellable like a run. */
  tune?(
    text: string,
    budgetMs: number,
    hardLimitMs: number,
    onProgress: (fraction: number, message: string) => void,
  ): TuneHandle;
  dispose(): void;
}

/** After cancelling or at the hard limit, how long a worker may take to notice the flag before
 * it is terminated. The analysis looks at the flag every few milliseconds while it reads, sweeps
 * and checks; what cannot look (lexing a 1 MiB text, building its model) takes a second or two on
 * a busy machine. Common practice, no source. */
export const LAST_RESORT_MS = 5000;
/** A worker that has not loaded after this long is given up (a fault): loading takes about a
 * second on a busy machine (the bundle and the parser's grammar). Common practice, no source. */
const WORKER_LOAD_LIMIT_MS = 30_000;

type Outcome =
  | { kind: "done"; value: unknown }
  | { kind: "cancelled" }
  | { kind: "timeout" }
  | { kind: "failed"; message: string };

/** A request as queued: without its id and cancel flag, given when it is sent. */
type QueuedRequest =
  | { kind: "analyse"; text: string; options: AnalysisOptions }
  | { kind: "view"; text: string; options: AnalysisOptions; view: ViewOptions }
  | { kind: "fixes"; text: string; options: AnalysisOptions; fixes: FixJob }
  | { kind: "tune"; text: string; options: AnalysisOptions };

interface Job {
  id: number;
  request: QueuedRequest;
  hardLimitMs: number;
  startedAt?: number;
  settle: (o: Outcome) => void;
  settled: boolean;
  onProgress?: (fraction: number, message: string) => void;
}

/** Where the bundled worker sits: beside the bundle that is running (dist/). */
export function bundledWorkerPath(): string | undefined {
  const dir = typeof __dirname === "string" ? __dirname : undefined;
  if (!dir) return undefined;
  const path = join(dir, "analysis-worker.js");
  return existsSync(path) ? path : undefined;
}

export class WorkerRunner implements AnalysisRunner, FixChecker {
  private worker: Worker | undefined;
  private readonly queue: Job[] = [];
  /** The job the worker is computing, until its reply arrives (even after the job was settled
   * as cancelled or timed out: the worker is busy until it answers). */
  private busy:
    | {
        job: Job;
        cancel: Int32Array;
        timer?: ReturnType<typeof setTimeout>;
        /** Set once the flag is raised: the worker is terminated if it has not answered by then. */
        lastResort?: ReturnType<typeof setTimeout>;
        stopAsked?: boolean;
      }
    | undefined;
  /** Whether the current worker has loaded (its `ready` message), and the timer that gives up on
   * one that does not. */
  private ready = false;
  private loading: ReturnType<typeof setTimeout> | undefined;
  private nextId = 1;
  private disposed = false;
  /** Worker faults since the last good reply, and when the last one was. */
  private faults = 0;
  private lastFault = 0;
  /** Workers started, and terminated because they did not answer their cancel flag (for the log
   * and the tests: a warm worker is one that was not restarted). */
  starts = 0;
  terminations = 0;

  constructor(
    private readonly workerPath: string,
    private readonly onFault: (message: string) => void,
    /** What is worth a line in the log but is no fault (a worker restarted as a last resort). */
    private readonly onNotice: (message: string) => void = onFault,
  ) {}

  /** True while the worker keeps failing: the caller analyses in its own thread meanwhile, and
   * the worker is tried again a while after its last fault. */
  get broken(): boolean {
    return (
      this.faults >= WORKER_FAULTS_BEFORE_GIVING_UP && performance.now() - this.lastFault < WORKER_RETRY_MS
    );
  }

  run(text: string, options: AnalysisOptions, hardLimitMs: number): RunHandle {
    const { job, outcome } = this.enqueue({ kind: "analyse", text, options }, hardLimitMs);
    return {
      outcome: outcome.then((o) => (o.kind === "done" ? { kind: "done", analysis: o.value as Analysis } : o)),
      started: () => job.startedAt,
      cancel: () => this.cancel(job),
    };
  }

  view(text: string, options: AnalysisOptions, view: ViewOptions, hardLimitMs: number): Promise<ViewOutcome> {
    const { outcome } = this.enqueue({ kind: "view", text, options, view }, hardLimitMs);
    return outcome.then((o) => (o.kind === "done" ? { kind: "done", view: o.value as ViewModel } : o));
  }

  checkFixes(
    text: string,
    options: AnalysisOptions,
    fixes: FixJob,
    hardLimitMs: number,
  ): Promise<TextFix[][] | undefined> {
    const { outcome } = this.enqueue({ kind: "fixes", text, options, fixes }, hardLimitMs);
    return outcome.then((o) => (o.kind === "done" ? (o.value as TextFix[][]) : undefined));
  }

  tune(
    text: string,
    budgetMs: number,
    hardLimitMs: number,
    onProgress: (fraction: number, message: string) => void,
  ): TuneHandle {
    const { job, outcome } = this.enqueue({ kind: "tune", text, options: { budgetMs } }, hardLimitMs);
    job.onProgress = onProgress;
    return {
      outcome: outcome.then((o) => (o.kind === "done" ? { kind: "done", tune: o.value as TuneReply } : o)),
      cancel: () => this.cancel(job),
    };
  }

  /** Starts the worker now, so that it has loaded by the time the first document arrives. */
  warm(): void {
    try {
      this.ensureWorker();
    } catch {
      // reported when a run needs it
    }
  }

  dispose(): void {
    this.disposed = true;
    if (this.loading) clearTimeout(this.loading);
    for (const job of [...this.queue]) this.settle(job, { kind: "cancelled" });
    if (this.busy) this.settle(this.busy.job, { kind: "cancelled" });
    this.clearBusy();
    void this.worker?.terminate();
    this.worker = undefined;
  }

  private enqueue(request: Job["request"], hardLimitMs: number): { job: Job; outcome: Promise<Outcome> } {
    let settle!: (o: Outcome) => void;
    const outcome = new Promise<Outcome>((resolve) => (settle = resolve));
    const job: Job = { id: this.nextId++, request, hardLimitMs, settle, settled: false };
    this.queue.push(job);
    this.pump();
    return { job, outcome };
  }

  private ensureWorker(): Worker {
    if (this.worker) return this.worker;
    const worker = new Worker(this.workerPath);
    this.starts++;
    this.ready = false;
    if (this.loading) clearTimeout(this.loading);
    this.loading = setTimeout(() => {
      if (this.worker !== worker || this.ready) return;
      this.fault(`analysis worker did not load within ${WORKER_LOAD_LIMIT_MS} ms`);
      this.lose(worker, "the analysis worker did not load");
    }, WORKER_LOAD_LIMIT_MS);
    worker.on("message", (reply: WorkerReply) => this.onReply(worker, reply));
    worker.on("error", (err) => {
      this.fault(`analysis worker error: ${err instanceof Error ? err.message : String(err)}`);
      this.lose(worker, String(err));
    });
    worker.on("exit", () => this.lose(worker, "the analysis worker stopped"));
    this.worker = worker;
    return worker;
  }

  private fault(message: string): void {
    this.faults++;
    this.lastFault = performance.now();
    this.onFault(message);
  }

  /** The worker is gone: its job fails, the next starts a new one. */
  private lose(worker: Worker, message: string): void {
    if (this.worker !== worker) return;
    this.worker = undefined;
    const busy = this.busy;
    this.clearBusy();
    if (busy) this.settle(busy.job, { kind: "failed", message });
    void worker.terminate();
    this.pump();
  }

  private pump(): void {
    if (this.disposed || this.busy) return;
    const job = this.queue.shift();
    if (!job) return;
    job.startedAt = performance.now();
    const cancel = new Int32Array(new SharedArrayBuffer(4));
    this.busy = { job, cancel };
    // At the hard limit the run is stopped like a cancelled one; its caller hears "timeout" now.
    this.busy.timer = setTimeout(() => {
      this.settle(job, { kind: "timeout" });
      this.stopBusy(job);
    }, job.hardLimitMs);
    try {
      const request = { ...job.request, id: job.id, cancel } as WorkerRequest;
      this.ensureWorker().postMessage(request);
    } catch (err) {
      // A host that refuses worker threads: no use trying again before the retry time.
      this.faults = WORKER_FAULTS_BEFORE_GIVING_UP - 1;
      this.fault(`analysis worker could not start: ${err instanceof Error ? err.message : String(err)}`);
      this.clearBusy();
      this.settle(job, { kind: "failed", message: String(err) });
      setImmediate(() => this.pump());
    }
  }

  private cancel(job: Job): void {
    if (job.settled) return;
    this.settle(job, { kind: "cancelled" });
    const queued = this.queue.indexOf(job);
    if (queued >= 0) this.queue.splice(queued, 1);
    else this.stopBusy(job);
  }

  /** Raises the running job's cancel flag; terminates the worker if it does not answer soon
   * (counted from when it has loaded: a worker still loading cannot look at the flag yet). */
  private stopBusy(job: Job): void {
    const busy = this.busy;
    if (!busy || busy.job !== job) return;
    Atomics.store(busy.cancel, 0, 1);
    busy.stopAsked = true;
    this.armLastResort();
  }

  private armLastResort(): void {
    const busy = this.busy;
    if (!busy?.stopAsked || busy.lastResort || !this.ready) return;
    busy.lastResort = setTimeout(() => {
      if (this.busy !== busy || !this.worker) return;
      this.terminations++;
      this.onNotice(`analysis worker did not stop within ${LAST_RESORT_MS} ms of being asked: restarted`);
      const worker = this.worker;
      this.worker = undefined;
      this.clearBusy();
      void worker.terminate();
      this.pump();
    }, LAST_RESORT_MS);
  }

  private onReply(worker: Worker, reply: WorkerReply): void {
    if ("ready" in reply) {
      if (worker !== this.worker) return;
      this.ready = true;
      if (this.loading) clearTimeout(this.loading);
      this.armLastResort();
      return;
    }
    const busy = this.busy;
    if (worker !== this.worker || !busy || busy.job.id !== reply.id) return;
    if ("progress" in reply) {
      if (!busy.job.settled) busy.job.onProgress?.(reply.progress, reply.message);
      return;
    }
    this.faults = 0;
    this.clearBusy();
    const job = busy.job;
    if ("error" in reply) this.settle(job, { kind: "failed", message: reply.error });
    else
      this.settle(job, {
        kind: "done",
        value:
          "analysis" in reply
            ? reply.analysis
            : "view" in reply
              ? reply.view
              : "tune" in reply
                ? reply.tune
                : reply.fixes,
      });
    this.pump();
  }

  private clearBusy(): void {
    if (this.busy?.timer) clearTimeout(this.busy.timer);
    if (this.busy?.lastResort) clearTimeout(this.busy.lastResort);
    this.busy = undefined;
  }

  private settle(job: Job, outcome: Outcome): void {
    if (job.settled) return;
    job.settled = true;
    job.settle(outcome);
  }
}

/** How long one run in the server's own thread may take, ms, whatever the budget setting: while it
 * runs no request is answered. The run stops cooperatively at it (stop.ts), like the worker at its
 * flag; the phases that cannot stop midway are bounded by the size limits (limits.ts). Common
 * practice, no source: about the longest pause a hover may take. */
export const IN_THREAD_LIMIT_MS = 1000;

/** Runs in this thread, one at a time (the fallback, and the tests of the sources). */
export class InThreadRunner implements AnalysisRunner, FixChecker {
  private readonly cache = new AnalysisCache();

  run(text: string, options: AnalysisOptions, hardLimitMs: number): RunHandle {
    let cancelled = false;
    let startedAt: number | undefined;
    const outcome = new Promise<RunOutcome>((resolve) => {
      setImmediate(() => {
        if (cancelled) return resolve({ kind: "cancelled" });
        startedAt = performance.now();
        try {
          const analysis = analyse(text, this.bounded(options, hardLimitMs));
          this.cache.put(text, options, analysis);
          resolve({ kind: "done", analysis });
        } catch (err) {
          resolve({ kind: "failed", message: String(err) });
        }
      });
    });
    return { outcome, started: () => startedAt, cancel: () => (cancelled = true) };
  }

  view(text: string, options: AnalysisOptions, view: ViewOptions, hardLimitMs: number): Promise<ViewOutcome> {
    return new Promise((resolve) =>
      setImmediate(() => {
        try {
          const analysis = this.cache.get(text, options) ?? analyse(text, this.bounded(options, hardLimitMs));
          resolve({ kind: "done", view: buildViewModel(analysis, view) });
        } catch (err) {
          resolve({ kind: "failed", message: String(err) });
        }
      }),
    );
  }

  /** Without a worker the re-checks run here, each analysis within the in-thread limit. */
  checkFixes(
    text: string,
    options: AnalysisOptions,
    fixes: FixJob,
    hardLimitMs: number,
  ): Promise<TextFix[][] | undefined> {
    return new Promise((resolve) =>
      setImmediate(() => {
        try {
          const current = this.cache.get(text, options);
          resolve(
            checkedFixes(text, fixes.requests, {
              budgetMs: Math.min(fixes.budgetMs, hardLimitMs, IN_THREAD_LIMIT_MS),
              ...(current ? { current } : {}),
            }),
          );
        } catch {
          resolve(undefined);
        }
      }),
    );
  }

  tune(
    text: string,
    budgetMs: number,
    hardLimitMs: number,
    onProgress: (fraction: number, message: string) => void,
  ): TuneHandle {
    // In this thread nothing else is answered while it runs: the in-thread limit holds.
    const cancel = new Int32Array(new SharedArrayBuffer(4));
    const outcome = new Promise<TuneOutcome>((resolve) =>
      setImmediate(() => {
        if (Atomics.load(cancel, 0) !== 0) return resolve({ kind: "cancelled" });
        try {
          const budget = Math.min(budgetMs, hardLimitMs, IN_THREAD_LIMIT_MS);
          const tune = runTune(text, budget, cancel, onProgress);
          resolve(tune.cancelled ? { kind: "cancelled" } : { kind: "done", tune });
        } catch (err) {
          resolve({ kind: "failed", message: String(err) });
        }
      }),
    );
    return { outcome, cancel: () => Atomics.store(cancel, 0, 1) };
  }

  /** The run's budget within the in-thread limit and its own hard limit. */
  private bounded(options: AnalysisOptions, hardLimitMs: number): AnalysisOptions {
    return { ...options, budgetMs: Math.min(options.budgetMs ?? Infinity, hardLimitMs, IN_THREAD_LIMIT_MS) };
  }

  dispose(): void {}
}

/** Consecutive worker faults after which analysis moves into the server's own thread (slower
 * answers while a sweep runs, but answers). Common practice, no source. */
const WORKER_FAULTS_BEFORE_GIVING_UP = 3;
/** After that, the worker is tried again this long after its last fault. Common practice, no
 * source. */
const WORKER_RETRY_MS = 60_000;

/** The worker while it works; the server's own thread while the worker keeps failing. */
export class FallbackRunner implements AnalysisRunner, FixChecker {
  private readonly inThread = new InThreadRunner();
  private said = false;
  constructor(
    private readonly worker: WorkerRunner,
    private readonly onFault: (message: string) => void,
  ) {}

  run(text: string, options: AnalysisOptions, hardLimitMs: number): RunHandle {
    if (this.useThread()) return this.inThread.run(text, options, hardLimitMs);
    // A run the worker fails at the fault that gives it up is run again here at once, so the
    // editor sees no failure for it.
    const first = this.worker.run(text, options, hardLimitMs);
    let again: RunHandle | undefined;
    let cancelled = false;
    const outcome = first.outcome.then((o) => {
      if (o.kind !== "failed" || cancelled || !this.useThread()) return o;
      again = this.inThread.run(text, options, hardLimitMs);
      return again.outcome;
    });
    return {
      outcome,
      started: () => again?.started() ?? first.started(),
      cancel: () => {
        cancelled = true;
        first.cancel();
        again?.cancel();
      },
    };
  }

  view(text: string, options: AnalysisOptions, view: ViewOptions, hardLimitMs: number): Promise<ViewOutcome> {
    if (!this.useThread()) return this.worker.view(text, options, view, hardLimitMs);
    return this.inThread.view(text, options, view, hardLimitMs);
  }

  checkFixes(
    text: string,
    options: AnalysisOptions,
    fixes: FixJob,
    hardLimitMs: number,
  ): Promise<TextFix[][] | undefined> {
    return this.useThread()
      ? this.inThread.checkFixes(text, options, fixes, hardLimitMs)
      : this.worker.checkFixes(text, options, fixes, hardLimitMs);
  }

  tune(
    text: string,
    budgetMs: number,
    hardLimitMs: number,
    onProgress: (fraction: number, message: string) => void,
  ): TuneHandle {
    if (!this.useThread()) return this.worker.tune(text, budgetMs, hardLimitMs, onProgress);
    return this.inThread.tune(text, budgetMs, hardLimitMs, onProgress);
  }

  private useThread(): boolean {
    if (!this.worker.broken) {
      this.said = false;
      return false;
    }
    if (!this.said)
      this.onFault(
        `analysis worker keeps failing: analysing in the server's own thread, at most ${IN_THREAD_LIMIT_MS} ms a run, until it is tried again`,
      );
    this.said = true;
    return true;
  }

  dispose(): void {
    this.worker.dispose();
  }
}

export function createRunner(
  onFault: (message: string) => void,
  onNotice: (message: string) => void = onFault,
): AnalysisRunner & FixChecker {
  const path = bundledWorkerPath();
  if (!path) return new InThreadRunner();
  const worker = new WorkerRunner(path, onFault, onNotice);
  worker.warm();
  return new FallbackRunner(worker, onFault);
}
