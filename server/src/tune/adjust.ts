// `adjust` lines (docs/language.md, "Tuning"): an adjuster the user sets in service (a slot for the
// anchor, a preload screw on the initial tension, a strut's force setting). For each payload with a
// mass `range`, the setting that balances best at each of a few masses across the range (a table
// on the spring's readout: hover, report, `poise results`), and `balance.out-of-travel` where part
// of the range cannot be held within `require balance` anywhere in the adjuster's travel. Runs
// inside the analysis, over its own sweep; bounded by the cooperative stop.
import type { ArmModel, Spring } from "../model/types";
import type { SweepResult } from "../mechanics/types";
import { finding, type Finding } from "../findings/finding";
import { addFigures, type Figure, type Readouts } from "../checks/readout";
import { subRanges } from "../checks/balance";
import { formatForce } from "../mechanics/format";
import { formatResult } from "../units/format";
import { pastDeadline } from "../stop";
import { HandForceMeasure } from "./evaluate";
import { goldenSection, minimise } from "./search";
import { applyValues, variablesOfLine, type Variable } from "./variables";

/** Masses sampled across a payload's range, both ends included: a row of the table each. */
export const ADJUST_MASSES = 5;
/** Designs measured per mass for an adjuster of two coordinates (a slot in a plate). */
const REGION_EVALUATIONS = 200;

export interface AdjustRow {
  /** Payload mass, kg. */
  mass: number;
  /** The best setting of each adjust variable, in order. */
  values: number[];
  /** Worst hand force over the range at that setting, N. */
  worst: number;
}

export interface AdjustTable {
  payload: string;
  variables: Variable[];
  rows: AdjustRow[];
}

/** Every `adjust` variable of the model (each spring's, in order). */
function adjustVariables(model: ArmModel): Variable[] {
  return model.springs.flatMap((s) =>
    (s.tunings ?? []).filter((t) => t.mode === "adjust").flatMap((t) => variablesOfLine(s, t)),
  );
}

/** The setting per mass of every payload with a mass range; undefined when the spec has no
 * `adjust` line or no payload has a range. */
export function adjustTables(model: ArmModel, sweep: SweepResult, deadline = Infinity): AdjustTable[] {
  const vars = adjustVariables(model).filter((v) => v.hi > v.lo);
  const ranged = model.payloads.filter((p) => p.massRange);
  if (vars.length === 0 || ranged.length === 0 || sweep.poses.length === 0) return [];
  const ids = [...new Set(vars.map((v) => v.spring))];
  const springs = ids.map((id) => model.springs.find((s) => s.id === id)!);
  const measure = new HandForceMeasure(model, sweep, springs);
  const springsAt = (x: readonly number[]): Spring[] => springs.map((s) => applyValues(model, s, vars, x));
  const tables: AdjustTable[] = [];
  for (const p of ranged) {
    const [lo, hi] = p.massRange!;
    const rows: AdjustRow[] = [];
    for (let i = 0; i < ADJUST_MASSES; i++) {
      if (pastDeadline(deadline)) return tables;
      const kg = lo + ((hi - lo) * i) / (ADJUST_MASSES - 1);
      const f = (x: readonly number[]) => {
        const m = measure.measure(springsAt(x), { payload: p.id, kg });
        return m.worst + 1e-3 * m.worstFree + 1e6 * m.violation;
      };
      let values: number[];
      if (vars.length === 1) {
        const v = vars[0]!;
        values = [goldenSection((x) => f([x]), v.lo, v.hi)];
      } else {
        const r = minimise((x) => f(x), boxOf(vars), {
          maxEvaluations: REGION_EVALUATIONS,
          starts: 4,
          localSearches: 1,
        });
        values = r.best;
      }
      rows.push({ mass: kg, values, worst: measure.measure(springsAt(values), { payload: p.id, kg }).worst });
    }
    tables.push({ payload: p.id, variables: vars, rows });
  }
  return tables;
}

function boxOf(vars: readonly Variable[]) {
  return {
    lo: vars.map((v) => v.lo),
    hi: vars.map((v) => v.hi),
    integer: vars.map((v) => v.integer ?? false),
    start: vars.map((v) => Math.min(v.hi, Math.max(v.lo, v.current))),
  };
}

/** A variable's name in a table: `initial_tension`, `anchor x`. */
function nameOf(v: Variable): string {
  return v.axis ? `${v.what} ${v.axis}` : v.what;
}

/** The table as figures on each adjusted spring's readout (hover, report, `poise results`), and
 * `balance.out-of-travel` where part of a payload's range cannot be balanced in the travel. */
export function adjustChecks(
  model: ArmModel,
  sweep: SweepResult,
  readouts: Readouts,
  deadline = Infinity,
): Finding[] {
  const findings: Finding[] = [];
  for (const table of adjustTables(model, sweep, deadline)) {
    const limit = model.require.balance.byPayload[table.payload] ?? model.require.balance.default;
    for (const id of new Set(table.variables.map((v) => v.spring))) {
      const figures: Figure[] = [];
      for (const row of table.rows) {
        const grams = Math.round(row.mass * 1000);
        table.variables.forEach((v, i) => {
          if (v.spring !== id) return;
          figures.push({
            label: `setting of ${nameOf(v)} for ${table.payload} at ${grams} g`,
            value: row.values[i]!,
            dimension: v.dimension,
            result: { key: `${nameOf(v).replace(" ", "_")}_at_${grams}g` },
          });
        });
        figures.push({
          label: `worst hand force at that setting (${table.payload} at ${grams} g)`,
          value: row.worst,
          dimension: "force",
          result: { key: `hand_force_at_${grams}g`, limit },
        });
      }
      addFigures(readouts, id, "spring", figures, [
        `Adjuster settings: for each ${table.payload} mass, the setting that makes the worst hand force over the range least (the rest of the arm as written).`,
      ]);
    }
    const bad = table.rows.filter((r) => r.worst > limit);
    if (bad.length === 0) continue;
    const runs = subRanges(
      table.rows.map((r) => r.mass),
      (m) => bad.some((r) => r.mass === m),
    );
    const worst = Math.max(...bad.map((r) => r.worst));
    const first = table.variables[0]!;
    const spring = model.springs.find((s) => s.id === first.spring)!;
    const line = spring.tunings?.find((t) => t.mode === "adjust" && t.what === first.what);
    const masses = runs
      .map(([a, b]) =>
        a === b ? `${Math.round(a * 1000)} g` : `${Math.round(a * 1000)} g .. ${Math.round(b * 1000)} g`,
      )
      .join(", ");
    const travel = table.variables
      .filter((v) => v.spring === spring.id)
      .map(
        (v) =>
          `${nameOf(v)} ${formatResult(v.lo, v.dimension, "si")} .. ${formatResult(v.hi, v.dimension, "si")}`,
      )
      .join(", ");
    findings.push(
      finding(
        "balance.out-of-travel",
        line?.span ?? spring.origin.name ?? spring.origin.declaration,
        `With ${table.payload} at ${masses}, no setting of spring ${spring.id}'s adjuster (${travel}) holds it within the ${formatForce(limit)} that require balance allows: at best ${formatForce(worst)}. Widen the travel, or tune the spring (\`tune\`) so the range falls inside it.`,
        {
          data: {
            subject: spring.id,
            payload: table.payload,
            adjuster: first.what,
            masses: runs,
            limit,
            worstHandForce: worst,
          },
        },
      ),
    );
  }
  return findings;
}
