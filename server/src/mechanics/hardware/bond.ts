// Glued joints: the mean shear stress on the bonded area, compared with the adhesive's lap-shear
// strength (itself a mean over the test's short overlap). SI.

/** What a lap-shear figure leaves out; every glue readout carries it. */
export const PEEL_CAUTION =
  "Glue is checked in shear only: a bond pulled open at one edge (peel or cleavage) fails at a small fraction of its lap-shear strength. Shape the joint so the load slides the parts, and keep the bond out of peel.";

/** Mean shear stress of a force along the bond over its area, tau = F / A, Pa (the same mean as the
 * lap-shear test, ISO 4587 / ASTM D1002, reports). */
export function bondShearStress(force: number, area: number): number {
  return Math.abs(force) / area;
}

/** Largest shear stress of a twisting moment T in the bond's plane, taking the bond as a square
 * patch of the same area, side a = sqrt(A): tau = T r / J with the polar moment J = A a^2 / 6 and
 * r = a / sqrt 2 to the corners (elastic torsion of the glue line, the polar-moment method Shigley
 * uses for welds in torsion, ch. 9). A disc of the same area sees 16 % less, a long narrow patch
 * more. Pa. */
export function bondTorsionShearStress(torque: number, area: number): number {
  const a = Math.sqrt(area);
  return (Math.abs(torque) * (a / Math.SQRT2)) / ((area * a * a) / 6);
}

/** Largest shear of a force and a twisting moment together, the two added where they meet at the
 * rim (conservative: their directions are not compared), Pa. */
export function bondCombinedShearStress(force: number, torque: number, area: number): number {
  return bondShearStress(force, area) + bondTorsionShearStress(torque, area);
}
