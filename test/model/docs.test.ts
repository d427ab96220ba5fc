// Keeps docs/language.md and docs/materials.md true to the code: every declaration and property of
// the schema appears in the language reference, every built-in material in the materials page.
import { expect, test } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { ARM_PROPERTIES, DECLARATIONS } from "../../server/src/model/schema";
import { BUILTIN_MATERIAL_IDS } from "../../server/src/model/materials";

const docs = (name: string) => readFileSync(join(__dirname, "..", "..", "docs", name), "utf8");

test("every property of every declaration is in docs/language.md, in its declaration's section", () => {
  const text = docs("language.md");
  for (const d of DECLARATIONS) {
    const heading = `### \`${d.keyword}${d.named ? " NAME" : ""}\``;
    const start = text.indexOf(heading);
    expect(start, heading).toBeGreaterThan(0);
    const end = text.indexOf("\n### ", start + 1);
    const section = text.slice(start, end < 0 ? undefined : end);
    for (const p of d.properties) expect(section, `${d.keyword}.${p.key}`).toContain(`| \`${p.key}\` |`);
  }
  for (const p of ARM_PROPERTIES) expect(text).toContain(`\`${p.key}\``);
});

test("every built-in material is in docs/materials.md and named in docs/language.md", () => {
  for (const id of BUILTIN_MATERIAL_IDS) {
    expect(docs("materials.md")).toContain(`| \`${id}\``);
    expect(docs("language.md")).toContain(`\`${id}\``);
  }
});
