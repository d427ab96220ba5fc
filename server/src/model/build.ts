// PLACEHOLDER until the model builder lands.
import type { SyntaxTree } from "../syntax/ast";
import type { ArmModel } from "./types";
import type { Finding } from "../checks/finding";
export function buildModel(_tree: SyntaxTree, _text: string): { model?: ArmModel; findings: Finding[] } {
  return { findings: [] };
}
