// Hertz contact of a ball: on a flat (circular contact) and in a grooved race (elliptical
// contact), after Johnson, Contact Mechanics (Cambridge, 1985), ch. 4. SI in, SI out.
import { ellipticIntegrals } from "./elliptic";

/** Contact modulus: 1/E* = (1 - nu1^2)/E1 + (1 - nu2^2)/E2 (Johnson section 4.2). */
export function contactModulus(e1: number, nu1: number, e2: number, nu2: number): number {
  return 1 / ((1 - nu1 * nu1) / e1 + (1 - nu2 * nu2) / e2);
}

export interface HertzContact {
  /** Semi-axes of the contact, m: a >= b (a = b for a circle). */
  a: number;
  b: number;
  /** Peak pressure at the centre, Pa. */
  peakPressure: number;
  /** Approach of the two bodies, m. */
  approach: number;
}

/** Sphere of radius R pressed by F on a flat (or two spheres, R their relative radius):
 * a = (3 F R / (4 E*))^(1/3), p0 = 3 F / (2 pi a^2), delta = a^2 / R (Johnson section 4.2(a)). */
export function sphereOnFlat(force: number, radius: number, modulus: number): HertzContact {
  const F = Math.max(0, force);
  const a = Math.cbrt((3 * F * radius) / (4 * modulus));
  const p0 = a > 0 ? (3 * F) / (2 * Math.PI * a * a) : 0;
  return { a, b: a, peakPressure: p0, approach: (a * a) / radius };
}

/** A ball of diameter D in a race. `grooveRadius` is the radius of the race's cross groove
 * (Infinity: a flat race), conformity f = grooveRadius / D > 0.5. `raceRadius` is the race's
 * radius in the rolling direction, signed: positive where the race is convex there (an inner
 * ring), negative where concave (an outer ring), Infinity for a flat thrust plate. */
export interface BallRaceGeometry {
  ballDiameter: number;
  grooveRadius: number;
  raceRadius: number;
}

/** Relative curvatures of the two principal directions, 1/m: rolling and across the groove.
 * Both must be positive for the surfaces to touch at a point. */
export function relativeCurvatures(g: BallRaceGeometry): { rolling: number; across: number } {
  const ball = 2 / g.ballDiameter;
  return { rolling: ball + 1 / g.raceRadius, across: ball - 1 / g.grooveRadius };
}

/** Below this ratio of the principal curvatures the contact is a circle to rounding. */
const CIRCULAR_RATIO = 1 + 1e-9;
/** Bisection on ln(b/a) down to this ellipse ratio: a groove that conforms this closely is no
 * bearing a user would draw. */
const MIN_AXIS_RATIO = 1e-8;
const BISECTION_STEPS = 200;

/** B/A of the contact ellipse with axis ratio k = b/a (Johnson section 4.2(b): A and B in terms of
 * p0, a, b and the complete elliptic integrals of eccentricity e^2 = 1 - k^2). */
export function curvatureRatioOfEllipse(k: number): number {
  const m = 1 - k * k;
  const { K, E } = ellipticIntegrals(m);
  return (E / (k * k) - K) / (K - E);
}

/** Elliptical Hertz contact of a ball in a race under `force`, with contact modulus E*
 * (Johnson section 4.2(b)): with A and B the half relative curvatures (A <= B),
 * B/A fixes e; then A = p0 b (K - E) / (E* e^2 a^2) and F = (2/3) pi a b p0 give
 * a^3 = 3 F (K - E) / (2 pi A E* e^2), b = a sqrt(1 - e^2), p0 = 3 F / (2 pi a b),
 * delta = p0 b K / E*. */
export function ballInRace(force: number, g: BallRaceGeometry, modulus: number): HertzContact {
  const { rolling, across } = relativeCurvatures(g);
  if (!(rolling > 0 && across > 0))
    throw new RangeError("the race's groove or rolling radius is tighter than the ball");
  const A = Math.min(rolling, across) / 2;
  const B = Math.max(rolling, across) / 2;
  const ratio = B / A;
  if (ratio < CIRCULAR_RATIO) return sphereOnFlat(force, 1 / (A + B), modulus);
  // curvatureRatioOfEllipse falls from infinity to 1 as k rises from 0 to 1
  let lo = Math.log(MIN_AXIS_RATIO);
  let hi = 0;
  for (let i = 0; i < BISECTION_STEPS && hi - lo > 1e-15; i++) {
    const mid = (lo + hi) / 2;
    if (curvatureRatioOfEllipse(Math.exp(mid)) > ratio) lo = mid;
    else hi = mid;
  }
  const k = Math.exp((lo + hi) / 2);
  const m = 1 - k * k;
  const { K, E } = ellipticIntegrals(m);
  const F = Math.max(0, force);
  const a = Math.cbrt((3 * F * (K - E)) / (2 * Math.PI * A * modulus * m));
  const b = k * a;
  const p0 = a > 0 ? (3 * F) / (2 * Math.PI * a * b) : 0;
  return { a, b, peakPressure: p0, approach: (p0 * b * K) / modulus };
}
