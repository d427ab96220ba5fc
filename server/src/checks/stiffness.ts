// Stiffness and vibration of the loaded arm with its degrees of freedom held (docs/checks.md,
// Stiffness and vibration, Swivels): deflection and tilt at each payload and the lowest natural frequency
// (sideways and twisting modes included) from the space frame, at a few representative poses (the
// reference and the ends of each range), not every pose. A pose where the frame cannot be solved
// is said on the parts it leaves unchecked, never skipped in silence.
import type { ArmModel, Body, Parallelogram } from "../model/types";
import type { Span } from "../findings/span";
import { tiltShares } from "../mechanics/structure/tilt-share";
import type { Pose, SweepResult } from "../mechanics/types";
import { loadArmFrame, type ArmFrame, type ArmStructure } from "../mechanics/structure/arm-frame";
import { structureAt } from "./frame-structures";
import {
  headingSets,
  isQuarterTurn,
  isRangeEnd,
  loadsAcross,
  Placement,
  type Headings,
  type Vec3,
} from "../mechanics/headings";
import type { SpaceFrameSolution } from "../mechanics/structure/space-frame";
import type { CheckContext } from "./index";
import { finding } from "../findings/finding";
import { addFigures } from "./readout";
import { carrierHead, parallelogramOfHead } from "./arm-paths";
import { orientationRange } from "./geometry";
import {
  bodyWord,
  describePose,
  describeStation,
  pastDeadline,
  payloadMasses,
  sectionSpan,
  show,
  spanOf,
} from "./part-words";

/** The reference pose, then for each degree of freedom the poses at the two ends of its range
 * (of those, the one whose other dofs sit nearest their reference); at most MAX_STIFFNESS_POSES. */
export function representativePoses(sweep: SweepResult): Pose[] {
  const out: Pose[] = [];
  const add = (p: Pose | undefined) => p && !out.includes(p) && out.push(p);
  add(sweep.reference ?? sweep.poses[0]);
  // Each pose's distance from the reference, dof by dof, read once (not once per dof and end:
  // that was dofs^2 x poses lookups by name); the score adds them in the same order as before.
  const { dofs } = sweep;
  const away = sweep.poses.map((p) =>
    Float64Array.from(dofs, (o) => Math.abs((p.angles[o.id] ?? o.reference) - o.reference)),
  );
  dofs.forEach((d, di) => {
    for (const end of [d.range[0], d.range[1]]) {
      let best: { pose: Pose; score: number } | undefined;
      sweep.poses.forEach((p, pi) => {
        const a = p.angles[d.id];
        if (a === undefined) return;
        let score = Math.abs(a - end) * 1e3;
        const off = away[pi]!;
        for (let oi = 0; oi < dofs.length; oi++) if (oi !== di) score += off[oi]!;
        if (!best || score < best.score) best = { pose: p, score };
      });
      add(best?.pose);
    }
  });
  return out.length <= MAX_STIFFNESS_POSES
    ? out
    : [out[0]!, ...mostExtended(out.slice(1), MAX_STIFFNESS_POSES - 1)];
}

/** Poses the frame and eigen solves visit at most: the reference and both ends of three ranges.
 * An arm of many stages would otherwise pay an eigenproblem per range end (a 60-body chain spent
 * seconds there); beyond this, the poses that reach farthest are kept. */
const MAX_STIFFNESS_POSES = 7;

/** Figures closer than this share are one figure: the subspace iteration stops at 1e-10 relative,
 * and a different order of the frame's equations changes the last digits. */
const SAME_FIGURE_RATIO = 1e-9;

/** The `count` poses whose bodies reach farthest from the base horizontally (summed over the
 * bodies' frame origins): bending deflection and the lowest mode grow with reach. */
function mostExtended(poses: Pose[], count: number): Pose[] {
  const reach = (p: Pose) => Object.values(p.bodies).reduce((sum, b) => sum + Math.abs(b.x), 0);
  return poses
    .map((pose) => ({ pose, reach: reach(pose) }))
    .sort((a, b) => b.reach - a.reach)
    .slice(0, count)
    .map((r) => r.pose);
}

/** Of the representative poses, the ones the swivels are turned at: the reference and the pose
 * that reaches farthest (a turned stage twists the stages below it most when it reaches out). */
export function turnedPoses(poses: Pose[]): Pose[] {
  const farthest = mostExtended(poses, 1)[0];
  return farthest && farthest !== poses[0] ? [poses[0]!, farthest] : poses.slice(0, 1);
}

/** The load case with the largest total payload mass. */
function heaviestCase(model: ArmModel, sweep: SweepResult): number {
  let best = 0;
  let bestMass = -Infinity;
  sweep.loadCases.forEach((_, ci) => {
    const m = Object.values(payloadMasses(model, sweep, ci)).reduce((a, b) => a + b, 0);
    if (m > bestMass) ((bestMass = m), (best = ci));
  });
  return best;
}

interface PayloadWorst {
  deflection: number;
  deflectionPose?: Pose;
  deflectionCase: number;
  deflectionHeadings: Headings;
  tilt: number;
  tiltPose?: Pose;
  tiltCase: number;
  tiltHeadings: Headings;
  /** Elastic turn out of the payload's stage plane (about its horizontal in-plane axis), rad. */
  lean: number;
  leanPose?: Pose;
  leanCase: number;
  leanHeadings: Headings;
  leanEnergy?: Map<string, number>;
}

/** The body whose bending, twisting and stretching stores most of the strain energy (under the
 * load, or in the lowest mode's shape): the part whose stiffening helps most. */
function mostCompliantBody(model: ArmModel, energy: Map<string, number>): Body | undefined {
  let best: { id: string; e: number } | undefined;
  for (const [id, e] of energy) if (!best || e > best.e) best = { id, e };
  return best ? model.bodies.find((b) => b.id === best.id) : undefined;
}

function dot3(a: Vec3, b: Vec3): number {
  return a.x * b.x + a.y * b.y + a.z * b.z;
}

/** Strain energy of each body's members in a solution or mode shape, J (or J per unit mode). */
function energyByBody(af: ArmFrame, sol: SpaceFrameSolution): Map<string, number> {
  const energy = new Map<string, number>();
  af.memberBody.forEach((id, k) => id && energy.set(id, (energy.get(id) ?? 0) + sol.strainEnergy(k)));
  return energy;
}

/** Which way a mode moves the arm: in its plane (x-y) or out of it (sideways sway and twist; the
 * two are decoupled while the arm does not turn). */
function modeDirection(af: ArmFrame, shape: SpaceFrameSolution): "in-plane" | "sideways" {
  let inPlane = 0;
  let across = 0;
  for (let n = 0; n < af.frame.nodeCount; n++) {
    const u = shape.displacement(n).translation;
    inPlane += u.x * u.x + u.y * u.y;
    across += u.z * u.z;
  }
  return across > inPlane ? "sideways" : "in-plane";
}

/** Whether the lowest mode is sought with these headings: an eigenproblem costs several static
 * solves, so only at the quarter turns and the range ends (where a turned stage sits wholly in or
 * across its parent's plane, or as far as it goes), not at every heading searched. */
function modeWorthy(model: ArmModel, headings: Headings): boolean {
  return Object.entries(headings).every(([id, h]) => {
    const s = model.swivels?.find((x) => x.id === id);
    return isQuarterTurn(h) || (s !== undefined && isRangeEnd(s, h));
  });
}

interface LowestMode {
  f: number;
  pose: Pose;
  ci: number;
  headings: Headings;
  energy: Map<string, number>;
  direction: "in-plane" | "sideways";
}

export function checkStiffness(ctx: CheckContext): void {
  const { model, sweep } = ctx;
  const poses = representativePoses(sweep);
  const worst = new Map<string, PayloadWorst>();
  let lowest: LowestMode | undefined;
  const energyForDeflection = new Map<string, Map<string, number>>();
  const unsolved: Pose[] = [];
  let solvedAny = false;
  let flexible = false;
  // the lowest frequency comes with the heaviest payloads: solve the eigenproblem for that case only
  const heaviest = heaviestCase(model, sweep);
  // Turned swivels are visited at the reference pose and at the pose reaching farthest: the other
  // representative poses stay at heading 0 (docs/checks.md, "Which poses each check visits").
  const turnedSets = headingSets(model, sweep.quick === true);
  const farthest = turnedPoses(poses)[1];
  for (const pose of poses) {
    // while typing, the swivels are turned at the farthest pose only
    const turnedHere = sweep.quick ? pose === (farthest ?? poses[0]) : pose === poses[0] || pose === farthest;
    const sets = turnedHere ? turnedSets : turnedSets.slice(0, 1);
    for (const headings of sets) {
      // the load cases of one pose and heading differ in loads and masses only: one structure,
      // one factorisation
      let structure: ArmStructure | undefined;
      for (let ci = 0; ci < Math.max(1, pose.cases.length); ci++) {
        if (pastDeadline(ctx.options.deadline)) break;
        structure ??= structureAt(ctx, pose, headings);
        const af = loadArmFrame(model, structure, pose.cases[ci], payloadMasses(model, sweep, ci));
        const sol = af.frame.solveStatic();
        if (!sol) {
          if (!unsolved.includes(pose)) unsolved.push(pose);
          continue;
        }
        solvedAny = true;
        if (af.memberBody.some((id) => id !== undefined)) flexible = true;
        const energy = energyByBody(af, sol);
        if (pose === poses[0] && ci === 0 && headings === turnedSets[0])
          for (const [id, n] of Object.entries(af.endNode)) {
            const u = sol.displacement(n).translation;
            const b = model.bodies.find((bb) => bb.id === id)!;
            addFigures(ctx.readouts, id, b.kind === "bar" ? "bar" : "link", [
              {
                label: "tip deflection under load",
                value: Math.hypot(u.x, u.y, u.z),
                dimension: "length",
                where: describePose(sweep, pose),
              },
            ]);
          }
        const placement = new Placement(model, pose, headings);
        for (const [pid, n] of Object.entries(af.payloadNode)) {
          const u = sol.displacement(n);
          const body = model.payloads.find((p) => p.id === pid)!.body;
          const d = Math.hypot(u.translation.x, u.translation.y, u.translation.z);
          // elastic tilt in the payload's stage plane (about its pins' axis), and lean out of it
          // (about the stage's horizontal in-plane axis)
          const normal = placement.direction(body, { x: 0, y: 0, z: 1 });
          const along = placement.direction(body, { x: 1, y: 0, z: 0 });
          const tilt = Math.abs(dot3(u.rotation, normal));
          const lean = Math.abs(dot3(u.rotation, along));
          const w = worst.get(pid) ?? {
            deflection: -1,
            deflectionCase: 0,
            deflectionHeadings: {},
            tilt: -1,
            tiltCase: 0,
            tiltHeadings: {},
            lean: -1,
            leanCase: 0,
            leanHeadings: {},
          };
          if (d > w.deflection)
            (Object.assign(w, {
              deflection: d,
              deflectionPose: pose,
              deflectionCase: ci,
              deflectionHeadings: headings,
            }),
              energyForDeflection.set(pid, energy));
          if (tilt > w.tilt) Object.assign(w, { tilt, tiltPose: pose, tiltCase: ci, tiltHeadings: headings });
          if (lean > w.lean)
            Object.assign(w, {
              lean,
              leanPose: pose,
              leanCase: ci,
              leanHeadings: headings,
              leanEnergy: energy,
            });
          worst.set(pid, w);
        }
        const modes = ci === heaviest && modeWorthy(model, headings) ? af.frame.naturalModes(1) : undefined;
        if (modes) {
          const f = Math.sqrt(modes.omega2[0]!) / (2 * Math.PI);
          const shape = modes.shapes[0]!;
          // equal frequencies (a symmetric arm at both ends of a range) keep the first pose visited,
          // whatever the solve's last digits say
          if (!lowest || f < lowest.f * (1 - SAME_FIGURE_RATIO))
            lowest = {
              f,
              pose,
              ci,
              headings,
              energy: energyByBody(af, shape),
              direction: modeDirection(af, shape),
            };
        }
      }
    }
  }
  if (unsolved.length > 0) reportUnsolved(ctx, unsolved, solvedAny);
  if (solvedAny && !flexible)
    addFigures(
      ctx.readouts,
      model.base?.bodyId ?? "arm",
      "base",
      [],
      [
        "No moving part has a section and a material, so the arm is rigid in the stiffness model: no deflection to speak of and no natural frequency.",
      ],
    );
  // the lean is a figure of arms that turn: in the drawing plane alone it is nought by symmetry
  reportPayloads(ctx, worst, energyForDeflection, turnedSets.length > 1 || loadsAcross(model));
  if (lowest) reportFrequency(ctx, lowest);
}

function baseNameSpan(model: ArmModel): Span | undefined {
  const base = model.bodies.find((b) => b.id === model.base?.bodyId);
  return base ? (base.origin.name ?? base.origin.declaration) : undefined;
}

/** Poses where the held arm is still a mechanism (a joint that nothing holds): an information
 * finding on each payload and on the frequency requirement, so that no check goes missing in
 * silence, and a note on the base. */
function reportUnsolved(ctx: CheckContext, unsolved: Pose[], solvedAny: boolean): void {
  const { model, sweep } = ctx;
  const where = describePose(sweep, unsolved[0]!);
  const more = unsolved.length > 1 ? ` and ${unsolved.length - 1} more of the poses checked` : "";
  const why = `with its degrees of freedom held the arm is still a mechanism ${where}${more} (some joint that nothing holds there)`;
  const scope = solvedAny ? "there; the figures shown cover the other poses" : "at any pose checked";
  addFigures(
    ctx.readouts,
    model.base?.bodyId ?? "arm",
    "base",
    [],
    [`${why[0]!.toUpperCase()}${why.slice(1)}: stiffness not computed ${scope}.`],
  );
  for (const p of model.payloads)
    ctx.findings.push(
      finding(
        "stiffness.not-computed",
        p.origin.name ?? p.origin.declaration,
        `deflection and tilt of payload ${p.id} not computed ${scope}: ${why}`,
        { data: { subject: p.id, payload: p.id, poses: unsolved.length } },
      ),
    );
  const frequencyOrigin = model.require.origin?.properties["frequency"];
  if (frequencyOrigin || model.payloads.length === 0)
    ctx.findings.push(
      finding(
        "stiffness.not-computed",
        frequencyOrigin ?? baseNameSpan(model) ?? model.span,
        `the lowest natural frequency not computed ${scope}: ${why}`,
        { data: { poses: unsolved.length } },
      ),
    );
}

function reportPayloads(
  ctx: CheckContext,
  worst: Map<string, PayloadWorst>,
  energies: Map<string, Map<string, number>>,
  turns: boolean,
): void {
  const { model, sweep } = ctx;
  for (const p of model.payloads) {
    const w = worst.get(p.id);
    if (!w || !w.deflectionPose || !w.tiltPose) continue;
    const head = carrierHead(model, p.body);
    const par = head ? parallelogramOfHead(model, head.id) : undefined;
    const geometric = head ? (orientationRange(sweep, head.id)?.change ?? 0) : 0;
    const totalTilt = geometric + w.tilt;
    const dLimit = model.require.deflection.byPayload[p.id] ?? model.require.deflection.default;
    const tLimit = model.require.tilt.byPayload[p.id] ?? model.require.tilt.default;
    addFigures(ctx.readouts, p.id, "payload", [
      {
        label: "deflection under load",
        value: w.deflection,
        dimension: "length",
        where: describeStation(sweep, w.deflectionPose, w.deflectionCase, w.deflectionHeadings),
        result: { key: "deflection", limit: dLimit },
      },
      {
        label: "elastic tilt",
        value: w.tilt,
        dimension: "angle",
        where: describeStation(sweep, w.tiltPose, w.tiltCase, w.tiltHeadings),
      },
      ...(turns && w.leanPose
        ? [
            {
              label: "elastic lean (sideways, out of its stage's plane)",
              value: w.lean,
              dimension: "angle" as const,
              where: describeStation(sweep, w.leanPose, w.leanCase, w.leanHeadings),
              result: { key: "lean", limit: tLimit },
            },
          ]
        : []),
      ...(head
        ? [{ label: "head orientation change over the range", value: geometric, dimension: "angle" as const }]
        : []),
      {
        label: "tilt, elastic plus head orientation change",
        value: totalTilt,
        dimension: "angle",
        result: { key: "tilt", limit: tLimit },
      },
    ]);
    const compliant = mostCompliantBody(model, energies.get(p.id) ?? new Map());
    const partSpan = compliant ? sectionSpan(model, compliant) : spanOf(p.origin, "at");
    const related = [{ span: p.origin.name ?? p.origin.declaration, message: `payload ${p.id}` }];
    if (w.deflection > dLimit)
      ctx.findings.push(
        finding(
          "stiffness.deflection",
          partSpan,
          `payload ${p.id} deflects ${show(w.deflection, "length")} under load, more than the ${show(dLimit, "length")} allowed (${describeStation(sweep, w.deflectionPose, w.deflectionCase, w.deflectionHeadings)})${compliant ? `; ${bodyWord(compliant)} gives most of it` : ""}`,
          {
            related,
            data: { subject: compliant?.id ?? p.id, payload: p.id, deflection: w.deflection, limit: dLimit },
          },
        ),
      );
    if (totalTilt > tLimit) {
      const source = tiltSource(ctx, p.id, w, geometric, par);
      ctx.findings.push(
        finding(
          "stiffness.tilt",
          source?.span ?? (par ? spanOf(par.origin, "bars") : partSpan),
          `payload ${p.id} tilts ${show(totalTilt, "angle")}, more than the ${show(tLimit, "angle")} allowed: ${show(w.tilt, "angle")} elastic (${describeStation(sweep, w.tiltPose, w.tiltCase, w.tiltHeadings)})${head ? ` plus ${show(geometric, "angle")} of head orientation change over the range` : ""}${source ? `; ${source.words}` : ""}`,
          {
            related,
            data: {
              subject: source?.subject ?? par?.id ?? compliant?.id ?? p.id,
              payload: p.id,
              tilt: totalTilt,
              elastic: w.tilt,
              geometric,
              limit: tLimit,
            },
          },
        ),
      );
    }
    if (turns && w.leanPose && w.lean > tLimit) {
      const leaner = mostCompliantBody(model, w.leanEnergy ?? new Map());
      ctx.findings.push(
        finding(
          "stiffness.lean",
          leaner ? sectionSpan(model, leaner) : partSpan,
          `payload ${p.id} leans ${show(w.lean, "angle")} sideways, out of its stage's plane, more than the ${show(tLimit, "angle")} require tilt allows (${describeStation(sweep, w.leanPose, w.leanCase, w.leanHeadings)})${leaner ? `; ${bodyWord(leaner)} gives most of it by twisting and bending sideways` : ""}`,
          {
            related,
            data: { subject: leaner?.id ?? p.id, payload: p.id, lean: w.lean, limit: tLimit },
          },
        ),
      );
    }
  }
}

/** The part that gives most of a payload's tilt: the parallelogram whose head turns over the
 * range, when that is more than any one body's share of the elastic tilt (by virtual work at the
 * pose of the worst elastic tilt, tilt-share.ts); else that body. */
function tiltSource(
  ctx: CheckContext,
  payloadId: string,
  w: PayloadWorst,
  geometric: number,
  par: Parallelogram | undefined,
): { subject: string; span: Span; words: string } | undefined {
  const { model, sweep } = ctx;
  let top: { body: Body; share: number } | undefined;
  if (w.tiltPose) {
    const shares = tiltShares(
      model,
      w.tiltPose,
      w.tiltPose.cases[w.tiltCase],
      payloadMasses(model, sweep, w.tiltCase),
      payloadId,
      w.tiltHeadings,
    );
    const sign = Math.sign(shares?.rotation ?? 0) || 1;
    for (const [id, share] of shares?.byBody ?? []) {
      const body = model.bodies.find((b) => b.id === id);
      if (body && (!top || sign * share > top.share)) top = { body, share: sign * share };
    }
  }
  if (par && geometric >= (top?.share ?? 0))
    return {
      subject: par.id,
      span: spanOf(par.origin, "bars"),
      words: `the turn of parallelogram ${par.id}'s head over the range gives most of it (unequal bars or a turning root)`,
    };
  if (!top || !(top.share > 0)) return undefined;
  return {
    subject: top.body.id,
    span: sectionSpan(model, top.body),
    words: `${bodyWord(top.body)} gives most of it (${show(top.share, "angle")} of the elastic tilt by bending and stretching)`,
  };
}

function reportFrequency(ctx: CheckContext, lowest: LowestMode): void {
  const { model, sweep } = ctx;
  const where = describeStation(sweep, lowest.pose, lowest.ci, lowest.headings);
  const ids = [model.base?.bodyId, ...model.payloads.map((p) => p.id)].filter((x): x is string => !!x);
  for (const id of ids)
    addFigures(ctx.readouts, id, id === model.base?.bodyId ? "base" : "payload", [
      {
        label: "lowest natural frequency of the arm",
        value: lowest.f,
        dimension: "frequency",
        where,
        result: { key: "frequency", arm: true, limit: model.require.frequency, atLeast: true },
      },
    ]);
  const need = model.require.frequency;
  if (lowest.f >= need) return;
  const compliant = mostCompliantBody(model, lowest.energy);
  ctx.findings.push(
    finding(
      "stiffness.low-frequency",
      compliant
        ? sectionSpan(model, compliant)
        : (model.require.origin?.properties["frequency"] ?? model.span),
      `the loaded arm's lowest natural frequency is ${show(lowest.f, "frequency")}, below the ${show(need, "frequency")} required (${where}): ${lowest.direction === "sideways" ? "it will sway sideways, out of the arm's plane," : "it will bounce"} when the tool moves${compliant ? `; ${bodyWord(compliant)} is the most flexible part in that mode` : ""}`,
      {
        related: model.require.origin?.properties["frequency"]
          ? [{ span: model.require.origin.properties["frequency"], message: "the required frequency" }]
          : [],
        data: {
          ...(compliant ? { subject: compliant.id } : {}),
          frequency: lowest.f,
          required: need,
          direction: lowest.direction,
        },
      },
    ),
  );
}
