// Entry of `npm run fuzz` and of the CI-size fuzz test (bundled by scripts/fuzz.mjs): runs the
// campaign in a worker thread under a watchdog, so a hang in the analysis is caught and recorded
// like any other failure, and writes every new failure as a fixture in test/fuzz/failures/.
import { Worker, isMainThread, parentPort, workerData } from "node:worker_threads";
import { readFileSync, readdirSync, writeFileSync, mkdirSync, existsSync } from "node:fs";
import { createHash } from "node:crypto";
import { join } from "node:path";
import { runCampaign, type CampaignResult, type FailureRecord, type FamilyName } from "./campaign";
import { signature } from "./properties";

/** A case that runs this long without returning is a hang; the worker is stopped and restarted. */
const HANG_MS = 20_000;
/** Room for the text of the case in flight (UTF-16 code units). */
const TEXT_SLOTS = 1 << 20;

interface WorkerInput {
  runs: number;
  seed: number;
  samples: string[];
  families?: FamilyName[];
  timeLimitMs?: number;
  known: string[];
  shared: SharedArrayBuffer;
}

type WorkerMessage =
  | { type: "failure"; failure: FailureRecord }
  | { type: "progress"; cases: number }
  | { type: "done"; result: CampaignResult };

interface Args {
  runs: number;
  seed: number;
  out: string;
  write: boolean;
  json: boolean;
  timeLimitMs?: number;
  families?: FamilyName[];
  root: string;
}

function parseArgs(argv: string[]): Args {
  const get = (name: string) => {
    const i = argv.indexOf(name);
    return i >= 0 ? argv[i + 1] : undefined;
  };
  const root = get("--root") ?? process.cwd();
  const runs = Number(get("--runs") ?? process.env.FUZZ_RUNS ?? 100_000);
  const seed = Number(get("--seed") ?? process.env.FUZZ_SEED ?? Math.floor(Math.random() * 2 ** 31));
  const time = get("--time-limit-ms");
  const fam = get("--families");
  return {
    root,
    runs,
    seed,
    out: get("--out") ?? join(root, "test", "fuzz", "failures"),
    write: !argv.includes("--no-write"),
    json: argv.includes("--json"),
    ...(time ? { timeLimitMs: Number(time) } : {}),
    ...(fam ? { families: fam.split(",") as FamilyName[] } : {}),
  };
}

function readSamples(root: string): string[] {
  const dir = join(root, "samples");
  if (!existsSync(dir)) return [];
  return readdirSync(dir)
    .filter((f) => f.endsWith(".poise"))
    .sort()
    .map((f) => readFileSync(join(dir, f), "utf8"));
}

/** Signatures of failures already on file, so a long run records only new bugs. */
function knownSignatures(out: string): string[] {
  if (!existsSync(out)) return [];
  const sigs: string[] = [];
  for (const f of readdirSync(out)) {
    if (!f.endsWith(".json")) continue;
    try {
      const rec = JSON.parse(readFileSync(join(out, f), "utf8"));
      if (typeof rec.signature === "string") sigs.push(rec.signature);
    } catch {
      // A malformed file is the replay test's business.
    }
  }
  return sigs;
}

function writeFailure(out: string, f: FailureRecord & { hang?: boolean }): string {
  mkdirSync(out, { recursive: true });
  const hash = createHash("sha1").update(f.text).digest("hex").slice(0, 10);
  const file = join(out, `${f.family}-${f.property}-${hash}.json`);
  const record = {
    ...f,
    found: new Date().toISOString(),
    open: true,
    replay: "test/fuzz/replay.test.ts checks the properties on `text`",
  };
  writeFileSync(file, JSON.stringify(record, null, 2) + "\n");
  return file;
}

function runWorkerSide(): void {
  const input = workerData as WorkerInput;
  const counter = new Int32Array(input.shared, 0, 2);
  const slots = new Uint16Array(input.shared, 8);
  const result = runCampaign({
    runs: input.runs,
    seed: input.seed,
    samples: input.samples,
    ...(input.families ? { families: input.families } : {}),
    ...(input.timeLimitMs !== undefined ? { timeLimitMs: input.timeLimitMs } : {}),
    known: new Set(input.known),
    onCaseStart: (text) => {
      const n = Math.min(text.length, TEXT_SLOTS);
      for (let i = 0; i < n; i++) slots[i] = text.charCodeAt(i);
      Atomics.store(counter, 1, n);
      Atomics.add(counter, 0, 1);
    },
    onFailure: (failure) => parentPort!.postMessage({ type: "failure", failure } satisfies WorkerMessage),
    onProgress: (cases) => parentPort!.postMessage({ type: "progress", cases } satisfies WorkerMessage),
  });
  parentPort!.postMessage({ type: "done", result } satisfies WorkerMessage);
}

/** Runs one worker until it finishes or hangs. */
function runOneWorker(
  args: Args,
  runs: number,
  seed: number,
  samples: string[],
  known: Set<string>,
  onFailure: (f: FailureRecord & { hang?: boolean }) => void,
  timeLimitMs?: number,
): Promise<{
  cases: number;
  repeats: number;
  hung: boolean;
  byFamily?: Record<string, number>;
  solvedByFamily?: Record<string, number>;
}> {
  return new Promise((resolve) => {
    const shared = new SharedArrayBuffer(8 + 2 * TEXT_SLOTS);
    const counter = new Int32Array(shared, 0, 2);
    const slots = new Uint16Array(shared, 8);
    const input: WorkerInput = {
      runs,
      seed,
      samples,
      known: [...known],
      shared,
      ...(args.families ? { families: args.families } : {}),
      ...(timeLimitMs !== undefined ? { timeLimitMs } : {}),
    };
    const worker = new Worker(__filename, { workerData: input });
    let lastCount = -1;
    let lastChange = Date.now();
    let cases = 0;
    let settled = false;
    const finish = (value: {
      cases: number;
      repeats: number;
      hung: boolean;
      byFamily?: Record<string, number>;
      solvedByFamily?: Record<string, number>;
    }) => {
      if (settled) return;
      settled = true;
      clearInterval(watch);
      resolve(value);
    };
    const watch = setInterval(() => {
      const c = Atomics.load(counter, 0);
      if (c !== lastCount) {
        lastCount = c;
        lastChange = Date.now();
        return;
      }
      if (Date.now() - lastChange < HANG_MS) return;
      const n = Atomics.load(counter, 1);
      const text =
        String.fromCharCode(...slots.subarray(0, Math.min(n, 65536))) +
        (n > 65536 ? decodeRest(slots, n) : "");
      const v = { property: "fast" as const, message: `no answer after ${HANG_MS / 1000} s (hang)` };
      onFailure({
        family: "valid",
        property: v.property,
        message: v.message,
        signature: signature(v),
        seed,
        text,
        hang: true,
      });
      void worker.terminate();
      finish({ cases: Math.max(cases, c), repeats: 0, hung: true });
    }, 1000);
    worker.on("message", (m: WorkerMessage) => {
      if (m.type === "failure") onFailure(m.failure);
      else if (m.type === "progress") cases = m.cases;
      else
        finish({
          cases: m.result.cases,
          repeats: m.result.repeats,
          hung: false,
          byFamily: m.result.byFamily,
          solvedByFamily: m.result.solvedByFamily,
        });
    });
    worker.on("error", (err) => {
      const v = {
        property: "no-throw" as const,
        message: `worker died: ${err instanceof Error ? err.stack : String(err)}`,
      };
      onFailure({
        family: "valid",
        property: v.property,
        message: v.message,
        signature: signature(v),
        seed,
        text: "",
      });
      finish({ cases, repeats: 0, hung: false });
    });
    worker.on("exit", () => finish({ cases, repeats: 0, hung: false }));
  });
}

function decodeRest(slots: Uint16Array, n: number): string {
  let s = "";
  for (let i = 65536; i < n; i += 8192) s += String.fromCharCode(...slots.subarray(i, Math.min(n, i + 8192)));
  return s;
}

async function runMainSide(): Promise<void> {
  const args = parseArgs(process.argv.slice(2));
  const samples = readSamples(args.root);
  const known = new Set(knownSignatures(args.out));
  const failures: (FailureRecord & { hang?: boolean; file?: string })[] = [];
  const started = Date.now();
  let done = 0;
  let repeats = 0;
  let seed = args.seed;
  const byFamily: Record<string, number> = {};
  const solvedByFamily: Record<string, number> = {};
  const log = (s: string) => process.stderr.write(s + "\n");
  log(
    `fuzz: ${args.runs} cases, seed ${args.seed}${args.timeLimitMs ? `, at most ${args.timeLimitMs} ms` : ""}`,
  );
  while (done < args.runs) {
    const left = args.timeLimitMs !== undefined ? args.timeLimitMs - (Date.now() - started) : undefined;
    if (left !== undefined && left <= 0) break;
    const r = await runOneWorker(
      args,
      args.runs - done,
      seed,
      samples,
      known,
      (f) => {
        known.add(f.signature);
        const file = args.write ? writeFailure(args.out, f) : undefined;
        failures.push({ ...f, ...(file ? { file } : {}) });
        log(
          `fuzz: FAILURE ${f.property} (${f.family}, seed ${f.seed}${f.path ? `, path ${f.path}` : ""})${file ? ` -> ${file}` : ""}\n  ${f.message.split("\n").slice(0, 6).join("\n  ")}`,
        );
      },
      left,
    );
    done += Math.max(1, r.cases);
    repeats += r.repeats;
    for (const [f, n] of Object.entries(r.byFamily ?? {})) byFamily[f] = (byFamily[f] ?? 0) + n;
    for (const [f, n] of Object.entries(r.solvedByFamily ?? {}))
      solvedByFamily[f] = (solvedByFamily[f] ?? 0) + n;
    if (!r.hung) break;
    seed = seed + 7919;
  }
  const summary = {
    cases: done,
    byFamily,
    solvedByFamily,
    repeats,
    failures: failures.length,
    seconds: (Date.now() - started) / 1000,
    seed: args.seed,
  };
  log(
    `fuzz: ${summary.cases} cases (${Object.entries(byFamily)
      .map(([f, n]) => `${f} ${n}, ${solvedByFamily[f] ?? 0} solved`)
      .join(
        "; ",
      )}) in ${summary.seconds.toFixed(1)} s, ${summary.failures} new failure(s), ${repeats} repeat(s) of known ones`,
  );
  if (args.json) process.stdout.write(JSON.stringify({ ...summary, details: failures }) + "\n");
  process.exitCode = failures.length ? 1 : 0;
}

if (isMainThread) void runMainSide();
else runWorkerSide();
