// What the `poise` command (bin/poise.js over dist/cli.js, the same build as the .vsix) says about a file: the
// expectations the editor test holds the editor's diagnostics, hover, status bar and drawing to.
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { ROOT } from "./workspace.mjs";

const CLI = join(ROOT, "bin", "poise.js");

function run(args) {
  const r = spawnSync(process.execPath, [CLI, ...args], { encoding: "utf8", timeout: 60_000 });
  if (r.status === 2 || r.error) throw new Error(`poise ${args.join(" ")}: ${r.error ?? r.stderr}`);
  return r.stdout;
}

/** `poise check --json FILE`: [{ line, column, severity, code, message, ... }]. */
export function check(file) {
  return JSON.parse(run(["check", "--json", file]));
}

/** `poise sweep --json FILE`: { dofs, poses: [{ angles, bodies, hand_force, springs, ... }] }. */
export function sweep(file) {
  return JSON.parse(run(["sweep", "--json", file]));
}

/** The same for a text that is not on disk (an edit made in the editor). */
export function checkText(name, text) {
  const dir = mkdtempSync(join(tmpdir(), "counterpoise-editor-check-"));
  const file = join(dir, name);
  try {
    writeFileSync(file, text);
    return check(file);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Least and greatest of a list of numbers. */
export function range(values) {
  return [Math.min(...values), Math.max(...values)];
}

/** True when `shown` (a figure as the editor printed it) is `exact` rounded to the digits shown;
 * `slack` covers the rounding of `exact` itself (the sweep's JSON has 4 decimals). */
export function agrees(shown, exact, slack = 1e-4) {
  const decimals = (String(shown).split(".")[1] ?? "").length;
  return Math.abs(Number(shown) - exact) <= 0.5 * 10 ** -decimals + slack;
}

/** A diagnostic as one comparable line: `severity code line:column message`. */
export function diagnosticKey(d) {
  return `${d.severity} ${d.code} ${d.line}:${d.column} ${d.message}`;
}
