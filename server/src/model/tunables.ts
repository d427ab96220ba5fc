// What a `tune` or `adjust` line may free, by spring kind and by how the spring is given: the
// places of its two ends, and the numeric properties that describe the spring (never a limit it
// must keep). One table for the model builder, completion, hover and the design search.
import type { DimensionName } from "../units/dimension";
import type { Spring } from "./types";

export interface TunableProperty {
  key: string;
  /** The dimensions its bounds may be written in (the first is the property's own). */
  dimensions: DimensionName[];
  /** The least value the language takes, SI, and whether that value itself is allowed: a rate,
   * a length, a count must be above 0 (`rate 0` is refused); an initial tension may be 0; a gas
   * strut's progression is at least 1. Undefined: any sign (a torsion preload). */
  least?: { value: number; allowed: boolean };
  /** Counts: whole numbers only. */
  integer?: boolean;
}

/** The places a two-point spring's ends may be freed in. */
export const TUNABLE_ENDS = ["anchor", "hook"] as const;

/** Limits the spring must keep: the search respects them, it never changes them. */
export const TUNING_LIMIT_KEYS = ["max_length", "max_stretch", "max_angle"];

const positive = { value: 0, allowed: false };
const nonNegative = { value: 0, allowed: true };

const P = {
  rate: { key: "rate", dimensions: ["stiffness"], least: positive },
  angularRate: { key: "rate", dimensions: ["angular_stiffness"], least: positive },
  initialTension: { key: "initial_tension", dimensions: ["force"], least: nonNegative },
  freeLength: { key: "free_length", dimensions: ["length"], least: positive },
  wire: { key: "wire", dimensions: ["length"], least: positive },
  coil: { key: "coil", dimensions: ["length"], least: positive },
  coils: { key: "coils", dimensions: ["dimensionless"], least: positive },
  area: { key: "area", dimensions: ["area"], least: positive },
  strands: { key: "strands", dimensions: ["dimensionless"], least: positive, integer: true },
  force: { key: "force", dimensions: ["force"], least: positive },
  progression: { key: "progression", dimensions: ["dimensionless"], least: { value: 1, allowed: true } },
  stroke: { key: "stroke", dimensions: ["length"], least: positive },
  extendedLength: { key: "extended_length", dimensions: ["length"], least: positive },
  preload: { key: "preload", dimensions: ["torque", "angle"] },
} satisfies Record<string, TunableProperty>;

/** The numeric properties a spring may tune, given which properties its text has (`has`): a
 * spring given by its rate tunes the rate, one given by its coil tunes the coil; a cord given by
 * `area` tunes the area, one cut from `tube` its strands and length. */
export function tunableProperties(s: Spring, has: (key: string) => boolean): TunableProperty[] {
  switch (s.kind) {
    case "extension":
      return has("rate")
        ? [P.rate, P.initialTension, P.freeLength]
        : [P.wire, P.coil, P.coils, P.initialTension, P.freeLength];
    case "zero_length":
      return [P.rate, P.initialTension];
    case "elastic":
      return has("area") ? [P.freeLength, P.area, P.strands] : [P.freeLength, P.strands];
    case "gas":
      return [P.force, P.progression, P.stroke, P.extendedLength];
    case "torsion":
      return has("rate") ? [P.angularRate, P.preload] : [P.wire, P.coil, P.coils, P.preload];
  }
}

/** Every numeric property a spring of this kind may tune, however it is given (for completion
 * while the text is being typed). */
export function tunablePropertiesOfKind(kind: Spring["kind"]): TunableProperty[] {
  const all = [
    ...tunableProperties({ kind } as Spring, () => true),
    ...tunableProperties({ kind } as Spring, () => false),
  ];
  return all.filter((t, i) => all.findIndex((u) => u.key === t.key) === i);
}

/** Whether a spring has two ends to place (every kind but torsion). */
export function hasEnds(s: Spring): boolean {
  return s.kind !== "torsion";
}

/** What the search frees when the spec has no `tune` line at all (cli.md: "every spring's rate and
 * tension"): the properties its force is linear in where it is given by them, else what makes
 * the same force (the coil for a coil-defined spring; the cut length and strands of a tube).
 * Bounds are set by the search around the present value. */
export function defaultTunedKeys(s: Spring, has: (key: string) => boolean): string[] {
  switch (s.kind) {
    case "extension":
      return has("rate") ? ["rate", "initial_tension"] : ["wire", "coils", "initial_tension"];
    case "zero_length":
      return ["rate", "initial_tension"];
    case "elastic":
      return has("area") ? ["area"] : ["free_length", "strands"];
    case "gas":
      return ["force"];
    case "torsion":
      return has("rate") ? ["rate", "preload"] : ["wire", "coils", "preload"];
  }
}

/** The present value of a tunable property, SI, in the dimension asked for (a torsion preload as
 * an angle is its torque over the rate). Undefined when the spring has no such value. */
export function presentValue(s: Spring, key: string, dimension?: DimensionName): number | undefined {
  switch (key) {
    case "rate":
      return "rate" in s ? s.rate : undefined;
    case "initial_tension":
      return "initialTension" in s ? s.initialTension : undefined;
    case "free_length":
      return "freeLength" in s ? s.freeLength : undefined;
    case "wire":
      return "coil" in s ? s.coil?.wireDiameter : undefined;
    case "coil":
      return "coil" in s ? s.coil?.meanDiameter : undefined;
    case "coils":
      return "coil" in s ? s.coil?.bodyCoils : undefined;
    case "area":
      return s.kind === "elastic" ? s.area / (s.strands ?? 1) : undefined;
    case "strands":
      return s.kind === "elastic" ? (s.strands ?? 1) : undefined;
    case "force":
      return s.kind === "gas" ? s.force : undefined;
    case "progression":
      return s.kind === "gas" ? s.progression : undefined;
    case "stroke":
      return s.kind === "gas" ? s.stroke : undefined;
    case "extended_length":
      return s.kind === "gas" ? s.extendedLength : undefined;
    case "preload":
      if (s.kind !== "torsion") return undefined;
      return dimension === "angle" ? (s.rate !== 0 ? s.preloadTorque / s.rate : 0) : s.preloadTorque;
    default:
      return undefined;
  }
}
