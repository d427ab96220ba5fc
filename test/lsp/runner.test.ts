// The analysis runner over the real bundled worker: a run returns the core's analysis, a cancelled
// or over-long run stops (and the next run gets a fresh worker), and a worker that cannot start
// hands the work to the server's own thread.
import { beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { FallbackRunner, WorkerRunner } from "../../server/src/lsp/session/runner";
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

  it("stops a cancelled run and a run past its hard limit, then runs again", async () => {
    const runner = new WorkerRunner(WORKER, () => undefined);
    const cancelled = runner.run(HEAVY, {}, 60_000);
    const queued = runner.run(CAMERA, {}, 60_000);
    cancelled.cancel();
    expect((await cancelled.outcome).kind).toBe("cancelled");
    expect((await queued.outcome).kind).toBe("done");
    const timedOut = await runner.run(HEAVY, {}, 50).outcome;
    expect(timedOut.kind).toBe("timeout");
    expect((await runner.run(CAMERA, {}, 60_000).outcome).kind).toBe("done");
    runner.dispose();
  });

  it("analyses in this thread once the worker keeps failing", async () => {
    const dir = mkdtempSync(join(tmpdir(), "poise-worker-"));
    const broken = join(dir, "broken-worker.js");
    writeFileSync(broken, 'throw new Error("cannot start");\n');
    const faults: string[] = [];
    const runner = new FallbackRunner(new WorkerRunner(broken, (m) => faults.push(m)), (m) => faults.push(m));
    for (let i = 0; i < 3; i++) expect((await runner.run(CAMERA, {}, 10_000).outcome).kind).toBe("failed");
    const fallback = await runner.run(CAMERA, {}, 10_000).outcome;
    expect(fallback.kind).toBe("done");
    expect(faults.some((f) => f.includes("own thread"))).toBe(true);
    runner.dispose();
  });
});
