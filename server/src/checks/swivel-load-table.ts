// The loads through every swivel at each pose and load case, the largest of each over the heading
// combinations the pass searches (mechanics/swivel-loads.ts, swivelLoadsOverHeadings): the
// swivels' own figures (swivels.ts) and their bearings (swivel-bearings.ts) read the same loads,
// so one check run works each out once and keeps it as numbers (five a swivel), not objects.
import type { SwivelLoad } from "../mechanics/swivel-loads";
import { swivelLoadsOverHeadings } from "../mechanics/swivel-loads";
import { headingCombinations, type Headings } from "../mechanics/headings";
import type { CheckContext } from "./index";
import { payloadMasses } from "./part-words";

/** Numbers kept per swivel, pose and case: axial, radial, moment, twist, bearingRadial. */
const WIDTH = 5;
/** Per swivel, pose and case: whether the loads had the swivel, and whether they had its
 * bearingRadial (a swivel with `bearings D`). */
const HAS_SWIVEL = 1;
const HAS_BEARING_RADIAL = 2;

interface Table {
  ids: string[];
  cases: number;
  sets: readonly Headings[];
  computed: Uint8Array;
  has: Uint8Array;
  values: Float64Array;
}

const tables = new WeakMap<CheckContext, Table>();

function tableOf(ctx: CheckContext): Table {
  let t = tables.get(ctx);
  if (t) return t;
  const { model, sweep } = ctx;
  const ids = (model.swivels ?? []).map((s) => s.id);
  const cases = Math.max(1, ...sweep.poses.map((p) => p.cases.length));
  const entries = sweep.poses.length * cases;
  t = {
    ids,
    cases,
    sets: headingCombinations(model, sweep.quick === true),
    computed: new Uint8Array(entries),
    has: new Uint8Array(entries * ids.length),
    values: new Float64Array(entries * ids.length * WIDTH),
  };
  tables.set(ctx, t);
  return t;
}

/** The loads through each swivel at pose `poseIndex` of the sweep and load case `ci`, by swivel
 * id, as swivelLoadsOverHeadings gives them over the heading combinations of this pass. */
export function swivelLoadsAt(ctx: CheckContext, poseIndex: number, ci: number): Record<string, SwivelLoad> {
  const t = tableOf(ctx);
  const entry = poseIndex * t.cases + ci;
  if (!t.computed[entry]) {
    const { model, sweep } = ctx;
    const loads = swivelLoadsOverHeadings(
      model,
      sweep.poses[poseIndex]!,
      payloadMasses(model, sweep, ci),
      t.sets,
    );
    keep(t, entry, loads);
    return loads;
  }
  return recall(t, entry);
}

function keep(t: Table, entry: number, loads: Record<string, SwivelLoad>): void {
  t.computed[entry] = 1;
  t.ids.forEach((id, s) => {
    const l = loads[id];
    const at = entry * t.ids.length + s;
    if (!l) return;
    t.has[at] = HAS_SWIVEL | (l.bearingRadial !== undefined ? HAS_BEARING_RADIAL : 0);
    const o = at * WIDTH;
    t.values[o] = l.axial;
    t.values[o + 1] = l.radial;
    t.values[o + 2] = l.moment;
    t.values[o + 3] = l.twist;
    t.values[o + 4] = l.bearingRadial ?? 0;
  });
}

function recall(t: Table, entry: number): Record<string, SwivelLoad> {
  const out: Record<string, SwivelLoad> = {};
  t.ids.forEach((id, s) => {
    const at = entry * t.ids.length + s;
    const has = t.has[at]!;
    if (!(has & HAS_SWIVEL)) return;
    const v = t.values;
    const o = at * WIDTH;
    out[id] = {
      axial: v[o]!,
      radial: v[o + 1]!,
      moment: v[o + 2]!,
      twist: v[o + 3]!,
      ...(has & HAS_BEARING_RADIAL ? { bearingRadial: v[o + 4]! } : {}),
    };
  });
  return out;
}
