// Latency through the protocol: spawns the bundled server (dist/server.js) over stdio, types into
// each sample and into a generated 60-body spec, and times keystroke (didChange) to
// publishDiagnostics; then watches the server's memory across 1,000 edits. Prints against the
// targets; asserts nothing (timings belong in a benchmark, not in the test suite).
import { existsSync, readFileSync, readdirSync } from "node:fs";
import { join } from "node:path";
import { ServerSession } from "../test/fuzz/lsp-client";
import { chainSpec } from "../test/fuzz/big-spec";

/** Targets of the robustness issue: a typical spec answers within 50 ms at the 95th percentile,
 * a 60-body one within 500 ms, and memory does not grow with edits. */
export const LATENCY_TARGETS = { typicalP95Ms: 50, largeP95Ms: 500 } as const;
/** Growth of resident memory over 1,000 edits still read as "no growth": V8 grows its heap in
 * steps and returns it lazily, so a few MB either way is noise. Common practice, no source. */
const MEMORY_NOISE_KB = 16 * 1024;
/** Keystrokes timed per document. */
const KEYSTROKES = 60;
const LARGE_KEYSTROKES = 20;
const MEMORY_EDITS = 1000;
/** Longest wait for one publish before the keystroke counts as lost. */
const PUBLISH_TIMEOUT_MS = 30_000;

function findRoot(): string {
  for (const dir of [join(__dirname, ".."), process.cwd()]) if (existsSync(join(dir, "samples"))) return dir;
  return process.cwd();
}

function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return NaN;
  const i = Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1));
  return sorted[i]!;
}

/** The text after the k-th keystroke: the first number of the last `mass` line gets a different
 * last digit each time (so every keystroke changes what the analysis sees), or, without one, a
 * trailing comment grows. */
function keystroke(base: string, k: number): string {
  const re = /(mass\s+)(\d+(?:\.\d+)?)/g;
  let last: RegExpExecArray | null = null;
  for (let m = re.exec(base); m; m = re.exec(base)) last = m;
  if (!last) return `${base}# ${"x".repeat(k % 7)}\n`;
  const digits = last[2]!;
  const changed = digits.slice(0, -1) + String((Number(digits.slice(-1)) + 1 + (k % 8)) % 10);
  const at = last.index + last[1]!.length;
  return base.slice(0, at) + changed + base.slice(at + digits.length);
}

interface Timing {
  name: string;
  p50: number;
  p95: number;
  max: number;
  lost: number;
  firstMs: number;
}

async function timeDocument(
  session: ServerSession,
  name: string,
  text: string,
  strokes: number,
): Promise<Timing> {
  const uri = `file:///bench/${name}`;
  let version = 1;
  const t0 = performance.now();
  await session.open(uri, text, version);
  const first = await session.waitForDiagnostics(uri, version, PUBLISH_TIMEOUT_MS);
  const firstMs = first ? first.at - t0 : NaN;
  const times: number[] = [];
  let lost = 0;
  for (let k = 0; k < strokes; k++) {
    version++;
    const sent = performance.now();
    const wait = session.waitForDiagnostics(uri, version, PUBLISH_TIMEOUT_MS);
    await session.change(uri, version, keystroke(text, k));
    const p = await wait;
    if (p) times.push(p.at - sent);
    else lost++;
  }
  await session.close(uri);
  times.sort((a, b) => a - b);
  return {
    name,
    p50: percentile(times, 50),
    p95: percentile(times, 95),
    max: times[times.length - 1] ?? NaN,
    lost,
    firstMs,
  };
}

/** Resident memory (kB) sampled every 100 edits across MEMORY_EDITS edits, after a warm-up. */
async function memoryAcrossEdits(session: ServerSession, text: string): Promise<number[] | undefined> {
  const uri = "file:///bench/memory.poise";
  let version = 1;
  await session.open(uri, text, version);
  await session.waitForDiagnostics(uri, version, PUBLISH_TIMEOUT_MS);
  const typeOnce = async (k: number) => {
    version++;
    const wait = session.waitForDiagnostics(uri, version, PUBLISH_TIMEOUT_MS);
    await session.change(uri, version, keystroke(text, k));
    await wait;
  };
  // Warm up first so the baseline includes the JIT's code and the worker.
  for (let k = 0; k < 50; k++) await typeOnce(k);
  const samples: number[] = [];
  for (let k = 0; k <= MEMORY_EDITS; k++) {
    if (k % 100 === 0) {
      const m = session.memoryKb();
      if (!m) return undefined;
      samples.push(m.rss);
    }
    if (k < MEMORY_EDITS) await typeOnce(k);
  }
  await session.close(uri);
  return samples;
}

const fmt = (ms: number) => (Number.isFinite(ms) ? `${ms.toFixed(1)} ms` : "—");

/** The benchmark section: prints a table; resolves to whether every target was met (false also
 * when the server could not be run). */
export async function runLatencyBench(log: (line: string) => void = console.log): Promise<boolean> {
  const root = findRoot();
  const serverPath =
    process.env.COUNTERPOISE_SERVER ??
    [join(__dirname, "server.js"), join(root, "dist", "server.js")].find((p) => existsSync(p));
  if (!serverPath || !existsSync(serverPath)) {
    log("latency: dist/server.js is missing (run `npm run build`); section skipped");
    return false;
  }
  // No debounce: the figure is the server's own latency; the editor adds its configured pause.
  const session = new ServerSession({ serverPath, settings: { diagnosticsDelayMs: 0 } });
  try {
    await session.initialize();
    const samplesDir = join(root, "samples");
    const samples = readdirSync(samplesDir)
      .filter((f) => f.endsWith(".poise"))
      .sort();
    log(`latency: keystroke -> publishDiagnostics over stdio (${KEYSTROKES} keystrokes each, no debounce)`);
    log("  document                       first      p50        p95        max        lost  target p95");
    let met = true;
    const row = (t: Timing, target: number) => {
      const ok = t.p95 <= target && t.lost === 0;
      met &&= ok;
      log(
        `  ${t.name.padEnd(28)} ${fmt(t.firstMs).padEnd(10)} ${fmt(t.p50).padEnd(10)} ${fmt(t.p95).padEnd(10)} ${fmt(t.max).padEnd(10)} ${String(t.lost).padEnd(5)} ${target} ms ${ok ? "ok" : "MISSED"}`,
      );
    };
    for (const f of samples)
      row(
        await timeDocument(session, f, readFileSync(join(samplesDir, f), "utf8"), KEYSTROKES),
        LATENCY_TARGETS.typicalP95Ms,
      );
    row(
      await timeDocument(session, "generated-60-body.poise", chainSpec({ bodies: 60 }), LARGE_KEYSTROKES),
      LATENCY_TARGETS.largeP95Ms,
    );

    const typical = samples.includes("camera-arm.poise") ? "camera-arm.poise" : samples[0];
    if (typical) {
      const mem = await memoryAcrossEdits(session, readFileSync(join(samplesDir, typical), "utf8"));
      if (!mem) {
        log("latency: memory not readable (/proc missing)");
        met = false;
      } else {
        // A leak keeps growing; V8's heap settles after its first growth steps. Judge the second
        // half of the edits, and show the whole trace.
        const half = mem[Math.floor(mem.length / 2)]!;
        const last = mem[mem.length - 1]!;
        const lateGrowth = last - half;
        met &&= lateGrowth <= MEMORY_NOISE_KB;
        const mb = (kb: number) => (kb / 1024).toFixed(1);
        log(
          `latency: server RSS every 100 of ${MEMORY_EDITS} edits of ${typical} (MB): ${mem.map(mb).join(" ")}`,
        );
        log(
          `latency: growth ${mb(last - mem[0]!)} MB in all, ${mb(lateGrowth)} MB over the second half: ${lateGrowth <= MEMORY_NOISE_KB ? "ok (no growth beyond noise)" : "GROWS"}`,
        );
      }
    }
    if (session.errorLogs.length)
      log(
        `latency: the server logged ${session.errorLogs.length} fault(s); first: ${session.errorLogs[0]!.slice(0, 300)}`,
      );
    return met;
  } finally {
    await session.stop();
  }
}
