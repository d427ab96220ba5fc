// The design search's measure of a candidate: the worst hand force over every pose, load case
// and payload (beyond what the pivots' friction holds, as the balance check has it), and how far it breaks the limits the search must keep (spring lengths, stretch,
// stroke and wind-up; coil body stress; friction that held before), from one solved sweep.
// Springs do not move the arm, so the poses stay; only the tuned springs' parts of the holding
// torque change. A spring's holding torque per newton of tension is dL/dtheta (virtual work),
// from its ends' velocities; the rest of the holding torque is the sweep's own.
import type { ArmModel, Spring } from "../model/types";
import type { Pose, SweepResult } from "../mechanics/types";
import { springTension, torsionSpringTorque } from "../mechanics/forces";
import { handForceVector, torqueBeyondFriction } from "../mechanics/hand-force";
import { springWireStrength } from "../checks/spring-strength";
import { coilBodyShearStress } from "../mechanics/structure/spring-stress";
import {
  defaultHook,
  hookBendingStress,
  initialStressRange,
  initialTensionStress,
  hookTorsionStress,
  shortestFreeLength,
  torsionSpringWireStress,
} from "../mechanics/hardware/spring-ends";
import type { CheckContext } from "../checks/index";
import { springDofValue, springRow } from "../mechanics/spring-table";

export interface Measure {
  /** Worst hand force over every pose, case and payload, N: beyond what the pivots' friction
   * holds, as the balance check judges it (a pose friction holds needs no hand). */
  worst: number;
  /** The same as if no pivot had friction, N (the search's tie-break: of two designs friction
   * holds alike, the one that leans on it less). */
  worstFree: number;
  /** Per payload, N. */
  byPayload: Record<string, number>;
  /** How far the candidate breaks a kept limit, summed as fractions of each limit (0: keeps all). */
  violation: number;
  /** What it breaks, in a few words each (for a result that cannot keep them). */
  broken: string[];
}

/** Relative slack on a limit (lengths at a limit to rounding). */
const LIMIT_SLACK = 1e-9;
/** The values are written to four figures, which moves one by up to 5e-4 of itself: a fit the
 * re-check must find (coils and hooks within the free length) is kept with this much to spare. */
const WRITTEN_ROUNDING = 1e-3;
/** A safety already short of the requirement may not fall: kept this much above where it is. */
const SAFETY_MARGIN = 0.01;

export class HandForceMeasure {
  private readonly ndof: number;
  private readonly dofIds: string[];
  /** Per pose, per case: the holding torque without the tuned springs' parts, dof after dof. */
  private readonly baseTorque: Float64Array[][];
  /** Per pose, per payload: the payload Jacobian (x, y per dof). */
  private readonly jacobians: (Float64Array | undefined)[][];
  private readonly poses: Pose[];
  private readonly add: Float64Array;
  private readonly tau: Float64Array;
  /** Scratch: the holding torque beyond each dof's friction. */
  private readonly beyond: Float64Array;
  /** Each dof's pivot friction, N*m (0: none), in dof order. */
  private readonly dofFriction: Float64Array;
  /** Scratch: the two ends' velocities (x, y per dof). */
  private readonly va: Float64Array;
  private readonly vb: Float64Array;
  /** Each tuned torsion spring's joint. */
  private readonly jointOf = new Map<string, { id: string; angle: number }>();
  private readonly friction: { dof: number; friction: number; before: number }[] = [];
  /** Each tuned spring's body stress safety before (coil-defined extension springs). */
  private readonly safetyBefore = new Map<string, number>();
  private readonly required: number;
  /** Each tuned coil extension spring's initial stress over the windable most, now. */
  private readonly initialBefore = new Map<string, number>();

  constructor(
    private readonly model: ArmModel,
    private readonly sweep: SweepResult,
    private readonly tuned: readonly Spring[],
  ) {
    this.ndof = sweep.dofs.length;
    this.dofIds = sweep.dofs.map((d) => d.id);
    this.poses = sweep.poses;
    this.add = new Float64Array(Math.max(1, this.ndof));
    this.tau = new Float64Array(Math.max(1, this.ndof));
    this.beyond = new Float64Array(Math.max(1, this.ndof));
    // The pose solver's own rule (mechanics/hand-force.ts): each dof's joint friction.
    this.dofFriction = Float64Array.from(
      sweep.dofs,
      (d) => model.joints.find((j) => j.id === d.jointId)?.friction ?? 0,
    );
    this.va = new Float64Array(2 * Math.max(1, this.ndof));
    this.vb = new Float64Array(2 * Math.max(1, this.ndof));
    for (const s of tuned)
      if (s.kind === "torsion") {
        const j = model.joints.find((x) => x.id === s.joint);
        if (j) this.jointOf.set(s.id, { id: j.id, angle: j.angle });
      }
    this.required = model.require.safety;
    const ids = new Set(tuned.map((s) => s.id));
    this.baseTorque = this.poses.map((pose) =>
      pose.cases.map((c) => {
        const t = new Float64Array(Math.max(1, this.ndof));
        this.dofIds.forEach((d, i) => {
          let v = c.holdingTorque[d] ?? 0;
          for (const id of ids) v -= springDofValue(pose.springTorque, id, d) ?? 0;
          t[i] = v;
        });
        return t;
      }),
    );
    this.jacobians = this.poses.map((pose) =>
      model.payloads.map((p) => {
        const pj = pose.payloadJacobian?.[p.id];
        if (!pj) return undefined;
        const j = new Float64Array(2 * Math.max(1, this.ndof));
        this.dofIds.forEach((d, i) => {
          j[2 * i] = pj[d]?.x ?? 0;
          j[2 * i + 1] = pj[d]?.y ?? 0;
        });
        return j;
      }),
    );
    // Friction that holds a joint: the tuned design must hold wherever it held before, and drift
    // no further where it did not (its worst excess over friction, as a fraction, may not grow).
    sweep.dofs.forEach((d, i) => {
      const joint = model.joints.find((j) => j.id === d.jointId);
      if (!joint?.friction) return;
      let before = 0;
      for (const pose of this.poses)
        for (const c of pose.cases)
          before = Math.max(before, (Math.abs(c.holdingTorque[d.id] ?? 0) - joint.friction) / joint.friction);
      this.friction.push({ dof: i, friction: joint.friction, before: Math.max(0, before) });
    });
    for (const s of tuned) {
      const ratio = this.initialStressRatio(s);
      if (ratio !== undefined) this.initialBefore.set(s.id, ratio);
      const sf = this.bodySafety(s, this.largestForce(s));
      if (sf !== undefined) this.safetyBefore.set(s.id, sf);
    }
  }

  /** The measure of the design with `springs` in place of the tuned ones (same order). With
   * `mass`, one payload at that mass and the others at their nominal ones (the nominal case's
   * holding torque plus the weight's change, m g dy/dtheta by virtual work), instead of every
   * load case. */
  measure(springs: readonly Spring[], mass?: { payload: string; kg: number }): Measure {
    const byPayload: Record<string, number> = {};
    let worst = 0;
    let worstFree = 0;
    let violation = 0;
    const broken = new Set<string>();
    const ndof = this.ndof;
    const payloads = this.model.payloads;
    const frictionExcess = this.friction.map(() => 0);
    const largest = springs.map(() => 0);
    for (let pi = 0; pi < this.poses.length; pi++) {
      const pose = this.poses[pi]!;
      this.add.fill(0);
      springs.forEach((s, k) => {
        const f = this.springPart(s, pose);
        if (!f) return;
        if (Math.abs(f.force) > largest[k]!) largest[k] = Math.abs(f.force);
        if (f.over > 0) {
          violation += f.over;
          broken.add(f.limit);
        }
      });
      const cases = mass ? this.baseTorque[pi]!.slice(0, 1) : this.baseTorque[pi]!;
      const shift = mass ? this.weightShift(pi, mass) : undefined;
      for (let ci = 0; ci < cases.length; ci++) {
        const base = cases[ci]!;
        for (let d = 0; d < ndof; d++) this.tau[d] = base[d]! + this.add[d]! + (shift ? shift[d]! : 0);
        this.friction.forEach((fr, k) => {
          const e = (Math.abs(this.tau[fr.dof]!) - fr.friction) / fr.friction;
          if (e > frictionExcess[k]!) frictionExcess[k] = e;
        });
        torqueBeyondFriction(this.tau, this.dofFriction, this.beyond, ndof);
        for (let k = 0; k < payloads.length; k++) {
          const j = this.jacobians[pi]![k];
          if (!j) continue;
          const free = handForceVector(j, this.tau, ndof);
          const hf = Math.hypot(free.x, free.y);
          if (!(hf <= worstFree)) worstFree = hf;
          const v = handForceVector(j, this.beyond, ndof);
          const h = Math.hypot(v.x, v.y);
          const id = payloads[k]!.id;
          if (!(h <= (byPayload[id] ?? 0))) byPayload[id] = h;
          if (!(h <= worst)) worst = h;
        }
      }
    }
    this.friction.forEach((fr, k) => {
      const grew = frictionExcess[k]! - fr.before;
      if (frictionExcess[k]! > LIMIT_SLACK && grew > LIMIT_SLACK) {
        violation += grew;
        broken.add(`the friction at ${this.dofIds[fr.dof]} no longer holds`);
      }
    });
    springs.forEach((s, k) => {
      const sf = this.bodySafety(s, largest[k]!);
      if (sf === undefined) return;
      const before = this.safetyBefore.get(s.id) ?? Infinity;
      // Short of the requirement already: no lower, with a margin for the rounding of the written
      // values (four figures move a wire's stress by about a tenth of a percent).
      const need = before < this.required ? before * (1 + SAFETY_MARGIN) : this.required;
      if (sf < need * (1 - LIMIT_SLACK)) {
        violation += need / sf - 1;
        broken.add(`spring ${s.id}'s wire stress`);
      }
    });
    springs.forEach((s) => {
      const ratio = this.initialStressRatio(s);
      if (ratio === undefined) return;
      // More than a maker can wind (the spring-end check's warning): not past the preferred
      // range, or where the present spring is past it already, no further.
      const allowed = Math.max(1 - WRITTEN_ROUNDING, this.initialBefore.get(s.id) ?? 0);
      if (ratio > allowed) {
        violation += ratio / allowed - 1;
        broken.add(`spring ${s.id}'s initial tension`);
      }
    });
    return { worst, worstFree, byPayload, violation, broken: [...broken] };
  }

  /** The nominal case's holding torque at pose `pi` with `springs` in place of the tuned ones
   * (same order), per dof, N*m (a fresh array). */
  holdingTorque(springs: readonly Spring[], pi: number): Float64Array {
    const pose = this.poses[pi]!;
    this.add.fill(0);
    for (const s of springs) this.springPart(s, pose);
    const base = this.baseTorque[pi]![0]!;
    const out = new Float64Array(Math.max(1, this.ndof));
    for (let d = 0; d < this.ndof; d++) out[d] = base[d]! + this.add[d]!;
    return out;
  }

  /** Index of a dof in the holding torque's order (-1: none). */
  dofIndex(id: string): number {
    return this.dofIds.indexOf(id);
  }

  /** The change of the nominal case's holding torque when one payload weighs `kg`, per dof. */
  private weightShift(pi: number, mass: { payload: string; kg: number }): Float64Array {
    const out = new Float64Array(Math.max(1, this.ndof));
    const k = this.model.payloads.findIndex((p) => p.id === mass.payload);
    const j = k >= 0 ? this.jacobians[pi]![k] : undefined;
    const nominal = this.sweep.loadCases[0]?.payloadMass[mass.payload] ?? this.model.payloads[k]?.mass ?? 0;
    if (j)
      for (let d = 0; d < this.ndof; d++) out[d] = (mass.kg - nominal) * this.model.gravity * j[2 * d + 1]!;
    return out;
  }

  /** Adds a spring's part of the holding torque at a pose to `this.add`; its force, and how far
   * it passes a limit there. */
  private springPart(s: Spring, pose: Pose): { force: number; over: number; limit: string } | undefined {
    const ndof = this.ndof;
    if (s.kind === "torsion") {
      const j = this.jointOf.get(s.id);
      const perUnit = springRow(pose.springTorquePerUnit, s.id);
      if (!j || !perUnit) return undefined;
      const theta = pose.jointAngles[j.id] ?? j.angle;
      const torque = torsionSpringTorque(s, theta, j.angle);
      for (let d = 0; d < ndof; d++)
        this.add[d]! += torque * (springDofValue(pose.springTorquePerUnit, s.id, this.dofIds[d]!) ?? 0);
      const windUp = s.rate !== 0 ? Math.abs(torque / s.rate) : 0;
      const over = s.maxAngle !== undefined ? windUp / s.maxAngle - 1 : 0;
      return { force: torque, over: over > LIMIT_SLACK ? over : 0, limit: `spring ${s.id}'s max_angle` };
    }
    const a = this.end(pose, s.a.body, s.a.point.x, s.a.point.y, this.va);
    const b = this.end(pose, s.b.body, s.b.point.x, s.b.point.y, this.vb);
    if (!a || !b) return undefined;
    const dx = b.x - a.x;
    const dy = b.y - a.y;
    const length = Math.hypot(dx, dy);
    const tension = springTension(this.model, s, length);
    if (length > 0) {
      const ux = dx / length;
      const uy = dy / length;
      // dL/dtheta_d = (vB - vA) . u: the holding torque per newton of tension.
      for (let d = 0; d < ndof; d++) {
        const dl = (b.v[2 * d]! - a.v[2 * d]!) * ux + (b.v[2 * d + 1]! - a.v[2 * d + 1]!) * uy;
        this.add[d]! += tension * dl;
      }
    }
    let over = 0;
    let limit = "";
    if (s.kind === "extension" && s.coil) {
      // The body and its hooks must fit in the free length (the spring-end check's body room).
      const shortest = shortestFreeLength(s.coil.bodyCoils, s.coil.meanDiameter, s.coil.wireDiameter);
      if (shortest > s.freeLength * (1 - WRITTEN_ROUNDING)) {
        over += shortest / (s.freeLength * (1 - WRITTEN_ROUNDING)) - 1;
        limit = `spring ${s.id}'s coils fit in its free length`;
      }
    }
    if (s.kind === "extension" && s.maxLength !== undefined && length > s.maxLength) {
      over += length / s.maxLength - 1;
      limit = `spring ${s.id}'s max_length`;
    } else if (s.kind === "elastic" && s.maxStretch !== undefined && s.freeLength > 0) {
      over = length / s.freeLength / s.maxStretch - 1;
      limit = `cord ${s.id}'s max_stretch`;
    } else if (s.kind === "gas") {
      const closed = s.extendedLength - s.stroke;
      over = Math.max(length / s.extendedLength - 1, closed > 0 ? 1 - length / closed : 0);
      limit = `strut ${s.id}'s stroke`;
    }
    return { force: tension, over: over > LIMIT_SLACK ? over : 0, limit };
  }

  /** A point of a body at a pose, world, and its velocity per dof (x, y per dof) into `v`. */
  private end(
    pose: Pose,
    body: string,
    lx: number,
    ly: number,
    v: Float64Array,
  ): { x: number; y: number; v: Float64Array } | undefined {
    const f = pose.bodies[body];
    if (!f) return undefined;
    const c = Math.cos(f.phi);
    const s = Math.sin(f.phi);
    const rx = c * lx - s * ly;
    const ry = s * lx + c * ly;
    v.fill(0);
    const bv = pose.bodyVelocities?.[body];
    if (bv)
      for (let d = 0; d < this.ndof; d++) {
        const w = bv[3 * d + 2]!;
        v[2 * d] = bv[3 * d]! - ry * w;
        v[2 * d + 1] = bv[3 * d + 1]! + rx * w;
      }
    return { x: f.x + rx, y: f.y + ry, v };
  }

  /** A coil-defined extension spring's initial stress over the most a maker can wind into its
   * index (Shigley 10th ed., section 10-11, as the spring-end check has it); undefined for others. */
  private initialStressRatio(s: Spring): number | undefined {
    if (s.kind !== "extension" || !s.coil || !(s.initialTension > 0)) return undefined;
    const D = s.coil.meanDiameter;
    const d = s.coil.wireDiameter;
    return initialTensionStress(s.initialTension, D, d) / initialStressRange(D / d).high;
  }

  /** The largest force a spring pulls with over the sweep now, N (torsion: N*m). */
  private largestForce(s: Spring): number {
    let m = 0;
    for (const pose of this.poses) m = Math.max(m, Math.abs(pose.cases[0]?.springForce[s.id] ?? 0));
    return m;
  }

  /** The least safety of a coil-defined spring's wire at its largest force, against the shares of
   * S_ut the strength checks use: an extension spring's body (Shigley eq. 10-7, Bergstraesser
   * factor) and its default hooks in bending and torsion (eqs. 10-34, 10-35); a torsion spring's
   * wire in bending (section 10-12). */
  private bodySafety(s: Spring, force: number): number | undefined {
    if ((s.kind !== "extension" && s.kind !== "torsion") || !s.coil || !(force > 0)) return undefined;
    const wire = springWireStrength({ model: this.model } as CheckContext, s.coil);
    if (!wire) return undefined;
    const D = s.coil.meanDiameter;
    const d = s.coil.wireDiameter;
    const ratio = (share: number, stress: number) =>
      stress > 0 ? (share * wire.tensile) / stress : Infinity;
    if (s.kind === "torsion")
      return ratio(wire.allowables.torsionSpringBending, torsionSpringWireStress(force, D, d));
    const hook = defaultHook(D, d);
    return Math.min(
      ratio(wire.allowables.extensionBodyTorsion, coilBodyShearStress(force, D, d)),
      ratio(wire.allowables.extensionHookBending, hookBendingStress(force, D, d, hook)),
      ratio(wire.allowables.extensionHookTorsion, hookTorsionStress(force, D, d, hook)),
    );
  }
}
