// Entry of the bundled language server (dist/server.js): node IPC when VS Code starts it,
// `--stdio` for other editors (also reachable as `poise lsp --stdio`).
import { startServer } from "./server";
import { createServerConnection } from "./transport";

startServer(createServerConnection());
