// `npm run bench`: timings of the analysis, printed against their targets. A list of sections;
// each prints its figures and says whether its targets are met. Asserts nothing (timings belong
// in a benchmark, not in the test suite). Add a section by appending to SECTIONS.
import { existsSync, readFileSync, readdirSync } from "node:fs";
import { join } from "node:path";
import { analyse, type AnalysisOptions } from "../server/src/analysis";
import { solveSweep } from "../server/src/mechanics/sweep";
import { DenseLu } from "../server/src/mechanics/dense-lu";
import { buildLinkage } from "../server/src/mechanics/linkage";
import type { ArmModel } from "../server/src/model/types";
import { TYPICAL_ARM } from "./typical-arm";
import { runLatencyBench } from "./latency";
import { runSwivelCost } from "./swivel-cost";
import { DEFAULT_SETTINGS } from "../server/src/lsp/session/settings";
import { runTypingUnderLoadBench } from "./typing-under-load";
import { runCostBench } from "./cost";
import { tuneDesign } from "../server/src/tune/index";

/** Targets of the mechanics issue: a typical arm (up to 12 bodies, 3 dof) analysed end to end in
 * 20 ms, and a pose costing at most 5 bare LU solves of the same size. */
export const MECHANICS_TARGETS = { typicalArmMs: 20, poseOverLu: 5 } as const;
/** The `stepsWhileTyping` setting's default. The server sweeps at most this many steps per dof
 * while the user types (a quick pass), and fewer when the grid times the bodies passes the sweep
 * planner's work budget (server/src/mechanics/sweep-plan.ts): for the typical arm that is 6
 * steps, not 13. Both are timed below; each says on its own whether it meets the target. */
const TYPING_STEPS_SETTING = DEFAULT_SETTINGS.stepsWhileTyping;
/** Repetitions: the median of several runs after a warm-up (the JIT compiles on first runs). */
const RUNS = 7;

type Log = (line: string) => void;
interface Section {
  name: string;
  /** Prints figures; resolves to whether its targets are met. */
  run: (log: Log) => Promise<boolean> | boolean;
}

function findRoot(): string {
  for (const dir of [join(__dirname, ".."), process.cwd()]) if (existsSync(join(dir, "samples"))) return dir;
  return process.cwd();
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)]!;
}

function timeMs(f: () => void, runs = RUNS): number {
  return timeRuns(f, runs).median;
}

/** Median and least of `runs` timed runs after a warm-up. The median decides a target; the least
 * is printed beside it as what the code does when nothing else wants the CPU. */
function timeRuns(f: () => void, runs = RUNS): { median: number; least: number } {
  f();
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t = performance.now();
    f();
    times.push(performance.now() - t);
  }
  return { median: median(times), least: Math.min(...times) };
}

/** Runs for a figure of about this many ms in total (more runs steady the median of a quick one). */
const TIMING_BUDGET_MS = 1500;
const MAX_RUNS = 41;

function specs(): { name: string; text: string; typical: boolean }[] {
  const dir = join(findRoot(), "samples");
  const files = existsSync(dir)
    ? readdirSync(dir)
        .filter((f) => f.endsWith(".poise"))
        .sort()
    : [];
  return [
    ...files.map((f) => ({ name: f, text: readFileSync(join(dir, f), "utf8"), typical: false })),
    { name: "typical arm (bench/typical-arm.ts)", text: TYPICAL_ARM, typical: true },
  ];
}

/** One bare LU factor + solve of an n x n matrix, ms (median over enough repetitions to time). */
function bareLuMs(n: number): number {
  const a = new Float64Array(n * n);
  // Diagonally dominant with pseudo-random off-diagonal entries: a well-posed Jacobian's stand-in.
  let seed = 12345;
  const rnd = () => (seed = (seed * 1103515245 + 12345) >>> 0) / 4294967296 - 0.5;
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) a[i * n + j] = i === j ? n : rnd();
  const lu = new DenseLu(n);
  const b = new Float64Array(n).fill(1);
  const x = new Float64Array(n);
  const reps = Math.max(200, Math.floor(2e7 / (n * n * n + 1)));
  return (
    timeMs(() => {
      for (let r = 0; r < reps; r++) {
        lu.factor(a);
        lu.solve(b, x);
      }
    }) / reps
  );
}

/** The options of the language server's while-typing run (a quick pass at the setting's steps). */
const WHILE_TYPING: AnalysisOptions = { quickSteps: TYPING_STEPS_SETTING };

/** The density a run used, in words. */
function densityOf(a: { sweep?: { steps: number; quick?: true } }): string {
  return a.sweep?.quick ? `${a.sweep.steps} steps` : "its own";
}

function typicalAt(log: Log, label: string, options: AnalysisOptions): boolean {
  const t0 = performance.now();
  let last = analyse(TYPICAL_ARM, options);
  const once = performance.now() - t0;
  const runs = Math.max(RUNS, Math.min(MAX_RUNS, Math.floor(TIMING_BUDGET_MS / Math.max(once, 1e-3))));
  const { median: ms, least } = timeRuns(() => (last = analyse(TYPICAL_ARM, options)), runs);
  const t = last.timings;
  const met = ms <= MECHANICS_TARGETS.typicalArmMs;
  log(
    `  typical arm, ${label}: ${ms.toFixed(1)} ms median of ${runs} runs (least ${least.toFixed(1)}) for ${last.sweep?.poses.length ?? 0} poses (last run: solve ${t.solve.toFixed(1)}, checks ${t.checks.toFixed(1)}); target <= ${MECHANICS_TARGETS.typicalArmMs} ms: ${met ? "met" : "NOT met"}`,
  );
  return met;
}

const endToEnd: Section = {
  name: "analysis end to end (analyse() on each spec)",
  run(log) {
    for (const s of specs()) {
      let last = analyse(s.text);
      const full = timeMs(() => (last = analyse(s.text)));
      let typed = analyse(s.text, WHILE_TYPING);
      const quick = timeMs(() => (typed = analyse(s.text, WHILE_TYPING)));
      const poses = last.sweep?.poses.length ?? 0;
      const t = last.timings;
      log(
        `  ${s.name}: ${full.toFixed(1)} ms for ${poses} poses (parse ${t.parse.toFixed(1)}, model ${t.model.toFixed(1)}, solve ${t.solve.toFixed(1)}, checks ${t.checks.toFixed(1)}); while typing (server density: ${densityOf(typed)}) ${quick.toFixed(1)} ms`,
      );
    }
    // The target row: the typical arm as the server analyses it while the user types.
    const typed = analyse(TYPICAL_ARM, WHILE_TYPING);
    return typicalAt(
      log,
      `while typing at the server's density (${densityOf(typed)} per dof, setting ${TYPING_STEPS_SETTING} lowered by the work budget)`,
      WHILE_TYPING,
    );
  },
};

const typicalDenser: Section = {
  name: `typical arm at ${TYPING_STEPS_SETTING} steps per dof and at its own density (not what the server runs while typing)`,
  run(log) {
    const grid = typicalAt(log, `${TYPING_STEPS_SETTING} steps per dof in a grid`, {
      stepsOverride: TYPING_STEPS_SETTING,
    });
    // The same arm with each degree of freedom swept alone (3 x steps poses instead of steps^3).
    const alone = TYPICAL_ARM.replace(/\}\s*$/, "  sweep {\n    grid off\n  }\n}\n");
    let last2 = analyse(alone, { stepsOverride: TYPING_STEPS_SETTING });
    const aloneMs = timeMs(() => (last2 = analyse(alone, { stepsOverride: TYPING_STEPS_SETTING })));
    log(
      `  typical arm with grid off at ${TYPING_STEPS_SETTING} steps: ${aloneMs.toFixed(1)} ms median for ${last2.sweep?.poses.length ?? 0} poses: ${aloneMs <= MECHANICS_TARGETS.typicalArmMs ? "within" : "over"} the target`,
    );
    const own = typicalAt(log, "at its own density (after typing pauses)", {});
    return grid && own;
  },
};

const perPose: Section = {
  name: "cost of one pose against one bare LU solve of the same size",
  run(log) {
    let ok = true;
    for (const s of specs()) {
      const built = analyse(s.text, { modelOnly: true });
      const model: ArmModel | undefined = built.findings.some((f) => f.severity === "error")
        ? undefined
        : built.model;
      if (!model) {
        log(`  ${s.name}: no model (spec has errors)`);
        continue;
      }
      const linkage = buildLinkage(model);
      if (!linkage || !linkage.ok) {
        log(`  ${s.name}: does not assemble`);
        continue;
      }
      let poses = 0;
      const solve = timeMs(() => (poses = solveSweep(model).poses.length));
      if (poses === 0) continue;
      const n = linkage.cs.n;
      const lu = bareLuMs(n);
      const ratio = solve / poses / lu;
      const met = ratio <= MECHANICS_TARGETS.poseOverLu;
      if (s.typical) ok &&= met;
      log(
        `  ${s.name}: n = ${n}, ${((solve / poses) * 1000).toFixed(1)} us per pose (kinematics, statics for ${model.payloads.length ? "every load case" : "one case"}, records), bare LU ${(lu * 1000).toFixed(2)} us: ratio ${ratio.toFixed(1)} (target <= ${MECHANICS_TARGETS.poseOverLu}: ${met ? "met" : "NOT met"})`,
      );
    }
    return ok;
  },
};

const latency: Section = {
  name: "latency through the language server protocol",
  run: (log) =>
    existsSync(join(findRoot(), "dist", "server.js"))
      ? runLatencyBench(log)
      : (log("  dist/server.js missing: run npm run build"), false),
};

const typingUnderLoad: Section = {
  name: "typing with the other core busy: last keystroke to diagnostics, worker restarts",
  run: (log) => runTypingUnderLoadBench(log, findRoot()),
};

const swivelCost: Section = {
  name: "cost of the heading search by number of swivels (two-stage sample, 0 to 3 swivels)",
  run: (log) => runSwivelCost(log, findRoot(), (f) => timeMs(f, 3), WHILE_TYPING),
};

const cost: Section = {
  name: "near-linear cost (issue 15): stress chains, growth, a pose, poise check, the worker's result",
  run: (log) => runCostBench(log, findRoot()),
};

/** Target of the design search (issue 13): `poise tune` on the typical arm, with no `tune` line
 * (every spring's rate and tension free), from the text to a re-checked design, within 30 s, half
 * the command's 60 s budget. Most of it is two full analyses at the arm's own density (its grid
 * of 27^3 = 19,683 poses: the present design, and the re-check of the tuned one); the search
 * itself measures its 4000 designs on a sweep of a few hundred poses in under 2 s. */
export const TUNE_TARGET_MS = 30_000;

const tuneTypical: Section = {
  name: "poise tune on the typical arm (design search, re-check included)",
  run(log) {
    // One run: a search is seconds long and the machine is shared.
    const t = performance.now();
    const r = tuneDesign(TYPICAL_ARM, { analyse: (text, o) => analyse(text, o) });
    const ms = performance.now() - t;
    const met = ms <= TUNE_TARGET_MS;
    log(
      `  typical arm: ${(ms / 1000).toFixed(2)} s for ${r.variables.length} variables, ${r.evaluations} designs measured; worst hand force ${r.worstBefore?.toFixed(2)} N -> ${r.improved ? `${r.worstAfter?.toFixed(2)} N` : `unchanged (${r.reason})`}; target <= ${TUNE_TARGET_MS / 1000} s: ${met ? "met" : "NOT met"}`,
    );
    return met;
  },
};

export const SECTIONS: Section[] = [
  endToEnd,
  typicalDenser,
  perPose,
  cost,
  latency,
  typingUnderLoad,
  swivelCost,
  tuneTypical,
];

async function main(): Promise<void> {
  const only = process.argv.slice(2);
  const results: [string, boolean][] = [];
  for (const section of SECTIONS) {
    if (only.length > 0 && !only.some((o) => section.name.includes(o))) continue;
    console.log(`\n== ${section.name}`);
    results.push([section.name, await section.run((line) => console.log(line))]);
  }
  console.log("\n== summary");
  for (const [name, ok] of results) console.log(`  ${ok ? "met    " : "NOT met"}  ${name}`);
}

void main();
