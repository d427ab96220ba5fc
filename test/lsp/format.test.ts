// The canonical layout: formatting a sample twice changes nothing the second time, keeps every
// word and comment, and reads back to the same syntax tree.
import { describe, expect, it } from "vitest";
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { formatSpec } from "../../server/src/services/format-text";
import { parse } from "../../server/src/syntax/parser";
import { armLexer } from "../../server/src/syntax/tokens";

const root = join(__dirname, "..", "..");
const samples = readdirSync(join(root, "samples")).filter((f) => f.endsWith(".poise"));

/** Each end-of-line comment with the white space written before it. */
function trailingComments(text: string): string[] {
  return text.split(/\r?\n/).flatMap((line) => {
    const m = /\S(\s+)(#.*)$/.exec(line);
    return m && !line.trimStart().startsWith("#") && !line.includes('"')
      ? [`${JSON.stringify(m[1])}${m[2]}`]
      : [];
  });
}

/** The fuzz bound on the formatter's output (test/fuzz/properties.ts, checkFormatting). Common
 * practice, no source: a small multiple of the input. */
function withinOutputBound(input: string, output: string): boolean {
  return output.length <= 8 * input.length + 1024;
}

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
    const crammed =
      'arm "a" { base b { point top (0 mm,300 mm) ; mass   2 kg }   # the base\n\n\n  link   l {length 3 mm}\n}';
    expect(formatSpec(crammed)).toBe(
      [
        'arm "a" {',
        "  base b {",
        "    point top (0 mm, 300 mm)",
        "    mass 2 kg",
        "  }   # the base",
        "",
        "  link l {",
        "    length 3 mm",
        "  }",
        "}",
        "",
      ].join("\n"),
    );
  });

  it("keeps an inline point glued to its body and a range spaced", () => {
    expect(
      formatSpec("arm {\nspring s {\nbetween a.b and c(1 mm, 2 mm)\n}\njoint j { range -30deg..45deg }\n}\n"),
    ).toBe(
      [
        "arm {",
        "  spring s {",
        "    between a.b and c(1 mm, 2 mm)",
        "  }",
        "  joint j {",
        "    range -30deg .. 45deg",
        "  }",
        "}",
        "",
      ].join("\n"),
    );
  });

  it("treats every Unicode space as a space (and always ends)", () => {
    const spaces = [
      "\u00a0",
      "\u1680",
      "\u2000",
      "\u2005",
      "\u200a",
      "\u2028",
      "\u2029",
      "\u202f",
      "\u205f",
      "\u3000",
      "\ufeff",
      "\t",
      "\v",
      "\f",
    ];
    for (const sp of spaces) {
      expect(formatSpec(`arm {${sp}base${sp}b${sp}{${sp}mass${sp}2${sp}kg${sp}}${sp}}`)).toBe(
        ["arm {", "  base b {", "    mass 2 kg", "  }", "}", ""].join("\n"),
      );
    }
  });

  it("keeps own-line comments at the block's indent", () => {
    expect(formatSpec("arm {\n# one\n      # two\nbase b {\n}\n}\n")).toBe(
      ["arm {", "  # one", "  # two", "  base b {", "  }", "}", ""].join("\n"),
    );
  });

  it("keeps the spacing before end-of-line comments, so aligned comments stay aligned", () => {
    for (const name of samples) {
      const text = readFileSync(join(root, "samples", name), "utf8");
      expect(trailingComments(formatSpec(text)), name).toEqual(trailingComments(text));
    }
    const aligned =
      "arm {\n  base b {\n    mass 2 kg       # heavy\n    yaw\t\t# turns\n    footprint 1 mm x 1 mm# glued\n    surface 0 mm\u3000\u3000# odd spaces\n  }   # end\n}\n";
    expect(formatSpec(aligned)).toBe(
      [
        "arm {",
        "  base b {",
        "    mass 2 kg       # heavy",
        "    yaw\t\t# turns",
        "    footprint 1 mm x 1 mm # glued",
        "    surface 0 mm  # odd spaces",
        "  }   # end",
        "}",
        "",
      ].join("\n"),
    );
    expect(formatSpec(formatSpec(aligned))).toBe(formatSpec(aligned));
  });

  it("caps the indent on deep nesting, so the output stays a small multiple of the input", () => {
    // docs/language.md: declarations sit in the arm and properties in a declaration, two levels; a
    // missing `}` shows as one level more, written at the deepest indent.
    expect(formatSpec("arm {\nlink a {\nlength 1 mm\nlink b {\nlength 2 mm\n}\n}\n")).toBe(
      ["arm {", "  link a {", "    length 1 mm", "    link b {", "    length 2 mm", "    }", "  }", ""].join(
        "\n",
      ),
    );
    for (const text of [
      "{".repeat(10_000),
      "{".repeat(30_000),
      `${"{".repeat(30_000)}\r\n`,
      `${"{".repeat(5)}${"{}".repeat(20_000)}`,
      `{{{${"{}\r\n".repeat(10_000)}`,
      "a{".repeat(20_000),
    ]) {
      const once = formatSpec(text);
      expect(withinOutputBound(text, once), `${text.length} characters gave ${once.length}`).toBe(true);
      expect(Math.max(...once.split(/\r?\n/).map((l) => l.length - l.trimStart().length))).toBe(4);
      expect(formatSpec(once)).toBe(once);
      expect(once.replace(/\s+/g, "")).toBe(text.replace(/\s+/g, ""));
    }
  });

  it("ends an unclosed string at the end of its line and joins nothing onto it", () => {
    // tokens.ts: UnclosedString ends before the line end, so the next line is never string text.
    const text = '("a\n# c\narm "x" {\n}\n';
    const once = formatSpec(text);
    expect(once).toBe(['("a', "# c", 'arm "x" {', "}", ""].join("\n"));
    expect(formatSpec(once)).toBe(once);
    // Inside a point, after a trailing backslash, and with a `#` in the string: the rest of the
    // line stays as written and the lines after it stay lines.
    for (const broken of [
      'point p (1 mm, "a\n2 mm)\n# c\n',
      'name "a\\\n# c\nmass 2 kg\n',
      'name "a # not a comment\n  mass 2 kg\n',
      '("a\u2028b c\n# c\n',
    ]) {
      const out = formatSpec(broken);
      expect(formatSpec(out)).toBe(out);
      const lines = out.split("\n").filter((l) => l !== "");
      expect(lines.map((l) => l.trim())).toEqual(
        broken
          .split("\n")
          .filter((l) => l !== "")
          .map((l) => l.trim().replace(/ +/g, " ")),
      );
      // The lexer reads the same tokens before and after (only the line's leading space may differ).
      const images = (t: string) => armLexer.tokenize(t).tokens.map((k) => `${k.tokenType.name}:${k.image}`);
      expect(images(out)).toEqual(images(broken));
    }
    // A closed string with an escaped quote is one word, left intact.
    expect(formatSpec('arm "a \\"b\\" c" {\n}\n')).toBe('arm "a \\"b\\" c" {\n}\n');
  });
});
