// How a ball bearing shares its load among its balls: Stribeck's most loaded ball under a radial
// load, even sharing under a centred thrust, and a thrust ring tilted by a moment (rigid rings,
// Hertz point contacts). Harris, Rolling Bearing Analysis (4th ed., 2001), ch. 7. SI.

/** Stribeck's factor: the most loaded ball of a radial ball bearing carries about 5 Fr / Z. The
 * exact figure for rigid rings without clearance is 4.37; Stribeck took 5 to allow for clearance
 * (Harris ch. 7). */
export const STRIBECK_FACTOR = 5;

/** Most loaded ball under a radial load Fr on Z balls, N (Stribeck). */
export function radialBallLoad(radialForce: number, balls: number): number {
  return (STRIBECK_FACTOR * Math.abs(radialForce)) / balls;
}

/** Each ball's load under a centred thrust Fa on Z balls, N. */
export function thrustBallLoad(axialForce: number, balls: number): number {
  return Math.abs(axialForce) / balls;
}

/** Load-deflection exponent of a ball (point) contact: Q ~ delta^1.5 (Hertz; Harris ch. 7). */
const POINT_CONTACT_EXPONENT = 1.5;
const BISECTION_STEPS = 200;

export interface ThrustRingLoad {
  /** Load on the most loaded ball, N (Infinity when the ring tips). */
  largest: number;
  /** Share of the balls still pressed (1 when none lifts). */
  loadedShare: number;
  /** True when the moment exceeds what the thrust can hold down: the resultant falls outside the
   * balls and the ring tips over its edge. */
  tips: boolean;
}

/** Ball loads of a thrust ring (balls on a pitch circle between two plates) under a centred
 * thrust Fa and a tilting moment M. The rings are rigid, so each ball's compression is linear in
 * cos psi across the ring, delta_i ~ max(cos psi_i - c, 0), and its load Q_i ~ delta_i^1.5 (Hertz
 * point contact); Fa and M fix the scale and c (Harris ch. 7, thrust bearings under eccentric
 * load): c < -1 keeps every ball pressed, c -> 1 leaves one. With one ball where the moment
 * presses hardest (psi = 0), the worst orientation. While every ball stays pressed the result is
 * close to the linear share Fa / Z + 4 M / (Z dp). The ring tips once M / Fa reaches the pitch
 * radius. */
export function thrustRingLoad(
  axialForce: number,
  moment: number,
  balls: number,
  pitchDiameter: number,
): ThrustRingLoad {
  const Fa = Math.abs(axialForce);
  const M = Math.abs(moment);
  if (M === 0) return { largest: Fa / balls, loadedShare: 1, tips: false };
  const target = Fa > 0 ? M / (Fa * (pitchDiameter / 2)) : Infinity;
  if (target >= 1) return { largest: Infinity, loadedShare: 0, tips: true };
  const cos = Array.from({ length: balls }, (_, i) => Math.cos((2 * Math.PI * i) / balls));
  const shares = (c: number) => {
    let su = 0;
    let suc = 0;
    let umax = 0;
    let loaded = 0;
    for (const x of cos) {
      const u = Math.max(x - c, 0) ** POINT_CONTACT_EXPONENT;
      su += u;
      suc += u * x;
      if (u > umax) umax = u;
      if (u > 0) loaded++;
    }
    // c rounded to 1: only the top ball is pressed
    if (su === 0) return { eccentricity: 1, top: 1, loaded: 1 };
    return { eccentricity: suc / su, top: umax / su, loaded };
  };
  // c = 1 - exp(t): the eccentricity M / (Fa r) = sum u cos / sum u falls as t rises
  let lo = -40;
  let hi = 40;
  for (let i = 0; i < BISECTION_STEPS && hi - lo > 1e-13; i++) {
    const mid = (lo + hi) / 2;
    if (shares(1 - Math.exp(mid)).eccentricity > target) lo = mid;
    else hi = mid;
  }
  const s = shares(1 - Math.exp((lo + hi) / 2));
  return { largest: Fa * s.top, loadedShare: s.loaded / balls, tips: false };
}

/** ISO 76 factors for a radial (deep-groove) ball bearing: P0 = X0 Fr + Y0 Fa, and never less
 * than Fr (ISO 76, static equivalent radial load, single-row radial ball bearings). */
export const ISO76_RADIAL_BALL = { X0: 0.6, Y0: 0.5 } as const;

/** Static equivalent radial load P0 = max(X0 Fr + Y0 Fa, Fr), N (ISO 76). */
export function staticEquivalentLoad(
  radialForce: number,
  axialForce: number,
  factors: { X0: number; Y0: number } = ISO76_RADIAL_BALL,
): number {
  const Fr = Math.abs(radialForce);
  const Fa = Math.abs(axialForce);
  return Math.max(factors.X0 * Fr + factors.Y0 * Fa, Fr);
}

/** Static safety s0 = C0 / P0 (ISO 76). */
export function staticSafety(staticRating: number, equivalentLoad: number): number {
  return equivalentLoad > 0 ? staticRating / equivalentLoad : Infinity;
}

/** Mean pressure of a plain bearing (sleeve or hole) on its projected area, p = F / (d L), Pa. */
export function plainBearingPressure(force: number, bore: number, length: number): number {
  return Math.abs(force) / (bore * length);
}

/** p v of a plain bearing, Pa m/s: pressure times the sliding speed at the bore. A hand-moved arm
 * turns slowly; the figure matters for a powered turntable. */
export function pressureVelocity(pressure: number, bore: number, angularSpeed: number): number {
  return pressure * Math.abs(angularSpeed) * (bore / 2);
}
