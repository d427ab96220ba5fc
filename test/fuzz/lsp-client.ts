// A minimal protocol client that drives the real bundled server (dist/server.js) over stdio, for
// the robustness tests and the latency benchmark. It waits for diagnostics to arrive rather than
// sleeping, answers the server's own requests, and keeps every fault the server logs.
import { spawn, type ChildProcess } from "node:child_process";
import { readFileSync } from "node:fs";
import {
  createMessageConnection,
  StreamMessageReader,
  StreamMessageWriter,
  type MessageConnection,
} from "vscode-languageserver-protocol/node";
import type {
  Diagnostic,
  InitializeResult,
  PublishDiagnosticsParams,
  ServerCapabilities,
} from "vscode-languageserver-protocol";

export interface LaunchOptions {
  serverPath: string;
  /** Extra node flags, e.g. the permission model's. */
  nodeArgs?: string[];
  /** Sent as initializationOptions.settings. */
  settings?: Record<string, unknown>;
  cwd?: string;
}

export interface Published {
  version?: number;
  diagnostics: Diagnostic[];
  at: number;
}

export class ServerSession {
  readonly child: ChildProcess;
  readonly conn: MessageConnection;
  capabilities: ServerCapabilities = {};
  /** Messages the server logged at error level (its guards report handler faults this way). */
  readonly errorLogs: string[] = [];
  /** Messages it logged as warnings (e.g. a worker restarted as a last resort). */
  readonly warningLogs: string[] = [];
  readonly stderr: string[] = [];
  exited: { code: number | null; signal: string | null } | undefined;
  private readonly published = new Map<string, Published[]>();
  private readonly waiters: { uri: string; version?: number; resolve: (p: Published) => void }[] = [];

  constructor(private readonly opts: LaunchOptions) {
    this.child = spawn(process.execPath, [...(opts.nodeArgs ?? []), opts.serverPath, "--stdio"], {
      cwd: opts.cwd,
      stdio: ["pipe", "pipe", "pipe"],
    });
    this.child.stderr!.on("data", (d: Buffer) => this.stderr.push(d.toString()));
    this.child.on("exit", (code, signal) => (this.exited = { code, signal }));
    this.conn = createMessageConnection(
      new StreamMessageReader(this.child.stdout!),
      new StreamMessageWriter(this.child.stdin!),
    );
    this.conn.onNotification("textDocument/publishDiagnostics", (p: PublishDiagnosticsParams) =>
      this.onPublish(p),
    );
    this.conn.onNotification("window/logMessage", (p: { type: number; message: string }) => {
      if (p.type === 1) this.errorLogs.push(p.message);
      if (p.type === 2) this.warningLogs.push(p.message);
    });
    this.conn.onNotification(() => undefined);
    // The server's own requests: settings, registrations, progress, refreshes.
    this.conn.onRequest((method, params) => {
      if (method === "workspace/configuration") {
        const items = (params as { items?: unknown[] } | undefined)?.items ?? [];
        return items.map(() => opts.settings ?? {});
      }
      return null;
    });
    this.conn.onError(() => undefined);
    this.conn.onClose(() => undefined);
    this.conn.listen();
  }

  get pid(): number {
    return this.child.pid ?? -1;
  }

  get alive(): boolean {
    return this.exited === undefined && this.child.exitCode === null;
  }

  async initialize(timeoutMs = 15_000): Promise<InitializeResult> {
    const result = await this.request<InitializeResult>(
      "initialize",
      {
        processId: process.pid,
        rootUri: null,
        workspaceFolders: null,
        capabilities: {
          textDocument: {
            hover: { contentFormat: ["markdown", "plaintext"] },
            completion: { completionItem: { snippetSupport: true } },
            publishDiagnostics: { relatedInformation: true, versionSupport: true },
            documentSymbol: { hierarchicalDocumentSymbolSupport: true },
          },
          workspace: { configuration: true },
        },
        initializationOptions: { settings: this.opts.settings ?? {} },
      },
      timeoutMs,
    );
    this.capabilities = result.capabilities;
    await this.conn.sendNotification("initialized", {});
    return result;
  }

  private onPublish(p: PublishDiagnosticsParams): void {
    const entry: Published = {
      diagnostics: p.diagnostics,
      at: performance.now(),
      ...(p.version !== undefined ? { version: p.version } : {}),
    };
    const list = this.published.get(p.uri) ?? [];
    list.push(entry);
    if (list.length > 50) list.shift();
    this.published.set(p.uri, list);
    for (let i = this.waiters.length - 1; i >= 0; i--) {
      const w = this.waiters[i]!;
      if (
        w.uri === p.uri &&
        (w.version === undefined || p.version === undefined || w.version === p.version)
      ) {
        this.waiters.splice(i, 1);
        w.resolve(entry);
      }
    }
  }

  /** The next diagnostics published for `uri` at `version` (or any version if the server does not
   * send one); undefined after the timeout. */
  waitForDiagnostics(
    uri: string,
    version: number | undefined,
    timeoutMs: number,
  ): Promise<Published | undefined> {
    return new Promise((resolve) => {
      const timer = setTimeout(() => {
        const i = this.waiters.indexOf(waiter);
        if (i >= 0) this.waiters.splice(i, 1);
        resolve(undefined);
      }, timeoutMs);
      const waiter = {
        uri,
        ...(version !== undefined ? { version } : {}),
        resolve: (p: Published) => {
          clearTimeout(timer);
          resolve(p);
        },
      };
      this.waiters.push(waiter);
    });
  }

  open(uri: string, text: string, version = 1): Promise<void> {
    return this.conn.sendNotification("textDocument/didOpen", {
      textDocument: { uri, languageId: "counterpoise", version, text },
    });
  }

  /** Replaces the whole text (a full-document change, which every server must accept). */
  change(uri: string, version: number, text: string): Promise<void> {
    return this.conn.sendNotification("textDocument/didChange", {
      textDocument: { uri, version },
      contentChanges: [{ text }],
    });
  }

  /** An incremental change: `text` replaces the range. */
  edit(
    uri: string,
    version: number,
    range: { start: { line: number; character: number }; end: { line: number; character: number } },
    text: string,
  ): Promise<void> {
    return this.conn.sendNotification("textDocument/didChange", {
      textDocument: { uri, version },
      contentChanges: [{ range, text }],
    });
  }

  close(uri: string): Promise<void> {
    return this.conn.sendNotification("textDocument/didClose", { textDocument: { uri } });
  }

  /** A request with a deadline: rejects with "no answer" if the server does not reply in time. */
  request<R>(method: string, params: unknown, timeoutMs = 10_000): Promise<R> {
    let timer: ReturnType<typeof setTimeout> | undefined;
    const timeout = new Promise<never>((_, reject) => {
      timer = setTimeout(() => reject(new Error(`no answer to ${method} within ${timeoutMs} ms`)), timeoutMs);
    });
    return Promise.race([this.conn.sendRequest<R>(method, params), timeout]).finally(() =>
      clearTimeout(timer),
    );
  }

  /** Resident set and heap of the server process, kB, from /proc (Linux). */
  memoryKb(): { rss: number; data: number } | undefined {
    try {
      const status = readFileSync(`/proc/${this.pid}/status`, "utf8");
      const field = (name: string) => Number(new RegExp(`^${name}:\\s+(\\d+)`, "m").exec(status)?.[1] ?? NaN);
      return { rss: field("VmRSS"), data: field("VmData") };
    } catch {
      return undefined;
    }
  }

  async stop(): Promise<void> {
    if (this.alive) {
      try {
        await this.request("shutdown", null, 5000);
        await this.conn.sendNotification("exit");
      } catch {
        // Already gone or stuck: killed below.
      }
    }
    await new Promise((r) => setTimeout(r, 100));
    if (this.alive) this.child.kill("SIGKILL");
    this.conn.dispose();
  }
}

/** Splits text into lines the way the protocol counts them (\n, \r\n and \r end a line). */
export function protocolLines(text: string): string[] {
  return text.split(/\r\n|\r|\n/);
}

/** True when the position is inside the document as the protocol counts it. */
export function positionInDocument(
  lines: readonly string[],
  p: { line: number; character: number },
): boolean {
  return (
    Number.isInteger(p.line) &&
    Number.isInteger(p.character) &&
    p.line >= 0 &&
    p.line < lines.length &&
    p.character >= 0 &&
    p.character <= lines[p.line]!.length
  );
}
