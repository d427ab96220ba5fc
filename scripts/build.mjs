// Bundles the extension client, the language server, the `poise` command and the benchmark into dist/.
import { build } from "esbuild";
import { existsSync } from "node:fs";

const entries = [
  { in: "client/src/extension.ts", out: "client", external: ["vscode"] },
  { in: "server/src/lsp/main.ts", out: "server" },
  // The analysis runs off the server's request path in this worker (server/src/lsp/runner.ts).
  { in: "server/src/lsp/analysis-worker.ts", out: "analysis-worker" },
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
