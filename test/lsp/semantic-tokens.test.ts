// Semantic tokens of a sample, decoded: each word carries the type of what it is.
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { TextDocument } from "vscode-languageserver-textdocument";
import { semanticTokens, TOKEN_MODIFIERS, TOKEN_TYPES } from "../../server/src/lsp/features/semantic-tokens";
import { SyntaxViews } from "../../server/src/lsp/session/syntax-view";
import { BUILTIN_MATERIAL_IDS } from "../../server/src/model/materials";
import { LineIndex } from "../../server/src/syntax/span";

const CAMERA = readFileSync(join(__dirname, "..", "..", "samples", "camera-arm.poise"), "utf8");

/** Offset → [type, modifiers] of the token starting there. */
function decode(text: string): Map<number, { type: string; modifiers: string[]; length: number }> {
  const view = new SyntaxViews().view(
    TextDocument.create("file:///c.poise", "counterpoise", 1, text),
    BUILTIN_MATERIAL_IDS,
  );
  const data = semanticTokens(view).data;
  const lines = new LineIndex(text);
  const out = new Map<number, { type: string; modifiers: string[]; length: number }>();
  let line = 0;
  let char = 0;
  for (let i = 0; i < data.length; i += 5) {
    line += data[i]!;
    char = data[i] === 0 ? char + data[i + 1]! : data[i + 1]!;
    const mods = TOKEN_MODIFIERS.filter((_, k) => (data[i + 4]! >> k) & 1);
    out.set(lines.offset({ line, character: char }), {
      type: TOKEN_TYPES[data[i + 3]!]!,
      modifiers: [...mods],
      length: data[i + 2]!,
    });
  }
  return out;
}

describe("semantic tokens", () => {
  const tokens = decode(CAMERA);
  const at = (needle: string, shift = 0) => tokens.get(CAMERA.indexOf(needle) + shift);

  it("types keywords, property keys, numbers and units", () => {
    expect(at("spring lift")?.type).toBe("keyword");
    expect(at("free_length")?.type).toBe("property");
    const rate = /rate ([\d.]+) N\/mm/.exec(CAMERA)!;
    expect(at(rate[0], "rate ".length)?.type).toBe("number");
    expect(at(rate[0], `rate ${rate[1]} `.length)).toMatchObject({ type: "unit", length: 4 });
    expect(at(" and reach", 1)?.type).toBe("keyword");
  });

  it("types names by what they name", () => {
    expect(at("parallelogram reach", 14)).toMatchObject({ type: "struct", modifiers: ["declaration"] });
    expect(at("reach.lower(100")?.type).toBe("struct");
    expect(at("reach.lower(100", 6)?.type).toBe("class");
    expect(at("bench_clamp.anchor", 12)?.type).toBe("enumMember");
    expect(at("steel_1018")).toMatchObject({ type: "type", modifiers: ["defaultLibrary"] });
    expect(at("payload camera", 8)?.type).toBe("variable");
  });
});
