// The robustness properties every text must satisfy: the core never throws and never faults
// internally, every finding lies inside the document, the same text gives the same findings, and
// no figure that reaches the user is NaN or infinite.
import { analyse, type Analysis } from "../../server/src/analysis";
import { parse } from "../../server/src/syntax/parser";
import { buildModel } from "../../server/src/model/build";
import { solveSweep } from "../../server/src/mechanics/sweep";
import { runChecks } from "../../server/src/checks/index";
import { CODES } from "../../server/src/findings/codes";
import type { Finding } from "../../server/src/findings/finding";
import type { Span } from "../../server/src/syntax/span";
import type { Pose } from "../../server/src/mechanics/types";
import { formatSpec } from "../../server/src/services/format-text";

/** Poses per degree of freedom during fuzzing: enough to walk a range (ends and middle), few
 * enough that thousands of cases fit in the CI budget. */
export const FUZZ_STEPS = 3;

/** A single case slower than this is reported as a failure: the editor re-analyses on every
 * keystroke, so a text that takes seconds at 3 steps is a hang in the making. Common practice,
 * no source: generous against a 2-core CI box shared with other jobs. */
export const SLOW_CASE_MS = 4000;

export interface Violation {
  /** What makes two failures the same bug (defaults to the message without numbers). */
  key?: string;
  property:
    | "format-stable"
    | "no-throw"
    | "no-internal-fault"
    | "span-in-document"
    | "deterministic"
    | "finite-figures"
    | "finite-model"
    | "well-formed-finding"
    | "fast";
  message: string;
}

/** How far the texts got: counted so a run can show it reached the solver and the checks, not
 * only the parser. */
export const fuzzStats = { analysed: 0, solved: 0 };

export interface CheckOptions {
  alwaysDeterminism?: boolean;
  /** Analyse under this budget, ms, as the editor and `poise` do (the large shapes of issue 16):
   * the case must then end within the budget plus SLOW_CASE_MS for the phases that cannot stop
   * midway. Where a budget cuts the work depends on the clock, so determinism and the
   * formatter's same-findings check are left out. */
  budgetMs?: number;
}

export function checkText(text: string, options: CheckOptions = {}): Violation[] {
  const violations: Violation[] = [];
  const t0 = performance.now();
  let first: Analysis;
  const analysis = {
    stepsOverride: FUZZ_STEPS,
    ...(options.budgetMs !== undefined ? { budgetMs: options.budgetMs } : {}),
  };
  try {
    first = analyse(text, analysis);
  } catch (err) {
    return [{ property: "no-throw", message: `analyse threw: ${describeError(err)}` }];
  }
  const elapsed = performance.now() - t0;
  fuzzStats.analysed++;
  if (first.sweep && first.sweep.poses.length > 0) fuzzStats.solved++;
  const slow = (options.budgetMs ?? 0) + SLOW_CASE_MS;
  if (elapsed > slow)
    violations.push({
      property: "fast",
      message: `analyse took ${elapsed.toFixed(0)} ms at ${FUZZ_STEPS} steps${options.budgetMs !== undefined ? ` under a ${options.budgetMs} ms budget` : ""}`,
    });

  const found = checkAnalysis(first, text);
  // A model that already holds infinities explains every NaN after it: report the cause alone.
  const cause = found.find((v) => v.property === "finite-model");
  violations.push(...(cause ? found.filter((v) => v.property !== "finite-figures") : found));

  violations.push(...checkFormatting(text));
  if (options.budgetMs !== undefined) return violations;

  // Determinism costs a second analysis: check it on a third of the texts, chosen by the text
  // itself so that shrinking a failure keeps checking it.
  if (!options.alwaysDeterminism && textHash(text) % 3 !== 0) return violations;
  let second: Analysis;
  try {
    second = analyse(text, { stepsOverride: FUZZ_STEPS });
  } catch (err) {
    violations.push({ property: "deterministic", message: `second analyse threw: ${describeError(err)}` });
    return violations;
  }
  const a = findingsDigest(first.findings);
  const b = findingsDigest(second.findings);
  if (a !== b)
    violations.push({
      property: "deterministic",
      message: `findings differ between two runs:\n  ${a}\n  ${b}`,
    });

  // Formatting a text that parses must not change what it means: the same findings, word for word.
  if (!first.findings.some((f) => f.code === "syntax.error")) {
    try {
      const formatted = analyse(formatSpec(text), { stepsOverride: FUZZ_STEPS });
      const before = meaningDigest(first.findings);
      const after = meaningDigest(formatted.findings);
      if (before !== after)
        violations.push({
          property: "format-stable",
          message: `formatting changed the findings:\n  ${before}\n  ${after}`,
        });
    } catch (err) {
      violations.push({
        property: "no-throw",
        message: `analysing the formatted text threw: ${describeError(err)}`,
      });
    }
  }
  return violations;
}

/** The formatter (server/src/services/format-text.ts) on any text: returns, is idempotent, and keeps
 * every word (only spaces, line ends and `;` separators may change). */
function checkFormatting(text: string): Violation[] {
  let once: string;
  try {
    once = formatSpec(text);
  } catch (err) {
    return [{ property: "no-throw", message: `formatSpec threw: ${describeError(err)}` }];
  }
  const out: Violation[] = [];
  // Formatting only adds indentation and line ends; the language nests two levels (arm, then a
  // declaration), so the output stays within a small multiple of the input. Common practice, no
  // source: 8 x + 1 kB leaves room for `a;b;c` split one property a line, four spaces deep.
  if (once.length > 8 * text.length + 1024)
    return [
      {
        property: "format-stable",
        message: `formatting a ${text.length}-character text gave ${once.length} characters`,
      },
    ];
  const squeeze = (s: string) => s.replace(/[\s;]+/g, "");
  if (squeeze(once) !== squeeze(text))
    out.push({ property: "format-stable", message: "formatting changed a word, not only the spacing" });
  if (formatSpec(once) !== once)
    out.push({ property: "format-stable", message: "formatting the formatted text changes it again" });
  return out;
}

function meaningDigest(findings: readonly Finding[]): string {
  return findings
    .filter((f) => f.code !== "analysis.budget")
    .map((f) => `${f.code} ${f.message}`)
    .sort()
    .join(" | ");
}

/** The properties of one analysis: no internal fault, findings well formed and inside the
 * document, every reported figure finite. */
export function checkAnalysis(a: Analysis, text: string): Violation[] {
  const violations: Violation[] = [];
  for (const f of a.findings) {
    if (f.code === "analysis.internal")
      violations.push({ property: "no-internal-fault", message: `${f.message}${internalStack(text)}` });
    checkFindingShape(f, text, violations);
  }
  for (const e of a.tree.errors) checkSpan(e.span, text, `syntax error "${e.message}"`, violations);
  checkFiniteResults(a, violations);
  return violations;
}

function checkSpan(s: Span, text: string, what: string, violations: Violation[]): void {
  const ok =
    s &&
    Number.isInteger(s.start) &&
    Number.isInteger(s.end) &&
    0 <= s.start &&
    s.start <= s.end &&
    s.end <= text.length;
  if (!ok)
    violations.push({
      property: "span-in-document",
      message: `${what}: span ${JSON.stringify(s)} outside 0..${text.length}`,
    });
}

function checkFindingShape(f: Finding, text: string, violations: Violation[]): void {
  const what = `${f.code} "${f.message}"`;
  checkSpan(f.span, text, what, violations);
  for (const r of f.related ?? []) checkSpan(r.span, text, `${what} related "${r.message}"`, violations);
  if (!(f.code in CODES))
    violations.push({ property: "well-formed-finding", message: `unknown code ${f.code}` });
  if (typeof f.message !== "string" || f.message.trim() === "")
    violations.push({ property: "well-formed-finding", message: `${f.code} has an empty message` });
  // A message may quote the user's own words; only flag NaN/undefined the text did not contain.
  for (const word of ["NaN", "Infinity", "undefined", "[object Object]"]) {
    if (f.message.includes(word) && !text.includes(word))
      violations.push({ property: "finite-figures", message: `${what} shows ${word}` });
  }
}

function finiteOr(value: unknown, path: string, out: string[]): void {
  if (typeof value === "number" && !Number.isFinite(value)) out.push(`${path} = ${value}`);
}

function recordFinite(rec: Record<string, number> | undefined, path: string, out: string[]): void {
  for (const [k, v] of Object.entries(rec ?? {})) finiteOr(v, `${path}.${k}`, out);
}

function checkPose(p: Pose, torsion: Set<string>, path: string, out: string[]): void {
  recordFinite(p.angles, `${path}.angles`, out);
  recordFinite(p.jointAngles, `${path}.jointAngles`, out);
  for (const [id, b] of Object.entries(p.bodies)) {
    finiteOr(b.x, `${path}.bodies.${id}.x`, out);
    finiteOr(b.y, `${path}.bodies.${id}.y`, out);
    finiteOr(b.phi, `${path}.bodies.${id}.phi`, out);
  }
  for (const [id, s] of Object.entries(p.springs)) {
    // The contract makes a torsion spring's hook-to-hook length NaN; everything else is reported.
    if (!torsion.has(id)) finiteOr(s.length, `${path}.springs.${id}.length`, out);
    for (const v of [s.a.x, s.a.y, s.b.x, s.b.y]) finiteOr(v, `${path}.springs.${id}.hooks`, out);
    if (s.windUp !== undefined) finiteOr(s.windUp, `${path}.springs.${id}.windUp`, out);
  }
  p.cases.forEach((c, i) => {
    recordFinite(c.holdingTorque, `${path}.cases[${i}].holdingTorque`, out);
    recordFinite(c.handForce, `${path}.cases[${i}].handForce`, out);
    recordFinite(c.lockedTorque, `${path}.cases[${i}].lockedTorque`, out);
    recordFinite(c.springForce, `${path}.cases[${i}].springForce`, out);
    for (const [id, r] of Object.entries(c.reactions)) {
      finiteOr(r.x, `${path}.cases[${i}].reactions.${id}.x`, out);
      finiteOr(r.y, `${path}.cases[${i}].reactions.${id}.y`, out);
    }
  });
}

/** Walks a plain value and lists every non-finite number in it. */
function nonFiniteNumbers(value: unknown, path: string, out: string[], depth = 0): void {
  if (depth > 8 || out.length > 5) return;
  if (typeof value === "number") finiteOr(value, path, out);
  else if (Array.isArray(value))
    value.forEach((v, i) => nonFiniteNumbers(v, `${path}[${i}]`, out, depth + 1));
  else if (value && typeof value === "object")
    for (const [k, v] of Object.entries(value)) nonFiniteNumbers(v, `${path}.${k}`, out, depth + 1);
}

function checkFiniteResults(a: Analysis, violations: Violation[]): void {
  const out: string[] = [];
  for (const [id, r] of Object.entries(a.readouts)) {
    for (const f of r.figures) {
      finiteOr(f.value, `readouts.${id}.${f.label}`, out);
      if (f.high !== undefined) finiteOr(f.high, `readouts.${id}.${f.label}.high`, out);
      if (typeof f.value !== "number") out.push(`readouts.${id}.${f.label} is ${typeof f.value}`);
    }
    if (r.worstSafety) finiteOr(r.worstSafety.value, `readouts.${id}.worstSafety`, out);
  }
  if (a.sweep) {
    const torsion = new Set((a.model?.springs ?? []).filter((s) => s.kind === "torsion").map((s) => s.id));
    if (a.sweep.reference) checkPose(a.sweep.reference, torsion, "sweep.reference", out);
    a.sweep.poses.forEach((p, i) => checkPose(p, torsion, `sweep.poses[${i}]`, out));
    for (const d of a.sweep.dofs)
      for (const v of [...d.range, d.reference]) finiteOr(v, `sweep.dofs.${d.id}`, out);
  }
  if (out.length)
    violations.push({
      property: "finite-figures",
      message: out.slice(0, 5).join("; "),
      key: out.map(genericPath).sort()[0]!,
    });

  // The solver is only ever fed a model whose numbers are all finite.
  if (a.sweep && a.model) {
    const bad: string[] = [];
    nonFiniteNumbers(a.model, "model", bad);
    if (bad.length)
      violations.push({
        property: "finite-model",
        message: `solved a model with ${bad.slice(0, 5).join("; ")}`,
        key: "the model holds a non-finite number",
      });
  }
}

/** FNV-1a over the UTF-16 code units: a cheap, stable choice of texts. */
function textHash(text: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) h = Math.imul(h ^ text.charCodeAt(i), 0x01000193) >>> 0;
  return h;
}

function findingsDigest(findings: readonly Finding[]): string {
  return JSON.stringify(
    findings
      .filter((f) => f.code !== "analysis.budget")
      .map((f) => [f.code, f.severity, f.span.start, f.span.end, f.message]),
  );
}

export function describeError(err: unknown): string {
  if (err instanceof Error) return `${err.message}\n${(err.stack ?? "").split("\n").slice(1, 8).join("\n")}`;
  return String(err);
}

/** Re-runs the phases without the analysis guard to recover the stack of an internal fault. */
function internalStack(text: string): string {
  try {
    const tree = parse(text);
    const built = buildModel(tree, text);
    if (!built.model) return "";
    const sweep = solveSweep(built.model, { stepsOverride: FUZZ_STEPS });
    runChecks(built.model, sweep, { deadline: Infinity });
    return "";
  } catch (err) {
    return `\n${describeError(err)}`;
  }
}

/** A figure's path with the part names and indices taken out: `readouts.stand.tipping safety
 * factor = Infinity` and `readouts.foot.tipping safety factor = -Infinity` are one bug. */
function genericPath(entry: string): string {
  const path = entry.split(" = ")[0]!;
  const parts = path.replace(/\[\d+\]/g, "[]").split(".");
  if (parts[0] === "readouts") return `readouts.*.${parts.slice(2).join(".")}`;
  if (parts[0] === "sweep")
    return parts
      .filter(
        (p, i) =>
          !(
            i > 0 &&
            /^(angles|jointAngles|bodies|springs|holdingTorque|handForce|lockedTorque|springForce|reactions|dofs)$/.test(
              parts[i - 1]!,
            )
          ),
      )
      .join(".");
  return parts.filter((p) => !/^[a-z]+_\d+$|^[a-z]+_[a-z]+$/.test(p)).join(".");
}

/** A failure's signature, for deduplication: the property and the message without numbers. */
export function signature(v: Violation): string {
  if (v.key) return `${v.property}:${v.key}`;
  return `${v.property}:${v.message
    .split("\n")[0]!
    .replace(/-?\d[\d.e+-]*/g, "#")
    .replace(/"[^"]*"/g, '"…"')
    .slice(0, 160)}`;
}
