// The arm preview panel: a webview beside the editor showing the arm of the active .poise file,
// re-requested from the server whenever that file's diagnostics or text change, and
// revealing a part's declaration when it is clicked in the drawing.
import * as vscode from "vscode";
import type { LanguageClient } from "vscode-languageclient/node";
import {
  ARM_VIEW_REQUEST,
  type ArmViewParams,
  type ArmViewResult,
} from "../../server/src/lsp/preview-protocol";
import { makeNonce, previewHtml } from "./preview-html";

export const SHOW_ARM_COMMAND = "counterpoise.showArm";
const VIEW_TYPE = "counterpoise.armView";
/** Diagnostics arrive in bursts while typing; one request per burst is enough. */
const REFRESH_DEBOUNCE_MS = 120;

class ArmPanel {
  private panel: vscode.WebviewPanel | undefined;
  private uri: vscode.Uri | undefined;
  private timer: ReturnType<typeof setTimeout> | undefined;
  private ticket = 0;

  constructor(
    private readonly context: vscode.ExtensionContext,
    private readonly client: LanguageClient,
  ) {}

  private roots(): vscode.Uri[] {
    return [
      vscode.Uri.joinPath(this.context.extensionUri, "dist"),
      vscode.Uri.joinPath(this.context.extensionUri, "client", "media"),
    ];
  }

  show(uri: vscode.Uri): void {
    this.uri = uri;
    if (this.panel) {
      this.panel.reveal(vscode.ViewColumn.Beside, true);
    } else {
      this.attach(
        vscode.window.createWebviewPanel(
          VIEW_TYPE,
          "Arm drawing",
          { viewColumn: vscode.ViewColumn.Beside, preserveFocus: true },
          { enableScripts: true, localResourceRoots: this.roots() },
        ),
      );
    }
    this.panel!.title = `Arm: ${uri.path.split("/").pop() ?? ""}`;
    this.refresh();
  }

  /** A panel the editor kept over a window reload: its page's saved state names the file (and
   * keeps the sliders' pose and headings), so it shows that file again. */
  restore(panel: vscode.WebviewPanel, state: unknown): void {
    const saved = (state as { uri?: unknown } | undefined)?.uri;
    if (this.panel || typeof saved !== "string") return void panel.dispose();
    panel.webview.options = { enableScripts: true, localResourceRoots: this.roots() };
    this.attach(panel);
    this.show(vscode.Uri.parse(saved));
  }

  private attach(panel: vscode.WebviewPanel): void {
    this.panel = panel;
    const webview = this.panel.webview;
    webview.html = previewHtml({
      cspSource: webview.cspSource,
      nonce: makeNonce(),
      scriptUri: webview
        .asWebviewUri(vscode.Uri.joinPath(this.context.extensionUri, "dist", "preview-page.js"))
        .toString(),
      styleUri: webview
        .asWebviewUri(vscode.Uri.joinPath(this.context.extensionUri, "client", "media", "preview.css"))
        .toString(),
    });
    webview.onDidReceiveMessage((msg) => this.onMessage(msg), undefined, this.context.subscriptions);
    this.panel.onDidChangeViewState(
      () => this.panel?.visible && this.refresh(),
      undefined,
      this.context.subscriptions,
    );
    this.panel.onDidDispose(() => (this.panel = undefined), undefined, this.context.subscriptions);
  }

  /** The active editor moved to another .poise file: follow it if the panel is open. */
  follow(editor: vscode.TextEditor | undefined): void {
    if (
      this.panel &&
      editor?.document.languageId === "counterpoise" &&
      editor.document.uri.toString() !== this.uri?.toString()
    )
      this.show(editor.document.uri);
  }

  diagnosticsChanged(uris: readonly vscode.Uri[]): void {
    if (!this.panel || !this.uri || !uris.some((u) => u.toString() === this.uri!.toString())) return;
    if (this.timer) clearTimeout(this.timer);
    this.timer = setTimeout(() => this.refresh(), REFRESH_DEBOUNCE_MS);
  }

  private async refresh(): Promise<void> {
    const panel = this.panel;
    const uri = this.uri;
    if (!panel || !uri) return;
    const ticket = ++this.ticket;
    let model: ArmViewResult = null;
    try {
      const params: ArmViewParams = { uri: uri.toString() };
      model = await this.client.sendRequest<ArmViewResult>(ARM_VIEW_REQUEST, params);
    } catch (err) {
      this.client.outputChannel.appendLine(`Counterpoise: the arm view request failed: ${String(err)}`);
    }
    if (ticket !== this.ticket || this.panel !== panel) return; // a newer request is on its way
    void panel.webview.postMessage({ type: "view", model, uri: uri.toString() });
  }

  private async onMessage(msg: {
    type?: string;
    partId?: string;
    range?: { start: { line: number; character: number }; end: { line: number; character: number } };
  }): Promise<void> {
    if (msg?.type === "ready") return void this.refresh();
    if (msg?.type !== "reveal" || !this.uri || !msg.range) return;
    const range = new vscode.Range(
      msg.range.start.line,
      msg.range.start.character,
      msg.range.end.line,
      msg.range.end.character,
    );
    const doc = await vscode.workspace.openTextDocument(this.uri);
    const visible = vscode.window.visibleTextEditors.find(
      (e) => e.document.uri.toString() === this.uri!.toString(),
    );
    const editor = await vscode.window.showTextDocument(doc, {
      viewColumn: visible?.viewColumn ?? vscode.ViewColumn.One,
      selection: range,
      preserveFocus: false,
    });
    editor.revealRange(range, vscode.TextEditorRevealType.InCenterIfOutsideViewport);
  }
}

/** Registers the command, its editor-title button (package.json) and the panel's live updates. */
export function registerArmPreview(context: vscode.ExtensionContext, client: LanguageClient): void {
  const panel = new ArmPanel(context, client);
  context.subscriptions.push(
    vscode.commands.registerCommand(SHOW_ARM_COMMAND, (uri?: vscode.Uri) => {
      const target = uri ?? vscode.window.activeTextEditor?.document.uri;
      if (!target) return void vscode.window.showInformationMessage("Open a .poise file to see its arm.");
      panel.show(target);
    }),
    vscode.languages.onDidChangeDiagnostics((e) => panel.diagnosticsChanged(e.uris)),
    // Backup for an analysis whose diagnostics did not change: the request waits for the new text.
    vscode.workspace.onDidChangeTextDocument(
      (e) => e.contentChanges.length && panel.diagnosticsChanged([e.document.uri]),
    ),
    vscode.window.onDidChangeActiveTextEditor((e) => panel.follow(e)),
    vscode.window.registerWebviewPanelSerializer(VIEW_TYPE, {
      deserializeWebviewPanel: async (restored, state) => panel.restore(restored, state),
    }),
  );
}
