// The hand force at a payload: the least force at its centre that holds the pose. With the
// payload's Jacobian J (columns dp/dtheta per degree of freedom) the force must satisfy
// J^T F = tau (the holding torques). Rule: the least-squares, least-norm solution
// F = pinv(J^T) tau = (J J^T)^+ J tau. One dof: |F| = |tau| / |dp/dtheta|. Two dofs that move the
// payload independently: the exact solution. A dof that does not move the payload cannot be held
// from it: that share of its torque is not counted here (the holding torque readouts show it).
// Near a straight arm the payload's two motions fall on one line and the exact force grows
// without bound (a push at the tip cannot stop an elbow folding); there the weak direction is
// damped (its eigenvalue of J J^T floored), so the figure stays a measure of effort. Several
// payloads: each one's hand force is computed alone, as if the hand held the arm only there.
// Friction: a pivot's friction holds up to its torque either way, so the hand supplies only the
// holding torque beyond it (torqueBeyondFriction), and the hand force is signed by whether the
// arm sinks (the hand lifts: positive) or rises (the hand pushes down: negative).
import type { Vec2 } from "../model/types";

/** Eigenvalues of J J^T below this fraction of the largest count as zero: directions in which
 * the payload does not move at all (round-off) hold nothing. */
export const HAND_FORCE_PINV_TOLERANCE = 1e-12;
/** Floor of the weak eigenvalue of J J^T, as a fraction of the strong one: 0.01 (singular values
 * 1 : 0.1, the payload's two motions within about 6 deg of one line for equal stages). Below it
 * the weak direction is damped (damped least squares as in robot arm control near singular
 * poses, Wampler, IEEE Trans. SMC 16, 1986), so the push along a nearly straight arm stays
 * finite; above it the force is exact. Common practice, the value has no source. */
export const HAND_FORCE_DAMPING_FLOOR = 0.01;

export function handForceVector(
  jacobian: ArrayLike<number>,
  holdingTorque: ArrayLike<number>,
  dofCount: number,
): Vec2 {
  let a = 0;
  let b = 0;
  let c = 0;
  let vx = 0;
  let vy = 0;
  for (let d = 0; d < dofCount; d++) {
    const jx = jacobian[2 * d]!;
    const jy = jacobian[2 * d + 1]!;
    const t = holdingTorque[d]!;
    a += jx * jx;
    b += jx * jy;
    c += jy * jy;
    vx += jx * t;
    vy += jy * t;
  }
  const half = (a + c) / 2;
  const disc = Math.hypot((a - c) / 2, b);
  const l1 = half + disc;
  const l2 = half - disc;
  if (!(l1 > 0)) return { x: 0, y: 0 };
  let e1x: number;
  let e1y: number;
  if (b !== 0) {
    e1x = l1 - c;
    e1y = b;
    const m = Math.hypot(e1x, e1y);
    e1x /= m;
    e1y /= m;
  } else if (a >= c) {
    e1x = 1;
    e1y = 0;
  } else {
    e1x = 0;
    e1y = 1;
  }
  const e2x = -e1y;
  const e2y = e1x;
  const p1 = (e1x * vx + e1y * vy) / l1;
  let fx = p1 * e1x;
  let fy = p1 * e1y;
  if (l2 > HAND_FORCE_PINV_TOLERANCE * l1) {
    const p2 = (e2x * vx + e2y * vy) / Math.max(l2, HAND_FORCE_DAMPING_FLOOR * l1);
    fx += p2 * e2x;
    fy += p2 * e2y;
  }
  return { x: fx, y: fy };
}

/** The part of each dof's holding torque that its pivot's friction does not hold:
 * sign(tau) max(0, |tau| - friction) (friction holds up to its torque in either direction). */
export function torqueBeyondFriction(
  holdingTorque: ArrayLike<number>,
  friction: ArrayLike<number>,
  out: Float64Array,
  dofCount: number,
): Float64Array {
  for (let d = 0; d < dofCount; d++) {
    const t = holdingTorque[d]!;
    const f = friction[d]!;
    out[d] = t > f ? t - f : t < -f ? t + f : 0;
  }
  return out;
}

/** The hand force signed by what the arm does without it: positive where it sinks (the hand
 * lifts, the force points up), negative where it rises; its size is |F|. */
export function signedHandForce(vector: Vec2): number {
  const size = Math.hypot(vector.x, vector.y);
  return vector.y < 0 ? -size : size;
}
