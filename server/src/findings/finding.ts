// A finding is the core's own diagnostic; the language server converts it to the protocol's,
// the CLI prints it. Its `data` has the shape its code gives it (data.ts).
import type { Span } from "./span";
import { CODES, type Code, type Severity } from "./codes";
import type { FindingDataMap } from "./data";

export interface RelatedInfo {
  span: Span;
  message: string;
}

/** A finding of one code. */
export interface FindingOf<C extends Code> {
  code: C;
  severity: Severity;
  span: Span;
  message: string;
  related: RelatedInfo[];
  /** The part it is about and its figures, SI: what quick fixes, hover, the view and
   * `poise check --json` read (never the message). */
  data: FindingDataMap[C];
}

/** Any finding: a union keyed by `code`, so testing the code narrows the data. */
export type Finding = { [C in Code]: FindingOf<C> }[Code];

/** The data of a code, for callers that build it before they know the span or message. */
export type FindingData<C extends Code> = FindingDataMap[C];

/** Codes whose data has no required field: their producers may leave it out. */
type OptionalDataCode = { [C in Code]: {} extends FindingDataMap[C] ? C : never }[Code];

interface Extra {
  related?: RelatedInfo[];
  severity?: Severity;
}

export function finding<C extends OptionalDataCode>(
  code: C,
  span: Span,
  message: string,
  extra?: Extra & { data?: FindingDataMap[C] },
): FindingOf<C>;
export function finding<C extends Code>(
  code: C,
  span: Span,
  message: string,
  extra: Extra & { data: FindingDataMap[C] },
): FindingOf<C>;
export function finding<C extends Code>(
  code: C,
  span: Span,
  message: string,
  extra: Extra & { data?: FindingDataMap[C] } = {},
): FindingOf<C> {
  return {
    code,
    severity: extra.severity ?? CODES[code].severity,
    span,
    message,
    related: extra.related ?? [],
    data: extra.data ?? ({} as FindingDataMap[C]),
  };
}

/** A type guard by code, for `findings.filter(isCode("strength.overstress"))`. */
export function isCode<C extends Code>(code: C): (f: Finding) => f is FindingOf<C> & Finding {
  return (f): f is FindingOf<C> & Finding => f.code === code;
}
