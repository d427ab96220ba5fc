// Stress in a bar loaded in three dimensions (docs/checks.md, Swivels): axial force, bending about
// both axes and torsion at one section. The largest normal stress adds the axial stress and the
// bending stresses at the extreme fibres (for a rectangle the two bending maxima meet at a corner;
// for a round section the moments add as a vector); the largest shear stress is T / Q (Roark's
// torsional section modulus). The two are combined as if at one point, which is conservative for a
// rectangle (its torsional peak sits mid-side, not at the corner): von Mises for a ductile metal,
// the largest principal stress for a brittle print (Shigley, Mechanical Engineering Design, 10th
// ed., sections 5-5 and 5-10 for the two criteria). SI units.
import type { SectionProperties } from "../../model/section";

export interface SectionLoads {
  /** N, tension positive */
  axial: number;
  /** N*m about the bar's axis */
  torque: number;
  /** N*m, bending in the arm's (stage's) plane, about the pins' axis */
  momentInPlane: number;
  /** N*m, bending sideways, about the in-plane axis across the bar */
  momentAcross: number;
}

export interface CombinedStress {
  /** Largest normal stress, Pa (magnitude). */
  normal: number;
  /** Largest torsional shear stress, Pa. */
  shear: number;
  /** sqrt(sigma^2 + 3 tau^2), Pa. */
  vonMises: number;
  /** sigma / 2 + sqrt(sigma^2 / 4 + tau^2), Pa. */
  principal: number;
}

export function combinedStress(sec: SectionProperties, round: boolean, l: SectionLoads): CombinedStress {
  const bending = round
    ? (Math.hypot(l.momentInPlane, l.momentAcross) * sec.extremeFibre) / sec.secondMoment
    : (Math.abs(l.momentInPlane) * sec.extremeFibre) / sec.secondMoment +
      (Math.abs(l.momentAcross) * sec.extremeFibreAcross) / sec.secondMomentAcross;
  const normal = Math.abs(l.axial) / sec.area + bending;
  const shear = sec.torsionModulus > 0 ? Math.abs(l.torque) / sec.torsionModulus : 0;
  return {
    normal,
    shear,
    vonMises: Math.sqrt(normal * normal + 3 * shear * shear),
    principal: normal / 2 + Math.sqrt((normal * normal) / 4 + shear * shear),
  };
}
