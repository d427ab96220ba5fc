// Force laws of the spring elements and how much each one pulls at a given length (or joint
// angle). Tension is positive when it pulls the two hooks together; gas struts push (negative).
import type {
  ArmModel,
  ElasticCord,
  ExtensionSpring,
  GasStrut,
  Spring,
  TorsionSpring,
  ZeroLengthSpring,
} from "../model/types";

/** Helical extension spring: F = Fi + k (L - L0) past its free length, slack (0) below it. */
export function extensionSpringTension(
  s: Pick<ExtensionSpring, "rate" | "freeLength" | "initialTension">,
  length: number,
): number {
  return length > s.freeLength ? s.initialTension + s.rate * (length - s.freeLength) : 0;
}

/** Ideal zero-free-length spring: F = Fi + k L. */
export function zeroLengthTension(
  s: Pick<ZeroLengthSpring, "rate" | "initialTension">,
  length: number,
): number {
  return s.initialTension + s.rate * length;
}

/** Neo-Hookean cord in uniaxial tension: F = G A0 (s - s^-2), s = L / L0, slack below L0
 * (Treloar, The Physics of Rubber Elasticity, 3rd ed., 1975). */
export function elasticCordTension(
  s: Pick<ElasticCord, "freeLength" | "area">,
  shearModulus: number,
  length: number,
): number {
  if (!(s.freeLength > 0) || length <= s.freeLength) return 0;
  const stretch = length / s.freeLength;
  return shearModulus * s.area * (stretch - 1 / (stretch * stretch));
}

/** Stroke position of a gas strut: how far it is pushed in from full extension, clamped to
 * 0..stroke (outside it the strut is topped or bottomed out and its force stays at the end value). */
export function gasStrutStrokePosition(
  s: Pick<GasStrut, "stroke" | "extendedLength">,
  length: number,
): number {
  return Math.min(Math.max(s.extendedLength - length, 0), Math.max(s.stroke, 0));
}

/** Gas strut: pushes with a force linear in stroke position from `force` fully extended to
 * progression x force fully compressed. Returned as (negative) tension. */
export function gasStrutTension(
  s: Pick<GasStrut, "force" | "progression" | "stroke" | "extendedLength">,
  length: number,
): number {
  const x = gasStrutStrokePosition(s, length);
  const fraction = s.stroke > 0 ? x / s.stroke : 0;
  return -s.force * (1 + (s.progression - 1) * fraction);
}

/** Torsion spring at a joint: T = k (theta - theta_ref) - preload. The spring applies T to the
 * parent and -T to the child (CCW positive), so turning the child CCW winds it up and it pushes
 * back; a positive preload pushes the child counter-clockwise at the reference pose (it lifts a
 * child that reaches out to the right, as a counterbalance does). */
export function torsionSpringTorque(
  s: Pick<TorsionSpring, "rate" | "preloadTorque">,
  jointAngle: number,
  referenceAngle: number,
): number {
  return s.rate * (jointAngle - referenceAngle) - s.preloadTorque;
}

/** Shear modulus of a cord's material, Pa (0 when the material is unknown). */
export function cordShearModulus(model: ArmModel, s: ElasticCord): number {
  return model.materials[s.material]?.shearModulus ?? 0;
}

/** Tension of a point-to-point spring at a hook-to-hook length, N. */
export function springTension(model: ArmModel, s: Exclude<Spring, TorsionSpring>, length: number): number {
  switch (s.kind) {
    case "extension":
      return extensionSpringTension(s, length);
    case "zero_length":
      return zeroLengthTension(s, length);
    case "elastic":
      return elasticCordTension(s, cordShearModulus(model, s), length);
    case "gas":
      return gasStrutTension(s, length);
  }
}

/** The two design parameters a spring's force is linear in, for best-fit readouts: force =
 * basis[0] x p[0] + basis[1] x p[1] where the spring is taut. */
export interface SpringParameters {
  names: [string, string | undefined];
  values: [number, number];
}

export function springParameters(s: Spring): SpringParameters {
  switch (s.kind) {
    case "extension":
    case "zero_length":
      return { names: ["rate", "initialTension"], values: [s.rate, s.initialTension] };
    case "torsion":
      return { names: ["rate", "preloadTorque"], values: [s.rate, s.preloadTorque] };
    case "gas":
      return { names: ["force", undefined], values: [s.force, 0] };
    case "elastic":
      return { names: ["area", undefined], values: [s.area, 0] };
  }
}

/** Coefficients of the force (tension, or torsion torque T) in the two parameters at a length
 * (torsion: joint angle minus reference angle). */
export function springForceBasis(model: ArmModel, s: Spring, lengthOrTurn: number, out: Float64Array): void {
  switch (s.kind) {
    case "extension": {
      const taut = lengthOrTurn > s.freeLength;
      out[0] = taut ? lengthOrTurn - s.freeLength : 0;
      out[1] = taut ? 1 : 0;
      return;
    }
    case "zero_length":
      out[0] = lengthOrTurn;
      out[1] = 1;
      return;
    case "torsion":
      out[0] = lengthOrTurn;
      out[1] = -1;
      return;
    case "gas":
      out[0] = s.force !== 0 ? gasStrutTension(s, lengthOrTurn) / s.force : 0;
      out[1] = 0;
      return;
    case "elastic":
      out[0] = s.area !== 0 ? elasticCordTension(s, cordShearModulus(model, s), lengthOrTurn) / s.area : 0;
      out[1] = 0;
      return;
  }
}
