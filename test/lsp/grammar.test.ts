// The TextMate grammar's main patterns, read with JavaScript's regular expressions (the subset
// they use means the same in Oniguruma): keywords, property keys, numbers and units.
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { UNITS_BY_DIMENSION } from "../../server/src/services/unit-words";
import { DECLARATIONS } from "../../server/src/model/schema";

const grammar = JSON.parse(
  readFileSync(join(__dirname, "..", "..", "syntaxes", "counterpoise.tmLanguage.json"), "utf8"),
);
const pattern = (name: string) => new RegExp(grammar.repository[name].match, "m");

describe("TextMate grammar", () => {
  it("reads every unit docs/language.md lists after a number", () => {
    const quantity = pattern("quantity");
    for (const unit of Object.values(UNITS_BY_DIMENSION).flat()) {
      const m = quantity.exec(`rate 0.35 ${unit}`);
      expect(m?.[1]).toBe("0.35");
      expect(m?.[2]).toBe(unit);
    }
    expect(quantity.exec("angle -40 deg")?.[1]).toBe("-40");
  });

  it("takes a declaration keyword for a keyword, not a property key", () => {
    const key = pattern("property-key");
    for (const d of DECLARATIONS) expect(key.exec(`  ${d.keyword} x {`)).toBeNull();
    expect(key.exec("    free_length 50 mm")?.[1]).toBe("free_length");
    expect(key.exec("link l {length 3 mm}")?.[1]).toBe("length");
  });

  it("names the declaration after its keyword", () => {
    const decl = new RegExp(grammar.repository.declaration.patterns[0].match);
    const m = decl.exec("  parallelogram reach {");
    expect([m?.[1], m?.[2]]).toEqual(["parallelogram", "reach"]);
  });
});

describe("snippets", () => {
  const snippets = JSON.parse(
    readFileSync(join(__dirname, "..", "..", "snippets", "counterpoise.json"), "utf8"),
  ) as Record<string, { prefix: string; body: string[] }>;
  it("offer one per declaration (a spring one per kind), with properties the schema knows", () => {
    const prefixes = Object.values(snippets).map((s) => s.prefix);
    for (const d of DECLARATIONS)
      expect(prefixes.some((p) => p === d.keyword || p.startsWith(`${d.keyword}-`))).toBe(true);
    for (const s of Object.values(snippets)) {
      const keyword = s.body[0]!.split(" ")[0]!;
      const spec = DECLARATIONS.find((d) => d.keyword === keyword);
      if (!spec) continue; // the arm itself
      for (const line of s.body.slice(1, -1)) {
        const key = /\$\{\d+:([a-z_]+)/.exec(line)?.[1];
        expect(spec.properties.map((p) => p.key)).toContain(key);
      }
    }
  });
});
