// The VS Code side of Counterpoise: starts the bundled language server (dist/server.js) over node
// IPC, passes the settings, and shows the active spec's summary in the status bar. All the work
// is in the server.
import * as path from "node:path";
import * as vscode from "vscode";
import {
  LanguageClient,
  TransportKind,
  type LanguageClientOptions,
  type ServerOptions,
} from "vscode-languageclient/node";
import {
  SPEC_SUMMARY_NOTIFICATION,
  REANALYSE_REQUEST,
  TUNE_COMMAND,
  type SpecSummary,
} from "../../server/src/lsp/custom-protocol";
import { createStatusBar } from "./status-bar";
import { registerArmPreview, SHOW_ARM_COMMAND } from "./preview";

/** Runs the server's tune command without writing, with the arm drawing open to show the run. */
const TUNE_AND_SHOW_COMMAND = "counterpoise.tuneAndShow";

/** The active editor's spec, or a word saying to open one. */
function activeSpec(): vscode.Uri | undefined {
  const doc = vscode.window.activeTextEditor?.document;
  if (doc?.languageId === "counterpoise") return doc.uri;
  void vscode.window.showInformationMessage("Open a .poise file to tune its springs.");
  return undefined;
}

let client: LanguageClient | undefined;

function serverOptions(context: vscode.ExtensionContext): ServerOptions {
  const module = context.asAbsolutePath(path.join("dist", "server.js"));
  return {
    run: { module, transport: TransportKind.ipc },
    debug: { module, transport: TransportKind.ipc, options: { execArgv: ["--nolazy", "--inspect=6019"] } },
  };
}

function clientOptions(output: vscode.LogOutputChannel): LanguageClientOptions {
  return {
    documentSelector: [
      { scheme: "file", language: "counterpoise" },
      { scheme: "untitled", language: "counterpoise" },
    ],
    synchronize: { configurationSection: "counterpoise" },
    initializationOptions: { settings: vscode.workspace.getConfiguration("counterpoise") },
    outputChannel: output,
    middleware: {
      // The language client registers the server's tune command itself; from the command palette
      // it comes with no arguments, and then tunes the active spec.
      executeCommand: (command, args, next) => {
        if (command !== TUNE_COMMAND || args.length > 0) return next(command, args);
        const uri = activeSpec();
        return uri ? next(command, [uri.toString()]) : undefined;
      },
    },
  };
}

export async function activate(context: vscode.ExtensionContext): Promise<void> {
  const output = vscode.window.createOutputChannel("Counterpoise", { log: true });
  const status = createStatusBar();
  context.subscriptions.push(output, status);

  const start = async () => {
    client = new LanguageClient(
      "counterpoise",
      "Counterpoise",
      serverOptions(context),
      clientOptions(output),
    );
    client.onNotification(SPEC_SUMMARY_NOTIFICATION, (summary: SpecSummary) => status.update(summary));
    await client.start();
  };

  context.subscriptions.push(
    vscode.commands.registerCommand("counterpoise.restartServer", async () => {
      status.clear();
      if (client) await client.restart();
      else await start();
    }),
    vscode.commands.registerCommand("counterpoise.showServerLog", () => output.show(true)),
    vscode.commands.registerCommand(TUNE_AND_SHOW_COMMAND, async () => {
      const uri = activeSpec();
      if (!uri) return;
      await vscode.commands.executeCommand(SHOW_ARM_COMMAND, uri);
      await vscode.commands.executeCommand(TUNE_COMMAND, uri.toString(), { write: false });
      // The run changed no text: draw again so that it shows.
      await vscode.commands.executeCommand(SHOW_ARM_COMMAND, uri);
    }),
    vscode.commands.registerCommand("counterpoise.reanalyse", async () => {
      const doc = vscode.window.activeTextEditor?.document;
      if (client && doc?.languageId === "counterpoise")
        await client.sendRequest(REANALYSE_REQUEST, { uri: doc.uri.toString() });
    }),
    // Focus in the drawing panel (a webview) leaves no active text editor: keep the spec's figures
    // while its editor is still on screen, and hide them only when no editor is.
    vscode.window.onDidChangeActiveTextEditor((editor) => {
      if (editor || vscode.window.visibleTextEditors.length === 0) status.follow(editor?.document);
    }),
    vscode.workspace.onDidCloseTextDocument((doc) => status.forget(doc.uri.toString())),
  );

  await start();
  if (client) registerArmPreview(context, client);
  status.follow(vscode.window.activeTextEditor?.document);
}

export async function deactivate(): Promise<void> {
  await client?.stop();
  client = undefined;
}
