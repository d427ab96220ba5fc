// Pins and the holes they sit in: shear in the pin and bearing on the hole wall, SI.
// Shigley's Mechanical Engineering Design (Budynas and Nisbett, 9th-11th ed.), ch. 5 (distortion
// energy) and the usual bearing-stress definition sigma = F / (d t).

/** Ratio of shear yield to tensile yield by the distortion-energy theory, as Shigley states it
 * (S_sy = 0.577 S_y, ch. 5; exactly 1/sqrt(3)). */
export const DISTORTION_ENERGY_SHEAR_RATIO = 0.577;

/** Average shear stress in a pin carrying `force` across `shearPlanes` planes, Pa. */
export function pinShearStress(force: number, diameter: number, shearPlanes: number): number {
  return Math.abs(force) / ((shearPlanes * Math.PI * diameter * diameter) / 4);
}

/** Allowable shear stress of a ductile pin from its tensile yield strength, Pa. */
export function shearYieldStrength(tensileYield: number): number {
  return DISTORTION_ENERGY_SHEAR_RATIO * tensileYield;
}

/** Bearing (projected-area) stress of a pin of `diameter` on a wall `thickness` thick, Pa. */
export function bearingStress(force: number, diameter: number, thickness: number): number {
  return Math.abs(force) / (diameter * thickness);
}

// ---- pins loaded in three dimensions (a stage turned across): docs/checks.md, Pins and holes ----

/** Bending stress at the surface of a round pin carrying `moment`, Pa: M / S with the section
 * modulus of a solid circle S = pi d^3 / 32 (Shigley, geometric properties, table A-18). */
export function pinBendingStress(moment: number, diameter: number): number {
  return (32 * Math.abs(moment)) / (Math.PI * diameter * diameter * diameter);
}

/** Shear stress in the more loaded plane of a double-shear pin carrying `force` across its axis
 * and a moment `moment` across it as a couple of shear forces M / arm at its two planes, Pa (the
 * couple's arm: the spacing of the planes). With no moment this is pinShearStress. */
export function doubleShearStressWithCouple(
  force: number,
  moment: number,
  diameter: number,
  arm: number,
): number {
  const area = (Math.PI * diameter * diameter) / 4;
  return pinShearStress(force, diameter, 2) + (moment > 0 ? Math.abs(moment) / arm / area : 0);
}

/** Peak bearing stress of a pin on a hole wall `thickness` thick carrying `force` across it and a
 * moment `moment` that tilts it in the hole, Pa: pressure varying linearly along a rigid pin,
 * F / (d t) + 6 M / (d t^2) (the projected area d x t taken as a section in bending; common
 * practice, no source). With no moment this is bearingStress. */
export function bearingStressWithMoment(
  force: number,
  moment: number,
  diameter: number,
  thickness: number,
): number {
  return (
    bearingStress(force, diameter, thickness) + (6 * Math.abs(moment)) / (diameter * thickness * thickness)
  );
}

/** Peak bearing stress of a pin through both walls of a tube (each `wall` thick, their mid-planes
 * `spacing` apart) carrying `force` across it and a moment `moment` that tilts it, Pa: the force
 * shared by the two walls, the moment as a couple M / spacing between them, each wall's share on
 * its d x wall area. With no moment this is bearingStress on the two walls together. */
export function tubeBearingStressWithMoment(
  force: number,
  moment: number,
  diameter: number,
  wall: number,
  spacing: number,
): number {
  return bearingStress(force, diameter, 2 * wall) + Math.abs(moment) / spacing / (diameter * wall);
}
