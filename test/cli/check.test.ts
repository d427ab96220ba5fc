// `poise check` as docs/cli.md fixes it: one line per diagnostic `path:line:column: severity code:
// message` (1-based), a one-line summary, or a JSON array; exit 0 / 1 / 2.
import { beforeAll, describe, expect, it } from "vitest";
import { readdirSync } from "node:fs";
import { ensureBuilt, poise, specFile } from "./run-cli";

const LINE = /^(.+):(\d+):(\d+): (error|warning|information|hint) ([a-z]+\.[a-z-]+): (.+)$/;
const samples = readdirSync("samples")
  .filter((f) => f.endsWith(".poise"))
  .map((f) => `samples/${f}`);

beforeAll(() => ensureBuilt());

describe("poise check", () => {
  it("prints well-formed lines and a summary for every sample", () => {
    const r = poise("check", ...samples);
    const lines = r.stdout.trimEnd().split("\n");
    const summary = lines.pop()!;
    expect(summary).toMatch(new RegExp(`^${samples.length} files checked: \\d+ errors?, \\d+ warnings?`));
    for (const line of lines) expect(line).toMatch(LINE);
    const errors = lines.filter((l) => LINE.exec(l)![4] === "error").length;
    expect(r.status).toBe(errors > 0 ? 1 : 0);
  });

  it("exits 1 on the sample full of mistakes, with findings on its lines", () => {
    const r = poise("check", "samples/mistakes.poise");
    expect(r.status).toBe(1);
    const codes = r.stdout
      .split("\n")
      .filter((l) => LINE.test(l))
      .map((l) => LINE.exec(l)![5]);
    // The sample's own comments name these mistakes.
    expect(codes).toEqual(
      expect.arrayContaining(["value.impossible", "unit.missing", "unit.wrong-dimension", "name.duplicate"]),
    );
  });

  it("counts lines and columns from 1", () => {
    const file = specFile("nameless.poise", 'arm "x" {\n  link {\n    length 3 mm\n  }\n}\n');
    const r = poise("check", file);
    expect(r.status).toBe(1);
    // `link` without a name: the error sits on `link`, line 2, column 3.
    expect(r.stdout).toContain(`${file}:2:3: error syntax.error: `);
  });

  it("prints one JSON array with docs/cli.md's fields instead", () => {
    const file = specFile("broken.poise", 'arm "x" {\n  link {\n');
    const r = poise("check", file, "samples/camera-arm.poise", "--json");
    const parsed = JSON.parse(r.stdout) as Record<string, unknown>[];
    expect(Array.isArray(parsed)).toBe(true);
    expect(parsed.length).toBeGreaterThan(0);
    for (const d of parsed) {
      expect(Object.keys(d).sort()).toEqual([
        "code",
        "column",
        "data",
        "endColumn",
        "endLine",
        "file",
        "line",
        "message",
        "severity",
      ]);
      expect(["error", "warning", "information", "hint"]).toContain(d.severity);
      expect(d.line).toBeGreaterThanOrEqual(1);
      expect(d.column).toBeGreaterThanOrEqual(1);
      expect((d.endLine as number) * 1e6 + (d.endColumn as number)).toBeGreaterThanOrEqual(
        (d.line as number) * 1e6 + (d.column as number),
      );
    }
    expect(parsed.some((d) => d.file === file)).toBe(true);
    expect(r.status).toBe(1);
  });

  it("gives each JSON diagnostic its data: the part it is about and its figures in SI", () => {
    const r = poise("check", "samples/engraver-arm.poise", "--json");
    const parsed = JSON.parse(r.stdout) as { code: string; message: string; data: Record<string, unknown> }[];
    const balance = parsed.find((d) => d.code === "balance.unbalanced")!;
    expect(balance, r.stdout).toBeDefined();
    expect(balance.data["subject"]).toBe("inner_lift");
    expect(balance.data["payload"]).toBe("engraver");
    // The message shows the worst hand force in N to 4 significant figures; the data has it in N, whole.
    const shown = Number(/takes ([\d.]+) N/.exec(balance.message)![1]);
    expect(balance.data["worstHandForce"]).toBeCloseTo(shown, 1);
    expect(Object.keys(balance.data["best"] as object).sort()).toEqual(["initial_tension", "rate"]);
  });

  it("exits 2 when it cannot run", () => {
    const missing = poise("check", "samples/no-such-file.poise");
    expect(missing.status).toBe(2);
    expect(missing.stderr).toContain("no such file");
    expect(poise("check").status).toBe(2);
    expect(poise("check", "--frobnicate", "samples/camera-arm.poise").status).toBe(2);
    expect(poise("unknown-command").status).toBe(2);
  });

  it("never throws on text that is not a spec", () => {
    const file = specFile("junk.poise", '\u0000\u00ff}}}{{{((("\n\t#\n🦾 arm arm');
    const r = poise("check", file);
    expect(r.stderr).not.toContain("internal fault");
    expect([0, 1]).toContain(r.status);
  });

  it("answers --help and --version", () => {
    const help = poise("--help");
    expect(help.status).toBe(0);
    expect(help.stdout).toContain("poise check FILE...");
    const version = poise("--version");
    expect(version.status).toBe(0);
    expect(version.stdout.trim()).toMatch(/^\d+\.\d+\.\d+$/);
  });
});
