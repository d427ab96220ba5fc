// Runs analyses one at a time, in a worker thread when the bundled worker is present (else in
// this thread). A run can be cancelled (a stale text) or stopped at a hard time limit: both
// terminate the worker, which is restarted for the next run.
import { existsSync } from "node:fs";
import { join } from "node:path";
import { Worker } from "node:worker_threads";
import { analyse, type Analysis, type AnalysisOptions } from "../../analysis";
import type { WorkerReply, WorkerRequest } from "./worker-protocol";

export type RunOutcome =
  | { kind: "done"; analysis: Analysis }
  | { kind: "cancelled" }
  | { kind: "timeout" }
  | { kind: "failed"; message: string };

export interface RunHandle {
  readonly outcome: Promise<RunOutcome>;
  /** True from the moment the run reached the worker until it settles. */
  readonly started: () => number | undefined;
  cancel(): void;
}

export interface AnalysisRunner {
  run(text: string, options: AnalysisOptions, hardLimitMs: number): RunHandle;
  dispose(): void;
}

interface Job {
  id: number;
  text: string;
  options: AnalysisOptions;
  hardLimitMs: number;
  startedAt?: number;
  timer?: ReturnType<typeof setTimeout>;
  settle: (o: RunOutcome) => void;
  settled: boolean;
}

/** Where the bundled worker sits: beside the bundle that is running (dist/). */
export function bundledWorkerPath(): string | undefined {
  const dir = typeof __dirname === "string" ? __dirname : undefined;
  if (!dir) return undefined;
  const path = join(dir, "analysis-worker.js");
  return existsSync(path) ? path : undefined;
}

export class WorkerRunner implements AnalysisRunner {
  private worker: Worker | undefined;
  private readonly queue: Job[] = [];
  private current: Job | undefined;
  private nextId = 1;
  private disposed = false;
  /** Worker faults since the last good reply (a worker that cannot even start keeps failing). */
  private faults = 0;

  /** True once the worker has failed again and again: the caller should analyse in-thread. */
  get broken(): boolean {
    return this.faults >= WORKER_FAULTS_BEFORE_GIVING_UP;
  }

  constructor(
    private readonly workerPath: string,
    private readonly onFault: (message: string) => void,
  ) {}

  run(text: string, options: AnalysisOptions, hardLimitMs: number): RunHandle {
    let settle!: (o: RunOutcome) => void;
    const outcome = new Promise<RunOutcome>((resolve) => (settle = resolve));
    const job: Job = { id: this.nextId++, text, options, hardLimitMs, settle, settled: false };
    this.queue.push(job);
    this.pump();
    return {
      outcome,
      started: () => job.startedAt,
      cancel: () => this.finish(job, { kind: "cancelled" }, true),
    };
  }

  dispose(): void {
    this.disposed = true;
    for (const job of [...this.queue]) this.finish(job, { kind: "cancelled" }, false);
    if (this.current) this.finish(this.current, { kind: "cancelled" }, true);
    void this.worker?.terminate();
    this.worker = undefined;
  }

  private ensureWorker(): Worker {
    if (this.worker) return this.worker;
    const worker = new Worker(this.workerPath);
    worker.on("message", (reply: WorkerReply) => this.onReply(reply));
    worker.on("error", (err) => {
      this.faults++;
      this.onFault(`analysis worker error: ${err instanceof Error ? err.message : String(err)}`);
      this.dropWorker(worker);
      if (this.current) this.finish(this.current, { kind: "failed", message: String(err) }, false);
    });
    worker.on("exit", () => {
      if (this.worker !== worker) return;
      this.worker = undefined;
      if (this.current)
        this.finish(this.current, { kind: "failed", message: "the analysis worker stopped" }, false);
    });
    this.worker = worker;
    return worker;
  }

  private dropWorker(worker: Worker): void {
    if (this.worker === worker) this.worker = undefined;
    void worker.terminate();
  }

  private pump(): void {
    if (this.disposed || this.current) return;
    const job = this.queue.shift();
    if (!job) return;
    this.current = job;
    job.startedAt = performance.now();
    job.timer = setTimeout(() => this.finish(job, { kind: "timeout" }, true), job.hardLimitMs);
    const request: WorkerRequest = { id: job.id, text: job.text, options: job.options };
    try {
      this.ensureWorker().postMessage(request);
    } catch (err) {
      this.finish(job, { kind: "failed", message: String(err) }, true);
    }
  }

  private onReply(reply: WorkerReply): void {
    const job = this.current;
    if (!job || job.id !== reply.id) return; // a reply for a run already given up on
    this.faults = 0;
    this.finish(
      job,
      "analysis" in reply
        ? { kind: "done", analysis: reply.analysis }
        : { kind: "failed", message: reply.error },
      false,
    );
  }

  /** Settles a job once; a job stopped while running takes the worker down with it. */
  private finish(job: Job, outcome: RunOutcome, stopWorker: boolean): void {
    if (job.settled) return;
    job.settled = true;
    if (job.timer) clearTimeout(job.timer);
    const queued = this.queue.indexOf(job);
    if (queued >= 0) this.queue.splice(queued, 1);
    if (this.current === job) {
      this.current = undefined;
      if (stopWorker && this.worker) this.dropWorker(this.worker);
      setImmediate(() => this.pump());
    }
    job.settle(outcome);
  }
}

/** Fallback without a bundled worker (tests of the sources): runs in this thread, one at a time. */
export class InThreadRunner implements AnalysisRunner {
  run(text: string, options: AnalysisOptions): RunHandle {
    let cancelled = false;
    let startedAt: number | undefined;
    const outcome = new Promise<RunOutcome>((resolve) => {
      setImmediate(() => {
        if (cancelled) return resolve({ kind: "cancelled" });
        startedAt = performance.now();
        try {
          resolve({ kind: "done", analysis: analyse(text, options) });
        } catch (err) {
          resolve({ kind: "failed", message: String(err) });
        }
      });
    });
    return { outcome, started: () => startedAt, cancel: () => (cancelled = true) };
  }

  dispose(): void {}
}

/** Consecutive worker faults after which analysis moves into the server's own thread (slower
 * answers while a sweep runs, but answers). Common practice, no source. */
const WORKER_FAULTS_BEFORE_GIVING_UP = 3;

/** The worker while it works; the server's own thread once the worker keeps failing. */
export class FallbackRunner implements AnalysisRunner {
  private readonly inThread = new InThreadRunner();
  private said = false;
  constructor(
    private readonly worker: WorkerRunner,
    private readonly onFault: (message: string) => void,
  ) {}

  run(text: string, options: AnalysisOptions, hardLimitMs: number): RunHandle {
    if (!this.worker.broken) return this.worker.run(text, options, hardLimitMs);
    if (!this.said) this.onFault("analysis worker keeps failing: analysing in the server's own thread");
    this.said = true;
    return this.inThread.run(text, options);
  }

  dispose(): void {
    this.worker.dispose();
  }
}

export function createRunner(onFault: (message: string) => void): AnalysisRunner {
  const path = bundledWorkerPath();
  return path ? new FallbackRunner(new WorkerRunner(path, onFault), onFault) : new InThreadRunner();
}
