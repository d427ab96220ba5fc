// Where the arm is in three dimensions when its swivels are turned (docs/checks.md, Swivels): each
// swivel turns the bodies it carries about its parent's y axis through its point, by its heading.
// The drawing plane is x-y (y up), z towards the reader; a positive heading turns counter-clockwise
// seen from above (right-handed about the axis). The base's yaw turns everything rigidly and
// changes no load within the arm, so it is not applied here (the tipping check turns the arm on
// its footprint itself). SI units.
import type { ArmModel, Swivel, Vec2 } from "../model/types";
import { carriedBodies } from "../model/build-swivels";
import type { Pose } from "./types";
import { worldPoint } from "./body-loads";

export interface Vec3 {
  x: number;
  y: number;
  z: number;
}

/** Heading of each swivel by id, rad (absent: 0, the drawing plane). */
export type Headings = Readonly<Record<string, number>>;

/** A rigid motion x -> R x + t, R row-major 3 x 3. */
interface Motion {
  r: Float64Array;
  t: Vec3;
}

/** No motion (Float64Array.of is a slow builtin call: the array is filled in place). */
function identity(): Motion {
  const r = new Float64Array(9);
  r[0] = r[4] = r[8] = 1;
  return { r, t: { x: 0, y: 0, z: 0 } };
}

function apply(m: Motion, p: Vec3): Vec3 {
  const r = m.r;
  return {
    x: r[0]! * p.x + r[1]! * p.y + r[2]! * p.z + m.t.x,
    y: r[3]! * p.x + r[4]! * p.y + r[5]! * p.z + m.t.y,
    z: r[6]! * p.x + r[7]! * p.y + r[8]! * p.z + m.t.z,
  };
}

export function rotate(r: Float64Array, v: Vec3): Vec3 {
  return {
    x: r[0]! * v.x + r[1]! * v.y + r[2]! * v.z,
    y: r[3]! * v.x + r[4]! * v.y + r[5]! * v.z,
    z: r[6]! * v.x + r[7]! * v.y + r[8]! * v.z,
  };
}

/** Rotation by `angle` about the unit axis `a` (Rodrigues' formula). */
export function axisRotation(a: Vec3, angle: number): Float64Array {
  const c = Math.cos(angle);
  const s = Math.sin(angle);
  const k = 1 - c;
  const r = new Float64Array(9);
  // prettier-ignore
  r.set([
    c + a.x * a.x * k, a.x * a.y * k - a.z * s, a.x * a.z * k + a.y * s,
    a.y * a.x * k + a.z * s, c + a.y * a.y * k, a.y * a.z * k - a.x * s,
    a.z * a.x * k - a.y * s, a.z * a.y * k + a.x * s, c + a.z * a.z * k,
  ]);
  return r;
}

/** m2 after m1. */
function compose(m2: Motion, m1: Motion): Motion {
  const r = new Float64Array(9);
  for (let i = 0; i < 3; i++)
    for (let j = 0; j < 3; j++) {
      let s = 0;
      for (let k = 0; k < 3; k++) s += m2.r[i * 3 + k]! * m1.r[k * 3 + j]!;
      r[i * 3 + j] = s;
    }
  return { r, t: apply(m2, m1.t) };
}

/** The swivels that turn parts of the arm (not the base's yaw), each with the bodies it carries,
 * deepest first: a swivel carried by another comes before it. Cached per model. */
const turning = new WeakMap<ArmModel, { swivel: Swivel; carried: Set<string> }[]>();
export function turningSwivels(model: ArmModel): { swivel: Swivel; carried: Set<string> }[] {
  let list = turning.get(model);
  if (list) return list;
  list = (model.swivels ?? [])
    .filter((s) => s.joint && s.child)
    .map((swivel) => ({ swivel, carried: carriedBodies(model.joints, swivel).bodies }));
  const depth = (s: Swivel) => list!.filter((o) => o.carried.has(s.parent)).length;
  list.sort((a, b) => depth(b.swivel) - depth(a.swivel));
  turning.set(model, list);
  return list;
}

/** The arm at a pose with its swivels turned: each body's rigid motion from the drawing plane. */
export class Placement {
  private readonly motion = new Map<string, Motion>();

  constructor(
    private readonly model: ArmModel,
    private readonly pose: Pose,
    readonly headings: Headings = {},
  ) {
    // Deepest swivel first, about its axis where the drawing puts it: its parent has not moved
    // yet (only shallower swivels move it), so each turn uses its own axis as it then stands.
    for (const { swivel, carried } of turningSwivels(model)) {
      const h = headings[swivel.id] ?? 0;
      if (h === 0) continue;
      const p = worldPoint(pose, swivel.parent, swivel.point, model);
      const phi = pose.bodies[swivel.parent]?.phi ?? 0;
      const axis = { x: -Math.sin(phi), y: Math.cos(phi), z: 0 };
      const r = axisRotation(axis, h);
      const at = { x: p.x, y: p.y, z: 0 };
      const rp = rotate(r, at);
      const turn: Motion = { r, t: { x: at.x - rp.x, y: at.y - rp.y, z: at.z - rp.z } };
      for (const b of carried) this.motion.set(b, compose(turn, this.motion.get(b) ?? identity()));
    }
  }

  /** Whether no swivel is turned (the drawing plane). */
  get planar(): boolean {
    return this.motion.size === 0;
  }

  /** World position of a body's local point. */
  point(bodyId: string, local: Vec2): Vec3 {
    const w = worldPoint(this.pose, bodyId, local, this.model);
    const p = { x: w.x, y: w.y, z: 0 };
    const m = this.motion.get(bodyId);
    return m ? apply(m, p) : p;
  }

  /** A direction of the drawing plane as it is for this body (its swivels turned). */
  direction(bodyId: string, v: Vec3): Vec3 {
    const m = this.motion.get(bodyId);
    return m ? rotate(m.r, v) : { ...v };
  }
}

/** Spacing of the headings searched inside a swivel's range. A turned stage's wrench goes as
 * cos h and sin h, so a figure like |a cos h| + |b sin h| peaks between the headings visited; with
 * 30 deg steps the peak is missed by at most 1 - cos 15 deg = 3.4 % (45 deg steps: 7.6 %). */
export const HEADING_STEP_RAD = Math.PI / 6;

/** The headings a swivel's loads are searched at, besides 0 (the drawing plane): the ends of its
 * range and every multiple of HEADING_STEP_RAD inside it (all the way round: 12 headings). */
export function candidateHeadings(s: Swivel): number[] {
  const range = s.heading ?? [-Math.PI, Math.PI];
  const out: number[] = [];
  const add = (h: number) => {
    // -180 and 180 deg are one heading
    const same = (a: number, b: number) => Math.abs(Math.atan2(Math.sin(a - b), Math.cos(a - b))) < 1e-9;
    if (!same(h, 0) && !out.some((o) => same(o, h))) out.push(h);
  };
  add(range[0]);
  add(range[1]);
  const first = Math.ceil((range[0] - 1e-9) / HEADING_STEP_RAD);
  const last = Math.floor((range[1] + 1e-9) / HEADING_STEP_RAD);
  for (let k = first; k <= last; k++) add(k * HEADING_STEP_RAD);
  return out;
}

/** Whether a heading is one end of the swivel's range. */
export function isRangeEnd(s: Swivel, h: number): boolean {
  return s.heading !== undefined && (h === s.heading[0] || h === s.heading[1]);
}

/** Whether a heading is a quarter turn (0, +-90, 180 deg), where a turned stage's moment is wholly
 * in its parent's plane or wholly across it. */
export function isQuarterTurn(h: number): boolean {
  const q = h / (Math.PI / 2);
  return Math.abs(q - Math.round(q)) < 1e-9;
}

/** The heading sets visited one swivel at a time: every swivel at 0, then each swivel alone at each
 * of its candidate headings (the others at 0). Their number grows as the sum of the swivels'
 * candidates, not as their product. `coarse` (the quick pass while typing) keeps only the quarter
 * turns and range ends. */
export function headingSets(model: ArmModel, coarse = false): Headings[] {
  const sets: Headings[] = [{}];
  for (const { swivel } of turningSwivels(model))
    for (const h of candidateHeadings(swivel))
      if (!coarse || isQuarterTurn(h) || isRangeEnd(swivel, h)) sets.push({ [swivel.id]: h });
  return sets;
}

/** Whether a payload's working load has a part out of the drawing plane (a force across it, a
 * torque about an axis in it): the checks then read the space frame and the 3D sums even with
 * every heading at 0. */
export function loadsAcross(model: ArmModel): boolean {
  return model.payloads.some((p) => (p.forceAcross ?? 0) !== 0 || !!p.torque?.x || !!p.torque?.y);
}

/** Heading combinations at most: past this (three swivels all the way round would be 13^3 = 2197),
 * the combinations fall back to one swivel turned at a time. */
export const MAX_HEADING_COMBINATIONS = 400;

/** Every combination of the swivels' quarter turns, range ends and 0, all turned together (for a
 * sum of loads whose worst case needs them together, like tipping: two stages turned the same
 * way). A lever along a fixed direction goes as cos h or sin h of each heading, and the length of
 * a sum of stage levers is longest with the stages in line, so quarter turns and range ends hold
 * its peaks; the 30 deg steps between are left out. Grows as the product of the swivels' choices,
 * so it falls back to `headingSets` past MAX_HEADING_COMBINATIONS, and to the coarse `headingSets`
 * on the quick pass while typing. The first set is all at 0. */
export function headingCombinations(model: ArmModel, coarse = false): Headings[] {
  // the quick pass while typing turns one swivel at a time (a sum, not a product)
  if (coarse) return headingSets(model, true);
  const turning = turningSwivels(model);
  const choices = turning.map(({ swivel }) => [
    0,
    ...candidateHeadings(swivel).filter((h) => isQuarterTurn(h) || isRangeEnd(swivel, h)),
  ]);
  const count = choices.reduce((n, c) => n * c.length, 1);
  if (count > MAX_HEADING_COMBINATIONS) return headingSets(model);
  let sets: Record<string, number>[] = [{}];
  turning.forEach(({ swivel }, i) => {
    const next: Record<string, number>[] = [];
    for (const set of sets)
      for (const h of choices[i]!) next.push(h === 0 ? set : { ...set, [swivel.id]: h });
    sets = next;
  });
  return sets;
}
