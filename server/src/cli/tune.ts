// `poise tune FILE [--json] [--write]` (cli.md): the design search over what the spec's `tune`
// lines free (or each spring's rate and tension), per spring the values found and the worst hand
// force before and after, every check re-run on the tuned design. `--write` writes the values
// into the file in its own units, keeping its layout and comments. A progress line on stderr.
// Exit 0 when the tuned design (or, with nothing better, the present one) passes every check,
// 1 when it still has errors, 2 when the search could not run.
import { analyse } from "../analysis";
import { CLI_BUDGET_MS } from "../limits";
import { tuneDesign, type TuneAnalysis, type TuneResult } from "../tune/index";
import { applyEdits, tunedEdits } from "../tune/write";
import type { Finding } from "../findings/finding";
import { readSpec, writeTextFile, type Output } from "./io";

const USAGE = "poise tune FILE [--json] [--write]";

interface TuneArgs {
  file: string;
  json: boolean;
  write: boolean;
}

function parseArgs(args: readonly string[]): TuneArgs | string {
  let file: string | undefined;
  let json = false;
  let write = false;
  for (const a of args) {
    if (a === "--json") json = true;
    else if (a === "--write") write = true;
    else if (a.startsWith("-")) return `poise tune: unknown option ${a} (${USAGE})`;
    else if (file === undefined) file = a;
    else return `poise tune: one file at a time (got ${file} and ${a})`;
  }
  if (file === undefined) return `poise tune: name one .poise file (${USAGE})`;
  return { file, json, write };
}

/** Hand forces to the hundredth of a newton (finer than a hand feels). */
const newtons = (n: number | undefined) => (n === undefined ? "-" : `${n.toFixed(2)} N`);

function errorsOf(findings: readonly Finding[]): Finding[] {
  return findings.filter((f) => f.severity === "error");
}

/** Each tuned value as the text had it before: the present values written the same way. */
function beforeTexts(text: string, before: TuneAnalysis, r: TuneResult): Map<string, string> {
  const out = new Map<string, string>();
  const w = tunedEdits(
    text,
    before.tree,
    r.variables,
    r.variables.map((v) => v.current),
  );
  for (const x of w?.written ?? []) out.set(`${x.spring}|${x.what}`, x.text);
  return out;
}

/** What `poise tune` prints, as lines, and its JSON; the exit code. */
export function tuneReport(
  file: string,
  text: string,
  progress?: (fraction: number, message: string) => void,
): { lines: string[]; json: Record<string, unknown>; code: number; edited?: string } {
  const before = analyse(text, { budgetMs: CLI_BUDGET_MS });
  const r = tuneDesign(text, {
    analyse: (t, o) => analyse(t, o),
    before,
    budgetMs: CLI_BUDGET_MS,
    ...(progress ? { progress } : {}),
  });
  const ran = before.model !== undefined && before.sweep !== undefined && before.sweep.poses.length > 0;
  const final = r.improved && r.after ? r.after : before;
  const errors = errorsOf(final.findings);
  const warnings = final.findings.filter((f) => f.severity === "warning").length;
  const lines: string[] = [];
  const was = beforeTexts(text, before, r);
  if (r.improved) {
    for (const s of r.springs) {
      const seen = new Set<string>();
      const parts = s.values.flatMap((v) => {
        if (seen.has(v.what)) return [];
        seen.add(v.what);
        const then = was.get(`${s.id}|${v.what}`);
        return then === v.text ? [] : [`${v.what} ${then ?? "?"} -> ${v.text}`];
      });
      lines.push(`spring ${s.id}: ${parts.length > 0 ? parts.join("; ") : "as it is"}`);
    }
  } else lines.push(`no tuned design: ${r.reason ?? "nothing better found"}`);
  lines.push(
    `worst hand force over every pose and payload mass: ${newtons(r.worstBefore)}${r.improved ? ` -> ${newtons(r.worstAfter)}` : ""}`,
  );
  lines.push(
    `${r.improved ? "tuned design" : "present design"}: ${
      errors.length === 0
        ? "passes every check"
        : `${errors.length} error${errors.length === 1 ? "" : "s"} (first: ${errors[0]!.code}: ${errors[0]!.message})`
    }${warnings > 0 ? `, ${warnings} warning${warnings === 1 ? "" : "s"}` : ""}`,
  );
  if (r.stopped && !r.cancelled)
    lines.push(
      `the search stopped at its ${CLI_BUDGET_MS / 1000} s budget: the result is the best found by then`,
    );
  const json: Record<string, unknown> = {
    file,
    improved: r.improved,
    ...(r.reason ? { reason: r.reason } : {}),
    springs: r.springs.map((s) => ({
      id: s.id,
      values: s.values.map((v) => ({
        what: v.what,
        ...(v.axis ? { axis: v.axis } : {}),
        before: v.before,
        after: v.after,
        dimension: v.dimension,
        text: v.text,
      })),
    })),
    worst_hand_force: {
      before: r.worstBefore ?? null,
      after: r.improved ? (r.worstAfter ?? null) : null,
      unit: "N",
    },
    errors: errors.map((f) => ({ code: f.code, message: f.message })),
    warnings,
    evaluations: r.evaluations,
    stopped: r.stopped,
  };
  const code = !ran ? 2 : errors.length > 0 ? 1 : 0;
  return { lines, json, code, ...(r.improved ? { edited: applyEdits(text, r.edits) } : {}) };
}

export function runTune(args: string[], out: Output): number {
  const parsed = parseArgs(args);
  if (typeof parsed === "string") {
    out.err(`${parsed}\n`);
    return 2;
  }
  const text = readSpec(parsed.file, out, "tune");
  if (text === undefined) return 2;
  let shown = -1;
  const report = tuneReport(parsed.file, text, (fraction, message) => {
    const step = Math.floor(fraction * 10);
    if (step === shown) return;
    shown = step;
    out.err(`poise tune: ${Math.round(fraction * 100)} % ${message}\n`);
  });
  let written = false;
  if (parsed.write && report.edited !== undefined) {
    if (!writeTextFile(parsed.file, report.edited, out, "tune")) return 2;
    written = true;
  }
  if (parsed.json) out.out(`${JSON.stringify({ ...report.json, written }, null, 2)}\n`);
  else {
    const tail =
      report.edited === undefined
        ? []
        : [
            written
              ? `written to ${parsed.file}`
              : `run poise tune ${parsed.file} --write to write these values`,
          ];
    out.out(`${[...report.lines, ...tail].join("\n")}\n`);
  }
  return report.code;
}
