// Moves the linkage from pose to pose and records kinematics and statics at each. Continuation:
// a tangent predictor dq/dtheta, then corrector iterations with the last factored Jacobian
// (chord method), falling back to full Newton-Raphson; the step halves on failure and the
// angle where it can go no further is where the linkage locks (Nikravesh 1988, ch. 4; Haug 1989,
// ch. 4). Statics: Phi_q^T lambda = Q with the same factorization (Lagrange multipliers), a
// sparse one (sparse-lu.ts); the holding torque of a single force comes from the tangents.
// One class (past the usual file length) because continuation and statics share the buffers and
// the factorization of the current pose.
import type { ArmModel, Spring, Vec2 } from "../model/types";
import type { LoadCase, Pose, PoseStatics, SpringDofTable, SpringState } from "./types";
import { SparseLu } from "./sparse-lu";
import {
  constraintJacobianInto,
  constraintResidual,
  sparseJacobian,
  updateAngles,
  type SparseJacobian,
} from "./constraints";
import { springTension, torsionSpringTorque } from "./forces";
import { handForceVector, torqueBeyondFriction } from "./hand-force";
import { wrapNear } from "./joint-graph";
import type { Linkage } from "./linkage";
import { pastDeadline } from "../stop";
import { turnedX, turnedY, worldX, worldY } from "./plane";
import { atJoint } from "../model/spring-kinds";
import { indexOf, springDofTable } from "./spring-table";

/** Converged when every constraint is met within 1e-10 (m, or rad for drives): a tenth of a
 * nanometre, far below any displayed digit and about 1e4 x the round-off of arm-sized numbers. */
export const NEWTON_TOLERANCE = 1e-10;
/** Chord iterations before switching to full Newton: from a tangent-predicted start a 10 deg step
 * leaves an error of order step^2, and the chord contracts it fast enough that 8 reach the
 * tolerance; a step that does not converge is halved. */
const CHORD_MAX_ITERATIONS = 8;
/** Full Newton converges quadratically in 3-6 iterations from a close start; 25 means lost. */
const NEWTON_MAX_ITERATIONS = 25;
/** Largest continuation step of a degree of freedom, rad (10 deg): small enough for the tangent
 * predictor to land in Newton's basin on an arm-sized linkage (a step that does not converge, or
 * that jumps branch, is halved), large enough that a sweep rarely needs sub-steps. 5 deg gave the
 * same poses on every sample at twice the cost. */
export const MAX_CONTINUATION_STEP = (10 * Math.PI) / 180;
/** Where a step no longer succeeds, halving stops at this size (0.01 deg): the lock angle is
 * reported to this resolution. */
export const LOCK_RESOLUTION = (0.01 * Math.PI) / 180;
/** A body turning more than this (rad) away from the predicted pose within one step means Newton
 * jumped to another assembly branch: treated as a failed step. */
const BRANCH_JUMP = 0.25;

interface PointSpring {
  spring: Spring;
  a: number;
  ax: number;
  ay: number;
  b: number;
  bx: number;
  by: number;
}
interface TorsionAt {
  spring: Spring & { kind: "torsion" };
  /** Graph joint index. */
  joint: number;
}

/** A pose's factored Jacobian and tangents (see PoseSolver.saveCurrent). */
export interface SavedFactors {
  lu: SparseLu;
  tangents: Float64Array;
}

export class PoseSolver {
  readonly n: number;
  readonly ndof: number;
  readonly q: Float64Array;
  private readonly qTrial: Float64Array;
  private readonly qPredicted: Float64Array;
  private readonly residual: Float64Array;
  private readonly step: Float64Array;
  private readonly jac: SparseJacobian;
  private luCurrent: SparseLu;
  private luTrial: SparseLu;
  /** Tangent dq/dtheta_d per dof at the current pose, dof-major. */
  private readonly tangents: Float64Array;
  private readonly unit: Float64Array;
  /** Scratch: where a generalized force is non-zero, and its holding torque per dof. */
  private readonly nonZeroAt: Int32Array;
  private readonly holdingScratch: Float64Array;
  private readonly dofIds: string[];
  /** Rows and columns of the poses' spring tables (shared by every pose). */
  private springRows: ReadonlyMap<string, number> = new Map();
  private dofColumns: ReadonlyMap<string, number> = new Map();
  readonly angles: Float64Array;
  private readonly moveStart: Float64Array;
  private readonly trialAngles: Float64Array;
  private readonly rhs: Float64Array;
  private readonly lambda: Float64Array;
  private readonly qSprings: Float64Array;
  private readonly qBodies: Float64Array;
  private readonly qCase: Float64Array;
  private readonly pointSprings: PointSpring[] = [];
  private readonly torsions: TorsionAt[] = [];
  private readonly model: ArmModel;
  private readonly payloadJ: Float64Array[];
  /** Body index of each payload (-1 base, -2 a body the base does not reach). */
  private readonly payloadBody: Int32Array;
  private readonly tau: Float64Array;
  /** Each dof's pivot friction, N*m, and its holding torque beyond it (what the hand supplies). */
  private readonly friction: Float64Array;
  private readonly tauBeyond: Float64Array;
  /** Number of LU factorizations so far (for the benchmark). */
  factorizations = 0;
  /** Set when the last moveTo stopped at the deadline rather than at a lock. */
  timedOut = false;
  /** Set when the last moveTo stopped at a dead point (the Jacobian's determinant changes sign:
   * the linkage passes a singular configuration, e.g. a parallelogram folding flat). */
  deadPoint = false;
  private singularAtTrial = false;

  constructor(
    readonly linkage: Linkage,
    readonly loadCases: LoadCase[],
    /** Record each body's velocity per dof in every pose (`Pose.bodyVelocities`), for the design
     * search, which moves spring ends to points no sweep has seen. */
    private readonly keepBodyVelocities = false,
  ) {
    const n = linkage.cs.n;
    this.model = linkage.model;
    this.n = n;
    this.ndof = linkage.dofs.length;
    this.q = Float64Array.from(linkage.qReference);
    this.qTrial = new Float64Array(n);
    this.qPredicted = new Float64Array(n);
    this.residual = new Float64Array(n);
    this.step = new Float64Array(n);
    this.jac = sparseJacobian(linkage.cs);
    this.luCurrent = new SparseLu(n, 4 * this.jac.rowIndex.length);
    this.luTrial = new SparseLu(n, 4 * this.jac.rowIndex.length);
    this.tangents = new Float64Array(Math.max(1, this.ndof) * n);
    this.unit = new Float64Array(n);
    this.nonZeroAt = new Int32Array(n);
    this.holdingScratch = new Float64Array(Math.max(1, this.ndof));
    this.dofIds = linkage.dofs.map((d) => d.id);
    this.angles = Float64Array.from(linkage.dofs, (d) => d.reference);
    this.moveStart = new Float64Array(this.ndof);
    this.trialAngles = new Float64Array(this.ndof);
    this.rhs = new Float64Array(n);
    this.lambda = new Float64Array(n);
    this.qSprings = new Float64Array(n);
    this.qBodies = new Float64Array(n);
    this.qCase = new Float64Array(n);
    const idx = linkage.graph.bodyIndex;
    this.payloadJ = this.model.payloads.map(() => new Float64Array(2 * Math.max(this.ndof, 1)));
    this.payloadBody = Int32Array.from(this.model.payloads, (p) => idx.get(p.body) ?? -2);
    this.tau = new Float64Array(Math.max(this.ndof, 1));
    this.tauBeyond = new Float64Array(Math.max(this.ndof, 1));
    this.friction = Float64Array.from(
      linkage.dofs,
      (d) => this.model.joints.find((j) => j.id === d.jointId)?.friction ?? 0,
    );
    for (const s of this.model.springs) {
      if (atJoint(s)) {
        const joint = linkage.graph.joints.findIndex((j) => j.id === s.joint);
        if (joint >= 0) this.torsions.push({ spring: s, joint });
        continue;
      }
      const a = idx.get(s.a.body);
      const b = idx.get(s.b.body);
      if (a === undefined || b === undefined) continue;
      this.pointSprings.push({
        spring: s,
        a,
        ax: s.a.point.x,
        ay: s.a.point.y,
        b,
        bx: s.b.point.x,
        by: s.b.point.y,
      });
    }
    // record() visits the point springs first, then the torsion springs: the rows' order
    this.springRows = indexOf(this.activeSprings().map((sp) => sp.id));
    this.dofColumns = indexOf(this.dofIds);
  }

  /** Springs the solver applies (both ends on bodies the base reaches). */
  activeSprings(): Spring[] {
    return [...this.pointSprings.map((p) => p.spring), ...this.torsions.map((t) => t.spring)];
  }

  private setDriveAngles(angles: Float64Array): void {
    const cs = this.linkage.cs;
    for (let d = 0; d < this.ndof; d++) cs.driveTheta[this.linkage.dofDrive[d]!] = angles[d]!;
  }

  /** Makes `q` (with dof values `angles`) the current pose: factors its Jacobian and computes
   * the tangents. False when the Jacobian is singular there. */
  setCurrent(q: Float64Array, angles: Float64Array): boolean {
    this.q.set(q);
    this.angles.set(angles);
    this.setDriveAngles(angles);
    return this.factorCurrent();
  }

  /** The current pose's factorization and tangents, to come back to it later without factoring
   * its Jacobian again (the sweep continues several neighbours from one pose). */
  saveCurrent(): SavedFactors {
    return { lu: this.luCurrent.clone(), tangents: Float64Array.from(this.tangents) };
  }

  /** setCurrent for a pose saved by saveCurrent at exactly this q: the factors setCurrent would
   * compute there (the same Jacobian, so the same numbers) are copied back instead. */
  restoreCurrent(q: Float64Array, angles: Float64Array, saved: SavedFactors): void {
    this.q.set(q);
    this.angles.set(angles);
    this.setDriveAngles(angles);
    updateAngles(this.linkage.cs, this.q);
    this.luCurrent.copyFrom(saved.lu);
    this.tangents.set(saved.tangents);
  }

  private factorCurrent(): boolean {
    updateAngles(this.linkage.cs, this.q);
    constraintJacobianInto(this.linkage.cs, this.jac);
    this.factorizations++;
    const ok = this.luCurrent.factor(this.jac);
    if (ok) this.computeTangents(this.luCurrent);
    return ok;
  }

  private computeTangents(lu: SparseLu): void {
    const n = this.n;
    for (let d = 0; d < this.ndof; d++) {
      this.unit.fill(0);
      this.unit[this.linkage.driveRow[this.linkage.dofDrive[d]!]!] = 1;
      lu.solve(this.unit, this.rhs);
      this.tangents.set(this.rhs, d * n);
    }
  }

  /** Moves from the current pose to dof values `target` by continuation. On failure the current
   * pose stays at the last angles reached (the lock) and false is returned. */
  moveTo(target: Float64Array, deadline = Infinity): boolean {
    this.timedOut = false;
    this.deadPoint = false;
    const ndof = this.ndof;
    const n = this.n;
    const start = this.moveStart;
    start.set(this.angles);
    let span = 0;
    for (let d = 0; d < ndof; d++) span = Math.max(span, Math.abs(target[d]! - start[d]!));
    if (span === 0) return true;
    const maxFraction = MAX_CONTINUATION_STEP / span;
    const minFraction = LOCK_RESOLUTION / span;
    let s = 0;
    let h = Math.min(1, maxFraction);
    const trialAngles = this.trialAngles;
    let tries = 0;
    while (s < 1) {
      // A long move (a huge range) checks the clock now and then.
      if ((++tries & 63) === 0 && pastDeadline(deadline)) {
        this.timedOut = true;
        return false;
      }
      const sNew = Math.min(1, s + h);
      const ds = sNew - s;
      this.qPredicted.set(this.q);
      for (let d = 0; d < ndof; d++) {
        trialAngles[d] = start[d]! + sNew * (target[d]! - start[d]!);
        const move = ds * (target[d]! - start[d]!);
        if (move === 0) continue;
        const t = this.tangents;
        const o = d * n;
        for (let i = 0; i < n; i++) this.qPredicted[i]! += t[o + i]! * move;
      }
      this.setDriveAngles(trialAngles);
      const corrected = this.correct();
      const crossed = corrected && this.luTrial.determinantSign !== this.luCurrent.determinantSign;
      if (crossed || (!corrected && this.singularAtTrial)) this.deadPoint = true;
      if (corrected && !crossed) {
        this.deadPoint = false;
        // Accept: the trial factorization becomes the current one.
        const swap = this.luCurrent;
        this.luCurrent = this.luTrial;
        this.luTrial = swap;
        this.q.set(this.qTrial);
        this.angles.set(trialAngles);
        this.computeTangents(this.luCurrent);
        s = sNew;
        h = Math.min(2 * h, maxFraction);
      } else {
        this.setDriveAngles(this.angles);
        h /= 2;
        if (h < minFraction) return false;
      }
    }
    return true;
  }

  /** Corrects qPredicted into qTrial and factors the Jacobian there into luTrial. */
  private correct(): boolean {
    this.singularAtTrial = false;
    const cs = this.linkage.cs;
    const q = this.qTrial;
    q.set(this.qPredicted);
    let converged = false;
    let previous = Infinity;
    for (let it = 0; it < CHORD_MAX_ITERATIONS; it++) {
      const r = constraintResidual(cs, q, this.residual);
      if (r < NEWTON_TOLERANCE) {
        converged = true;
        break;
      }
      if (!(r < previous)) break;
      previous = r;
      this.luCurrent.solve(this.residual, this.step);
      for (let i = 0; i < this.n; i++) q[i]! -= this.step[i]!;
    }
    if (!converged) {
      q.set(this.qPredicted);
      for (let it = 0; it < NEWTON_MAX_ITERATIONS; it++) {
        const r = constraintResidual(cs, q, this.residual);
        if (r < NEWTON_TOLERANCE) {
          converged = true;
          break;
        }
        if (!Number.isFinite(r)) return false;
        constraintJacobianInto(cs, this.jac);
        this.factorizations++;
        if (!this.luTrial.factor(this.jac)) return false;
        this.luTrial.solve(this.residual, this.step);
        for (let i = 0; i < this.n; i++) q[i]! -= this.step[i]!;
      }
      if (!converged) return false;
    }
    for (let b = 0; b < cs.bodyCount; b++)
      if (Math.abs(q[3 * b + 2]! - this.qPredicted[3 * b + 2]!) > BRANCH_JUMP) return false;
    updateAngles(cs, q);
    constraintJacobianInto(cs, this.jac);
    this.factorizations++;
    const ok = this.luTrial.factor(this.jac);
    // Converged onto a pose whose Jacobian is singular: the linkage sits on a dead point.
    if (!ok) this.singularAtTrial = true;
    return ok;
  }

  /** World position of a body's local point at the current pose (needs updateAngles). */
  private world(body: number, x: number, y: number): Vec2 {
    if (body < 0) return { x, y };
    const cs = this.linkage.cs;
    const c = cs.cos[body]!;
    const s = cs.sin[body]!;
    return { x: worldX(this.q[3 * body]!, c, s, x, y), y: worldY(this.q[3 * body + 1]!, c, s, x, y) };
  }

  private addForce(
    Q: Float64Array,
    body: number,
    x: number,
    y: number,
    fx: number,
    fy: number,
    scale = 1,
  ): void {
    if (body < 0) return;
    const cs = this.linkage.cs;
    const c = cs.cos[body]!;
    const s = cs.sin[body]!;
    const rx = turnedX(c, s, x, y);
    const ry = turnedY(c, s, x, y);
    Q[3 * body]! += scale * fx;
    Q[3 * body + 1]! += scale * fy;
    Q[3 * body + 2]! += scale * (rx * fy - ry * fx);
  }

  private jointAngle(joint: number): number {
    const g = this.linkage.graph;
    const p = g.parent[joint]!;
    const c = g.child[joint]!;
    const rel = (c >= 0 ? this.q[3 * c + 2]! : 0) - (p >= 0 ? this.q[3 * p + 2]! : 0);
    return wrapNear(rel, this.linkage.referenceAngles[joint]!);
  }

  /** Kinematics and statics of the current pose, for every load case. */
  record(index: number): Pose {
    const L = this.linkage;
    const g = L.graph;
    const cs = L.cs;
    const n = this.n;
    const ndof = this.ndof;
    const model = this.model;
    const gravity = model.gravity;
    updateAngles(cs, this.q);

    // Plain loops rather than forEach here and below: `poise` runs a small spec without the
    // optimising compiler, where a callback a pose and item costs a call each.
    const angles: Record<string, number> = {};
    for (let i = 0; i < ndof; i++) angles[L.dofs[i]!.id] = this.angles[i]!;
    const jointAngles: Record<string, number> = {};
    for (let i = 0; i < g.joints.length; i++) jointAngles[g.joints[i]!.id] = this.jointAngle(i);
    const bodies: Pose["bodies"] = { [g.baseId]: { x: 0, y: 0, phi: 0 } };
    for (let b = 0; b < g.bodyIds.length; b++)
      bodies[g.bodyIds[b]!] = { x: this.q[3 * b]!, y: this.q[3 * b + 1]!, phi: this.q[3 * b + 2]! };

    // Springs: state, tension, generalized force and the holding torque per unit of tension.
    const springs: Record<string, SpringState> = {};
    const springForce: Record<string, number> = {};
    const springTorquePerUnit = springDofTable(this.springRows, this.dofColumns);
    const springTorque = springDofTable(this.springRows, this.dofColumns);
    this.qSprings.fill(0);
    for (const ps of this.pointSprings) {
      const wa = this.world(ps.a, ps.ax, ps.ay);
      const wb = this.world(ps.b, ps.bx, ps.by);
      const dx = wb.x - wa.x;
      const dy = wb.y - wa.y;
      const length = Math.hypot(dx, dy);
      const tension = springTension(model, ps.spring as Exclude<Spring, { kind: "torsion" }>, length);
      springs[ps.spring.id] = { length, a: wa, b: wb };
      springForce[ps.spring.id] = tension;
      this.unit.fill(0);
      if (length > 0) {
        const ux = dx / length;
        const uy = dy / length;
        this.addForce(this.unit, ps.a, ps.ax, ps.ay, ux, uy);
        this.addForce(this.unit, ps.b, ps.bx, ps.by, -ux, -uy);
      }
      this.addSpring(ps.spring.id, tension, springTorquePerUnit, springTorque);
    }
    for (const t of this.torsions) {
      const theta = this.jointAngle(t.joint);
      const torque = torsionSpringTorque(t.spring, theta, g.joints[t.joint]!.angle);
      const j = g.joints[t.joint]!;
      const pivot = this.world(g.parent[t.joint]!, j.parentPoint.x, j.parentPoint.y);
      springs[t.spring.id] = {
        length: NaN,
        a: pivot,
        b: pivot,
        windUp: t.spring.rate !== 0 ? torque / t.spring.rate : theta - j.angle,
      };
      springForce[t.spring.id] = torque;
      this.unit.fill(0);
      const p = g.parent[t.joint]!;
      const c = g.child[t.joint]!;
      if (p >= 0) this.unit[3 * p + 2]! += 1;
      if (c >= 0) this.unit[3 * c + 2]! -= 1;
      this.addSpring(t.spring.id, torque, springTorquePerUnit, springTorque);
    }

    // Gravity on every body's centre of mass.
    this.qBodies.fill(0);
    for (const body of model.bodies) {
      const b = g.bodyIndex.get(body.id);
      if (b === undefined || b < 0 || body.mass === 0) continue;
      this.addForce(this.qBodies, b, body.centreOfMass.x, body.centreOfMass.y, 0, -body.mass * gravity);
    }
    const bodiesGravityTorque = this.holdingFrom(this.qBodies);

    // Payload Jacobians dp/dtheta from the tangents.
    const payloadJacobian: Record<string, Record<string, Vec2>> = {};
    const payloadJ = this.payloadJ;
    const payloadBody = this.payloadBody;
    for (let k = 0; k < model.payloads.length; k++) {
      const p = model.payloads[k]!;
      const b = payloadBody[k]!;
      const jac = payloadJ[k]!;
      jac.fill(0);
      if (b !== undefined && b >= 0) {
        const c = cs.cos[b]!;
        const s = cs.sin[b]!;
        const rx = turnedX(c, s, p.point.x, p.point.y);
        const ry = turnedY(c, s, p.point.x, p.point.y);
        for (let d = 0; d < ndof; d++) {
          const o = d * n + 3 * b;
          const w = this.tangents[o + 2]!;
          jac[2 * d] = this.tangents[o]! - ry * w;
          jac[2 * d + 1] = this.tangents[o + 1]! + rx * w;
        }
      }
      const rec: Record<string, Vec2> = {};
      for (let i = 0; i < ndof; i++) rec[L.dofs[i]!.id] = { x: jac[2 * i]!, y: jac[2 * i + 1]! };
      payloadJacobian[p.id] = rec;
    }

    const cases: PoseStatics[] = [];
    for (const lc of this.loadCases) cases.push(this.caseStatics(lc, springForce, bodiesGravityTorque));
    return {
      index,
      angles,
      jointAngles,
      bodies,
      springs,
      cases,
      payloadJacobian,
      springTorquePerUnit,
      springTorque,
      ...(this.keepBodyVelocities ? { bodyVelocities: this.bodyVelocities() } : {}),
    };
  }

  /** The statics of load case `lc` at the current pose (record() has set the springs' and the
   * bodies' generalized forces and the payloads' Jacobians). */
  private caseStatics(
    lc: LoadCase,
    springForce: Record<string, number>,
    bodiesGravityTorque: Record<string, number>,
  ): PoseStatics {
    const L = this.linkage;
    const g = L.graph;
    const n = this.n;
    const ndof = this.ndof;
    const model = this.model;
    const gravity = model.gravity;
    const payloadJ = this.payloadJ;
    const payloadBody = this.payloadBody;
    const tau = this.tau;
    this.qCase.set(this.qSprings);
    for (let i = 0; i < n; i++) this.qCase[i]! += this.qBodies[i]!;
    for (let k = 0; k < model.payloads.length; k++) {
      const p = model.payloads[k]!;
      const b = payloadBody[k]!;
      if (b < 0) continue;
      const mass = lc.payloadMass[p.id] ?? p.mass;
      this.addForce(this.qCase, b, p.point.x, p.point.y, p.force?.x ?? 0, (p.force?.y ?? 0) - mass * gravity);
      // a working torque's in-plane part is a couple on the payload's body
      if (p.torque?.z) this.qCase[3 * b + 2]! += p.torque.z;
    }
    this.luCurrent.solveTransposed(this.qCase, this.lambda);
    const holdingTorque: Record<string, number> = {};
    for (let i = 0; i < ndof; i++) {
      const v = -this.lambda[L.driveRow[L.dofDrive[i]!]!]!;
      tau[i] = v;
      holdingTorque[L.dofs[i]!.id] = v;
    }
    const lockedTorque: Record<string, number> = {};
    for (let di = 0; di < L.driveKind.length; di++) {
      if (L.driveKind[di] === "dof") continue;
      lockedTorque[g.joints[L.driveJoint[di]!]!.id] = -this.lambda[L.driveRow[di]!]!;
    }
    const reactions: Record<string, Vec2> = {};
    for (let ji = 0; ji < g.joints.length; ji++) {
      const rx = L.revRow[2 * ji]!;
      const ry = L.revRow[2 * ji + 1]!;
      reactions[g.joints[ji]!.id] = { x: rx >= 0 ? this.lambda[rx]! : 0, y: ry >= 0 ? this.lambda[ry]! : 0 };
    }
    // The parts of that torque. Holding torque is the generalized force's virtual work along
    // each dof's tangent (lambda_d = t_d . Q), so a force F at a payload's centre adds
    // -(dp/dtheta) . F: the payload Jacobian gives the payloads' weights and steady forces.
    const gravityTorque: Record<string, number> = {};
    const loadTorque: Record<string, number> = {};
    for (let i = 0; i < ndof; i++) {
      const d = L.dofs[i]!;
      let weight = bodiesGravityTorque[d.id]!;
      let load = 0;
      for (let k = 0; k < model.payloads.length; k++) {
        const p = model.payloads[k]!;
        if (payloadBody[k]! < 0) continue;
        const jx = payloadJ[k]![2 * i]!;
        const jy = payloadJ[k]![2 * i + 1]!;
        weight += (lc.payloadMass[p.id] ?? p.mass) * gravity * jy;
        if (p.force) load -= p.force.x * jx + p.force.y * jy;
        // a couple's virtual work along the dof: T times the body's turn per unit dof
        if (p.torque?.z) load -= p.torque.z * this.tangents[i * n + 3 * payloadBody[k]! + 2]!;
      }
      gravityTorque[d.id] = weight;
      loadTorque[d.id] = load;
    }
    const handForce: Record<string, number> = {};
    const handForceVectorRec: Record<string, Vec2> = {};
    const beyond = torqueBeyondFriction(tau, this.friction, this.tauBeyond, ndof);
    for (let k = 0; k < model.payloads.length; k++) {
      if (payloadBody[k]! < -1) continue;
      const p = model.payloads[k]!;
      const f = handForceVector(payloadJ[k]!, beyond, ndof);
      handForce[p.id] = Math.hypot(f.x, f.y);
      handForceVectorRec[p.id] = f;
    }
    return {
      holdingTorque,
      handForce,
      handForceVector: handForceVectorRec,
      reactions,
      lockedTorque,
      springForce,
      gravityTorque,
      loadTorque,
    };
  }

  /** Each moving body's (dx/dtheta, dy/dtheta, dphi/dtheta) per dof, dof after dof. */
  private bodyVelocities(): Record<string, Float64Array> {
    const g = this.linkage.graph;
    const n = this.n;
    const out: Record<string, Float64Array> = {};
    g.bodyIds.forEach((id, b) => {
      const v = new Float64Array(3 * this.ndof);
      for (let d = 0; d < this.ndof; d++) {
        v[3 * d] = this.tangents[d * n + 3 * b]!;
        v[3 * d + 1] = this.tangents[d * n + 3 * b + 1]!;
        v[3 * d + 2] = this.tangents[d * n + 3 * b + 2]!;
      }
      out[id] = v;
    });
    return out;
  }

  /** Adds a spring of force `force` whose unit generalized force is in `this.unit`: to the
   * springs' generalized force, and its holding torque per unit of force and its share of the
   * holding torque to the pose's records. */
  private addSpring(id: string, force: number, perUnit: SpringDofTable, share: SpringDofTable): void {
    const count = this.nonZerosOf(this.unit);
    const at = this.nonZeroAt;
    for (let m = 0; m < count; m++) this.qSprings[at[m]!]! += force * this.unit[at[m]!]!;
    const torque = this.holdingAt(this.unit, count);
    const o = this.springRows.get(id)! * this.ndof;
    for (let d = 0; d < this.ndof; d++) {
      perUnit.values[o + d] = torque[d]!;
      share.values[o + d] = torque[d]! * force;
    }
  }

  /** Where Q is non-zero, into this.nonZeroAt; returns how many. */
  private nonZerosOf(Q: Float64Array): number {
    const at = this.nonZeroAt;
    let count = 0;
    for (let i = 0; i < this.n; i++) if (Q[i] !== 0) at[count++] = i;
    return count;
  }

  /** Holding torque per dof caused by the generalized force Q, whose non-zeros nonZerosOf has
   * listed (sign: what the hand adds), into a scratch array. The multiplier of dof d's drive row
   * is t_d . Q (J t_d = e_row, so e_row^T J^-T Q = t_d^T Q): the tangents give it over Q's few
   * non-zeros, without a transposed solve. */
  private holdingAt(Q: Float64Array, count: number): Float64Array {
    const n = this.n;
    const at = this.nonZeroAt;
    const t = this.tangents;
    const out = this.holdingScratch;
    for (let d = 0; d < this.ndof; d++) {
      const o = d * n;
      let sum = 0;
      for (let m = 0; m < count; m++) sum += t[o + at[m]!]! * Q[at[m]!]!;
      out[d] = -sum;
    }
    return out;
  }

  /** holdingAt as a record by dof id. */
  private holdingFrom(Q: Float64Array): Record<string, number> {
    const torque = this.holdingAt(Q, this.nonZerosOf(Q));
    const out: Record<string, number> = {};
    for (let d = 0; d < this.ndof; d++) out[this.dofIds[d]!] = torque[d]!;
    return out;
  }
}
