// Builds springs: one kind word (extension, zero_length, elastic, gas, torsion), the properties
// that kind takes, and the values derived from them (a coil's rate, a tube's area, a preload torque).
import { SPRING_KINDS } from "./schema";
import { SPRING_KIND_TABLE } from "./spring-kinds";
import type { Attachment, CoilGeometry, Spring, SpringKind } from "./types";
import { extensionSpringRate, torsionSpringRatePerRad } from "./coil";
import {
  readDims,
  readFlag,
  readKeyword,
  readQuantity,
  readReference,
  readWord,
  type Read,
} from "./read-values";
import { listWords, type BuildContext, type Props } from "./build-context";
import { materialOf } from "./build-parts";

/** "an extension spring", "a gas strut": the kind as messages name it. */
const withArticle = (kind: SpringKind): string => SPRING_KIND_TABLE[kind].words.withArticle;

/** Best effort: a spring whose hooks (or joint) resolve is kept even when a value has an error (the
 * finding stands and the solver does not run), with 0 for what could not be read, so the editor
 * can still show and hover it. */
export function buildSpring(ctx: BuildContext, p: Props, id: string): Spring | undefined {
  const kinds = SPRING_KINDS.filter((k) => p.has(k));
  for (const k of kinds) readFlag(p.values(k)!);
  if (kinds.length === 0) {
    ctx.r.add(
      "property.missing",
      p.nameSpan,
      `${p.what} needs its kind: one of ${listWords([...SPRING_KINDS], "or")}`,
      { data: { keys: [], lines: ["extension"] } },
    );
    return undefined;
  }
  if (kinds.length > 1) {
    const second = p.get(kinds[1]!)!;
    ctx.r.add(
      "property.conflict",
      second.key.span,
      `${p.what} is already \`${kinds[0]}\`: a spring has one kind`,
      {
        related: [{ span: p.get(kinds[0]!)!.key.span, message: "its first kind" }],
      },
    );
  }
  const kind = kinds[0]!;
  // Properties of other kinds do not apply.
  for (const key of p.keys()) {
    const spec = p.specOf(key);
    if (!spec.springKinds || spec.springKinds.includes(kind)) continue;
    ctx.r.add(
      "property.unknown",
      p.get(key)!.key.span,
      `\`${key}\` does not apply to ${withArticle(kind)} (it is for ${listWords(spec.springKinds.map((k) => withArticle(k as SpringKind)))})`,
    );
  }
  const origin = p.origin();

  const q = (
    key: string,
    dim: Parameters<typeof readQuantity>[1][number],
    opts: { positive?: boolean; atLeastOne?: boolean } = {},
  ): Read<number> | undefined => {
    const v = p.values(key);
    if (!v) return undefined;
    const r = readQuantity(v, [dim]);
    v.finish();
    if (!r) return undefined;
    if (opts.positive && r.value <= 0) {
      ctx.r.add("value.impossible", r.span, `\`${key}\` must be positive, got ${ctx.r.quote(r.span)}`);
      return undefined;
    }
    if (r.value < 0) {
      ctx.r.add("value.impossible", r.span, `\`${key}\` cannot be negative, got ${ctx.r.quote(r.span)}`);
      return undefined;
    }
    return r;
  };
  // What every spring of the kind needs (its descriptor's `required`); a choice between two ways
  // of giving a value (a rate or its coil, an area or a tube) is read below.
  for (const key of SPRING_KIND_TABLE[kind].properties.required) if (!p.has(key)) p.missing(key);

  if (kind === "torsion") {
    // the rate as given, or from the coil's active coils; wire, coil and material alone (with a
    // rate) let the wire's stress be checked
    const wireKeys = ["wire", "coil", "material"];
    if (p.has("rate") && p.has("coils")) {
      ctx.r.add(
        "property.conflict",
        p.get("coils")!.key.span,
        `${p.what} has both \`rate\` and \`coils\`: give the rate, or the coils (with \`wire\`, \`coil\`, \`material\`) to compute it`,
        { related: [{ span: p.get("rate")!.span, message: "the rate" }] },
      );
    } else if (!p.has("rate") && !p.has("coils")) p.missing("rate");
    else if (!p.has("rate"))
      for (const k of wireKeys) if (!p.has(k)) p.missing(k, " to compute the rate from the coil");
    if (p.has("rate") && wireKeys.some((k) => p.has(k)))
      for (const k of wireKeys) if (!p.has(k)) p.missing(k, " to check the wire's stress");
    const rate = q("rate", "angular_stiffness", { positive: true });
    const wire = q("wire", "length", { positive: true });
    const mean = q("coil", "length", { positive: true });
    const coils = q("coils", "dimensionless", { positive: true });
    const material = materialOf(ctx, p, "material", "the wire's material");
    let coil: CoilGeometry | undefined;
    let coilRate: number | undefined;
    if (wire && mean && mean.value <= wire.value)
      ctx.r.add(
        "value.impossible",
        mean.span,
        `the mean coil diameter ${ctx.r.quote(mean.span)} must be larger than the wire ${ctx.r.quote(wire.span)}`,
      );
    else if (wire && mean && material) {
      coil = { wireDiameter: wire.value, meanDiameter: mean.value, bodyCoils: coils?.value ?? 0, material };
      if (!rate && coils)
        coilRate = torsionSpringRatePerRad(
          wire.value,
          mean.value,
          coils.value,
          ctx.materials[material]!.modulus,
        );
    }
    let joint: string | undefined;
    const av = p.values("at");
    if (av) {
      const w = readWord(av, "a joint or parallelogram name");
      av.finish();
      const target = w ? ctx.resolveName(w, ["joint", "parallelogram"], "a joint") : undefined;
      joint = target?.id;
    }
    let preloadTorque = 0;
    const pv = p.values("preload");
    if (pv) {
      const r = readQuantity(pv, ["angle", "torque"]);
      pv.finish();
      // A preload given as a wind-up angle becomes the torque rate x angle.
      if (r) preloadTorque = r.dimension === "angle" ? (rate?.value ?? coilRate ?? 0) * r.value : r.value;
    }
    const maxAngle = q("max_angle", "angle", { positive: true });
    if (!joint) return undefined;
    return {
      kind,
      id,
      origin,
      joint,
      rate: rate?.value ?? coilRate ?? 0,
      preloadTorque,
      ...(maxAngle ? { maxAngle: maxAngle.value } : {}),
      ...(coil ? { coil } : {}),
    };
  }

  const ends = readBetween(ctx, p);

  if (kind === "extension") {
    const coilKeys = ["wire", "coil", "coils", "material"];
    const coilGiven = coilKeys.filter((k) => p.has(k));
    if (p.has("rate") && coilGiven.length > 0) {
      ctx.r.add(
        "property.conflict",
        p.get(coilGiven[0]!)!.key.span,
        `${p.what} has both \`rate\` and a coil: give the rate, or the coil (\`wire\`, \`coil\`, \`coils\`, \`material\`) to compute it`,
        {
          related: [{ span: p.get("rate")!.span, message: "the rate" }],
        },
      );
    } else if (!p.has("rate") && coilGiven.length === 0) {
      ctx.r.add(
        "property.missing",
        p.nameSpan,
        `${p.what} needs \`rate\` (or its coil: \`wire\`, \`coil\`, \`coils\`, \`material\`), e.g. \`rate 0.8 N/mm\``,
        { data: { keys: ["rate"], lines: ["rate 0.8 N/mm"] } },
      );
    } else if (!p.has("rate")) {
      for (const k of coilKeys) if (!p.has(k)) p.missing(k, " to compute the rate from the coil");
      p.flushMissing();
    }
    const rate = q("rate", "stiffness", { positive: true });
    const free = q("free_length", "length", { positive: true });
    const fi = q("initial_tension", "force");
    const max = q("max_length", "length", { positive: true });
    if (max && free && max.value <= free.value) {
      ctx.r.add(
        "value.impossible",
        max.span,
        `max_length ${ctx.r.quote(max.span)} must be longer than free_length ${ctx.r.quote(free.span)}`,
      );
    }
    let coil: CoilGeometry | undefined;
    let coilRate: number | undefined;
    if (!p.has("rate")) {
      const wire = q("wire", "length", { positive: true });
      const mean = q("coil", "length", { positive: true });
      const coils = q("coils", "dimensionless", { positive: true });
      const material = materialOf(ctx, p, "material", "the wire's material");
      if (wire && mean && mean.value <= wire.value) {
        ctx.r.add(
          "value.impossible",
          mean.span,
          `the mean coil diameter ${ctx.r.quote(mean.span)} must be larger than the wire ${ctx.r.quote(wire.span)}`,
        );
      } else if (wire && mean && coils && material) {
        coil = { wireDiameter: wire.value, meanDiameter: mean.value, bodyCoils: coils.value, material };
        const m = ctx.materials[material]!;
        coilRate = extensionSpringRate(wire.value, mean.value, coils.value, m.shearModulus, m.modulus);
      }
    }
    if (!ends) return undefined;
    return {
      kind,
      id,
      origin,
      ...ends,
      rate: rate?.value ?? coilRate ?? 0,
      freeLength: free?.value ?? 0,
      initialTension: fi?.value ?? 0,
      ...(max ? { maxLength: max.value } : {}),
      ...(coil ? { coil } : {}),
    };
  }

  if (kind === "zero_length") {
    const rate = q("rate", "stiffness", { positive: true });
    const fi = q("initial_tension", "force");
    if (!ends) return undefined;
    return { kind, id, origin, ...ends, rate: rate?.value ?? 0, initialTension: fi?.value ?? 0 };
  }

  if (kind === "elastic") {
    const free = q("free_length", "length", { positive: true });
    let area: number | undefined;
    if (p.has("area") && p.has("tube")) {
      ctx.r.add(
        "property.conflict",
        p.get("tube")!.key.span,
        `${p.what} has both \`area\` and \`tube\`: give one`,
        { related: [{ span: p.get("area")!.span, message: "the area" }] },
      );
    } else if (!p.has("area") && !p.has("tube")) {
      ctx.r.add(
        "property.missing",
        p.nameSpan,
        `${p.what} needs its cross-section: \`area\` or \`tube OD x wall\`, e.g. \`tube 6 mm x 1.5 mm\``,
        { data: { keys: [], lines: ["tube 6 mm x 1.5 mm"] } },
      );
    }
    const av = p.values("area");
    if (av) {
      const r = readQuantity(av, ["area"]);
      av.finish();
      if (r && r.value <= 0)
        ctx.r.add("value.impossible", r.span, `an area must be positive, got ${ctx.r.quote(r.span)}`);
      else if (r) area = r.value;
    }
    const tv = p.values("tube");
    if (tv) {
      const d = readDims(tv);
      tv.finish();
      if (d) {
        const [od, wall] = d.value;
        if (od <= 0 || wall <= 0)
          ctx.r.add(
            "value.impossible",
            d.span,
            `a tube's sizes must be positive, got ${ctx.r.quote(d.span)}`,
          );
        else if (wall >= od / 2)
          ctx.r.add(
            "value.impossible",
            d.span,
            `a tube's wall must be less than its radius: ${ctx.r.quote(d.span)}`,
          );
        else if (area === undefined) area = (Math.PI / 4) * (od * od - (od - 2 * wall) ** 2);
      }
    }
    const material = materialOf(ctx, p, "material", "the cord's material");
    const strands = q("strands", "dimensionless", { positive: true });
    if (strands && !Number.isInteger(strands.value)) {
      ctx.r.add(
        "value.impossible",
        strands.span,
        `\`strands\` is a count of cords: a whole number, got ${ctx.r.quote(strands.span)}`,
      );
    } else if (strands && area !== undefined) area *= strands.value;
    const stretch = q("max_stretch", "dimensionless", { positive: true });
    if (stretch && stretch.value <= 1)
      ctx.r.add(
        "value.impossible",
        stretch.span,
        `max_stretch is a ratio L / L0 above 1, got ${ctx.r.quote(stretch.span)}`,
      );
    if (!ends) return undefined;
    return {
      kind,
      id,
      origin,
      ...ends,
      freeLength: free?.value ?? 0,
      area: area ?? 0,
      material: material ?? "",
      ...(strands && Number.isInteger(strands.value) && strands.value > 1 ? { strands: strands.value } : {}),
      ...(stretch && stretch.value > 1 ? { maxStretch: stretch.value } : {}),
    };
  }

  // gas
  const force = q("force", "force", { positive: true });
  const progression = q("progression", "dimensionless", { positive: true });
  if (progression && progression.value < 1) {
    ctx.r.add(
      "value.impossible",
      progression.span,
      `progression is compressed force / extended force, at least 1; got ${ctx.r.quote(progression.span)}`,
    );
  }
  const stroke = q("stroke", "length", { positive: true });
  const extended = q("extended_length", "length", { positive: true });
  if (stroke && extended && stroke.value >= extended.value) {
    ctx.r.add(
      "value.impossible",
      stroke.span,
      `a stroke of ${ctx.r.quote(stroke.span)} does not fit in an extended length of ${ctx.r.quote(extended.span)}`,
    );
  }
  if (!ends) return undefined;
  return {
    kind,
    id,
    origin,
    ...ends,
    force: force?.value ?? 0,
    progression: Math.max(1, progression?.value ?? 1),
    stroke: stroke?.value ?? 0,
    extendedLength: extended?.value ?? 0,
  };
}

/** `between REF and REF`. */
function readBetween(ctx: BuildContext, p: Props): { a: Attachment; b: Attachment } | undefined {
  const v = p.values("between");
  if (!v) return undefined;
  const first = readReference(v, "the first hook point");
  const and = first ? readKeyword(v, "and", "and the second hook point") : false;
  const second = and ? readReference(v, "the second hook point") : undefined;
  v.finish();
  const a = first ? ctx.resolvePoint(first, "between") : undefined;
  const b = second ? ctx.resolvePoint(second, "between") : undefined;
  if (!a || !b) return undefined;
  if (a.body === b.body) {
    ctx.r.add(
      "spring.same-body",
      p.get("between")!.span,
      `both hooks of ${p.what} are on ${a.body}: it pulls the body on itself and does nothing`,
    );
  }
  return { a, b };
}
