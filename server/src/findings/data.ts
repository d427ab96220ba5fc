// The data each finding carries, by code: the model id of the part it is about (`subject`) and its
// figures, SI numbers (m, kg, N, N*m, rad, Pa, Hz). Quick fixes, hover, the view and
// `poise check --json` read these instead of the message, which is for people only.
//
// Adding a code: add it to CODES and give it a shape here (the check at the bottom fails until
// every code has one). Adding a figure to a code: add an optional field. Consumers switch on the
// codes they care about and ignore the rest, so neither touches the others.

/** What every finding's data has. */
export interface About {
  /**
   * The model id of the part the finding is about: a declaration's name, `reach.lower` for a body
   * a parallelogram generates, `reach.lower_root` for one of its joints. It is the part whose
   * words the finding points at, so the view and hover can find it without comparing spans.
   * Absent when the finding is about no one part (the file, the arm as a whole, `require`, `sweep`).
   */
  subject?: string;
  /** Set on a finding of the aged load case (`aged`): how long the arm has held its load, s. */
  agedAfter?: number;
}

/** A finding that is always about one part. */
export interface AboutPart extends About {
  subject: string;
}

/** Findings about the text as written: the words to change, and the words that would do. */
export interface TextData extends About {
  /** Replacement for exactly the words the finding points at (the closest name, a known unit, a
   * reversed range the right way round). */
  suggestion?: string;
  /** Text to insert just before the words the finding points at (a missing `to `). */
  insert?: string;
}

/** A required property is missing. */
export interface MissingData extends About {
  /** The keys that are missing (empty when one of several would do, e.g. a spring's kind). */
  keys: string[];
  /** Property lines that would supply them, as they would be typed. */
  lines: string[];
}

/** `joint.unheld`: a passive joint that nothing determines. */
export interface UnheldData extends AboutPart {
  /** Every passive joint of the same unheld block (model builder only). */
  joints?: string[];
  /** Degrees of freedom the block has too many (model builder only). */
  mobility?: number;
}

/** `sweep.capped`: the sweep asked for more poses than are solved. */
export interface CappedData extends About {
  /** Steps per degree of freedom asked for, and used. */
  requested: number;
  used: number;
  /** False when a grid was given up for sweeping each degree of freedom alone. */
  grid?: boolean;
  /** The limit of poses times moving bodies that capped it (docs/robustness.md, limits). */
  limit?: number;
}

/** `geometry.loop-open`: the closing joint's pivots at the reference pose. */
export interface LoopOpenData extends AboutPart {
  /** Distance between the two pivots that should meet, m. */
  gap: number;
  /** The joint angle at which the loop does meet (when only the angle is off), rad. */
  angle?: number;
}

/** `geometry.cannot-reach`: the linkage locks. */
export interface CannotReachData extends About {
  /** The dof's angle where it locks, rad. */
  lockAngle?: number;
  /** Which way the sweep was going when it locked. */
  direction?: "up" | "down";
  /** True at a dead point (pivots in line), where the linkage can fold either way. */
  deadPoint?: boolean;
}

/** `balance.out-of-travel`: with an `adjust` line, part of a payload's mass range cannot be
 * held within `require balance` at any setting inside the adjuster's travel. */
export interface OutOfTravelData extends AboutPart {
  payload: string;
  /** What the adjuster sets: `anchor`, `hook` or a property's key. */
  adjuster: string;
  /** The payload masses that cannot be balanced, kg, as runs [low, high] of the sampled masses. */
  masses: [number, number][];
  /** The hand force `require balance` allows, N. */
  limit: number;
  /** The least worst hand force any setting reaches over those masses, N. */
  worstHandForce: number;
}

/** `balance.unbalanced`: a payload takes more hand force than `require balance` allows. */
export interface UnbalancedData extends AboutPart {
  /** The spring whose retuning helps most when there is one (the finding is then on it and
   * `subject` is the spring), else the payload. */
  payload: string;
  /** The spring whose best fit lowers the worst hand force most; absent when no spring acts. */
  spring?: string;
  /** The hand force allowed, and the worst one over the range and load cases, N. */
  limit: number;
  worstHandForce: number;
  /** Where the worst hand force is: each dof's angle, rad, and the load case. */
  worstPose: Record<string, number>;
  caseId?: string;
  /** True when the arm sinks there (the hand must push up), false when it rises. */
  sinks: boolean;
  /** Worst hand force over every payload with `spring` as written and at its best fit, N. */
  worstHandForceBefore?: number;
  worstHandForceAfter?: number;
  /** The best-fit settings of `spring`, SI, by the property they go in (`rate`,
   * `initial_tension`, `preload`, `force`, `area`, ...: see the spring kinds' `fit`). Present
   * only when writing them in helps: a quick fix writes exactly these. */
  best?: Record<string, number>;
}

/** `balance.drifts`: a pivot's friction does not hold the arm. */
export interface DriftsData extends AboutPart {
  /** Runs of the dof's angle, rad, where the arm turns on its own. */
  ranges: [number, number][];
  /** Which way it turns over each run (seen with the arm's plane as drawn: x right, y up). */
  turns?: ("clockwise" | "counter-clockwise")[];
  /** Largest holding torque (signed, counter-clockwise positive) and the friction, N*m. */
  worstHoldingTorque: number;
  friction: number;
}

/** `geometry.spring-toggle`: a spring's lever arm about a pivot collapses. Subject: the spring. */
export interface ToggleData extends AboutPart {
  /** The joint it works about. */
  joint: string;
  /** Least lever arm of its line of action about that pivot, m. */
  leverArm: number;
}

/** `geometry.spring-leverage`: a spring pulls many times the weight it balances. Subject: the
 * spring. */
export interface LeverageData extends AboutPart {
  /** The joint it works about. */
  joint: string;
  /** Its largest pull (magnitude) over the range and load cases, the weight the joint carries
   * there, N, and their ratio. */
  force: number;
  weight: number;
  ratio: number;
  /** Largest lever arm of its line of action about the pivot, and of the weight (the horizontal
   * distance of the carried weight's centre from the pivot), over the range, m. */
  leverArm: number;
  weightArm: number;
  /** Largest force on the pin of `joint`, N. */
  pinReaction: number;
  /** The body its hook is on, and the largest compression the pull puts in it between the hook
   * and the pivot, N. */
  body?: string;
  compression?: number;
}

/** `geometry.spring-slack`: a spring or cord at or below its free length. Subject: the spring. */
export interface SlackData extends AboutPart {
  /** Poses where it is slack, of `posesSwept`. */
  poses: number;
  posesSwept: number;
  /** Shortest length where slack, and its free length, m. */
  shortest: number;
  freeLength: number;
}

/** `geometry.tilt`: a parallelogram's head turns too much over the range. Subject: the stage. */
export interface HeadTiltData extends AboutPart {
  /** Orientation change of the head over the range, and the limit, rad. */
  change: number;
  limit: number;
  /** The payload whose `require tilt` sets the limit. */
  payload?: string;
}

/** `geometry.clearance`: two bodies too close, or a part too near or below the bench. */
export interface ClearanceData extends AboutPart {
  /** The other body of a pair. */
  other?: string;
  /** Least gap between the pair (negative: overlap), m. */
  gap?: number;
  /** How far the part goes below the bench surface (negative: above it by that much), m. */
  below?: number;
}

/** A safety factor against its requirement. */
export interface SafetyData extends AboutPart {
  safety: number;
  required: number;
}

/** `geometry.tipping`. Subject: the base body. */
export interface TippingData extends SafetyData {
  /** Overturning and restoring moments about the footprint's edge at the worst pose, N*m. */
  overturning: number;
  restoring: number;
}

/** `strength.overstress`: a part's safety factor is short. */
export interface OverstressData extends SafetyData {
  /** What fails: `stress` or `buckling` of a body, `pin` of a joint, `coil` body of a spring. */
  check: "stress" | "buckling" | "pin" | "coil";
}

/** `strength.bearing`: a bearing under the load of the part that turns on it. Subject: that part
 * (the joint, or the swivel: the base's id for its yaw); the words are its `bearing` (a swivel's
 * `bearings` or `thrust`). */
export interface BearingData extends SafetyData {
  bearing: string;
  /** What limits it: the most loaded ball's contact, a thrust ring tipping, the rating, the bore. */
  check: "ball contact" | "tipping" | "static rating" | "bore pressure";
  /** Loads through it at the worst pose, N and N*m. */
  radial: number;
  axial: number;
  moment: number;
  /** Most loaded ball, N; peak contact pressure and its allowable, Pa; static equivalent load, N;
   * bore pressure, Pa: the figures of its kind. */
  ballLoad?: number;
  contactPressure?: number;
  allowablePressure?: number;
  equivalentLoad?: number;
  borePressure?: number;
}

/** `strength.fastening`: a fastening under the load through it. Subject: the part that uses it;
 * the words are its `fastening`, `anchor_fastening` or `hook_fastening`. */
export interface FasteningData extends SafetyData {
  fastening: string;
  /** The key that names it in the using part. */
  use: string;
  /** What fails first. */
  check:
    | "thread stripping"
    | "screw"
    | "bolt"
    | "hole bearing"
    | "glue shear"
    | "glue peel"
    | "cannot hold a moment";
  /** Largest shear and tension on one screw or bolt, N (glue: over the whole bond). */
  shear: number;
  tension: number;
}

/** `strength.spring-end`. Subject: the spring. */
export interface SpringEndData extends AboutPart {
  check: "hook bending" | "hook torsion" | "body room" | "initial tension" | "torsion wire";
  /** For stress checks: the safety and the requirement. */
  safety?: number;
  required?: number;
  /** Stress and its allowable, Pa (stress checks; initial tension: its stress and the nearer end
   * of the range a spring maker can wind). */
  stress?: number;
  allowable?: number;
  /** Body room: the shortest length the coil can have and the length it is given or pulled to, m. */
  shortest?: number;
  length?: number;
}

/** `strength.overstretch`: a spring past its limit. Subject: the spring. */
export interface OverstretchData extends AboutPart {
  /** The property whose limit is passed (`max_length`, `max_stretch`, `max_angle`, `stroke`,
   * `extended_length`). */
  limitKey: string;
  /** The limit, in the figure's own terms (m, a ratio, or rad). */
  limit: number;
  /** The figure past it: a length (m), a stretch ratio, or a wind-up (rad). */
  length?: number;
  stretch?: number;
  windUp?: number;
}

/** `stiffness.deflection`. Subject: the most compliant body when known, else the payload. */
export interface DeflectionData extends AboutPart {
  payload: string;
  /** Deflection under load, and the limit, m. */
  deflection: number;
  limit: number;
}

/** `stiffness.tilt`. Subject: the part that gives most of the tilt: the parallelogram whose head
 * turns over the range, else the body with the largest share of the elastic tilt, else the payload. */
export interface ElasticTiltData extends AboutPart {
  payload: string;
  /** Total, elastic and geometric (head orientation change) tilt, and the limit, rad. */
  tilt: number;
  elastic: number;
  geometric: number;
  limit: number;
}

/** `stiffness.lean`. Subject: the body that gives most of it, else the payload. */
export interface LeanData extends AboutPart {
  payload: string;
  /** Elastic lean out of the stage's plane, and the limit (require tilt), rad. */
  lean: number;
  limit: number;
}

/** `stiffness.low-frequency`. Subject: the most flexible body, when one stands out. */
export interface FrequencyData extends About {
  /** Lowest natural frequency, and the one required, Hz. */
  frequency: number;
  required: number;
  /** Which way the lowest mode moves the arm: in its plane, or sideways out of it (sway and
   * twist). */
  direction?: "in-plane" | "sideways";
}

/** `stiffness.not-computed`: the held arm is still a mechanism at some poses checked. Subject:
 * the payload whose deflection and tilt are missing there (absent for the frequency). */
export interface NotComputedData extends About {
  payload?: string;
  /** How many of the poses checked could not be solved. */
  poses: number;
}

/** `analysis.budget`. */
export interface BudgetData extends About {
  /** Poses solved, of those planned. */
  solved?: number;
  planned?: number;
  /** The budget, ms, when a phase that cannot stop midway used it up and checks were cut short. */
  budgetMs?: number;
}

/** `analysis.limit`: the spec passes a documented limit (server/src/limits.ts). */
export interface LimitData extends About {
  /** The limit: characters of text, or moving bodies solved. */
  limit: number;
  /** The text's length, characters (a text too long). */
  length?: number;
  /** Bodies left out (too many moving bodies). */
  leftOut?: number;
}

/** `geometry.swivel-leans`. Subject: the swivel. */
export interface SwivelLeansData extends AboutPart {
  /** Largest angle of the axis from vertical over the range, rad. */
  lean: number;
}

/** The data of each code. */
export interface FindingDataMap {
  "syntax.error": TextData;
  "unit.missing": TextData;
  "unit.unknown": TextData;
  "unit.wrong-dimension": TextData;
  "name.unknown": TextData;
  "name.duplicate": TextData;
  "name.unknown-point": TextData;
  "property.missing": MissingData;
  "property.unknown": TextData;
  "property.repeated": TextData;
  "property.conflict": TextData;
  "value.invalid": TextData;
  "value.impossible": TextData;
  "arm.missing": TextData;
  "arm.second": TextData;
  "declaration.unknown": TextData;
  "base.missing": TextData;
  "base.second": TextData;
  "payload.weightless": TextData;
  "payload.on-base": TextData;
  "spring.same-body": TextData;
  "adjust.no-range": TextData;
  "joint.unheld": UnheldData;
  "body.unconnected": AboutPart;
  "sweep.capped": CappedData;
  "geometry.loop-open": LoopOpenData;
  "geometry.cannot-reach": CannotReachData;
  "balance.unbalanced": UnbalancedData;
  "balance.drifts": DriftsData;
  "balance.out-of-travel": OutOfTravelData;
  "geometry.spring-toggle": ToggleData;
  "geometry.spring-leverage": LeverageData;
  "geometry.spring-slack": SlackData;
  "geometry.tilt": HeadTiltData;
  "geometry.clearance": ClearanceData;
  "geometry.swivel-leans": SwivelLeansData;
  "geometry.tipping": TippingData;
  "strength.overstress": OverstressData;
  "strength.overstretch": OverstretchData;
  "strength.bearing": BearingData;
  "strength.fastening": FasteningData;
  "strength.spring-end": SpringEndData;
  "stiffness.deflection": DeflectionData;
  "stiffness.tilt": ElasticTiltData;
  "stiffness.lean": LeanData;
  "stiffness.low-frequency": FrequencyData;
  "stiffness.not-computed": NotComputedData;
  "analysis.budget": BudgetData;
  "analysis.limit": LimitData;
  "analysis.internal": About;
}
