// Maps the core's findings and spans to protocol diagnostics and ranges. The one place where
// offsets become line/character positions for the editor.
import { DiagnosticSeverity, type Diagnostic, type Range } from "vscode-languageserver";
import { LineIndex, type Span } from "../syntax/span";
import type { Finding } from "../findings/finding";
import type { Code, Severity } from "../findings/codes";

/** What rides in a diagnostic's `data`, so quick fixes can find the finding behind it. */
export interface DiagnosticData {
  code: Code;
  /** The finding's typed data (findings/data.ts: its subject and figures, SI), as the check wrote it. */
  detail?: Finding["data"];
  /** The finding's span as offsets into the text the analysis saw. */
  span: Span;
}

export const DIAGNOSTIC_SOURCE = "counterpoise";

const SEVERITY: Record<Severity, DiagnosticSeverity> = {
  error: DiagnosticSeverity.Error,
  warning: DiagnosticSeverity.Warning,
  information: DiagnosticSeverity.Information,
  hint: DiagnosticSeverity.Hint,
};

export function spanToRange(index: LineIndex, s: Span): Range {
  return { start: index.position(s.start), end: index.position(s.end) };
}

export function findingToDiagnostic(f: Finding, index: LineIndex, uri: string): Diagnostic {
  const data: DiagnosticData = {
    code: f.code,
    span: { start: f.span.start, end: f.span.end },
    detail: f.data,
  };
  const diagnostic: Diagnostic = {
    range: spanToRange(index, f.span),
    severity: SEVERITY[f.severity] ?? DiagnosticSeverity.Error,
    code: f.code,
    source: DIAGNOSTIC_SOURCE,
    message: f.message,
    data,
  };
  if (f.related.length > 0) {
    diagnostic.relatedInformation = f.related.map((r) => ({
      location: { uri, range: spanToRange(index, r.span) },
      message: r.message,
    }));
  }
  return diagnostic;
}

export function findingsToDiagnostics(findings: readonly Finding[], text: string, uri: string): Diagnostic[] {
  const index = new LineIndex(text);
  return findings.map((f) => findingToDiagnostic(f, index, uri));
}
