// Runs the `poise` command (bin/poise.js, the launcher of dist/cli.js) as a child process, as a
// terminal or CI would.
import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { ROOT } from "../lsp/protocol-client";

export { ensureBuilt, ROOT } from "../lsp/protocol-client";

export interface CliResult {
  status: number | null;
  stdout: string;
  stderr: string;
}

export function poise(...args: string[]): CliResult {
  const r = spawnSync(process.execPath, [join(ROOT, "bin", "poise.js"), ...args], {
    cwd: ROOT,
    encoding: "utf8",
    timeout: 60_000,
  });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** Writes a spec to a fresh temporary folder and returns its path. */
export function specFile(name: string, text: string): string {
  const dir = mkdtempSync(join(tmpdir(), "poise-cli-"));
  const path = join(dir, name);
  writeFileSync(path, text);
  return path;
}
