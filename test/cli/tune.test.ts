// `poise tune` as cli.md fixes it (issue 13): per spring the values found, the worst hand force
// before and after with every check re-run, `--write` in the spec's own units keeping its layout
// and comments, a progress line on stderr, exit 0 / 1 / 2. Tune on every sample gives a design
// that passes or says why it cannot.
import { beforeAll, describe, expect, it } from "vitest";
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { analyse } from "../../server/src/analysis";
import { tuneReport } from "../../server/src/cli/tune";
import { ensureBuilt, poise, ROOT, specFile } from "./run-cli";

beforeAll(() => ensureBuilt());

/** Standard gravity, m/s^2 (SI Brochure, 9th ed.; the language's default `gravity`). */
const G0 = 9.80665;

// A lamp on a pivoting boom balanced by a zero-free-length spring, with comments to keep.
const LAMP = `# Invented for the tests: a desk lamp on a boom, balanced by a spring led over a pulley.
arm "Lamp" {
  base post {
    point pivot (0 mm, 300 mm)   # the boom's pivot
    point anchor (0 mm, 350 mm)  # the pulley, 50 mm above it
  }
  link boom {
    length 450 mm
    mass 0 kg
  }
  joint shoulder {
    connects post.pivot to boom.start
    range -50 deg .. 50 deg
  }
  spring lift {
    zero_length
    between post.anchor and boom(100 mm, 0 mm)
    rate 0.5 N/mm          # a guess
    tune rate 0.1 N/mm .. 2 N/mm
  }
  payload shade {
    mass 1 kg
    at boom(400 mm, 0 mm)
  }
}
`;

describe("poise tune", () => {
  it("writes the balancing rate into the file in its own unit, keeping comments, with progress on stderr", () => {
    const file = specFile("lamp.poise", LAMP);
    const r = poise("tune", file, "--write");
    expect(r.status).toBe(0);
    // Streit and Gilmore 1989 (docs/formulas.md): k a b = m g l, here 1 kg, l = 0.4 m, a = 0.05 m, b = 0.1 m
    const k = (1 * G0 * 0.4) / (0.05 * 0.1);
    const written = `${Number((k / 1000).toPrecision(4))} N/mm`;
    expect(r.stdout).toContain(`spring lift: rate 0.5 N/mm -> ${written}`);
    expect(r.stdout).toMatch(/worst hand force over every pose and payload mass: \d+\.\d\d N -> 0\.0\d N/);
    expect(r.stdout).toContain(`written to ${file}`);
    expect(r.stderr).toMatch(/^poise tune: \d+ % /m);
    const after = readFileSync(file, "utf8");
    // Only the value changed: every other character, comments included, is as it was
    expect(after).toBe(
      LAMP.replace("rate 0.5 N/mm          # a guess", `rate ${written}          # a guess`),
    );
    expect(poise("check", file).status).toBe(0);
  });

  it("prints JSON with the values in SI and the hand forces, and leaves the file alone without --write", () => {
    const file = specFile("lamp.poise", LAMP);
    const r = poise("tune", file, "--json");
    expect(r.status).toBe(0);
    const json = JSON.parse(r.stdout) as {
      improved: boolean;
      springs: { id: string; values: { what: string; before: number; after: number; text: string }[] }[];
      worst_hand_force: { before: number; after: number };
      written: boolean;
    };
    expect(json.improved).toBe(true);
    expect(json.written).toBe(false);
    const rate = json.springs[0]!.values[0]!;
    expect(rate.before).toBeCloseTo(500, 9);
    // k a b = m g l (docs/formulas.md)
    expect(rate.after).toBeCloseTo((1 * G0 * 0.4) / (0.05 * 0.1), 3);
    // Before: the residual (m g l - k a b) cos(theta) over l, worst at theta = 0
    expect(json.worst_hand_force.before).toBeCloseTo((G0 * 0.4 - 500 * 0.05 * 0.1) / 0.4, 6);
    expect(readFileSync(file, "utf8")).toBe(LAMP);
  });

  it("exits 2 when it cannot run, with the reason", () => {
    expect(poise("tune").status).toBe(2);
    expect(poise("tune", "no-such-file.poise").status).toBe(2);
    expect(poise("tune", join(ROOT, "samples", "lamp-arm.poise"), "--fast").status).toBe(2);
    const broken = poise("tune", join(ROOT, "samples", "mistakes.poise"));
    expect(broken.status).toBe(2);
    expect(broken.stdout).toContain("no tuned design: the spec has errors that stop the analysis");
  });

  it("gives every sample a design that passes every check, or says why it cannot", () => {
    const dir = join(ROOT, "samples");
    for (const name of readdirSync(dir).filter((f) => f.endsWith(".poise"))) {
      const text = readFileSync(join(dir, name), "utf8");
      const r = tuneReport(name, text);
      const errors = r.json["errors"] as { code: string; message: string }[];
      if (r.code === 0) {
        expect(errors, name).toEqual([]);
        // the tuned text itself passes: no error in a fresh analysis of it
        if (r.edited)
          expect(
            analyse(r.edited).findings.filter((f) => f.severity === "error"),
            name,
          ).toEqual([]);
      } else {
        // it says why: the search's reason, or the checks the tuned design still fails
        expect(r.lines.join("\n"), name).toMatch(/no tuned design: .+|\d+ errors? \(first: [a-z.-]+: .+\)/);
        expect(errors.length > 0 || r.code === 2, name).toBe(true);
      }
    }
  }, 120_000);
});
