// A fuzzing campaign: runs fast-check over each family of inputs, checks the robustness
// properties, shrinks each new failure and keeps going with a fresh seed until the run budget is
// spent. Pure apart from the callbacks, so the same code serves the CI run and `npm run fuzz`.
import fc from "fast-check";
import { validSpecArb } from "./spec-arbitrary";
import { byteMutantArb, junkArb, nearlyValidArb } from "./mutations";
import { largeSpecArb } from "./shapes";
import { checkText, fuzzStats, signature, type Violation } from "./properties";

export type FamilyName = "valid" | "nearly-valid" | "byte-mutant" | "junk" | "large";

/** Share of the runs each family gets: the near-valid texts reach deepest into the checks. The
 * large shapes (issue 16) take a second or two each: 500 of the long run's 100,000 cases (the CI
 * run gives them a few cases of their own, test/fuzz/fuzz.test.ts). */
export const FAMILY_WEIGHTS: Record<FamilyName, number> = {
  valid: 0.3,
  "nearly-valid": 0.35,
  "byte-mutant": 0.25,
  junk: 0.095,
  large: 0.005,
};

/** The budget the large shapes are analysed under: the editor's default is 3 s; a shorter one
 * keeps the cases quick and still shows that every phase stops or is bounded. */
export const LARGE_BUDGET_MS = 1500;

export function familyArbitrary(name: FamilyName, samples: readonly string[]): fc.Arbitrary<string> {
  switch (name) {
    case "valid":
      return validSpecArb;
    case "nearly-valid":
      return nearlyValidArb(validSpecArb);
    case "byte-mutant":
      return byteMutantArb(samples.length ? samples : ['arm "empty" {\n}\n']);
    case "junk":
      return junkArb;
    case "large":
      return largeSpecArb;
  }
}

export interface FailureRecord {
  family: FamilyName;
  property: Violation["property"];
  message: string;
  signature: string;
  /** fast-check seed and counterexample path that reproduce the (unshrunk) failure. */
  seed: number;
  path?: string;
  /** The shrunk failing input. */
  text: string;
}

export interface CampaignOptions {
  runs: number;
  seed: number;
  samples: readonly string[];
  families?: FamilyName[];
  /** Stop starting new cases after this many ms (the CI run's budget). */
  timeLimitMs?: number;
  /** Called before each case runs (the watchdog keeps the text in case it hangs). */
  onCaseStart?: (text: string, family: FamilyName) => void;
  onFailure?: (f: FailureRecord) => void;
  onProgress?: (casesDone: number) => void;
  /** Signatures already known (e.g. from earlier workers), not recorded again. */
  known?: Set<string>;
}

export interface CampaignResult {
  cases: number;
  /** Cases that hit a failure already recorded (same signature). */
  repeats: number;
  failures: FailureRecord[];
  byFamily: Record<string, number>;
  /** Cases per family whose spec was solved (poses computed), not stopped by an error. */
  solvedByFamily: Record<string, number>;
  interrupted: boolean;
}

class NewViolation extends Error {
  constructor(readonly violation: Violation) {
    super(`${violation.property}: ${violation.message}`);
  }
}

export function runCampaign(opts: CampaignOptions): CampaignResult {
  const families = opts.families ?? (Object.keys(FAMILY_WEIGHTS) as FamilyName[]);
  const totalWeight = families.reduce((s, f) => s + FAMILY_WEIGHTS[f], 0);
  const known = opts.known ?? new Set<string>();
  const result: CampaignResult = {
    cases: 0,
    repeats: 0,
    failures: [],
    byFamily: {},
    solvedByFamily: {},
    interrupted: false,
  };
  const started = performance.now();
  let seed = opts.seed;
  let weightSoFar = 0;

  for (const family of families) {
    // Each family gets its share of the time budget (plus whatever earlier ones left unused), so a
    // slow family cannot starve the rest.
    weightSoFar += FAMILY_WEIGHTS[family];
    const familyDeadline =
      opts.timeLimitMs !== undefined ? started + (opts.timeLimitMs * weightSoFar) / totalWeight : Infinity;
    const overTime = () => performance.now() > familyDeadline;
    let remaining = Math.max(1, Math.round((opts.runs * FAMILY_WEIGHTS[family]) / totalWeight));
    const arb = familyArbitrary(family, opts.samples);
    let shrinking = false;
    const property = fc.property(arb, (text) => {
      if (!shrinking) {
        result.cases++;
        result.byFamily[family] = (result.byFamily[family] ?? 0) + 1;
        if (result.cases % 200 === 0) opts.onProgress?.(result.cases);
      }
      opts.onCaseStart?.(text, family);
      const solvedBefore = fuzzStats.solved;
      const violations = checkText(text, family === "large" ? { budgetMs: LARGE_BUDGET_MS } : {});
      if (!shrinking && fuzzStats.solved > solvedBefore)
        result.solvedByFamily[family] = (result.solvedByFamily[family] ?? 0) + 1;
      // A failure already recorded passes, so one bug does not stop the campaign or fill the
      // folder with copies; a new one throws and is shrunk.
      const fresh = violations.find((v) => !known.has(signature(v)));
      if (!fresh) {
        if (violations.length && !shrinking) result.repeats++;
        return;
      }
      shrinking = true;
      throw new NewViolation(fresh);
    });
    while (remaining > 0 && !overTime()) {
      shrinking = false;
      const casesBefore = result.cases;
      const details = fc.check(property, {
        seed,
        numRuns: remaining,
        ...(opts.timeLimitMs !== undefined
          ? { interruptAfterTimeLimit: Math.max(1, familyDeadline - performance.now()) }
          : {}),
        markInterruptAsFailure: false,
      });
      remaining -= Math.max(1, result.cases - casesBefore);
      if (details.interrupted) result.interrupted = true;
      if (details.failed && details.counterexample) {
        const err = details.errorInstance;
        const violation =
          err instanceof NewViolation
            ? err.violation
            : { property: "no-throw" as const, message: String(err) };
        const record: FailureRecord = {
          family,
          property: violation.property,
          message: violation.message,
          signature: signature(violation),
          seed,
          ...(details.counterexamplePath ? { path: details.counterexamplePath } : {}),
          text: details.counterexample[0],
        };
        known.add(record.signature);
        result.failures.push(record);
        opts.onFailure?.(record);
      }
      seed = (seed * 1103515245 + 12345) % 2147483647;
    }
  }
  if (opts.timeLimitMs !== undefined && performance.now() - started > opts.timeLimitMs)
    result.interrupted = true;
  return result;
}
