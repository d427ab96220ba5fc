// The loads acting on one body at a solved pose, in world coordinates: pin reactions, locked
// and holding torques, spring hook forces, torsion torques, payload weights and working forces.
// Self-weight is left to the caller (distributed along links). Reads the sweep's statics.
import type { ArmModel, Body, Vec2 } from "../../model/types";
import type { BodyPose, Pose, PoseStatics } from "../types";

/** A body's local point in world coordinates at a pose. */
export function worldPointOf(pose: BodyPose, local: Vec2): Vec2 {
  const c = Math.cos(pose.phi);
  const s = Math.sin(pose.phi);
  return { x: pose.x + c * local.x - s * local.y, y: pose.y + s * local.x + c * local.y };
}

export interface WorldLoad {
  point: Vec2;
  force: Vec2;
  /** Couple, N m, CCW positive. */
  couple: number;
  /** What applies it, for messages ("joint shoulder", "spring lift", "payload lamp"). */
  source: string;
}

/** Loads on `body` at `pose` under load case `caseIndex` (payload masses from `payloadMass`). */
export function loadsOnBody(model: ArmModel, pose: Pose, caseIndex: number, body: Body, payloadMass: Record<string, number>): WorldLoad[] {
  const bp = pose.bodies[body.id];
  const statics: PoseStatics | undefined = pose.cases[caseIndex];
  if (!bp || !statics) return [];
  const out: WorldLoad[] = [];
  for (const j of model.joints) {
    if (j.child !== body.id && j.parent !== body.id) continue;
    const r = statics.reactions[j.id];
    const torque = (statics.lockedTorque[j.id] ?? 0) + (statics.holdingTorque[j.id] ?? 0);
    const sign = j.child === body.id ? 1 : -1;
    const local = j.child === body.id ? j.childPoint : j.parentPoint;
    out.push({
      point: worldPointOf(bp, local),
      force: r ? { x: sign * r.x, y: sign * r.y } : { x: 0, y: 0 },
      couple: sign * torque,
      source: `joint ${j.id}`,
    });
  }
  for (const sp of model.springs) {
    const force = statics.springForce[sp.id] ?? 0;
    if (sp.kind === "torsion") {
      const j = model.joints.find((jj) => jj.id === sp.joint);
      if (!j) continue;
      // The torsion torque acts on the child (CCW positive) and back on the parent.
      if (j.child === body.id) out.push({ point: worldPointOf(bp, j.childPoint), force: { x: 0, y: 0 }, couple: force, source: `spring ${sp.id}` });
      if (j.parent === body.id) out.push({ point: worldPointOf(bp, j.parentPoint), force: { x: 0, y: 0 }, couple: -force, source: `spring ${sp.id}` });
      continue;
    }
    const st = pose.springs[sp.id];
    if (!st || !(st.length > 0)) continue;
    const ux = (st.b.x - st.a.x) / st.length;
    const uy = (st.b.y - st.a.y) / st.length;
    // tension pulls each hook toward the other
    if (sp.a.body === body.id) out.push({ point: st.a, force: { x: force * ux, y: force * uy }, couple: 0, source: `spring ${sp.id}` });
    if (sp.b.body === body.id) out.push({ point: st.b, force: { x: -force * ux, y: -force * uy }, couple: 0, source: `spring ${sp.id}` });
  }
  for (const p of model.payloads) {
    if (p.body !== body.id) continue;
    const m = payloadMass[p.id] ?? p.mass;
    out.push({
      point: worldPointOf(bp, p.point),
      force: { x: p.force?.x ?? 0, y: -m * model.gravity + (p.force?.y ?? 0) },
      couple: 0,
      source: `payload ${p.id}`,
    });
  }
  return out;
}
