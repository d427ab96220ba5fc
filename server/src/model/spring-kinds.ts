// One descriptor per spring kind: the properties it takes, what the balance best fit may change,
// the words messages and hovers use for it, and its force law. Everything kind-specific that the
// model, the solver, the checks, the fixes, the hover and docs/language.md need is here, so a new
// kind is one entry (plus its type in types.ts and how build-springs.ts reads it).
import type { DimensionName } from "../units/dimension";
import type {
  ArmModel,
  ElasticCord,
  ExtensionSpring,
  GasStrut,
  Spring,
  SpringKind,
  TorsionSpring,
  ZeroLengthSpring,
} from "./types";

export type SpringOf<K extends SpringKind> = Extract<Spring, { kind: K }>;
/** Springs that act at a joint (torsion), and those between two hooks. */
export type JointSpring = Extract<Spring, { joint: string }>;
export type HookSpring = Exclude<Spring, JointSpring>;

/** What the force law may read of the arm: the materials (a cord's rubber). */
export type LawContext = Pick<ArmModel, "materials">;

/** A setting the balance best fit may change. The force is linear in the kind's settings where
 * the spring is taut (force = basis[0] p[0] + basis[1] p[1]), which makes the fit convex. */
export interface FitSetting<S extends Spring = Spring> {
  /** The property it is written in: the key of a balance finding's `best`. */
  key: string;
  dimension: DimensionName;
  /** Its present value, SI. */
  value(s: S): number;
  /** Its name in a quick fix's title ("Set lift's rate to ..."). */
  words: string;
  /** Its name in a balance message ("with initial tension ..."). */
  messageWords: string;
  /** The label of its best-fit readout. */
  label: string;
  /** The fix rewrites it only where the text has it; otherwise it adds a line for it under the
   * first setting. */
  mustExist: boolean;
  /** A fix writes it only when positive (a rate, an area; a force or torque may be 0 or less). */
  positive: boolean;
  /** The fit may choose a negative value (a torsion preload winds either way). */
  signed: boolean;
  /** Below this magnitude a balance message says "and no <messageWords>" ... */
  negligible?: number;
  /** ... and a fix adds no line for it. */
  omitNegligible?: boolean;
}

/** The properties of a kind, as docs/language.md's table lists them. */
export interface KindProperties {
  required: string[];
  /** One of these groups is required (`rate`, or the coil that gives it). */
  oneOf?: string[][];
  optional: string[];
}

export interface SpringKindDescriptor<K extends SpringKind = SpringKind> {
  kind: K;
  /** The kind word's meaning (schema, docs). */
  doc: string;
  /** "an extension spring" (model messages), "extension spring" (hover). */
  words: { withArticle: string; name: string };
  /** Between two hooks (`between`), or at a joint (`at`): what its length or turn is. */
  actsAt: "hooks" | "joint";
  properties: KindProperties;
  /** The properties a balance finding about it points at, the first one written. */
  balanceKeys: string[];
  /** What the best fit may change: one or two settings. */
  fit: [FitSetting<SpringOf<K>>] | [FitSetting<SpringOf<K>>, FitSetting<SpringOf<K>>];
  /** Pulls only above its free length (slack, 0, below it). */
  slackBelowFreeLength: boolean;
  /** A rate along its hook line: the ideal zero-free-length rate k = m g l / (a b) applies. */
  lineRate: boolean;
  /** The force law: tension at a hook-to-hook length (N, positive pulls the hooks together; a
   * strut pushes, negative), or for a torsion spring the torque T at a turn from its reference
   * (N*m, applied to the parent, -T to the child). */
  load(s: SpringOf<K>, lengthOrTurn: number, arm: LawContext): number;
  /** The coefficients of `load` in the fit settings at a length or turn. */
  basis(s: SpringOf<K>, lengthOrTurn: number, arm: LawContext, out: Float64Array): void;
  /** The tangent rate d(load)/d(length or turn): N/m, or N*m/rad at a joint. */
  tangentRate(s: SpringOf<K>, lengthOrTurn: number, arm: LawContext): number;
  /** What the hover says of it, with figures formatted by `show`. */
  facts(s: SpringOf<K>, show: (valueSI: number, dimension: DimensionName) => string): string[];
  /** Cautions its readout carries. */
  cautions: string[];
}

// ---- force laws ---------------------------------------------------------------------------------

/** Helical extension spring: F = Fi + k (L - L0) past its free length, slack (0) below it. */
export function extensionSpringTension(
  s: Pick<ExtensionSpring, "rate" | "freeLength" | "initialTension">,
  length: number,
): number {
  return length > s.freeLength ? s.initialTension + s.rate * (length - s.freeLength) : 0;
}

/** Ideal zero-free-length spring: F = Fi + k L. */
export function zeroLengthTension(
  s: Pick<ZeroLengthSpring, "rate" | "initialTension">,
  length: number,
): number {
  return s.initialTension + s.rate * length;
}

/** Neo-Hookean cord in uniaxial tension: F = G A0 (s - s^-2), s = L / L0, slack below L0
 * (Treloar, The Physics of Rubber Elasticity, 3rd ed., 1975). */
export function elasticCordTension(
  s: Pick<ElasticCord, "freeLength" | "area">,
  shearModulus: number,
  length: number,
): number {
  if (!(s.freeLength > 0) || length <= s.freeLength) return 0;
  const stretch = length / s.freeLength;
  return shearModulus * s.area * (stretch - 1 / (stretch * stretch));
}

/** Stroke position of a gas strut: how far it is pushed in from full extension, clamped to
 * 0..stroke (outside it the strut is topped or bottomed out and its force stays at the end value). */
export function gasStrutStrokePosition(
  s: Pick<GasStrut, "stroke" | "extendedLength">,
  length: number,
): number {
  return Math.min(Math.max(s.extendedLength - length, 0), Math.max(s.stroke, 0));
}

/** Gas strut: pushes with a force linear in stroke position from `force` fully extended to
 * progression x force fully compressed. Returned as (negative) tension. */
export function gasStrutTension(
  s: Pick<GasStrut, "force" | "progression" | "stroke" | "extendedLength">,
  length: number,
): number {
  const x = gasStrutStrokePosition(s, length);
  const fraction = s.stroke > 0 ? x / s.stroke : 0;
  return -s.force * (1 + (s.progression - 1) * fraction);
}

/** Torsion spring at a joint: T = k (theta - theta_ref) - preload. The spring applies T to the
 * parent and -T to the child (CCW positive), so turning the child CCW winds it up and it pushes
 * back; a positive preload pushes the child counter-clockwise at the reference pose (it lifts a
 * child that reaches out to the right, as a counterbalance does). */
export function torsionSpringTorque(
  s: Pick<TorsionSpring, "rate" | "preloadTorque">,
  jointAngle: number,
  referenceAngle: number,
): number {
  return s.rate * (jointAngle - referenceAngle) - s.preloadTorque;
}

/** Shear modulus of a cord's material, Pa (0 when the material is unknown). */
export function cordShearModulus(arm: LawContext, s: ElasticCord): number {
  return arm.materials[s.material]?.shearModulus ?? 0;
}

// ---- the descriptors ----------------------------------------------------------------------------

/** Hundredths of a newton of initial tension are below what a spring maker can set (common
 * practice, no source). */
const NEGLIGIBLE_TENSION_N = 0.01;

/** How each end of a spring between hooks is fastened (issue 12's fastenings). */
const HOOK_FASTENINGS = ["anchor_fastening", "hook_fastening"];
/** Every kind takes `tune` and `adjust` lines (what each may free: model/tunables.ts). */
const TUNING = ["tune", "adjust"];

/** A fit setting: its messages and label say `words` unless told otherwise; by default it must be
 * written already, a fix writes it only when positive, and the fit keeps it unsigned. */
function fitSetting<S extends Spring>(
  key: string,
  dimension: DimensionName,
  value: (s: S) => number,
  words: string,
  opts: Partial<Omit<FitSetting<S>, "key" | "dimension" | "value" | "words">> = {},
): FitSetting<S> {
  const messageWords = opts.messageWords ?? words;
  return {
    key,
    dimension,
    value,
    words,
    messageWords,
    label: `best-fit ${messageWords}`,
    mustExist: true,
    positive: true,
    signed: false,
    ...opts,
  };
}

const rate = <S extends ExtensionSpring | ZeroLengthSpring>(): FitSetting<S> =>
  fitSetting<S>("rate", "stiffness", (s) => s.rate, "rate");

const initialTension = <S extends ExtensionSpring | ZeroLengthSpring>(
  omitNegligible: boolean,
): FitSetting<S> =>
  fitSetting<S>("initial_tension", "force", (s) => s.initialTension, "initial tension", {
    mustExist: false,
    positive: false,
    negligible: NEGLIGIBLE_TENSION_N,
    omitNegligible,
  });

/** Force = Fi + k x where taut: coefficients (x, 1), or (0, 0) where slack. */
function rateAndTensionBasis(stretch: number, taut: boolean, out: Float64Array): void {
  out[0] = taut ? stretch : 0;
  out[1] = taut ? 1 : 0;
}

const EXTENSION: SpringKindDescriptor<"extension"> = {
  kind: "extension",
  doc: "Helical extension spring.",
  words: { withArticle: "an extension spring", name: "extension spring" },
  actsAt: "hooks",
  properties: {
    required: ["between", "free_length"],
    oneOf: [["rate"], ["wire", "coil", "coils", "material"]],
    optional: ["initial_tension", "max_length", ...HOOK_FASTENINGS, ...TUNING],
  },
  balanceKeys: ["rate"],
  fit: [rate(), initialTension(false)],
  slackBelowFreeLength: true,
  lineRate: true,
  load: (s, length) => extensionSpringTension(s, length),
  basis: (s, length, _arm, out) => rateAndTensionBasis(length - s.freeLength, length > s.freeLength, out),
  tangentRate: (s, length) => (length > s.freeLength ? s.rate : 0),
  facts: (s, show) => [
    "extension spring",
    `rate ${show(s.rate, "stiffness")}`,
    `free length ${show(s.freeLength, "length")}`,
    `initial tension ${show(s.initialTension, "force")}`,
  ],
  cautions: [],
};

const ZERO_LENGTH: SpringKindDescriptor<"zero_length"> = {
  kind: "zero_length",
  doc: "Ideal zero-free-length spring (e.g. led over a pulley).",
  words: { withArticle: "a zero-length spring", name: "zero-free-length spring" },
  actsAt: "hooks",
  properties: { required: ["between", "rate"], optional: ["initial_tension", ...HOOK_FASTENINGS, ...TUNING] },
  balanceKeys: ["rate"],
  fit: [rate(), initialTension(true)],
  slackBelowFreeLength: false,
  lineRate: true,
  load: (s, length) => zeroLengthTension(s, length),
  basis: (_s, length, _arm, out) => rateAndTensionBasis(length, true, out),
  tangentRate: (s) => s.rate,
  facts: (s, show) => ["zero-free-length spring", `rate ${show(s.rate, "stiffness")}`],
  cautions: [],
};

const ELASTIC: SpringKindDescriptor<"elastic"> = {
  kind: "elastic",
  doc: "Rubber cord or tubing (neo-Hookean).",
  words: { withArticle: "an elastic cord", name: "elastic cord" },
  actsAt: "hooks",
  properties: {
    required: ["between", "free_length", "material"],
    oneOf: [["area"], ["tube"]],
    optional: ["max_stretch", "strands", ...HOOK_FASTENINGS, ...TUNING],
  },
  balanceKeys: ["area", "tube"],
  fit: [fitSetting<ElasticCord>("area", "area", (s) => s.area, "cross-section")],
  slackBelowFreeLength: true,
  lineRate: false,
  load: (s, length, arm) => elasticCordTension(s, cordShearModulus(arm, s), length),
  // The neo-Hookean force is proportional to the area: its coefficient is the force per m^2.
  basis: (s, length, arm, out) => {
    out[0] = s.area !== 0 ? elasticCordTension(s, cordShearModulus(arm, s), length) / s.area : 0;
    out[1] = 0;
  },
  tangentRate: (s, length, arm) => {
    const G = cordShearModulus(arm, s);
    const stretch = length / s.freeLength;
    // d/dL of G A0 (s - s^-2) (Treloar neo-Hookean) is G A0 (1 + 2 s^-3) / L0
    return stretch > 1 ? (G * s.area * (1 + 2 / stretch ** 3)) / s.freeLength : 0;
  },
  facts: (s, show) => [
    "elastic cord",
    `free length ${show(s.freeLength, "length")}`,
    `area ${show(s.area, "area")}`,
    `material ${s.material}`,
  ],
  cautions: [
    "Rubber creeps and relaxes under a steady stretch: its force falls over days; check the balance again after the cord has settled.",
  ],
};

const GAS: SpringKindDescriptor<"gas"> = {
  kind: "gas",
  doc: "Gas strut.",
  words: { withArticle: "a gas strut", name: "gas strut" },
  actsAt: "hooks",
  properties: {
    required: ["between", "force", "progression", "stroke", "extended_length"],
    optional: [...HOOK_FASTENINGS, ...TUNING],
  },
  balanceKeys: ["force"],
  fit: [
    fitSetting<GasStrut>("force", "force", (s) => s.force, "force", {
      messageWords: "extended force",
      positive: false,
    }),
  ],
  slackBelowFreeLength: false,
  lineRate: false,
  load: (s, length) => gasStrutTension(s, length),
  // The force scales with the extended force: its coefficient is the force per newton of it.
  basis: (s, length, _arm, out) => {
    out[0] = s.force !== 0 ? gasStrutTension(s, length) / s.force : 0;
    out[1] = 0;
  },
  // The force rises linearly from `force` to progression x force over the stroke, and stays at the
  // end value when the strut is topped or bottomed out.
  tangentRate: (s, length) => {
    const x = gasStrutStrokePosition(s, length);
    return x > 0 && x < s.stroke ? ((s.progression - 1) * s.force) / s.stroke : 0;
  },
  facts: (s, show) => [
    "gas strut",
    `force ${show(s.force, "force")} extended`,
    `progression ${show(s.progression, "dimensionless")}`,
    `stroke ${show(s.stroke, "length")}`,
  ],
  cautions: [],
};

const TORSION: SpringKindDescriptor<"torsion"> = {
  kind: "torsion",
  doc: "Torsion spring at a pivot.",
  words: { withArticle: "a torsion spring", name: "torsion spring" },
  actsAt: "joint",
  // The rate as given, or from the coils with the wire, coil and material (which, given with a
  // rate, let the wire's stress be checked).
  properties: {
    required: ["at"],
    oneOf: [["rate"], ["coils", "wire", "coil", "material"]],
    optional: ["preload", "max_angle", ...TUNING],
  },
  balanceKeys: ["rate"],
  fit: [
    fitSetting<TorsionSpring>("rate", "angular_stiffness", (s) => s.rate, "rate"),
    fitSetting<TorsionSpring>("preload", "torque", (s) => s.preloadTorque, "preload", {
      mustExist: false,
      positive: false,
      signed: true,
    }),
  ],
  slackBelowFreeLength: false,
  lineRate: false,
  load: (s, turn) => torsionSpringTorque(s, turn, 0),
  basis: (_s, turn, _arm, out) => {
    out[0] = turn;
    out[1] = -1;
  },
  tangentRate: (s) => s.rate,
  facts: (s, show) => [
    `torsion spring at ${s.joint}`,
    `rate ${show(s.rate, "angular_stiffness")}`,
    `preload ${show(s.preloadTorque, "torque")}`,
  ],
  cautions: [],
};

/** Every spring kind, in the order the language lists them. */
export const SPRING_KIND_TABLE: { readonly [K in SpringKind]: SpringKindDescriptor<K> } = {
  extension: EXTENSION,
  zero_length: ZERO_LENGTH,
  elastic: ELASTIC,
  gas: GAS,
  torsion: TORSION,
};

/** The kind words, in order. */
export const SPRING_KIND_WORDS = Object.keys(SPRING_KIND_TABLE) as SpringKind[];

/** The descriptor of a spring's kind, typed for that spring. */
export function springKind<S extends Spring>(s: S): SpringKindDescriptor<S["kind"]> {
  return SPRING_KIND_TABLE[s.kind] as unknown as SpringKindDescriptor<S["kind"]>;
}

/** True for a spring that acts at a joint (its descriptor's `actsAt`). */
export function atJoint(s: Spring): s is JointSpring {
  return SPRING_KIND_TABLE[s.kind].actsAt === "joint";
}

/** True for a spring that pulls only above its free length (its descriptor's `slackBelowFreeLength`). */
export function goesSlack(s: Spring): s is Extract<Spring, { freeLength: number }> {
  return SPRING_KIND_TABLE[s.kind].slackBelowFreeLength && "freeLength" in s;
}

/** The kinds that take a property, in order (the schema's `springKinds`). */
export function kindsTaking(key: string): SpringKind[] {
  return SPRING_KIND_WORDS.filter((k) => {
    const p = SPRING_KIND_TABLE[k].properties;
    return p.required.includes(key) || p.optional.includes(key) || !!p.oneOf?.some((g) => g.includes(key));
  });
}

/** True for a word that names a spring kind. */
export function isSpringKind(word: string): word is SpringKind {
  return Object.prototype.hasOwnProperty.call(SPRING_KIND_TABLE, word);
}
