// Keeps docs/language.md and docs/materials.md true to the code: every declaration and property of
// the schema appears in the language reference, every built-in material in the materials page, and
// the spring kinds table says what each kind's descriptor (model/spring-kinds.ts) takes.
import { expect, test } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { ARM_PROPERTIES, DECLARATIONS } from "../../server/src/model/schema";
import { BUILTIN_MATERIAL_IDS } from "../../server/src/model/materials";
import { SPRING_KIND_TABLE, SPRING_KIND_WORDS } from "../../server/src/model/spring-kinds";

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

test("docs/language.md's spring kinds table lists what each kind's descriptor takes", () => {
  const text = docs("language.md");
  const start = text.indexOf("### What each spring kind requires");
  expect(start).toBeGreaterThan(0);
  const end = text.indexOf("\n## ", start);
  const table = text.slice(start, end < 0 ? undefined : end);
  for (const kind of SPRING_KIND_WORDS) {
    const d = SPRING_KIND_TABLE[kind];
    const row = table.split("\n").find((l) => l.startsWith(`| \`${kind}\` |`));
    expect(row, kind).toBeDefined();
    const [, required, optional] = row!.split(" | ");
    // A property in backticks, alone or with the form of its value (`tube OD x wall`).
    const named = (key: string) => new RegExp("`" + key + "[` ]");
    for (const key of [...d.properties.required, ...(d.properties.oneOf ?? []).flat()])
      expect(required, `${kind} requires ${key}`).toMatch(named(key));
    for (const key of d.properties.optional) expect(optional, `${kind} may take ${key}`).toMatch(named(key));
    // The kind word's own row in the property table says what the descriptor says it is.
    expect(text, kind).toContain(`| \`${kind}\` | kind word | — |  | ${d.doc} |`);
  }
});
