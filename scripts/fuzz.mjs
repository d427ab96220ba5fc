// `npm run fuzz`: bundles the fuzzer (test/fuzz/long-run.ts) and runs it. Arguments pass through:
//   --runs N (default FUZZ_RUNS or 100000)  --seed S (default FUZZ_SEED or random)
//   --time-limit-ms T  --families valid,nearly-valid,byte-mutant,junk,large  --no-write  --json
// Every new failure is shrunk and written to test/fuzz/failures/ with its seed and path.
import { build } from "esbuild";
import { spawnSync } from "node:child_process";
import { fileURLToPath } from "node:url";
import { dirname, join } from "node:path";

const root = join(dirname(fileURLToPath(import.meta.url)), "..");
const outfile = join(root, "fuzz-failures-tmp", "long-run.cjs");

await build({
  entryPoints: [join(root, "test", "fuzz", "long-run.ts")],
  outfile,
  bundle: true,
  platform: "node",
  target: "node20",
  format: "cjs",
  sourcemap: "inline",
  logLevel: "warning",
});

const run = spawnSync(
  process.execPath,
  ["--enable-source-maps", outfile, "--root", root, ...process.argv.slice(2)],
  { stdio: "inherit" },
);
process.exit(run.status ?? 1);
