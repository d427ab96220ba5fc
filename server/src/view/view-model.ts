// The arm view model: plain JSON the preview panel and the HTML report draw from. Built once per
// analysis (build-view-model.ts). SI like the rest of the core (m, rad, kg, N, N*m); the drawing,
// plots and tables show figures through units/format in the reader's unit system.
import type { ResultsRecord } from "../checks/results";

/** 0-based line/character range, as editors count them (so the client can reveal it as is). */
export interface ViewRange {
  start: { line: number; character: number };
  end: { line: number; character: number };
}

export type PartStatus = "ok" | "warning" | "error";

/** A declaration the reader can point at: clicking it in the drawing reveals this range. */
export interface ViewPart {
  id: string;
  kind: "base" | "link" | "joint" | "parallelogram" | "spring" | "payload";
  range: ViewRange;
  status: PartStatus;
  /** Codes of the findings on this part (for the drawing's tooltip). */
  codes: string[];
}

/** A drawable body: its centre line in local m and its drawn thickness (section depth). */
export interface ViewBody {
  id: string;
  /** The part it belongs to (a parallelogram's bars and head belong to the parallelogram). */
  partId: string;
  kind: "base" | "link" | "bar" | "head";
  /** Centre line, local m: a polyline of [x, y] points. */
  line: [number, number][];
  /** Thin brackets from the centre line out to points off it (hooks, payload seats), local m. */
  brackets: [number, number, number, number][];
  /** Section depth in the arm's plane, m (drawn to scale); undefined when the section is not given. */
  depth?: number;
}

export interface ViewPivot {
  jointId: string;
  partId: string;
  /** The child body and the pivot's point on it, local m. */
  body: string;
  local: [number, number];
  mode: "range" | "fixed" | "passive";
  /** Pin diameter, m, when given. */
  pin?: number;
}

export interface ViewSpring {
  id: string;
  kind: "extension" | "zero_length" | "elastic" | "gas" | "torsion";
  /** Springs that act at a joint (torsion): the joint; the view tells them by it. */
  jointId?: string;
  /** Gas struts: length of the cylinder, m (the rest of the eye-to-eye length is rod). */
  cylinder?: number;
}

export interface ViewPayload {
  id: string;
  body: string;
  /** Its centre on the body, local m. */
  local: [number, number];
  /** Nominal mass, kg. */
  mass: number;
}

/** A swivel for the top view: it turns `carried` about the vertical through its point (the base's
 * yaw: everything but the base, about the base's origin). */
export interface ViewSwivel {
  id: string;
  /** The body that holds its axis, and the axis point on it, local m. */
  parent: string;
  local: [number, number];
  carried: string[];
  /** The range it turns through, rad (all the way round: [-pi, pi]). */
  heading: [number, number];
}

export interface ViewDof {
  id: string;
  /** Range and reference angle, rad. */
  range: [number, number];
  reference: number;
  /** The distinct values the sweep visited, rad, ascending. */
  values: number[];
}

/** One solved pose, nominal load case for the torques. */
export interface ViewPose {
  /** Value of each dof, rad, in `dofs` order. */
  angles: number[];
  /** Body frame origin (m) and x-axis angle (rad), by body id. */
  bodies: Record<string, [number, number, number]>;
  /** World hook points [ax, ay, bx, by] m, by spring id (torsion: the pivot twice). */
  springs: Record<string, [number, number, number, number]>;
  /** Holding torque from the sweep, N*m, in `dofs` order. */
  netTorque: number[];
  /** Its parts from the solver's statics (gravity, the springs together, the steady loads), N*m,
   * in `dofs` order. */
  gravityTorque: number[];
  springTorque: number[];
  loadTorque: number[];
  /** Hand force per payload beyond what the pivots' friction holds, N, one value per load case;
   * signed: positive where the arm sinks (the hand lifts), negative where it rises. */
  handForce: Record<string, number[]>;
  /** The nominal case's hand force per payload as if no pivot had friction, N, signed; only when
   * some joint has friction. */
  handForceFree?: Record<string, number>;
  /** Spring tension N (torsion: torque N*m), by spring id, nominal case. */
  springForce: Record<string, number>;
}

/** A spring end on a body, local m. */
export interface ViewEnd {
  body: string;
  local: [number, number];
}

/** A tuned spring in the drawing: the design the text holds is drawn as every spring is; `other`
 * is the other design's place (dashed), absent for a spring at a joint. */
export interface ViewTuneSpring {
  id: string;
  kind: ViewSpring["kind"];
  other?: [ViewEnd, ViewEnd];
  /** Whether the tune run moves an end (else only its rate, tension or size change, and the
   * drawing names it in the legend without drawing it again on top of itself). */
  moved: boolean;
  /** What the tune run changes, in the spec's own units (`rate 0.7845 N/mm`). */
  changes: string[];
}

/** Anchor points at which the arm balances with the spring as the text has it (its rate kept),
 * local m on `body`: along rays from `pivot`. */
export interface ViewTuneLocus {
  spring: string;
  body: string;
  pivot: [number, number];
  /** Where the arm floats at the reference pose (polylines). */
  atReference: [number, number][][];
  /** Where it balances at every pose (within `tolerance`, N); empty when nowhere in reach. */
  exact: [number, number][];
  tolerance: number;
  /** Why there is no locus at all. */
  reason?: string;
}

/** The result of a tune run the user asked for, laid over the drawing of either text: the
 * present one (the tuned values not written yet) or the tuned one (written). */
export interface ViewTune {
  /** Which design the text holds: "present" (the other is the tuned proposal) or "tuned" (the
   * other is the design before tuning). */
  textIs: "present" | "tuned";
  /** Words for the other design in legends: "as tuned" or "before tuning". */
  otherLabel: string;
  springs: ViewTuneSpring[];
  /** The other design's signed hand force per payload (nominal case, beyond friction, N), for
   * each pose of `poses` (same index); null where the other design has no such pose. */
  otherHandForce: (Record<string, number> | null)[];
  /** Worst hand force over every pose and payload mass, N: before and after tuning. */
  worstBefore?: number;
  worstAfter?: number;
  /** For the design the text holds. */
  locus: ViewTuneLocus[];
}

export interface SafetyRow {
  partId: string;
  /** The readout's id (a parallelogram's bar or pin may be listed under its own id). */
  id: string;
  kind: string;
  value: number;
  what: string;
  where?: string;
  required: number;
}

export interface ViewFinding {
  code: string;
  severity: "error" | "warning" | "information" | "hint";
  message: string;
  range: ViewRange;
  partId?: string;
}

export interface ViewModel {
  /** 2: SI figures (1 held mm and deg). */
  version: 2;
  title: string;
  /** The reader's unit system for figures and labels (the numbers here stay SI). */
  units: "si" | "us";
  /** Bench surface height, m. */
  surface: number;
  /** Base footprint width along x, m, centred on x = 0, when given. */
  footprint?: number;
  /** Base footprint depth across the drawing plane, m, when given (the top view draws it). */
  footprintDepth?: number;
  /** Swivels, deepest first (a swivel carried by another comes before it), when the arm turns
   * somewhere above its base: the preview and the report then show a top view. */
  swivels?: ViewSwivel[];
  /** World extent over every pose, m: [minX, minY, maxX, maxY]. */
  bounds: [number, number, number, number];
  parts: ViewPart[];
  bodies: ViewBody[];
  pivots: ViewPivot[];
  springs: ViewSpring[];
  payloads: ViewPayload[];
  dofs: ViewDof[];
  loadCases: { id: string; label: string }[];
  poses: ViewPose[];
  /** Index into `poses` of the pose nearest the reference. */
  referencePose: number;
  /** The reference pose itself when no swept pose is exactly at it (a grid whose steps miss the
   * written angles): the report draws this one. */
  reference?: ViewPose;
  /** For each dof (same order), runs of pose indices along which only that dof changes, sorted by
   * its angle: a plot against that dof uses the run through the current pose. */
  lines: number[][][];
  /** Payload paths: polylines (world m) along the outer edges of the swept range, by payload. */
  envelope: Record<string, [number, number][][]>;
  /** `require balance` per payload, N. */
  balanceLimit: Record<string, number>;
  requiredSafety: number;
  safety: SafetyRow[];
  /** Every figure behind the checks, pass or fail (SI, each with its dimension). */
  results?: ResultsRecord;
  findings: ViewFinding[];
  /** How the torque split was computed, for the plots' caption. */
  torqueMethod: string;
  /** Why there is nothing to draw, when there is nothing. */
  emptyReason?: string;
  /** Set when the sweep had more poses than the view carries (every k-th value of each dof kept). */
  thinned?: { shown: number; solved: number };
  /** A tune run's result over this drawing, when the user asked for one (docs/tuning.md). */
  tune?: ViewTune;
  /** Set when the drawing is of an earlier text than the editor's (the current one builds no arm). */
  staleNote?: string;
}
