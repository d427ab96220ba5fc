// Bundles the extension client, the language server, the `poise` command and the benchmark into dist/.
import { build } from "esbuild";
import { spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import { appendFileSync, existsSync, readdirSync, readFileSync, rmSync } from "node:fs";
import { join } from "node:path";

const entries = [
  { in: "client/src/extension.ts", out: "client", external: ["vscode"] },
  { in: "server/src/lsp/main.ts", out: "server" },
  // The analysis runs off the server's request path in this worker (server/src/lsp/session/runner.ts).
  { in: "server/src/lsp/session/analysis-worker.ts", out: "analysis-worker" },
  // `poise lsp` requires the server's own bundle beside it (cli/io.ts).
  { in: "server/src/cli/main.ts", out: "cli", external: ["./server.js"] },
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

// The `poise` command's code cache (bin/poise.js): the bundle gets an id (the SHA-256 of its text)
// that the cache must carry, then a training run checks every bundled sample and leaves the
// bytecode of what it ran in dist/cli.code-cache. A failed training run only costs speed.
const cli = "dist/cli.js";
const cache = "dist/cli.code-cache";
rmSync(cache, { force: true });
if (existsSync(cli)) {
  const id = createHash("sha256").update(readFileSync(cli)).digest("hex");
  appendFileSync(cli, `//# poise-bundle-id ${id}\n`);
  const samples = (existsSync("samples") ? readdirSync("samples") : [])
    .filter((name) => name.endsWith(".poise"))
    .map((name) => join("samples", name));
  const run = spawnSync(process.execPath, ["bin/poise.js", "check", ...samples], {
    env: { ...process.env, POISE_CODE_CACHE: "write" },
    stdio: ["ignore", "ignore", "pipe"],
    encoding: "utf8",
    timeout: 120_000,
  });
  if (!existsSync(cache))
    console.warn(
      `build: no code cache for poise (the command works, only slower): ${run.stderr || run.error}`,
    );
}
