// The spring-kind table against outside references: each kind's tangent rate is the derivative of
// its force law (mathjs differentiates the published formula), its force is linear in the
// settings the best fit changes (the property the fit relies on), and the model builder takes
// exactly the properties each descriptor lists.
import { describe, expect, it } from "vitest";
import * as math from "mathjs";
import { SPRING_KIND_TABLE, SPRING_KIND_WORDS, springKind } from "../../server/src/model/spring-kinds";
import { declarationSpec } from "../../server/src/model/schema";
import type { Spring } from "../../server/src/model/types";
import { analyse } from "../../server/src/analysis";

const origin = { declaration: { start: 0, end: 0 }, properties: {} };
const hook = (body: string) => ({ body, point: { x: 0, y: 0 }, span: { start: 0, end: 0 } });
const RUBBER_G = 0.6e6; // Pa, a soft rubber (from memory; any positive value serves the check)
const arm = { materials: { rubber: { shearModulus: RUBBER_G } } } as unknown as Parameters<
  (typeof SPRING_KIND_TABLE)["elastic"]["load"]
>[2];

const SPRINGS: Spring[] = [
  {
    kind: "extension",
    id: "e",
    origin,
    a: hook("p"),
    b: hook("q"),
    rate: 800,
    freeLength: 0.06,
    initialTension: 4,
  },
  { kind: "zero_length", id: "z", origin, a: hook("p"), b: hook("q"), rate: 550, initialTension: 1.5 },
  {
    kind: "elastic",
    id: "c",
    origin,
    a: hook("p"),
    b: hook("q"),
    freeLength: 0.1,
    area: 12e-6,
    material: "rubber",
  },
  {
    kind: "gas",
    id: "g",
    origin,
    a: hook("p"),
    b: hook("q"),
    force: 100,
    progression: 1.3,
    stroke: 0.06,
    extendedLength: 0.18,
  },
  { kind: "torsion", id: "t", origin, joint: "shoulder", rate: 0.5, preloadTorque: 0.2 },
];

/** The published force law of each kind as a formula of x (length, or turn for torsion). */
const FORMULA: Record<Spring["kind"], string> = {
  // Shigley's Mechanical Engineering Design, 10th ed., sec. 10-11: F = Fi + k y (extension, taut)
  extension: "4 + 800 * (x - 0.06)",
  // Streit and Gilmore 1989: a zero-free-length spring, F = Fi + k L
  zero_length: "1.5 + 550 * x",
  // Treloar, The Physics of Rubber Elasticity, 3rd ed., 1975: F = G A0 (s - s^-2), s = L / L0
  elastic: `${RUBBER_G} * 12e-6 * (x / 0.1 - (x / 0.1)^(-2))`,
  // Linear gas-strut characteristic (common practice, no source): F from 100 N extended to 1.3 x
  // over the stroke, pushing (negative tension)
  gas: "-100 * (1 + (1.3 - 1) * (0.18 - x) / 0.06)",
  // Torsion spring (Shigley sec. 10-12): T = k theta - preload
  torsion: "0.5 * x - 0.2",
};
/** Where each formula holds: taut, inside the stroke. */
const XS: Record<Spring["kind"], number[]> = {
  extension: [0.07, 0.09, 0.12],
  zero_length: [0.02, 0.1, 0.3],
  elastic: [0.12, 0.2, 0.25],
  gas: [0.13, 0.15, 0.17],
  torsion: [-0.4, 0.1, 0.9],
};

describe("the spring-kind table", () => {
  it("has one descriptor per kind, in the language's order", () => {
    expect(SPRING_KIND_WORDS).toEqual(["extension", "zero_length", "elastic", "gas", "torsion"]);
    for (const k of SPRING_KIND_WORDS) expect(SPRING_KIND_TABLE[k].kind).toBe(k);
  });

  for (const s of SPRINGS) {
    const kind = springKind(s);
    const law = math.compile(FORMULA[s.kind]);
    const slope = math.compile(math.derivative(FORMULA[s.kind], "x").toString());
    it(`${s.kind}: its force law and tangent rate are the published formula and its derivative`, () => {
      for (const x of XS[s.kind]) {
        expect(kind.load(s, x, arm)).toBeCloseTo(law.evaluate({ x }) as number, 9);
        expect(kind.tangentRate(s, x, arm)).toBeCloseTo(slope.evaluate({ x }) as number, 6);
      }
    });

    it(`${s.kind}: its force is linear in the settings the best fit may change`, () => {
      const out = new Float64Array(2);
      for (const x of XS[s.kind]) {
        kind.basis(s, x, arm, out);
        const values = kind.fit.map((f) => f.value(s));
        const sum = values.reduce((acc, v, i) => acc + v * out[i]!, 0);
        expect(sum).toBeCloseTo(kind.load(s, x, arm), 9);
      }
    });
  }

  it("the model builder takes exactly the properties a kind's descriptor lists", () => {
    const spec = declarationSpec("spring")!;
    for (const k of SPRING_KIND_WORDS) {
      const p = SPRING_KIND_TABLE[k].properties;
      const listed = new Set([...p.required, ...(p.oneOf ?? []).flat(), ...p.optional]);
      for (const f of SPRING_KIND_TABLE[k].fit) expect(listed.has(f.key), `${k} fits ${f.key}`).toBe(true);
      for (const q of spec.properties) {
        if ((SPRING_KIND_WORDS as string[]).includes(q.key)) continue;
        const text = `arm "a" {\n  base b { point p (0 mm, 0 mm) }\n  spring s {\n    ${k}\n    ${q.example}\n  }\n}\n`;
        const refused = analyse(text, { modelOnly: true }).findings.some(
          (f) => f.code === "property.unknown" && text.slice(f.span.start, f.span.end) === q.key,
        );
        expect(refused, `${k} ${q.key}`).toBe(!listed.has(q.key));
      }
    }
  });
});
