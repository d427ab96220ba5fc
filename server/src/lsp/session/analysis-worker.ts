// The analysis worker: runs the core's analyse() off the server's request path, so hover and
// completion stay responsive while a heavy sweep runs; builds the drawing panel's view model
// from the analysis it just made; and re-checks quick fixes on copies of the text (recheck.ts).
// Bundled to dist/analysis-worker.js. Each request brings a cancel flag in shared memory that the
// server raises when the run is no longer wanted (stop.ts).
import { parentPort } from "node:worker_threads";
import { analyse } from "../../analysis";
import { buildViewModel } from "../../view";
import { AnalysisCache } from "./analysis-cache";
import { serverCopy } from "./server-copy";
import { checkedFixes } from "../../recheck";
import type { WorkerRequest, WorkerReply } from "./worker-protocol";
import { runTune } from "./tune-run";

const cache = new AnalysisCache();

function answer(request: WorkerRequest): WorkerReply {
  if (request.kind === "tune") {
    let shown = -1;
    const reply = runTune(
      request.text,
      request.options.budgetMs ?? 60_000,
      request.cancel,
      (fraction, message) => {
        // A message a percent, at most: the server forwards each one to the editor.
        const step = Math.floor(fraction * 100);
        if (step === shown) return;
        shown = step;
        parentPort?.postMessage({ id: request.id, progress: fraction, message } satisfies WorkerReply);
      },
    );
    return { id: request.id, tune: reply };
  }
  const options = { ...request.options, cancel: request.cancel };
  if (request.kind === "fixes") {
    const current = cache.get(request.text, request.options);
    const fixes = checkedFixes(request.text, request.fixes.requests, {
      budgetMs: request.fixes.budgetMs,
      cancel: request.cancel,
      ...(current ? { current } : {}),
    });
    return { id: request.id, fixes };
  }
  let analysis = cache.get(request.text, request.options);
  if (!analysis) {
    analysis = analyse(request.text, options);
    // A cancelled run's results are partial and nobody reads them: not kept.
    if (Atomics.load(request.cancel, 0) === 0) cache.put(request.text, request.options, analysis);
  }
  if (request.kind === "view") return { id: request.id, view: buildViewModel(analysis, request.view) };
  return { id: request.id, analysis: serverCopy(analysis) };
}

parentPort?.postMessage({ ready: true } satisfies WorkerReply);

parentPort?.on("message", (request: WorkerRequest) => {
  let reply: WorkerReply;
  try {
    reply = answer(request);
  } catch (err) {
    reply = { id: request.id, error: err instanceof Error ? (err.stack ?? err.message) : String(err) };
  }
  try {
    parentPort!.postMessage(reply);
  } catch {
    // Something in the result cannot be structured-cloned: send a JSON copy instead.
    parentPort!.postMessage(JSON.parse(JSON.stringify(reply)) as WorkerReply);
  }
});
