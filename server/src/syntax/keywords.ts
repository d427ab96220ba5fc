// The words that open a declaration. The syntax layer needs them to recover from a missing `}`
// (a line starting with one of them ends an unclosed declaration); model/schema.ts says what each holds.
import type { DeclarationKeyword } from "./ast";

export const DECLARATION_KEYWORDS: readonly DeclarationKeyword[] = [
  "material",
  "base",
  "link",
  "joint",
  "swivel",
  "parallelogram",
  "spring",
  "payload",
  "bearing",
  "fastening",
  "require",
  "sweep",
  "aged",
];

/** Declarations written without a name. */
export const UNNAMED_DECLARATIONS: readonly DeclarationKeyword[] = ["require", "sweep", "aged"];

export function isDeclarationKeyword(word: string): word is DeclarationKeyword {
  return (DECLARATION_KEYWORDS as readonly string[]).includes(word);
}
