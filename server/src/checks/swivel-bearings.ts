// Bearings of the swivels and of the base's yaw (`strength.bearing`, mechanics.md section 11): at
// every pose and load case, the loads through the swivel over the headings searched
// (mechanics/swivel-loads.ts: the largest of each over the heading combinations). The two radial
// bearings D apart carry the tilting moment as a couple plus half the radial force (M / D +
// Fr / 2); the thrust bearing carries the load along the axis. Without a thrust bearing one
// radial bearing takes the axial load as well; without radial bearings the thrust bearing takes
// the radial force and the tilting moment (a turntable ring). Safety by bearingSafety, as at a
// joint (bearings.ts).
import type { Bearing, Swivel } from "../model/types";
import type { Pose } from "../mechanics/types";
import { bearingSafety, type BearingLoad, type BearingRole } from "../mechanics/hardware/bearing-safety";
import type { SwivelLoad } from "../mechanics/swivel-loads";
import { swivelLoadsAt } from "./swivel-load-table";
import type { CheckContext } from "./index";
import { finding } from "../findings/finding";
import { addFigures, noteSafety } from "./readout";
import { describePose, pastDeadline, show, showSafety, spanOf } from "./part-words";
import { bearingFigures, bearingModelOf, bearingWords } from "./bearings";

/** The load on each of a swivel's bearings from what passes through it. */
export function swivelBearingLoads(s: Swivel, l: SwivelLoad): { radial?: BearingLoad; thrust?: BearingLoad } {
  const hasThrust = s.thrust !== undefined;
  const out: { radial?: BearingLoad; thrust?: BearingLoad } = {};
  if (l.bearingRadial !== undefined)
    out.radial = { radial: l.bearingRadial, axial: hasThrust ? 0 : Math.max(0, l.axial), moment: 0 };
  if (hasThrust)
    out.thrust = out.radial
      ? { radial: 0, axial: Math.max(0, l.axial), moment: 0 }
      : { radial: l.radial, axial: Math.max(0, l.axial), moment: l.moment };
  return out;
}

interface Worst {
  safety: number;
  load: BearingLoad;
  pose: Pose;
  ci: number;
  result: ReturnType<typeof bearingSafety>;
}

/** Every swivel (and the base's yaw) whose `bearings` or `thrust` names a bearing: its least
 * safety over the range, load cases and headings. */
export function checkSwivelBearings(ctx: CheckContext): void {
  const { model, sweep } = ctx;
  const uses = new Map<Swivel, { key: "bearings" | "thrust"; role: BearingRole; bearing: Bearing }[]>();
  for (const s of model.swivels ?? []) {
    const list: { key: "bearings" | "thrust"; role: BearingRole; bearing: Bearing }[] = [];
    const radial = s.bearings?.bearing ? model.bearings[s.bearings.bearing] : undefined;
    const thrust = s.thrust?.bearing ? model.bearings[s.thrust.bearing] : undefined;
    if (radial) list.push({ key: "bearings", role: "radial", bearing: radial });
    if (thrust) list.push({ key: "thrust", role: "thrust", bearing: thrust });
    if (list.length) uses.set(s, list);
  }
  if (uses.size === 0) return;
  const worst = new Map<string, Worst>();
  for (let k = 0; k < sweep.poses.length; k++) {
    if (pastDeadline(ctx.options.deadline)) break;
    const pose = sweep.poses[k]!;
    for (let ci = 0; ci < Math.max(1, pose.cases.length); ci++) {
      const loads = swivelLoadsAt(ctx, k, ci);
      for (const [s, list] of uses) {
        const l = loads[s.id];
        if (!l) continue;
        const each = swivelBearingLoads(s, l);
        for (const u of list) {
          const load = u.role === "radial" ? each.radial : each.thrust;
          const bm = bearingModelOf(model, u.bearing);
          if (!load || !bm) continue;
          const result = bearingSafety(bm, load, u.role);
          const key = `${s.id} ${u.key}`;
          const w = worst.get(key);
          if (!w || result.safety < w.safety)
            worst.set(key, { safety: result.safety, load, pose, ci, result });
        }
      }
    }
  }
  for (const [s, list] of uses)
    for (const u of list) {
      const w = worst.get(`${s.id} ${u.key}`);
      if (w) reportSwivelBearing(ctx, s, u.key, u.bearing, w, s.joint ? "swivel" : "base");
    }
}

function reportSwivelBearing(
  ctx: CheckContext,
  s: Swivel,
  key: "bearings" | "thrust",
  bearing: Bearing,
  w: Worst,
  kind: "swivel" | "base",
): void {
  const { model, sweep } = ctx;
  const where = describePose(sweep, w.pose, w.ci);
  const what = key === "bearings" ? "radial bearing" : "thrust bearing";
  const r = w.result;
  addFigures(
    ctx.readouts,
    bearing.id,
    "bearing",
    bearingFigures(`at ${s.id} (${what}): `, w.load, r, where),
    [
      ...r.notes,
      ...(key === "bearings"
        ? [`At ${s.id}: the pair carries the tilting moment as a couple, M / D on each, plus half the shear.`]
        : []),
    ],
  );
  addFigures(ctx.readouts, s.id, kind, [
    { label: `${what} safety factor`, value: r.safety, dimension: "dimensionless", where },
  ]);
  noteSafety(ctx.readouts, bearing.id, "bearing", r.safety, `bearing at ${s.id}`, where);
  noteSafety(ctx.readouts, s.id, kind, r.safety, `bearing ${bearing.id}`, where);
  const need = model.require.safety;
  if (r.safety >= need) return;
  ctx.findings.push(
    finding(
      "strength.bearing",
      spanOf(s.origin, key),
      `${what} ${bearing.id} of ${s.joint ? `swivel ${s.id}` : `the base's yaw`}: ${bearingWords(bearing, r)}: safety ${showSafety(r.safety)} < ${showSafety(need)} required (${key === "bearings" ? `radial load ${show(w.load.radial, "force")}` : `axial load ${show(w.load.axial, "force")}${w.load.moment > 0 ? `, tilting moment ${show(w.load.moment, "torque")}` : ""}`} ${where})`,
      {
        related: [
          { span: bearing.origin.name ?? bearing.origin.declaration, message: `bearing ${bearing.id}` },
        ],
        data: {
          subject: s.id,
          bearing: bearing.id,
          safety: r.safety,
          required: need,
          check: r.governing,
          radial: w.load.radial,
          axial: w.load.axial,
          moment: w.load.moment,
          ...(r.ballLoad !== undefined ? { ballLoad: r.ballLoad } : {}),
          ...(r.contactPressure !== undefined ? { contactPressure: r.contactPressure } : {}),
          ...(r.allowablePressure !== undefined ? { allowablePressure: r.allowablePressure } : {}),
          ...(r.equivalentLoad !== undefined ? { equivalentLoad: r.equivalentLoad } : {}),
          ...(r.borePressure !== undefined ? { borePressure: r.borePressure } : {}),
        },
      },
    ),
  );
}
