// Where a spring's anchor would balance the arm, for the spring as it is (its rate, tension and
// hook kept): searched along rays from the pivot in the anchor's body frame (docs/tuning.md,
// "The preview"). On each ray a 1-D root search finds the distance at which the holding torque
// at the reference pose vanishes (the arm floats there); a root at which the worst hand force
// over every pose stays within a small tolerance balances exactly. For a zero-free-length spring
// on a pivot the exact points obey k a b = m g l (Streit and Gilmore 1989; Herder 2001,
// docs/formulas.md): on the vertical through the pivot, at a = m g l / (k b). Pure; bounded (a
// fixed number of rays and steps).
import type { ArmModel, Spring, Vec2 } from "../model/types";
import type { SweepResult } from "../mechanics/types";
import { HandForceMeasure } from "./evaluate";

export interface AnchorLocus {
  spring: string;
  /** The anchor's body; every point below is local to it, m. */
  body: string;
  /** The pivot the rays start from. */
  pivot: Vec2;
  /** Anchor points at which the arm balances at the reference pose, as polylines. */
  atReference: Vec2[][];
  /** Those at which it balances at every pose, within `tolerance`. */
  exact: Vec2[];
  /** Worst hand force that still counts as exact balance, N. */
  tolerance: number;
  /** How far from the pivot the rays were searched, m. */
  reach: number;
}

/** Rays from the pivot: one a degree, so that the vertical of an upright base is one of them. */
const RAYS = 360;
/** Steps of the scan for a sign change along a ray, before the root is bisected. */
const SCAN_STEPS = 48;
const BISECTIONS = 60;
/** The rays reach this many times the farther of the anchor and the hook from the pivot. */
const REACH_FACTOR = 2.5;
/** Exact balance: the worst hand force within this share of the payloads' weight, and at least
 * a millinewton (common practice, no source: well below what a hand feels). */
const EXACT_SHARE = 0.005;
const EXACT_FLOOR_N = 0.001;

/** The pivot of a spring's anchor body that the spring turns about: a joint between its two
 * bodies, else the first joint that hangs from the anchor's body, else one it hangs from. */
function pivotOf(model: ArmModel, s: Spring & { a: { body: string }; b: { body: string } }) {
  const a = s.a.body;
  const b = s.b.body;
  const direct = model.joints.find(
    (j) => (j.parent === a && j.child === b) || (j.parent === b && j.child === a),
  );
  const j = direct ?? model.joints.find((x) => x.parent === a) ?? model.joints.find((x) => x.child === a);
  if (!j) return undefined;
  return { joint: j, point: j.parent === a ? j.parentPoint : j.childPoint };
}

/** A world point in a body's local frame at a pose. */
function toLocal(frame: { x: number; y: number; phi: number }, w: Vec2): Vec2 {
  const c = Math.cos(frame.phi);
  const s = Math.sin(frame.phi);
  const dx = w.x - frame.x;
  const dy = w.y - frame.y;
  return { x: c * dx + s * dy, y: -s * dx + c * dy };
}

/** The locus of a point-to-point spring's anchor, or why there is none. `sweep` must carry the
 * bodies' velocities (solveSweep with bodyVelocities) and its reference pose. */
export function anchorLocus(
  model: ArmModel,
  sweep: SweepResult,
  spring: Spring,
): AnchorLocus | { spring: string; reason: string } {
  if (spring.kind === "torsion")
    return { spring: spring.id, reason: "a torsion spring has no anchor to move" };
  const ref = sweep.reference;
  if (!ref || sweep.poses.length === 0) return { spring: spring.id, reason: "the arm has no solved pose" };
  const payload = [...model.payloads].sort((p, q) => q.mass - p.mass)[0];
  if (!payload) return { spring: spring.id, reason: "the arm carries no payload" };
  const pivot = pivotOf(model, spring);
  if (!pivot) return { spring: spring.id, reason: `no pivot on ${spring.a.body}` };
  const frameA = ref.bodies[spring.a.body];
  const hookW = ref.springs[spring.id];
  if (!frameA || !hookW) return { spring: spring.id, reason: "the spring is not in the reference pose" };
  const hook = toLocal(frameA, hookW.b);
  const reach =
    REACH_FACTOR *
    Math.max(
      Math.hypot(spring.a.point.x - pivot.point.x, spring.a.point.y - pivot.point.y),
      Math.hypot(hook.x - pivot.point.x, hook.y - pivot.point.y),
      1e-3,
    );
  const all = new HandForceMeasure(model, sweep, [spring]);
  const atRef = new HandForceMeasure(model, { ...sweep, poses: [ref] }, [spring]);
  const movedTo = (p: Vec2): Spring => ({ ...spring, a: { ...spring.a, point: p } });
  const along = (angle: number, r: number): Vec2 => ({
    x: pivot.point.x + r * Math.cos(angle),
    y: pivot.point.y + r * Math.sin(angle),
  });
  // The torque the root is sought in: the pivot's own degree of freedom, else the one the anchor
  // moves most.
  let dof = atRef.dofIndex(sweep.dofs.find((d) => d.jointId === pivot.joint.id)?.id ?? "");
  if (dof < 0) {
    const near = atRef.holdingTorque([movedTo(pivot.point)], 0);
    const far = atRef.holdingTorque([movedTo(along(Math.PI / 2, reach))], 0);
    let most = -1;
    for (let d = 0; d < sweep.dofs.length; d++)
      if (Math.abs(far[d]! - near[d]!) > most) {
        most = Math.abs(far[d]! - near[d]!);
        dof = d;
      }
  }
  if (dof < 0) return { spring: spring.id, reason: "the arm has no degree of freedom" };
  const torque = (angle: number, r: number) => atRef.holdingTorque([movedTo(along(angle, r))], 0)[dof]!;
  const nominal = sweep.loadCases[0]?.payloadMass[payload.id] ?? payload.mass;
  const weight =
    model.gravity * model.payloads.reduce((m, p) => m + (sweep.loadCases[0]?.payloadMass[p.id] ?? p.mass), 0);
  const tolerance = Math.max(EXACT_FLOOR_N, EXACT_SHARE * weight);

  const atReference: Vec2[][] = [];
  const exact: Vec2[] = [];
  let line: Vec2[] = [];
  let last: { r: number } | undefined;
  const step = (2 * Math.PI) / RAYS;
  for (let k = 0; k < RAYS; k++) {
    const angle = k * step;
    const r = firstRoot((x) => torque(angle, x), reach);
    // A jump between neighbouring rays (a root on another branch) starts a new line.
    const joins = r !== undefined && last !== undefined && Math.abs(r - last.r) < 0.1 * reach + r * step * 4;
    if (!joins && line.length > 1) atReference.push(line);
    if (!joins) line = [];
    if (r === undefined) {
      last = undefined;
      continue;
    }
    const p = along(angle, r);
    line.push(p);
    last = { r };
    if (all.measure([movedTo(p)], { payload: payload.id, kg: nominal }).worst <= tolerance) exact.push(p);
  }
  if (line.length > 1) atReference.push(line);
  return { spring: spring.id, body: spring.a.body, pivot: pivot.point, atReference, exact, tolerance, reach };
}

/** The root of f nearest zero on (0, reach]: a scan for the first change of sign, then bisection
 * (undefined when f keeps its sign). */
function firstRoot(f: (r: number) => number, reach: number): number | undefined {
  let lo = 0;
  let flo = f(0);
  for (let i = 1; i <= SCAN_STEPS; i++) {
    const hi = (reach * i) / SCAN_STEPS;
    const fhi = f(hi);
    if (flo === 0) return lo > 0 ? lo : undefined;
    if (Math.sign(fhi) !== Math.sign(flo) && Number.isFinite(fhi) && Number.isFinite(flo)) {
      let a = lo;
      let b = hi;
      let fa = flo;
      for (let n = 0; n < BISECTIONS; n++) {
        const m = (a + b) / 2;
        const fm = f(m);
        if (fm === 0) return m;
        if (Math.sign(fm) === Math.sign(fa)) {
          a = m;
          fa = fm;
        } else b = m;
      }
      return (a + b) / 2;
    }
    lo = hi;
    flo = fhi;
  }
  return undefined;
}
