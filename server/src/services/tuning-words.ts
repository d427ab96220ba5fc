// Completion inside a spring's `tune` and `adjust` lines: what may be freed first (the ends, then
// the kind's numeric properties), then the units of that property and the `..` between bounds.
import type { DimensionName } from "../units/dimension";
import { TUNABLE_ENDS, tunablePropertiesOfKind } from "../model/tunables";
import type { SpringKind } from "../model/types";

const NUMBER = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;
const SPRING_KINDS: readonly string[] = ["extension", "zero_length", "elastic", "gas", "torsion"];

export type TuningWant =
  { kind: "words"; words: string[] } | { kind: "units"; dimensions: DimensionName[] } | undefined;

/** What may come next after the complete words `done` that follow `tune` (or `adjust`). */
export function tuningWant(done: string[], springKind: string | undefined): TuningWant {
  const kind = SPRING_KINDS.includes(springKind ?? "") ? (springKind as SpringKind) : undefined;
  const properties = kind ? tunablePropertiesOfKind(kind) : [];
  if (done.length === 0) {
    const ends = kind === "torsion" ? [] : [...TUNABLE_ENDS];
    return { kind: "words", words: [...ends, ...properties.map((p) => p.key)] };
  }
  const what = done[0]!;
  const last = done[done.length - 1]!;
  if ((TUNABLE_ENDS as readonly string[]).includes(what))
    return last.endsWith("()") && !done.includes("..") ? { kind: "words", words: [".."] } : undefined;
  const property = properties.find((p) => p.key === what);
  if (!property) return undefined;
  if (NUMBER.test(last)) return { kind: "units", dimensions: property.dimensions };
  const numbers = done.filter((w) => NUMBER.test(w)).length;
  if (numbers === 1 && !done.includes("..")) return { kind: "words", words: [".."] };
  return undefined;
}
