#!/usr/bin/env node
// The `poise` command: a thin launcher for the bundled CLI in dist/.
//
// It loads dist/cli.js with the V8 code cache the build leaves beside it (dist/cli.code-cache,
// scripts/build.mjs): the bytecode of every function a check run uses, so a one-shot run skips
// parsing and compiling them (about a tenth of `poise check`'s CPU on a typical arm; see
// docs/robustness.md). Without the cache, or with one V8 refuses or that was built for another
// bundle, it compiles the bundle as usual: the cache changes speed, never results.
"use strict";
const path = require("node:path");
const fs = require("node:fs");
const vm = require("node:vm");
const v8 = require("node:v8");
const Module = require("node:module");

const dist = path.join(__dirname, "..", "dist");
const cli = path.join(dist, "cli.js");
const cacheFile = path.join(dist, "cli.code-cache");
/** The build ends dist/cli.js with this comment and the SHA-256 of what precedes it; the cache
 * file starts with the same 64 hex digits. V8's own check of a code cache compares the source's
 * length, not its text, so a cache from another build of the same length would otherwise run
 * stale bytecode. */
const BUNDLE_ID_MARK = "//# poise-bundle-id ";
const ID_LENGTH = 64;

function readBundle() {
  try {
    return fs.readFileSync(cli, "utf8");
  } catch {
    process.stderr.write("poise: dist/cli.js is missing; run `npm run build` first\n");
    process.exit(2);
  }
}

function bundleIdOf(source) {
  const at = source.lastIndexOf(BUNDLE_ID_MARK);
  return at < 0
    ? undefined
    : source.slice(at + BUNDLE_ID_MARK.length, at + BUNDLE_ID_MARK.length + ID_LENGTH);
}

/** The cache's V8 data when it was built for this bundle, else a reason it is not used. */
function cacheFor(bundleId) {
  let bytes;
  try {
    bytes = fs.readFileSync(cacheFile);
  } catch {
    return { reason: "none beside the bundle" };
  }
  if (!bundleId || bytes.subarray(0, ID_LENGTH).toString("latin1") !== bundleId)
    return { reason: "built for another bundle" };
  return { data: bytes.subarray(ID_LENGTH) };
}

/** Compiles the bundle (with the cache where it fits) and runs it as Node runs a CommonJS module,
 * with its own module object and require. */
function launch() {
  const source = readBundle();
  const bundleId = bundleIdOf(source);
  const cache = cacheFor(bundleId);
  const script = new vm.Script(Module.wrap(source), { filename: cli, cachedData: cache.data });
  if (process.env.POISE_CODE_CACHE === "report") {
    const state = cache.data ? (script.cachedDataRejected ? "refused by V8" : "used") : "not used";
    process.stderr.write(`poise: code cache ${state}${cache.reason ? `: ${cache.reason}` : ""}\n`);
  }
  if (process.env.POISE_CODE_CACHE === "write" && bundleId) {
    // The build's training run (scripts/build.mjs). V8 accepts a cache only under the flags it
    // was made with, and the command turns the optimising compiler off for small specs
    // (server/src/cli/optimiser.ts): back to the default before writing, as a later run starts.
    process.on("exit", () => {
      v8.setFlagsFromString("--opt");
      fs.writeFileSync(
        cacheFile,
        Buffer.concat([Buffer.from(bundleId, "latin1"), script.createCachedData()]),
      );
    });
  }
  const bundleModule = new Module(cli, module);
  bundleModule.filename = cli;
  bundleModule.paths = Module._nodeModulePaths(dist);
  const run = script.runInThisContext();
  run.call(bundleModule.exports, bundleModule.exports, Module.createRequire(cli), bundleModule, cli, dist);
}

launch();
