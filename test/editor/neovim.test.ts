// The Neovim set-up that docs/editors.md and the README give, run as written in a headless Neovim
// (Debian's package: 0.7), driving `poise lsp --stdio` through Neovim's built-in LSP client: each
// spec gets the diagnostics `poise check` finds, on the same lines and columns, and a hover
// answers. scripts/ensure-neovim.mjs installs Neovim before `npm test` when it can.
import { beforeAll, describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { chmodSync, mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { ROOT, ensureBuilt } from "../lsp/protocol-client";
import { poise } from "../cli/run-cli";

const MARKER =
  "<!-- neovim-setup: the same in README.md and docs/editors.md; run by test/editor/neovim.test.ts -->";

/** The first ```lua block after the marker in a Markdown file. */
function setupBlock(markdown: string): string {
  const after = markdown.slice(markdown.indexOf(MARKER));
  const m = /```lua\n([\s\S]*?)```/.exec(after);
  if (!markdown.includes(MARKER) || !m) throw new Error("no Neovim set-up block after the marker");
  return m[1]!;
}

interface NvimDiagnostic {
  line: number;
  column: number;
  severity: string;
  code: string;
  message: string;
}
interface NvimReport {
  neovim: string;
  specs: {
    file: string;
    filetype: string;
    clients: string[];
    arrived: boolean;
    diagnostics: NvimDiagnostic[];
  }[];
  hover: string | null;
  errors: string[];
}

const SPECS = ["samples/camera-arm.poise", "samples/mistakes.poise", "samples/lamp-arm.poise"];
let report: NvimReport;
let stderr = "";

beforeAll(() => {
  ensureBuilt();
  const dir = mkdtempSync(join(tmpdir(), "counterpoise-nvim-"));
  // `poise` on the PATH, as `npm link` would put it.
  const bin = join(dir, "bin");
  spawnSync("mkdir", ["-p", bin]);
  writeFileSync(
    join(bin, "poise"),
    `#!/bin/sh\nexec "${process.execPath}" "${join(ROOT, "bin", "poise.js")}" "$@"\n`,
  );
  chmodSync(join(bin, "poise"), 0o755);
  const init = join(dir, "init.lua");
  writeFileSync(init, setupBlock(readFileSync(join(ROOT, "docs", "editors.md"), "utf8")));
  const out = join(dir, "report.json");
  const camera = readFileSync(join(ROOT, "samples", "camera-arm.poise"), "utf8").split("\n");
  const springLine = camera.findIndex((l) => /^\s*spring lift \{/.test(l));
  const r = spawnSync(
    "nvim",
    [
      "--headless",
      "-n",
      "-i",
      "NONE",
      "-u",
      init,
      "-c",
      `luafile ${join(ROOT, "test", "editor", "neovim-driver.lua")}`,
    ],
    {
      cwd: ROOT,
      encoding: "utf8",
      timeout: 120_000,
      env: {
        ...process.env,
        PATH: `${bin}:${process.env["PATH"]}`,
        XDG_CONFIG_HOME: join(dir, "config"),
        XDG_DATA_HOME: join(dir, "data"),
        XDG_STATE_HOME: join(dir, "state"),
        XDG_CACHE_HOME: join(dir, "cache"),
        POISE_SPECS: SPECS.map((s) => join(ROOT, s)).join("\n"),
        POISE_HOVER: `${join(ROOT, "samples", "camera-arm.poise")}:${springLine + 1}:${camera[springLine]!.indexOf("lift") + 2}`,
        POISE_OUT: out,
      },
    },
  );
  stderr = `${r.error ?? ""}${r.stderr}`;
  if (r.error && (r.error as NodeJS.ErrnoException).code === "ENOENT")
    throw new Error("Neovim (nvim) is not installed: on Debian, apt-get install neovim");
  report = JSON.parse(readFileSync(out, "utf8")) as NvimReport;
}, 180_000);

describe(`Neovim's built-in LSP client with the documented set-up`, () => {
  it("the README gives the same set-up as docs/editors.md", () => {
    const readme = readFileSync(join(ROOT, "README.md"), "utf8");
    const docs = readFileSync(join(ROOT, "docs", "editors.md"), "utf8");
    expect(setupBlock(readme)).toBe(setupBlock(docs));
  });

  it("opens every spec as `counterpoise` with the server attached, without errors", () => {
    expect(report.errors, stderr).toEqual([]);
    expect(report.specs.map((s) => s.file)).toEqual(SPECS.map((s) => join(ROOT, s)));
    for (const spec of report.specs) {
      expect(spec.filetype, spec.file).toBe("counterpoise");
      expect(spec.clients, spec.file).toEqual(["counterpoise"]);
      expect(spec.arrived, `diagnostics for ${spec.file} (Neovim ${report.neovim})`).toBe(true);
    }
  });

  it("shows each spec's diagnostics where `poise check` puts them", () => {
    for (const [i, file] of SPECS.entries()) {
      // The command's contract (cli.md, `poise check --json`): 1-based line and column.
      const expected = (JSON.parse(poise("check", "--json", file).stdout) as NvimDiagnostic[]).map((d) => ({
        line: d.line,
        column: d.column,
        severity: d.severity,
        code: d.code,
        message: d.message,
      }));
      const key = (d: NvimDiagnostic) => `${d.line}:${d.column} ${d.severity} ${d.code} ${d.message}`;
      expect(report.specs[i]!.diagnostics.map(key).sort(), file).toEqual(expected.map(key).sort());
    }
    // The samples between them have errors and clean specs: the comparison is not of empty lists.
    expect(report.specs.some((s) => s.diagnostics.length > 0)).toBe(true);
  });

  it("answers a hover on a spring's name with its figures", () => {
    expect(report.hover).toMatch(/lift.*spring/);
    expect(report.hover).toMatch(/force range: [\d.]+ N \.\. [\d.]+ N/);
  });
});
