// `poise results FILE [--json] [--units si|us]`: every figure behind the checks, pass or fail
// (checks/results.ts builds the record), as JSON in docs/cli.md's shape or as lines to read.
// Exit 0 no errors, 1 the spec has errors, 2 the command could not run.
import { analyse } from "../analysis";
import { optimiseFor } from "./optimiser";
import { CLI_BUDGET_MS } from "../limits";
import {
  buildResults,
  RESULT_SECTIONS,
  resultsJson,
  type AgedResults,
  type FigureMap,
  type ResultsRecord,
} from "../checks/results";
import { formatNumber } from "../units/format";
import { tableUnit, toTableUnit } from "../units/format";
import type { UnitSystem } from "../units/unit-table";
import { readSpec, type Output } from "./io";

const USAGE = "poise results FILE [--json] [--units si|us]";

interface ResultsArgs {
  file: string;
  json: boolean;
  /** Absent: the system the spec is written in. */
  units?: UnitSystem;
}

function parseArgs(args: readonly string[]): ResultsArgs | string {
  let file: string | undefined;
  let json = false;
  let units: UnitSystem | undefined;
  for (let i = 0; i < args.length; i++) {
    const a = args[i]!;
    if (a === "--json") json = true;
    else if (a === "--units" || a.startsWith("--units=")) {
      const v = a === "--units" ? args[++i] : a.slice("--units=".length);
      if (v !== "si" && v !== "us") return `poise results: --units takes si or us (${USAGE})`;
      units = v;
    } else if (a.startsWith("-")) return `poise results: unknown option ${a} (${USAGE})`;
    else if (file === undefined) file = a;
    else return `poise results: one file at a time (got ${file} and ${a})`;
  }
  if (file === undefined) return `poise results: name one .poise file (${USAGE})`;
  return { file, json, ...(units ? { units } : {}) };
}

/** The record as the JSON that `--json` prints, for a spec's text (what the tests call). */
export function resultsOf(
  text: string,
  units?: UnitSystem,
): {
  json: Record<string, unknown>;
  record: ResultsRecord;
  errors: string[];
  solved: boolean;
  units: UnitSystem;
} {
  // Figures and messages in the system asked for, else the one the spec is written in.
  optimiseFor(text);
  const analysis = analyse(text, { budgetMs: CLI_BUDGET_MS, ...(units ? { units } : {}) });
  const record = buildResults(analysis);
  const system = units ?? analysis.units ?? "si";
  return {
    units: system,
    json: resultsJson(record, system),
    record,
    errors: analysis.findings.filter((f) => f.severity === "error").map((f) => f.message),
    solved: analysis.sweep !== undefined,
  };
}

// ---- lines to read -----------------------------------------------------------------------------

function words(key: string): string {
  return key.replace(/_/g, " ");
}

function figureText(map: FigureMap, system: UnitSystem): string {
  return Object.entries(map)
    .map(([key, f]) => {
      if (!f) return `${words(key)} -`;
      const unit = tableUnit(f.dimension, system);
      const n = (v: number) => formatNumber(toTableUnit(v, f.dimension, system));
      const value = f.high === undefined ? n(f.value) : `${n(f.value)} .. ${n(f.high)}`;
      return `${words(key)} ${value}${unit ? ` ${unit}` : ""}`;
    })
    .join("; ");
}

/** The record as lines: one per part, `-` where a figure is not computed or unlimited. */
export function resultsText(record: ResultsRecord, system: UnitSystem): string {
  const lines: string[] = [];
  const width = (ids: string[]) => Math.max(8, ...ids.map((id) => id.length));
  const parts = Object.entries(record.parts).sort((a, b) => a[1].safety - b[1].safety);
  lines.push(parts.length ? "parts (least safety factor first):" : "parts: no safety factors computed");
  const pw = width(parts.map(([id]) => id));
  for (const [id, p] of parts)
    lines.push(
      `  ${id.padEnd(pw)}  safety ${Number.isFinite(p.safety) ? p.safety.toFixed(2) : "-"} (${p.check}, ${p.required} required)${p.where ? ` ${p.where}` : ""}`,
    );
  const section = (name: string) => {
    const entries = Object.entries(record.sections[name] ?? {});
    if (entries.length === 0) {
      lines.push(`${name}: none`);
      return;
    }
    lines.push(`${name}:`);
    const w = width(entries.map(([id]) => id));
    for (const [id, map] of entries) lines.push(`  ${id.padEnd(w)}  ${figureText(map, system)}`);
  };
  section("payloads");
  lines.push(figureText(record.arm, system));
  lines.push(`base: ${figureText(record.base, system)}`);
  for (const s of RESULT_SECTIONS)
    if (s.name !== "payloads" && !(s.onlyTagged && Object.keys(record.sections[s.name] ?? {}).length === 0))
      section(s.name);
  const units = (["length", "force", "torque", "angle", "frequency"] as const)
    .map((d) => `${d} ${tableUnit(d, system)}`)
    .join(", ");
  if (record.aged) agedLines(record.aged, system, lines, width);
  lines.push(`units: ${units}; safety factors are plain numbers; - where not computed or unlimited`);
  return `${lines.join("\n")}\n`;
}

/** The aged case's figures, after the arm as built's. */
function agedLines(
  aged: AgedResults,
  system: UnitSystem,
  lines: string[],
  width: (ids: string[]) => number,
): void {
  lines.push(`aged case, after ${aged.afterWords} (balance and stiffness re-checked):`);
  const ids = [...Object.keys(aged.payloads), ...Object.keys(aged.springs)];
  const w = width(ids);
  for (const [id, map] of Object.entries(aged.payloads))
    lines.push(`  ${id.padEnd(w)}  ${figureText(map, system)}`);
  lines.push(`  ${figureText(aged.arm, system)}`);
  for (const [id, map] of Object.entries(aged.springs))
    lines.push(`  ${id.padEnd(w)}  ${figureText(map, system)}`);
}

export function runResults(args: string[], out: Output): number {
  const parsed = parseArgs(args);
  if (typeof parsed === "string") {
    out.err(`${parsed}\n`);
    return 2;
  }
  const text = readSpec(parsed.file, out, "results");
  if (text === undefined) return 2;
  const r = resultsOf(text, parsed.units);
  out.out(parsed.json ? `${JSON.stringify(r.json, null, 2)}\n` : resultsText(r.record, r.units));
  if (!r.solved)
    out.err(
      `poise results: ${parsed.file} could not be solved, so its figures are missing: ${
        r.errors.slice(0, 3).join("; ") || "no model"
      } (run poise check ${parsed.file})\n`,
    );
  else if (r.errors.length > 0)
    out.err(
      `poise results: ${parsed.file} has ${r.errors.length} error${r.errors.length === 1 ? "" : "s"} (run poise check ${parsed.file})\n`,
    );
  if (r.errors.length > 0) return 1;
  return r.solved ? 0 : 2;
}
