// The design search's variables: what the spec's `tune` lines free (or, with none, each spring's
// rate and tension or what makes the same force), as scalars within bounds, and how a set of
// values makes the tuned spring. SI throughout; a torsion preload keeps the dimension its line is
// written in (an angle or a torque).
import type { ArmModel, Spring, Tuning, Vec2 } from "../model/types";
import type { DimensionName } from "../units/dimension";
import { defaultTunedKeys, presentValue, tunableProperties } from "../model/tunables";
import { extensionSpringRate, torsionSpringRatePerRad } from "../model/coil";

export interface Variable {
  spring: string;
  /** `anchor`, `hook` or a property's key. */
  what: string;
  /** For `anchor` and `hook`: which coordinate, in the end's body frame. */
  axis?: "x" | "y";
  lo: number;
  hi: number;
  /** The value the spec has now (an end's coordinate, a property's value), SI. */
  current: number;
  /** The dimension the value is in (a torsion preload may be an angle). */
  dimension: DimensionName;
  integer?: boolean;
  /** From the spec's own `tune` line (false: a default the search chose). */
  written: boolean;
}

/** Default bounds when no line frees anything: a factor of the present value either way (common
 * practice, no source: a spring catalogue's next sizes lie within it). */
const DEFAULT_FACTOR = 4;

/** Whether the spec's text gives this property of the spring. */
export function springHas(s: Spring): (key: string) => boolean {
  return (key) => key in s.origin.properties;
}

/** The place of an end now: the anchor is `between`'s first point, the hook its second. */
function endPoint(s: Spring, what: string): Vec2 | undefined {
  if (s.kind === "torsion") return undefined;
  return what === "anchor" ? s.a.point : what === "hook" ? s.b.point : undefined;
}

/** The dimension a property's value is in. */
function dimensionOf(s: Spring, key: string): DimensionName {
  const t = tunableProperties(s, () => true)
    .concat(tunableProperties(s, () => false))
    .find((p) => p.key === key);
  return t?.dimensions[0] ?? "dimensionless";
}

/** The variables of one `tune` (or `adjust`) line. */
export function variablesOfLine(s: Spring, t: Tuning): Variable[] {
  if (t.region) {
    const p = endPoint(s, t.what);
    if (!p) return [];
    const out: Variable[] = [];
    for (const axis of ["x", "y"] as const)
      out.push({
        spring: s.id,
        what: t.what,
        axis,
        lo: t.region.low[axis],
        hi: t.region.high[axis],
        current: p[axis],
        dimension: "length",
        written: true,
      });
    return out;
  }
  if (!t.range) return [];
  const dimension = t.dimension ?? dimensionOf(s, t.what);
  return [
    {
      spring: s.id,
      what: t.what,
      lo: t.range[0],
      hi: t.range[1],
      current: presentValue(s, t.what, dimension) ?? (t.range[0] + t.range[1]) / 2,
      dimension,
      ...(t.integer ? { integer: true } : {}),
      written: true,
    },
  ];
}

/** A default variable around the present value (cli.md: with no `tune` line, every spring's rate
 * and tension). A torsion preload written as an angle is searched as an angle. */
function defaultVariable(
  model: ArmModel,
  s: Spring,
  key: string,
  anglePreloads: ReadonlySet<string>,
): Variable | undefined {
  const dimension = key === "preload" && anglePreloads.has(s.id) ? "angle" : dimensionOf(s, key);
  const now = presentValue(s, key, dimension);
  if (now === undefined || !Number.isFinite(now)) return undefined;
  let lo: number;
  let hi: number;
  switch (key) {
    case "initial_tension": {
      // Up to the tension that makes an effective zero free length (Fi = k L0), or a few times
      // the present one, or the heaviest payload's weight.
      const weight = Math.max(0, ...model.payloads.map((p) => (p.massRange?.[1] ?? p.mass) * model.gravity));
      const kL0 = "rate" in s && "freeLength" in s ? s.rate * s.freeLength : 0;
      lo = 0;
      hi = Math.max(DEFAULT_FACTOR * now, kL0, weight);
      break;
    }
    case "preload": {
      const turn = dimension === "angle" ? Math.PI : s.kind === "torsion" ? s.rate * Math.PI : 0;
      const span = Math.max(DEFAULT_FACTOR * Math.abs(now), turn);
      lo = now - span;
      hi = now + span;
      break;
    }
    case "strands":
      lo = 1;
      hi = Math.max(DEFAULT_FACTOR * now, 4);
      break;
    case "wire":
      // rate goes with d^4: this spans about a factor 4 of rate either way
      lo = now / Math.SQRT2;
      hi = now * Math.SQRT2;
      break;
    case "free_length":
      lo = now / 2;
      hi = now * 1.5;
      break;
    default:
      if (!(now > 0)) return undefined;
      lo = now / DEFAULT_FACTOR;
      hi = now * DEFAULT_FACTOR;
  }
  if (!(hi > lo)) return undefined;
  return {
    spring: s.id,
    what: key,
    lo,
    hi,
    current: now,
    dimension,
    ...(key === "strands" ? { integer: true } : {}),
    written: false,
  };
}

/** The variables of the whole search, `tune` lines only (`adjust` lines are set per payload mass,
 * elsewhere). With no `tune` line in the spec, each spring's defaults. */
export function searchVariables(
  model: ArmModel,
  anglePreloads: ReadonlySet<string> = new Set(),
  springIds?: readonly string[],
): Variable[] {
  const springs = model.springs.filter((s) => !springIds || springIds.includes(s.id));
  const written = springs.flatMap((s) =>
    (s.tunings ?? []).filter((t) => t.mode === "tune").flatMap((t) => variablesOfLine(s, t)),
  );
  if (model.springs.some((s) => s.tunings?.some((t) => t.mode === "tune"))) return written;
  return springs.flatMap((s) =>
    defaultTunedKeys(s, springHas(s)).flatMap((k) => defaultVariable(model, s, k, anglePreloads) ?? []),
  );
}

/** The spring with these values in place of its own (`values` by variable, in order). */
export function applyValues(
  model: ArmModel,
  s: Spring,
  vars: readonly Variable[],
  values: ArrayLike<number>,
  /** The torsion springs whose `preload` is written as an angle (its wind-up stays when the
   * rate changes). */
  anglePreloads: ReadonlySet<string> = new Set(),
): Spring {
  const set = new Map<string, number>();
  vars.forEach((v, i) => {
    if (v.spring === s.id) set.set(v.axis ? `${v.what}.${v.axis}` : v.what, values[i]!);
  });
  if (set.size === 0) return s;
  const get = (k: string, now: number) => set.get(k) ?? now;
  switch (s.kind) {
    case "extension": {
      const coil = s.coil && {
        ...s.coil,
        wireDiameter: get("wire", s.coil.wireDiameter),
        meanDiameter: get("coil", s.coil.meanDiameter),
        bodyCoils: get("coils", s.coil.bodyCoils),
      };
      const m = coil ? model.materials[coil.material] : undefined;
      const rate =
        coil && m && (set.has("wire") || set.has("coil") || set.has("coils"))
          ? extensionSpringRate(
              coil.wireDiameter,
              coil.meanDiameter,
              coil.bodyCoils,
              m.shearModulus,
              m.modulus,
            )
          : get("rate", s.rate);
      return {
        ...s,
        a: moved(s.a, set, "anchor"),
        b: moved(s.b, set, "hook"),
        rate,
        initialTension: get("initial_tension", s.initialTension),
        freeLength: get("free_length", s.freeLength),
        ...(coil ? { coil } : {}),
      };
    }
    case "zero_length":
      return {
        ...s,
        a: moved(s.a, set, "anchor"),
        b: moved(s.b, set, "hook"),
        rate: get("rate", s.rate),
        initialTension: get("initial_tension", s.initialTension),
      };
    case "elastic": {
      const strands = s.strands ?? 1;
      const perStrand = get("area", s.area / strands);
      const n = Math.round(get("strands", strands));
      return {
        ...s,
        a: moved(s.a, set, "anchor"),
        b: moved(s.b, set, "hook"),
        freeLength: get("free_length", s.freeLength),
        area: perStrand * n,
        ...(n > 1 ? { strands: n } : {}),
      };
    }
    case "gas":
      return {
        ...s,
        a: moved(s.a, set, "anchor"),
        b: moved(s.b, set, "hook"),
        force: get("force", s.force),
        progression: get("progression", s.progression),
        stroke: get("stroke", s.stroke),
        extendedLength: get("extended_length", s.extendedLength),
      };
    case "torsion": {
      const coil = s.coil && {
        ...s.coil,
        wireDiameter: get("wire", s.coil.wireDiameter),
        meanDiameter: get("coil", s.coil.meanDiameter),
        bodyCoils: get("coils", s.coil.bodyCoils),
      };
      const m = coil ? model.materials[coil.material] : undefined;
      const rate =
        coil && m && (set.has("wire") || set.has("coil") || set.has("coils"))
          ? torsionSpringRatePerRad(coil.wireDiameter, coil.meanDiameter, coil.bodyCoils, m.modulus)
          : get("rate", s.rate);
      const preloadVar = vars.find((v) => v.spring === s.id && v.what === "preload");
      const preloadTorque = !set.has("preload")
        ? // a preload written as an angle winds the new rate up by the same angle
          anglePreloads.has(s.id) && s.rate !== 0
          ? (s.preloadTorque / s.rate) * rate
          : s.preloadTorque
        : preloadVar?.dimension === "angle"
          ? rate * set.get("preload")!
          : set.get("preload")!;
      return { ...s, rate, preloadTorque, ...(coil ? { coil } : {}) };
    }
  }
}

function moved<A extends { point: Vec2 }>(a: A, set: Map<string, number>, what: string): A {
  const x = set.get(`${what}.x`);
  const y = set.get(`${what}.y`);
  if (x === undefined && y === undefined) return a;
  return { ...a, point: { x: x ?? a.point.x, y: y ?? a.point.y } };
}
