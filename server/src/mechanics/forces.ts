// How much each spring pulls at a given length (or joint angle), and the parameters its force is
// linear in, read from its kind's descriptor (model/spring-kinds.ts, where the force laws are).
// Tension is positive when it pulls the two hooks together; gas struts push (negative).
import type { ArmModel, Spring, TorsionSpring } from "../model/types";
import { springKind } from "../model/spring-kinds";

export {
  cordShearModulus,
  elasticCordTension,
  extensionSpringTension,
  gasStrutStrokePosition,
  gasStrutTension,
  torsionSpringTorque,
  zeroLengthTension,
} from "../model/spring-kinds";

/** Tension of a point-to-point spring at a hook-to-hook length, N. */
export function springTension(model: ArmModel, s: Exclude<Spring, TorsionSpring>, length: number): number {
  return springKind(s).load(s, length, model);
}

/** The design parameters a spring's force is linear in (its kind's fit settings, by the property
 * each is written in), for best-fit readouts: force = basis[0] x p[0] + basis[1] x p[1] where the
 * spring is taut. */
export interface SpringParameters {
  names: [string, string | undefined];
  values: [number, number];
}

export function springParameters(s: Spring): SpringParameters {
  const [first, second] = springKind(s).fit;
  return {
    names: [first.key, second?.key],
    values: [first.value(s), second ? second.value(s) : 0],
  };
}

/** Coefficients of the force (tension, or torsion torque T) in the two parameters at a length
 * (torsion: joint angle minus reference angle). */
export function springForceBasis(model: ArmModel, s: Spring, lengthOrTurn: number, out: Float64Array): void {
  springKind(s).basis(s, lengthOrTurn, model, out);
}
