// Reads a spring's `tune` and `adjust` lines: `tune anchor (x1, y1) .. (x2, y2)` (a rectangle in
// the end's body's frame), `tune rate 0.1 N/mm .. 2 N/mm` (a numeric property within bounds). What
// a spring may free comes from model/tunables.ts; a bound the language would refuse as a value
// (`rate 0`) is refused here too, so the search never writes one.
import type { PropertyNode, RegionNode } from "../syntax/ast";
import { span as makeSpan } from "../syntax/span";
import type { DimensionName } from "../units/dimension";
import type { Payload, Spring, Tuning } from "./types";
import { isWord, pointValue, quantityValue, type Values } from "./read-values";
import { listWords, type BuildContext, type Props } from "./build-context";
import {
  hasEnds,
  TUNABLE_ENDS,
  TUNING_LIMIT_KEYS,
  tunableProperties,
  type TunableProperty,
} from "./tunables";
import { parseUnit, sameDimension } from "../units/quantity";
import { DIMENSIONS } from "../units/dimension";

/** Reads every `tune` and `adjust` line of a spring into `spring.tunings`. */
export function readTunings(ctx: BuildContext, p: Props, spring: Spring): void {
  const lines = [...p.all("tune"), ...p.all("adjust")].sort((a, b) => a.span.start - b.span.start);
  if (lines.length === 0) return;
  const has = (key: string) => p.has(key);
  const tunings: Tuning[] = [];
  for (const prop of lines) {
    const t = readTuning(ctx, p, prop, spring, has);
    if (!t) continue;
    const earlier = tunings.find((x) => x.what === t.what);
    if (earlier) {
      ctx.r.add(
        earlier.mode === t.mode ? "property.repeated" : "property.conflict",
        t.whatSpan,
        earlier.mode === t.mode
          ? `\`${t.mode} ${t.what}\` is given twice in ${p.what}; this one counts`
          : `${p.what} has both \`${earlier.mode} ${t.what}\` and \`${t.mode} ${t.what}\`: the search picks one value, an adjuster is set per payload mass; give one`,
        { related: [{ span: earlier.span, message: "the earlier one" }] },
      );
      tunings.splice(tunings.indexOf(earlier), 1);
    }
    tunings.push(t);
  }
  if (tunings.length > 0) spring.tunings = tunings;
}

function readTuning(
  ctx: BuildContext,
  p: Props,
  prop: PropertyNode,
  spring: Spring,
  has: (key: string) => boolean,
): Tuning | undefined {
  const mode = prop.key.text === "adjust" ? "adjust" : "tune";
  const v = p.cursor(prop);
  const first = v.next();
  if (!first) {
    v.missing("what to free: `anchor`, `hook` or a property");
    return undefined;
  }
  if (!isWord(first)) {
    ctx.r.add(
      "value.invalid",
      first.span,
      `\`${mode}\` names what it frees first: \`anchor\`, \`hook\` or a property, e.g. \`${mode} rate 0.1 N/mm .. 2 N/mm\``,
    );
    return undefined;
  }
  const what = first.parts[0]!.text;
  const tunables = tunableProperties(spring, has);
  const ends = hasEnds(spring) ? [...TUNABLE_ENDS] : [];
  if ((TUNABLE_ENDS as readonly string[]).includes(what)) {
    if (!hasEnds(spring)) {
      ctx.r.add(
        "value.invalid",
        first.span,
        `${p.what} acts at a joint: it has no ${what} to place; it can ${mode} ${listWords(
          tunables.map((t) => `\`${t.key}\``),
          "or",
        )}`,
      );
      return undefined;
    }
    return readRegion(ctx, v, mode, what, first.span, prop);
  }
  const tunable = tunables.find((t) => t.key === what);
  if (!tunable) {
    ctx.r.add(
      "value.invalid",
      first.span,
      `${p.what} cannot ${mode} \`${what}\`: ${whyNot(what, spring, has)}; it can ${mode} ${listWords(
        [...ends, ...tunables.map((t) => t.key)].map((k) => `\`${k}\``),
        "or",
      )}`,
    );
    return undefined;
  }
  return readBounds(ctx, v, mode, tunable, first.span, prop);
}

/** Why a word is not something this spring can free, in a few words. */
function whyNot(what: string, spring: Spring, has: (key: string) => boolean): string {
  if (TUNING_LIMIT_KEYS.includes(what)) return `\`${what}\` is a limit the search keeps, not a design value`;
  if (what === "rate" && (spring.kind === "extension" || spring.kind === "torsion") && !has("rate"))
    return "its rate comes from its coil, so the coil is what changes";
  if ((what === "wire" || what === "coil" || what === "coils") && has("rate"))
    return "it is given by its rate, so the rate is what changes";
  if (what === "area" && spring.kind === "elastic") return "it is cut from a `tube`, whose sizes are bought";
  if (what === "tube") return "a tube's sizes are bought; its strands and cut length are what change";
  return "it is not a numeric property of this kind of spring";
}

function readRegion(
  ctx: BuildContext,
  v: Values,
  mode: "tune" | "adjust",
  what: string,
  whatSpan: Tuning["whatSpan"],
  prop: PropertyNode,
): Tuning | undefined {
  const node = v.next();
  if (!node || node.kind !== "region") {
    ctx.r.add(
      "value.invalid",
      node?.span ?? whatSpan,
      `\`${mode} ${what}\` takes a rectangle in its body's frame, two corners \`(x1, y1) .. (x2, y2)\`, e.g. \`${mode} ${what} (-10 mm, 40 mm) .. (10 mm, 120 mm)\``,
    );
    return undefined;
  }
  v.finish();
  const region = regionValue(ctx, node, `${mode} ${what}`);
  if (!region) return undefined;
  return { mode, what, region, span: prop.span, whatSpan, boundsSpan: node.span };
}

function regionValue(ctx: BuildContext, node: RegionNode, key: string): Tuning["region"] {
  const a = pointValue(node.low, key, "length", ctx.r);
  const b = pointValue(node.high, key, "length", ctx.r);
  if (!a || !b) return undefined;
  return {
    low: { x: Math.min(a.x, b.x), y: Math.min(a.y, b.y) },
    high: { x: Math.max(a.x, b.x), y: Math.max(a.y, b.y) },
  };
}

function readBounds(
  ctx: BuildContext,
  v: Values,
  mode: "tune" | "adjust",
  tunable: TunableProperty,
  whatSpan: Tuning["whatSpan"],
  prop: PropertyNode,
): Tuning | undefined {
  const node = v.next();
  const key = `${mode} ${tunable.key}`;
  if (!node || node.kind !== "range") {
    ctx.r.add(
      "value.invalid",
      node?.span ?? whatSpan,
      `\`${key}\` takes its bounds \`low .. high\`, e.g. \`${exampleOf(mode, tunable)}\``,
    );
    return undefined;
  }
  v.finish();
  const dimension = boundsDimension(node.low.unit?.text, tunable.dimensions);
  const lo = quantityValue(node.low, key, [dimension], ctx.r);
  const hi = quantityValue(node.high, key, [dimension], ctx.r);
  if (lo === undefined || hi === undefined) return undefined;
  if (lo > hi) {
    ctx.r.add(
      "value.impossible",
      node.span,
      `reversed bounds: the low end ${ctx.r.quote(node.low.span)} is above the high end ${ctx.r.quote(node.high.span)}`,
      { data: { suggestion: `${ctx.r.quote(node.high.span)} .. ${ctx.r.quote(node.low.span)}` } },
    );
    return undefined;
  }
  const least = tunable.least;
  if (least && (lo < least.value || (!least.allowed && lo <= least.value))) {
    ctx.r.add(
      "value.impossible",
      node.low.span,
      `the search would try \`${tunable.key} ${ctx.r.quote(node.low.span)}\`, which a spring cannot have: \`${tunable.key}\` must be ${least.allowed ? "at least" : "above"} ${least.value}`,
    );
    return undefined;
  }
  if (tunable.integer && (!Number.isInteger(lo) || !Number.isInteger(hi))) {
    ctx.r.add(
      "value.impossible",
      node.span,
      `\`${tunable.key}\` is a count: its bounds are whole numbers, got ${ctx.r.quote(node.span)}`,
    );
    return undefined;
  }
  return {
    mode,
    what: tunable.key,
    range: [lo, hi],
    dimension,
    ...(tunable.integer ? { integer: true } : {}),
    span: prop.span,
    whatSpan,
    boundsSpan: makeSpan(node.span.start, node.span.end),
  };
}

/** The dimension the bounds are written in: the property's own, or another it takes (a torsion
 * preload as an angle) when the low end's unit says so. */
function boundsDimension(unit: string | undefined, dims: DimensionName[]): DimensionName {
  const parsed = unit ? parseUnit(unit) : undefined;
  if (parsed?.ok) for (const d of dims) if (sameDimension(parsed.unit.dimension, DIMENSIONS[d])) return d;
  return dims[0]!;
}

function exampleOf(mode: string, t: TunableProperty): string {
  const examples: Record<string, string> = {
    rate: t.dimensions[0] === "angular_stiffness" ? "0.001 N*m/deg .. 0.01 N*m/deg" : "0.1 N/mm .. 2 N/mm",
    initial_tension: "0 N .. 20 N",
    free_length: "40 mm .. 120 mm",
    wire: "0.8 mm .. 2 mm",
    coil: "6 mm .. 16 mm",
    coils: "5 .. 40",
    area: "5 mm^2 .. 40 mm^2",
    strands: "1 .. 4",
    force: "50 N .. 300 N",
    progression: "1.1 .. 1.5",
    stroke: "40 mm .. 100 mm",
    extended_length: "150 mm .. 300 mm",
    preload: "-0.5 N*m .. 0.5 N*m",
  };
  return `${mode} ${t.key} ${examples[t.key] ?? "low .. high"}`;
}

/** An `adjust` line sets a value per payload mass: without a payload that has a mass `range` it has
 * nothing to follow. */
export function reportAdjustWithoutRange(ctx: BuildContext, springs: Spring[], payloads: Payload[]): void {
  if (payloads.some((p) => p.massRange)) return;
  for (const s of springs)
    for (const t of s.tunings ?? [])
      if (t.mode === "adjust")
        ctx.r.about(s.id, () =>
          ctx.r.add(
            "adjust.no-range",
            t.whatSpan,
            `\`adjust ${t.what}\` gives a setting for each payload mass, but no payload has a mass \`range\`: give the payload one (e.g. \`range 300 g .. 700 g\`), or \`tune\` it instead`,
          ),
        );
}
