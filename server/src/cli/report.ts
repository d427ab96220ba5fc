// `poise report FILE [-o OUT] [--units si|us]`: the arm's drawing, curves, safety factors, diagnostics, limits and
// cautions as one self-contained HTML page. Exit 0 no errors, 1 the spec has errors, 2 could not run.
import { analyse } from "../analysis";
import { optimiseFor, optimiseForSearch } from "./optimiser";
import { CLI_BUDGET_MS } from "../limits";
import { reportPage } from "../view";
import { tuneDesign } from "../tune/index";
import { tunePreview } from "../tune/preview";
import { overwritesSpec, readSpec, writeTextFile, type Output } from "./io";

/** The tune overlay's own sweeps may take this long, ms. */
const PREVIEW_MS = 5000;

const USAGE = "usage: poise report FILE [-o OUT.html] [--units si|us]   (without -o the page goes to stdout)";

interface ReportArgs {
  file: string;
  out?: string;
  /** Absent: the system the spec is written in. */
  units?: "si" | "us";
}

function parseArgs(args: readonly string[]): ReportArgs | string {
  let file: string | undefined;
  let out: string | undefined;
  let units: "si" | "us" | undefined;
  for (let i = 0; i < args.length; i++) {
    const a = args[i]!;
    if (a === "--units" || a.startsWith("--units=")) {
      const v = a === "--units" ? args[++i] : a.slice("--units=".length);
      if (v !== "si" && v !== "us") return `poise report: --units takes si or us`;
      units = v;
    } else if (a === "-o" || a === "--output") {
      const next = args[++i];
      if (next === undefined) return `poise report: ${a} needs a file name`;
      out = next;
    } else if (a.startsWith("--output=")) out = a.slice("--output=".length);
    else if (a === "-h" || a === "--help") return USAGE;
    else if (a.startsWith("-")) return `poise report: unknown option ${a}`;
    else if (file === undefined) file = a;
    else return `poise report: one file at a time (got ${file} and ${a})`;
  }
  if (file === undefined) return `poise report: no file given`;
  return { file, ...(out !== undefined ? { out } : {}), ...(units ? { units } : {}) };
}

/** Builds the report page for a spec's text: the part the tests call without touching files. */
export function reportHtml(
  text: string,
  file: string,
  units?: "si" | "us",
): { html: string; errors: number } {
  // Figures and messages in the system asked for, else the one the spec is written in.
  const start = performance.now();
  optimiseFor(text);
  const analysis = analyse(text, { budgetMs: CLI_BUDGET_MS, ...(units ? { units } : {}) });
  // A spec with `tune` lines: the page shows the search's design beside the present one
  // (docs/tuning.md, "The preview"), within what is left of the command's budget.
  const tunes = analysis.model?.springs.some((s) => s.tunings?.some((t) => t.mode === "tune")) ?? false;
  const left = CLI_BUDGET_MS - (performance.now() - start);
  if (tunes) optimiseForSearch();
  const run = tunes && left > 0 ? tuneDesign(text, { analyse, before: analysis, budgetMs: left }) : undefined;
  const tune = run?.improved
    ? tunePreview(analysis, run, { deadline: performance.now() + PREVIEW_MS })
    : undefined;
  return {
    html: reportPage(analysis, { file, units: units ?? analysis.units ?? "si", ...(tune ? { tune } : {}) }),
    errors: analysis.findings.filter((f) => f.severity === "error").length,
  };
}

export function runReport(args: string[], out: Output): number {
  const parsed = parseArgs(args);
  if (typeof parsed === "string") {
    out.err(parsed === USAGE ? `${USAGE}\n` : `${parsed}\n${USAGE}\n`);
    return 2;
  }
  const clash = parsed.out !== undefined ? overwritesSpec(parsed.out, parsed.file) : undefined;
  if (clash) {
    out.err(`poise report: will not write the page over ${parsed.out}: ${clash}\n`);
    return 2;
  }
  const text = readSpec(parsed.file, out, "report");
  if (text === undefined) return 2;
  const { html, errors } = reportHtml(text, parsed.file, parsed.units);
  if (parsed.out === undefined) out.out(html);
  else {
    if (!writeTextFile(parsed.out, html, out, "report")) return 2;
    out.err(
      `poise report: wrote ${parsed.out}${errors ? ` (${errors} error${errors > 1 ? "s" : ""} in the spec)` : ""}\n`,
    );
  }
  return errors > 0 ? 1 : 0;
}
