// `poise check FILE... [--json]`: one line per diagnostic `path:line:column: severity code:
// message` (1-based), then a one-line summary; or one JSON array, each diagnostic with its figures
// (`data`: subject and SI numbers). Exit 0 no errors, 1 errors, 2 the command could not run.
import { analyse } from "../analysis";
import { optimiseFor } from "./optimiser";
import { CLI_BUDGET_MS } from "../limits";
import type { Finding } from "../findings/finding";
import { LineIndex } from "../syntax/span";
import { readSpec, type Output } from "./io";

export interface JsonDiagnostic {
  file: string;
  line: number;
  column: number;
  endLine: number;
  endColumn: number;
  severity: Finding["severity"];
  code: string;
  message: string;
  /** The finding's subject and figures, SI (findings/data.ts; docs/checks.md). */
  data: Finding["data"];
}

export function diagnosticsOf(file: string, text: string): JsonDiagnostic[] {
  optimiseFor(text);
  const analysis = analyse(text, { budgetMs: CLI_BUDGET_MS });
  const lines = new LineIndex(text);
  return [...analysis.findings]
    .sort((a, b) => a.span.start - b.span.start || a.span.end - b.span.end)
    .map((f) => {
      const start = lines.position(f.span.start);
      const end = lines.position(f.span.end);
      return {
        file,
        line: start.line + 1,
        column: start.character + 1,
        endLine: end.line + 1,
        endColumn: end.character + 1,
        severity: f.severity,
        code: f.code,
        // One diagnostic, one line: a message never breaks the line format.
        message: f.message.replace(/\s*[\r\n]+\s*/g, " "),
        data: f.data,
      };
    });
}

function plural(n: number, word: string): string {
  return `${n} ${word}${n === 1 ? "" : "s"}`;
}

export function runCheck(files: string[], json: boolean, out: Output): number {
  if (files.length === 0) {
    out.err("poise check: name at least one .poise file (poise check FILE... [--json])\n");
    return 2;
  }
  const all: JsonDiagnostic[] = [];
  let unreadable = 0;
  for (const file of files) {
    const text = readSpec(file, out, "check");
    if (text === undefined) {
      unreadable++;
      continue;
    }
    all.push(...diagnosticsOf(file, text));
  }
  if (json) out.out(`${JSON.stringify(all, null, 2)}\n`);
  else {
    for (const d of all) out.out(`${d.file}:${d.line}:${d.column}: ${d.severity} ${d.code}: ${d.message}\n`);
    const count = (s: string) => all.filter((d) => d.severity === s).length;
    const notes = count("information") + count("hint");
    const checked = files.length - unreadable;
    out.out(
      `${plural(checked, "file")} checked: ${plural(count("error"), "error")}, ${plural(count("warning"), "warning")}${notes ? `, ${plural(notes, "note")}` : ""}${unreadable ? `; ${plural(unreadable, "file")} could not be read` : ""}\n`,
    );
  }
  if (unreadable > 0) return 2;
  return all.some((d) => d.severity === "error") ? 1 : 0;
}
