// Readouts: the figures a hover, an inlay hint, the preview and the report show for a part.
// Values in SI; the editor layer formats them in the user's unit system.
import type { DimensionName } from "../units/dimension";

export interface Figure {
  label: string;
  value: number;
  dimension: DimensionName;
  /** Where in the range, e.g. "at shoulder 35 deg". */
  where?: string;
  /** A second value for a span, e.g. a min..max range. */
  high?: number;
  /** The key this figure fills in the results record (`poise results`, the report's figures;
   * checks/results.ts): in its part's section (payloads, springs, base, ...), or with `arm` at
   * the top level. A check adds a figure to the results by tagging it here. */
  result?: ResultTag;
}

/** Where a figure goes in the results record, and the requirement it is held to. */
export interface ResultTag {
  key: string;
  /** A figure of the arm as a whole (the lowest natural frequency), not of its part. */
  arm?: boolean;
  /** The requirement, SI: a greatest value (a least one with `atLeast`); for a [least, greatest]
   * range, the greatest magnitude. */
  limit?: number;
  atLeast?: boolean;
}

export type PartKind =
  | "base"
  | "link"
  | "bar"
  | "head"
  | "joint"
  | "swivel"
  | "parallelogram"
  | "spring"
  | "payload"
  | "material"
  | "bearing"
  | "fastening";

export interface PartReadout {
  id: string;
  kind: PartKind;
  figures: Figure[];
  /** Plain sentences (limits of the model for this part, cautions such as rubber creep). */
  notes: string[];
  /** The smallest safety factor of the part over the range, if any check computes one. */
  worstSafety?: { value: number; what: string; where?: string };
}

export type Readouts = Record<string, PartReadout>;

/** Adds figures to a part's readout, creating it on first use. */
export function addFigures(
  readouts: Readouts,
  id: string,
  kind: PartKind,
  figures: Figure[],
  notes: string[] = [],
): PartReadout {
  const r = (readouts[id] ??= { id, kind, figures: [], notes: [] });
  // Two check families may report the same figure (a joint's largest reaction): keep one.
  for (const f of figures) {
    if (!isShowable(f)) {
      const note = unshowableNote(f);
      if (!r.notes.includes(note)) r.notes.push(note);
    } else if (!r.figures.some((g) => sameFigure(f, g))) r.figures.push(f);
  }
  for (const n of notes) if (!r.notes.includes(n)) r.notes.push(n);
  return r;
}

/** Keeps the lowest safety factor seen for a part. */
export function noteSafety(
  readouts: Readouts,
  id: string,
  kind: PartKind,
  value: number,
  what: string,
  where?: string,
): void {
  const r = (readouts[id] ??= { id, kind, figures: [], notes: [] });
  if (!Number.isFinite(value)) return;
  if (!r.worstSafety || value < r.worstSafety.value)
    r.worstSafety = { value, what, ...(where ? { where } : {}) };
}

/** The check a safety factor comes from, as `poise results` names it: the first word of what is
 * checked ("pin of reach.lower_root" is a pin, "coil body" the coil). */
export function checkOf(what: string): string {
  return what.split(" ")[0] ?? what;
}

function sameFigure(a: Figure, b: Figure): boolean {
  return (
    a.label === b.label &&
    a.dimension === b.dimension &&
    Math.abs(a.value - b.value) <= 1e-9 * Math.max(1, Math.abs(a.value))
  );
}

function isShowable(f: Figure): boolean {
  return Number.isFinite(f.value) && (f.high === undefined || Number.isFinite(f.high));
}

/** An infinite figure is a part that carries nothing there (a safety factor with no load); a NaN
 * one could not be computed. Either reads better as words than as "infinity" or "NaN". */
function unshowableNote(f: Figure): string {
  const values = f.high === undefined ? [f.value] : [f.value, f.high];
  if (values.some((v) => Number.isNaN(v))) return `${f.label}: could not be computed for this geometry`;
  return `${f.label}: no load on this part anywhere in range`;
}
