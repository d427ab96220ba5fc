// Cross-section properties of links and bars, SI: area, second moments about both bending axes,
// torsion constant and torsional section modulus. Formulas: Roark's Formulas for Stress and
// Strain (8th ed., table of section properties: rectangle b h^3/12, round pi d^4/64, tube
// pi (D^4 - d^4)/64; 7th ed., table 10.7 for torsion: rectangle case 4, circle and tube exact).
import type { Section } from "./types";

export interface SectionProperties {
  /** m^2 */
  area: number;
  /** Second moment of area about the axis normal to the arm's plane (in-plane bending), m^4. */
  secondMoment: number;
  /** Distance from the neutral axis to the extreme fibre in the plane, m. */
  extremeFibre: number;
  /** Second moment of area about the in-plane axis across the bar (bending out of the arm's
   * plane, sideways), m^4. */
  secondMomentAcross: number;
  /** Distance from that axis to the extreme fibre across the plane, m. */
  extremeFibreAcross: number;
  /** Polar second moment Iy + Iz, m^4 (rotary inertia of the section in torsion, per density). */
  polarMoment: number;
  /** Torsion constant K of theta = T L / (K G), m^4 (Roark's K; J for round sections). */
  torsionConstant: number;
  /** Torsional section modulus Q of tau_max = T / Q, m^3 (Roark's Q). */
  torsionModulus: number;
  /** Depth in the arm's plane, m. */
  depth: number;
  /** Width across the plane (along the pin axis), m: the default wall a pin bears on. */
  width: number;
}

/** Torsion of a solid rectangle a x b with a >= b and r = b / a (Roark's Formulas for Stress and
 * Strain, 7th ed., table 10.7, case 4, written with full side lengths):
 * K = a b^3 [1/3 - 0.21 r (1 - r^4 / 12)], and at the middle of the long sides
 * tau_max = 3 T / (a b^2) [1 + 0.6095 r + 0.8865 r^2 - 1.8023 r^3 + 0.9100 r^4].
 * The shorter tau_max = T (3a + 1.8b) / (a^2 b^2) of older editions reads up to 4 % low (at
 * r near 0.5) against the exact series, so the polynomial is used: a stress must not read low. */
export function rectangleTorsion(side1: number, side2: number): { constant: number; modulus: number } {
  const a = Math.max(side1, side2);
  const b = Math.min(side1, side2);
  if (!(b > 0)) return { constant: 0, modulus: 0 };
  const r = b / a;
  const stressFactor = 1 + 0.6095 * r + 0.8865 * r ** 2 - 1.8023 * r ** 3 + 0.91 * r ** 4;
  return {
    constant: a * b ** 3 * (1 / 3 - 0.21 * r * (1 - r ** 4 / 12)),
    modulus: (a * b * b) / (3 * stressFactor),
  };
}

/** Torsion of a round tube of outer diameter D and bore d (d = 0: a solid rod), exact (Roark,
 * table 10.7, cases 1 and 10): K = J = pi (D^4 - d^4) / 32, tau_max = T (D/2) / J. */
export function roundTorsion(outer: number, bore: number): { constant: number; modulus: number } {
  const J = (Math.PI * (outer ** 4 - bore ** 4)) / 32;
  return { constant: J, modulus: outer > 0 ? J / (outer / 2) : 0 };
}

export function sectionProperties(section: Section): SectionProperties {
  switch (section.shape) {
    case "rect": {
      const { depth, width } = section;
      const inPlane = (width * depth ** 3) / 12;
      const across = (depth * width ** 3) / 12;
      const t = rectangleTorsion(depth, width);
      return {
        area: depth * width,
        secondMoment: inPlane,
        extremeFibre: depth / 2,
        secondMomentAcross: across,
        extremeFibreAcross: width / 2,
        polarMoment: inPlane + across,
        torsionConstant: t.constant,
        torsionModulus: t.modulus,
        depth,
        width,
      };
    }
    case "rod": {
      const d = section.diameter;
      const I = (Math.PI * d ** 4) / 64;
      const t = roundTorsion(d, 0);
      return {
        area: (Math.PI * d * d) / 4,
        secondMoment: I,
        extremeFibre: d / 2,
        secondMomentAcross: I,
        extremeFibreAcross: d / 2,
        polarMoment: 2 * I,
        torsionConstant: t.constant,
        torsionModulus: t.modulus,
        depth: d,
        width: d,
      };
    }
    case "tube": {
      const od = section.outerDiameter;
      const id = Math.max(0, od - 2 * section.wall);
      const I = (Math.PI * (od ** 4 - id ** 4)) / 64;
      const t = roundTorsion(od, id);
      return {
        area: (Math.PI * (od * od - id * id)) / 4,
        secondMoment: I,
        extremeFibre: od / 2,
        secondMomentAcross: I,
        extremeFibreAcross: od / 2,
        polarMoment: 2 * I,
        torsionConstant: t.constant,
        torsionModulus: t.modulus,
        depth: od,
        // A pin through a tube bears on both walls.
        width: Math.min(od, 2 * section.wall),
      };
    }
  }
}
