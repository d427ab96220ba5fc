// A fast parse of a document's current text (not its last analysis), cached per version: what
// completion, navigation, outline, folding, highlighting and formatting read, so they follow the
// text as typed while the heavy analysis runs elsewhere.
import type { TextDocument } from "vscode-languageserver-textdocument";
import { parse } from "../syntax/parser";
import type { SyntaxTree } from "../syntax/ast";
import { LineIndex } from "../syntax/span";
import { buildNameIndex, type NameIndex } from "./names";

export interface SyntaxView {
  uri: string;
  version: number;
  text: string;
  tree: SyntaxTree;
  lines: LineIndex;
  names: NameIndex;
}

const EMPTY_TREE: SyntaxTree = { arms: [], comments: [], errors: [] };

export class SyntaxViews {
  private readonly cache = new Map<string, { view: SyntaxView; materialsKey: string }>();

  /** `builtinMaterials` come from the last model (the library is in the core, not here);
   * `analysed` is the current analysis, whose tree serves when it is of this very text (a large
   * spec then is not parsed twice). */
  view(doc: TextDocument, builtinMaterials: readonly string[], analysed?: { text: string; tree: SyntaxTree }): SyntaxView {
    const key = builtinMaterials.join(",");
    const hit = this.cache.get(doc.uri);
    if (hit && hit.view.version === doc.version && hit.materialsKey === key) return hit.view;
    const text = doc.getText();
    let tree: SyntaxTree;
    try {
      if (hit && hit.view.version === doc.version) tree = hit.view.tree;
      else if (analysed && analysed.text === text) tree = analysed.tree;
      else tree = parse(text);
    } catch {
      tree = EMPTY_TREE; // parsing never fails by contract; this guards a broken parser
    }
    const view: SyntaxView = { uri: doc.uri, version: doc.version, text, tree, lines: new LineIndex(text), names: buildNameIndex(tree, builtinMaterials) };
    this.cache.set(doc.uri, { view, materialsKey: key });
    return view;
  }

  forget(uri: string): void {
    this.cache.delete(uri);
  }
}
