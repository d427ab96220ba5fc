// Every diagnostic code, its default severity and a one-line explanation that docs and hovers
// reuse. The one place codes are defined; `data.ts` gives each code the shape of its data.

export type Severity = "error" | "warning" | "information" | "hint";

export interface CodeInfo {
  severity: Severity;
  explanation: string;
}

export const CODES = {
  // text and model
  "syntax.error": { severity: "error", explanation: "The text does not follow the language's grammar." },
  "unit.missing": { severity: "error", explanation: "A number that needs a unit has none." },
  "unit.unknown": { severity: "error", explanation: "The unit is not one the language knows." },
  "unit.wrong-dimension": {
    severity: "error",
    explanation: "The quantity has the wrong dimension for the property.",
  },
  "name.unknown": { severity: "error", explanation: "A reference names nothing declared (or built in)." },
  "name.duplicate": { severity: "error", explanation: "Two declarations share a name." },
  "name.unknown-point": {
    severity: "error",
    explanation: "A reference names a point the body does not have.",
  },
  "property.missing": { severity: "error", explanation: "A required property is missing." },
  "property.unknown": { severity: "error", explanation: "The declaration has no such property." },
  "property.repeated": {
    severity: "warning",
    explanation: "A property is given twice; the last one counts.",
  },
  "property.conflict": { severity: "error", explanation: "Two properties contradict each other." },
  "value.invalid": { severity: "error", explanation: "The value has the wrong shape for the property." },
  "value.impossible": {
    severity: "error",
    explanation: "The value cannot describe a real part (zero or negative size, reversed range, ...).",
  },
  "arm.missing": { severity: "error", explanation: "The file has no `arm` block." },
  "arm.second": { severity: "error", explanation: "A file holds one arm; a second `arm` block is ignored." },
  "declaration.unknown": {
    severity: "error",
    explanation: "The word before a `{ }` block is not a kind of declaration.",
  },
  "base.missing": {
    severity: "error",
    explanation: "The arm has no `base`: nothing is fixed to the ground.",
  },
  "base.second": { severity: "error", explanation: "An arm has one base; a second `base` is ignored." },
  "payload.weightless": {
    severity: "warning",
    explanation: "A payload of zero mass with no force loads nothing.",
  },
  "payload.on-base": {
    severity: "warning",
    explanation: "A payload sits on the base: no joint carries it, so it takes no part in balance.",
  },
  "spring.same-body": {
    severity: "warning",
    explanation: "Both hooks of a spring are on one body: it pulls the body on itself and does nothing.",
  },
  "joint.unheld": { severity: "error", explanation: "A passive joint that no closed loop determines." },
  "body.unconnected": { severity: "warning", explanation: "A body no joint connects to the base." },
  "sweep.capped": { severity: "warning", explanation: "The requested sweep was too large and was capped." },
  // kinematics
  "geometry.loop-open": {
    severity: "error",
    explanation: "A closed loop does not meet at its reference pose.",
  },
  "geometry.cannot-reach": {
    severity: "error",
    explanation: "The linkage locks or cannot assemble inside a joint's range.",
  },
  // balance
  "balance.unbalanced": {
    severity: "error",
    explanation: "Holding a payload needs more hand force than `require balance` allows somewhere in range.",
  },
  "balance.drifts": {
    severity: "warning",
    explanation: "A pivot's friction does not hold the arm over part of its range.",
  },
  // geometry checks
  "geometry.spring-toggle": {
    severity: "warning",
    explanation:
      "A spring's line of action passes close to the pivot it works about: its lever arm collapses.",
  },
  "geometry.spring-leverage": {
    severity: "warning",
    explanation:
      "A spring works at a small lever arm against the weight's, so it pulls many times the weight it balances.",
  },
  "geometry.spring-slack": {
    severity: "warning",
    explanation: "An extension spring or rubber cord is at or below its free length where it must pull.",
  },
  "geometry.tilt": {
    severity: "warning",
    explanation: "The head's orientation changes over the range by more than `require tilt`.",
  },
  "geometry.clearance": {
    severity: "warning",
    explanation: "Bodies come closer than `require clearance`, or go below the bench surface.",
  },
  "geometry.swivel-leans": {
    severity: "warning",
    explanation:
      "A swivel's axis (its parent's y axis) leans away from vertical over the range: its heading would then change the gravity torque.",
  },
  "geometry.tipping": {
    severity: "error",
    explanation: "The base's restoring moment is short of `require tipping` times the overturning moment.",
  },
  // strength
  "strength.overstress": {
    severity: "error",
    explanation: "A part's safety factor is below `require safety`.",
  },
  "strength.overstretch": {
    severity: "error",
    explanation: "A spring goes past its max_length, max_stretch or max_angle.",
  },
  "strength.bearing": {
    severity: "error",
    explanation: "A bearing's safety under the load it carries is below `require safety`.",
  },
  "strength.fastening": {
    severity: "error",
    explanation:
      "A fastening's safety (screws stripping or breaking, bolts, glue) is below `require safety`.",
  },
  "strength.spring-end": {
    severity: "error",
    explanation:
      "A spring's hook or torsion wire is overstressed, its body does not fit between its hooks, or its initial tension cannot be wound.",
  },
  // stiffness and vibration
  "stiffness.deflection": {
    severity: "warning",
    explanation: "The payload deflects under load by more than `require deflection`.",
  },
  "stiffness.tilt": {
    severity: "warning",
    explanation: "Elastic tilt plus head orientation change exceed `require tilt`.",
  },
  "stiffness.lean": {
    severity: "warning",
    explanation:
      "The payload's elastic lean out of its stage's plane (twist and sideways bending below it) exceeds `require tilt`.",
  },
  "stiffness.low-frequency": {
    severity: "warning",
    explanation: "The lowest natural frequency of the loaded arm is below `require frequency`.",
  },
  "stiffness.not-computed": {
    severity: "information",
    explanation:
      "A stiffness figure could not be computed at some pose (the held arm is still a mechanism there).",
  },
  // robustness
  "analysis.budget": {
    severity: "warning",
    explanation: "The analysis stopped at its time budget; results are partial.",
  },
  "analysis.limit": {
    severity: "warning",
    explanation:
      "The spec is larger than a documented limit (docs/robustness.md); the part beyond it is left out.",
  },
  "analysis.internal": {
    severity: "error",
    explanation: "The analysis hit an internal fault; this is a bug in Counterpoise.",
  },
} as const satisfies Record<string, CodeInfo>;

export type Code = keyof typeof CODES;
