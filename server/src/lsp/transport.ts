// The server's connection: the protocol library's, over the transport the command line names
// (node IPC when VS Code starts it, `--stdio` for other editors), with what the library leaves
// to the server: a request before `initialize` is answered with the protocol's error -32002
// (ServerNotInitialized) and a notification then is dropped, as the specification says; over
// stdio a body that is not JSON is answered with -32700 (ParseError), valid JSON that is no
// message with -32600 (InvalidRequest), and a malformed frame header is logged and skipped
// (frame-guard.ts) instead of leaving the server deaf. Every reply is written by the library.
import { format } from "node:util";
import {
  createConnection,
  ErrorCodes,
  Message,
  ProposedFeatures,
  ResponseError,
  StreamMessageReader,
  StreamMessageWriter,
  type Connection,
  type ConnectionOptions,
  type MessageStrategy,
  type RequestMessage,
  type ResponseMessage,
} from "vscode-languageserver/node";
import { FrameGuard } from "./frame-guard";

/** A request that came before `initialize` is handed to this method, whose handler answers
 * -32002 with the library's own error reply. */
const NOT_INITIALIZED = "counterpoise/notInitialized";

export function createServerConnection(argv: readonly string[] = process.argv): Connection {
  let initialized = false;
  let shutdown = false;
  let reply: ((r: ResponseMessage) => void) | undefined;
  let log: (message: string) => void = (m) => process.stderr.write(`${m}\n`);
  const gate: MessageStrategy = {
    handleMessage(message, next) {
      if (!Message.isRequest(message) && !Message.isNotification(message) && !Message.isResponse(message)) {
        log(
          `Counterpoise: a message from the editor is not a JSON-RPC request, notification or response: ${format("%j", message).slice(0, 200)}`,
        );
        reply?.({
          jsonrpc: "2.0",
          id: null,
          error: { code: ErrorCodes.InvalidRequest, message: "Invalid request: not a JSON-RPC 2.0 message" },
        });
        return;
      }
      if (Message.isRequest(message) && message.method === "shutdown") shutdown = true;
      if (initialized || Message.isResponse(message)) return next(message);
      if (Message.isRequest(message)) {
        if (message.method === "initialize") {
          const result = next(message);
          initialized = true;
          return result;
        }
        const held: RequestMessage = {
          ...message,
          method: NOT_INITIALIZED,
          params: { method: message.method },
        };
        return next(held);
      }
      // a notification before initialize: dropped, except `exit`
      if (message.method === "exit") return next(message);
    },
  };
  const options: ConnectionOptions = { messageStrategy: gate };

  let connection: Connection;
  if (argv.includes("--stdio")) {
    const guard = new FrameGuard((m) => log(m));
    process.stdin.pipe(guard);
    const reader = new StreamMessageReader(guard);
    const writer = new StreamMessageWriter(process.stdout);
    reply = (r) => void writer.write(r).catch(() => undefined);
    reader.onError((err) => {
      // A frame was read whole but its body would not decode: not JSON.
      log(
        `Counterpoise: a message from the editor is not JSON (${err.message}); answered with a parse error.`,
      );
      reply?.({
        jsonrpc: "2.0",
        id: null,
        error: { code: ErrorCodes.ParseError, message: `Parse error: ${err.message}` },
      });
    });
    connection = createConnection(ProposedFeatures.all, reader, writer, options);
    // What the library does itself when it owns the streams: end with the editor, and keep
    // console output out of the message stream.
    for (const event of ["end", "close"] as const)
      process.stdin.on(event, () => process.exit(shutdown ? 0 : 1));
    routeConsole(connection);
  } else connection = createConnection(ProposedFeatures.all, options);
  log = (m) => {
    try {
      connection.console.error(m);
    } catch {
      process.stderr.write(`${m}\n`);
    }
  };
  connection.onRequest(NOT_INITIALIZED, (params: { method?: string } | undefined) => {
    return new ResponseError(
      ErrorCodes.ServerNotInitialized,
      `The server is not initialized: ${params?.method ?? "this request"} must come after initialize.`,
    );
  });
  return connection;
}

/** console.* to the editor's log, never to stdout (the message stream). */
function routeConsole(connection: Connection): void {
  const to =
    (write: (m: string) => void) =>
    (...args: unknown[]) =>
      write(format(...args));
  console.log = to((m) => connection.console.log(m));
  console.info = to((m) => connection.console.info(m));
  console.warn = to((m) => connection.console.warn(m));
  console.error = to((m) => connection.console.error(m));
  console.debug = to((m) => connection.console.log(m));
}
