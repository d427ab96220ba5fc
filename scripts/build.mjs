// Bundles the extension client, the language server, the `poise` command and the benchmark into dist/.
import { build } from "esbuild";
import { existsSync } from "node:fs";

const entries = [
  { in: "client/src/extension.ts", out: "client", external: ["vscode"] },
  { in: "server/src/lsp/main.ts", out: "server" },
  // The analysis runs off the server's request path in this worker (server/src/lsp/session/runner.ts).
  { in: "server/src/lsp/session/analysis-worker.ts", out: "analysis-worker" },
  { in: "server/src/cli/main.ts", out: "cli" },
  { in: "bench/bench.ts", out: "bench" },
];

for (const entry of entries) {
  if (!existsSync(entry.in)) continue;
  await build({
    entryPoints: [entry.in],
    outfile: `dist/${entry.out}.js`,
    bundle: true,
    platform: "node",
    target: "node20",
    format: "cjs",
    sourcemap: true,
    external: entry.external ?? [],
    logLevel: "warning",
  });
}

// The arm preview's webview script, for the browser (client/media/preview-page.ts → dist/preview-page.js).
if (existsSync("client/media/preview-page.ts")) {
  await build({
    entryPoints: ["client/media/preview-page.ts"],
    outfile: "dist/preview-page.js",
    bundle: true,
    platform: "browser",
    target: "es2020",
    format: "iife",
    sourcemap: true,
    logLevel: "warning",
  });
}
