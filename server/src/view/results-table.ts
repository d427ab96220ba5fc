// The report's table of figures over the range: hand force, deflection, tilt, the lowest natural
// frequency, tipping safety, spring forces and lengths — each against its requirement, shown
// whether it passes or fails. Read from the results record (checks/results.ts), so a figure a
// check adds there appears here too.
import type { FigureMap, ResultFigure, ResultsRecord } from "../checks/results";
import { formatResult } from "../units/format";
import type { UnitSystem } from "../units/unit-table";
import { esc } from "./text";

/** Figures the table lists even when they could not be computed (then it says so): a designer
 * expects them on every arm. */
const ALWAYS_SHOWN = new Set(["hand_force", "deflection", "tilt", "frequency"]);

function words(key: string): string {
  return key.replace(/_/g, " ");
}

function value(v: number, f: ResultFigure, units: UnitSystem): string {
  if (f.dimension === "dimensionless") return Number.isFinite(v) ? v.toFixed(2) : "–";
  return formatResult(v, f.dimension, units);
}

function shown(f: ResultFigure, units: UnitSystem): string {
  return f.high === undefined
    ? value(f.value, f, units)
    : `${value(f.value, f, units)} .. ${value(f.high, f, units)}`;
}

/** True when the figure is past its requirement (a range: its largest magnitude). */
function fails(f: ResultFigure): boolean {
  if (f.limit === undefined) return false;
  const v = f.high === undefined ? f.value : Math.max(Math.abs(f.value), Math.abs(f.high));
  return f.atLeast ? v < f.limit : v > f.limit;
}

function requirement(f: ResultFigure, units: UnitSystem): string {
  if (f.limit === undefined) return "";
  const limit =
    f.dimension === "dimensionless" ? f.limit.toFixed(2) : formatResult(f.limit, f.dimension, units);
  return `${f.atLeast ? "at least" : "at most"} ${limit}`;
}

/** Rows of one part's figures; `part` undefined for the arm as a whole. */
function rows(label: string, part: string | undefined, map: FigureMap, units: UnitSystem): string {
  const data = part ? ` data-part="${esc(part)}"` : "";
  let out = "";
  for (const [key, f] of Object.entries(map)) {
    if (!f) {
      if (ALWAYS_SHOWN.has(key))
        out += `<tr${data}><td>${esc(label)}</td><td>${esc(words(key))}</td><td class="num">not computed</td><td></td><td>see the diagnostics</td></tr>`;
      continue;
    }
    const bad = fails(f);
    out +=
      `<tr class="${bad ? "fail" : "ok"}"${data}><td>${esc(label)}</td><td>${esc(words(key))}</td>` +
      `<td class="num">${esc(shown(f, units))}${bad ? " ✗" : ""}</td><td>${esc(requirement(f, units))}</td><td>${esc(f.where ?? "")}</td></tr>`;
  }
  return out;
}

export function resultsTableHtml(results: ResultsRecord | undefined, units: UnitSystem): string {
  if (!results) return `<p class="none">No figures: the arm has not been solved.</p>`;
  let body = "";
  for (const [id, map] of Object.entries(results.sections["payloads"] ?? {}))
    body += rows(id, id, map, units);
  body += rows("the arm", undefined, results.arm, units);
  body += rows(results.baseId ?? "base", results.baseId, results.base, units);
  for (const [name, section] of Object.entries(results.sections))
    if (name !== "payloads")
      for (const [id, map] of Object.entries(section)) body += rows(id, id, map, units);
  return (
    `<table class="figures"><thead><tr><th>part</th><th>figure</th><th>value</th><th>required</th><th>where</th></tr></thead><tbody>` +
    `${body}</tbody></table>`
  );
}
