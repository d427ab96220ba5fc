// Swivels (docs/checks.md, Swivels and Bearings): whether each one's axis stays vertical over the range
// (`geometry.swivel-leans`), each one's heading range, and the loads it carries over the range,
// the load cases and the headings (mechanics/swivel-loads.ts). The stiffness and tipping over
// headings are in their own checks.
import type { Swivel } from "../model/types";
import type { Pose } from "../mechanics/types";
import type { SwivelLoad } from "../mechanics/swivel-loads";
import { swivelLoadsAt } from "./swivel-load-table";
import type { CheckContext } from "./index";
import { finding } from "../findings/finding";
import { addFigures, type Figure } from "./readout";
import { describePose, pastDeadline, show } from "./part-words";

/** An axis within this of vertical counts as vertical: a degree moves a stage's weight by under
 * 2 % of its lever sideways (sin 1 deg = 0.017), far inside the other figures' accuracy (common
 * practice, no source). */
export const SWIVEL_LEAN_TOLERANCE_RAD = Math.PI / 180;

/** The angle of the swivel's axis from vertical at a pose: its parent's turn in the plane. */
function leanAt(phi: number): number {
  const a = Math.abs(Math.atan2(Math.sin(phi), Math.cos(phi)));
  return a;
}

function checkOne(ctx: CheckContext, s: Swivel): void {
  const { sweep } = ctx;
  const heading = s.heading;
  const readout = addFigures(ctx.readouts, s.id, s.joint ? "swivel" : "base", [
    heading
      ? { label: "heading range", value: heading[0], high: heading[1], dimension: "angle" }
      : { label: "heading range", value: -Math.PI, high: Math.PI, dimension: "angle" },
  ]);
  if (!s.joint) return; // the base's yaw: vertical by definition (the base is the ground)
  // the locked joint that stands for it in the plane has the same id and reported first: the part
  // is a swivel (the results record files it under `swivels`)
  readout.kind = "swivel";
  let worst: { lean: number; pose: (typeof sweep.poses)[number] } | undefined;
  for (const pose of sweep.poses) {
    const b = pose.bodies[s.parent];
    if (!b) continue;
    const lean = leanAt(b.phi);
    if (!worst || lean > worst.lean) worst = { lean, pose };
  }
  if (!worst || worst.lean <= SWIVEL_LEAN_TOLERANCE_RAD) return;
  ctx.findings.push(
    finding(
      "geometry.swivel-leans",
      s.origin.properties["connects"] ?? s.origin.name ?? s.origin.declaration,
      `swivel ${s.id}'s axis leans up to ${show(worst.lean, "angle")} from vertical (${describePose(sweep, worst.pose)}): it runs along ${s.parent}'s y axis, so turning it would raise or lower what it carries; the checks take the axis as vertical. Put the swivel on a part that stays level (a parallelogram's head, the base)`,
      { data: { subject: s.id, lean: worst.lean } },
    ),
  );
}

export function checkSwivels(ctx: CheckContext): void {
  for (const s of ctx.model.swivels ?? []) checkOne(ctx, s);
  reportLoads(ctx);
}

type Peak = { value: number; pose: Pose; ci: number };

/** The largest of each load on each swivel between the base and the payloads, with where it
 * falls; the base's yaw is left to the base's own figures (tipping check). */
function reportLoads(ctx: CheckContext): void {
  const { model, sweep } = ctx;
  const swivels = (model.swivels ?? []).filter((s) => s.joint);
  if (swivels.length === 0) return;
  const peaks = new Map<string, Partial<Record<keyof SwivelLoad, Peak>>>();
  for (let k = 0; k < sweep.poses.length; k++) {
    if (pastDeadline(ctx.options.deadline)) break;
    const pose = sweep.poses[k]!;
    for (let ci = 0; ci < Math.max(1, pose.cases.length); ci++) {
      const loads = swivelLoadsAt(ctx, k, ci);
      for (const s of swivels) {
        const l = loads[s.id];
        if (!l) continue;
        const p = peaks.get(s.id) ?? {};
        for (const k of Object.keys(l) as (keyof SwivelLoad)[]) {
          const v = l[k] ?? 0;
          if (!p[k] || v > p[k]!.value) p[k] = { value: v, pose, ci };
        }
        peaks.set(s.id, p);
      }
    }
  }
  for (const s of swivels) {
    const p = peaks.get(s.id);
    if (!p) continue;
    const at = (k: keyof SwivelLoad) => (p[k] ? describePose(sweep, p[k]!.pose, p[k]!.ci) : undefined);
    const fig = (
      k: keyof SwivelLoad,
      label: string,
      dimension: Figure["dimension"],
      key?: string,
    ): Figure[] =>
      p[k]
        ? [{ label, value: p[k]!.value, dimension, where: at(k), ...(key ? { result: { key } } : {}) }]
        : [];
    addFigures(ctx.readouts, s.id, "swivel", [
      ...fig("axial", "load along its axis (thrust)", "force", "thrust"),
      ...fig("radial", "load across its axis", "force"),
      ...fig("moment", "tilting moment (carried as a couple by its bearings)", "torque", "tilting_moment"),
      ...((p.twist?.value ?? 0) > 0
        ? fig("twist", "moment about its axis (its friction or a brake holds it)", "torque")
        : []),
      ...fig("bearingRadial", "radial load on the more loaded of its two bearings", "force", "bearing_loads"),
    ]);
    // A moment about the axis (a leaning axis, a sideways working load) turns the stage by itself
    // unless the swivel's friction holds it: said in its readout, as a balance drift would be.
    const twist = p.twist?.value ?? 0;
    if (twist > TWIST_NOTE_NM)
      addFigures(
        ctx.readouts,
        s.id,
        "swivel",
        [],
        [
          s.friction !== undefined && s.friction >= twist
            ? `Its friction (${show(s.friction, "torque")}) holds the largest moment about its axis, ${show(twist, "torque")} (${at("twist")}).`
            : `Up to ${show(twist, "torque")} about its axis (${at("twist")})${s.friction !== undefined ? `, more than its friction of ${show(s.friction, "torque")}` : " and no friction given"}: the stage turns by itself unless a brake holds it.`,
        ],
      );
  }
}

/** A moment about a swivel's axis under this is nothing to say (round-off of a vertical axis), N*m. */
const TWIST_NOTE_NM = 1e-6;
