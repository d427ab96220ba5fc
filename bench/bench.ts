// `npm run bench`: timings of the analysis, printed against their targets. A list of sections;
// each prints its figures and says whether its targets are met. Asserts nothing (timings belong
// in a benchmark, not in the test suite). Add a section by appending to SECTIONS.
import { existsSync, readFileSync, readdirSync } from "node:fs";
import { join } from "node:path";
import { analyse } from "../server/src/analysis";
import { solveSweep } from "../server/src/mechanics/sweep";
import { DenseLu } from "../server/src/mechanics/dense-lu";
import { buildLinkage } from "../server/src/mechanics/linkage";
import type { ArmModel } from "../server/src/model/types";
import { TYPICAL_ARM } from "./typical-arm";
import { runLatencyBench } from "./latency";

/** Targets of the mechanics issue: a typical arm (up to 12 bodies, 3 dof) analysed end to end in
 * 20 ms, and a pose costing at most 5 bare LU solves of the same size. */
export const MECHANICS_TARGETS = { typicalArmMs: 20, poseOverLu: 5 } as const;
/** Steps the editor uses while typing (lsp settings default), for the quick-pass figure. */
const TYPING_STEPS = 13;
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
  f();
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t = performance.now();
    f();
    times.push(performance.now() - t);
  }
  return median(times);
}

function specs(): { name: string; text: string; typical: boolean }[] {
  const dir = join(findRoot(), "samples");
  const files = existsSync(dir) ? readdirSync(dir).filter((f) => f.endsWith(".poise")).sort() : [];
  return [...files.map((f) => ({ name: f, text: readFileSync(join(dir, f), "utf8"), typical: false })), { name: "typical arm (bench/typical-arm.ts)", text: TYPICAL_ARM, typical: true }];
}

/** One bare LU factor + solve of an n x n matrix, ms (median over enough repetitions to time). */
function bareLuMs(n: number): number {
  const a = new Float64Array(n * n);
  // Diagonally dominant with pseudo-random off-diagonal entries: a well-posed Jacobian's stand-in.
  let seed = 12345;
  const rnd = () => ((seed = (seed * 1103515245 + 12345) >>> 0) / 4294967296) - 0.5;
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

const endToEnd: Section = {
  name: "analysis end to end (analyse() on each spec)",
  run(log) {
    let ok = true;
    for (const s of specs()) {
      let last = analyse(s.text);
      const full = timeMs(() => (last = analyse(s.text)));
      const quick = timeMs(() => analyse(s.text, { stepsOverride: TYPING_STEPS }));
      const poses = last.sweep?.poses.length ?? 0;
      const t = last.timings;
      log(
        `  ${s.name}: ${full.toFixed(1)} ms for ${poses} poses (parse ${t.parse.toFixed(1)}, model ${t.model.toFixed(1)}, solve ${t.solve.toFixed(1)}, checks ${t.checks.toFixed(1)}); at ${TYPING_STEPS} steps ${quick.toFixed(1)} ms`,
      );
      if (s.typical) {
        const met = quick <= MECHANICS_TARGETS.typicalArmMs;
        ok &&= met;
        log(`  typical arm target <= ${MECHANICS_TARGETS.typicalArmMs} ms at the typing steps: ${met ? "met" : "NOT met"} (${quick.toFixed(1)} ms); the full sweep of ${poses} poses takes ${full.toFixed(1)} ms`);
        // The same arm with each degree of freedom swept alone (3 x steps poses instead of steps^3).
        const alone = s.text.replace(/\}\s*$/, "  sweep {\n    grid off\n  }\n}\n");
        let last2 = analyse(alone, { stepsOverride: TYPING_STEPS });
        const aloneMs = timeMs(() => (last2 = analyse(alone, { stepsOverride: TYPING_STEPS })));
        const t2 = last2.timings;
        log(
          `  typical arm with grid off at ${TYPING_STEPS} steps: ${aloneMs.toFixed(1)} ms for ${last2.sweep?.poses.length ?? 0} poses (solve ${t2.solve.toFixed(1)}, checks ${t2.checks.toFixed(1)}): ${aloneMs <= MECHANICS_TARGETS.typicalArmMs ? "within" : "over"} the target`,
        );
      }
    }
    return ok;
  },
};

const perPose: Section = {
  name: "cost of one pose against one bare LU solve of the same size",
  run(log) {
    let ok = true;
    for (const s of specs()) {
      const built = analyse(s.text, { modelOnly: true });
      const model: ArmModel | undefined = built.findings.some((f) => f.severity === "error") ? undefined : built.model;
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
  run: (log) => (existsSync(join(findRoot(), "dist", "server.js")) ? runLatencyBench(log) : (log("  dist/server.js missing: run npm run build"), false)),
};

export const SECTIONS: Section[] = [endToEnd, perPose, latency];

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
