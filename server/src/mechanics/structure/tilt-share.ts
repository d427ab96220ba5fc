// Which body gives how much of a payload's elastic tilt, by virtual work: with u the displacements
// under the arm's loads and v those under a unit moment at the payload, the payload's rotation is
// theta = v^T K u = sum over members of v_k^T K_k u_k (unit-load method; e.g. McGuire, Gallagher
// and Ziemian, Matrix Structural Analysis, 2nd ed., ch. 2), so each member's term is its share.
// The tilt is the turn about the pins' axis (z, in the arm's plane).
import type { ArmModel } from "../../model/types";
import type { Pose, PoseStatics } from "../types";
import { buildArmFrame } from "./arm-frame";
import type { SpaceFrame } from "./space-frame";
import { Placement, type Headings } from "../headings";

/** Raw node displacements of one load case (a frame solution's, or a difference of two). */
export interface Displacements {
  /** node * 6 + k: three translations then three rotations, global axes. */
  raw: ArrayLike<number>;
}

/** v_k^T K_k u_k of member `index`: its share of the work of one load case on the other's
 * displacements. */
export function elementMutualWork(
  frame: SpaceFrame,
  u: Displacements,
  v: Displacements,
  index: number,
): number {
  const m = frame.members[index]!;
  if (m.massOnly) return 0;
  const k = frame.memberStiffness(index);
  const ends = (s: Displacements) => {
    const out = new Float64Array(12);
    for (let d = 0; d < 6; d++) {
      out[d] = s.raw[m.i * 6 + d]!;
      out[6 + d] = s.raw[m.j * 6 + d]!;
    }
    return out;
  };
  const uu = ends(u);
  const vv = ends(v);
  let w = 0;
  for (let p = 0; p < 12; p++) for (let q = 0; q < 12; q++) w += vv[p]! * k[p * 12 + q]! * uu[q]!;
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
  headings: Headings = {},
): { rotation: number; byBody: Map<string, number> } | undefined {
  const loaded = buildArmFrame(model, pose, statics, payloadMass, { headings });
  const node = loaded.payloadNode[payloadId];
  const body = model.payloads.find((p) => p.id === payloadId)?.body;
  if (node === undefined || body === undefined) return undefined;
  // the tilt is the turn about the payload's pins' axis: the drawing's z turned with its swivels
  const axis = new Placement(model, pose, headings).direction(body, { x: 0, y: 0, z: 1 });
  const u = loaded.frame.solveStatic();
  if (!u) return undefined;
  // A load leaves the stiffness alone, so the second solve reuses the frame's factorisation.
  loaded.frame.addLoad(node, { x: 0, y: 0, z: 0 }, axis);
  const withMoment = loaded.frame.solveStatic();
  if (!withMoment) return undefined;
  // The frame is linear: the unit moment's own displacements are the difference of the two solves.
  const v: Displacements = { raw: withMoment.raw.map((x, d) => x - u.raw[d]!) };
  const byBody = new Map<string, number>();
  loaded.memberBody.forEach((id, k) => {
    if (!id) return;
    byBody.set(id, (byBody.get(id) ?? 0) + elementMutualWork(loaded.frame, u, v, k));
  });
  const r = u.displacement(loaded.payloadNode[payloadId]!).rotation;
  return { rotation: r.x * axis.x + r.y * axis.y + r.z * axis.z, byBody };
}
