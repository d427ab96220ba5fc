// Builds `bearing` and `fastening` declarations (their kind follows from the properties given) and
// reads where they are used: a joint's `bearing` and `fastening`, a spring's `anchor_fastening` and
// `hook_fastening`, a payload's and the base's `fastening`.
import type { DimsNode } from "../syntax/ast";
import type { Span } from "../syntax/span";
import type { Base, Bearing, Fastening, FasteningAxis, Joint, Payload, Spring } from "./types";
import { coarsePitch, COARSE_SIZES_MM } from "./metric-threads";
import { quantityValue, readChoice, readQuantity, readWord, type Read, type Values } from "./read-values";
import { listWords, type BuildContext, type Props } from "./build-context";
import { materialOf } from "./build-parts";
import { boundedQuantity } from "./read-props";
import { atJoint } from "./spring-kinds";

/** The screws' class when `screws` names none: plain machine screws are commonly class 4.8 (the
 * weakest common class, so the check is not optimistic; common practice, no source). */
export const DEFAULT_SCREW_MATERIAL = "steel_4_8";

/** Fewest balls that hold two races apart on a plane (a ring of two rocks). */
const MIN_BALLS = 3;

interface KindRule {
  /** The property whose presence makes this kind. */
  key: string;
  words: string;
  /** Every property this kind takes. */
  keys: readonly string[];
}

const BEARING_KINDS: readonly KindRule[] = [
  { key: "balls", words: "a ball bearing", keys: ["balls", "pitch", "races", "groove"] },
  { key: "bore", words: "a plain bearing", keys: ["bore", "length", "material"] },
  { key: "static_rating", words: "a rated bearing", keys: ["static_rating", "dynamic_rating", "pitch"] },
];

const FASTENING_KINDS: readonly KindRule[] = [
  {
    key: "screws",
    words: "screws",
    keys: ["screws", "into", "engagement", "thread", "pitch", "spacing", "axis", "lever"],
  },
  { key: "bolts", words: "bolts", keys: ["bolts", "shear", "pitch", "spacing", "axis", "lever"] },
  { key: "adhesive", words: "glue", keys: ["adhesive", "area", "axis", "lever"] },
];

/** Which kind the properties make: exactly one kind key, else a finding. Properties of another
 * kind are reported as not applying. */
function kindOf(
  ctx: BuildContext,
  p: Props,
  rules: readonly KindRule[],
  example: string,
): KindRule | undefined {
  const given = rules.filter((k) => p.has(k.key));
  if (given.length === 0) {
    ctx.r.add(
      "property.missing",
      p.nameSpan,
      `${p.what} needs ${listWords(
        rules.map((k) => `\`${k.key}\``),
        "or",
      )} to say what it is, e.g. \`${example}\``,
      { data: { keys: [], lines: [example] } },
    );
    return undefined;
  }
  if (given.length > 1)
    ctx.r.add(
      "property.conflict",
      p.get(given[1]!.key)!.key.span,
      `${p.what} is ${given[0]!.words} (\`${given[0]!.key}\`): it cannot also be ${given[1]!.words}`,
      { related: [{ span: p.get(given[0]!.key)!.key.span, message: "what it is" }] },
    );
  const kind = given[0]!;
  for (const key of p.keys())
    if (!kind.keys.includes(key))
      ctx.r.add("property.unknown", p.get(key)!.key.span, `\`${key}\` does not apply to ${kind.words}`);
  return kind;
}

/** A quantity that must be positive, named by its key in the message. */
function positive(
  ctx: BuildContext,
  p: Props,
  key: string,
  dim: "length" | "force" | "area",
): Read<number> | undefined {
  return boundedQuantity(ctx, p, key, dim, `\`${key}\``, "positive");
}

/** `N x SIZE` then, where `material` is not "none", a material word (optional when "optional"). */
function readCountOf(
  ctx: BuildContext,
  v: Values,
  what: string,
  material: "required" | "optional",
): { count: number; size: number; span: Span; sizeSpan: Span; material?: string } | undefined {
  const node = v.next();
  if (!node || node.kind !== "dims") {
    if (node)
      v.r.add("value.invalid", node.span, `\`${v.key}\` expects a count x a size, e.g. \`${v.example}\``);
    else v.missing("a count x a size");
    return undefined;
  }
  const dims = node as DimsNode;
  const count = quantityValue(dims.first, v.key, ["dimensionless"], ctx.r);
  const size = quantityValue(dims.second, v.key, ["length"], ctx.r);
  let mat: string | undefined;
  if (v.peek() || material === "required") {
    const w = readWord(v, `the ${what}' material`);
    mat = w ? ctx.resolveMaterial(w) : undefined;
  }
  v.finish();
  if (count !== undefined && (count < 1 || !Number.isInteger(count))) {
    ctx.r.add(
      "value.impossible",
      dims.first.span,
      `the number of ${what} is a whole number, at least 1; got ${ctx.r.quote(dims.first.span)}`,
    );
    return undefined;
  }
  if (size !== undefined && size <= 0) {
    ctx.r.add(
      "value.impossible",
      dims.second.span,
      `a size must be positive, got ${ctx.r.quote(dims.second.span)}`,
    );
    return undefined;
  }
  if (count === undefined || size === undefined) return undefined;
  return { count, size, span: dims.span, sizeSpan: dims.second.span, ...(mat ? { material: mat } : {}) };
}

export function buildBearing(ctx: BuildContext, p: Props, id: string): Bearing | undefined {
  const kind = kindOf(ctx, p, BEARING_KINDS, "balls 12 x 6 mm chrome_steel");
  if (!kind) return undefined;
  const origin = p.origin();
  const need = (...keys: string[]) => {
    for (const k of keys) if (!p.has(k)) p.missing(k);
  };
  switch (kind.key) {
    case "balls": {
      need("pitch", "races");
      const bv = p.values("balls")!;
      const balls = readCountOf(ctx, bv, "balls", "required");
      const pitch = positive(ctx, p, "pitch", "length");
      const races = materialOf(ctx, p, "races", "the races' material");
      const groove = positive(ctx, p, "groove", "length");
      if (!balls || !balls.material || !pitch || !races) return undefined;
      const D = balls.size;
      if (balls.count < MIN_BALLS) {
        ctx.r.add("value.impossible", balls.span, `a ball bearing needs at least ${MIN_BALLS} balls`);
        return undefined;
      }
      // neighbours on the pitch circle are pitch sin(pi / Z) apart, centre to centre
      const gap = pitch.value * Math.sin(Math.PI / balls.count);
      if (gap < D) {
        const most = Math.floor(Math.PI / Math.asin(Math.min(1, D / pitch.value)));
        ctx.r.add(
          "value.impossible",
          balls.span,
          `${balls.count} balls of ${ctx.r.quote(balls.sizeSpan)} do not fit on a pitch circle of ${ctx.r.quote(pitch.span)} (at most ${most})`,
        );
        return undefined;
      }
      if (groove && groove.value <= D / 2) {
        ctx.r.add(
          "value.impossible",
          groove.span,
          `the groove's radius ${ctx.r.quote(groove.span)} must be larger than the ball's radius`,
        );
        return undefined;
      }
      return {
        id,
        kind: "balls",
        count: balls.count,
        ballDiameter: D,
        ballMaterial: balls.material,
        pitchDiameter: pitch.value,
        raceMaterial: races,
        ...(groove ? { grooveRadius: groove.value } : {}),
        origin,
      };
    }
    case "bore": {
      need("length", "material");
      const bore = positive(ctx, p, "bore", "length");
      const length = positive(ctx, p, "length", "length");
      const material = materialOf(ctx, p, "material", "the bearing's material");
      if (!bore || !length || !material) return undefined;
      return { id, kind: "plain", bore: bore.value, length: length.value, material, origin };
    }
    default: {
      const c0 = positive(ctx, p, "static_rating", "force");
      const c = positive(ctx, p, "dynamic_rating", "force");
      const pitch = positive(ctx, p, "pitch", "length");
      if (!c0) return undefined;
      return {
        id,
        kind: "rated",
        staticRating: c0.value,
        ...(c ? { dynamicRating: c.value } : {}),
        ...(pitch ? { pitchDiameter: pitch.value } : {}),
        origin,
      };
    }
  }
}

/** The thread pitch: as given, else the ISO coarse pitch of the diameter. */
function threadPitch(ctx: BuildContext, p: Props, diameter: number): number | undefined {
  const given = positive(ctx, p, "pitch", "length");
  if (given) return given.value;
  const coarse = coarsePitch(diameter);
  if (coarse === undefined && !p.has("pitch")) {
    ctx.r.add(
      "property.missing",
      p.nameSpan,
      `${p.what}: ${(diameter * 1000).toPrecision(3)} mm is not an ISO metric coarse size (${COARSE_SIZES_MM.join(", ")} mm): give its \`pitch\`, e.g. \`pitch 0.5 mm\``,
      { data: { keys: ["pitch"], lines: ["pitch 0.5 mm"] } },
    );
  }
  return coarse;
}

function commonFastening(
  ctx: BuildContext,
  p: Props,
  count: number,
): { axis?: FasteningAxis; lever?: number; spacing?: number } {
  const out: { axis?: FasteningAxis; lever?: number; spacing?: number } = {};
  const av = p.values("axis");
  if (av) {
    const w = readChoice(av, ["across", "through"]);
    av.finish();
    if (w) out.axis = w.value as FasteningAxis;
  }
  const lv = p.values("lever");
  if (lv) {
    const q = readQuantity(lv, ["length"]);
    lv.finish();
    if (q && q.value < 0)
      ctx.r.add("value.impossible", q.span, `\`lever\` cannot be negative, got ${ctx.r.quote(q.span)}`);
    else if (q) out.lever = q.value;
  }
  const spacing = positive(ctx, p, "spacing", "length");
  if (spacing) out.spacing = spacing.value;
  else if (count > 1 && !p.has("spacing"))
    p.missing("spacing", " (between the screws or bolts, to carry a moment)");
  return out;
}

export function buildFastening(ctx: BuildContext, p: Props, id: string): Fastening | undefined {
  const kind = kindOf(ctx, p, FASTENING_KINDS, "screws 2 x 3 mm");
  if (!kind) return undefined;
  const origin = p.origin();
  switch (kind.key) {
    case "screws": {
      for (const k of ["into", "engagement"]) if (!p.has(k)) p.missing(k);
      const screws = readCountOf(ctx, p.values("screws")!, "screws", "optional");
      const into = materialOf(ctx, p, "into", "the material the thread is in");
      const engagement = positive(ctx, p, "engagement", "length");
      let thread: "formed" | "tapped" | undefined;
      const tv = p.values("thread");
      if (tv) {
        const w = readChoice(tv, ["formed", "tapped"]);
        tv.finish();
        if (w) thread = w.value as "formed" | "tapped";
      }
      if (!screws) return undefined;
      const common = commonFastening(ctx, p, screws.count);
      const pitch = threadPitch(ctx, p, screws.size);
      const screwMaterial = screws.material ?? DEFAULT_SCREW_MATERIAL;
      if (!into || !engagement || pitch === undefined || !ctx.materials[screwMaterial]) return undefined;
      return {
        id,
        kind: "screws",
        count: screws.count,
        diameter: screws.size,
        pitch,
        screwMaterial,
        into,
        engagement: engagement.value,
        // a screw forms its own thread in a print unless the hole is said to be tapped
        thread: thread ?? (ctx.materials[into]!.printed ? "formed" : "tapped"),
        ...common,
        origin,
      };
    }
    case "bolts": {
      const bolts = readCountOf(ctx, p.values("bolts")!, "bolts", "required");
      let planes: 1 | 2 = 1;
      const sv = p.values("shear");
      if (sv) {
        const w = readChoice(sv, ["single", "double"]);
        sv.finish();
        if (w?.value === "double") planes = 2;
      }
      if (!bolts || !bolts.material) return undefined;
      const common = commonFastening(ctx, p, bolts.count);
      const pitch = threadPitch(ctx, p, bolts.size);
      if (pitch === undefined) return undefined;
      return {
        id,
        kind: "bolts",
        count: bolts.count,
        diameter: bolts.size,
        pitch,
        material: bolts.material,
        shearPlanes: planes,
        ...common,
        origin,
      };
    }
    default: {
      if (!p.has("area")) p.missing("area");
      const adhesive = materialOf(ctx, p, "adhesive", "the adhesive");
      const area = positive(ctx, p, "area", "area");
      const common = commonFastening(ctx, p, 1);
      if (!adhesive || !area) return undefined;
      return { id, kind: "glue", adhesive, area: area.value, ...common, origin };
    }
  }
}

/** A use of a bearing or fastening by name (`bearing elbow_ring`, `hook_fastening lug_screws`). */
export function readHardwareUse(
  ctx: BuildContext,
  p: Props,
  key: string,
  kind: "bearing" | "fastening",
): string | undefined {
  const v = p.values(key);
  if (!v) return undefined;
  const w = readWord(v, `a ${kind}'s name`);
  v.finish();
  return w ? ctx.resolveName(w, [kind], `a ${kind}`)?.id : undefined;
}

/** Reads the bearing and fastening uses of a built part into it. A fastening holds a joint only
 * when the joint is locked: a joint that turns passes no moment to hold. */
export function readUses(
  ctx: BuildContext,
  p: Props,
  part:
    | { keyword: "joint"; joint: Joint }
    | { keyword: "spring"; spring: Spring }
    | { keyword: "payload"; payload: Payload }
    | { keyword: "base"; base: Base },
): void {
  switch (part.keyword) {
    case "joint": {
      const bearing = readHardwareUse(ctx, p, "bearing", "bearing");
      const fastening = readHardwareUse(ctx, p, "fastening", "fastening");
      if (bearing) part.joint.bearing = bearing;
      if (fastening && part.joint.mode !== "fixed") {
        const modeKey = part.joint.mode === "range" ? p.get("range") : undefined;
        ctx.r.add(
          "property.conflict",
          p.get("fastening")!.key.span,
          `${p.what} turns${part.joint.mode === "range" ? " over its range" : " with its loop"}: a fastening holds only a fixed joint (a turning joint takes a \`pin\` or a \`bearing\`)`,
          modeKey ? { related: [{ span: modeKey.span, message: "its range" }] } : {},
        );
      } else if (fastening) part.joint.fastening = fastening;
      return;
    }
    case "spring": {
      if (atJoint(part.spring)) return; // its ends are not two points (reported as unknown)
      const a = readHardwareUse(ctx, p, "anchor_fastening", "fastening");
      const b = readHardwareUse(ctx, p, "hook_fastening", "fastening");
      if (a || b) part.spring.fastenings = { ...(a ? { a } : {}), ...(b ? { b } : {}) };
      return;
    }
    case "payload": {
      const f = readHardwareUse(ctx, p, "fastening", "fastening");
      if (f) part.payload.fastening = f;
      return;
    }
    case "base": {
      const f = readHardwareUse(ctx, p, "fastening", "fastening");
      if (f) part.base.fastening = f;
      return;
    }
  }
}
