// Every diagnostic code, its default severity and a one-line explanation that docs and hovers
// reuse. The one place codes are defined; `data.ts` gives each code the shape of its data.

export type Severity = "error" | "warning" | "information" | "hint";

export interface CodeInfo {
  severity: Severity;
  /** A few plain words for a label on the drawing or a report line, where a code would mean
   * nothing to the reader. */
  words: string;
  explanation: string;
}

export const CODES = {
  // text and model
  "syntax.error": {
    severity: "error",
    words: "text not understood",
    explanation: "The text does not follow the language's grammar.",
  },
  "unit.missing": {
    severity: "error",
    words: "unit missing",
    explanation: "A number that needs a unit has none.",
  },
  "unit.unknown": {
    severity: "error",
    words: "unknown unit",
    explanation: "The unit is not one the language knows.",
  },
  "unit.wrong-dimension": {
    severity: "error",
    words: "wrong kind of unit",
    explanation: "The quantity has the wrong dimension for the property.",
  },
  "name.unknown": {
    severity: "error",
    words: "unknown name",
    explanation: "A reference names nothing declared (or built in).",
  },
  "name.duplicate": {
    severity: "error",
    words: "name used twice",
    explanation: "Two declarations share a name.",
  },
  "name.unknown-point": {
    severity: "error",
    words: "unknown point",
    explanation: "A reference names a point the body does not have.",
  },
  "property.missing": {
    severity: "error",
    words: "property missing",
    explanation: "A required property is missing.",
  },
  "property.unknown": {
    severity: "error",
    words: "unknown property",
    explanation: "The declaration has no such property.",
  },
  "property.repeated": {
    severity: "warning",
    words: "given twice",
    explanation: "A property is given twice; the last one counts.",
  },
  "property.conflict": {
    severity: "error",
    words: "properties disagree",
    explanation: "Two properties contradict each other.",
  },
  "value.invalid": {
    severity: "error",
    words: "value not understood",
    explanation: "The value has the wrong shape for the property.",
  },
  "value.impossible": {
    severity: "error",
    words: "impossible value",
    explanation: "The value cannot describe a real part (zero or negative size, reversed range, ...).",
  },
  "arm.missing": { severity: "error", words: "no arm", explanation: "The file has no `arm` block." },
  "arm.second": {
    severity: "error",
    words: "second arm ignored",
    explanation: "A file holds one arm; a second `arm` block is ignored.",
  },
  "declaration.unknown": {
    severity: "error",
    words: "unknown declaration",
    explanation: "The word before a `{ }` block is not a kind of declaration.",
  },
  "base.missing": {
    severity: "error",
    words: "no base",
    explanation: "The arm has no `base`: nothing is fixed to the ground.",
  },
  "base.second": {
    severity: "error",
    words: "second base ignored",
    explanation: "An arm has one base; a second `base` is ignored.",
  },
  "payload.weightless": {
    severity: "warning",
    words: "weighs nothing",
    explanation: "A payload of zero mass with no force loads nothing.",
  },
  "payload.on-base": {
    severity: "warning",
    words: "rests on the base",
    explanation: "A payload sits on the base: no joint carries it, so it takes no part in balance.",
  },
  "spring.same-body": {
    severity: "warning",
    words: "spring on one body",
    explanation: "Both hooks of a spring are on one body: it pulls the body on itself and does nothing.",
  },
  "adjust.no-range": {
    severity: "warning",
    words: "adjuster with no mass range",
    explanation: "An `adjust` line gives a setting per payload mass, but no payload has a mass range.",
  },
  "joint.unheld": {
    severity: "error",
    words: "joint not held",
    explanation: "A passive joint that no closed loop determines.",
  },
  "body.unconnected": {
    severity: "warning",
    words: "not connected",
    explanation: "A body no joint connects to the base.",
  },
  "sweep.capped": {
    severity: "warning",
    words: "sweep shortened",
    explanation: "The requested sweep was too large and was capped.",
  },
  // kinematics
  "geometry.loop-open": {
    severity: "error",
    words: "loop does not close",
    explanation: "A closed loop does not meet at its reference pose.",
  },
  "geometry.cannot-reach": {
    severity: "error",
    words: "cannot reach its range",
    explanation: "The linkage locks or cannot assemble inside a joint's range.",
  },
  // balance
  "balance.unbalanced": {
    severity: "error",
    words: "out of balance",
    explanation: "Holding a payload needs more hand force than `require balance` allows somewhere in range.",
  },
  "balance.drifts": {
    severity: "warning",
    words: "drifts",
    explanation: "A pivot's friction does not hold the arm over part of its range.",
  },
  "balance.out-of-travel": {
    severity: "error",
    words: "adjuster cannot reach",
    explanation:
      "Part of a payload's mass range cannot be held within `require balance` at any setting in an adjuster's travel (`adjust`).",
  },
  // geometry checks
  "geometry.spring-toggle": {
    severity: "warning",
    words: "spring nearly through its pivot",
    explanation:
      "A spring's line of action passes close to the pivot it works about: its lever arm collapses.",
  },
  "geometry.spring-leverage": {
    severity: "warning",
    words: "spring pulls too hard",
    explanation:
      "A spring works at a small lever arm against the weight's, so it pulls many times the weight it balances.",
  },
  "geometry.spring-slack": {
    severity: "warning",
    words: "spring goes slack",
    explanation: "An extension spring or rubber cord is at or below its free length where it must pull.",
  },
  "geometry.tilt": {
    severity: "warning",
    words: "head tilts",
    explanation: "The head's orientation changes over the range by more than `require tilt`.",
  },
  "geometry.clearance": {
    severity: "warning",
    words: "parts too close",
    explanation: "Bodies come closer than `require clearance`, or go below the bench surface.",
  },
  "geometry.swivel-leans": {
    severity: "warning",
    words: "swivel axis leans",
    explanation:
      "A swivel's axis (its parent's y axis) leans away from vertical over the range: its heading would then change the gravity torque.",
  },
  "geometry.tipping": {
    severity: "error",
    words: "base tips over",
    explanation: "The base's restoring moment is short of `require tipping` times the overturning moment.",
  },
  // strength
  "strength.overstress": {
    severity: "error",
    words: "overstressed",
    explanation: "A part's safety factor is below `require safety`.",
  },
  "strength.overstretch": {
    severity: "error",
    words: "spring overstretched",
    explanation: "A spring goes past its max_length, max_stretch or max_angle.",
  },
  "strength.bearing": {
    severity: "error",
    words: "bearing overloaded",
    explanation: "A bearing's safety under the load it carries is below `require safety`.",
  },
  "strength.fastening": {
    severity: "error",
    words: "fastening too weak",
    explanation:
      "A fastening's safety (screws stripping or breaking, bolts, glue) is below `require safety`.",
  },
  "strength.spring-end": {
    severity: "error",
    words: "spring end too weak",
    explanation:
      "A spring's hook or torsion wire is overstressed, its body does not fit between its hooks, or its initial tension cannot be wound.",
  },
  // stiffness and vibration
  "stiffness.deflection": {
    severity: "warning",
    words: "sags too far",
    explanation: "The payload deflects under load by more than `require deflection`.",
  },
  "stiffness.tilt": {
    severity: "warning",
    words: "flexes out of level",
    explanation: "Elastic tilt plus head orientation change exceed `require tilt`.",
  },
  "stiffness.lean": {
    severity: "warning",
    words: "leans sideways",
    explanation:
      "The payload's elastic lean out of its stage's plane (twist and sideways bending below it) exceeds `require tilt`.",
  },
  "stiffness.low-frequency": {
    severity: "warning",
    words: "bounces (low frequency)",
    explanation: "The lowest natural frequency of the loaded arm is below `require frequency`.",
  },
  "stiffness.not-computed": {
    severity: "information",
    words: "stiffness not computed",
    explanation:
      "A stiffness figure could not be computed at some pose (the held arm is still a mechanism there).",
  },
  // robustness
  "analysis.budget": {
    severity: "warning",
    words: "analysis cut short",
    explanation: "The analysis stopped at its time budget; results are partial.",
  },
  "analysis.limit": {
    severity: "warning",
    words: "too large to analyse whole",
    explanation:
      "The spec is larger than a documented limit (docs/robustness.md); the part beyond it is left out.",
  },
  "analysis.internal": {
    severity: "error",
    words: "analysis failed",
    explanation: "The analysis hit an internal fault; this is a bug in Counterpoise.",
  },
} as const satisfies Record<string, CodeInfo>;

export type Code = keyof typeof CODES;
