// Results of the kinematic and static sweep: plain data keyed by model ids, SI units.
// Hover, inlay hints, checks, the preview, the report and `poise sweep` all read these.
import type { Vec2 } from "../model/types";
import type { Finding } from "../findings/finding";

/** Origin of a body's frame in world coordinates and its x axis angle from horizontal, rad. */
export interface BodyPose {
  x: number;
  y: number;
  phi: number;
}

/** A degree of freedom: a joint with a range. A parallelogram's is named after it. */
export interface Dof {
  id: string;
  jointId: string;
  range: [number, number];
  reference: number;
}

/** One assignment of payload masses; the nominal case first, then the ends of mass ranges. */
export interface LoadCase {
  id: string;
  label: string;
  payloadMass: Record<string, number>;
}

export interface SpringState {
  /** Hook-to-hook length, m (torsion: NaN). */
  length: number;
  /** World hook points (torsion: the pivot, twice). */
  a: Vec2;
  b: Vec2;
  /** Torsion springs: wind-up angle from free, rad. */
  windUp?: number;
}

export interface PoseStatics {
  /** Torque a hand or brake must apply at each degree of freedom to hold the pose, N*m, CCW
   * positive (applied to the child relative to the parent), by dof id. */
  holdingTorque: Record<string, number>;
  /** Least force at each payload's centre that holds the pose, with each pivot's friction holding
   * what it can (the holding torque beyond friction), N, by payload id. */
  handForce: Record<string, number>;
  /** Force the parent exerts on the child at each joint, world, N, by joint id. */
  reactions: Record<string, Vec2>;
  /** Torque the parent exerts on the child at locked (fixed) joints, N*m, by joint id. */
  lockedTorque: Record<string, number>;
  /** Spring tension (N, positive pulls the hooks together) or torsion torque (N*m), by spring id. */
  springForce: Record<string, number>;
  /** The hand force itself, world, N, by payload id: the least force at the payload's centre
   * that holds the pose (its magnitude is `handForce`). Added by the mechanics core. */
  handForceVector?: Record<string, Vec2>;
  /** The part of `holdingTorque` that gravity causes (the bodies' weights and the payloads' at this
   * case's masses), N*m, by dof id. With `loadTorque` and the springs' parts
   * (`Pose.springTorque`) it adds up to `holdingTorque` (to round-off). Added by the mechanics core. */
  gravityTorque?: Record<string, number>;
  /** The part of `holdingTorque` that the payloads' steady working forces cause, N*m, by dof id.
   * Added by the mechanics core. */
  loadTorque?: Record<string, number>;
}

/** A figure per spring and degree of freedom, one typed array a pose: row `springIndex.get(id)`,
 * column `dofIndex.get(id)` (rows in the order the solver applies the springs, columns in
 * `SweepResult.dofs` order); the two maps are shared by every pose of a sweep. An object per
 * spring keyed by dof ids made springs x dofs boxed numbers a pose (3,200 at 120 bodies), whose
 * copying by the garbage collector was a fifth of the analysis. Read it with
 * mechanics/spring-table.ts. */
export interface SpringDofTable {
  springIndex: ReadonlyMap<string, number>;
  dofIndex: ReadonlyMap<string, number>;
  /** springIndex.size x dofIndex.size, row by row. */
  values: Float64Array;
}

export interface Pose {
  /** Position in `poses`. */
  index: number;
  /** Value of each degree of freedom, rad, by dof id. */
  angles: Record<string, number>;
  /** Relative angle of every joint (child x from parent x), rad, by joint id. */
  jointAngles: Record<string, number>;
  bodies: Record<string, BodyPose>;
  springs: Record<string, SpringState>;
  /** Statics per load case, same order as `SweepResult.loadCases`. */
  cases: PoseStatics[];
  /** dp/dtheta of each payload's centre per degree of freedom, m/rad, by payload then dof id.
   * Added by the mechanics core. */
  payloadJacobian?: Record<string, Record<string, Vec2>>;
  /** Change of each dof's holding torque per unit of a spring's force (N*m per N of tension;
   * torsion: per N*m of its torque T), by spring and dof: holding torque is affine in each
   * spring's force, which the best-fit readouts use. Added by the mechanics core. */
  springTorquePerUnit?: SpringDofTable;
  /** Each spring's part of the holding torque (its force times `springTorquePerUnit`), N*m, by
   * spring and dof; the same in every load case, since a spring's force depends on the pose
   * alone. Added by the mechanics core. */
  springTorque?: SpringDofTable;
  /** Each moving body's velocity per unit of each dof: (dx/dtheta, dy/dtheta, dphi/dtheta) of its
   * frame's origin, dof after dof in `SweepResult.dofs` order, by body id (the base has none).
   * Only when the sweep was asked for it (the design search). */
  bodyVelocities?: Record<string, Float64Array>;
}

export interface SweepResult {
  dofs: Dof[];
  loadCases: LoadCase[];
  /** The reference pose (every joint at its angle), when it assembles. */
  reference?: Pose;
  /** Poses in sweep order: a grid (last dof fastest) or each dof alone, others at reference. */
  poses: Pose[];
  /** Steps actually used per dof. */
  steps: number;
  grid: boolean;
  /** Set when a quick pass (while typing) swept fewer steps than the spec's own: the sweep planner
   * (sweep-plan.ts) says so, and the spec's own density is still to run. */
  quick?: true;
  /** Kinematic findings: geometry.loop-open, geometry.cannot-reach, joint.unheld, ... */
  findings: Finding[];
}
