// The loads each swivel carries at a pose (docs/checks.md, Swivels and Bearings): the wrench of
// everything it carries (weights, payload masses, working forces) at the swivel's point, split
// along and across its axis. A swivel is the only path from what it carries to the rest (no loop
// or spring passes it, model/build-swivels.ts), so the wrench is the carried parts' own loads,
// statically determinate. Its two radial bearings carry the tilting moment as a couple, M / D, plus
// the radial force they share; the thrust bearing the axial load. SI units.
import type { ArmModel, Swivel } from "../model/types";
import { carriedBodies } from "../model/build-swivels";
import type { Pose } from "./types";
import { headingCombinations, Placement, type Headings, type Vec3 } from "./headings";

/** What passes through one swivel, in its own axes. */
export interface SwivelLoad {
  /** Force along the axis, N (positive pressing the carried part down onto the thrust bearing). */
  axial: number;
  /** Force across the axis, N. */
  radial: number;
  /** Moment about the swivel's point across the axis (tilting the carried part), N*m. */
  moment: number;
  /** Moment about the axis (what its friction or a brake must hold), N*m. */
  twist: number;
  /** With `bearings D`: the radial load on the more loaded of the two bearings, M / D + radial / 2, N. */
  bearingRadial?: number;
}

function cross(a: Vec3, b: Vec3): Vec3 {
  return { x: a.y * b.z - a.z * b.y, y: a.z * b.x - a.x * b.z, z: a.x * b.y - a.y * b.x };
}
function dot(a: Vec3, b: Vec3): number {
  return a.x * b.x + a.y * b.y + a.z * b.z;
}

/** The wrench of the parts a swivel carries, about its point, world axes: force and moment. */
export function carriedWrench(
  model: ArmModel,
  placement: Placement,
  swivel: Swivel,
  carried: ReadonlySet<string>,
  payloadMass: Record<string, number>,
): { force: Vec3; moment: Vec3; at: Vec3 } {
  const at = placement.point(swivel.parent, swivel.point);
  const force = { x: 0, y: 0, z: 0 };
  const moment = { x: 0, y: 0, z: 0 };
  const addLoad = (p: Vec3, f: Vec3, m?: Vec3) => {
    const r = { x: p.x - at.x, y: p.y - at.y, z: p.z - at.z };
    const c = cross(r, f);
    force.x += f.x;
    force.y += f.y;
    force.z += f.z;
    moment.x += c.x + (m?.x ?? 0);
    moment.y += c.y + (m?.y ?? 0);
    moment.z += c.z + (m?.z ?? 0);
  };
  const g = model.gravity;
  for (const b of model.bodies)
    if (carried.has(b.id) && b.mass > 0)
      addLoad(placement.point(b.id, b.centreOfMass), { x: 0, y: -b.mass * g, z: 0 });
  for (const p of model.payloads) {
    if (!carried.has(p.body)) continue;
    const weight = { x: 0, y: -(payloadMass[p.id] ?? p.mass) * g, z: 0 };
    const f =
      p.force || p.forceAcross
        ? placement.direction(p.body, { x: p.force?.x ?? 0, y: p.force?.y ?? 0, z: p.forceAcross ?? 0 })
        : undefined;
    addLoad(
      placement.point(p.body, p.point),
      f ? { x: weight.x + f.x, y: weight.y + f.y, z: weight.z + f.z } : weight,
      p.torque ? placement.direction(p.body, p.torque) : undefined,
    );
  }
  return { force, moment, at };
}

const carriedCache = new WeakMap<ArmModel, Map<string, ReadonlySet<string>>>();
/** The bodies a swivel carries, computed once per model. */
function carriedOf(model: ArmModel, s: Swivel): ReadonlySet<string> {
  let byId = carriedCache.get(model);
  if (!byId) carriedCache.set(model, (byId = new Map()));
  let set = byId.get(s.id);
  if (!set) byId.set(s.id, (set = carriedBodies(model.joints, s).bodies));
  return set;
}

/** The loads through every swivel (the base's yaw included) at a pose with the given headings. */
export function swivelLoads(
  model: ArmModel,
  pose: Pose,
  payloadMass: Record<string, number>,
  headings: Headings = {},
): Record<string, SwivelLoad> {
  const out: Record<string, SwivelLoad> = {};
  const placement = new Placement(model, pose, headings);
  for (const s of model.swivels ?? []) {
    if (!pose.bodies[s.parent] && s.joint) continue;
    const carried = carriedOf(model, s);
    const { force, moment, at } = carriedWrench(model, placement, s, carried, payloadMass);
    // the axis: the parent's y axis through the point, as the pose and the headings place it
    const up = placement.point(s.parent, { x: s.point.x, y: s.point.y + 1 });
    const axis = { x: up.x - at.x, y: up.y - at.y, z: up.z - at.z };
    const along = dot(force, axis);
    const turn = dot(moment, axis);
    const radial = Math.hypot(force.x - along * axis.x, force.y - along * axis.y, force.z - along * axis.z);
    const tilt = Math.hypot(moment.x - turn * axis.x, moment.y - turn * axis.y, moment.z - turn * axis.z);
    out[s.id] = {
      axial: -along,
      radial,
      moment: tilt,
      twist: Math.abs(turn),
      ...(s.bearings && s.bearings.spacing > 0
        ? { bearingRadial: tilt / s.bearings.spacing + radial / 2 }
        : {}),
    };
  }
  return out;
}

/** Each swivel's loads at a pose, the largest of each figure over the heading combinations
 * (`headingCombinations`: a deeper swivel's heading moves what an outer one carries). This is the
 * entry for a swivel's bearings: `radial`, `axial` and `moment` are what `bearingSafety` takes. */
export function swivelLoadsOverHeadings(
  model: ArmModel,
  pose: Pose,
  payloadMass: Record<string, number>,
  sets: readonly Headings[] = headingCombinations(model),
): Record<string, SwivelLoad> {
  const out: Record<string, SwivelLoad> = {};
  for (const headings of sets)
    for (const [id, l] of Object.entries(swivelLoads(model, pose, payloadMass, headings))) {
      const w = out[id];
      if (!w) out[id] = { ...l };
      else {
        w.axial = Math.max(w.axial, l.axial);
        w.radial = Math.max(w.radial, l.radial);
        w.moment = Math.max(w.moment, l.moment);
        w.twist = Math.max(w.twist, l.twist);
        if (l.bearingRadial !== undefined) w.bearingRadial = Math.max(w.bearingRadial ?? 0, l.bearingRadial);
      }
    }
  return out;
}
