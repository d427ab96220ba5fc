// Grammar-aware generator of arm specs for the fuzzer: random arms (bases, links, joints,
// parallelograms, a closed four-bar, springs of every kind, payloads, require, sweep) whose names
// resolve, rendered in varied but valid layout. Mutations live in mutations.ts.
import fc from "fast-check";

/** Units of each dimension with the factor that converts a value in the first (canonical) unit
 * into that unit, so that most generated arms stay physically plausible. Exact definitions:
 * 1 in = 25.4 mm, 1 ft = 12 in, 1 lb = 0.45359237 kg, 1 oz = lb/16 (NIST SP 811, appendix B). */
export const UNITS = {
  length: [
    ["mm", 1],
    ["cm", 0.1],
    ["m", 0.001],
    ["in", 1 / 25.4],
    ["ft", 1 / 304.8],
  ],
  mass: [
    ["g", 1],
    ["kg", 0.001],
    ["lb", 1 / 453.59237],
    ["oz", 16 / 453.59237],
  ],
  force: [
    ["N", 1],
    ["kN", 0.001],
    ["lbf", 1 / 4.4482216152605],
  ],
  torque: [
    ["N*m", 1],
    ["N*mm", 1000],
    ["lbf*in", 8.850745791],
    ["lbf*ft", 0.7375621493],
  ],
  stiffness: [
    ["N/mm", 1],
    ["N/m", 1000],
    ["lbf/in", 5.710147155],
  ],
  angular_stiffness: [
    ["N*m/rad", 1],
    ["N*mm/deg", 1000 * (Math.PI / 180)],
    ["lbf*in/deg", 8.850745791 * (Math.PI / 180)],
  ],
  angle: [
    ["deg", 1],
    ["rad", Math.PI / 180],
  ],
  pressure: [
    ["MPa", 1],
    ["GPa", 0.001],
    ["kPa", 1000],
    ["Pa", 1e6],
    ["psi", 145.0377377],
    ["ksi", 0.1450377377],
  ],
  density: [
    ["g/cm^3", 1],
    ["kg/m^3", 1000],
    ["lb/in^3", 0.036127292],
  ],
  acceleration: [["m/s^2", 1]],
  frequency: [["Hz", 1]],
  area: [
    ["mm^2", 1],
    ["cm^2", 0.01],
    ["m^2", 1e-6],
  ],
} as const satisfies Record<string, readonly (readonly [string, number])[]>;

export type UnitDimension = keyof typeof UNITS;
export const ALL_UNITS: readonly string[] = Object.values(UNITS).flatMap((list) => list.map(([u]) => u));

export const BUILTIN_MATERIALS = [
  "pla",
  "petg",
  "abs",
  "nylon",
  "aluminium_6061_t6",
  "steel_1018",
  "stainless_304",
  "music_wire",
  "natural_latex",
] as const;

/** A quantity as generated: the value in the canonical unit and which unit to write it in. */
interface QuantityGen {
  value: number;
  unitIndex: number;
  /** 0 plain, 1 fixed decimals, 2 exponent form */
  form: number;
}

function quantityArb(min: number, max: number): fc.Arbitrary<QuantityGen> {
  return fc.record({
    // Mostly round values spread over the range; now and then a finely divided one (long digit
    // strings). The extremes (subnormals, 1e300, NaN-like text) are the mutations' job: here the
    // spec must stay buildable so that the solver and the checks are reached.
    value: fc.oneof(
      { weight: 4, arbitrary: fc.integer({ min: 0, max: 1000 }).map((k) => min + ((max - min) * k) / 1000) },
      {
        weight: 1,
        arbitrary: fc.integer({ min: 0, max: 1_000_000 }).map((k) => min + ((max - min) * k) / 1_000_000),
      },
    ),
    // Mostly the canonical unit: keeps the arm near real sizes; the rest exercises conversions.
    unitIndex: fc.oneof({ weight: 4, arbitrary: fc.constant(0) }, { weight: 1, arbitrary: fc.nat(5) }),
    form: fc.nat(2),
  });
}

function formatNumber(v: number, form: number): string {
  if (form === 2 && v !== 0) return v.toExponential(3);
  if (form === 1) return v.toPrecision(4);
  return String(Number(v.toPrecision(6)));
}

function q(dim: UnitDimension, g: QuantityGen): string {
  const list = UNITS[dim];
  const [unit, factor] = list[g.unitIndex % list.length]!;
  return `${formatNumber(g.value * factor, g.form)} ${unit}`;
}

const sectionArb = fc.oneof(
  fc.record({ shape: fc.constant("rect" as const), a: quantityArb(4, 40), b: quantityArb(2, 20) }),
  fc.record({ shape: fc.constant("tube" as const), a: quantityArb(8, 40), b: quantityArb(0.5, 3) }),
  fc.record({ shape: fc.constant("rod" as const), a: quantityArb(3, 20), b: quantityArb(1, 2) }),
);
type SectionGen = { shape: "rect" | "tube" | "rod"; a: QuantityGen; b: QuantityGen };

function section(s: SectionGen): string {
  if (s.shape === "rod") return `rod ${q("length", s.a)}`;
  return `${s.shape} ${q("length", s.a)} x ${q("length", s.b)}`;
}

const materialNameArb = fc.oneof(
  { weight: 5, arbitrary: fc.constantFrom(...BUILTIN_MATERIALS) },
  { weight: 1, arbitrary: fc.constant("own") }, // the arm's own material, declared when used
);

// Mostly held joints; a passive one outside any loop (a model error) now and then.
const modeArb = fc.oneof(
  { weight: 6, arbitrary: fc.constant("range" as const) },
  { weight: 3, arbitrary: fc.constant("fixed" as const) },
  { weight: 1, arbitrary: fc.constant("passive" as const) },
);

const linkStageArb = fc.record({
  kind: fc.constant("link" as const),
  length: quantityArb(20, 500),
  section: fc.option(sectionArb, { nil: undefined }),
  material: fc.option(materialNameArb, { nil: undefined }),
  mass: fc.option(quantityArb(0, 800), { nil: undefined }),
  mode: modeArb,
  angle: quantityArb(-120, 120),
  rangeLow: quantityArb(-90, 0),
  rangeHigh: quantityArb(0, 90),
  pin: fc.option(fc.record({ d: quantityArb(2, 10), material: materialNameArb, double: fc.boolean() }), {
    nil: undefined,
  }),
  friction: fc.option(quantityArb(0, 0.5), { nil: undefined }),
  extraPoint: fc.option(fc.record({ x: quantityArb(0, 300), y: quantityArb(-30, 30) }), { nil: undefined }),
  inlineParent: fc.boolean(),
});

const parallelogramStageArb = fc.record({
  kind: fc.constant("parallelogram" as const),
  // Spacing stays below the bars' length in any unit, or the stage is impossible.
  length: quantityArb(100, 500),
  spacing: quantityArb(10, 60),
  /** Upper bar length as a ratio of the lower's: a slightly unequal stage closes with a tilt. */
  upperRatio: fc.option(fc.double({ min: 0.98, max: 1.02, noNaN: true }), { nil: undefined }),
  angle: quantityArb(-60, 60),
  rangeLow: quantityArb(-60, 0),
  rangeHigh: quantityArb(0, 60),
  fixed: fc.boolean(),
  bars: sectionArb,
  barMaterial: materialNameArb,
  headMass: fc.option(quantityArb(0, 200), { nil: undefined }),
  pins: fc.option(fc.record({ d: quantityArb(2, 8), material: materialNameArb }), { nil: undefined }),
  shear: fc.option(fc.constantFrom("single", "double"), { nil: undefined }),
  friction: fc.option(quantityArb(0, 0.3), { nil: undefined }),
  inlineParent: fc.boolean(),
});

const fourBarArb = fc.record({
  crank: quantityArb(80, 300),
  spacing: quantityArb(20, 80),
  angle: quantityArb(-40, 40),
  rangeLow: quantityArb(-50, 0),
  rangeHigh: quantityArb(0, 50),
});

type LinkStage = typeof linkStageArb extends fc.Arbitrary<infer T> ? T : never;
type ParallelogramStage = typeof parallelogramStageArb extends fc.Arbitrary<infer T> ? T : never;
type FourBar = typeof fourBarArb extends fc.Arbitrary<infer T> ? T : never;
type Stage = LinkStage | ParallelogramStage;

const attachArb = fc.record({
  body: fc.nat(20),
  x: quantityArb(0, 200),
  y: quantityArb(-40, 40),
  named: fc.boolean(),
});
type AttachGen = typeof attachArb extends fc.Arbitrary<infer T> ? T : never;

const springArb = fc.oneof(
  fc.record({
    kind: fc.constant("extension" as const),
    a: attachArb,
    b: attachArb,
    coil: fc.boolean(),
    rate: quantityArb(0.05, 5),
    free: quantityArb(10, 150),
    tension: fc.option(quantityArb(0, 30), { nil: undefined }),
    max: fc.option(quantityArb(100, 400), { nil: undefined }),
    wire: quantityArb(0.5, 3),
    coilD: quantityArb(5, 20),
    coils: fc.integer({ min: 5, max: 60 }),
  }),
  fc.record({
    kind: fc.constant("zero_length" as const),
    a: attachArb,
    b: attachArb,
    rate: quantityArb(0.05, 5),
    tension: fc.option(quantityArb(0, 20), { nil: undefined }),
  }),
  fc.record({
    kind: fc.constant("elastic" as const),
    a: attachArb,
    b: attachArb,
    free: quantityArb(20, 150),
    tube: fc.boolean(),
    area: quantityArb(2, 40),
    od: quantityArb(3, 12),
    wall: quantityArb(0.5, 2),
    stretch: fc.option(fc.double({ min: 1.2, max: 5, noNaN: true }), { nil: undefined }),
  }),
  fc.record({
    kind: fc.constant("gas" as const),
    a: attachArb,
    b: attachArb,
    force: quantityArb(10, 300),
    progression: fc.double({ min: 1, max: 2, noNaN: true }),
    strokeRatio: fc.double({ min: 0.2, max: 0.45, noNaN: true }),
    extended: quantityArb(100, 400),
  }),
  fc.record({
    kind: fc.constant("torsion" as const),
    at: fc.nat(20),
    rate: quantityArb(0.0005, 0.05),
    preloadAngle: fc.boolean(),
    preload: quantityArb(0, 180),
    max: fc.option(quantityArb(90, 360), { nil: undefined }),
  }),
);
type SpringGen = typeof springArb extends fc.Arbitrary<infer T> ? T : never;

const payloadArb = fc.record({
  body: fc.nat(20),
  mass: quantityArb(0, 2000),
  at: fc.record({ x: quantityArb(-50, 100), y: quantityArb(-80, 40) }),
  /** The mass range as ratios of the nominal mass, which must lie inside it. */
  range: fc.option(
    fc.record({
      low: fc.double({ min: 0.3, max: 1, noNaN: true }),
      high: fc.double({ min: 1, max: 2.5, noNaN: true }),
    }),
    { nil: undefined },
  ),
  force: fc.option(fc.record({ x: quantityArb(-10, 10), y: quantityArb(-10, 10) }), { nil: undefined }),
  onBase: fc.boolean(),
});
type PayloadGen = typeof payloadArb extends fc.Arbitrary<infer T> ? T : never;

const requireArb = fc.record({
  balance: fc.option(quantityArb(0.2, 5), { nil: undefined }),
  balanceAt: fc.boolean(),
  safety: fc.option(fc.double({ min: 1, max: 4, noNaN: true }), { nil: undefined }),
  tilt: fc.option(quantityArb(0.2, 5), { nil: undefined }),
  deflection: fc.option(quantityArb(0.2, 5), { nil: undefined }),
  frequency: fc.option(quantityArb(1, 10), { nil: undefined }),
  tipping: fc.option(fc.double({ min: 1, max: 3, noNaN: true }), { nil: undefined }),
  clearance: fc.option(quantityArb(0.5, 10), { nil: undefined }),
});

/** Layout choices that must not change the meaning. */
const styleArb = fc.record({
  indent: fc.constantFrom("  ", "    ", "\t", " "),
  newline: fc.constantFrom("\n", "\n", "\n", "\r\n"),
  semicolons: fc.boolean(),
  comments: fc.boolean(),
  gravity: fc.boolean(),
});

export const specGenArb = fc.record({
  title: fc.string({ maxLength: 20 }).map((s) => s.replace(/["\\\r\n]/g, "")),
  base: fc.record({
    name: fc.constantFrom("stand", "clamp", "foot", "base_1"),
    mass: fc.option(quantityArb(0, 10000), { nil: undefined }),
    footprint: fc.option(fc.record({ w: quantityArb(50, 400), d: quantityArb(50, 400) }), { nil: undefined }),
    yaw: fc.boolean(),
    surface: fc.option(quantityArb(-50, 50), { nil: undefined }),
    pivot: fc.record({ x: quantityArb(-50, 50), y: quantityArb(50, 400) }),
    anchor: fc.record({ x: quantityArb(-80, 80), y: quantityArb(100, 500) }),
  }),
  ownMaterial: fc.record({
    density: quantityArb(0.5, 8),
    modulus: quantityArb(1000, 200000),
    strength: quantityArb(10, 500),
    layer: fc.option(quantityArb(5, 50), { nil: undefined }),
    poisson: fc.double({ min: 0.1, max: 0.49, noNaN: true }),
  }),
  stages: fc.array(fc.oneof(linkStageArb, parallelogramStageArb), { minLength: 1, maxLength: 4 }),
  fourBar: fc.option(fourBarArb, { nil: undefined }),
  springs: fc.array(springArb, { maxLength: 3 }),
  payloads: fc.array(payloadArb, { maxLength: 2 }),
  require: fc.option(requireArb, { nil: undefined }),
  sweep: fc.option(
    fc.record({ steps: fc.integer({ min: 2, max: 9 }), grid: fc.option(fc.boolean(), { nil: undefined }) }),
    { nil: undefined },
  ),
  style: styleArb,
});

export type SpecGen = typeof specGenArb extends fc.Arbitrary<infer T> ? T : never;

interface Decl {
  head: string;
  props: string[];
  comment?: string;
}

/** Bodies a spring, payload or child can hang on, and how to name a point on each. */
interface Hanger {
  body: string;
  /** A named point on it that exists, for `body.point` references. */
  named?: string;
}

/** Renders a generated arm as spec text. */
export function renderSpec(g: SpecGen): string {
  const decls: Decl[] = [];
  const base = g.base.name;
  let usesOwn = false;
  const mat = (m: string): string => {
    if (m === "own") usesOwn = true;
    return m;
  };

  const baseProps: string[] = [];
  if (g.base.mass) baseProps.push(`mass ${q("mass", g.base.mass)}`);
  if (g.base.footprint)
    baseProps.push(`footprint ${q("length", g.base.footprint.w)} x ${q("length", g.base.footprint.d)}`);
  if (g.base.yaw) baseProps.push("yaw");
  if (g.base.surface) baseProps.push(`surface ${q("length", g.base.surface)}`);
  baseProps.push(`point pivot (${q("length", g.base.pivot.x)}, ${q("length", g.base.pivot.y)})`);
  baseProps.push(`point anchor (${q("length", g.base.anchor.x)}, ${q("length", g.base.anchor.y)})`);
  baseProps.push(`point fb_a (${g.base.pivot.x.value} mm, 40 mm)`);
  decls.push({ head: `base ${base}`, props: baseProps, comment: "the fixed ground" });

  const hangers: Hanger[] = [];
  const pivots: string[] = []; // joints and parallelograms a torsion spring may sit at
  let parent = `${base}.pivot`;
  g.stages.forEach((stage, i) => {
    if (stage.kind === "link") parent = renderLinkStage(stage, i, parent, decls, hangers, pivots, mat);
    else parent = renderParallelogramStage(stage, i, parent, decls, hangers, pivots, mat);
  });
  if (g.fourBar) renderFourBar(g.fourBar, base, g.base.pivot.x.value, decls, hangers, pivots);

  g.springs.forEach((s, i) => decls.push(renderSpring(s, i, base, hangers, pivots, mat)));
  const payloadNames: string[] = [];
  g.payloads.forEach((p, i) => {
    payloadNames.push(`load_${i}`);
    decls.push(renderPayload(p, i, base, hangers));
  });
  if (usesOwn) {
    const m = g.ownMaterial;
    const props = [
      `density ${q("density", m.density)}`,
      `modulus ${q("pressure", m.modulus)}`,
      `strength ${q("pressure", m.strength)}`,
      `poisson ${formatNumber(m.poisson, 1)}`,
    ];
    if (m.layer) props.push(`layer_strength ${q("pressure", m.layer)}`);
    decls.unshift({ head: "material own", props });
  }
  if (g.require) decls.push({ head: "require", props: renderRequire(g.require, payloadNames) });
  if (g.sweep) {
    const props = [`steps ${g.sweep.steps}`];
    if (g.sweep.grid !== undefined) props.push(`grid ${g.sweep.grid ? "on" : "off"}`);
    decls.push({ head: "sweep", props });
  }
  return layout(g, decls);
}

function renderLinkStage(
  s: LinkStage,
  i: number,
  parent: string,
  decls: Decl[],
  hangers: Hanger[],
  pivots: string[],
  mat: (m: string) => string,
): string {
  const name = `link_${i}`;
  const props = [`length ${q("length", s.length)}`];
  if (s.section) props.push(`section ${section(s.section)}`);
  if (s.material) props.push(`material ${mat(s.material)}`);
  if (s.mass || (!s.section && !s.material))
    props.push(`mass ${q("mass", s.mass ?? { value: 100, unitIndex: 0, form: 0 })}`);
  else if (!s.material) props.push("material pla");
  else if (!s.section) props.push("section rect 12 mm x 6 mm");
  if (s.extraPoint) props.push(`point hook (${q("length", s.extraPoint.x)}, ${q("length", s.extraPoint.y)})`);
  decls.push({ head: `link ${name}`, props });

  const joint = `joint_${i}`;
  const jprops = [`connects ${parent} to ${name}.start`, `angle ${q("angle", s.angle)}`];
  // A passive joint outside a loop is a model error on purpose now and then.
  if (s.mode === "range") jprops.push(`range ${q("angle", s.rangeLow)} .. ${q("angle", s.rangeHigh)}`);
  else if (s.mode === "fixed") jprops.push("fixed");
  if (s.pin) {
    jprops.push(`pin ${q("length", s.pin.d)} ${mat(s.pin.material)}`);
    if (s.pin.double) jprops.push("shear double");
  }
  if (s.friction) jprops.push(`friction ${q("torque", s.friction)}`);
  decls.push({ head: `joint ${joint}`, props: jprops });
  pivots.push(joint);
  hangers.push({ body: name, named: s.extraPoint ? "hook" : "end" });
  return s.inlineParent ? `${name}(${q("length", s.length)}, 0 mm)` : `${name}.end`;
}

function renderParallelogramStage(
  s: ParallelogramStage,
  i: number,
  parent: string,
  decls: Decl[],
  hangers: Hanger[],
  pivots: string[],
  mat: (m: string) => string,
): string {
  const name = `stage_${i}`;
  const props = [
    `on ${parent}`,
    `length ${q("length", s.length)}`,
    `spacing ${q("length", s.spacing)}`,
    `angle ${q("angle", s.angle)}`,
  ];
  if (s.upperRatio)
    props.push(`upper_length ${q("length", { ...s.length, value: s.length.value * s.upperRatio })}`);
  if (s.fixed) props.push("fixed");
  else props.push(`range ${q("angle", s.rangeLow)} .. ${q("angle", s.rangeHigh)}`);
  props.push(`bars ${section(s.bars)} ${mat(s.barMaterial)}`);
  if (s.headMass) props.push(`head_mass ${q("mass", s.headMass)}`);
  if (s.pins) props.push(`pins ${q("length", s.pins.d)} ${mat(s.pins.material)}`);
  if (s.shear) props.push(`shear ${s.shear}`);
  if (s.friction) props.push(`friction ${q("torque", s.friction)}`);
  decls.push({ head: `parallelogram ${name}`, props });
  pivots.push(name);
  hangers.push(
    { body: `${name}.lower`, named: "end" },
    { body: `${name}.upper`, named: "start" },
    { body: `${name}.head` },
  );
  return s.inlineParent ? `${name}.head(0 mm, ${q("length", s.spacing)})` : `${name}.head`;
}

/** A four-bar written out with links and passive joints: crank and rocker from the base, a
 * coupler across their ends; the last joint closes the loop. */
function renderFourBar(
  f: FourBar,
  base: string,
  pivotXmm: number,
  decls: Decl[],
  hangers: Hanger[],
  pivots: string[],
): void {
  const len = q("length", f.crank);
  const gap = q("length", f.spacing);
  decls.push({
    head: "link fb_crank",
    props: [`length ${len}`, "section rect 10 mm x 4 mm", "material aluminium_6061_t6"],
  });
  decls.push({
    head: "link fb_rocker",
    props: [`length ${len}`, "section rect 10 mm x 4 mm", "material aluminium_6061_t6"],
  });
  decls.push({ head: "link fb_coupler", props: [`length ${gap}`, "mass 20 g"] });
  decls.push({
    head: "joint fb_drive",
    props: [
      `connects ${base}.fb_a to fb_crank.start`,
      `angle ${q("angle", f.angle)}`,
      `range ${q("angle", f.rangeLow)} .. ${q("angle", f.rangeHigh)}`,
    ],
  });
  decls.push({
    head: "joint fb_rock",
    props: [
      `connects ${base}(${pivotXmm} mm, ${40 + f.spacing.value} mm) to fb_rocker.start`,
      `angle ${q("angle", f.angle)}`,
    ],
  });
  decls.push({
    head: "joint fb_top",
    props: ["connects fb_crank.end to fb_coupler.start", `angle ${90 - f.angle.value} deg`],
  });
  decls.push({
    head: "joint fb_close",
    props: ["connects fb_rocker.end to fb_coupler.end", `angle ${90 - f.angle.value} deg`],
  });
  pivots.push("fb_drive");
  hangers.push({ body: "fb_crank", named: "end" }, { body: "fb_coupler" });
}

function attach(a: AttachGen, base: string, hangers: Hanger[]): string {
  if (a.body % 4 === 0 || hangers.length === 0)
    return a.named ? `${base}.anchor` : `${base}(${q("length", a.x)}, ${q("length", a.y)})`;
  const h = hangers[a.body % hangers.length]!;
  if (a.named && h.named) return `${h.body}.${h.named}`;
  if (a.named) return h.body;
  return `${h.body}(${q("length", a.x)}, ${q("length", a.y)})`;
}

function renderSpring(
  s: SpringGen,
  i: number,
  base: string,
  hangers: Hanger[],
  pivots: string[],
  mat: (m: string) => string,
): Decl {
  const head = `spring spring_${i}`;
  if (s.kind === "torsion") {
    const at = pivots.length ? pivots[s.at % pivots.length]! : "nowhere";
    const props = ["torsion", `at ${at}`, `rate ${q("angular_stiffness", s.rate)}`];
    props.push(
      s.preloadAngle
        ? `preload ${q("angle", s.preload)}`
        : `preload ${q("torque", { ...s.preload, value: s.preload.value / 100 })}`,
    );
    if (s.max) props.push(`max_angle ${q("angle", s.max)}`);
    return { head, props };
  }
  const props = [s.kind, `between ${attach(s.a, base, hangers)} and ${attach(s.b, base, hangers)}`];
  switch (s.kind) {
    case "extension":
      if (s.coil)
        props.push(
          `wire ${q("length", s.wire)}`,
          `coil ${q("length", s.coilD)}`,
          `coils ${s.coils}`,
          `material ${mat("music_wire")}`,
        );
      else props.push(`rate ${q("stiffness", s.rate)}`);
      props.push(`free_length ${q("length", s.free)}`);
      if (s.tension) props.push(`initial_tension ${q("force", s.tension)}`);
      if (s.max) props.push(`max_length ${q("length", s.max)}`);
      break;
    case "zero_length":
      props.push(`rate ${q("stiffness", s.rate)}`);
      if (s.tension) props.push(`initial_tension ${q("force", s.tension)}`);
      break;
    case "elastic":
      props.push(`free_length ${q("length", s.free)}`);
      props.push(s.tube ? `tube ${q("length", s.od)} x ${q("length", s.wall)}` : `area ${q("area", s.area)}`);
      props.push("material natural_latex");
      if (s.stretch) props.push(`max_stretch ${formatNumber(s.stretch, 1)}`);
      break;
    case "gas":
      props.push(
        `force ${q("force", s.force)}`,
        `progression ${formatNumber(s.progression, 1)}`,
        `stroke ${q("length", { ...s.extended, value: s.extended.value * s.strokeRatio })}`,
        `extended_length ${q("length", s.extended)}`,
      );
      break;
  }
  return { head, props };
}

function renderPayload(p: PayloadGen, i: number, base: string, hangers: Hanger[]): Decl {
  const on =
    p.onBase && p.body % 5 === 0 ? base : hangers.length ? hangers[p.body % hangers.length]!.body : base;
  const props = [`mass ${q("mass", p.mass)}`, `at ${on}(${q("length", p.at.x)}, ${q("length", p.at.y)})`];
  if (p.range)
    props.push(
      `range ${q("mass", { ...p.mass, value: p.mass.value * p.range.low * 0.999 })} .. ${q("mass", { ...p.mass, value: p.mass.value * p.range.high * 1.001 })}`,
    );
  if (p.force) props.push(`force (${q("force", p.force.x)}, ${q("force", p.force.y)})`);
  return { head: `payload load_${i}`, props };
}

function renderRequire(r: NonNullable<SpecGen["require"]>, payloads: string[]): string[] {
  const props: string[] = [];
  const at = (s: string) => (r.balanceAt && payloads.length ? `${s} at ${payloads[0]}` : s);
  if (r.balance) props.push(at(`balance ${q("force", r.balance)}`));
  if (r.safety !== undefined) props.push(`safety ${formatNumber(r.safety, 1)}`);
  if (r.tilt) props.push(at(`tilt ${q("angle", r.tilt)}`));
  if (r.deflection) props.push(at(`deflection ${q("length", r.deflection)}`));
  if (r.frequency) props.push(`frequency ${q("frequency", r.frequency)}`);
  if (r.tipping !== undefined) props.push(`tipping ${formatNumber(r.tipping, 1)}`);
  if (r.clearance) props.push(`clearance ${q("length", r.clearance)}`);
  return props;
}

function layout(g: SpecGen, decls: Decl[]): string {
  const { indent, newline: nl, semicolons, comments } = g.style;
  const lines: string[] = [];
  if (comments) lines.push("# generated by the fuzzer");
  lines.push(`arm "${g.title}" {`);
  if (g.style.gravity) lines.push(`${indent}gravity 9.81 m/s^2`);
  for (const d of decls) {
    lines.push(`${indent}${d.head} {${comments && d.comment ? ` # ${d.comment}` : ""}`);
    if (semicolons && d.props.length > 1) {
      // Two properties on one line, `;`-separated, as the language allows.
      for (let k = 0; k < d.props.length; k += 2)
        lines.push(`${indent}${indent}${d.props.slice(k, k + 2).join("; ")}`);
    } else for (const p of d.props) lines.push(`${indent}${indent}${p}`);
    lines.push(`${indent}}`);
  }
  lines.push("}");
  return lines.join(nl) + nl;
}

/** Valid specs (as far as the generator knows). */
export const validSpecArb: fc.Arbitrary<string> = specGenArb.map(renderSpec);
