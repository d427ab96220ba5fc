// The current text of a document, parsed and its names indexed, cached per version: what
// completion, navigation, outline, folding, highlighting and formatting read, so they follow the
// text as typed while the heavy analysis runs elsewhere (a fast parse until the analysis of this
// very text arrives; then its tree and the model builder's symbol table).
import type { TextDocument } from "vscode-languageserver-textdocument";
import { parse } from "../../syntax/parser";
import type { SyntaxTree } from "../../syntax/ast";
import { LineIndex } from "../../syntax/span";
import { buildNameIndex, mergeNameIndexes, nameIndexFromSymbols, type NameIndex } from "../../services/names";
import type { Analysis } from "../../analysis";

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
  private readonly cache = new Map<string, { view: SyntaxView; materialsKey: string; fromModel: boolean }>();

  /** `builtinMaterials` are the library's names; `analysed` is the current analysis: when it is
   * of this very text its tree serves (a large spec is not parsed twice) and its symbol table
   * names things, as the model builder resolved them. */
  view(
    doc: TextDocument,
    builtinMaterials: readonly string[],
    analysed?: Pick<Analysis, "text" | "tree" | "symbols">,
  ): SyntaxView {
    const key = builtinMaterials.join(",");
    const hit = this.cache.get(doc.uri);
    const text = doc.getText();
    const fromModel = !!analysed?.symbols && analysed.text === text;
    if (hit && hit.view.version === doc.version && hit.materialsKey === key && (hit.fromModel || !fromModel))
      return hit.view;
    let tree: SyntaxTree;
    try {
      if (hit && hit.view.version === doc.version) tree = hit.view.tree;
      else if (analysed && analysed.text === text) tree = analysed.tree;
      else tree = parse(text);
    } catch {
      tree = EMPTY_TREE; // parsing never fails by contract; this guards a broken parser
    }
    const fromTree = buildNameIndex(tree, builtinMaterials);
    const names = fromModel
      ? mergeNameIndexes(nameIndexFromSymbols(analysed!.symbols!, builtinMaterials), fromTree)
      : fromTree;
    const view: SyntaxView = {
      uri: doc.uri,
      version: doc.version,
      text,
      tree,
      lines: new LineIndex(text),
      names,
    };
    this.cache.set(doc.uri, { view, materialsKey: key, fromModel });
    return view;
  }

  forget(uri: string): void {
    this.cache.delete(uri);
  }
}
