// Metric screw threads: basic dimensions (ISO 68-1, ISO 724), coarse pitches (ISO 261), the
// stress area (ISO 898-1), the shear areas over which a thread strips (FED-STD-H28/2, appendix A),
// and the stresses of a bolt in tension and shear. SI: m, N, Pa.
import type { Material } from "../../model/types";
import { LAYER_STRENGTH_FRACTION } from "../../model/materials";

export { coarsePitch } from "../../model/metric-threads";

/** Height of the fundamental triangle H = (sqrt 3 / 2) P (ISO 68-1). */
function fundamentalHeight(pitch: number): number {
  return (Math.sqrt(3) / 2) * pitch;
}

/** Basic pitch diameter d2 = d - (3/4) H = d - 0.649519 P (ISO 68-1). */
export function basicPitchDiameter(d: number, pitch: number): number {
  return d - 0.75 * fundamentalHeight(pitch);
}

/** Basic minor diameter of the internal thread D1 = d - (5/4) H = d - 1.082532 P (ISO 68-1). */
export function internalMinorDiameter(d: number, pitch: number): number {
  return d - 1.25 * fundamentalHeight(pitch);
}

/** Minor diameter of the external thread d3 = d - (17/12) H = d - 1.226869 P, with the root
 * rounded to H/6 (ISO 724). */
export function externalMinorDiameter(d: number, pitch: number): number {
  return d - (17 / 12) * fundamentalHeight(pitch);
}

/** Tensile stress area As = (pi / 4) ((d2 + d3) / 2)^2 (ISO 898-1). */
export function tensileStressArea(d: number, pitch: number): number {
  const mean = (basicPitchDiameter(d, pitch) + externalMinorDiameter(d, pitch)) / 2;
  return (Math.PI / 4) * mean * mean;
}

/** Root area of the external thread (pi / 4) d3^2: a bolt sheared across its thread. */
export function rootArea(d: number, pitch: number): number {
  return (Math.PI / 4) * externalMinorDiameter(d, pitch) ** 2;
}

/** tan 30 deg, the flank of a 60 deg thread, as the standard writes it. */
const TAN_30 = 0.57735;

/** Shear area of the internal thread (the nut, or the part tapped or formed), m^2: the cylinder at
 * the screw's major diameter through which the internal thread's teeth shear off,
 * A_n = pi n L_e d_s [1/(2n) + 0.57735 (d_s - E_n)], n = 1/P threads per length
 * (FED-STD-H28/2, appendix A). d_s is the screw's least major diameter and E_n the internal
 * thread's greatest pitch diameter; with basic dimensions (d and d2) it is 0.875 pi d L_e. */
export function internalThreadShearArea(
  engagement: number,
  pitch: number,
  screwMajorDiameter: number,
  internalPitchDiameter: number = basicPitchDiameter(screwMajorDiameter, pitch),
): number {
  const n = 1 / pitch;
  return (
    Math.PI *
    n *
    engagement *
    screwMajorDiameter *
    (1 / (2 * n) + TAN_30 * (screwMajorDiameter - internalPitchDiameter))
  );
}

/** Shear area of the external thread (the screw), m^2: the cylinder at the internal thread's
 * minor diameter through which the screw's teeth shear off,
 * A_s = pi n L_e D_n [1/(2n) + 0.57735 (E_s - D_n)] (FED-STD-H28/2, appendix A). D_n is the
 * internal thread's greatest minor diameter and E_s the screw's least pitch diameter; with basic
 * dimensions (D1 and d2) it is 0.75 pi D1 L_e. */
export function externalThreadShearArea(
  engagement: number,
  pitch: number,
  nominalDiameter: number,
  internalMinor: number = internalMinorDiameter(nominalDiameter, pitch),
  screwPitchDiameter: number = basicPitchDiameter(nominalDiameter, pitch),
): number {
  const n = 1 / pitch;
  return (
    Math.PI * n * engagement * internalMinor * (1 / (2 * n) + TAN_30 * (screwPitchDiameter - internalMinor))
  );
}

/** A screw that forms or cuts its own thread in a pilot hole (a print, wood, soft plastic) fills
 * less of the profile than a tapped thread and tears the material it displaces: its engagement
 * counts at 60 % (common practice, no source). */
export const FORMED_THREAD_ENGAGEMENT_SHARE = 0.6;

/** Ratio of shear to tensile yield by the distortion-energy theory, S_sy = 0.577 S_y (Shigley ch. 5). */
const SHEAR_YIELD_RATIO = 0.577;

/** Shear strength the material of an internal thread offers its teeth, Pa: 0.577 of its strength
 * (distortion energy, Shigley ch. 5). A print's teeth shear across its layers, so it offers 0.577
 * of its layer strength (the layer rule of docs/checks.md; applying 0.577 to the layer bond is
 * common practice, no source). */
export function threadShearStrength(material: Material): number {
  const s = material.printed
    ? (material.layerStrength ?? LAYER_STRENGTH_FRACTION * material.strength)
    : material.strength;
  return SHEAR_YIELD_RATIO * s;
}

/** Force that strips a thread of shear area A in a material of shear strength S_s, N. */
export function strippingForce(shearArea: number, shearStrength: number): number {
  return shearArea * shearStrength;
}

/** Tensile stress of a bolt on its stress area, Pa. */
export function boltTensileStress(force: number, d: number, pitch: number): number {
  return Math.abs(force) / tensileStressArea(d, pitch);
}

/** Shear stress of a bolt cut across its thread on `planes` shear planes (the threads in the
 * shear plane, the weaker case), Pa. */
export function boltShearStress(force: number, d: number, pitch: number, planes: number): number {
  return Math.abs(force) / (planes * rootArea(d, pitch));
}

/** Von Mises stress of tension sigma with shear tau, sqrt(sigma^2 + 3 tau^2) (Shigley ch. 5). */
export function vonMisesStress(tension: number, shear: number): number {
  return Math.sqrt(tension * tension + 3 * shear * shear);
}
