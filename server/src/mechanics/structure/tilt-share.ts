// Which body gives how much of a payload's elastic tilt, by virtual work: with u the displacements
// under the arm's loads and v those under a unit moment at the payload, the payload's rotation is
// theta = v^T K u = sum over elements of v_k^T K_k u_k (unit-load method; e.g. McGuire, Gallagher
// and Ziemian, Matrix Structural Analysis, 2nd ed., ch. 2), so each element's term is its share.
import type { ArmModel } from "../../model/types";
import type { Pose, PoseStatics } from "../types";
import { buildArmFrame } from "./arm-frame";
import type { FrameSolution, PlaneFrame } from "./frame";

/** Node displacements of one load case (a frame solution, or a difference of two). */
export type Displacements = Pick<FrameSolution, "displacement">;

/** v_k^T K_k u_k of element `index`: its share of the work of one load case on the other's
 * displacements. */
export function elementMutualWork(
  frame: PlaneFrame,
  u: Displacements,
  v: Displacements,
  index: number,
): number {
  const e = frame.elements[index]!;
  const k = frame.elementStiffness(e);
  const ends = (s: Displacements) => {
    const a = s.displacement(e.i);
    const b = s.displacement(e.j);
    return [a.ux, a.uy, a.rotation, b.ux, b.uy, b.rotation];
  };
  const uu = ends(u);
  const vv = ends(v);
  let w = 0;
  for (let p = 0; p < 6; p++) for (let q = 0; q < 6; q++) w += vv[p]! * k[p * 6 + q]! * uu[q]!;
  return w;
}

/** Each body's share of the payload's elastic rotation at a pose, rad (signed like the rotation:
 * the shares of bodies and springs add up to it), and the rotation itself. Undefined when the
 * frame is a mechanism or the payload has no node. */
export function tiltShares(
  model: ArmModel,
  pose: Pose,
  statics: PoseStatics | undefined,
  payloadMass: Record<string, number>,
  payloadId: string,
): { rotation: number; byBody: Map<string, number> } | undefined {
  const loaded = buildArmFrame(model, pose, statics, payloadMass);
  const probe = buildArmFrame(model, pose, statics, payloadMass);
  const node = probe.payloadNode[payloadId];
  if (node === undefined) return undefined;
  const u = loaded.frame.solveStatic();
  const base = probe.frame.solveStatic();
  probe.frame.addLoad(node, 0, 0, 1);
  const withMoment = probe.frame.solveStatic();
  if (!u || !base || !withMoment) return undefined;
  // The frame is linear: the unit moment's own displacements are the difference of the two solves.
  const v: Displacements = {
    displacement: (n) => {
      const a = withMoment.displacement(n);
      const b = base.displacement(n);
      return { ux: a.ux - b.ux, uy: a.uy - b.uy, rotation: a.rotation - b.rotation };
    },
  };
  const byBody = new Map<string, number>();
  loaded.elementBody.forEach((id, k) => {
    if (!id) return;
    byBody.set(id, (byBody.get(id) ?? 0) + elementMutualWork(loaded.frame, u, v, k));
  });
  return { rotation: u.displacement(loaded.payloadNode[payloadId]!).rotation, byBody };
}
