// The ends of coil springs, where they usually break first: extension-spring hooks in bending and
// torsion, the body's solid length and the room between the hooks, the initial tension a spring
// maker can wind, and the wire of a torsion spring in bending. Shigley's Mechanical Engineering
// Design (Budynas and Nisbett, 10th ed.), sections 10-11 (extension springs) and 10-12 (helical
// torsion springs). SI: m, N, Pa.
import { bergstraesserFactor, coilShearStress, springIndex } from "../../model/coil";

/** Curvature factor of a wire bent on a radius of index C (inner fibre): (4C^2 - C - 1) /
 * (4C (C - 1)). Shigley uses it for the hook in bending, (K)_A with C1 = 2 r1 / d (with eq. 10-34),
 * and for the wire of a torsion spring, K_i with C = D / d (section 10-12). */
export function innerFibreBendingFactor(index: number): number {
  return (4 * index * index - index - 1) / (4 * index * (index - 1));
}

/** Curvature factor of the hook's bend in torsion, (K)_B = (4 C2 - 1) / (4 C2 - 4), C2 = 2 r2 / d
 * (with eq. 10-35). */
export function hookTorsionFactor(index: number): number {
  return (4 * index - 1) / (4 * index - 4);
}

/** Where a hook's stress is taken: r1 is the radius of the hook's loop (section A, bending), r2
 * the radius of the bend where the loop turns out of the body (section B, torsion) (Shigley fig.
 * 10-7). */
export interface HookGeometry {
  loopRadius: number;
  bendRadius: number;
}

/** Default hook when the spec gives none: a full loop over the centre (machine hook) whose loop
 * radius is the coil's mean radius, r1 = D / 2, bent out of the body on r2 = 2 d, about the
 * tightest bend a spring maker forms without marking the wire (common practice, no source; a
 * tighter bend raises the hook's torsion stress). */
export function defaultHook(meanDiameter: number, wireDiameter: number): HookGeometry {
  return { loopRadius: meanDiameter / 2, bendRadius: 2 * wireDiameter };
}

/** Bending stress at A, the inside of the hook's loop, with its direct tension:
 * sigma_A = F [(K)_A 16 D / (pi d^3) + 4 / (pi d^2)], C1 = 2 r1 / d (Shigley 10th ed., eq. 10-34). */
export function hookBendingStress(
  force: number,
  meanDiameter: number,
  wireDiameter: number,
  hook: HookGeometry,
): number {
  const K = innerFibreBendingFactor((2 * hook.loopRadius) / wireDiameter);
  const d = wireDiameter;
  return Math.abs(force) * ((K * 16 * meanDiameter) / (Math.PI * d ** 3) + 4 / (Math.PI * d * d));
}

/** Torsion stress at B, the bend into the hook: tau_B = (K)_B 8 F D / (pi d^3), C2 = 2 r2 / d
 * (Shigley 10th ed., eq. 10-35). */
export function hookTorsionStress(
  force: number,
  meanDiameter: number,
  wireDiameter: number,
  hook: HookGeometry,
): number {
  return coilShearStress(
    Math.abs(force),
    meanDiameter,
    wireDiameter,
    hookTorsionFactor((2 * hook.bendRadius) / wireDiameter),
  );
}

/** Solid length of a close-wound extension spring's body, (Nb + 1) d (Shigley section 10-11). */
export function bodySolidLength(bodyCoils: number, wireDiameter: number): number {
  return (bodyCoils + 1) * wireDiameter;
}

/** Inside length of one full-loop hook, D - d: with two of them the free length of an extension
 * spring is L0 = 2 (D - d) + (Nb + 1) d (Shigley section 10-11). */
export function fullLoopHookLength(meanDiameter: number, wireDiameter: number): number {
  return meanDiameter - wireDiameter;
}

/** Shortest free length a spring of this coil can have with two full-loop hooks, m. */
export function shortestFreeLength(bodyCoils: number, meanDiameter: number, wireDiameter: number): number {
  return 2 * fullLoopHookLength(meanDiameter, wireDiameter) + bodySolidLength(bodyCoils, wireDiameter);
}

/** 1 psi in Pa, exact from lbf and in (NIST SP 811 B.8). */
const PSI = (0.45359237 * 9.80665) / (0.0254 * 0.0254);

/** The initial stress a spring maker can wind into an extension spring of index C: the preferred
 * range tau_i = 33 500 / exp(0.105 C) -/+ 1000 (4 - (C - 3) / 6.5) psi (Shigley 10th ed.,
 * section 10-11, preferred range of initial stress, from a spring maker's chart; in SI
 * 231 / exp(0.105 C) -/+ 6.9 (4 - (C - 3) / 6.5) MPa). Pa. */
export function initialStressRange(index: number): { low: number; high: number } {
  const middle = (33_500 / Math.exp(0.105 * index)) * PSI;
  const half = 1000 * (4 - (index - 3) / 6.5) * PSI;
  return { low: middle - half, high: middle + half };
}

/** Shear stress of the initial tension Fi in the body, tau_i = K_B 8 Fi D / (pi d^3), the figure
 * Shigley compares with the preferred range (Example 10-6 (b)). */
export function initialTensionStress(
  initialTension: number,
  meanDiameter: number,
  wireDiameter: number,
): number {
  return coilShearStress(
    Math.abs(initialTension),
    meanDiameter,
    wireDiameter,
    bergstraesserFactor(springIndex(meanDiameter, wireDiameter)),
  );
}

/** Initial tension that gives the initial stress tau_i: Fi = tau_i pi d^3 / (K_B 8 D), N. */
export function initialTensionForStress(stress: number, meanDiameter: number, wireDiameter: number): number {
  return stress / initialTensionStress(1, meanDiameter, wireDiameter);
}

/** Bending stress of a torsion spring's wire under moment M: sigma = K_i 32 M / (pi d^3), K_i the
 * inner-fibre factor of C = D / d (Shigley 10th ed., section 10-12). Pa. */
export function torsionSpringWireStress(moment: number, meanDiameter: number, wireDiameter: number): number {
  const K = innerFibreBendingFactor(springIndex(meanDiameter, wireDiameter));
  return (K * 32 * Math.abs(moment)) / (Math.PI * wireDiameter ** 3);
}
