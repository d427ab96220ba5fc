// Geometry over the swept range: springs whose line of action passes close to the pivot they
// work about (`geometry.spring-toggle`), slack extension springs (`geometry.spring-slack`),
// head orientation change of parallelograms (`geometry.tilt`), bodies too close to each other
// or below the bench (`geometry.clearance`).
import type { ArmModel, Body, Spring } from "../model/types";
import type { Pose, SweepResult } from "../mechanics/types";
import { worldPoint } from "../mechanics/body-loads";
import { wrapNear } from "../mechanics/joint-graph";
import { sectionProperties } from "../model/section";
import type { CheckContext } from "./index";
import { finding } from "../findings/finding";
import { addFigures } from "./readout";
import { carrierHead, jointsBetween, parallelogramOfHead } from "./arm-paths";
import { bodyWord, describePose, pastDeadline, relatedBody, show, spanOf } from "./part-words";
import { atJoint, goesSlack, type HookSpring } from "../model/spring-kinds";
import { springDofValue } from "../mechanics/spring-table";

/** A spring toggles where its lever arm about the pivot falls below this share of its shorter
 * hook radius: the line of action is then within about 6 degrees of the dead-centre line
 * (sin 5.7 deg = 0.1), and the spring must pull ten times harder than at a right angle for the
 * same torque (common practice, no source). */
export const TOGGLE_LEVER_SHARE = 0.1;
/** A hook closer than this to the pivot sits on its axis (0.1 mm: far below any pin radius). */
const HOOK_ON_AXIS_M = 1e-4;
/** A collapsing lever arm does no harm where the torque the spring is there to supply vanishes
 * too (a zero-free-length balancer reaching the vertical): below this share of its largest
 * value over the range the toggle is not reported (common practice, no source). */
const HARMLESS_TORQUE_SHARE = 0.1;
/** Below this force (N) a spring is not working and its line of action does not matter. */
const IDLE_SPRING_N = 1e-6;
/** Extension springs within this of their free length count as slack (sweep rounding). */
const SLACK_MARGIN_M = 1e-9;

export function checkGeometry(ctx: CheckContext): void {
  for (const s of ctx.model.springs) {
    if (atJoint(s)) continue;
    checkToggle(ctx, s);
    if (goesSlack(s)) checkSlack(ctx, s);
  }
  checkTilt(ctx);
  checkClearance(ctx);
}

/** Perpendicular distance from a point to the line through a and b. */
export function leverArm(
  a: { x: number; y: number },
  b: { x: number; y: number },
  p: { x: number; y: number },
): number {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  const L = Math.hypot(dx, dy);
  return L > 0 ? Math.abs(dx * (p.y - a.y) - dy * (p.x - a.x)) / L : Math.hypot(p.x - a.x, p.y - a.y);
}

/** The degree of freedom the spring mainly works about: of the dof joints on the chain between
 * its two bodies, the one with the longest lever arm at the reference pose. */
export function workingJoint(model: ArmModel, sweep: SweepResult, s: HookSpring) {
  const ref = sweep.reference ?? sweep.poses[0];
  if (!ref) return undefined;
  const candidates = jointsBetween(model, s.a.body, s.b.body).filter((j) => j.mode === "range");
  let best: { joint: (typeof candidates)[number]; arm: number } | undefined;
  const st = ref.springs[s.id];
  for (const j of candidates) {
    const p = worldPoint(ref, j.parent, j.parentPoint, model);
    const arm = st ? leverArm(st.a, st.b, p) : 0;
    if (!best || arm > best.arm) best = { joint: j, arm };
  }
  return best?.joint;
}

/** |holding torque the dof would need without this spring| (largest over load cases), N m:
 * the torque the spring is there to supply. 0 when the sweep gives no per-spring share. */
function torqueWithoutSpring(pose: Pose, springId: string, dofId: string): number {
  const perUnit = springDofValue(pose.springTorquePerUnit, springId, dofId);
  if (perUnit === undefined) return 0;
  let most = 0;
  for (const c of pose.cases) {
    const tau = c.holdingTorque[dofId];
    if (tau === undefined) continue;
    most = Math.max(most, Math.abs(tau - (c.springForce[springId] ?? 0) * perUnit));
  }
  return most;
}

function checkToggle(ctx: CheckContext, s: HookSpring): void {
  const { model, sweep } = ctx;
  const j = workingJoint(model, sweep, s);
  if (!j) return;
  let worst: { share: number; arm: number; radius: number; pose: Pose; duty: number } | undefined;
  let smallest: { arm: number; pose: Pose } | undefined;
  let largestDuty = 0;
  let hookOnAxisPoses = 0;
  let workingPoses = 0;
  for (const pose of sweep.poses) {
    if (pastDeadline(ctx.options.deadline)) break;
    const st = pose.springs[s.id];
    if (!st) continue;
    const working = pose.cases.some((c) => Math.abs(c.springForce[s.id] ?? 0) > IDLE_SPRING_N);
    if (!working) continue;
    workingPoses++;
    const p = worldPoint(pose, j.parent, j.parentPoint, model);
    const arm = leverArm(st.a, st.b, p);
    const radius = Math.min(Math.hypot(st.a.x - p.x, st.a.y - p.y), Math.hypot(st.b.x - p.x, st.b.y - p.y));
    if (radius < HOOK_ON_AXIS_M) hookOnAxisPoses++;
    const share = radius > 0 ? arm / radius : 1;
    const duty = torqueWithoutSpring(pose, s.id, j.id);
    largestDuty = Math.max(largestDuty, duty);
    if (!worst || share < worst.share) worst = { share, arm, radius, pose, duty };
    if (!smallest || arm < smallest.arm) smallest = { arm, pose };
  }
  if (workingPoses > 0 && hookOnAxisPoses === workingPoses) {
    ctx.findings.push(
      finding(
        "geometry.spring-toggle",
        spanOf(s.origin, "between"),
        `spring ${s.id}: a hook sits on the pivot of ${j.id}, so its lever arm about it is zero everywhere in range: it loads the pin and lifts nothing; move the hook off the pivot`,
        {
          related: [
            {
              span: j.origin.name ?? j.origin.declaration,
              message: `the pivot it works about: ${j.id}`,
            },
          ],
          data: { subject: s.id, joint: j.id, leverArm: 0 },
        },
      ),
    );
    return;
  }
  if (smallest)
    addFigures(ctx.readouts, s.id, "spring", [
      {
        label: `least lever arm about ${j.id}`,
        value: smallest.arm,
        dimension: "length",
        where: describePose(sweep, smallest.pose),
      },
    ]);
  if (!worst || worst.share >= TOGGLE_LEVER_SHARE) return;
  if (largestDuty > 0 && worst.duty < HARMLESS_TORQUE_SHARE * largestDuty) return;
  ctx.findings.push(
    finding(
      "geometry.spring-toggle",
      spanOf(s.origin, "between"),
      `spring ${s.id}: its line of action passes ${show(worst.arm, "length")} from the pivot of ${j.id} (lever arm ${Math.round(worst.share * 100)} % of its ${show(worst.radius, "length")} hook radius) ${describePose(sweep, worst.pose)}: there it has almost no leverage`,
      {
        related: [
          {
            span: j.origin.name ?? j.origin.declaration,
            message: `the pivot it works about: ${j.id}`,
          },
        ],
        data: { subject: s.id, joint: j.id, leverArm: worst.arm },
      },
    ),
  );
}

/** Extension springs and rubber cords pull only above their free length. */
function checkSlack(ctx: CheckContext, s: Extract<Spring, { freeLength: number }>): void {
  const { sweep } = ctx;
  const slack: Pose[] = [];
  let shortest = Infinity;
  for (const pose of sweep.poses) {
    const st = pose.springs[s.id];
    if (!st || !Number.isFinite(st.length)) continue;
    if (st.length <= s.freeLength + SLACK_MARGIN_M) {
      slack.push(pose);
      shortest = Math.min(shortest, st.length);
    }
  }
  if (slack.length === 0) return;
  const first = describePose(sweep, slack[0]!);
  const last = describePose(sweep, slack[slack.length - 1]!);
  const span =
    slack.length === 1 ? first : `from ${first.replace(/^at /, "")} to ${last.replace(/^at /, "")}`;
  ctx.findings.push(
    finding(
      "geometry.spring-slack",
      spanOf(s.origin, "free_length"),
      `spring ${s.id}: slack over ${slack.length} of ${sweep.poses.length} poses (${span}): as short as ${show(shortest, "length")} against its free length ${show(s.freeLength, "length")}, so it pulls nothing there`,
      {
        data: {
          subject: s.id,
          poses: slack.length,
          posesSwept: sweep.poses.length,
          shortest,
          freeLength: s.freeLength,
        },
      },
    ),
  );
}

interface TiltRange {
  change: number;
  low: { phi: number; pose: Pose };
  high: { phi: number; pose: Pose };
}

/** Range of a body's world orientation over the sweep. */
export function orientationRange(sweep: SweepResult, bodyId: string): TiltRange | undefined {
  const ref =
    sweep.reference?.bodies[bodyId]?.phi ?? sweep.poses.find((p) => p.bodies[bodyId])?.bodies[bodyId]?.phi;
  if (ref === undefined) return undefined;
  let low: TiltRange["low"] | undefined;
  let high: TiltRange["high"] | undefined;
  for (const pose of sweep.poses) {
    const bp = pose.bodies[bodyId];
    if (!bp) continue;
    const phi = wrapNear(bp.phi, ref);
    if (!low || phi < low.phi) low = { phi, pose };
    if (!high || phi > high.phi) high = { phi, pose };
  }
  return low && high ? { change: high.phi - low.phi, low, high } : undefined;
}

/** The tilt limit for a head: the tightest `require tilt` of the payloads it carries. */
function tiltLimitForHead(model: ArmModel, headId: string): { limit: number; payload?: string } {
  let limit = model.require.tilt.default;
  let payload: string | undefined;
  for (const p of model.payloads) {
    if (carrierHead(model, p.body)?.id !== headId) continue;
    const l = model.require.tilt.byPayload[p.id] ?? model.require.tilt.default;
    if (payload === undefined || l < limit) ((limit = l), (payload = p.id));
  }
  return payload ? { limit, payload } : { limit };
}

function checkTilt(ctx: CheckContext): void {
  const { model, sweep } = ctx;
  for (const par of model.parallelograms) {
    const r = orientationRange(sweep, par.bodies.head);
    if (!r) continue;
    const { limit, payload } = tiltLimitForHead(model, par.bodies.head);
    addFigures(ctx.readouts, par.id, "parallelogram", [
      { label: "head orientation change", value: r.change, dimension: "angle" },
    ]);
    if (r.change <= limit) continue;
    const unequal = Math.abs(par.upperLength - par.length) > 1e-9;
    const why = unequal
      ? `its bars differ (${show(par.length, "length")} and ${show(par.upperLength, "length")})`
      : `its root, ${par.parent}, turns over the range`;
    const deg = (v: number) => show(v, "angle");
    ctx.findings.push(
      finding(
        "geometry.tilt",
        unequal ? spanOf(par.origin, "upper_length") : spanOf(par.origin, "on"),
        `parallelogram ${par.id}: the head turns ${deg(r.change)} over the range, more than the ${deg(limit)} allowed${payload ? ` at ${payload}` : ""}, because ${why} (${deg(r.low.phi)} ${describePose(sweep, r.low.pose)}; ${deg(r.high.phi)} ${describePose(sweep, r.high.pose)})`,
        {
          related: payload
            ? [
                {
                  span: model.payloads.find((p) => p.id === payload)!.origin.name ?? par.origin.declaration,
                  message: `payload ${payload} rides on the head`,
                },
              ]
            : [],
          data: {
            subject: par.id,
            change: r.change,
            limit,
            ...(payload ? { payload } : {}),
          },
        },
      ),
    );
  }
}

interface Segment {
  body: Body;
  a: { x: number; y: number };
  b: { x: number; y: number };
  halfThickness: number;
}

/** Distance between two segments in the plane (0 where they cross). */
export function segmentDistance(
  p1: Segment["a"],
  p2: Segment["a"],
  q1: Segment["a"],
  q2: Segment["a"],
): number {
  return segmentDistanceXY(p1.x, p1.y, p2.x, p2.y, q1.x, q1.y, q2.x, q2.y);
}

/** Squares below this (m^2) may have underflowed; there the distances are all taken by hypot. */
const SQUARE_FLOOR = 1e-280;
/** Endpoint distances whose squares lie within this fraction of the least are re-measured with
 * Math.hypot: hypot and a sum of squares rank two lengths alike unless they agree to a few ulps
 * (1e-15), so the one hypot ranks least is always among them. */
const SQUARE_MARGIN = 1e-12;

/** segmentDistance on plain numbers: the least of the four endpoint-to-segment distances, the
 * same value as their Math.min of Math.hypot, with hypot called only near the least. */
function segmentDistanceXY(
  p1x: number,
  p1y: number,
  p2x: number,
  p2y: number,
  q1x: number,
  q1y: number,
  q2x: number,
  q2y: number,
): number {
  const d1 = (q2x - q1x) * (p1y - q1y) - (q2y - q1y) * (p1x - q1x);
  const d2 = (q2x - q1x) * (p2y - q1y) - (q2y - q1y) * (p2x - q1x);
  const d3 = (p2x - p1x) * (q1y - p1y) - (p2y - p1y) * (q1x - p1x);
  const d4 = (p2x - p1x) * (q2y - p1y) - (p2y - p1y) * (q2x - p1x);
  if (((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0))) return 0;
  const e = offsets;
  toSegment(p1x, p1y, q1x, q1y, q2x, q2y, e, 0);
  toSegment(p2x, p2y, q1x, q1y, q2x, q2y, e, 2);
  toSegment(q1x, q1y, p1x, p1y, p2x, p2y, e, 4);
  toSegment(q2x, q2y, p1x, p1y, p2x, p2y, e, 6);
  let least = Infinity;
  let nan = false;
  for (let k = 0; k < 8; k += 2) {
    const v = e[k]! * e[k]! + e[k + 1]! * e[k + 1]!;
    squares[k >> 1] = v;
    if (v !== v) nan = true;
    if (v < least) least = v;
  }
  if (nan || !(least > SQUARE_FLOOR && least < Infinity))
    return Math.min(
      Math.hypot(e[0]!, e[1]!),
      Math.hypot(e[2]!, e[3]!),
      Math.hypot(e[4]!, e[5]!),
      Math.hypot(e[6]!, e[7]!),
    );
  const threshold = least * (1 + SQUARE_MARGIN);
  let d = Infinity;
  for (let k = 0; k < 4; k++)
    if (squares[k]! <= threshold) d = Math.min(d, Math.hypot(e[2 * k]!, e[2 * k + 1]!));
  return d;
}
const offsets = new Float64Array(8);
const squares = new Float64Array(4);

/** The offset from point p to the nearest point of segment ab, written at `out[o]`, `out[o + 1]`. */
function toSegment(
  px: number,
  py: number,
  ax: number,
  ay: number,
  bx: number,
  by: number,
  out: Float64Array,
  o: number,
): void {
  const dx = bx - ax;
  const dy = by - ay;
  const L2 = dx * dx + dy * dy;
  const t = L2 > 0 ? Math.max(0, Math.min(1, ((px - ax) * dx + (py - ay) * dy) / L2)) : 0;
  out[o] = px - (ax + t * dx);
  out[o + 1] = py - (ay + t * dy);
}

/** Pairs of bodies that meet by design: joined directly, or both pinned to a third body at the
 * same point (a shared pivot). Their segments touch and say nothing about clearance. */
function joinedPairs<K>(model: ArmModel, key: (a: string, b: string) => K): Set<K> {
  const pairs = new Set<K>();
  const sites = new Map<string, string[]>();
  const site = (body: string, p: { x: number; y: number }) => `${body}|${p.x.toFixed(5)}|${p.y.toFixed(5)}`;
  for (const j of model.joints) {
    pairs.add(key(j.parent, j.child));
    for (const [on, other, p] of [
      [j.parent, j.child, j.parentPoint],
      [j.child, j.parent, j.childPoint],
    ] as const) {
      const list = sites.get(site(on, p)) ?? [];
      list.push(other);
      sites.set(site(on, p), list);
    }
  }
  for (const list of sites.values())
    for (let i = 0; i < list.length; i++)
      for (let k = i + 1; k < list.length; k++) pairs.add(key(list[i]!, list[k]!));
  addLayeredPairs(model, pairs, key);
  return pairs;
}

/** Two bodies pinned to one body closer together than their own half depths overlap there in
 * every pose, so the designer has put them in different layers (e.g. two stages on opposite
 * faces of a head plate): their segments say nothing about clearance. */
function addLayeredPairs<K>(model: ArmModel, pairs: Set<K>, key: (a: string, b: string) => K): void {
  const halfDepth = (id: string) => {
    const b = model.bodies.find((x) => x.id === id);
    return b?.section ? sectionProperties(b.section).depth / 2 : 0;
  };
  const pinsOn = new Map<string, { other: string; at: { x: number; y: number } }[]>();
  for (const j of model.joints) {
    for (const [on, other, at] of [
      [j.parent, j.child, j.parentPoint],
      [j.child, j.parent, j.childPoint],
    ] as const) {
      const list = pinsOn.get(on) ?? [];
      list.push({ other, at });
      pinsOn.set(on, list);
    }
  }
  for (const list of pinsOn.values()) {
    for (let i = 0; i < list.length; i++) {
      for (let k = i + 1; k < list.length; k++) {
        const a = list[i]!;
        const b = list[k]!;
        if (a.other === b.other) continue;
        const pinGap = Math.hypot(a.at.x - b.at.x, a.at.y - b.at.y);
        if (pinGap < halfDepth(a.other) + halfDepth(b.other)) pairs.add(key(a.other, b.other));
      }
    }
  }
}

/** A moving body as a clearance segment: local end points and half its section's depth. */
interface SegmentShape {
  body: Body;
  /** Far end, local (the near end is the origin). */
  farX: number;
  farY: number;
  halfThickness: number;
}

function segmentShape(body: Body): SegmentShape {
  const half = body.section ? sectionProperties(body.section).depth / 2 : 0;
  if (body.length > 0) return { body, farX: body.length, farY: 0, halfThickness: half };
  // a head: from its origin to its farthest named point
  let far = { x: 0, y: 0 };
  for (const p of Object.values(body.points)) if (Math.hypot(p.x, p.y) > Math.hypot(far.x, far.y)) far = p;
  return { body, farX: far.x, farY: far.y, halfThickness: half };
}

/** Sorts the segment indices by their left end (the smaller x of their two ends), keeping the
 * order of equal ones: a sort with a comparator calls back per comparison, dear in the untuned
 * tier, where an insertion over a few bodies is not. */
function sortByLeftEnd(order: number[], ends: Float64Array): void {
  for (let u = 1; u < order.length; u++) {
    const v = order[u]!;
    const key = Math.min(ends[4 * v]!, ends[4 * v + 2]!);
    let w = u;
    for (; w > 0; w--) {
      const prev = order[w - 1]!;
      if (!(Math.min(ends[4 * prev]!, ends[4 * prev + 2]!) - key > 0)) break;
      order[w] = prev;
    }
    order[w] = v;
  }
}

function checkClearance(ctx: CheckContext): void {
  const { model, sweep } = ctx;
  const need = model.require.clearance;
  const surface = model.base?.surface ?? 0;
  const shapes = model.bodies.filter((b) => b.kind !== "base").map(segmentShape);
  const m = shapes.length;
  // A pair of shapes i < k is the number i * m + k: no per-pair strings (a spec of thousands of
  // bodies would need millions), and pairs are only looked at where their boxes come near.
  const indexOf = new Map(shapes.map((sh, i) => [sh.body.id, i]));
  const joined = joinedPairs(model, (a, b) => {
    const i = indexOf.get(a);
    const k = indexOf.get(b);
    return i === undefined || k === undefined ? -1 : Math.min(i, k) * m + Math.max(i, k);
  });
  let thickest = 0;
  for (const sh of shapes) thickest = Math.max(thickest, sh.halfThickness);
  // World end points of each segment at the current pose: ax ay bx by; `present` when the pose has the body.
  const ends = new Float64Array(4 * m);
  const present = new Uint8Array(m);
  const order: number[] = [];
  const pairWorst = new Map<number, { gap: number; pose: Pose; a: Body; b: Body }>();
  const belowWorst = new Map<
    string,
    {
      id: string;
      depth: number;
      pose: Pose;
      what: string;
      span: { start: number; end: number };
    }
  >();
  for (const pose of sweep.poses) {
    if (pastDeadline(ctx.options.deadline)) break;
    order.length = 0;
    for (let i = 0; i < m; i++) {
      const sh = shapes[i]!;
      const bp = pose.bodies[sh.body.id];
      present[i] = bp ? 1 : 0;
      if (!bp) continue;
      order.push(i);
      // worldPoint's arithmetic, for the origin and the far point.
      const c = Math.cos(bp.phi);
      const s = Math.sin(bp.phi);
      ends[4 * i] = bp.x + c * 0 - s * 0;
      ends[4 * i + 1] = bp.y + s * 0 + c * 0;
      ends[4 * i + 2] = bp.x + c * sh.farX - s * sh.farY;
      ends[4 * i + 3] = bp.y + s * sh.farX + c * sh.farY;
    }
    for (let u = 0; u < order.length; u++) {
      const i = order[u]!;
      const sh = shapes[i]!;
      const o = 4 * i;
      const lowest = Math.min(ends[o + 1]!, ends[o + 3]!) - sh.halfThickness;
      // bodies keep `require clearance` from the bench too; payload centres may sit on the work
      if (lowest < surface + need) {
        const prev = belowWorst.get(sh.body.id);
        if (!prev || surface - lowest > prev.depth)
          belowWorst.set(sh.body.id, {
            id: sh.body.id,
            depth: surface - lowest,
            pose,
            what: bodyWord(sh.body),
            span: sh.body.origin.name ?? sh.body.origin.declaration,
          });
      }
    }
    // Sweep along x: segments whose boxes lie `need` plus both half depths apart or more cannot
    // come within `need` of each other, so they are never measured (the boxes bound the distance
    // from below).
    sortByLeftEnd(order, ends);
    for (let u = 0; u < order.length; u++) {
      const i0 = order[u]!;
      const hi = shapes[i0]!.halfThickness;
      const maxX = Math.max(ends[4 * i0]!, ends[4 * i0 + 2]!);
      const minY = Math.min(ends[4 * i0 + 1]!, ends[4 * i0 + 3]!);
      const maxY = Math.max(ends[4 * i0 + 1]!, ends[4 * i0 + 3]!);
      for (let w = u + 1; w < order.length; w++) {
        const k0 = order[w]!;
        const hk = shapes[k0]!.halfThickness;
        const minXk = Math.min(ends[4 * k0]!, ends[4 * k0 + 2]!);
        if (minXk - maxX - hi - thickest >= need) break; // every later box starts farther right
        if (minXk - maxX - hi - hk >= need) continue;
        const minYk = Math.min(ends[4 * k0 + 1]!, ends[4 * k0 + 3]!);
        const maxYk = Math.max(ends[4 * k0 + 1]!, ends[4 * k0 + 3]!);
        if (Math.max(minYk - maxY, minY - maxYk) - hi - hk >= need) continue;
        // measured with the lower index first, as every pair is named
        const i = Math.min(i0, k0);
        const k = Math.max(i0, k0);
        const key = i * m + k;
        if (joined.has(key)) continue;
        const sh = shapes[i]!;
        const th = shapes[k]!;
        const o = 4 * i;
        const q = 4 * k;
        const gap =
          segmentDistanceXY(
            ends[o]!,
            ends[o + 1]!,
            ends[o + 2]!,
            ends[o + 3]!,
            ends[q]!,
            ends[q + 1]!,
            ends[q + 2]!,
            ends[q + 3]!,
          ) -
          sh.halfThickness -
          th.halfThickness;
        if (!(gap < need)) continue;
        const prev = pairWorst.get(key);
        if (!prev || gap < prev.gap) pairWorst.set(key, { gap, pose, a: sh.body, b: th.body });
      }
    }
    for (const p of model.payloads) {
      if (!pose.bodies[p.body]) continue;
      const at = worldPoint(pose, p.body, p.point, model);
      if (at.y < surface) {
        const prev = belowWorst.get(`payload ${p.id}`);
        if (!prev || surface - at.y > prev.depth)
          belowWorst.set(`payload ${p.id}`, {
            id: p.id,
            depth: surface - at.y,
            pose,
            what: `payload ${p.id}`,
            span: spanOf(p.origin, "at"),
          });
      }
    }
  }
  // in the order of the bodies' declarations, first of the pair, then second
  for (const key of [...pairWorst.keys()].sort((a, b) => a - b)) {
    const w = pairWorst.get(key)!;
    const msg =
      w.gap <= 0
        ? `${bodyWord(w.b)} runs into ${bodyWord(w.a)} (they overlap by ${show(-w.gap, "length")}) ${describePose(sweep, w.pose)}; ${show(need, "length")} clearance required`
        : `${bodyWord(w.b)} comes within ${show(w.gap, "length")} of ${bodyWord(w.a)} ${describePose(sweep, w.pose)}; ${show(need, "length")} clearance required`;
    ctx.findings.push(
      finding("geometry.clearance", w.b.origin.name ?? w.b.origin.declaration, msg, {
        related: [relatedBody(w.a, `${bodyWord(w.a)} is the other part`)],
        data: { subject: w.b.id, other: w.a.id, gap: w.gap },
      }),
    );
  }
  for (const w of belowWorst.values()) {
    ctx.findings.push(
      finding(
        "geometry.clearance",
        w.span,
        w.depth > 0
          ? `${w.what} goes ${show(w.depth, "length")} below the bench surface ${describePose(sweep, w.pose)}`
          : `${w.what} comes within ${show(-w.depth, "length")} of the bench surface ${describePose(sweep, w.pose)}; ${show(need, "length")} clearance required`,
        { data: { subject: w.id, below: w.depth } },
      ),
    );
  }
}
