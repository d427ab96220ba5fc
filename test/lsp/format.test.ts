// The canonical layout: formatting a sample twice changes nothing the second time, keeps every
// word and comment, and reads back to the same syntax tree.
import { describe, expect, it } from "vitest";
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { formatSpec } from "../../server/src/lsp/format-text";
import { parse } from "../../server/src/syntax/parser";

const root = join(__dirname, "..", "..");
const samples = readdirSync(join(root, "samples")).filter((f) => f.endsWith(".poise"));

/** The tree without positions: what the text says, not where. */
function meaning(text: string): unknown {
  return JSON.parse(JSON.stringify(parse(text), (key, value) => (/span$/i.test(key) ? undefined : value)));
}

describe("formatting", () => {
  for (const name of samples) {
    it(`is idempotent and faithful on ${name}`, () => {
      const text = readFileSync(join(root, "samples", name), "utf8");
      const once = formatSpec(text);
      expect(formatSpec(once)).toBe(once);
      expect(meaning(once)).toEqual(meaning(text));
      expect(once.replace(/\s+/g, "")).toBe(text.replace(/\s+/g, ""));
    });
  }

  it("lays out a crammed spec one property a line, 2-space indent, single spaces", () => {
    const crammed = 'arm "a" { base b { point top (0 mm,300 mm) ; mass   2 kg }   # the base\n\n\n  link   l {length 3 mm}\n}';
    expect(formatSpec(crammed)).toBe(
      ['arm "a" {', "  base b {", "    point top (0 mm, 300 mm)", "    mass 2 kg", "  } # the base", "", "  link l {", "    length 3 mm", "  }", "}", ""].join("\n"),
    );
  });

  it("keeps an inline point glued to its body and a range spaced", () => {
    expect(formatSpec("arm {\nspring s {\nbetween a.b and c(1 mm, 2 mm)\n}\njoint j { range -30deg..45deg }\n}\n")).toBe(
      ["arm {", "  spring s {", "    between a.b and c(1 mm, 2 mm)", "  }", "  joint j {", "    range -30deg .. 45deg", "  }", "}", ""].join("\n"),
    );
  });

  it("treats every Unicode space as a space (and always ends)", () => {
    const spaces = ["\u00a0", "\u1680", "\u2000", "\u2005", "\u200a", "\u2028", "\u2029", "\u202f", "\u205f", "\u3000", "\ufeff", "\t", "\v", "\f"];
    for (const sp of spaces) {
      expect(formatSpec(`arm {${sp}base${sp}b${sp}{${sp}mass${sp}2${sp}kg${sp}}${sp}}`)).toBe(["arm {", "  base b {", "    mass 2 kg", "  }", "}", ""].join("\n"));
    }
  });

  it("keeps own-line comments at the block's indent", () => {
    expect(formatSpec("arm {\n# one\n      # two\nbase b {\n}\n}\n")).toBe(["arm {", "  # one", "  # two", "  base b {", "  }", "}", ""].join("\n"));
  });
});
