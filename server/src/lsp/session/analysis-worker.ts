// The analysis worker: runs the core's analyse() off the server's request path, so hover and
// completion stay responsive while a heavy sweep runs. Bundled to dist/analysis-worker.js.
import { parentPort } from "node:worker_threads";
import { analyse } from "../../analysis";
import type { WorkerRequest, WorkerReply } from "./worker-protocol";

parentPort?.on("message", (request: WorkerRequest) => {
  let reply: WorkerReply;
  try {
    reply = { id: request.id, analysis: analyse(request.text, request.options) };
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
