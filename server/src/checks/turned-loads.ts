// The loads of an arm whose stages are turned across, from the space frame (docs/checks.md,
// "Stages turned across" and "Headings searched"): at each pose the turned pass visits
// (turnedPassPoses) and each load case, one frame solve for every heading set searched (one
// swivel at a time), reduced at once to what the strength and bearing checks read: each bar's
// largest combined stress (torsion and bending both ways) and its compression, and each pinned or
// bearing joint's load along and across its pin axis. Run once per sweep and shared by the
// strength and bearing checks.
import type { ArmModel, Body, Material } from "../model/types";
import type { Pose, SweepResult } from "../mechanics/types";
import { sectionProperties, type SectionProperties } from "../model/section";
import { loadArmFrame, type ArmStructure } from "../mechanics/structure/arm-frame";
import { structureAt } from "./frame-structures";
import { combinedStress, type CombinedStress } from "../mechanics/structure/combined-stress";
import { jointWrench, pinLoadOf, type PinLoad } from "../mechanics/structure/joint-wrench";
import { headingSets, loadsAcross, turningSwivels, type Headings } from "../mechanics/headings";
import { swivelLoads } from "../mechanics/swivel-loads";
import { representativePoses, turnedPoses } from "./stiffness";
import type { CheckContext } from "./index";
import { pastDeadline, payloadMasses } from "./part-words";

/** A bar's worst station in one frame solve. */
export interface TurnedBody {
  /** The stress its material is held to: the largest principal stress for a print, von Mises
   * for a metal, Pa. */
  stress: number;
  at: CombinedStress;
  /** Largest compression along it, N (0 in tension). */
  compression: number;
}

/** One frame solve: a pose, a load case and the swivels' headings. */
export interface TurnedVisit {
  headings: Headings;
  bodies: Map<string, TurnedBody>;
  /** Joints with a pin or a bearing whose load the frame tells apart (joint-wrench.ts). */
  joints: Map<string, PinLoad>;
}

/** The visits at one pose and load case: the level to compare against (every heading at 0 and,
 * with working loads across the plane, those left out) and the heading sets searched. */
export interface TurnedGroup {
  pose: Pose;
  caseIndex: number;
  level: TurnedVisit;
  turned: TurnedVisit[];
}

interface BodyTable {
  body: Body;
  sec: SectionProperties;
  mat: Material;
  round: boolean;
}

const cache = new WeakMap<SweepResult, TurnedGroup[]>();

/** Whether the arm has anything for the turned pass to find: a swivel between stages, or a working
 * load across the drawing plane. */
export function hasTurnedLoads(model: ArmModel, quick: boolean): boolean {
  return headingSets(model, quick).length > 1 || loadsAcross(model);
}

/** Poses within this share of a swivel's largest tilting moment count as its peak (a level head
 * carries the same moment at every angle of the stages below it; round-off and a slightly leaning
 * axis make them differ a little). */
const PEAK_SHARE = 1e-3;
/** Peak poses visited per swivel at most, spread evenly over them (both ends kept). */
export const MAX_PEAK_POSES = 12;
/** The same while typing, when the headings are thinned too: the two ends of each swivel's peak
 * poses and the one between. Without them the quick pass missed what the turned stage does to
 * the pins below it (the two-stage sample's two pin errors vanished while typing). */
export const QUICK_PEAK_POSES = 3;

/** The poses the turned pass visits (docs/checks.md, "Which poses each check visits"): the
 * stiffness check's representative poses (the reference and the ends of each range), and for each
 * swivel between stages the poses where the wrench it passes on tilts most (its tilting moment by
 * statics, every pose and load case; at most MAX_PEAK_POSES of them). What a turned stage puts into
 * the parts below it is that wrench turned about the vertical, carried linearly by parts whose
 * stiffness no heading changes, so at any posture of the stages below, their stress with the stage
 * turned is largest where the wrench is; the peak poses take every posture of the stages below at
 * the carried stages' worst. While typing, the representative pose that reaches farthest and the
 * peak poses (at most QUICK_PEAK_POSES a swivel). */
export function turnedPassPoses(model: ArmModel, sweep: SweepResult): Pose[] {
  const poses = representativePoses(sweep);
  const out = sweep.quick ? turnedPoses(poses).slice(-1) : [...poses];
  for (const p of peakPoses(model, sweep, sweep.quick ? QUICK_PEAK_POSES : MAX_PEAK_POSES))
    if (!out.includes(p)) out.push(p);
  return out;
}

/** For each swivel between stages, the poses where the wrench it passes on tilts most (its
 * tilting moment by statics, every pose and load case), at most `most` a swivel, spread evenly
 * over them with both ends kept. */
function peakPoses(model: ArmModel, sweep: SweepResult, most: number): Pose[] {
  const swivels = turningSwivels(model);
  if (swivels.length === 0) return [];
  const cases = Math.max(1, sweep.loadCases.length);
  const masses = Array.from({ length: cases }, (_, ci) => payloadMasses(model, sweep, ci));
  const tilt = new Map(swivels.map(({ swivel }) => [swivel.id, new Float64Array(sweep.poses.length)]));
  sweep.poses.forEach((pose, k) => {
    for (const m of masses)
      for (const [id, l] of Object.entries(swivelLoads(model, pose, m))) {
        const t = tilt.get(id);
        if (t && l.moment > t[k]!) t[k] = l.moment;
      }
  });
  const out: Pose[] = [];
  for (const t of tilt.values()) {
    const top = Math.max(...t);
    if (!(top > 0)) continue;
    const peak = sweep.poses.filter((_, k) => t[k]! >= top * (1 - PEAK_SHARE));
    const step = peak.length <= most ? 1 : (peak.length - 1) / Math.max(1, most - 1);
    for (let i = 0; i < Math.min(peak.length, most); i++) {
      const p = peak[Math.round(i * step)]!;
      if (!out.includes(p)) out.push(p);
    }
  }
  return out;
}

/** The turned pass's groups, computed on first use for this sweep; empty for an arm with nothing
 * turned across. Stops at the analysis deadline with what it has. */
export function turnedLoads(ctx: CheckContext): TurnedGroup[] {
  const known = cache.get(ctx.sweep);
  if (known) return known;
  const groups: TurnedGroup[] = [];
  cache.set(ctx.sweep, groups);
  if (!hasTurnedLoads(ctx.model, ctx.sweep.quick === true)) return groups;
  turnedLoadsAt(ctx, turnedPassPoses(ctx.model, ctx.sweep), groups);
  return groups;
}

/** The turned pass at the given poses, into `groups` (the bench times it at every pose). */
export function turnedLoadsAt(
  ctx: CheckContext,
  poses: readonly Pose[],
  groups: TurnedGroup[] = [],
): TurnedGroup[] {
  const { model, sweep } = ctx;
  const quick = sweep.quick === true;
  const sets = headingSets(model, quick);
  const across = loadsAcross(model);
  const tables = new Map<string, BodyTable>();
  for (const b of model.bodies) {
    const mat = b.material ? model.materials[b.material] : undefined;
    if ((b.kind !== "link" && b.kind !== "bar") || !b.section || !mat || !(b.length > 0)) continue;
    tables.set(b.id, { body: b, sec: sectionProperties(b.section), mat, round: b.section.shape !== "rect" });
  }
  const jointIds = model.joints.filter((j) => j.pin || j.bearing).map((j) => j.id);
  // the level: every heading at 0 and, with working forces across the plane, those left out
  const runs: { headings: Headings; inPlane: boolean }[] = [
    ...(across ? [{ headings: {}, inPlane: true }] : []),
    ...sets.map((headings) => ({ headings, inPlane: false })),
  ];
  for (const pose of poses) {
    // each run's frame at this pose, shared by the load cases (they differ in loads only)
    const structures: ArmStructure[] = [];
    for (let ci = 0; ci < Math.max(1, pose.cases.length); ci++) {
      if (pastDeadline(ctx.options.deadline)) return groups;
      const masses = payloadMasses(model, sweep, ci);
      const visits: TurnedVisit[] = [];
      for (let ri = 0; ri < runs.length; ri++) {
        const run = runs[ri]!;
        const structure = (structures[ri] ??= structureAt(ctx, pose, run.headings));
        const af = loadArmFrame(model, structure, pose.cases[ci], masses, { inPlaneLoadsOnly: run.inPlane });
        const sol = af.frame.solveStatic();
        if (!sol) break;
        const bodies = new Map<string, TurnedBody>();
        af.memberBody.forEach((id, m) => {
          const t = id ? tables.get(id) : undefined;
          if (!t) return;
          const f = sol.endForces(m);
          for (const e of [f.i, f.j]) {
            const c = combinedStress(t.sec, t.round, {
              axial: e.fx,
              torque: e.mx,
              momentInPlane: e.mz,
              momentAcross: e.my,
            });
            const stress = t.mat.printed ? c.principal : c.vonMises;
            // end forces as the nodes exert them on the member: fx at i > 0 pushes it together
            const compression = Math.max(0, e === f.i ? e.fx : -e.fx);
            const prev = bodies.get(t.body.id);
            if (!prev) bodies.set(t.body.id, { stress, at: c, compression });
            else {
              if (stress > prev.stress) ((prev.stress = stress), (prev.at = c));
              if (compression > prev.compression) prev.compression = compression;
            }
          }
        });
        const joints = new Map<string, PinLoad>();
        for (const id of jointIds) {
          const w = jointWrench(af, sol, id);
          if (w) joints.set(id, pinLoadOf(w));
        }
        visits.push({ headings: run.headings, bodies, joints });
      }
      if (visits.length < 2) continue;
      groups.push({ pose, caseIndex: ci, level: visits[0]!, turned: visits.slice(1) });
    }
  }
  return groups;
}

/** Whether a turned figure is worse than the level's: beyond the frame's own round-off, so that
 * small departures of the frame from the statics do not pass for an effect of turning. */
export function worseThanLevel(turned: number, level: number | undefined): boolean {
  return turned > (level ?? 0) * (1 + 1e-9);
}
