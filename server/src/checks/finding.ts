// A finding is the core's own diagnostic; the language server converts it to the protocol's,
// the CLI prints it.
import type { Span } from "../syntax/span";
import { CODES, type Code, type Severity } from "./codes";

export interface RelatedInfo {
  span: Span;
  message: string;
}

export interface Finding {
  code: Code;
  severity: Severity;
  span: Span;
  message: string;
  related: RelatedInfo[];
  /** Machine-readable detail for quick fixes (e.g. the best-fit rate), keyed by the check. */
  data?: Record<string, unknown>;
}

export function finding(
  code: Code,
  span: Span,
  message: string,
  extra: { related?: RelatedInfo[]; data?: Record<string, unknown>; severity?: Severity } = {},
): Finding {
  return {
    code,
    severity: extra.severity ?? CODES[code].severity,
    span,
    message,
    related: extra.related ?? [],
    ...(extra.data ? { data: extra.data } : {}),
  };
}
