// Tipping of the base and the loads on its bearing (docs/checks.md, Tipping): the overturning
// moment of the arm about the footprint's edge against the base's restoring moment W e
// (statics, e.g. Meriam and Kraige, Engineering Mechanics: Statics, ch. 3). With `yaw` the arm
// can face any heading, so the worst edge is the nearest one in every direction. Swivels above the
// base turn stages out of the drawing plane: every combination of their headings is visited
// together (mechanics/headings.ts), the loads then in three dimensions.
import type { ArmModel, Payload, Vec2 } from "../model/types";
import type { Pose } from "../mechanics/types";
import { worldPoint } from "../mechanics/body-loads";
import { headingCombinations, loadsAcross, Placement, type Headings } from "../mechanics/headings";
import type { CheckContext } from "./index";
import { finding } from "../findings/finding";
import { addFigures, noteSafety } from "./readout";
import {
  describePose,
  headingWords,
  pastDeadline,
  payloadMasses,
  show,
  showSafety,
  spanOf,
} from "./part-words";

/** A load of the arm on the base in the arm's plane: a force at a point (x along the reach). */
export interface PlaneLoad {
  x: number;
  y: number;
  fx: number;
  fy: number;
}

/** Overturning moment about the edge at distance `edge` from the base's centre along the
 * heading (sign +1 toward +x, -1 toward -x), at bench height `surface`: positive tips. */
export function overturningMoment(
  loads: readonly PlaneLoad[],
  edge: number,
  sign: 1 | -1,
  surface: number,
  /** Loads to use from the front of `loads` (a reused list may hold more). */
  count = loads.length,
): number {
  let m = 0;
  for (let k = 0; k < count; k++) {
    const l = loads[k]!;
    const u = sign * l.x; // distance along the heading
    const fu = sign * l.fx;
    // clockwise moment (seen with the heading to the right) about the edge point (edge, surface)
    m -= (u - edge) * l.fy - (l.y - surface) * fu;
  }
  return m;
}

/** Restoring moment of the base's weight about an edge `edge` from its centre of gravity. */
export function restoringMoment(baseMass: number, gravity: number, edge: number): number {
  return baseMass * gravity * edge;
}

/** Every load the arm puts on the base at a pose: weights of moving bodies and payloads, and
 * the payloads' working forces (springs and pins between base and arm are internal). */
export function armLoads(model: ArmModel, pose: Pose, masses: Record<string, number>): PlaneLoad[] {
  const out: PlaneLoad[] = [];
  for (const b of model.bodies) {
    if (b.kind === "base" || !pose.bodies[b.id] || !(b.mass > 0)) continue;
    const c = worldPoint(pose, b.id, b.centreOfMass, model);
    out.push({ x: c.x, y: c.y, fx: 0, fy: -b.mass * model.gravity });
  }
  for (const p of model.payloads) {
    if (!pose.bodies[p.body]) continue;
    const c = worldPoint(pose, p.body, p.point, model);
    out.push({
      x: c.x,
      y: c.y,
      fx: p.force?.x ?? 0,
      fy: -(masses[p.id] ?? p.mass) * model.gravity + (p.force?.y ?? 0),
    });
  }
  return out;
}

/** What armLoads reads of the model, once per check run: the moving bodies with mass and the
 * payloads, with whether their points are the base's own (worldPoint gives those as written). */
interface ArmLoadSources {
  bodies: { id: string; point: Vec2; mass: number }[];
  payloads: { payload: Payload; onBase: boolean }[];
}

function armLoadSources(model: ArmModel): ArmLoadSources {
  const isBase = (id: string) => model.bodies.find((b) => b.id === id)?.kind === "base";
  return {
    bodies: model.bodies
      .filter((b) => b.kind !== "base" && b.mass > 0)
      .map((b) => ({ id: b.id, point: b.centreOfMass, mass: b.mass })),
    payloads: model.payloads.map((p) => ({
      payload: p,
      onBase: isBase(p.body),
    })),
  };
}

/** armLoads into `out` (its objects reused), with the same arithmetic (worldPoint's written
 * out); returns how many loads it wrote. */
function armLoadsInto(
  src: ArmLoadSources,
  gravity: number,
  pose: Pose,
  masses: Record<string, number>,
  out: PlaneLoad[],
): number {
  let n = 0;
  const put = (x: number, y: number, fx: number, fy: number) => {
    let l = out[n];
    if (!l) out[n] = l = { x: 0, y: 0, fx: 0, fy: 0 };
    l.x = x;
    l.y = y;
    l.fx = fx;
    l.fy = fy;
    n++;
  };
  for (let k = 0; k < src.bodies.length; k++) {
    const b = src.bodies[k]!;
    const bp = pose.bodies[b.id];
    if (!bp) continue;
    const c = Math.cos(bp.phi);
    const s = Math.sin(bp.phi);
    const lx = b.point.x;
    const ly = b.point.y;
    put(bp.x + c * lx - s * ly, bp.y + s * lx + c * ly, 0, -b.mass * gravity);
  }
  for (let k = 0; k < src.payloads.length; k++) {
    const { payload: p, onBase } = src.payloads[k]!;
    const bp = pose.bodies[p.body];
    if (!bp) continue;
    const lx = p.point.x;
    const ly = p.point.y;
    let x = lx;
    let y = ly;
    if (!onBase) {
      const c = Math.cos(bp.phi);
      const s = Math.sin(bp.phi);
      x = bp.x + c * lx - s * ly;
      y = bp.y + s * lx + c * ly;
    }
    put(x, y, p.force?.x ?? 0, -(masses[p.id] ?? p.mass) * gravity + (p.force?.y ?? 0));
  }
  return n;
}

/** A load of the arm on the base in three dimensions (z out of the drawing plane). */
export interface SpaceLoad extends PlaneLoad {
  z: number;
  fz: number;
  /** A working torque, world axes, N*m. */
  moment?: { x: number; y: number; z: number };
}

/** The arm's loads on the base with its swivels turned to `headings`. */
export function armLoadsTurned(
  model: ArmModel,
  pose: Pose,
  masses: Record<string, number>,
  headings: Headings,
): SpaceLoad[] {
  const placement = new Placement(model, pose, headings);
  const out: SpaceLoad[] = [];
  for (const b of model.bodies) {
    if (b.kind === "base" || !pose.bodies[b.id] || !(b.mass > 0)) continue;
    const c = placement.point(b.id, b.centreOfMass);
    out.push({
      x: c.x,
      y: c.y,
      z: c.z,
      fx: 0,
      fy: -b.mass * model.gravity,
      fz: 0,
    });
  }
  for (const p of model.payloads) {
    if (!pose.bodies[p.body]) continue;
    const c = placement.point(p.body, p.point);
    const f = placement.direction(p.body, {
      x: p.force?.x ?? 0,
      y: p.force?.y ?? 0,
      z: p.forceAcross ?? 0,
    });
    out.push({
      x: c.x,
      y: c.y,
      z: c.z,
      fx: f.x,
      fy: -(masses[p.id] ?? p.mass) * model.gravity + f.y,
      fz: f.z,
      ...(p.torque ? { moment: placement.direction(p.body, p.torque) } : {}),
    });
  }
  return out;
}

/** The overturning moment's lever part along the horizontal direction (ux, uz): the moment about
 * a line through the base's origin across that direction at bench height, positive tipping
 * towards it. The moment about an edge e out is this plus e times the (negative) vertical force. */
export function overturningToward(
  loads: readonly SpaceLoad[],
  ux: number,
  uz: number,
  surface: number,
): number {
  let m = 0;
  for (const l of loads) {
    m += -(ux * l.x + uz * l.z) * l.fy + (l.y - surface) * (ux * l.fx + uz * l.fz);
    // a couple tips the base about the edge's line, y x u = (uz, 0, -ux)
    if (l.moment) m += l.moment.x * uz - l.moment.z * ux;
  }
  return m;
}

/** The largest of `overturningToward` over every horizontal direction: the length of the
 * horizontal moment vector (a base that turns faces its worst direction). */
export function overturningAnyWay(loads: readonly SpaceLoad[], surface: number): number {
  return Math.hypot(overturningToward(loads, 1, 0, surface), overturningToward(loads, 0, 1, surface));
}

export function checkTipping(ctx: CheckContext): void {
  const { model, sweep } = ctx;
  const base = model.base;
  if (!base) return;
  const baseBody = model.bodies.find((b) => b.id === base.bodyId);
  if (!baseBody) return;
  let worst:
    | {
        safety: number;
        pose: Pose;
        ci: number;
        overturning: number;
        restoring: number;
        heading: string;
      }
    | undefined;
  /** Keeps the least safety against tipping over an edge `edge` from the pivot line. */
  const tryEdge = (pose: Pose, ci: number, over: number, edge: number, heading: string): void => {
    const restoring = restoringMoment(base.mass, model.gravity, edge);
    const safety = over > 0 ? restoring / over : Infinity;
    if (!worst || safety < worst.safety) worst = { safety, pose, ci, overturning: over, restoring, heading };
  };
  type Peak = { value: number; pose?: Pose; ci: number; words?: string };
  // with a working force across the plane the drawing plane's own set needs the 3D sums too
  const turnedSets = headingCombinations(model, sweep.quick === true).slice(
    loadsAcross(model) || model.payloads.some((p) => p.torque) ? 0 : 1,
  );
  let thrust: Peak = { value: 0, ci: 0 };
  let moment: Peak = { value: 0, ci: 0 };
  let radial: Peak = { value: 0, ci: 0 };
  const edges = base.footprint
    ? base.yaw
      ? [
          {
            edge: base.footprint.width / 2,
            heading: "facing along the footprint's width",
          },
          {
            edge: base.footprint.depth / 2,
            heading: "turned to face across the footprint's depth",
          },
        ]
      : [{ edge: base.footprint.width / 2, heading: "" }]
    : [];
  // Hoisted out of the pose loop (the untuned tier pays for every object and call): each load
  // case's payload masses, each edge's words, and the plane loads' objects, reused pose to pose.
  const massesByCase = sweep.loadCases.map((_, ci) => payloadMasses(model, sweep, ci));
  const edgeWords = edges.map((e) => (e.heading ? `${e.heading}, ` : ""));
  const planeLoads = armLoadSources(model);
  const loads: PlaneLoad[] = [];
  for (const pose of sweep.poses) {
    if (pastDeadline(ctx.options.deadline)) break;
    for (let ci = 0; ci < pose.cases.length; ci++) {
      const count = armLoadsInto(planeLoads, model.gravity, pose, massesByCase[ci] ?? {}, loads);
      let fy = 0;
      let fx = 0;
      for (let k = 0; k < count; k++) fy += loads[k]!.fy;
      for (let k = 0; k < count; k++) fx += loads[k]!.fx;
      // moment about the base's origin (the bearing's centre): the edge at 0
      const m0 = Math.abs(overturningMoment(loads, 0, 1, 0, count));
      if (-fy > thrust.value) thrust = { value: -fy, pose, ci };
      if (m0 > moment.value) moment = { value: m0, pose, ci };
      if (Math.abs(fx) > radial.value) radial = { value: Math.abs(fx), pose, ci };
      for (let ei = 0; ei < edges.length; ei++) {
        const edge = edges[ei]!.edge;
        tryEdge(pose, ci, overturningMoment(loads, edge, 1, base.surface, count), edge, edgeWords[ei]!);
        tryEdge(pose, ci, overturningMoment(loads, edge, -1, base.surface, count), edge, edgeWords[ei]!);
      }
      // the swivels above the base turned, all together (the drawing plane's set was just done)
      for (const headings of turnedSets) {
        const turned = armLoadsTurned(model, pose, payloadMasses(model, sweep, ci), headings);
        const words = headingWords(headings);
        const mAny = overturningAnyWay(turned, 0);
        if (mAny > moment.value) moment = { value: mAny, pose, ci, words };
        const fh = Math.hypot(
          turned.reduce((a, l) => a + l.fx, 0),
          turned.reduce((a, l) => a + l.fz, 0),
        );
        if (fh > radial.value) radial = { value: fh, pose, ci, words };
        if (!base.footprint) continue;
        const fyTurned = turned.reduce((a, l) => a + l.fy, 0);
        const W = base.footprint.width / 2;
        const Dp = base.footprint.depth / 2;
        const tries = base.yaw
          ? [
              {
                edge: W,
                lever: overturningAnyWay(turned, base.surface),
                heading: edges[0]!.heading,
              },
              {
                edge: Dp,
                lever: overturningAnyWay(turned, base.surface),
                heading: edges[1]!.heading,
              },
            ]
          : [
              {
                edge: W,
                lever: overturningToward(turned, 1, 0, base.surface),
                heading: "",
              },
              {
                edge: W,
                lever: overturningToward(turned, -1, 0, base.surface),
                heading: "",
              },
              {
                edge: Dp,
                lever: overturningToward(turned, 0, 1, base.surface),
                heading: "over the footprint's depth",
              },
              {
                edge: Dp,
                lever: overturningToward(turned, 0, -1, base.surface),
                heading: "over the footprint's depth",
              },
            ];
        for (const t of tries) {
          const said = [t.heading, words].filter((x) => x);
          tryEdge(pose, ci, t.lever + t.edge * fyTurned, t.edge, said.length ? `${said.join(", ")}, ` : "");
        }
      }
    }
  }
  const at = (p: Peak) =>
    p.pose ? `${describePose(sweep, p.pose, p.ci)}${p.words ? `, ${p.words}` : ""}` : "";
  addFigures(ctx.readouts, base.bodyId, "base", [
    {
      label: "vertical thrust on the base",
      value: thrust.value,
      dimension: "force",
      where: at(thrust),
    },
    {
      label: "overturning moment at the base",
      value: moment.value,
      dimension: "torque",
      where: at(moment),
    },
    {
      label: "radial load on the base",
      value: radial.value,
      dimension: "force",
      where: at(radial),
    },
  ]);
  if (!base.footprint) {
    addFigures(
      ctx.readouts,
      base.bodyId,
      "base",
      [],
      ["No footprint given: tipping is not checked (a base clamped or screwed down does not tip)."],
    );
    return;
  }
  if (!worst) return;
  const where = `${worst.heading}${describePose(sweep, worst.pose, worst.ci)}`;
  addFigures(ctx.readouts, base.bodyId, "base", [
    {
      label: "tipping safety factor",
      value: worst.safety,
      dimension: "dimensionless",
      where,
      result: {
        key: "tipping_safety",
        limit: model.require.tipping,
        atLeast: true,
      },
    },
  ]);
  noteSafety(ctx.readouts, base.bodyId, "base", worst.safety, "tipping", where);
  const need = model.require.tipping;
  if (worst.safety < need) {
    ctx.findings.push(
      finding(
        "geometry.tipping",
        spanOf(baseBody.origin, "mass", "footprint"),
        `base ${base.bodyId}: overturning moment ${show(worst.overturning, "torque")} about the footprint's edge against a restoring ${show(worst.restoring, "torque")}: tipping safety ${showSafety(worst.safety)} < ${showSafety(need)} required (${where})`,
        {
          related: model.payloads.map((p) => ({
            span: p.origin.name ?? p.origin.declaration,
            message: `payload ${p.id} adds to the overturning moment`,
          })),
          data: {
            subject: base.bodyId,
            safety: worst.safety,
            required: need,
            overturning: worst.overturning,
            restoring: worst.restoring,
          },
        },
      ),
    );
  }
}
