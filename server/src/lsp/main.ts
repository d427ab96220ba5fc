// Entry of the bundled language server (dist/server.js): node IPC when VS Code starts it,
// `--stdio` for other editors (also reachable as `poise lsp --stdio`).
import { createConnection, ProposedFeatures } from "vscode-languageserver/node";
import { startServer } from "./server";

startServer(createConnection(ProposedFeatures.all));
