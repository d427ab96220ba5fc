// Column buckling of bars in compression: Euler for slender columns, the Johnson parabola for
// intermediate ones (Shigley's Mechanical Engineering Design, 9th-11th ed., ch. 4, "Columns").
import type { Section } from "../../model/types";
import { sectionProperties } from "../../model/section";

/** Euler critical load P_cr = pi^2 E I / (K L)^2, N. */
export function eulerCriticalLoad(modulus: number, secondMoment: number, effectiveLength: number): number {
  return (Math.PI * Math.PI * modulus * secondMoment) / (effectiveLength * effectiveLength);
}

/** Slenderness ratio (K L) / k with radius of gyration k = sqrt(I / A). */
export function slendernessRatio(effectiveLength: number, area: number, secondMoment: number): number {
  return effectiveLength / Math.sqrt(secondMoment / area);
}

/** Slenderness where Euler's curve meets the Johnson parabola: sqrt(2 pi^2 E / S_y). */
export function transitionSlenderness(modulus: number, yieldStrength: number): number {
  return Math.sqrt((2 * Math.PI * Math.PI * modulus) / yieldStrength);
}

/** Johnson parabola P_cr = A [S_y - (S_y slenderness / (2 pi))^2 / E], N. */
export function johnsonCriticalLoad(
  area: number,
  yieldStrength: number,
  modulus: number,
  slenderness: number,
): number {
  const t = (yieldStrength * slenderness) / (2 * Math.PI);
  return area * (yieldStrength - (t * t) / modulus);
}

export interface ColumnResult {
  criticalLoad: number;
  slenderness: number;
  method: "Euler" | "Johnson";
}

/** Critical load of a column, choosing Euler or Johnson by the transition slenderness. */
export function columnCriticalLoad(
  modulus: number,
  area: number,
  secondMoment: number,
  yieldStrength: number,
  effectiveLength: number,
): ColumnResult {
  const slenderness = slendernessRatio(effectiveLength, area, secondMoment);
  if (slenderness >= transitionSlenderness(modulus, yieldStrength)) {
    return {
      criticalLoad: eulerCriticalLoad(modulus, secondMoment, effectiveLength),
      slenderness,
      method: "Euler",
    };
  }
  return {
    criticalLoad: johnsonCriticalLoad(area, yieldStrength, modulus, slenderness),
    slenderness,
    method: "Johnson",
  };
}

/** The least second moment of area of a section, m^4: a bar buckles about its weaker axis, and
 * a rectangle's out-of-plane axis (depth width^3 / 12) is often the weaker (Roark 8th ed.,
 * table of section properties). Round sections are the same about every axis. */
export function leastSecondMoment(section: Section): number {
  const p = sectionProperties(section);
  return Math.min(p.secondMoment, p.secondMomentAcross);
}
