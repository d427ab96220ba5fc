// The bundled server over raw stdio, for the tests that write bytes the protocol library would
// never write (malformed frames): bytes go out as given, replies are read by the library's reader.
import { spawn, type ChildProcess } from "node:child_process";
import { StreamMessageReader, type Message } from "vscode-languageserver-protocol/node";

export class RawSession {
  readonly child: ChildProcess;
  readonly messages: Message[] = [];
  readonly stderr: string[] = [];
  exited: { code: number | null; signal: string | null } | undefined;
  private waiters: { test: (m: Message) => boolean; resolve: (m: Message) => void }[] = [];

  constructor(serverPath: string, cwd: string) {
    this.child = spawn(process.execPath, [serverPath, "--stdio"], { cwd, stdio: ["pipe", "pipe", "pipe"] });
    this.child.stderr!.on("data", (d: Buffer) => this.stderr.push(d.toString()));
    this.child.on("exit", (code, signal) => (this.exited = { code, signal }));
    new StreamMessageReader(this.child.stdout!).listen((m) => {
      this.messages.push(m);
      for (const w of this.waiters.filter((w) => w.test(m))) w.resolve(m);
      this.waiters = this.waiters.filter((w) => !w.test(m));
    });
  }

  send(bytes: string | Buffer): void {
    this.child.stdin!.write(bytes);
  }

  frame(message: object): string {
    const body = Buffer.from(JSON.stringify({ jsonrpc: "2.0", ...message }), "utf8");
    return `Content-Length: ${body.length}\r\n\r\n${body.toString("utf8")}`;
  }

  next(test: (m: Record<string, unknown>) => boolean): Promise<Record<string, unknown>> {
    const seen = this.messages.find((m) => test(m as unknown as Record<string, unknown>));
    if (seen) return Promise.resolve(seen as unknown as Record<string, unknown>);
    return new Promise((resolve) =>
      this.waiters.push({
        test: (m) => test(m as unknown as Record<string, unknown>),
        resolve: (m) => resolve(m as unknown as Record<string, unknown>),
      }),
    );
  }

  reply(id: number | null) {
    return this.next((m) => "id" in m && m["id"] === id && ("result" in m || "error" in m));
  }

  /** The first reply to any of these ids. */
  replyToAny(ids: number[]) {
    const wanted = new Set(ids);
    return this.next(
      (m) => typeof m["id"] === "number" && wanted.has(m["id"]) && ("result" in m || "error" in m),
    );
  }

  logged(pattern: RegExp) {
    return this.next(
      (m) =>
        m["method"] === "window/logMessage" && pattern.test((m["params"] as { message: string }).message),
    );
  }

  async initialize(): Promise<void> {
    this.send(
      this.frame({
        id: 1,
        method: "initialize",
        params: { processId: null, rootUri: null, capabilities: {} },
      }),
    );
    await this.reply(1);
    this.send(this.frame({ method: "initialized", params: {} }));
  }

  hover(id: number): string {
    return this.frame({
      id,
      method: "textDocument/hover",
      params: { textDocument: { uri: "file:///none.poise" }, position: { line: 0, character: 0 } },
    });
  }

  stop(): void {
    if (this.child.exitCode === null) this.child.kill();
  }
}
