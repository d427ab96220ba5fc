// A fix is pure text: edits at offsets of the text that was analysed, a title that says what it
// does, and whether it is the one to prefer. The core produces them beside the check they fix;
// the language server maps them to protocol edits and the `poise` command may apply them.
import type { Span } from "./span";
import type { Code } from "./codes";
import type { FindingDataMap } from "./data";

export interface TextEdit {
  span: Span;
  newText: string;
}

export interface TextFix {
  title: string;
  edits: TextEdit[];
  preferred?: boolean;
}

/** What a fix reads of a finding: its code, the words it points at, and its typed data (a finding
 * itself fits). Never its message. */
export type FixRequest = { [C in Code]: { code: C; span: Span; data: FindingDataMap[C] } }[Code];

/** The request of one code. */
export type FixRequestOf<C extends Code> = Extract<FixRequest, { code: C }>;
