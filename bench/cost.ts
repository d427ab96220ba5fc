// The cost targets of issue 15 ("near-linear cost"), each printed as met or NOT met: the 60- and
// 120-body stress chains analysed warm, the growth exponent between them (one run, as a ratio),
// a pose against one sparse factorisation of the same Jacobian, `poise check` of the engraver
// sample as a whole process, and the size and passing time of the worker's result. CPU time
// (process.cpuUsage; for the command, the waited child's from /proc), least of a few runs: the
// machine is shared, and the least is what the code costs.
import { spawnSync } from "node:child_process";
import { existsSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { deserialize, serialize } from "node:v8";
import { analyse } from "../server/src/analysis";
import { solveSweep } from "../server/src/mechanics/sweep";
import { buildLinkage } from "../server/src/mechanics/linkage";
import { SparseLu } from "../server/src/mechanics/sparse-lu";
import { constraintJacobianInto, sparseJacobian, updateAngles } from "../server/src/mechanics/constraints";
import { serverCopy } from "../server/src/lsp/session/server-copy";
import { chainSpec } from "../test/fuzz/big-spec";

export const COST_TARGETS = {
  chain60Ms: 400,
  chain120Ms: 1500,
  growthExponent: 2.2,
  poseOverSparseFactor: 5,
  checkProcessMs: 400,
  workerResultBytes: 2 * 1024 * 1024,
  workerPassMs: 20,
} as const;

type Log = (line: string) => void;

function cpuMs(f: () => void): number {
  const c = process.cpuUsage();
  f();
  const u = process.cpuUsage(c);
  return (u.user + u.system) / 1000;
}

/** Least CPU time of `runs` runs after `warmUps` unmeasured ones. */
function leastCpuMs(f: () => void, runs: number, warmUps = 1): number {
  for (let i = 0; i < warmUps; i++) f();
  let least = Infinity;
  for (let i = 0; i < runs; i++) least = Math.min(least, cpuMs(f));
  return least;
}

/** CPU time of this process's waited-for children so far, ms (/proc/self/stat: cutime, cstime). */
function childrenCpuMs(): number | undefined {
  try {
    const stat = readFileSync("/proc/self/stat", "utf8");
    const fields = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
    // Fields 16 and 17 of stat(5), counted from 1 with pid and comm first: here 13 and 14.
    return ((Number(fields[13]) + Number(fields[14])) * 1000) / 100;
  } catch {
    return undefined;
  }
}

function verdict(met: boolean): string {
  return met ? "met" : "NOT met";
}

export function runCostBench(log: Log, root: string): boolean {
  let ok = true;
  const say = (met: boolean, line: string) => {
    ok &&= met;
    log(`  ${line}: ${verdict(met)}`);
  };

  // Warm analyses of the stress chains, and the growth between them. Warm means compiled by the
  // JIT: one analysis before the measured ones is not enough for the analysis's code to reach its
  // optimised tier. Fourteen 60-body runs in a row took 1551, 921, 598, 487, 335, 318, 295, 509,
  // 202, 187, 206, 359, 231 and 360 ms: about eight runs to warm up, then a spread of a major
  // collection now and then. So the 60-body figure depended on coming first in the process, and
  // the exponent with it. Eight unmeasured 60-body runs, then the least of five; one unmeasured
  // 120-body run, then the least of five (of three, a busy host could still put all three on a
  // collection: exponent 2.46 once on 2026-12-03, 1.70-2.03 in the runs around it).
  const chain = (bodies: number) => chainSpec({ bodies });
  const t60 = leastCpuMs(() => analyse(chain(60)), 5, 8);
  const t120 = leastCpuMs(() => analyse(chain(120)), 5, 1);
  const exponent = Math.log(t120 / t60) / Math.log(2);
  say(
    t60 <= COST_TARGETS.chain60Ms,
    `60-body chain, warm: ${t60.toFixed(0)} ms (target <= ${COST_TARGETS.chain60Ms})`,
  );
  say(
    t120 <= COST_TARGETS.chain120Ms,
    `120-body chain, warm: ${t120.toFixed(0)} ms (target <= ${COST_TARGETS.chain120Ms})`,
  );
  say(
    exponent <= COST_TARGETS.growthExponent,
    `growth from 60 to 120 bodies: time x ${(t120 / t60).toFixed(2)}, exponent ${exponent.toFixed(2)} (target <= ${COST_TARGETS.growthExponent})`,
  );
  const phases = analyse(chain(120)).timings;
  log(
    `    (120-body phases, wall ms of one run: parse ${phases.parse.toFixed(0)}, model ${phases.model.toFixed(0)}, solve ${phases.solve.toFixed(0)}, checks ${phases.checks.toFixed(0)})`,
  );

  // A pose against one sparse factorisation of the same Jacobian (the 60-body chain).
  const model = analyse(chain(60), { modelOnly: true }).model!;
  const linkage = buildLinkage(model)!;
  let poses = 0;
  const sweepMs = leastCpuMs(() => (poses = solveSweep(model).poses.length), 3);
  const cs = linkage.cs;
  updateAngles(cs, linkage.qReference);
  const jac = sparseJacobian(cs);
  constraintJacobianInto(cs, jac);
  const lu = new SparseLu(cs.n);
  const reps = 2000;
  // One factorisation from scratch (every column's pattern searched), as the target was set; the
  // sweep's own, which reuses the patterns while the pivots repeat, is printed beside it.
  const factorMs =
    leastCpuMs(() => {
      for (let r = 0; r < reps; r++) {
        lu.forgetPatterns();
        lu.factor(jac);
      }
    }, 3) / reps;
  const repeatedFactorMs =
    leastCpuMs(() => {
      for (let r = 0; r < reps; r++) lu.factor(jac);
    }, 3) / reps;
  const ratio = sweepMs / poses / factorMs;
  say(
    ratio <= COST_TARGETS.poseOverSparseFactor,
    `60-body chain: ${((sweepMs / poses) * 1000).toFixed(0)} us a pose (${poses} poses), one sparse factorisation from scratch ${(factorMs * 1000).toFixed(1)} us (n = ${cs.n}, ${lu.nonZeros} non-zeros in L and U of ${cs.n * cs.n}): ratio ${ratio.toFixed(1)} (target <= ${COST_TARGETS.poseOverSparseFactor}; against the sweep's repeated factorisation, its patterns reused, ${(repeatedFactorMs * 1000).toFixed(1)} us: ${(sweepMs / poses / repeatedFactorMs).toFixed(1)})`,
  );

  // `poise check` of the engraver sample as a whole process, as a user runs it (the launcher
  // bin/poise.js with the build's code cache): start-up, reading, analysis, output. The bundle
  // run bare (no cache) is printed beside it.
  const launcher = join(root, "bin", "poise.js");
  const cli = join(root, "dist", "cli.js");
  const sample = join(root, "samples", "engraver-arm.poise");
  if (existsSync(cli) && existsSync(sample) && childrenCpuMs() !== undefined) {
    /** Least CPU of seven `node ...args` processes. */
    const leastProcessMs = (args: string[]) => {
      let least = Infinity;
      for (let i = 0; i < 7; i++) {
        const before = childrenCpuMs()!;
        spawnSync(process.execPath, args, { encoding: "utf8" });
        least = Math.min(least, childrenCpuMs()! - before);
      }
      return least;
    };
    const least = leastProcessMs([launcher, "check", sample]);
    const bare = leastProcessMs([cli, "check", sample]);
    // A bare Node start on this machine, for scale: the same build costs about twice as much CPU
    // on a machine whose Node starts in twice the time (docs/robustness.md, third round).
    const node = leastProcessMs(["-e", ""]);
    say(
      least <= COST_TARGETS.checkProcessMs,
      `poise check samples/engraver-arm.poise, whole process: ${least.toFixed(0)} ms CPU (target <= ${COST_TARGETS.checkProcessMs}; the bundle without the launcher's code cache ${bare.toFixed(0)} ms; a bare Node start here ${node.toFixed(0)} ms)`,
    );
    // The turning two-stage sample (its swivel searched at ten headings at every pose the turned
    // pass visits): printed for scale, the target being set on the typical sample.
    const turning = join(root, "samples", "two-stage-arm.poise");
    if (existsSync(turning))
      log(
        `  for scale, poise check samples/two-stage-arm.poise (a turning swivel), whole process: ${leastProcessMs([launcher, "check", turning]).toFixed(0)} ms CPU`,
      );
  } else log("  poise check: dist/cli.js or the sample missing (npm run build), or no /proc: not measured");

  // The worker's result for the 60-body chain (the server's copy, server-copy.ts): its size as
  // the structured clone writes it, and the time to write and read it (what passing it from the
  // worker to the server costs).
  const result = serverCopy(analyse(chain(60)));
  const bytes = serialize(result).length;
  const passMs = leastCpuMs(() => deserialize(serialize(result)), 5);
  say(
    bytes <= COST_TARGETS.workerResultBytes && passMs <= COST_TARGETS.workerPassMs,
    `the worker's result for the 60-body chain: ${(bytes / 1024 / 1024).toFixed(2)} MB, ${passMs.toFixed(1)} ms to write and read (targets <= 2 MB, <= ${COST_TARGETS.workerPassMs} ms)`,
  );
  return ok;
}
