// Bearings under the parts that turn on them (`strength.bearing`): a joint's bearing carries the
// joint's reaction as a radial load at every pose and load case; the safety comes from
// mechanics/hardware/bearing-safety.ts (Stribeck and Hertz for ball bearings, ISO 76 for bought
// ones, the bore pressure for plain ones). Rules in docs/checks.md.
import type { ArmModel, Bearing } from "../model/types";
import type { Pose } from "../mechanics/types";
import {
  bearingSafety,
  type BearingLoad,
  type BearingModel,
  type BearingRole,
  type BearingSafety,
} from "../mechanics/hardware/bearing-safety";
import type { CheckContext } from "./index";
import { finding } from "../findings/finding";
import { addFigures, noteSafety, type Figure } from "./readout";
import { describePose, describeStation, pastDeadline, show, showSafety, spanOf } from "./part-words";
import type { PinLoad } from "../mechanics/structure/joint-wrench";
import { turnedLoads, worseThanLevel } from "./turned-loads";

/** The bearing with its materials resolved, for bearingSafety; undefined when a material is
 * missing (its name was reported by the model). */
export function bearingModelOf(model: ArmModel, b: Bearing): BearingModel | undefined {
  switch (b.kind) {
    case "balls": {
      const ball = model.materials[b.ballMaterial];
      const race = model.materials[b.raceMaterial];
      if (!ball || !race) return undefined;
      return {
        kind: "balls",
        count: b.count,
        ballDiameter: b.ballDiameter,
        ball,
        pitchDiameter: b.pitchDiameter,
        race,
        ...(b.grooveRadius !== undefined ? { grooveRadius: b.grooveRadius } : {}),
      };
    }
    case "plain": {
      const material = model.materials[b.material];
      return material ? { kind: "plain", bore: b.bore, length: b.length, material } : undefined;
    }
    case "rated":
      return {
        kind: "rated",
        staticRating: b.staticRating,
        ...(b.dynamicRating !== undefined ? { dynamicRating: b.dynamicRating } : {}),
        ...(b.pitchDiameter !== undefined ? { pitchDiameter: b.pitchDiameter } : {}),
      };
  }
}

/** What the safety figure of a bearing says, in words for a message. */
export function bearingWords(b: Bearing, r: BearingSafety): string {
  switch (r.governing) {
    case "ball contact":
      return `most loaded ball ${show(r.ballLoad!, "force")} presses ${show(r.contactPressure!, "pressure")} into the ${r.softer} (allowable ${show(r.allowablePressure!, "pressure")}; safety on load, the pressure cubed)`;
    case "tipping":
      return "the tilting moment lifts the ring off its balls";
    case "static rating":
      return `static equivalent load P0 ${show(r.equivalentLoad!, "force")} against its rating C0 ${show(b.kind === "rated" ? b.staticRating : 0, "force")}`;
    case "bore pressure":
      return `bore pressure ${show(r.borePressure!, "pressure")} against ${show(r.allowablePressure!, "pressure")} of ${r.softer}`;
  }
}

/** Figures of one bearing under one load, for the readouts. */
export function bearingFigures(prefix: string, load: BearingLoad, r: BearingSafety, where: string): Figure[] {
  const out: Figure[] = [];
  const add = (label: string, value: number | undefined, dimension: Figure["dimension"]) => {
    if (value !== undefined) out.push({ label: `${prefix}${label}`, value, dimension, where });
  };
  add("radial load", load.radial, "force");
  if (load.axial > 0) add("axial load", load.axial, "force");
  if (load.moment > 0) add("tilting moment", load.moment, "torque");
  add("most loaded ball", r.ballLoad, "force");
  add("contact pressure", r.contactPressure, "pressure");
  add("static equivalent load", r.equivalentLoad, "force");
  add("bore pressure", r.borePressure, "pressure");
  add("allowable pressure", r.allowablePressure, "pressure");
  add("safety factor", r.safety, "dimensionless");
  return out;
}

/** Every joint that turns on a bearing: its largest reaction over the range and load cases is the
 * bearing's radial load (the safety falls as the load grows, so the largest is the worst). */
export function checkBearings(ctx: CheckContext): void {
  const { model, sweep } = ctx;
  for (const j of model.joints) {
    if (!j.bearing) continue;
    const bearing = model.bearings[j.bearing];
    const bm = bearing && bearingModelOf(model, bearing);
    if (!bearing || !bm) continue;
    let worst: { force: number; pose: Pose; ci: number } | undefined;
    for (const pose of sweep.poses) {
      if (pastDeadline(ctx.options.deadline)) break;
      pose.cases.forEach((c, ci) => {
        const r = c.reactions[j.id];
        if (!r) return;
        const F = Math.hypot(r.x, r.y);
        if (!worst || F > worst.force) worst = { force: F, pose, ci };
      });
    }
    if (!worst) continue;
    const w: { force: number; pose: Pose; ci: number } = worst;
    const role: BearingRole = "radial";
    let load: BearingLoad = { radial: w.force, axial: 0, moment: 0 };
    let r = bearingSafety(bm, load, role);
    let where = describePose(sweep, w.pose, w.ci);
    const turned = turnedBearing(ctx, j.id, bm, r.safety);
    if (turned.worst) ({ load, r, where } = turned.worst);
    addFigures(ctx.readouts, bearing.id, "bearing", bearingFigures(`at ${j.id}: `, load, r, where), r.notes);
    addFigures(ctx.readouts, j.id, "joint", [
      ...(turned.moment && turned.moment.value > 1e-6
        ? [
            {
              label: "largest tilting moment on its bearing",
              value: turned.moment.value,
              dimension: "torque" as const,
              where: turned.moment.where,
              result: { key: "bearing_tilting_moment" },
            },
          ]
        : []),
      { label: "bearing safety factor", value: r.safety, dimension: "dimensionless", where },
    ]);
    noteSafety(ctx.readouts, bearing.id, "bearing", r.safety, `bearing at ${j.id}`, where);
    noteSafety(ctx.readouts, j.id, "joint", r.safety, `bearing ${bearing.id}`, where);
    const need = model.require.safety;
    if (r.safety < need)
      ctx.findings.push(
        finding(
          "strength.bearing",
          spanOf(j.origin, "bearing"),
          `bearing ${bearing.id} of joint ${j.id}: ${bearingWords(bearing, r)}: safety ${showSafety(r.safety)} < ${showSafety(need)} required (${turned.worst ? `radial load ${show(load.radial, "force")}, ${show(load.axial, "force")} along its axis and a tilting moment of ${show(load.moment, "torque")}` : `reaction ${show(w.force, "force")}`} ${where})`,
          {
            related: [
              { span: bearing.origin.name ?? bearing.origin.declaration, message: `bearing ${bearing.id}` },
            ],
            data: {
              subject: j.id,
              bearing: bearing.id,
              safety: r.safety,
              required: need,
              check: r.governing,
              radial: load.radial,
              axial: load.axial,
              moment: load.moment,
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
}

/** A joint's bearing with stages turned across (docs/checks.md, Bearings): the turned pass's load
 * on the joint (turned-loads.ts), its force across the pin axis as the radial load, along it as
 * the axial load and its moment across the axis as the tilting moment. A heading counts where it
 * makes the bearing's safety lower than the frame gives with every heading at 0 at that pose, and
 * then replaces the planar worst when lower still; the largest tilting moment is a figure. */
function turnedBearing(
  ctx: CheckContext,
  jointId: string,
  bm: BearingModel,
  planarSafety: number,
): {
  worst?: { load: BearingLoad; r: BearingSafety; where: string };
  moment?: { value: number; where: string };
} {
  const out: ReturnType<typeof turnedBearing> = {};
  let least = planarSafety;
  const asLoad = (p: PinLoad): BearingLoad => ({ radial: p.radial, axial: p.axial, moment: p.momentAcross });
  for (const { pose, caseIndex, level, turned } of turnedLoads(ctx)) {
    const lv = level.joints.get(jointId);
    const levelSafety = lv ? bearingSafety(bm, asLoad(lv), "radial").safety : Infinity;
    for (const visit of turned) {
      const p = visit.joints.get(jointId);
      if (!p) continue;
      const where = () => describeStation(ctx.sweep, pose, caseIndex, visit.headings);
      if (p.momentAcross > (out.moment?.value ?? 0)) out.moment = { value: p.momentAcross, where: where() };
      const load = asLoad(p);
      const r = bearingSafety(bm, load, "radial");
      if (worseThanLevel(1 / r.safety, 1 / levelSafety) && r.safety < least) {
        least = r.safety;
        out.worst = { load, r, where: where() };
      }
    }
  }
  return out;
}
