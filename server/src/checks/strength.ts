// Strength of links, bars and pins over the swept range: largest normal stress along each body
// (free body from the sweep's statics), column buckling of bodies in compression, pin shear and
// hole bearing; with swivels, the stress with torsion and sideways bending from stages turned
// across (the space frame at the stiffness check's poses and the headings searched). Rules in
// docs/checks.md; formulas in mechanics/structure/.
import type { ArmModel, Body, Joint, Material } from "../model/types";
import type { Pose, SweepResult } from "../mechanics/types";
import { sectionProperties, type SectionProperties } from "../model/section";
import {
  beamStressInto,
  emptyBeamStress,
  type BeamPointLoad,
  type BeamStressResult,
} from "../mechanics/structure/beam";
import { beamLoadSources, localBeamLoads, type BeamLoadSources } from "../mechanics/body-loads";
import { columnCriticalLoad, leastSecondMoment } from "../mechanics/structure/column";
import {
  bearingStress,
  bearingStressWithMoment,
  doubleShearStressWithCouple,
  pinBendingStress,
  pinShearStress,
  shearYieldStrength,
  tubeBearingStressWithMoment,
} from "../mechanics/structure/pin";
import type { PinLoad } from "../mechanics/structure/joint-wrench";
import type { Headings } from "../mechanics/headings";
import { turnedLoads, worseThanLevel } from "./turned-loads";
import type { CheckContext } from "./index";
import { finding } from "../findings/finding";
import { addFigures, noteSafety, type Figure } from "./readout";
import {
  bodyWord,
  describePose,
  describeStation,
  owningOrigin,
  payloadMasses,
  pastDeadline,
  pinSpan,
  relatedBody,
  sectionSpan,
  show,
  showSafety,
} from "./part-words";

/** Share of in-plane strength a print keeps across its layers when the material gives no
 * `layer_strength`: 0.5 is the conservative default of docs/materials.md (Ahn et al., Rapid
 * Prototyping J. 8(4), 2002: 40-80 %, from memory). */
export const PRINTED_LAYER_SHARE = 0.5;

/** Effective-length factor of a bar with a locked end and a free tip (flagpole): K = 2
 * (Shigley ch. 4, end-condition table, theoretical value for fixed-free). */
const FLAGPOLE_LENGTH_FACTOR = 2;
/** Every other bar: pinned ends, K = 1. A locked joint would allow less in theory (0.7), but the
 * parent's own flexibility and a held pivot's brake do not make a rigid clamp. */
const PINNED_LENGTH_FACTOR = 1;
/** A joint point within this of a body's end counts as at that end (pivots are drawn to 0.1 mm). */
const END_MATCH_M = 1e-4;

/** Strength against normal stress: printed bodies that bend have layers in tension across the
 * print (orientation unknown), so they use the layer strength. */
export function normalStrength(material: Material, bends: boolean): { value: number; layer: boolean } {
  if (material.printed && bends)
    return { value: material.layerStrength ?? PRINTED_LAYER_SHARE * material.strength, layer: true };
  return { value: material.strength, layer: false };
}

function strengthWords(material: Material, s: { value: number; layer: boolean }): string {
  return s.layer
    ? `layer strength ${show(s.value, "pressure")} of printed ${material.id}`
    : `strength ${show(s.value, "pressure")} of ${material.id}`;
}

interface Worst {
  safety: number;
  pose: Pose;
  caseIndex: number;
  /** The swivels' headings, when a turned stage makes it the worst. */
  headings?: Headings;
  /** Words for the message, built only when a finding needs them (formatting is slow). */
  detail: () => string;
  figure: number;
}

const NO_DETAIL = () => "";

function lengthFactor(model: ArmModel, body: Body): number {
  const at = (p: { x: number; y: number }, x: number) => Math.hypot(p.x - x, p.y) < END_MATCH_M;
  let start = false;
  let end = false;
  let locked = false;
  for (const j of model.joints) {
    const p = j.child === body.id ? j.childPoint : j.parent === body.id ? j.parentPoint : undefined;
    if (!p) continue;
    if (at(p, 0)) start = true;
    if (at(p, body.length)) end = true;
    if (j.mode !== "passive") locked = true;
  }
  return locked && start !== end ? FLAGPOLE_LENGTH_FACTOR : PINNED_LENGTH_FACTOR;
}

/** What the pose loop needs of each beam, computed once per check run: the body's constants do
 * not change from pose to pose. */
interface BeamTable {
  body: Body;
  sec: SectionProperties;
  mat: Material;
  /** Own weight per length, N/m. */
  w: number;
  allowBending: { value: number; layer: boolean };
  allowAxial: { value: number; layer: boolean };
  /** Effective-length factor and the column's critical load (filled on the first compression). */
  K: number;
  col?: ReturnType<typeof columnCriticalLoad>;
  /** What loads it, resolved once. */
  sources: BeamLoadSources;
  /** The pose loop's worst so far (fields, not maps by id: the loop's lookups stay cheap). */
  stress?: Worst;
  largest?: Worst;
  column?: Worst;
}

export function checkStrength(ctx: CheckContext): void {
  const { model, sweep } = ctx;
  const beams = model.bodies.filter(
    (b) =>
      (b.kind === "link" || b.kind === "bar") &&
      b.section &&
      b.material &&
      model.materials[b.material] &&
      b.length > 0,
  );
  const pinned = model.joints.filter((j) => j.pin && model.materials[j.pin.material]);
  const tables: BeamTable[] = beams.map((body) => {
    const mat = model.materials[body.material!]!;
    return {
      body,
      sec: sectionProperties(body.section!),
      mat,
      w: (body.mass * model.gravity) / body.length,
      allowBending: normalStrength(mat, true),
      allowAxial: normalStrength(mat, false),
      K: lengthFactor(model, body),
      sources: beamLoadSources(model, body.id),
    };
  });
  const pins = pinned.map((j) => pinTable(model, j));
  const dofJoints = new Set(sweep.dofs.map((d) => d.jointId));
  const loads: BeamPointLoad[] = [];
  const r = emptyBeamStress();
  const g = model.gravity;

  outer: for (const pose of sweep.poses) {
    if (pastDeadline(ctx.options.deadline)) break outer;
    for (let ci = 0; ci < pose.cases.length; ci++) {
      for (let ti = 0; ti < tables.length; ti++) {
        const t = tables[ti]!;
        const body = t.body;
        const bp = pose.bodies[body.id];
        if (!bp) continue;
        const { sec, w } = t;
        // Its own weight is spread along it, not among the point loads.
        const count = localBeamLoads(t.sources, g, sweep.loadCases, dofJoints, pose, ci, bp, loads);
        beamStressInto(loads, count, -w * Math.sin(bp.phi), -w * Math.cos(bp.phi), body.length, sec, r);
        const allow = r.bendingShare > 0 ? t.allowBending : t.allowAxial;
        const sf = r.stress > 0 ? allow.value / r.stress : Infinity;
        if (!t.stress || sf < t.stress.safety) t.stress = stressWorstAt(t, r, allow, sf, pose, ci);
        const largest = t.largest;
        if (!largest) t.largest = { safety: sf, pose, caseIndex: ci, detail: NO_DETAIL, figure: r.stress };
        else if (r.stress > largest.figure) {
          largest.safety = sf;
          largest.pose = pose;
          largest.caseIndex = ci;
          largest.figure = r.stress;
        }
        if (r.compression > 0) {
          const col = columnOf(t);
          const csf = col.criticalLoad / r.compression;
          if (!t.column || csf < t.column.safety)
            t.column = columnWorstAt(t, col, r.compression, csf, pose, ci);
        }
      }
      const reactions = pose.cases[ci]?.reactions;
      if (!reactions) continue;
      for (let pi = 0; pi < pins.length; pi++) {
        const pt = pins[pi]!;
        const j = pt.joint;
        const reaction = reactions[j.id];
        if (!reaction) continue;
        const F = Math.hypot(reaction.x, reaction.y);
        const prevR = pt.reactionMax;
        if (!prevR) pt.reactionMax = { safety: 0, pose, caseIndex: ci, detail: NO_DETAIL, figure: F };
        else if (F > prevR.figure) {
          prevR.pose = pose;
          prevR.caseIndex = ci;
          prevR.figure = F;
        }
        const safety = pinTableSafety(pt, F);
        // pinSafety gives the same safety with the words; they are built only for a finding
        if (!pt.worst || safety < pt.worst.safety)
          pt.worst = {
            safety,
            pose,
            caseIndex: ci,
            detail: () => pinSafety(model, j, F).detail(),
            figure: F,
          };
      }
    }
  }
  const stressWorst = new Map<string, Worst>();
  const columnWorst = new Map<string, Worst>();
  const largestStress = new Map<string, Worst>();
  for (const t of tables) {
    if (t.stress) stressWorst.set(t.body.id, t.stress);
    if (t.column) columnWorst.set(t.body.id, t.column);
    if (t.largest) largestStress.set(t.body.id, t.largest);
  }
  const pinWorst = new Map<string, Worst>();
  const reactionMax = new Map<string, Worst>();
  for (const pt of pins) {
    if (pt.worst) pinWorst.set(pt.joint.id, pt.worst);
    if (pt.reactionMax) reactionMax.set(pt.joint.id, pt.reactionMax);
  }
  const pin3d = new Map<string, PinFigures3d>();
  turnedStrength(ctx, tables, pins, {
    stress: stressWorst,
    largest: largestStress,
    column: columnWorst,
    pin: pinWorst,
    pin3d,
  });
  reportBodies(ctx, beams, stressWorst, columnWorst, largestStress);
  reportPins(ctx, pinned, pinWorst, reactionMax, pin3d);
}

/** A beam's new worst stress, its words kept for a finding (the section's loads copied: the
 * result object is reused). */
function stressWorstAt(
  t: BeamTable,
  r: BeamStressResult,
  allow: { value: number; layer: boolean },
  safety: number,
  pose: Pose,
  caseIndex: number,
): Worst {
  const { moment, axial, s } = r.at;
  const mat = t.mat;
  return {
    safety,
    pose,
    caseIndex,
    detail: () =>
      `(bending moment ${show(Math.abs(moment), "torque")}, axial ${axial < 0 ? "compression" : "tension"} ${show(Math.abs(axial), "force")}, ${show(s, "length")} from its start) against the ${strengthWords(mat, allow)}`,
    figure: r.stress,
  };
}

/** A beam's new worst buckling safety. */
function columnWorstAt(
  t: BeamTable,
  col: ReturnType<typeof columnCriticalLoad>,
  P: number,
  safety: number,
  pose: Pose,
  caseIndex: number,
): Worst {
  const K = t.K;
  const L = t.body.length;
  return {
    safety,
    pose,
    caseIndex,
    detail: () =>
      `compression ${show(P, "force")} against a ${col.method} buckling load of ${show(col.criticalLoad, "force")} (K L = ${show(K * L, "length")})`,
    figure: P,
  };
}

/** Stress, buckling and pins with stages turned across (docs/checks.md, "Stages turned across"):
 * the turned pass's frame solves (turned-loads.ts) give each bar's combined stress (von Mises for
 * metals, the largest principal stress against the layer strength for prints) and compression,
 * and each pin's load along and across its axis. A heading counts where it makes a figure worse
 * than the frame gives with every heading at 0 at that pose (worseThanLevel), and then replaces
 * the planar worst when its safety is lower: an arm that does not turn keeps its planar figures. */
function turnedStrength(
  ctx: CheckContext,
  tables: BeamTable[],
  pins: PinTable[],
  worst: {
    stress: Map<string, Worst>;
    largest: Map<string, Worst>;
    column: Map<string, Worst>;
    pin: Map<string, Worst>;
    pin3d: Map<string, PinFigures3d>;
  },
): void {
  const groups = turnedLoads(ctx);
  if (groups.length === 0) return;
  const byBody = new Map(tables.map((t) => [t.body.id, t]));
  for (const { pose, caseIndex: ci, level, turned } of groups) {
    for (const visit of turned) {
      const headings = visit.headings;
      for (const [id, w] of visit.bodies) {
        const t = byBody.get(id);
        if (!t) continue;
        const lv = level.bodies.get(id);
        if (worseThanLevel(w.stress, lv?.stress)) {
          const allow = t.allowBending;
          const safety = w.stress > 0 ? allow.value / w.stress : Infinity;
          const c = w.at;
          const mat = t.mat;
          const prev = worst.stress.get(id);
          if (!prev || safety < prev.safety)
            worst.stress.set(id, {
              safety,
              pose,
              caseIndex: ci,
              headings,
              detail: () =>
                `(${mat.printed ? "largest principal stress" : "von Mises"} of ${show(c.normal, "pressure")} from bending both ways and axial force, with ${show(c.shear, "pressure")} of torsion) against the ${strengthWords(mat, allow)}`,
              figure: w.stress,
            });
          const big = worst.largest.get(id);
          if (!big || w.stress > big.figure)
            worst.largest.set(id, {
              safety,
              pose,
              caseIndex: ci,
              headings,
              detail: NO_DETAIL,
              figure: w.stress,
            });
        }
        if (w.compression > 0 && worseThanLevel(w.compression, lv?.compression)) {
          const col = columnOf(t);
          const csf = col.criticalLoad / w.compression;
          const P = w.compression;
          const K = t.K;
          const L = t.body.length;
          const prev = worst.column.get(id);
          if (!prev || csf < prev.safety)
            worst.column.set(id, {
              safety: csf,
              pose,
              caseIndex: ci,
              headings,
              detail: () =>
                `compression ${show(P, "force")} against a ${col.method} buckling load of ${show(col.criticalLoad, "force")} (K L = ${show(K * L, "length")})`,
              figure: P,
            });
        }
      }
      for (const pt of pins) {
        const id = pt.joint.id;
        const load = visit.joints.get(id);
        if (!load) continue;
        const fig = worst.pin3d.get(id) ?? { axial: undefined, momentAcross: undefined };
        if (load.axial > (fig.axial?.value ?? 0))
          fig.axial = { value: load.axial, where: describeStation(ctx.sweep, pose, ci, headings) };
        if (load.momentAcross > (fig.momentAcross?.value ?? 0))
          fig.momentAcross = {
            value: load.momentAcross,
            where: describeStation(ctx.sweep, pose, ci, headings),
          };
        worst.pin3d.set(id, fig);
        const lv = level.joints.get(id);
        const r = pinSafety3d(pt, load);
        const levelSafety = lv ? pinSafety3d(pt, lv).safety : Infinity;
        if (!worseThanLevel(1 / r.safety, 1 / levelSafety)) continue;
        const prev = worst.pin.get(id);
        if (!prev || r.safety < prev.safety)
          worst.pin.set(id, {
            safety: r.safety,
            pose,
            caseIndex: ci,
            headings,
            detail: r.detail,
            figure: load.radial,
          });
      }
    }
  }
}

/** The largest force along a pin and moment across it over the turned pass, for the readouts. */
interface PinFigures3d {
  axial?: { value: number; where: string };
  momentAcross?: { value: number; where: string };
}

/** A bar's column capacity, computed on first use. */
function columnOf(t: BeamTable): ReturnType<typeof columnCriticalLoad> {
  return (t.col ??= columnCriticalLoad(
    t.mat.modulus,
    t.sec.area,
    leastSecondMoment(t.body.section!),
    t.allowBending.value,
    t.K * t.body.length,
  ));
}

/** A pin's safety under a load in three dimensions (docs/checks.md, Pins and holes): the shear of
 * the force across its axis, with the moment across it carried as a couple, a double-shear pin's
 * by shear forces M / s at its two planes (s the thinner hole wall it passes through, else its
 * diameter), a single-shear pin's by bending at its one plane (von Mises of the bending and the
 * shear against the pin's strength); the holes' bearing with the moment tilting the pin in them.
 * With no moment across it, the same arithmetic as pinTableSafety. */
function pinSafety3d(pt: PinTable, load: PinLoad): { safety: number; detail: () => string } {
  const pin = pt.joint.pin!;
  const F = load.radial;
  const M = load.momentAcross;
  const d = pin.diameter;
  const arm = pt.holes.length > 0 ? Math.min(...pt.holes.map((h) => h.tubeSpacing ?? h.t)) : d;
  let safety: number;
  let detail: () => string;
  const alongWords = () =>
    load.axial > 0 ? `; ${show(load.axial, "force")} along the pin on its head or clip` : "";
  if (pin.shearPlanes === 2) {
    const tau = doubleShearStressWithCouple(F, M, d, arm);
    safety = tau > 0 ? pt.shearAllow / tau : Infinity;
    detail = () =>
      `double-shear stress ${show(tau, "pressure")} (${show(F, "force")} across the pin, and ${show(M, "torque")} across its axis as a couple over ${show(arm, "length")}) against ${show(pt.shearAllow, "pressure")}${alongWords()}`;
  } else {
    const tau = pinShearStress(F, d, 1);
    const sigma = pinBendingStress(M, d);
    const vm = Math.sqrt(sigma * sigma + 3 * tau * tau);
    safety = M > 0 ? (vm > 0 ? pt.strength / vm : Infinity) : tau > 0 ? pt.shearAllow / tau : Infinity;
    detail = () =>
      M > 0
        ? `von Mises ${show(vm, "pressure")} of single-shear stress ${show(tau, "pressure")} and bending ${show(sigma, "pressure")} (${show(M, "torque")} across its axis) against ${show(pt.strength, "pressure")}${alongWords()}`
        : `single-shear stress ${show(tau, "pressure")} against ${show(pt.shearAllow, "pressure")}${alongWords()}`;
  }
  for (const h of pt.holes) {
    const sigma =
      h.tubeSpacing !== undefined
        ? tubeBearingStressWithMoment(F, M, d, h.t / 2, h.tubeSpacing)
        : bearingStressWithMoment(F, M, d, h.t);
    const sf = sigma > 0 ? h.allow / sigma : Infinity;
    if (sf < safety) {
      safety = sf;
      detail = () =>
        `bearing stress ${show(sigma, "pressure")} in the ${show(h.t, "length")} ${h.tubeSpacing !== undefined ? "walls" : "wall"} of ${bodyWord(h.body)} (${show(F, "force")} across the pin, tilted in the hole by ${show(M, "torque")}) against ${show(h.allow, "pressure")}${alongWords()}`;
    }
  }
  return { safety, detail };
}

/** A pin's constants for the pose loop: what pinSafety looks up, looked up once; and the loop's
 * worst so far. */
interface PinTable {
  joint: Joint;
  worst?: Worst;
  reactionMax?: Worst;
  shearAllow: number;
  /** The pin material's tensile strength, Pa. */
  strength: number;
  /** Each body's hole: its wall `t` (a tube's two walls together), and for a tube without
   * `holes` the spacing of its two walls' mid-planes, the arm of a couple across the pin. */
  holes: { t: number; allow: number; body: Body; tubeSpacing?: number }[];
}

function pinTable(model: ArmModel, j: Joint): PinTable {
  const pin = j.pin!;
  const pinMat = model.materials[pin.material]!;
  const holes: PinTable["holes"] = [];
  for (const b of [bodyOf(model, j.parent), bodyOf(model, j.child)]) {
    if (!b || b.kind === "base") continue;
    const t = b.holeThickness ?? (b.section ? sectionProperties(b.section).width : undefined);
    const bm = b.material ? model.materials[b.material] : undefined;
    if (!t || !bm) continue;
    const sec = b.section;
    // a tube's hole is its two walls (the model's default `holes`, 2 x wall) far apart
    const tube =
      sec?.shape === "tube" && 2 * sec.wall < sec.outerDiameter && t === 2 * sec.wall
        ? { tubeSpacing: sec.outerDiameter - sec.wall }
        : {};
    holes.push({ t, allow: Math.min(pinMat.strength, normalStrength(bm, true).value), body: b, ...tube });
  }
  return { joint: j, shearAllow: shearYieldStrength(pinMat.strength), strength: pinMat.strength, holes };
}

/** pinSafety's safety figure, with the same arithmetic, from the table. */
function pinTableSafety(pt: PinTable, force: number): number {
  const pin = pt.joint.pin!;
  const tau = pinShearStress(force, pin.diameter, pin.shearPlanes);
  let safety = tau > 0 ? pt.shearAllow / tau : Infinity;
  const holes = pt.holes;
  for (let k = 0; k < holes.length; k++) {
    const h = holes[k]!;
    const sigma = bearingStress(force, pin.diameter, h.t);
    const sf = sigma > 0 ? h.allow / sigma : Infinity;
    if (sf < safety) safety = sf;
  }
  return safety;
}

/** Least of the pin's shear safety and the bearing safety of each hole it passes through. */
export function pinSafety(
  model: ArmModel,
  j: Joint,
  force: number,
): { safety: number; detail: () => string } {
  const pin = j.pin!;
  const pinMat = model.materials[pin.material]!;
  const tau = pinShearStress(force, pin.diameter, pin.shearPlanes);
  const shearAllow = shearYieldStrength(pinMat.strength);
  let safety = tau > 0 ? shearAllow / tau : Infinity;
  let detail = () =>
    `${pin.shearPlanes === 2 ? "double" : "single"}-shear stress ${show(tau, "pressure")} against ${show(shearAllow, "pressure")}`;
  for (const b of [bodyOf(model, j.parent), bodyOf(model, j.child)]) {
    if (!b || b.kind === "base") continue;
    const t = b.holeThickness ?? (b.section ? sectionProperties(b.section).width : undefined);
    const bm = b.material ? model.materials[b.material] : undefined;
    if (!t || !bm) continue;
    const sigma = bearingStress(force, pin.diameter, t);
    const allow = Math.min(pinMat.strength, normalStrength(bm, true).value);
    const sf = sigma > 0 ? allow / sigma : Infinity;
    if (sf < safety) {
      safety = sf;
      detail = () =>
        `bearing stress ${show(sigma, "pressure")} in the ${show(t, "length")} wall of ${bodyWord(b)} against ${show(allow, "pressure")}`;
    }
  }
  return { safety, detail };
}

function bodyOf(model: ArmModel, id: string): Body | undefined {
  return model.bodies.find((b) => b.id === id);
}

function reportBodies(
  ctx: CheckContext,
  beams: Body[],
  stressWorst: Map<string, Worst>,
  columnWorst: Map<string, Worst>,
  largest: Map<string, Worst>,
): void {
  const { model, sweep } = ctx;
  const need = model.require.safety;
  for (const body of beams) {
    const kind = body.kind === "bar" ? "bar" : "link";
    const s = stressWorst.get(body.id);
    const big = largest.get(body.id);
    const figures: Figure[] = [{ label: "mass", value: body.mass, dimension: "mass" }];
    if (big)
      figures.push({
        label: "largest stress",
        value: big.figure,
        dimension: "pressure",
        where: describeStation(sweep, big.pose, big.caseIndex, big.headings ?? {}),
      });
    addFigures(ctx.readouts, body.id, kind, figures);
    const own = owningOrigin(model, body.origin);
    for (const [w, what] of [
      [s, "stress"],
      [columnWorst.get(body.id), "buckling"],
    ] as const) {
      if (!w) continue;
      const where = describeStation(sweep, w.pose, w.caseIndex, w.headings ?? {});
      noteSafety(ctx.readouts, body.id, kind, w.safety, what, where);
      if (own.parallelogram)
        noteSafety(
          ctx.readouts,
          own.parallelogram,
          "parallelogram",
          w.safety,
          `${what} of ${body.id}`,
          where,
        );
      addFigures(ctx.readouts, body.id, kind, [
        { label: `${what} safety factor`, value: w.safety, dimension: "dimensionless", where },
      ]);
      if (w.safety < need) {
        const msg =
          what === "stress"
            ? `${bodyWord(body)}: largest stress ${show(w.figure, "pressure")} ${w.detail()}: safety ${showSafety(w.safety)} < ${showSafety(need)} required (${where})`
            : `${bodyWord(body)}: ${w.detail()}: buckling safety ${showSafety(w.safety)} < ${showSafety(need)} required (${where})`;
        ctx.findings.push(
          finding("strength.overstress", sectionSpan(model, body), msg, {
            related: model.payloads
              .filter((p) => p.body === body.id)
              .map((p) => ({
                span: p.origin.name ?? p.origin.declaration,
                message: `payload ${p.id} loads it`,
              })),
            data: { subject: body.id, check: what, safety: w.safety, required: need },
          }),
        );
      }
    }
  }
}

function reportPins(
  ctx: CheckContext,
  pinned: Joint[],
  pinWorst: Map<string, Worst>,
  reactionMax: Map<string, Worst>,
  pin3d: Map<string, PinFigures3d>,
): void {
  const { model, sweep } = ctx;
  const need = model.require.safety;
  for (const j of pinned) {
    const w = pinWorst.get(j.id);
    const r = reactionMax.get(j.id);
    if (!w || !r) continue;
    const pin = j.pin!;
    const where = describeStation(sweep, w.pose, w.caseIndex, w.headings ?? {});
    let bearing = 0;
    for (const b of [bodyOf(model, j.parent), bodyOf(model, j.child)]) {
      const t =
        b && b.kind !== "base"
          ? (b.holeThickness ?? (b.section ? sectionProperties(b.section).width : undefined))
          : undefined;
      if (t) bearing = Math.max(bearing, bearingStress(r.figure, pin.diameter, t));
    }
    addFigures(ctx.readouts, j.id, "joint", [
      {
        label: "largest reaction",
        value: r.figure,
        dimension: "force",
        where: describePose(sweep, r.pose, r.caseIndex),
      },
      {
        label: "pin shear stress",
        value: pinShearStress(r.figure, pin.diameter, pin.shearPlanes),
        dimension: "pressure",
      },
      ...(bearing > 0
        ? [{ label: "largest hole bearing stress", value: bearing, dimension: "pressure" as const }]
        : []),
      ...turnedPinFigures(pin3d.get(j.id)),
      { label: "pin safety factor", value: w.safety, dimension: "dimensionless", where },
    ]);
    noteSafety(ctx.readouts, j.id, "joint", w.safety, "pin", where);
    const own = owningOrigin(model, j.origin);
    if (own.parallelogram) {
      noteSafety(ctx.readouts, own.parallelogram, "parallelogram", w.safety, `pin of ${j.id}`, where);
      // a stage's joints have no name of their own in the text: its hover shows their figures
      const turned = turnedPinFigures(pin3d.get(j.id)).map(({ result: _, ...f }) => ({
        ...f,
        label: `pin of ${j.id}: ${f.label}`,
      }));
      if (turned.length) addFigures(ctx.readouts, own.parallelogram, "parallelogram", turned);
    }
    if (w.safety < need) {
      const related = [j.parent, j.child]
        .map((id) => model.bodies.find((b) => b.id === id))
        .filter((b): b is Body => !!b && b.kind !== "base")
        .map((b) => relatedBody(b, `${bodyWord(b)} holds this pin`));
      ctx.findings.push(
        finding(
          "strength.overstress",
          pinSpan(model, j),
          `pin of joint ${j.id}: ${w.detail()}: safety ${showSafety(w.safety)} < ${showSafety(need)} required (${w.headings ? "force across the pin" : "reaction"} ${show(w.figure, "force")} ${where})`,
          { related, data: { subject: j.id, check: "pin", safety: w.safety, required: need } },
        ),
      );
    }
  }
}

/** A pin's figures out of the drawing plane, where the turned pass found any (a stage turned
 * across, a working load across the plane): the largest force along the pin (on its head or clip)
 * and the largest moment across its axis (the couple its holes carry). Left out below a
 * micronewton and a micronewton-metre: nought by symmetry, not a figure. */
function turnedPinFigures(f: PinFigures3d | undefined): Figure[] {
  const out: Figure[] = [];
  if (f?.axial && f.axial.value > 1e-6)
    out.push({
      label: "largest force along the pin",
      value: f.axial.value,
      dimension: "force",
      where: f.axial.where,
      result: { key: "force_along_pin" },
    });
  if (f?.momentAcross && f.momentAcross.value > 1e-6)
    out.push({
      label: "largest moment across the pin",
      value: f.momentAcross.value,
      dimension: "torque",
      where: f.momentAcross.where,
      result: { key: "moment_across_pin" },
    });
  return out;
}
