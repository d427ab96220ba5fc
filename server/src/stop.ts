// Cooperative stop of one analysis: its time budget, and a flag another thread may raise to cancel
// it (the language server's worker, so a stale run ends within milliseconds and the worker stays
// warm). Every loop whose work grows with the spec asks `pastDeadline` now and then; the first
// "yes" is remembered, so the analysis can say that its results are partial.

interface StopContext {
  /** performance.now() past which the run stops (Infinity: no budget). */
  deadline: number;
  /** Raised (non-zero at index 0) by another thread to cancel the run. */
  cancel: Int32Array | undefined;
  /** Set by the first pastDeadline that said yes. */
  stopped: boolean;
}

let active: StopContext | undefined;

/** Runs `work` with this deadline and cancel flag seen by every pastDeadline call inside it;
 * returns its value and whether anything stopped early. */
export function withStop<T>(
  deadline: number,
  cancel: Int32Array | undefined,
  work: () => T,
): { value: T; stopped: boolean } {
  const outer = active;
  const ctx: StopContext = { deadline, cancel, stopped: false };
  active = ctx;
  try {
    return { value: work(), stopped: ctx.stopped };
  } finally {
    active = outer;
  }
}

/** True once the run is cancelled or past its deadline, or past `deadline` (a phase's own). */
export function pastDeadline(deadline = Infinity): boolean {
  const ctx = active;
  let stop = false;
  if (ctx) {
    if (ctx.cancel !== undefined && Atomics.load(ctx.cancel, 0) !== 0) stop = true;
    else if (Number.isFinite(ctx.deadline) && performance.now() > ctx.deadline) stop = true;
  }
  if (!stop && Number.isFinite(deadline) && performance.now() > deadline) stop = true;
  if (stop && ctx) ctx.stopped = true;
  return stop;
}

/** True when the running analysis was cancelled (not merely out of time). */
export function cancelled(): boolean {
  const c = active?.cancel;
  return c !== undefined && Atomics.load(c, 0) !== 0;
}
