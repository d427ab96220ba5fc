// The analysis runner over the real bundled worker: a run returns the core's analysis; a cancelled
// or over-long run stops at its cancel flag and the same worker, warm, takes the next run (issue
// 10, item 9); a worker that ignores the flag is terminated as a last resort; a worker that cannot
// start hands the work to the server's own thread, which keeps a stop of its own (issue 16, 7).
import { beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import {
  FallbackRunner,
  IN_THREAD_LIMIT_MS,
  LAST_RESORT_MS,
  WorkerRunner,
} from "../../server/src/lsp/session/runner";
import { analyse } from "../../server/src/analysis";
import { ROOT, ensureBuilt } from "./protocol-client";

const WORKER = join(ROOT, "dist", "analysis-worker.js");
const CAMERA = readFileSync(join(ROOT, "samples", "camera-arm.poise"), "utf8");
const HEAVY = readFileSync(join(ROOT, "samples", "engraver-arm.poise"), "utf8").replace(
  /steps \d+/,
  "steps 2001",
);

beforeAll(() => ensureBuilt());

describe("analysis runner", () => {
  it("returns the same findings as the core run in this thread", async () => {
    const runner = new WorkerRunner(WORKER, () => undefined);
    const outcome = await runner.run(CAMERA, {}, 30_000).outcome;
    runner.dispose();
    expect(outcome.kind).toBe("done");
    if (outcome.kind !== "done") return;
    const here = analyse(CAMERA);
    expect(outcome.analysis.findings.map((f) => [f.code, f.span.start])).toEqual(
      here.findings.map((f) => [f.code, f.span.start]),
    );
    expect(outcome.analysis.sweep?.poses.length).toBe(here.sweep?.poses.length);
  });

  it("stops a cancelled run and a run past its hard limit through their flags, keeping the worker", async () => {
    const runner = new WorkerRunner(WORKER, () => undefined);
    const cancelled = runner.run(HEAVY, {}, 60_000);
    const queued = runner.run(CAMERA, {}, 60_000);
    // cancelled once it is under way in the worker
    while (cancelled.started() === undefined) await new Promise((r) => setImmediate(r));
    cancelled.cancel();
    expect((await cancelled.outcome).kind).toBe("cancelled");
    expect((await queued.outcome).kind).toBe("done");
    const timedOut = await runner.run(HEAVY, {}, 50).outcome;
    expect(timedOut.kind).toBe("timeout");
    expect((await runner.run(CAMERA, {}, 60_000).outcome).kind).toBe("done");
    // One worker did all of it: nothing was terminated, nothing started cold.
    expect(runner.starts).toBe(1);
    expect(runner.terminations).toBe(0);
    runner.dispose();
  }, 120_000);

  it("terminates, as a last resort, a worker that does not answer its flag", async () => {
    const dir = mkdtempSync(join(tmpdir(), "poise-worker-"));
    const deaf = join(dir, "deaf-worker.js");
    // a worker that never looks at its flag (the real one looks every few milliseconds)
    writeFileSync(
      deaf,
      'const { parentPort } = require("node:worker_threads");\nparentPort.postMessage({ ready: true });\nparentPort.on("message", () => { for (;;) {} });\n',
    );
    const faults: string[] = [];
    const runner = new WorkerRunner(deaf, (m) => faults.push(m));
    expect((await runner.run(CAMERA, {}, 50).outcome).kind).toBe("timeout");
    const next = runner.run(CAMERA, {}, 50);
    expect((await next.outcome).kind).toBe("timeout");
    expect(runner.terminations).toBeGreaterThanOrEqual(1);
    expect(faults.some((f) => f.includes(`within ${LAST_RESORT_MS} ms`))).toBe(true);
    runner.dispose();
  }, 60_000);

  it("builds the drawing's view model in the worker, from the analysis it made", async () => {
    const runner = new WorkerRunner(WORKER, () => undefined);
    const analysed = await runner.run(CAMERA, { budgetMs: 30_000 }, 60_000).outcome;
    const view = await runner.view(CAMERA, { budgetMs: 30_000 }, { units: "si" }, 60_000);
    runner.dispose();
    expect(analysed.kind).toBe("done");
    expect(view.kind).toBe("done");
    if (view.kind !== "done" || analysed.kind !== "done") return;
    expect(view.view.title).toBe(analysed.analysis.model?.title);
    expect(view.view.poses.length).toBe(analysed.analysis.sweep?.poses.length);
  }, 60_000);

  it("analyses in this thread once the worker keeps failing", async () => {
    const dir = mkdtempSync(join(tmpdir(), "poise-worker-"));
    const broken = join(dir, "broken-worker.js");
    writeFileSync(broken, 'throw new Error("cannot start");\n');
    const faults: string[] = [];
    const runner = new FallbackRunner(new WorkerRunner(broken, (m) => faults.push(m)), (m) => faults.push(m));
    // The runs the worker fails before it is given up fail; the one that gives it up is run here.
    let outcome = await runner.run(CAMERA, {}, 10_000).outcome;
    for (let i = 0; i < 3 && outcome.kind === "failed"; i++)
      outcome = await runner.run(CAMERA, {}, 10_000).outcome;
    expect(outcome.kind).toBe("done");
    expect(faults.some((f) => f.includes("own thread"))).toBe(true);
    // In this thread a run keeps a stop: the heavy grid stops at the in-thread limit, whatever the
    // budget asked, and says its results are partial.
    const heavy = await runner.run(HEAVY, { budgetMs: 60_000 }, 62_000).outcome;
    expect(heavy.kind).toBe("done");
    if (heavy.kind === "done") {
      const budget = heavy.analysis.findings.filter((f) => f.code === "analysis.budget");
      expect(budget.length, `stopped at ${IN_THREAD_LIMIT_MS} ms`).toBeGreaterThan(0);
    }
    runner.dispose();
  }, 60_000);
});
