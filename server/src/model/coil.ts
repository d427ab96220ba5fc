// Helical spring formulas from the coil geometry (Shigley's Mechanical Engineering Design,
// Budynas and Nisbett, 9th-11th ed., chapter 10). SI in, SI out. Shared by the model builder
// (rate of a coil-defined spring) and the strength checks (body stress).

/** Spring index C = D / d (Shigley eq. 10-1). */
export function springIndex(meanDiameter: number, wireDiameter: number): number {
  return meanDiameter / wireDiameter;
}

/** Active coils of an extension spring: Na = Nb + G / E, the hooks adding G/E of a coil
 * (Shigley section 10-11, eq. 10-39). */
export function extensionActiveCoils(bodyCoils: number, shearModulus: number, modulus: number): number {
  return bodyCoils + shearModulus / modulus;
}

/** Rate of a helical spring k = G d^4 / (8 D^3 Na), N/m (Shigley eq. 10-9). */
export function helicalSpringRate(
  wireDiameter: number,
  meanDiameter: number,
  activeCoils: number,
  shearModulus: number,
): number {
  return (shearModulus * wireDiameter ** 4) / (8 * meanDiameter ** 3 * activeCoils);
}

/** Rate of an extension spring from its coil: Na = Nb + G/E, then k = G d^4 / (8 D^3 Na). */
export function extensionSpringRate(
  wireDiameter: number,
  meanDiameter: number,
  bodyCoils: number,
  shearModulus: number,
  modulus: number,
): number {
  return helicalSpringRate(
    wireDiameter,
    meanDiameter,
    extensionActiveCoils(bodyCoils, shearModulus, modulus),
    shearModulus,
  );
}

/** Bergstraesser factor K_B = (4C + 2) / (4C - 3) (Shigley eq. 10-5). */
export function bergstraesserFactor(index: number): number {
  return (4 * index + 2) / (4 * index - 3);
}

/** Wahl factor K_W = (4C - 1) / (4C - 4) + 0.615 / C (Shigley eq. 10-4). */
export function wahlFactor(index: number): number {
  return (4 * index - 1) / (4 * index - 4) + 0.615 / index;
}

/** Body shear stress tau = K 8 F D / (pi d^3), Pa, with K the curvature factor (Shigley eq. 10-7). */
export function coilShearStress(
  force: number,
  meanDiameter: number,
  wireDiameter: number,
  curvatureFactor: number,
): number {
  return (curvatureFactor * 8 * force * meanDiameter) / (Math.PI * wireDiameter ** 3);
}

/** Torsion spring rate per radian: k' = d^4 E / (10.8 D Na) per turn, over 2 pi (Shigley
 * section 10-12, eq. 10-51). */
export function torsionSpringRatePerRad(
  wireDiameter: number,
  meanDiameter: number,
  activeCoils: number,
  modulus: number,
): number {
  return (wireDiameter ** 4 * modulus) / (10.8 * meanDiameter * activeCoils) / (2 * Math.PI);
}
