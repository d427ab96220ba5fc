// Stress in helical extension-spring bodies (Shigley's Mechanical Engineering Design, 9th-11th
// ed., ch. 10): spring index, curvature factors, body shear stress, wire strength.

/** Spring index C = D / d. */
export function springIndex(meanDiameter: number, wireDiameter: number): number {
  return meanDiameter / wireDiameter;
}

/** Bergstraesser factor K_B = (4C + 2) / (4C - 3) (Shigley eq. 10-5). */
export function bergstraesserFactor(index: number): number {
  return (4 * index + 2) / (4 * index - 3);
}

/** Wahl factor K_W = (4C - 1) / (4C - 4) + 0.615 / C (Shigley eq. 10-4 discussion). */
export function wahlFactor(index: number): number {
  return (4 * index - 1) / (4 * index - 4) + 0.615 / index;
}

/** Body shear stress tau = K 8 F D / (pi d^3), Pa, with curvature factor K (Bergstraesser by default). */
export function coilBodyShearStress(
  force: number,
  meanDiameter: number,
  wireDiameter: number,
  factor?: number,
): number {
  const k = factor ?? bergstraesserFactor(springIndex(meanDiameter, wireDiameter));
  return (k * 8 * Math.abs(force) * meanDiameter) / (Math.PI * wireDiameter ** 3);
}

/** Music wire (ASTM A228) constants of S_ut = A / d^m with d in mm (Shigley Table 10-4). */
export const MUSIC_WIRE_STRENGTH = { aMpaMm: 2211, m: 0.145 } as const;

/** Minimum tensile strength S_ut = A / d^m, Pa, with A in MPa mm^m and d in m (converted to mm). */
export function minimumTensileStrength(aMpaMm: number, m: number, wireDiameter: number): number {
  return (aMpaMm / (wireDiameter * 1000) ** m) * 1e6;
}

/** Allowable static body stress of an extension spring as a share of S_ut (Shigley Table 10-7,
 * from memory: 45 % for the body of extension springs). */
export const EXTENSION_BODY_ALLOWABLE_RATIO = 0.45;
