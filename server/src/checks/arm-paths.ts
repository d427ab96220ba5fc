// Paths through the joint tree for the geometry and stiffness checks: the joint that places each
// body, the pivot a spring works about, the parallelogram head that carries a payload.
import type { ArmModel, Body, Joint } from "../model/types";

const MODE_ORDER: Record<Joint["mode"], number> = { range: 0, fixed: 1, passive: 2 };

/** The joint that places `bodyId` on its way from the base: a degree of freedom or a fixed joint
 * before a passive one (a parallelogram head hangs on its lower bar's far pivot first). */
export function placingJoint(model: ArmModel, bodyId: string): Joint | undefined {
  let best: Joint | undefined;
  for (const j of model.joints) {
    if (j.child !== bodyId) continue;
    if (!best || MODE_ORDER[j.mode] < MODE_ORDER[best.mode]) best = j;
  }
  return best;
}

/** The placing joint of every body that has one, by body id: one pass over the joints, for
 * callers that walk many bodies' chains (placingJoint scans every joint each time). */
export function placingJoints(model: ArmModel): Map<string, Joint> {
  const out = new Map<string, Joint>();
  for (const j of model.joints) {
    const best = out.get(j.child);
    if (!best || MODE_ORDER[j.mode] < MODE_ORDER[best.mode]) out.set(j.child, j);
  }
  return out;
}

/** Joints from `bodyId` back to the base, nearest first (stops on a cycle or a missing link).
 * `placing`: placingJoints(model), when the caller walks many chains. */
export function chainToBase(model: ArmModel, bodyId: string, placing?: Map<string, Joint>): Joint[] {
  const out: Joint[] = [];
  const seen = new Set<string>([bodyId]);
  let id = bodyId;
  for (;;) {
    const j = placing ? placing.get(id) : placingJoint(model, id);
    if (!j || seen.has(j.parent)) return out;
    out.push(j);
    seen.add(j.parent);
    id = j.parent;
  }
}

/** Joints on the chain between two bodies (each one's chain to their common ancestor). */
export function jointsBetween(model: ArmModel, a: string, b: string): Joint[] {
  const ca = chainToBase(model, a);
  const cb = chainToBase(model, b);
  const inB = new Set(cb.map((j) => j.id));
  const inA = new Set(ca.map((j) => j.id));
  return [...ca.filter((j) => !inB.has(j.id)), ...cb.filter((j) => !inA.has(j.id))];
}

/** The parallelogram head a body hangs from (itself if it is one), if any. */
export function carrierHead(model: ArmModel, bodyId: string): Body | undefined {
  const byId = new Map(model.bodies.map((b) => [b.id, b]));
  if (byId.get(bodyId)?.kind === "head") return byId.get(bodyId);
  for (const j of chainToBase(model, bodyId))
    if (byId.get(j.parent)?.kind === "head") return byId.get(j.parent);
  return undefined;
}

/** The parallelogram whose head is `headId`. */
export function parallelogramOfHead(model: ArmModel, headId: string) {
  return model.parallelograms.find((p) => p.bodies.head === headId);
}
