// A generated 5,000-line spec parses and builds without throwing (no timing assertion).
import { expect, test } from "vitest";
import { parse } from "../../server/src/syntax/parser";
import { buildModel } from "../../server/src/model/build";

function bigSpec(targetLines: number): string {
  const lines = ['arm "Long chain" {', "  base bench {", "    point top (0 mm, 300 mm)", "  }"];
  let i = 0;
  while (lines.length < targetLines - 1) {
    const parent = i === 0 ? "bench.top" : `l${i - 1}.end`;
    lines.push(
      `  link l${i} {`,
      "    length 100 mm",
      "    section rect 10 mm x 4 mm",
      "    material pla",
      "    point hook (50 mm, 5 mm)",
      "  }",
    );
    lines.push(
      `  joint j${i} {`,
      `    connects ${parent} to l${i}.start`,
      "    angle 1 deg",
      i % 2 ? "    fixed" : "    range -5 deg .. 5 deg",
      "  }",
    );
    // every tenth block has a typo, to exercise recovery at scale
    if (i % 10 === 7) lines.push(`  lnik broken${i} {`, "    length 10 mm", "    mass 5 g", "  }");
    i++;
  }
  lines.push("}");
  return lines.join("\n");
}

test("5,000 lines", () => {
  const text = bigSpec(5000);
  expect(text.split("\n").length).toBeGreaterThanOrEqual(5000);
  const tree = parse(text);
  expect(tree.errors).toEqual([]);
  const built = buildModel(tree, text);
  expect(built.model!.bodies.length).toBeGreaterThan(400);
  // Only the planted typos are reported: each read as the link it resembles, which no joint holds.
  const planted = (text.match(/lnik/g) ?? []).length;
  expect(built.findings.filter((f) => f.code === "declaration.unknown")).toHaveLength(planted);
  expect(built.findings.filter((f) => f.code === "body.unconnected")).toHaveLength(planted);
  expect(built.findings).toHaveLength(2 * planted);
});

test("random bytes never throw", () => {
  let seed = 12345;
  const rand = () => (seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648;
  const alphabet = 'arm link joint { } ( ) , .. x mm N/mm " # \n ; 3 -4.5 e + @ é';
  const pieces = alphabet.split(" ");
  for (let n = 0; n < 200; n++) {
    let s = "";
    for (let k = 0; k < 80; k++) s += pieces[Math.floor(rand() * pieces.length)] + (rand() < 0.5 ? " " : "");
    expect(() => buildModel(parse(s), s)).not.toThrow();
  }
});
