// Constraint equations of the planar linkage in absolute coordinates q = (x, y, phi) per moving
// body, and their analytic Jacobian (Nikravesh 1988, ch. 3; Haug 1989, ch. 3). The base is
// fixed (index -1: x = y = phi = 0, local frame = world).
import { worldX, worldY } from "./plane";

/** Row kinds: the x and y components of a revolute joint, or a driving constraint. */
export const ROW_REVOLUTE_X = 0;
export const ROW_REVOLUTE_Y = 1;
export const ROW_DRIVE = 2;

/** The selected, independent constraint rows of a linkage (as many as coordinates). */
export interface ConstraintSet {
  /** Coordinates = equations = 3 x moving bodies. */
  n: number;
  bodyCount: number;
  /** Revolute joints: parent and child body indices (-1 base) and local pivot points. */
  revParent: Int32Array;
  revChild: Int32Array;
  revParentPoint: Float64Array; // x, y per joint
  revChildPoint: Float64Array;
  /** Driving constraints phi_child - phi_parent - theta = 0. */
  driveParent: Int32Array;
  driveChild: Int32Array;
  driveTheta: Float64Array;
  /** Per row: its kind and the revolute or drive it belongs to. */
  rowKind: Uint8Array;
  rowRef: Int32Array;
  /** cos and sin of each body's phi at the last evaluation. */
  cos: Float64Array;
  sin: Float64Array;
}

export function createConstraintSet(
  bodyCount: number,
  revolutes: {
    parent: number;
    child: number;
    parentPoint: { x: number; y: number };
    childPoint: { x: number; y: number };
  }[],
  drives: { parent: number; child: number; theta: number }[],
  rows: { kind: number; ref: number }[],
): ConstraintSet {
  const cs: ConstraintSet = {
    n: bodyCount * 3,
    bodyCount,
    revParent: Int32Array.from(revolutes, (r) => r.parent),
    revChild: Int32Array.from(revolutes, (r) => r.child),
    revParentPoint: Float64Array.from(revolutes.flatMap((r) => [r.parentPoint.x, r.parentPoint.y])),
    revChildPoint: Float64Array.from(revolutes.flatMap((r) => [r.childPoint.x, r.childPoint.y])),
    driveParent: Int32Array.from(drives, (d) => d.parent),
    driveChild: Int32Array.from(drives, (d) => d.child),
    driveTheta: Float64Array.from(drives, (d) => d.theta),
    rowKind: Uint8Array.from(rows, (r) => r.kind),
    rowRef: Int32Array.from(rows, (r) => r.ref),
    cos: new Float64Array(bodyCount),
    sin: new Float64Array(bodyCount),
  };
  return cs;
}

/** Caches cos and sin of every body's angle. */
export function updateAngles(cs: ConstraintSet, q: Float64Array): void {
  for (let b = 0; b < cs.bodyCount; b++) {
    const phi = q[3 * b + 2]!;
    cs.cos[b] = Math.cos(phi);
    cs.sin[b] = Math.sin(phi);
  }
}

/** Phi(q) into `out`; returns the largest |Phi_i|. Calls updateAngles. */
export function constraintResidual(cs: ConstraintSet, q: Float64Array, out: Float64Array): number {
  updateAngles(cs, q);
  const rows = cs.rowKind.length;
  let worst = 0;
  for (let r = 0; r < rows; r++) {
    const k = cs.rowKind[r]!;
    const j = cs.rowRef[r]!;
    let v: number;
    if (k === ROW_DRIVE) {
      const p = cs.driveParent[j]!;
      const c = cs.driveChild[j]!;
      v = (c >= 0 ? q[3 * c + 2]! : 0) - (p >= 0 ? q[3 * p + 2]! : 0) - cs.driveTheta[j]!;
    } else {
      const p = cs.revParent[j]!;
      const c = cs.revChild[j]!;
      const spx = cs.revParentPoint[2 * j]!;
      const spy = cs.revParentPoint[2 * j + 1]!;
      const scx = cs.revChildPoint[2 * j]!;
      const scy = cs.revChildPoint[2 * j + 1]!;
      let wp: number;
      let wc: number;
      if (k === ROW_REVOLUTE_X) {
        wp = p >= 0 ? worldX(q[3 * p]!, cs.cos[p]!, cs.sin[p]!, spx, spy) : spx;
        wc = c >= 0 ? worldX(q[3 * c]!, cs.cos[c]!, cs.sin[c]!, scx, scy) : scx;
      } else {
        wp = p >= 0 ? worldY(q[3 * p + 1]!, cs.cos[p]!, cs.sin[p]!, spx, spy) : spy;
        wc = c >= 0 ? worldY(q[3 * c + 1]!, cs.cos[c]!, cs.sin[c]!, scx, scy) : scy;
      }
      v = wp - wc;
    }
    out[r] = v;
    const a = Math.abs(v);
    if (a > worst || Number.isNaN(v)) worst = Number.isNaN(v) ? Infinity : a;
  }
  return worst;
}

/** The constraint Jacobian in compressed columns (sparse-lu.ts): its pattern is fixed by the
 * joints, so it is worked out once per linkage and only the values change from pose to pose.
 * Each row holds at most four entries (two per body). */
export interface SparseJacobian {
  n: number;
  colStart: Int32Array;
  rowIndex: Int32Array;
  values: Float64Array;
  /** Where each row's entries go in `values`: four slots per row (-1: none). */
  slot: Int32Array;
}

/** Columns of a row's entries, four per row (-1: none), in the order constraintJacobianInto
 * writes them: the parent's translation, the parent's turn, the child's translation, the child's
 * turn. */
function rowColumns(cs: ConstraintSet, r: number, out: Int32Array): void {
  const k = cs.rowKind[r]!;
  const j = cs.rowRef[r]!;
  out.fill(-1);
  if (k === ROW_DRIVE) {
    const p = cs.driveParent[j]!;
    const c = cs.driveChild[j]!;
    if (p >= 0) out[1] = 3 * p + 2;
    if (c >= 0) out[3] = 3 * c + 2;
    return;
  }
  const p = cs.revParent[j]!;
  const c = cs.revChild[j]!;
  const axis = k === ROW_REVOLUTE_X ? 0 : 1;
  if (p >= 0) {
    out[0] = 3 * p + axis;
    out[1] = 3 * p + 2;
  }
  if (c >= 0) {
    out[2] = 3 * c + axis;
    out[3] = 3 * c + 2;
  }
}

export function sparseJacobian(cs: ConstraintSet): SparseJacobian {
  const n = cs.n;
  const rows = cs.rowKind.length;
  const cols = new Int32Array(4);
  // Entries per column, then the rows of each column in ascending order.
  const byColumn: number[][] = Array.from({ length: n }, () => []);
  for (let r = 0; r < rows; r++) {
    rowColumns(cs, r, cols);
    for (const c of cols) if (c >= 0 && !byColumn[c]!.includes(r)) byColumn[c]!.push(r);
  }
  const colStart = new Int32Array(n + 1);
  for (let c = 0; c < n; c++) colStart[c + 1] = colStart[c]! + byColumn[c]!.length;
  const rowIndex = new Int32Array(colStart[n]!);
  for (let c = 0; c < n; c++)
    rowIndex.set(
      byColumn[c]!.sort((a, b) => a - b),
      colStart[c]!,
    );
  const slot = new Int32Array(4 * rows).fill(-1);
  for (let r = 0; r < rows; r++) {
    rowColumns(cs, r, cols);
    for (let m = 0; m < 4; m++) {
      const c = cols[m]!;
      if (c < 0) continue;
      let p = colStart[c]!;
      while (rowIndex[p] !== r) p++;
      slot[4 * r + m] = p;
    }
  }
  return { n, colStart, rowIndex, values: new Float64Array(rowIndex.length), slot };
}

/** Phi_q into `jac.values` at the angles cached by the last
 * updateAngles/constraintResidual. */
export function constraintJacobianInto(cs: ConstraintSet, jac: SparseJacobian): void {
  const v = jac.values;
  const slot = jac.slot;
  v.fill(0);
  const rows = cs.rowKind.length;
  const add = (s: number, value: number) => {
    if (s >= 0) v[s]! += value;
  };
  for (let r = 0; r < rows; r++) {
    const k = cs.rowKind[r]!;
    const j = cs.rowRef[r]!;
    const o = 4 * r;
    if (k === ROW_DRIVE) {
      add(slot[o + 3]!, 1);
      add(slot[o + 1]!, -1);
      continue;
    }
    const p = cs.revParent[j]!;
    const c = cs.revChild[j]!;
    const spx = cs.revParentPoint[2 * j]!;
    const spy = cs.revParentPoint[2 * j + 1]!;
    const scx = cs.revChildPoint[2 * j]!;
    const scy = cs.revChildPoint[2 * j + 1]!;
    if (k === ROW_REVOLUTE_X) {
      if (p >= 0) {
        add(slot[o]!, 1);
        add(slot[o + 1]!, -cs.sin[p]! * spx - cs.cos[p]! * spy);
      }
      if (c >= 0) {
        add(slot[o + 2]!, -1);
        add(slot[o + 3]!, -(-cs.sin[c]! * scx - cs.cos[c]! * scy));
      }
    } else {
      if (p >= 0) {
        add(slot[o]!, 1);
        add(slot[o + 1]!, cs.cos[p]! * spx - cs.sin[p]! * spy);
      }
      if (c >= 0) {
        add(slot[o + 2]!, -1);
        add(slot[o + 3]!, -(cs.cos[c]! * scx - cs.sin[c]! * scy));
      }
    }
  }
}
