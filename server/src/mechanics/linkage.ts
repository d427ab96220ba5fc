// Turns an arm model into a solvable linkage: coordinates for the bodies the base reaches, the
// reference pose, and an independent, square set of constraint rows (redundant rows dropped,
// passive joints that no loop holds are held at their angle and reported).
import type { ArmModel, Joint } from "../model/types";
import type { Dof } from "./types";
import { finding, type Finding } from "../findings/finding";
import {
  createConstraintSet,
  ROW_DRIVE,
  ROW_REVOLUTE_X,
  ROW_REVOLUTE_Y,
  type ConstraintSet,
} from "./constraints";
import { jointGraph, type JointGraph } from "./joint-graph";
import { MAX_SOLVED_BODIES } from "../limits";
import { jointBlocks } from "./joint-blocks";
import { referencePose, LOOP_ANGLE_TOLERANCE, LOOP_GAP_TOLERANCE } from "./reference-pose";
import { formatAngle, formatLength } from "./format";
import { turnedX, turnedY } from "./plane";

/** A row counts as independent of the rows kept before it when more than this fraction of it
 * is left after projecting out theirs: rows are scaled to order 1, so 1e-8 separates true
 * dependence (round-off, ~1e-14) from near-singular but real geometry. */
const RANK_TOLERANCE = 1e-8;
/** Turn of each body's angle, rad, for the generic configuration that tells a dead point from
 * true mobility: 1e-3 rad moves rows by 1e-3, far above RANK_TOLERANCE, yet keeps the pose close. */
const GENERIC_TURN = 1e-3;

export type DriveKind = "dof" | "fixed" | "hold";

export interface Linkage {
  model: ArmModel;
  graph: JointGraph;
  cs: ConstraintSet;
  /** Position of each joint's x and y rows (-1: dropped as redundant), by graph joint index. */
  revRow: Int32Array;
  /** Drive index per graph joint (-1: none). */
  driveOfJoint: Int32Array;
  driveKind: DriveKind[];
  driveJoint: number[];
  /** Row of each drive. */
  driveRow: Int32Array;
  dofs: Dof[];
  /** Drive index per dof. */
  dofDrive: Int32Array;
  qReference: Float64Array;
  /** Angles of every graph joint at the reference pose. */
  referenceAngles: Float64Array;
  /** A typical length of the arm, m (scales radians against metres). */
  lengthScale: number;
  findings: Finding[];
  /** False when the reference pose does not assemble (no sweep is possible). */
  ok: boolean;
}

function jointSpan(j: Joint) {
  return j.origin.name ?? j.origin.declaration;
}

export function armLengthScale(model: ArmModel): number {
  let l = 0;
  for (const b of model.bodies) l = Math.max(l, b.length);
  for (const p of model.parallelograms) l = Math.max(l, p.spacing, p.length);
  // Arms are decimetres; the floor keeps a model of massless stubs sensible.
  return Math.max(l, 0.05);
}

export function buildLinkage(model: ArmModel): Linkage | undefined {
  const graph = jointGraph(model);
  if (!graph) return undefined;
  const findings: Finding[] = [];
  if (graph.leftOut) findings.push(leftOutFinding(model, graph.leftOut));
  const lengthScale = armLengthScale(model);
  const ref = referencePose(graph, lengthScale);
  const nb = graph.bodyIds.length;
  const n = 3 * nb;
  const nj = graph.joints.length;

  let ok = true;
  for (const g of ref.gaps) {
    const j = graph.joints[g.joint]!;
    if (g.gap > LOOP_GAP_TOLERANCE) {
      ok = false;
      findings.push(
        finding(
          "geometry.loop-open",
          jointSpan(j),
          `The loop closed by joint ${j.id} does not meet at the reference pose: its pivots are ${formatLength(g.gap)} apart.`,
          { data: { subject: j.id, gap: g.gap } },
        ),
      );
    } else if (g.angleMismatch > LOOP_ANGLE_TOLERANCE) {
      ok = false;
      findings.push(
        finding(
          "geometry.loop-open",
          jointSpan(j),
          `The loop closed by joint ${j.id} meets only with the joint at ${formatAngle(ref.angles[g.joint]!)}, not at its angle ${formatAngle(j.angle)}.`,
          { data: { subject: j.id, gap: 0, angle: ref.angles[g.joint]! } },
        ),
      );
    }
  }

  // Candidate rows, in order of precedence: every revolute (tree joints first), then fixed
  // joints, then degrees of freedom; a later row that repeats earlier ones is dropped.
  const treeFirst = [...graph.tree.map((t) => t.joint), ...graph.closing];
  const candidates: { kind: number; joint: number; driveKind?: DriveKind }[] = [];
  for (const ji of treeFirst) {
    candidates.push({ kind: ROW_REVOLUTE_X, joint: ji }, { kind: ROW_REVOLUTE_Y, joint: ji });
  }
  for (let ji = 0; ji < nj; ji++)
    if (graph.joints[ji]!.mode === "fixed")
      candidates.push({ kind: ROW_DRIVE, joint: ji, driveKind: "fixed" });
  for (let ji = 0; ji < nj; ji++)
    if (graph.joints[ji]!.mode === "range") candidates.push({ kind: ROW_DRIVE, joint: ji, driveKind: "dof" });

  // Rows are tested for independence block by block (joint-blocks.ts): each in the coordinates of
  // its block's bodies only, so the work follows the size of the loops, not of the whole arm.
  const blocks = jointBlocks(nb, graph.parent, graph.child);
  const blockDim = blocks.bodies.map((b) => 3 * b.length);
  const rowVector = (kind: number, ji: number, q: Float64Array): Float64Array => {
    // One row of Phi_q at the reference pose, in its block's coordinates, phi columns divided by
    // the length scale and drive rows multiplied by it, so that every entry is of order 1.
    const v = new Float64Array(blockDim[blocks.blockOf[ji]!]!);
    const p = graph.parent[ji]!;
    const c = graph.child[ji]!;
    const lp = blocks.localParent[ji]!;
    const lc = blocks.localChild[ji]!;
    if (kind === ROW_DRIVE) {
      if (lc >= 0) v[3 * lc + 2]! += 1;
      if (lp >= 0) v[3 * lp + 2]! -= 1;
      return v;
    }
    const j = graph.joints[ji]!;
    const axis = kind === ROW_REVOLUTE_X ? 0 : 1;
    const put = (body: number, local: number, s: { x: number; y: number }, sign: number) => {
      if (local < 0) return;
      const phi = q[3 * body + 2]!;
      const cp = Math.cos(phi);
      const sp = Math.sin(phi);
      v[3 * local + axis]! += sign;
      // d/dphi of the rotated point's x (or y) component
      v[3 * local + 2]! +=
        (sign * (axis === 0 ? -turnedY(cp, sp, s.x, s.y) : turnedX(cp, sp, s.x, s.y))) / lengthScale;
    };
    put(p, lp, j.parentPoint, 1);
    put(c, lc, j.childPoint, -1);
    return v;
  };
  // The same rows at a slightly turned, generic configuration tell a dead point of the
  // reference pose (rows dependent only there) from true redundancy or mobility (dependent at
  // any pose).
  const generic = Float64Array.from(ref.q);
  for (let b = 0; b < nb; b++) generic[3 * b + 2]! += GENERIC_TURN * Math.sin(12.9898 * (b + 1));
  const basisRef: Float64Array[][] = blockDim.map(() => []);
  const basisGeneric: Float64Array[][] = blockDim.map(() => []);
  const full = (basis: Float64Array[][], ji: number) =>
    basis[blocks.blockOf[ji]!]!.length >= blockDim[blocks.blockOf[ji]!]!;
  /** Whether joint ji's row v0 is independent of its block's basis; if so and `keep`, it joins
   * the basis. */
  const independent = (basis: Float64Array[][], ji: number, v0: Float64Array, keep: boolean): boolean => {
    const rows = basis[blocks.blockOf[ji]!]!;
    const m = v0.length;
    const v = Float64Array.from(v0);
    const norm0 = euclidean(v);
    if (norm0 === 0) return false;
    for (let pass = 0; pass < 2; pass++) {
      for (const b of rows) {
        let d = 0;
        for (let i = 0; i < m; i++) d += v[i]! * b[i]!;
        for (let i = 0; i < m; i++) v[i]! -= d * b[i]!;
      }
    }
    const norm = euclidean(v);
    if (norm <= RANK_TOLERANCE * norm0) return false;
    if (keep) {
      for (let i = 0; i < m; i++) v[i]! /= norm;
      rows.push(v);
    }
    return true;
  };
  let deadPointAtReference = false;

  const revRow = new Int32Array(2 * nj).fill(-1);
  const driveOfJoint = new Int32Array(nj).fill(-1);
  const rows: { kind: number; ref: number }[] = [];
  const drives: { parent: number; child: number; theta: number }[] = [];
  const driveKind: DriveKind[] = [];
  const driveJoint: number[] = [];
  const addDrive = (ji: number, kind: DriveKind) => {
    driveOfJoint[ji] = drives.length;
    drives.push({ parent: graph.parent[ji]!, child: graph.child[ji]!, theta: ref.angles[ji]! });
    driveKind.push(kind);
    driveJoint.push(ji);
    rows.push({ kind: ROW_DRIVE, ref: drives.length - 1 });
  };
  for (const c of candidates) {
    const atGeneric =
      !full(basisGeneric, c.joint) &&
      independent(basisGeneric, c.joint, rowVector(c.kind, c.joint, generic), true);
    const atReference =
      !full(basisRef, c.joint) && independent(basisRef, c.joint, rowVector(c.kind, c.joint, ref.q), true);
    if (!atReference) {
      if (atGeneric) deadPointAtReference = true;
      else if (c.driveKind === "dof") findings.push(lockedDofFinding(graph.joints[c.joint]!));
      continue;
    }
    if (c.kind === ROW_DRIVE) addDrive(c.joint, c.driveKind!);
    else {
      revRow[2 * c.joint + (c.kind === ROW_REVOLUTE_X ? 0 : 1)] = rows.length;
      rows.push({ kind: c.kind, ref: c.joint });
    }
  }
  // Mobility left over: passive joints whose angle nothing determines (at any pose) are held
  // where they are.
  for (let ji = 0; ji < nj && rows.length < n; ji++) {
    const j = graph.joints[ji]!;
    if (j.mode !== "passive" || full(basisRef, ji)) continue;
    if (!independent(basisRef, ji, rowVector(ROW_DRIVE, ji, ref.q), false)) continue;
    if (!independent(basisGeneric, ji, rowVector(ROW_DRIVE, ji, generic), true)) {
      deadPointAtReference = true;
      continue;
    }
    independent(basisRef, ji, rowVector(ROW_DRIVE, ji, ref.q), true);
    addDrive(ji, "hold");
    findings.push(
      finding(
        "joint.unheld",
        jointSpan(j),
        `Joint ${j.id} is free but no closed loop holds it: give it a range or make it fixed (the analysis holds it at ${formatAngle(j.angle)}).`,
        { data: { subject: j.id } },
      ),
    );
  }
  if (rows.length < n && ok) {
    ok = false;
    const first =
      graph.joints
        .filter((j) => j.mode === "range")
        .sort((a, b) => a.origin.declaration.start - b.origin.declaration.start)[0] ?? graph.joints[0];
    findings.push(
      finding(
        "geometry.cannot-reach",
        first
          ? (first.origin.properties["range"] ?? first.origin.name ?? first.origin.declaration)
          : model.span,
        `At its reference pose the linkage sits at a dead point${deadPointAtReference ? "" : " or cannot be solved"}: its pivots line up, so it could fold either way and cannot be moved from there; choose another reference angle.`,
        { data: { ...(first ? { subject: first.id } : {}), deadPoint: true } },
      ),
    );
  }

  const revolutes = graph.joints.map((j, i) => ({
    parent: graph.parent[i]!,
    child: graph.child[i]!,
    parentPoint: j.parentPoint,
    childPoint: j.childPoint,
  }));
  const cs = createConstraintSet(nb, revolutes, drives, rows);
  // Degrees of freedom in the order the text declares them (the grid's slowest first).
  const dofDrives = driveKind.map((k, d) => (k === "dof" ? d : -1)).filter((d) => d >= 0);
  dofDrives.sort(
    (a, b) =>
      graph.joints[driveJoint[a]!]!.origin.declaration.start -
      graph.joints[driveJoint[b]!]!.origin.declaration.start,
  );
  const dofs: Dof[] = dofDrives.map((d) => {
    const j = graph.joints[driveJoint[d]!]!;
    const range: [number, number] = j.range ? [j.range[0], j.range[1]] : [j.angle, j.angle];
    return { id: j.id, jointId: j.id, range, reference: ref.angles[driveJoint[d]!]! };
  });
  const dofDrive = dofDrives;
  return {
    model,
    graph,
    cs,
    revRow,
    driveOfJoint,
    driveKind,
    driveJoint,
    driveRow: driveRows(rows, drives.length),
    dofs,
    dofDrive: Int32Array.from(dofDrive),
    qReference: ref.q,
    referenceAngles: ref.angles,
    lengthScale,
    findings,
    ok,
  };
}

/** Row of each drive (-1: none). */
function driveRows(rows: readonly { kind: number; ref: number }[], drives: number): Int32Array {
  const out = new Int32Array(drives).fill(-1);
  rows.forEach((r, i) => {
    if (r.kind === ROW_DRIVE && out[r.ref] === -1) out[r.ref] = i;
  });
  return out;
}

function euclidean(v: Float64Array): number {
  // scaled, like Math.hypot, so that no entry's square overflows or underflows
  let scale = 0;
  for (let i = 0; i < v.length; i++) scale = Math.max(scale, Math.abs(v[i]!));
  if (scale === 0 || !Number.isFinite(scale)) return scale;
  let sum = 0;
  for (let i = 0; i < v.length; i++) {
    const x = v[i]! / scale;
    sum += x * x;
  }
  return scale * Math.sqrt(sum);
}

function leftOutFinding(model: ArmModel, leftOut: { first: string; count: number }): Finding {
  const body = model.bodies.find((b) => b.id === leftOut.first);
  const others = leftOut.count - 1;
  return finding(
    "analysis.limit",
    body ? (body.origin.name ?? body.origin.declaration) : model.span,
    `The arm has more moving bodies than the ${MAX_SOLVED_BODIES} the solver takes (nearest the base first): ${leftOut.first}${others > 0 ? ` and ${others} bod${others === 1 ? "y" : "ies"} beyond it are` : " is"} left out of the sweep and of every check that needs a pose.`,
    { data: { subject: leftOut.first, limit: MAX_SOLVED_BODIES, leftOut: leftOut.count } },
  );
}

function lockedDofFinding(j: Joint): Finding {
  return finding(
    "geometry.cannot-reach",
    jointSpan(j),
    `Joint ${j.id} cannot move: the loop it is in is already held by other fixed joints or degrees of freedom, so its range is never reached.`,
    { data: { subject: j.id } },
  );
}
