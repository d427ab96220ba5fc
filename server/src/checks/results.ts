// The results record: every figure a designer needs, whether its check passes or fails, keyed by
// model ids, SI. `poise results`, the report's figures table and hover read it. It is built from
// the readouts alone: a check puts a figure in the record by tagging it (`Figure.result`), and a
// part's least safety factor comes from `noteSafety`, so a new check adds its figures here without
// touching this file (a new kind of part adds one line to RESULT_SECTIONS).
import type { ArmModel } from "../model/types";
import type { DimensionName } from "../units/dimension";
import type { UnitSystem } from "../units/unit-table";
import { tableUnit, toTableUnit } from "../units/format";
import { checkOf, type Figure, type PartKind, type Readouts } from "./readout";
import type { AgedReadouts } from "./aged";
import { durationWords } from "../model/ageing";

/** A figure of the record, SI: a value, or a [least, greatest] pair. */
export interface ResultFigure {
  value: number;
  high?: number;
  dimension: DimensionName;
  where?: string;
  /** The requirement it is held to, SI (the greatest allowed, or with `atLeast` the least). */
  limit?: number;
  atLeast?: boolean;
}

/** A part's least safety factor over the range and load cases. */
export interface PartSafety {
  safety: number;
  /** What fails first: `stress`, `buckling`, `pin`, `coil`, ... (the `check` of
   * strength.overstress). */
  check: string;
  /** The requirement it is held to. */
  required: number;
  where?: string;
}

/** A section of parts of some kinds, each with the keys the record always carries (null when the
 * figure is not computed for that part). */
interface Section {
  name: string;
  kinds: readonly (PartKind | string)[];
  keys: readonly string[];
  /** The model's parts of this section, listed even when no readout has figures for them. */
  listed?: (model: ArmModel) => string[];
  /** A part enters only with a figure tagged for this section, and the section is left out of
   * the record's JSON and lines when no part has one (figures that only some arms have). */
  onlyTagged?: boolean;
}

/** The sections of the record, in the order of docs/cli.md. The `safety` key of a section is the
 * part's least safety factor when no figure fills it. */
export const RESULT_SECTIONS: readonly Section[] = [
  {
    name: "payloads",
    kinds: ["payload"],
    keys: ["hand_force", "deflection", "tilt", "lean"],
    listed: (m) => m.payloads.map((p) => p.id),
  },
  {
    name: "swivels",
    kinds: ["swivel"],
    keys: ["bearing_loads", "safety", "thrust", "tilting_moment"],
    listed: (m) => (m.swivels ?? []).filter((s) => s.joint).map((s) => s.id),
  },
  { name: "fastenings", kinds: ["fastening"], keys: ["safety"] },
  {
    // pins and joint bearings loaded out of the drawing plane (a stage turned across)
    name: "joints",
    kinds: ["joint"],
    keys: ["force_along_pin", "moment_across_pin", "bearing_tilting_moment"],
    onlyTagged: true,
  },
  {
    name: "springs",
    kinds: ["spring"],
    keys: ["force", "length", "safety"],
    listed: (m) => m.springs.map((s) => s.id),
  },
];
/** Keys of the base and of the arm as a whole that the record always carries. */
const BASE_KEYS = ["tipping_safety"] as const;
const ARM_KEYS = ["frequency"] as const;

export type FigureMap = Record<string, ResultFigure | null>;

export interface ResultsRecord {
  /** Every part with a safety factor (links, bars, joints, springs, parallelograms, ...). */
  parts: Record<string, PartSafety>;
  /** Section name → part id → key → figure. */
  sections: Record<string, Record<string, FigureMap>>;
  base: FigureMap;
  /** The base's body id, when the arm has a base. */
  baseId?: string;
  /** Figures of the arm as a whole (the lowest natural frequency). */
  arm: FigureMap;
  /** The aged case's figures, when the spec states one: the payloads' and springs' sections and
   * the arm's, as the aged case's checks give them (its parts' safety factors are not computed:
   * the aged case re-checks balance and stiffness only). */
  aged?: AgedResults;
}

export interface AgedResults {
  /** How long the load was held, s, and in words ("1 year"). */
  afterS: number;
  afterWords: string;
  payloads: Record<string, FigureMap>;
  springs: Record<string, FigureMap>;
  arm: FigureMap;
}

/** What the record needs of an analysis (an `Analysis` fits). */
export interface ResultsInput {
  model?: ArmModel;
  readouts: Readouts;
  aged?: AgedReadouts;
}

function toResult(f: Figure): ResultFigure {
  return {
    value: f.value,
    ...(f.high !== undefined ? { high: f.high } : {}),
    dimension: f.dimension,
    ...(f.where ? { where: f.where } : {}),
    ...(f.result?.limit !== undefined ? { limit: f.result.limit } : {}),
    ...(f.result?.atLeast ? { atLeast: true } : {}),
  };
}

function withKeys(keys: readonly string[]): FigureMap {
  return Object.fromEntries(keys.map((k) => [k, null]));
}

export function buildResults(input: ResultsInput): ResultsRecord {
  const record = buildRecord(input.model, input.readouts);
  if (input.aged) {
    const aged = buildRecord(input.model, input.aged.readouts);
    record.aged = {
      afterS: input.aged.afterS,
      afterWords: durationWords(input.aged.afterS),
      payloads: aged.sections["payloads"] ?? {},
      springs: aged.sections["springs"] ?? {},
      arm: aged.arm,
    };
  }
  return record;
}

function buildRecord(model: ArmModel | undefined, readouts: Readouts): ResultsRecord {
  const record: ResultsRecord = {
    ...(model?.base ? { baseId: model.base.bodyId } : {}),
    parts: {},
    sections: {},
    base: withKeys(BASE_KEYS),
    arm: withKeys(ARM_KEYS),
  };
  const sectionOf = new Map<string, Section>();
  for (const s of RESULT_SECTIONS) {
    record.sections[s.name] = {};
    for (const k of s.kinds) sectionOf.set(k, s);
    if (model) for (const id of s.listed?.(model) ?? []) record.sections[s.name]![id] = withKeys(s.keys);
  }
  for (const r of Object.values(readouts)) {
    const section = sectionOf.get(r.kind);
    const entered = section && (!section.onlyTagged || r.figures.some((f) => f.result && !f.result.arm));
    const target =
      r.kind === "base"
        ? record.base
        : section && entered
          ? (record.sections[section.name]![r.id] ??= withKeys(section.keys))
          : undefined;
    for (const f of r.figures) {
      if (!f.result) continue;
      if (f.result.arm) record.arm[f.result.key] ??= toResult(f);
      else if (target) target[f.result.key] ??= toResult(f);
    }
    const s = r.worstSafety;
    if (!s) continue;
    if (target && "safety" in target && target["safety"] === null)
      target["safety"] = {
        value: s.value,
        dimension: "dimensionless",
        ...(s.where ? { where: s.where } : {}),
      };
    // The base's tipping safety is its own key; every other safety factor is a part's.
    const check = checkOf(s.what);
    if (check !== "tipping")
      record.parts[r.id] = {
        safety: s.value,
        check,
        required: model?.require.safety ?? NaN,
        ...(s.where ? { where: s.where } : {}),
      };
  }
  return record;
}

// ---- the JSON of `poise results` ---------------------------------------------------------------

/** Significant figures kept in the JSON: past the model's accuracy, short enough to read. */
const JSON_SIGNIFICANT = 6;

function rounded(v: number): number | null {
  if (!Number.isFinite(v)) return null;
  const r = Number(v.toPrecision(JSON_SIGNIFICANT));
  return Object.is(r, -0) ? 0 : r;
}

type JsonFigure = number | [number | null, number | null] | null;

function jsonFigure(f: ResultFigure | null | undefined, system: UnitSystem): JsonFigure {
  if (!f) return null;
  const v = rounded(toTableUnit(f.value, f.dimension, system));
  return f.high === undefined ? v : [v, rounded(toTableUnit(f.high, f.dimension, system))];
}

function jsonFigures(map: FigureMap, system: UnitSystem): Record<string, JsonFigure> {
  return Object.fromEntries(Object.entries(map).map(([k, f]) => [k, jsonFigure(f, system)]));
}

/** The units the JSON names, by the dimension's name (`length`, `force`, ...). */
function unitsOf(record: ResultsRecord, system: UnitSystem): Record<string, string> {
  const used = new Set<DimensionName>(["length", "force", "torque", "angle", "frequency"]);
  const visit = (m: FigureMap) => {
    for (const f of Object.values(m)) if (f && f.dimension !== "dimensionless") used.add(f.dimension);
  };
  visit(record.base);
  visit(record.arm);
  for (const section of Object.values(record.sections)) for (const m of Object.values(section)) visit(m);
  if (record.aged) {
    used.add("time");
    visit(record.aged.arm);
    for (const m of [...Object.values(record.aged.payloads), ...Object.values(record.aged.springs)]) visit(m);
  }
  return Object.fromEntries([...used].map((d) => [d, tableUnit(d, system)]));
}

/** The record as `poise results --json` prints it (docs/cli.md): figures in the table units of
 * `system`, named in `units`; safety factors plain numbers; null where a figure is not computed
 * for a part, or is unlimited (a part that carries no load). */
export function resultsJson(record: ResultsRecord, system: UnitSystem): Record<string, unknown> {
  const out: Record<string, unknown> = { units: unitsOf(record, system) };
  out["parts"] = Object.fromEntries(
    Object.entries(record.parts).map(([id, p]) => [
      id,
      {
        safety: rounded(p.safety),
        check: p.check,
        required: rounded(p.required),
        ...(p.where ? { where: p.where } : {}),
      },
    ]),
  );
  const section = (name: string) =>
    Object.fromEntries(
      Object.entries(record.sections[name] ?? {}).map(([id, m]) => [id, jsonFigures(m, system)]),
    );
  out["payloads"] = section("payloads");
  for (const [k, f] of Object.entries(record.arm)) out[k] = jsonFigure(f, system);
  out["base"] = jsonFigures(record.base, system);
  for (const s of RESULT_SECTIONS)
    if (s.name !== "payloads" && !(s.onlyTagged && Object.keys(record.sections[s.name] ?? {}).length === 0))
      out[s.name] = section(s.name);
  if (record.aged) out["aged"] = agedJson(record.aged, system);
  return out;
}

/** The aged case's section: `after` in the table unit of time (named in `units`, as `time`). */
function agedJson(aged: AgedResults, system: UnitSystem): Record<string, unknown> {
  const sectionJson = (m: Record<string, FigureMap>) =>
    Object.fromEntries(Object.entries(m).map(([id, f]) => [id, jsonFigures(f, system)]));
  return {
    after: jsonFigure({ value: aged.afterS, dimension: "time" }, system),
    payloads: sectionJson(aged.payloads),
    ...Object.fromEntries(Object.entries(aged.arm).map(([k, f]) => [k, jsonFigure(f, system)])),
    springs: sectionJson(aged.springs),
  };
}
