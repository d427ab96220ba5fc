// Reads a property's values by the shape the schema gives it (quantity, range, point, section, ...)
// and reports, at the exact words, what does not fit. SI out.
import type { DimsNode, PropertyNode, QuantityNode, ReferenceNode, ValueNode } from "../syntax/ast";
import { LineIndex, span as makeSpan, type Span } from "../syntax/span";
import type { DimensionName } from "../units/dimension";
import { checkQuantity, parseUnit } from "../units/quantity";
import type { UnitSystem } from "../units/unit-table";
import { closestWord } from "../units/did-you-mean";
import type { Code } from "../findings/codes";
import { finding, type Finding, type FindingData, type RelatedInfo } from "../findings/finding";
import type { Section, Vec2 } from "./types";

/** Codes the model builder reports. */
export type ModelCode = Exclude<
  Code,
  | `geometry.${string}`
  | `balance.${string}`
  | `strength.${string}`
  | `stiffness.${string}`
  | `analysis.${string}`
  | "syntax.error"
>;

/** Collects findings for one build, each about the declaration being read when it was reported. */
export class Reporter {
  readonly findings: Finding[] = [];
  private readonly index: LineIndex | undefined;
  /** The model id of the declaration being read: every finding reported meanwhile is about it. */
  private subject: string | undefined;
  /** The unit system the spec is written in (model/written-units.ts): a missing unit is offered in it. */
  units: UnitSystem = "si";

  constructor(
    readonly text: string,
    /** Lines that already carry a syntax error: findings there are dropped. */
    private readonly quietLines: ReadonlySet<number> = new Set(),
  ) {
    this.index = quietLines.size > 0 ? new LineIndex(text) : undefined;
  }

  /** Runs `read` with its findings about `subject` (undefined: about no one part). */
  about<T>(subject: string | undefined, read: () => T): T {
    const outer = this.subject;
    this.subject = subject;
    try {
      return read();
    } finally {
      this.subject = outer;
    }
  }

  add<C extends ModelCode>(
    code: C,
    at: Span,
    message: string,
    ...[extra = {}]: {} extends FindingData<C>
      ? [extra?: { related?: RelatedInfo[]; data?: FindingData<C> }]
      : [extra: { related?: RelatedInfo[]; data: FindingData<C> }]
  ): void {
    if (this.index && this.quietLines.has(this.index.position(at.start).line)) return;
    // An explicit subject wins over the declaration being read.
    const data = { ...(this.subject !== undefined ? { subject: this.subject } : {}), ...extra.data };
    this.findings.push(
      finding<Code>(code, at, message, { related: extra.related ?? [], data } as {
        data: FindingData<Code>;
      }) as Finding,
    );
  }

  /** The text of a span, on one line, for quoting in a message. */
  quote(s: Span): string {
    return this.text.slice(s.start, s.end).replace(/\s+/g, " ");
  }
}

/** A value read from the text, with the span of the words it came from. */
export interface Read<T> {
  value: T;
  span: Span;
}

/** Walks a property's values left to right. */
export class Values {
  private index = 0;
  constructor(
    readonly prop: PropertyNode,
    readonly r: Reporter,
    /** Example as it would be typed, for "expected a value after `rate`, e.g. ...". */
    readonly example: string,
  ) {}

  get key(): string {
    return this.prop.key.text;
  }

  peek(offset = 0): ValueNode | undefined {
    return this.prop.values[this.index + offset];
  }

  next(): ValueNode | undefined {
    return this.prop.values[this.index++];
  }

  /** Where a missing value would go: just after the last value read, else the key. */
  private missingAt(): Span {
    const last = this.prop.values[this.index - 1];
    return last ? last.span : this.prop.key.span;
  }

  missing(what: string): void {
    const after = this.index === 0 ? `\`${this.key}\`` : `\`${this.r.quote(this.missingAt())}\``;
    this.r.add(
      "value.invalid",
      this.missingAt(),
      `expected ${what} after ${after}, e.g. \`${this.example}\``,
    );
  }

  /** Reports values left over after the shape is read. */
  finish(): void {
    const rest = this.prop.values.slice(this.index);
    if (rest.length === 0) return;
    const s = makeSpan(rest[0]!.span.start, rest[rest.length - 1]!.span.end);
    this.r.add(
      "value.invalid",
      s,
      `unexpected \`${this.r.quote(s)}\` after \`${this.key}\`: write it as \`${this.example}\``,
    );
    this.index = this.prop.values.length;
  }
}

const DIMENSION_WORDS: Record<DimensionName, string> = {
  length: "a length",
  area: "an area",
  mass: "a mass",
  force: "a force",
  torque: "a torque",
  stiffness: "a stiffness",
  angular_stiffness: "an angular stiffness",
  angle: "an angle",
  pressure: "a pressure",
  density: "a density",
  acceleration: "an acceleration",
  frequency: "a frequency",
  time: "a time",
  dimensionless: "a number",
};

export function isWord(v: ValueNode | undefined): v is ReferenceNode {
  return v?.kind === "reference" && v.parts.length === 1 && !v.point;
}

/** Checks one quantity node; reports on the number (missing unit) or on the unit (unknown, wrong
 * dimension). Returns SI. */
export function quantityValue(
  q: QuantityNode,
  key: string,
  dims: readonly DimensionName[],
  r: Reporter,
): number | undefined {
  return checkedQuantity(q, key, dims, r)?.value;
}

/** Magnitudes (SI) beyond which a quantity cannot belong to a bench arm and only invites overflow
 * and round-off downstream: 1e-15 to 1e15 spans a femtometre to the distance light travels in an
 * hour, and the stiffest modulus known (about 1e12 Pa) with room to spare (common practice, no
 * source). Zero stays allowed (massless links, `angle 0 deg`). */
const SMALLEST_MAGNITUDE = 1e-15;
const LARGEST_MAGNITUDE = 1e15;

function checkedQuantity(
  q: QuantityNode,
  key: string,
  dims: readonly DimensionName[],
  r: Reporter,
): { value: number; dimension: DimensionName } | undefined {
  if (!Number.isFinite(q.value)) {
    r.add("value.invalid", q.numberSpan, `\`${q.numberText}\` is too large a number to compute with`);
    return undefined;
  }
  if (q.value === 0 && /[1-9]/.test(q.numberText.replace(/[eE].*$/, ""))) {
    r.add(
      "value.invalid",
      q.numberSpan,
      `\`${q.numberText}\` is too small a number to compute with (it reads as 0)`,
    );
    return undefined;
  }
  const c = checkQuantity(key, q.value, q.numberText, q.unit?.text, dims, r.units);
  if (
    c.ok &&
    c.valueSI !== 0 &&
    (!Number.isFinite(c.valueSI) ||
      Math.abs(c.valueSI) < SMALLEST_MAGNITUDE ||
      Math.abs(c.valueSI) > LARGEST_MAGNITUDE)
  ) {
    r.add("value.impossible", q.span, `\`${r.quote(q.span)}\` is far outside anything an arm can have`);
    return undefined;
  }
  if (c.ok) return { value: c.valueSI, dimension: c.dimension };
  const at = c.onUnit && q.unit ? q.unit.span : q.numberSpan;
  r.add(c.problem, at, c.message, c.suggestion ? { data: { suggestion: c.suggestion } } : {});
  return undefined;
}

/**
 * Reads a quantity. A number without a unit followed by a word the shape does not expect reads as
 * a number with an unknown unit (`30 gr`: "unknown unit `gr`; did you mean g?"): the parser only
 * joins known units to their number, so the word arrives here on its own.
 */
export function readQuantity(
  v: Values,
  dims: readonly DimensionName[],
  opts: { nextTakesWord?: boolean } = {},
): (Read<number> & { dimension: DimensionName }) | undefined {
  const node = v.next();
  const what = dims.map((d) => DIMENSION_WORDS[d]).join(" or ");
  if (!node) {
    v.missing(what);
    return undefined;
  }
  if (node.kind !== "quantity") {
    v.r.add(
      "value.invalid",
      node.span,
      `\`${v.key}\` expects ${what}, e.g. \`${v.example}\`; got \`${v.r.quote(node.span)}\``,
    );
    return undefined;
  }
  const following = v.peek();
  if (!node.unit && !dims.includes("dimensionless") && isWord(following) && !opts.nextTakesWord) {
    v.next();
    const parsed = parseUnit(following.parts[0]!.text);
    const message = parsed.ok
      ? `unexpected space inside \`${v.r.quote(makeSpan(node.span.start, following.span.end))}\``
      : parsed.message;
    v.r.add(
      "unit.unknown",
      following.span,
      message,
      !parsed.ok && parsed.suggestion ? { data: { suggestion: parsed.suggestion } } : {},
    );
    return undefined;
  }
  const c = checkedQuantity(node, v.key, dims, v.r);
  return c === undefined ? undefined : { value: c.value, dimension: c.dimension, span: node.span };
}

/** A range as read: both ends (SI, low first) and, for findings about one end, each end's span. */
export type RangeRead = Read<[number, number]> & { ends: [Span, Span] };

export function readRange(v: Values, dim: DimensionName): RangeRead | undefined {
  const node = v.next();
  if (!node) {
    v.missing(`a range \`low .. high\``);
    return undefined;
  }
  if (node.kind !== "range") {
    v.r.add(
      "value.invalid",
      node.span,
      `\`${v.key}\` expects a range \`low .. high\`, e.g. \`${v.example}\``,
    );
    return undefined;
  }
  const lo = quantityValue(node.low, v.key, [dim], v.r);
  const hi = quantityValue(node.high, v.key, [dim], v.r);
  if (lo === undefined || hi === undefined) return undefined;
  if (lo > hi) {
    v.r.add(
      "value.impossible",
      node.span,
      `reversed range: the low end ${v.r.quote(node.low.span)} is above the high end ${v.r.quote(node.high.span)}`,
      {
        data: { suggestion: `${v.r.quote(node.high.span)} .. ${v.r.quote(node.low.span)}` },
      },
    );
    // Kept in order so that what is built from it stays consistent; the error stands.
    return { value: [hi, lo], span: node.span, ends: [node.high.span, node.low.span] };
  }
  return { value: [lo, hi], span: node.span, ends: [node.low.span, node.high.span] };
}

/** `(x, y)` with both parts of one dimension (lengths for points, forces for `force`). */
export function pointValue(
  node: ValueNode | undefined,
  key: string,
  dim: DimensionName,
  r: Reporter,
): Vec2 | undefined {
  if (!node || node.kind !== "point") return undefined;
  if (node.z)
    r.add(
      "value.invalid",
      node.z.span,
      `\`${key}\` takes a point in the drawing plane, \`(x, y)\`: a third component is only for a payload's working \`force\``,
    );
  const x = quantityValue(node.x, key, [dim], r);
  const y = quantityValue(node.y, key, [dim], r);
  return x === undefined || y === undefined ? undefined : { x, y };
}

/** `(x, y)` or `(x, y, z)`: a working load in three dimensions, z out of the drawing plane towards
 * the reader (absent: 0). */
export function vectorValue(
  node: ValueNode | undefined,
  key: string,
  dim: DimensionName,
  r: Reporter,
): { x: number; y: number; z: number } | undefined {
  if (!node || node.kind !== "point") return undefined;
  const x = quantityValue(node.x, key, [dim], r);
  const y = quantityValue(node.y, key, [dim], r);
  const z = node.z ? quantityValue(node.z, key, [dim], r) : 0;
  return x === undefined || y === undefined || z === undefined ? undefined : { x, y, z };
}

export function readPoint(v: Values, dim: DimensionName): Read<Vec2> | undefined {
  const node = v.next();
  if (!node) {
    v.missing("a point `(x, y)`");
    return undefined;
  }
  if (node.kind !== "point") {
    v.r.add("value.invalid", node.span, `\`${v.key}\` expects \`(x, y)\`, e.g. \`${v.example}\``);
    return undefined;
  }
  const p = pointValue(node, v.key, dim, v.r);
  return p ? { value: p, span: node.span } : undefined;
}

function dimsValue(node: DimsNode, key: string, r: Reporter): [number, number] | undefined {
  const a = quantityValue(node.first, key, ["length"], r);
  const b = quantityValue(node.second, key, ["length"], r);
  return a === undefined || b === undefined ? undefined : [a, b];
}

/** `A x B`, two lengths. */
export function readDims(v: Values): Read<[number, number]> | undefined {
  const node = v.next();
  if (!node) {
    v.missing("two sizes `A x B`");
    return undefined;
  }
  if (node.kind !== "dims") {
    v.r.add("value.invalid", node.span, `\`${v.key}\` expects two sizes \`A x B\`, e.g. \`${v.example}\``);
    return undefined;
  }
  const d = dimsValue(node, v.key, v.r);
  return d ? { value: d, span: node.span } : undefined;
}

export const SECTION_SHAPES = ["rect", "tube", "rod"] as const;

/** `rect DEPTH x WIDTH`, `tube OD x WALL`, `rod D`, with the checks that make it a real section. */
export function readSection(v: Values): Read<Section> | undefined {
  const shapeNode = v.next();
  if (!shapeNode) {
    v.missing("a section (rect, tube or rod)");
    return undefined;
  }
  if (!isWord(shapeNode)) {
    v.r.add(
      "value.invalid",
      shapeNode.span,
      `expected the section's shape first: rect, tube or rod, e.g. \`rect 20 mm x 6 mm\``,
    );
    if (shapeNode.kind === "dims" || shapeNode.kind === "quantity") return undefined;
    return undefined;
  }
  const shape = shapeNode.parts[0]!.text;
  if (!(SECTION_SHAPES as readonly string[]).includes(shape)) {
    const best = closestWord(shape, SECTION_SHAPES);
    v.r.add(
      "value.invalid",
      shapeNode.span,
      `unknown section \`${shape}\`${best ? `; did you mean \`${best}\`?` : ""} (the sections are rect, tube and rod)`,
      best ? { data: { suggestion: best } } : {},
    );
    v.next();
    return undefined;
  }
  if (shape === "rod") {
    const d = readQuantity(v, ["length"], { nextTakesWord: true });
    if (!d) return undefined;
    if (d.value <= 0) {
      v.r.add("value.impossible", d.span, `a rod's diameter must be positive, got ${v.r.quote(d.span)}`);
      return undefined;
    }
    return { value: { shape: "rod", diameter: d.value }, span: makeSpan(shapeNode.span.start, d.span.end) };
  }
  const sizes = v.next();
  if (!sizes || sizes.kind !== "dims") {
    const example = shape === "rect" ? "rect 20 mm x 6 mm" : "tube 25 mm x 2 mm";
    if (sizes)
      v.r.add("value.invalid", sizes.span, `a ${shape} section takes two sizes, e.g. \`${example}\``);
    else
      v.r.add(
        "value.invalid",
        shapeNode.span,
        `expected the ${shape}'s two sizes after \`${shape}\`, e.g. \`${example}\``,
      );
    return undefined;
  }
  const d = dimsValue(sizes, v.key, v.r);
  if (!d) return undefined;
  const whole = makeSpan(shapeNode.span.start, sizes.span.end);
  const [a, b] = d;
  if (a <= 0) {
    v.r.add(
      "value.impossible",
      sizes.first.span,
      `a section's size must be positive, got ${v.r.quote(sizes.first.span)}`,
    );
    return undefined;
  }
  if (b <= 0) {
    v.r.add(
      "value.impossible",
      sizes.second.span,
      `a section's size must be positive, got ${v.r.quote(sizes.second.span)}`,
    );
    return undefined;
  }
  if (shape === "rect") return { value: { shape: "rect", depth: a, width: b }, span: whole };
  if (b >= a / 2) {
    v.r.add(
      "value.impossible",
      sizes.second.span,
      `a tube's wall (${v.r.quote(sizes.second.span)}) must be less than its radius (half of ${v.r.quote(sizes.first.span)}): for a solid bar write \`rod ${v.r.quote(sizes.first.span)}\``,
    );
    return undefined;
  }
  return { value: { shape: "tube", outerDiameter: a, wall: b }, span: whole };
}

/** A single word (a material, an enumerated choice, a name). */
export function readWord(v: Values, what: string): Read<string> | undefined {
  const node = v.next();
  if (!node) {
    v.missing(what);
    return undefined;
  }
  if (!isWord(node)) {
    v.r.add(
      "value.invalid",
      node.span,
      `\`${v.key}\` expects ${what}, e.g. \`${v.example}\`; got \`${v.r.quote(node.span)}\``,
    );
    return undefined;
  }
  return { value: node.parts[0]!.text, span: node.span };
}

/** One of a fixed list of words, with did-you-mean. */
export function readChoice(v: Values, words: readonly string[]): Read<string> | undefined {
  const w = readWord(v, `one of ${words.join(", ")}`.replace(/, ([^,]*)$/, " or $1"));
  if (!w) return undefined;
  if (!words.includes(w.value)) {
    const best = closestWord(w.value, words);
    v.r.add(
      "value.invalid",
      w.span,
      `\`${v.key}\` is one of ${words.join(", ").replace(/, ([^,]*)$/, " or $1")}; got \`${w.value}\`${best ? `; did you mean \`${best}\`?` : ""}`,
      best ? { data: { suggestion: best } } : {},
    );
    return undefined;
  }
  return w;
}

/** A connective word (`to`, `and`, `at`) in a sequence. True when reading may go on: the word is
 * there, or it is missing before a value (reported once; the value is still read). */
export function readKeyword(v: Values, word: string, before: string): boolean {
  const node = v.peek();
  if (isWord(node) && node.parts[0]!.text === word) {
    v.next();
    return true;
  }
  if (!node) {
    v.missing(`\`${word}\` ${before}`);
    return false;
  }
  v.r.add(
    "value.invalid",
    node.span,
    `expected \`${word}\` before \`${v.r.quote(node.span)}\`, e.g. \`${v.example}\``,
    { data: { insert: `${word} ` } },
  );
  return true;
}

export function readReference(v: Values, what: string): ReferenceNode | undefined {
  const node = v.next();
  if (!node) {
    v.missing(what);
    return undefined;
  }
  if (node.kind !== "reference") {
    v.r.add(
      "value.invalid",
      node.span,
      `\`${v.key}\` expects ${what}, e.g. \`${v.example}\`; got \`${v.r.quote(node.span)}\``,
    );
    return undefined;
  }
  return node;
}

/** A property that is only its key (`fixed`, `yaw`, `extension`). */
export function readFlag(v: Values): void {
  const first = v.peek();
  if (!first) return;
  const last = v.prop.values[v.prop.values.length - 1]!;
  const s = makeSpan(first.span.start, last.span.end);
  v.r.add("value.invalid", s, `\`${v.key}\` takes no value: write it alone`);
  v.next();
  while (v.next()) {
    /* consumed */
  }
}
