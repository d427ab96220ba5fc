// The status-bar item: the active spec's worst hand force and least safety factor, as the server
// sends them after each analysis (counterpoise/specSummary).
import * as vscode from "vscode";
import type { SpecSummary } from "../../server/src/lsp/custom-protocol";

export interface SpecStatusBar extends vscode.Disposable {
  update(summary: SpecSummary): void;
  follow(doc: vscode.TextDocument | undefined): void;
  forget(uri: string): void;
  clear(): void;
}

export function createStatusBar(): SpecStatusBar {
  const item = vscode.window.createStatusBarItem("counterpoise.summary", vscode.StatusBarAlignment.Left, 50);
  item.name = "Counterpoise spec summary";
  item.command = "workbench.actions.view.problems";
  const summaries = new Map<string, SpecSummary>();
  let activeUri: string | undefined;

  const show = () => {
    const s = activeUri ? summaries.get(activeUri) : undefined;
    if (!s) {
      if (activeUri) {
        item.text = "$(sync~spin) Counterpoise";
        item.tooltip = "Analysing the spec…";
        item.show();
      } else item.hide();
      return;
    }
    const icon = s.errors > 0 ? "$(error)" : s.warnings > 0 ? "$(warning)" : "$(check)";
    item.text = `${icon} ${s.text}`;
    item.tooltip = s.tooltip;
    item.show();
  };

  return {
    update(summary) {
      summaries.set(summary.uri, summary);
      show();
    },
    follow(doc) {
      activeUri = doc?.languageId === "counterpoise" ? doc.uri.toString() : undefined;
      show();
    },
    forget(uri) {
      summaries.delete(uri);
      show();
    },
    clear() {
      summaries.clear();
      show();
    },
    dispose() {
      item.dispose();
    },
  };
}
