// The language server: wires documents, the analysis scheduler, diagnostics and every feature in
// FEATURES to a connection. Protocol handling only; all the work is in the core.
import {
  TextDocuments,
  TextDocumentSyncKind,
  DidChangeConfigurationNotification,
  type ClientCapabilities,
  type Connection,
  type InitializeResult,
  type ServerCapabilities,
} from "vscode-languageserver";
import { TextDocument } from "vscode-languageserver-textdocument";
import type { Analysis } from "../analysis";
import { BUILTIN_MATERIAL_IDS } from "../model/materials";
import { findingsToDiagnostics } from "./convert";
import type { FeatureContext } from "./context";
import { SPEC_SUMMARY_NOTIFICATION, REANALYSE_REQUEST, type ReanalyseParams } from "./custom-protocol";
import { FEATURES } from "./features";
import { createRunner } from "./session/runner";
import { attempt, guarded, reportFault, setFaultLogger } from "./safe";
import { AnalysisScheduler, type PublishedAnalysis } from "./session/scheduler";
import { DEFAULT_SETTINGS, readSettings, type Settings } from "./session/settings";
import { specSummary } from "./features/summary";
import { SyntaxViews } from "./session/syntax-view";

export const SERVER_NAME = "counterpoise";
export const SERVER_VERSION = "0.1.0";

/** The log line of one published analysis: which text, how many poses, how long, what it found. */
export function analysisLogLine(uri: string, version: number, analysis: Analysis): string {
  const t = analysis.timings;
  const ms = t.parse + t.model + t.solve + t.checks;
  const count = (severity: string) => {
    const n = analysis.findings.filter((f) => f.severity === severity).length;
    return `${n} ${severity}${n === 1 ? "" : "s"}`;
  };
  const name = decodeURIComponent(uri.slice(uri.lastIndexOf("/") + 1));
  return `analysed ${name} version ${version}: ${analysis.sweep?.poses.length ?? 0} poses in ${ms.toFixed(0)} ms, ${count("error")}, ${count("warning")}`;
}

/** A fix job stopped this long past its budget (a hung phase) offers no fix: common practice, no
 * source (the margin a run of the analysis gets). */
const FIX_CHECK_HARD_MARGIN_MS = 2000;

export function startServer(connection: Connection): void {
  const documents = new TextDocuments(TextDocument);
  const views = new SyntaxViews();
  let settings: Settings = { ...DEFAULT_SETTINGS };
  let client: ClientCapabilities = {};
  const log = (message: string) => attempt("logging", () => connection.console.error(message));
  setFaultLogger(log);
  // Last line of defence: a fault that escapes every guard (a timer, a worker event) is logged and
  // the server stays up, rather than the editor losing all feedback.
  process.on("uncaughtException", (err) => reportFault("an event handler", err));
  process.on("unhandledRejection", (err) => reportFault("a pending task", err));

  const runner = createRunner(log, (message) => attempt("logging", () => connection.console.warn(message)));
  const scheduler = new AnalysisScheduler(
    runner,
    () => settings,
    (result) => attempt("publishing diagnostics", () => publish(result)),
  );

  const ctx: FeatureContext = {
    connection,
    documents,
    scheduler,
    settings: () => settings,
    client: () => client,
    syntax: (uri) => {
      const doc = documents.get(uri);
      return doc ? views.view(doc, BUILTIN_MATERIAL_IDS, scheduler.current(uri)) : undefined;
    },
    figures: (uri) => scheduler.latest(uri),
    // The options of the spec's full run, so the worker can reuse that analysis as the "before".
    checkFixes: (text, job) =>
      runner.checkFixes(
        text,
        { budgetMs: settings.analysisBudgetMs },
        job,
        job.budgetMs + FIX_CHECK_HARD_MARGIN_MS,
      ),
    log,
    tuneRuns: new Map(),
  };

  function publish({ uri, version, analysis }: PublishedAnalysis): void {
    const doc = documents.get(uri);
    if (!doc || doc.version !== version) return; // the text moved on: a newer run will publish
    const diagnostics = findingsToDiagnostics(analysis.findings, analysis.text, uri);
    void connection.sendDiagnostics({ uri, version, diagnostics });
    attempt("logging an analysis", () => connection.console.info(analysisLogLine(uri, version, analysis)));
    void connection.sendNotification(
      SPEC_SUMMARY_NOTIFICATION,
      specSummary(uri, version, analysis, settings),
    );
    if (client.workspace?.inlayHint?.refreshSupport)
      void connection.languages.inlayHint.refresh().catch(() => undefined);
  }

  async function pullSettings(): Promise<void> {
    if (!client.workspace?.configuration) return;
    try {
      const raw: unknown = await connection.workspace.getConfiguration({ section: "counterpoise" });
      settings = readSettings(raw);
    } catch (err) {
      log(`Counterpoise: could not read settings: ${String(err)}`);
    }
  }

  connection.onInitialize((params): InitializeResult => {
    client = params.capabilities ?? {};
    const init = params.initializationOptions as Record<string, unknown> | undefined;
    if (init) settings = readSettings(init["settings"] ?? init);
    let capabilities: ServerCapabilities = {
      textDocumentSync: {
        openClose: true,
        change: TextDocumentSyncKind.Incremental,
        save: { includeText: false },
      },
    };
    for (const feature of FEATURES) {
      try {
        capabilities = { ...capabilities, ...feature.capabilities(client) };
      } catch (err) {
        log(`Counterpoise: feature ${feature.name} could not state its capabilities: ${String(err)}`);
      }
    }
    return { capabilities, serverInfo: { name: SERVER_NAME, version: SERVER_VERSION } };
  });

  connection.onInitialized(
    guarded("initialized", undefined, async () => {
      if (client.workspace?.didChangeConfiguration?.dynamicRegistration) {
        await connection.client.register(DidChangeConfigurationNotification.type, {
          section: "counterpoise",
        });
      }
      const before = JSON.stringify(settings);
      await pullSettings();
      // A document opened before the settings arrived was analysed with the defaults.
      if (JSON.stringify(settings) !== before) scheduler.refreshAll();
    }),
  );

  connection.onDidChangeConfiguration(
    guarded("configuration change", undefined, async (change) => {
      const pushed = (change.settings as Record<string, unknown> | null | undefined)?.["counterpoise"];
      if (pushed) settings = readSettings(pushed);
      else await pullSettings();
      scheduler.refreshAll();
      // Hints may have been switched on or off, or their units changed.
      if (client.workspace?.inlayHint?.refreshSupport) await connection.languages.inlayHint.refresh();
    }),
  );

  const justOpened = new Set<string>();
  documents.onDidOpen((e) => justOpened.add(e.document.uri));
  documents.onDidChangeContent((e) =>
    attempt("document change", () => {
      const doc = e.document;
      const opened = justOpened.delete(doc.uri);
      scheduler.update(doc.uri, doc.version, doc.getText(), opened ? "full" : "typing", opened);
    }),
  );
  documents.onDidSave((e) => attempt("document save", () => scheduler.refresh(e.document.uri)));
  documents.onDidClose((e) =>
    attempt("document close", () => {
      justOpened.delete(e.document.uri);
      scheduler.close(e.document.uri);
      views.forget(e.document.uri);
      ctx.tuneRuns.delete(e.document.uri);
      void connection.sendDiagnostics({ uri: e.document.uri, diagnostics: [] });
    }),
  );

  connection.onRequest(
    REANALYSE_REQUEST,
    guarded("reanalyse", null, (params: ReanalyseParams) => {
      if (params?.uri) scheduler.refresh(params.uri);
      return null;
    }),
  );

  for (const feature of FEATURES) attempt(`registering ${feature.name}`, () => feature.register(ctx));

  connection.onShutdown(guarded("shutdown", undefined, () => scheduler.dispose()));
  documents.listen(connection);
  connection.listen();
}
