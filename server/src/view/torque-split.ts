// Splits each pose's holding torque into its gravity, spring and steady-load parts by virtual
// work over neighbouring poses of the sweep (the sweep itself only gives the net torque).
//
// Method: along a run where only dof theta moves, the hand must supply the torque that cancels
// the generalized applied force Q = -dV/dtheta (Lagrange; any statics text, e.g. Haug 1989):
//   gravity part  = d/dtheta of g * sum(m * y_centre)        (bodies and payloads)
//   spring part   = sum over springs of F * dL/dtheta         (tension F pulls the hooks together,
//                                                               so its work on the arm is -F dL;
//                                                               torsion: T * d(wind-up)/dtheta;
//                                                               dL/dtheta is the solver's
//                                                               springTorquePerUnit where given)
//   load part     = -sum over payloads of Fsteady . dp/dtheta
// with the derivatives by three-point differences over the neighbouring poses of the run (central
// inside it, one-sided at its ends) and F, T taken from the sweep at the pose itself.
import type { ArmModel, Vec2 } from "../model/types";
import type { Pose, SweepResult } from "../mechanics/types";

export const TORQUE_METHOD =
  "Gravity, spring and load parts by virtual work: finite differences over neighbouring poses of " +
  "the gravity potential and of the payload points (times their steady force); each spring's force " +
  "from the sweep times its lever (the solver's torque per unit force, else the change of the " +
  "spring's length between neighbouring poses); net torque straight from the sweep.";

export interface TorqueSplit {
  /** [dof][pose], N*m; NaN where a pose has no neighbour along that dof. */
  gravity: Float64Array[];
  spring: Float64Array[];
  load: Float64Array[];
}

function worldPoint(pose: Pose, bodyId: string, local: Vec2): Vec2 | undefined {
  const b = pose.bodies[bodyId];
  if (!b) return undefined;
  const c = Math.cos(b.phi);
  const s = Math.sin(b.phi);
  return { x: b.x + c * local.x - s * local.y, y: b.y + s * local.x + c * local.y };
}

/** Gravity potential of the whole arm in a pose, J (nominal load case masses). */
export function gravityPotential(model: ArmModel, sweep: SweepResult, pose: Pose): number {
  let v = 0;
  for (const body of model.bodies) {
    if (body.kind === "base" || body.mass === 0) continue;
    const p = worldPoint(pose, body.id, body.centreOfMass);
    if (p) v += body.mass * model.gravity * p.y;
  }
  const masses = sweep.loadCases[0]?.payloadMass ?? {};
  for (const payload of model.payloads) {
    const p = worldPoint(pose, payload.body, payload.point);
    if (p) v += (masses[payload.id] ?? payload.mass) * model.gravity * p.y;
  }
  return v;
}

/** The coordinate a spring's force works through: its length, or a torsion spring's wind-up. */
function springStroke(model: ArmModel, pose: Pose, springIndex: number): number {
  const spring = model.springs[springIndex]!;
  const state = pose.springs[spring.id];
  if (spring.kind === "torsion") return state?.windUp ?? pose.jointAngles[spring.joint] ?? NaN;
  return state ? state.length : NaN;
}

/** Three-point (second-order) derivative weights at run position i: central inside the run,
 * one-sided at its ends, valid for uneven spacing (Lagrange interpolation); two points when the
 * run has only two. */
function stencil(
  run: readonly number[],
  i: number,
  angle: (p: number) => number,
): { at: number[]; w: number[] } {
  if (run.length === 2) {
    const h = angle(run[1]!) - angle(run[0]!);
    return { at: [run[0]!, run[1]!], w: [-1 / h, 1 / h] };
  }
  const j = Math.min(Math.max(i - 1, 0), run.length - 3);
  const at = [run[j]!, run[j + 1]!, run[j + 2]!];
  const [x0, x1, x2] = at.map(angle) as [number, number, number];
  const xe = angle(run[i]!);
  const w = [
    (2 * xe - x1 - x2) / ((x0 - x1) * (x0 - x2)),
    (2 * xe - x0 - x2) / ((x1 - x0) * (x1 - x2)),
    (2 * xe - x0 - x1) / ((x2 - x0) * (x2 - x1)),
  ];
  return { at, w };
}

function derivative(st: { at: number[]; w: number[] }, value: (p: number) => number): number {
  let sum = 0;
  for (let k = 0; k < st.at.length; k++) sum += st.w[k]! * value(st.at[k]!);
  return sum;
}

function springPart(
  model: ArmModel,
  poses: readonly Pose[],
  here: Pose,
  st: { at: number[]; w: number[] },
  dofId: string,
): number {
  const forces = here.cases[0]?.springForce ?? {};
  let sum = 0;
  for (let s = 0; s < model.springs.length; s++) {
    const id = model.springs[s]!.id;
    const f = forces[id];
    if (f === undefined || !Number.isFinite(f)) continue;
    // The solver's own dL/dtheta (holding torque per unit force), where it gives one: exact.
    const perUnit = here.springTorquePerUnit?.[id]?.[dofId];
    if (perUnit !== undefined && Number.isFinite(perUnit)) {
      sum += f * perUnit;
      continue;
    }
    const dL = derivative(st, (p) => springStroke(model, poses[p]!, s));
    if (Number.isFinite(dL)) sum += f * dL;
  }
  return sum;
}

function loadPart(model: ArmModel, poses: readonly Pose[], st: { at: number[]; w: number[] }): number {
  let sum = 0;
  for (const payload of model.payloads) {
    const force = payload.force;
    if (!force) continue;
    const work = derivative(st, (p) => {
      const w = worldPoint(poses[p]!, payload.body, payload.point);
      return w ? force.x * w.x + force.y * w.y : NaN;
    });
    if (Number.isFinite(work)) sum -= work;
  }
  return sum;
}

export function splitHoldingTorque(
  model: ArmModel,
  sweep: SweepResult,
  lines: readonly (readonly (readonly number[])[])[],
): TorqueSplit {
  const n = sweep.poses.length;
  const potential = new Float64Array(n);
  for (let p = 0; p < n; p++) potential[p] = gravityPotential(model, sweep, sweep.poses[p]!);
  const split: TorqueSplit = { gravity: [], spring: [], load: [] };
  sweep.dofs.forEach((dof, d) => {
    const gravity = new Float64Array(n).fill(NaN);
    const spring = new Float64Array(n).fill(NaN);
    const load = new Float64Array(n).fill(NaN);
    const angle = (p: number) => sweep.poses[p]!.angles[dof.id] ?? 0;
    for (const run of lines[d] ?? []) {
      if (run.length < 2) continue;
      for (let i = 0; i < run.length; i++) {
        const st = stencil(run, i, angle);
        if (!st.w.every(Number.isFinite)) continue;
        const p = run[i]!;
        gravity[p] = derivative(st, (q) => potential[q]!);
        spring[p] = springPart(model, sweep.poses, sweep.poses[p]!, st, dof.id);
        load[p] = loadPart(model, sweep.poses, st);
      }
    }
    split.gravity.push(gravity);
    split.spring.push(spring);
    split.load.push(load);
  });
  return split;
}
