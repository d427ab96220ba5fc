// `node scripts/compare-analyses.mjs REV`: whether this tree's analysis gives the same findings and
// readouts, to the last digit, as the tree at git revision REV, on every bundled sample, every
// test fixture and two generated chains (30 and 60 bodies), at the spec's own density and at the
// typing density. For a change meant to be faster and nothing else: the golden test allows
// 1e-9 of relative difference (a reordered sum), this allows none. Exits 1 on a difference.
import { execFileSync } from "node:child_process";
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from "node:fs";
import { createRequire } from "node:module";
import { tmpdir } from "node:os";
import { join, relative } from "node:path";
import { build } from "esbuild";

const root = join(import.meta.dirname, "..");
const rev = process.argv[2];
if (!rev) {
  process.stderr.write("usage: node scripts/compare-analyses.mjs REV (a git revision to compare against)\n");
  process.exit(2);
}

// The other tree's sources, as committed at REV.
let archive;
try {
  archive = execFileSync("git", ["-C", root, "archive", rev, "server"], {
    maxBuffer: 256 * 1024 * 1024,
    stdio: ["ignore", "pipe", "pipe"],
  });
} catch {
  process.stderr.write(
    `compare-analyses: git has no revision ${JSON.stringify(rev)} with a server/ folder\n`,
  );
  process.exit(2);
}
const work = mkdtempSync(join(tmpdir(), "poise-compare-"));
try {
  const other = join(work, "other");
  mkdirSync(other);
  execFileSync("tar", ["-x", "-C", other], { input: archive });
  const bundleOf = async (tree, name) => {
    const entry = join(work, `${name}-entry.ts`);
    writeFileSync(
      entry,
      [
        `export { analyse } from ${JSON.stringify(join(tree, "server/src/analysis"))};`,
        `export { DEFAULT_SETTINGS } from ${JSON.stringify(join(tree, "server/src/lsp/session/settings"))};`,
        // the generated chains come from this tree's generator, the same text for both
        ...(tree === root
          ? [`export { chainSpec } from ${JSON.stringify(join(root, "test/fuzz/big-spec"))};`]
          : []),
      ].join("\n"),
    );
    const outfile = join(work, `${name}.cjs`);
    // The other tree has no node_modules of its own: both resolve their packages from this one.
    await build({
      entryPoints: [entry],
      bundle: true,
      platform: "node",
      format: "cjs",
      outfile,
      logLevel: "error",
      nodePaths: [join(root, "node_modules")],
    });
    return createRequire(import.meta.url)(outfile);
  };
  const mine = await bundleOf(root, "this");
  const theirs = await bundleOf(other, "other");

  const specs = [];
  const walk = (dir) => {
    for (const f of readdirSync(dir)) {
      const p = join(dir, f);
      if (statSync(p).isDirectory()) walk(p);
      else if (f.endsWith(".poise")) specs.push({ name: relative(root, p), text: readFileSync(p, "utf8") });
    }
  };
  walk(join(root, "samples"));
  walk(join(root, "test"));
  for (const bodies of [30, 60])
    specs.push({ name: `generated ${bodies}-body chain`, text: mine.chainSpec({ bodies }) });

  const densities = [
    { label: "own density", options: {} },
    { label: "typing density", options: { quickSteps: mine.DEFAULT_SETTINGS.stepsWhileTyping } },
  ];
  const record = (a) => JSON.stringify({ findings: a.findings, readouts: a.readouts });
  let differ = 0;
  for (const spec of specs)
    for (const d of densities) {
      const a = record(mine.analyse(spec.text, d.options));
      const b = record(theirs.analyse(spec.text, d.options));
      if (a === b) continue;
      differ++;
      let i = 0;
      while (a[i] === b[i]) i++;
      process.stdout.write(
        `differs: ${spec.name} (${d.label}) at ...${a.slice(Math.max(0, i - 60), i + 60)}...\n  against ...${b.slice(Math.max(0, i - 60), i + 60)}...\n`,
      );
    }
  process.stdout.write(
    `${specs.length} specs at ${densities.length} densities: ${differ === 0 ? "the same to the last digit" : `${differ} differ`} (this tree against ${rev})\n`,
  );
  process.exitCode = differ === 0 ? 0 : 1;
} finally {
  rmSync(work, { recursive: true, force: true });
}
