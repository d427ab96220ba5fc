// The parser over every construct of the language, with exact spans, and its recovery.
import { describe, expect, test } from "vitest";
import { parse } from "../../server/src/syntax/parser";
import type {
  DeclarationNode,
  PropertyNode,
  QuantityNode,
  ReferenceNode,
  SyntaxTree,
} from "../../server/src/syntax/ast";

/** Span of the n-th occurrence of `sub` in `text`. */
function at(text: string, sub: string, nth = 0): { start: number; end: number } {
  let i = -1;
  for (let k = 0; k <= nth; k++) {
    i = text.indexOf(sub, i + 1);
    if (i < 0) throw new Error(`no ${sub}`);
  }
  return { start: i, end: i + sub.length };
}

function only(tree: SyntaxTree): {
  decls: readonly DeclarationNode[];
  props: (d: number) => readonly PropertyNode[];
} {
  expect(tree.errors).toEqual([]);
  const arm = tree.arms[0]!;
  return { decls: arm.declarations, props: (d) => arm.declarations[d]!.properties };
}

const wrap = (body: string) => `arm "t" {\n${body}\n}\n`;

describe("structure", () => {
  test("arm with title, declarations, arm-level property and comments", () => {
    const text = `# head comment\narm "Overhead arm" {\n  gravity 9.81 m/s^2\n  link boom { length 300 mm } # trailing\n  require { safety 2 }\n}\n`;
    const tree = parse(text);
    expect(tree.errors).toEqual([]);
    expect(tree.arms).toHaveLength(1);
    const arm = tree.arms[0]!;
    expect(arm.keywordSpan).toEqual(at(text, "arm"));
    expect(arm.title).toEqual({ kind: "string", value: "Overhead arm", span: at(text, '"Overhead arm"') });
    expect(arm.span).toEqual({ start: at(text, "arm").start, end: text.lastIndexOf("}") + 1 });
    expect(arm.bodySpan).toEqual({ start: at(text, "{").start, end: text.lastIndexOf("}") + 1 });
    expect(arm.properties).toHaveLength(1);
    expect(arm.properties[0]!.key).toEqual({ text: "gravity", span: at(text, "gravity") });
    expect(arm.properties[0]!.span).toEqual(at(text, "gravity 9.81 m/s^2"));
    expect(arm.declarations.map((d) => d.keyword.text)).toEqual(["link", "require"]);
    const link = arm.declarations[0]!;
    expect(link.name).toEqual({ text: "boom", span: at(text, "boom") });
    expect(link.span).toEqual(at(text, "link boom { length 300 mm }"));
    expect(link.bodySpan).toEqual(at(text, "{ length 300 mm }"));
    expect(arm.declarations[1]!.name).toBeUndefined();
    expect(tree.comments).toEqual([
      { text: "# head comment", span: at(text, "# head comment") },
      { text: "# trailing", span: at(text, "# trailing") },
    ]);
  });

  test("properties one per line or separated by `;`", () => {
    const text = wrap("  link boom {\n    length 300 mm; mass 2 kg\n    holes 6 mm\n  }");
    const { props } = only(parse(text));
    expect(props(0).map((p) => p.key.text)).toEqual(["length", "mass", "holes"]);
    expect(props(0)[1]!.span).toEqual(at(text, "mass 2 kg"));
  });

  test("flags: a key alone", () => {
    const text = wrap("  joint j {\n    fixed\n  }");
    const { props } = only(parse(text));
    expect(props(0)[0]).toEqual({
      kind: "property",
      key: { text: "fixed", span: at(text, "fixed") },
      values: [],
      span: at(text, "fixed"),
    });
  });

  test("CRLF line ends", () => {
    const text = 'arm "t" {\r\n  link boom {\r\n    length 3 mm\r\n  }\r\n}\r\n';
    const { props } = only(parse(text));
    expect(props(0)[0]!.span).toEqual(at(text, "length 3 mm"));
  });
});

describe("values", () => {
  const valuesOf = (line: string) => {
    const text = wrap(`  link boom {\n    ${line}\n  }`);
    const { props } = only(parse(text));
    return { text, values: props(0)[0]!.values };
  };

  test.each([
    ["500 g", 500, "g"],
    ["0.35 N/mm", 0.35, "N/mm"],
    ["9.81 m/s^2", 9.81, "m/s^2"],
    ["2.1 GPa", 2.1, "GPa"],
    ["-40 deg", -40, "deg"],
    ["1.2 N*m", 1.2, "N*m"],
    ["5 lbf/in", 5, "lbf/in"],
    ["0.004 N*m/deg", 0.004, "N*m/deg"],
    ["3 lbf*in/deg", 3, "lbf*in/deg"],
    ["1.24 g/cm^3", 1.24, "g/cm^3"],
    ["12 mm^2", 12, "mm^2"],
    ["2.5e-3 m", 2.5e-3, "m"],
    ["1E3 mm", 1000, "mm"],
    [".5 in", 0.5, "in"],
  ])("quantity %s", (written, value, unit) => {
    const { text, values } = valuesOf(`k ${written}`);
    const q = values[0] as QuantityNode;
    expect(q.kind).toBe("quantity");
    expect(q.value).toBe(value);
    const numberText = written.split(" ")[0]!;
    expect(q.numberText).toBe(numberText);
    expect(q.numberSpan).toEqual(at(text, numberText));
    expect(q.unit).toEqual({
      text: unit,
      span: { start: at(text, written).start + numberText.length + 1, end: at(text, written).end },
    });
    expect(q.span).toEqual(at(text, written));
  });

  test("a number alone has no unit; a word that is not a unit stays a separate value", () => {
    const { text, values } = valuesOf("coils 20");
    expect(values[0]).toMatchObject({ kind: "quantity", value: 20, span: at(text, "20") });
    expect((values[0] as QuantityNode).unit).toBeUndefined();
    const pin = valuesOf("pin 5 steel_1018").values;
    expect(pin.map((v) => v.kind)).toEqual(["quantity", "reference"]);
    expect((pin[0] as QuantityNode).unit).toBeUndefined();
  });

  test("a number glued to its unit (`20mm`)", () => {
    const { values } = valuesOf("k 20mm");
    expect(values[0]).toMatchObject({ kind: "quantity", value: 20, unit: { text: "mm" } });
  });

  test("range", () => {
    const { text, values } = valuesOf("range -45 deg .. 50 deg");
    expect(values[0]).toMatchObject({ kind: "range", span: at(text, "-45 deg .. 50 deg") });
    const r = values[0] as Extract<(typeof values)[number], { kind: "range" }>;
    expect(r.low.span).toEqual(at(text, "-45 deg"));
    expect(r.high.span).toEqual(at(text, "50 deg"));
    // Without spaces: `1..2` is a range, not the number 1. followed by .2
    const tight = valuesOf("range 1..2").values[0];
    expect(tight).toMatchObject({ kind: "range", low: { value: 1 }, high: { value: 2 } });
  });

  test("point", () => {
    const { text, values } = valuesOf("force (40 mm, -2.5 mm)");
    expect(values[0]).toMatchObject({
      kind: "point",
      span: at(text, "(40 mm, -2.5 mm)"),
      x: { value: 40, span: at(text, "40 mm") },
      y: { value: -2.5, span: at(text, "-2.5 mm") },
    });
  });

  test("region: a word and two corners (`tune anchor`), and a missing far corner", () => {
    const { text, values } = valuesOf("tune anchor (-10 mm, 40 mm) .. (10 mm, 120 mm)");
    expect(values.map((v) => v.kind)).toEqual(["reference", "region"]);
    expect(values[0]).toMatchObject({ span: at(text, "anchor") });
    expect(values[1]).toMatchObject({
      span: at(text, "(-10 mm, 40 mm) .. (10 mm, 120 mm)"),
      low: { x: { value: -10 }, y: { value: 40 } },
      high: { x: { value: 10 }, y: { value: 120 } },
    });
    const broken = wrap("  spring s { tune hook (0 mm, 0 mm) .. }");
    expect(parse(broken).errors).toEqual([
      { message: "expected the region's far corner `(x, y)` after `..`", span: at(broken, "..") },
    ]);
  });

  test("sections and dims", () => {
    const rect = valuesOf("section rect 20 mm x 6 mm");
    expect(rect.values.map((v) => v.kind)).toEqual(["reference", "dims"]);
    expect(rect.values[1]).toMatchObject({
      span: at(rect.text, "20 mm x 6 mm"),
      first: { value: 20 },
      second: { value: 6 },
    });
    const tube = valuesOf("section tube 25 mm x 2 mm");
    expect(tube.values[1]).toMatchObject({ kind: "dims", first: { value: 25 }, second: { value: 2 } });
    const rod = valuesOf("section rod 8 mm");
    expect(rod.values.map((v) => v.kind)).toEqual(["reference", "quantity"]);
    const times = valuesOf("footprint 220 mm × 180 mm");
    expect(times.values[0]).toMatchObject({ kind: "dims", first: { value: 220 }, second: { value: 180 } });
  });

  test("references", () => {
    const cases: [string, string[], boolean][] = [
      ["at mast", ["mast"], false],
      ["at mast.end", ["mast", "end"], false],
      ["at reach.head", ["reach", "head"], false],
      ["at reach.lower(100 mm, 0 mm)", ["reach", "lower"], true],
    ];
    for (const [line, parts, hasPoint] of cases) {
      const { text, values } = valuesOf(line);
      const ref = values[0] as ReferenceNode;
      expect(ref.kind).toBe("reference");
      expect(ref.parts.map((p) => p.text)).toEqual(parts);
      const lineStart = text.indexOf(line);
      expect(ref.parts.map((p) => p.span)).toEqual(
        parts.map((p) => ({
          start: text.indexOf(p, lineStart + 3),
          end: text.indexOf(p, lineStart + 3) + p.length,
        })),
      );
      expect(ref.span).toEqual(at(text, line.slice(3)));
      expect(ref.point !== undefined).toBe(hasPoint);
    }
  });

  test("connectives stay as one-part references in order", () => {
    const { values } = valuesOf("connects post.top to arm.start");
    expect(
      values.map((v) => (v.kind === "reference" ? v.parts.map((p) => p.text).join(".") : v.kind)),
    ).toEqual(["post.top", "to", "arm.start"]);
  });

  test("strings with escapes", () => {
    const text = 'arm "a \\"quoted\\" word" {\n}\n';
    const tree = parse(text);
    expect(tree.errors).toEqual([]);
    expect(tree.arms[0]!.title!.value).toBe('a "quoted" word');
  });
});

describe("recovery", () => {
  test("never throws, whatever the text", () => {
    for (const text of [
      "",
      "}",
      "{{{",
      "arm",
      'arm "',
      "((((",
      "arm { link { a ( , ) .. x } } }",
      "\u0000\u0001",
      'arm "x" { link a { length 3 mm ',
      "#",
      "\n\n\n",
      "x x x",
      "1 2 3",
    ]) {
      expect(() => parse(text)).not.toThrow();
    }
  });

  test("a typo costs one error at its word; the next declaration still parses", () => {
    const text = wrap("  link boom {\n    length 300 mm ..\n  }\n  link fore {\n    length 2 mm\n  }");
    const tree = parse(text);
    expect(tree.errors).toEqual([{ message: "expected a number after `..`", span: at(text, "..") }]);
    expect(tree.arms[0]!.declarations.map((d) => d.name?.text)).toEqual(["boom", "fore"]);
  });

  test("an unclosed `{` does not hide later declarations", () => {
    const text = wrap(
      "  link boom {\n    length 300 mm\n\n  link fore {\n    length 2 mm\n  }\n  require {\n  }",
    );
    const tree = parse(text);
    expect(tree.errors).toEqual([{ message: "unclosed `{` of link boom", span: at(text, "{", 1) }]);
    expect(tree.arms[0]!.declarations.map((d) => d.keyword.text)).toEqual(["link", "link", "require"]);
    expect(tree.arms[0]!.declarations[0]!.properties.map((p) => p.key.text)).toEqual(["length"]);
  });

  test("a bad line does not swallow the next one", () => {
    const text = wrap("  link boom {\n    length ) 300 mm\n    mass 2 kg\n  }");
    const tree = parse(text);
    expect(tree.errors).toHaveLength(1);
    expect(tree.errors[0]!.span.start).toBe(at(text, ")").start);
    expect(tree.arms[0]!.declarations[0]!.properties.map((p) => p.key.text)).toEqual(["length", "mass"]);
  });

  test("specific messages", () => {
    const cases: [string, string, string][] = [
      ["rate N/mm", "expected a number before the unit `N/mm`", "N/mm"],
      ["at mast.", "expected a point name after `mast.`", "."],
      ["point p (1 mm 2 mm)", "expected `,` between the point's x and y", "2 mm"],
      ['title "abc', 'unclosed string: add the closing `"`', '"abc'],
      ["300 mm", "expected a property name before `300 mm`", "300 mm"],
      ["k 3 @", "unexpected character `@`", "@"],
      ["length 1,5 mm", "write decimals with a point, e.g. `1.5`, not a comma", ","],
      ["angle 30\u00B0", "write angles with `deg`, e.g. `30 deg`", "\u00B0"],
    ];
    for (const [line, message, word] of cases) {
      const text = wrap(`  link boom {\n    ${line}\n  }`);
      const tree = parse(text);
      expect(tree.errors).toEqual([{ message, span: at(text, word, word === "." ? 0 : 0) }]);
    }
  });

  test("keyword typo parses as a declaration with that keyword (the model names it)", () => {
    const text = wrap("  lnk boom {\n    length 3 mm\n  }");
    const tree = parse(text);
    expect(tree.errors).toEqual([]);
    expect(tree.arms[0]!.declarations[0]!.keyword.text).toBe("lnk");
  });

  test("two arms are both in the tree (the model reports the second)", () => {
    const tree = parse('arm "a" {\n}\narm "b" {\n}\n');
    expect(tree.errors).toEqual([]);
    expect(tree.arms.map((a) => a.title?.value)).toEqual(["a", "b"]);
  });
});

describe("pathological input", () => {
  test("deep nesting neither throws nor overflows the stack: one error, the arm kept", () => {
    const text = `arm "x" {${"{".repeat(20000)}${"}".repeat(20000)}}`;
    const tree = parse(text);
    expect(tree.arms).toHaveLength(1);
    expect(tree.errors).toHaveLength(1);
    expect(tree.errors[0]!.message).not.toContain("internal");
  });
});
