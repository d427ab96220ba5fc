// Cross-section properties of links and bars, SI. Formulas: Roark's Formulas for Stress and
// Strain, 8th ed., table of section properties (rectangle b h^3/12, round pi d^4/64, tube
// pi (D^4 - d^4)/64).
import type { Section } from "./types";

export interface SectionProperties {
  /** m^2 */
  area: number;
  /** Second moment of area about the axis normal to the arm's plane (in-plane bending), m^4. */
  secondMoment: number;
  /** Distance from the neutral axis to the extreme fibre in the plane, m. */
  extremeFibre: number;
  /** Depth in the arm's plane, m. */
  depth: number;
  /** Width across the plane (along the pin axis), m: the default wall a pin bears on. */
  width: number;
}

export function sectionProperties(section: Section): SectionProperties {
  switch (section.shape) {
    case "rect": {
      const { depth, width } = section;
      return {
        area: depth * width,
        secondMoment: (width * depth ** 3) / 12,
        extremeFibre: depth / 2,
        depth,
        width,
      };
    }
    case "rod": {
      const d = section.diameter;
      return {
        area: (Math.PI * d * d) / 4,
        secondMoment: (Math.PI * d ** 4) / 64,
        extremeFibre: d / 2,
        depth: d,
        width: d,
      };
    }
    case "tube": {
      const od = section.outerDiameter;
      const id = Math.max(0, od - 2 * section.wall);
      return {
        area: (Math.PI * (od * od - id * id)) / 4,
        secondMoment: (Math.PI * (od ** 4 - id ** 4)) / 64,
        extremeFibre: od / 2,
        depth: od,
        // A pin through a tube bears on both walls.
        width: Math.min(od, 2 * section.wall),
      };
    }
  }
}
