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
