// What the drawing shows of a tune run (docs/tuning.md, "The preview"): each tuned spring's ends
// in the present design and as tuned, what changes in words, the hand force at every pose of
// both designs, and for each tuned spring in each design the anchor points that balance the arm
// (locus.ts). Built once, when the user asked for a search; the view lays it over the drawing of
// whichever of the two texts the editor holds. Pure.
import type { ArmModel, Spring } from "../model/types";
import type { SweepResult } from "../mechanics/types";
import { solveSweep } from "../mechanics/sweep";
import { signedHandForce } from "../mechanics/hand-force";
import { anchorLocus, type AnchorLocus } from "./locus";
import type { TuneAnalysis, TuneResult } from "./index";

export interface PreviewEnd {
  body: string;
  local: [number, number];
}

export interface PreviewSpring {
  id: string;
  kind: Spring["kind"];
  /** Ends in the present design and as tuned (absent for a spring at a joint). */
  present?: [PreviewEnd, PreviewEnd];
  tuned?: [PreviewEnd, PreviewEnd];
  /** What changes, as the file would have it: `rate 0.5 N/mm -> 0.7845 N/mm`. */
  changes: string[];
}

/** One design's hand force at a pose: the dofs' angles (rad, by dof id) and the nominal case's
 * signed hand force beyond friction per payload, N (as the drawing's hand-force plot has it). */
export interface PreviewPose {
  angles: Record<string, number>;
  handForce: Record<string, number>;
}

export interface PreviewLocus {
  spring: string;
  body: string;
  pivot: [number, number];
  atReference: [number, number][][];
  exact: [number, number][];
  tolerance: number;
  /** Why there is none (a torsion spring, no pivot on the anchor's body, ...). */
  reason?: string;
}

export interface TunePreview {
  springs: PreviewSpring[];
  worstBefore?: number;
  worstAfter?: number;
  present: { poses: PreviewPose[]; locus: PreviewLocus[] };
  tuned: { poses: PreviewPose[]; locus: PreviewLocus[] };
}

/** Steps per degree of freedom of the locus's own sweep (as the search's). */
const LOCUS_STEPS = 19;

function endsOf(s: Spring): [PreviewEnd, PreviewEnd] | undefined {
  if (s.kind === "torsion") return undefined;
  return [
    { body: s.a.body, local: [s.a.point.x, s.a.point.y] },
    { body: s.b.body, local: [s.b.point.x, s.b.point.y] },
  ];
}

function posesOf(sweep: SweepResult | undefined, model: ArmModel): PreviewPose[] {
  if (!sweep) return [];
  return sweep.poses.map((pose) => {
    const c = pose.cases[0];
    const handForce: Record<string, number> = {};
    for (const p of model.payloads) {
      const v = c?.handForceVector?.[p.id];
      handForce[p.id] = v ? signedHandForce(v) : (c?.handForce[p.id] ?? NaN);
    }
    return { angles: { ...pose.angles }, handForce };
  });
}

function loci(model: ArmModel, ids: readonly string[], deadline: number): PreviewLocus[] {
  const springs = ids
    .map((id) => model.springs.find((s) => s.id === id))
    .filter((s): s is Spring => s !== undefined && s.kind !== "torsion");
  if (springs.length === 0) return [];
  const sweep = solveSweep(model, { quickSteps: LOCUS_STEPS, bodyVelocities: true, deadline });
  return springs.map((s) => {
    const l = anchorLocus(model, sweep, s);
    if ("reason" in l)
      return {
        spring: s.id,
        body: s.kind === "torsion" ? "" : s.a.body,
        pivot: [0, 0],
        atReference: [],
        exact: [],
        tolerance: 0,
        reason: l.reason,
      };
    return locusOut(l);
  });
}

function locusOut(l: AnchorLocus): PreviewLocus {
  const xy = (p: { x: number; y: number }): [number, number] => [p.x, p.y];
  return {
    spring: l.spring,
    body: l.body,
    pivot: xy(l.pivot),
    atReference: l.atReference.map((line) => line.map(xy)),
    exact: l.exact.map(xy),
    tolerance: l.tolerance,
  };
}

/** The preview of a tune run that found a better design (undefined otherwise). */
export function tunePreview(
  before: TuneAnalysis,
  result: TuneResult,
  options: { deadline?: number } = {},
): TunePreview | undefined {
  const deadline = options.deadline ?? Infinity;
  const after = result.after;
  if (!result.improved || !after?.model || !before.model) return undefined;
  const ids = result.springs.map((s) => s.id);
  const springs: PreviewSpring[] = result.springs.map((t) => {
    const was = before.model!.springs.find((s) => s.id === t.id);
    const now = after.model!.springs.find((s) => s.id === t.id);
    const seen = new Set<string>();
    const changes = t.values
      .filter((v) => !seen.has(v.what) && seen.add(v.what))
      .map((v) => `${v.what} ${v.text}`);
    const present = was && endsOf(was);
    const tuned = now && endsOf(now);
    return {
      id: t.id,
      kind: (now ?? was)!.kind,
      ...(present ? { present } : {}),
      ...(tuned ? { tuned } : {}),
      changes,
    };
  });
  return {
    springs,
    ...(result.worstBefore !== undefined ? { worstBefore: result.worstBefore } : {}),
    ...(result.worstAfter !== undefined ? { worstAfter: result.worstAfter } : {}),
    present: { poses: posesOf(before.sweep, before.model), locus: loci(before.model, ids, deadline) },
    tuned: { poses: posesOf(after.sweep, after.model), locus: loci(after.model, ids, deadline) },
  };
}
