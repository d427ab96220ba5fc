// Starts the bundled language server (dist/server.js --stdio) as a child process and talks to it
// through the protocol library's typed connection. Diagnostics are awaited as notifications,
// never slept for.
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { existsSync, readdirSync, statSync } from "node:fs";
import { join } from "node:path";
import {
  createProtocolConnection,
  StreamMessageReader,
  StreamMessageWriter,
  InitializeRequest,
  InitializedNotification,
  PublishDiagnosticsNotification,
  DidOpenTextDocumentNotification,
  DidChangeTextDocumentNotification,
  ShutdownRequest,
  ExitNotification,
  ConfigurationRequest,
  type ProtocolConnection,
  type PublishDiagnosticsParams,
  type InitializeResult,
} from "vscode-languageserver-protocol/node";

export const ROOT = join(__dirname, "..", "..");
export const SERVER = join(ROOT, "dist", "server.js");

function newestSource(dir: string): number {
  let newest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    newest = Math.max(newest, entry.isDirectory() ? newestSource(path) : statSync(path).mtimeMs);
  }
  return newest;
}

/** Builds dist/ when it is missing or older than the sources. */
export function ensureBuilt(): void {
  const bundles = ["server.js", "analysis-worker.js", "cli.js", "client.js"].map((b) =>
    join(ROOT, "dist", b),
  );
  const built = bundles.every(existsSync) ? Math.min(...bundles.map((b) => statSync(b).mtimeMs)) : 0;
  const sources = [join(ROOT, "server", "src"), join(ROOT, "client", "src")]
    .filter(existsSync)
    .map(newestSource);
  if (
    built >
    Math.max(
      statSync(join(ROOT, "scripts", "build.mjs")).mtimeMs,
      statSync(join(ROOT, "package.json")).mtimeMs,
      ...sources,
    )
  )
    return;
  const r = spawnSync(process.execPath, [join(ROOT, "scripts", "build.mjs")], {
    cwd: ROOT,
    encoding: "utf8",
  });
  if (r.status !== 0) throw new Error(`build failed: ${r.stderr}`);
}

export class ProtocolSession {
  readonly child: ChildProcess;
  readonly connection: ProtocolConnection;
  readonly logs: string[] = [];
  private readonly diagnostics: PublishDiagnosticsParams[] = [];
  private waiters: {
    test: (p: PublishDiagnosticsParams) => boolean;
    resolve: (p: PublishDiagnosticsParams) => void;
  }[] = [];

  /** `command`: the script and its arguments (default the bundled server over stdio). */
  constructor(settings: Record<string, unknown> = {}, command: string[] = [SERVER, "--stdio"]) {
    this.child = spawn(process.execPath, command, { cwd: ROOT, stdio: ["pipe", "pipe", "pipe"] });
    this.child.stderr!.on("data", (d: Buffer) => this.logs.push(d.toString()));
    this.connection = createProtocolConnection(
      new StreamMessageReader(this.child.stdout!),
      new StreamMessageWriter(this.child.stdin!),
    );
    this.connection.onNotification(PublishDiagnosticsNotification.type, (p) => {
      this.diagnostics.push(p);
      const ready = this.waiters.filter((w) => w.test(p));
      this.waiters = this.waiters.filter((w) => !w.test(p));
      for (const w of ready) w.resolve(p);
    });
    this.connection.onNotification("window/logMessage", (p: { message: string }) => {
      this.logs.push(p.message);
    });
    this.connection.onRequest(ConfigurationRequest.type, (params) => params.items.map(() => settings));
    // Registrations and refreshes the server asks for: accepted.
    for (const method of [
      "client/registerCapability",
      "workspace/inlayHint/refresh",
      "workspace/semanticTokens/refresh",
    ])
      this.connection.onRequest(method, () => null);
    this.connection.listen();
  }

  async initialize(): Promise<InitializeResult> {
    const result = await this.connection.sendRequest(InitializeRequest.type, {
      processId: process.pid,
      rootUri: null,
      workspaceFolders: null,
      capabilities: {
        textDocument: {
          hover: { contentFormat: ["markdown"] },
          completion: { completionItem: { snippetSupport: true } },
          publishDiagnostics: { relatedInformation: true, versionSupport: true },
          documentSymbol: { hierarchicalDocumentSymbolSupport: true },
          rename: { prepareSupport: true },
        },
        workspace: { configuration: true },
      },
    });
    await this.connection.sendNotification(InitializedNotification.type, {});
    return result;
  }

  /** The first diagnostics for `uri` (at `version`, if given) published from now on, or already
   * published. */
  diagnosticsFor(uri: string, version?: number): Promise<PublishDiagnosticsParams> {
    const test = (p: PublishDiagnosticsParams) =>
      p.uri === uri && (version === undefined || p.version === version);
    const seen = this.diagnostics.find(test);
    if (seen) return Promise.resolve(seen);
    return new Promise((resolve) => this.waiters.push({ test, resolve }));
  }

  /** The first diagnostics for `uri` that pass `test`, published from now on or already. */
  diagnosticsWhere(
    uri: string,
    test: (p: PublishDiagnosticsParams) => boolean,
  ): Promise<PublishDiagnosticsParams> {
    const mine = (p: PublishDiagnosticsParams) => p.uri === uri && test(p);
    const seen = this.diagnostics.find(mine);
    if (seen) return Promise.resolve(seen);
    return new Promise((resolve) => this.waiters.push({ test: mine, resolve }));
  }

  async open(uri: string, text: string, version = 1): Promise<PublishDiagnosticsParams> {
    const published = this.diagnosticsFor(uri, version);
    await this.connection.sendNotification(DidOpenTextDocumentNotification.type, {
      textDocument: { uri, languageId: "counterpoise", version, text },
    });
    return published;
  }

  async replace(uri: string, text: string, version: number): Promise<PublishDiagnosticsParams> {
    const published = this.diagnosticsFor(uri, version);
    await this.connection.sendNotification(DidChangeTextDocumentNotification.type, {
      textDocument: { uri, version },
      contentChanges: [{ text }],
    });
    return published;
  }

  async stop(): Promise<number | null> {
    const exited = new Promise<number | null>((resolve) => this.child.once("exit", (code) => resolve(code)));
    try {
      await this.connection.sendRequest(ShutdownRequest.type);
      await this.connection.sendNotification(ExitNotification.type);
    } catch {
      this.child.kill();
    }
    const code = await exited;
    this.connection.dispose();
    return code;
  }
}

/** Position (0-based) of the `nth` occurrence of `needle` in `text`, plus `shift` characters. */
export function positionOf(
  text: string,
  needle: string,
  shift = 0,
  nth = 0,
): { line: number; character: number } {
  let at = -1;
  for (let i = 0; i <= nth; i++) {
    at = text.indexOf(needle, at + 1);
    if (at < 0) throw new Error(`"${needle}" (${nth}) not in the text`);
  }
  const before = text.slice(0, at + shift);
  const line = before.split("\n").length - 1;
  return { line, character: before.length - (before.lastIndexOf("\n") + 1) };
}
