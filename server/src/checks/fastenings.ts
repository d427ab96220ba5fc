// Fastenings at every pose and load case (`strength.fastening`): the force and moment through each
// use of a fastening (a spring's end, a fixed joint, a payload's clamp, the base on the bench), in
// the frame of the body it holds to, then the screws, bolts or glue against what they can take
// (mechanics/hardware/fastening-safety.ts). Rules in docs/checks.md.
import type { ArmModel, Body, Fastening, FasteningAxis, Origin, Vec2 } from "../model/types";
import type { Pose, SweepResult } from "../mechanics/types";
import {
  fastenerForces,
  fastenerSafety,
  glueSafety,
  distancesFromEdge,
  type FastenerForces,
  type FasteningLoad,
  type FasteningMaterials,
  type FasteningSafety,
} from "../mechanics/hardware/fastening-safety";
import { rowOfFasteners, tensionFromMoment } from "../mechanics/hardware/fastener-group";
import { FORMED_THREAD_ENGAGEMENT_SHARE } from "../mechanics/hardware/threads";
import { PEEL_CAUTION } from "../mechanics/hardware/bond";
import { armLoads, overturningMoment, restoringMoment } from "./tipping";
import type { CheckContext } from "./index";
import { finding } from "../findings/finding";
import { addFigures, noteSafety, type PartKind } from "./readout";
import { describePose, pastDeadline, payloadMasses, show, showSafety, spanOf } from "./part-words";
import { atJoint } from "../model/spring-kinds";

/** One place a fastening is used, and how to find the load through it at a pose. */
interface Use {
  fastening: Fastening;
  /** The part whose words name the fastening, and the key that does. */
  subject: string;
  subjectKind: PartKind;
  origin: Origin;
  key: string;
  /** Words for messages and readouts: "the hook of spring lift". */
  words: string;
  axis: FasteningAxis;
  /** The forces on the most loaded screw or bolt, or the load (for glue), at a pose. */
  at: (
    pose: Pose,
    ci: number,
  ) => { load?: FasteningLoad; forces?: FastenerForces; words: string } | undefined;
  notes: string[];
}

function materialsOf(model: ArmModel, f: Fastening): FasteningMaterials {
  switch (f.kind) {
    case "screws": {
      const fastener = model.materials[f.screwMaterial];
      const into = model.materials[f.into];
      return { ...(fastener ? { fastener } : {}), ...(into ? { into } : {}) };
    }
    case "bolts": {
      const fastener = model.materials[f.material];
      return fastener ? { fastener } : {};
    }
    case "glue": {
      const adhesive = model.materials[f.adhesive];
      return adhesive ? { adhesive } : {};
    }
  }
}

/** A world vector in a body's frame (the base's frame is the world's). */
function toLocal(pose: Pose, body: Body, v: Vec2): Vec2 {
  const phi = body.kind === "base" ? 0 : (pose.bodies[body.id]?.phi ?? 0);
  const c = Math.cos(phi);
  const s = Math.sin(phi);
  return { x: c * v.x + s * v.y, y: -s * v.x + c * v.y };
}

/** The load on a part held at `point` of `body` by a force `force` (world): along and across the
 * body, the across part positive off the face the part sits on (the side of the point's offset
 * from the body's axis; unknown for a point on the axis or on the base). */
function partLoad(
  pose: Pose,
  body: Body,
  point: Vec2,
  force: Vec2,
  moment: number,
  f: Fastening,
): FasteningLoad {
  const l = toLocal(pose, body, force);
  const side = body.kind === "base" ? 0 : Math.sign(point.y);
  return {
    along: l.x,
    across: side === 0 ? l.y : side * l.y,
    moment,
    lever: f.lever ?? (body.kind === "base" ? 0 : Math.abs(point.y)),
    eitherSide: side === 0,
  };
}

function leverNote(f: Fastening, body: Body): string[] {
  return f.lever === undefined && body.kind === "base"
    ? [
        `How far the load stands off the base's face is not known: give \`lever\` in fastening ${f.id} to count the prying moment.`,
      ]
    : [];
}

function usesOf(model: ArmModel, sweep: SweepResult): Use[] {
  const uses: Use[] = [];
  const body = (id: string) => model.bodies.find((b) => b.id === id);
  const fastening = (id: string | undefined) => (id ? model.fastenings[id] : undefined);
  for (const s of model.springs) {
    if (atJoint(s) || !s.fastenings) continue;
    for (const end of ["a", "b"] as const) {
      const f = fastening(s.fastenings[end]);
      const att = s[end];
      const b = body(att.body);
      if (!f || !b) continue;
      const words = `the ${end === "a" ? "anchor" : "hook"} of spring ${s.id}`;
      uses.push({
        fastening: f,
        subject: s.id,
        subjectKind: "spring",
        origin: s.origin,
        key: end === "a" ? "anchor_fastening" : "hook_fastening",
        words,
        axis: f.axis ?? "across",
        notes: leverNote(f, b),
        at: (pose, ci) => {
          const st = pose.springs[s.id];
          const T = pose.cases[ci]?.springForce[s.id];
          if (!st || T === undefined || !(st.length > 0)) return undefined;
          const [from, to] = end === "a" ? [st.a, st.b] : [st.b, st.a];
          const u = { x: (to.x - from.x) / st.length, y: (to.y - from.y) / st.length };
          return {
            load: partLoad(pose, b, att.point, { x: T * u.x, y: T * u.y }, 0, f),
            words: `spring pull ${show(Math.abs(T), "force")}`,
          };
        },
      });
    }
  }
  for (const j of model.joints) {
    const f = fastening(j.fastening);
    const b = body(j.child);
    if (!f || !b) continue;
    uses.push({
      fastening: f,
      subject: j.id,
      subjectKind: "joint",
      origin: j.origin,
      key: "fastening",
      words: `joint ${j.id}`,
      axis: f.axis ?? "through",
      notes: [],
      at: (pose, ci) => {
        const c = pose.cases[ci];
        const r = c?.reactions[j.id];
        if (!r) return undefined;
        const m = c.lockedTorque[j.id] ?? 0;
        const load = partLoad(pose, b, j.childPoint, r, m, f);
        return {
          load: { ...load, eitherSide: true },
          words: `force ${show(Math.hypot(r.x, r.y), "force")} and locked moment ${show(Math.abs(m), "torque")}`,
        };
      },
    });
  }
  for (const p of model.payloads) {
    const f = fastening(p.fastening);
    const b = body(p.body);
    if (!f || !b) continue;
    uses.push({
      fastening: f,
      subject: p.id,
      subjectKind: "payload",
      origin: p.origin,
      key: "fastening",
      words: `payload ${p.id}`,
      axis: f.axis ?? "across",
      notes: leverNote(f, b),
      at: (pose, ci) => {
        const mass = payloadMasses(model, sweep, ci)[p.id] ?? p.mass;
        const F = { x: p.force?.x ?? 0, y: -mass * model.gravity + (p.force?.y ?? 0) };
        return {
          load: partLoad(pose, b, p.point, F, 0, f),
          words: `its weight and working force ${show(Math.hypot(F.x, F.y), "force")}`,
        };
      },
    });
  }
  const base = model.base;
  const f = fastening(base?.fastening);
  const baseBody = base && body(base.bodyId);
  if (base && f && baseBody) uses.push(baseUse(model, sweep, base, baseBody, f));
  return uses;
}

/** The base held to the bench: the arm tips it about the footprint's edge (or, with no footprint,
 * about the edge of the row of screws) and only the part of that moment its own weight does not
 * hold pulls the screws; the sideways load shears them (friction not counted). A row along x;
 * with `yaw` the arm also faces across the row, which tips it about the row's side. */
function baseUse(
  model: ArmModel,
  sweep: SweepResult,
  base: NonNullable<ArmModel["base"]>,
  baseBody: Body,
  f: Fastening,
): Use {
  const W = base.mass * model.gravity;
  const count = f.kind === "glue" ? 1 : f.count;
  const diameter = f.kind === "glue" ? 0 : f.diameter;
  const row = rowOfFasteners(count, f.spacing ?? 0).map((p) => p.x);
  const rowEdge = distancesFromEdge(count, f.spacing, diameter);
  const alongEdge = base.footprint ? base.footprint.width / 2 : Math.max(...row) + rowEdge[0]!;
  const acrossEdge = base.footprint ? base.footprint.depth / 2 : rowEdge[0]!;
  return {
    fastening: f,
    subject: base.bodyId,
    subjectKind: "base",
    origin: baseBody.origin,
    key: "fastening",
    words: `base ${base.bodyId}`,
    axis: "across",
    notes: [],
    at: (pose, ci) => {
      const loads = armLoads(model, pose, payloadMasses(model, sweep, ci));
      const fx = loads.reduce((a, l) => a + l.fx, 0);
      const fy = loads.reduce((a, l) => a + l.fy, 0);
      const uplift = Math.max(0, fy - W);
      const words = `overturning moment ${show(Math.abs(overturningMoment(loads, 0, 1, base.surface)), "torque")} at the base`;
      if (f.kind === "glue")
        return {
          load: {
            along: fx,
            across: uplift,
            moment: Math.max(0, Math.abs(overturningMoment(loads, 0, 1, base.surface))),
            lever: 0,
          },
          words,
        };
      let tension = 0;
      const tip = (edge: number, sign: 1 | -1, c: number[]) => {
        const net =
          overturningMoment(loads, edge, sign, base.surface) -
          restoringMoment(base.mass, model.gravity, edge);
        if (net <= 0) return;
        tension = Math.max(tension, ...tensionFromMoment(c, net, uplift));
      };
      for (const sign of [1, -1] as const)
        tip(
          alongEdge,
          sign,
          row.map((x) => Math.max(0, alongEdge - sign * x)),
        );
      if (base.yaw)
        for (const sign of [1, -1] as const)
          tip(
            acrossEdge,
            sign,
            row.map(() => acrossEdge),
          );
      if (tension === 0 && uplift > 0) tension = uplift / count;
      return { forces: { shear: Math.abs(fx) / count, tension }, words };
    },
  };
}

/** The safety of a fastening at one pose of one use. */
function safetyAt(
  f: Fastening,
  use: Use,
  mats: FasteningMaterials,
  at: NonNullable<ReturnType<Use["at"]>>,
): FasteningSafety | undefined {
  if (f.kind === "glue") {
    if (!mats.adhesive || !at.load) return undefined;
    return glueSafety(f.area, use.axis, at.load, mats.adhesive);
  }
  const forces = at.forces ?? fastenerForces(f.count, f.spacing, f.diameter, use.axis, at.load!);
  return fastenerSafety(f, forces, mats);
}

/** What fails, in words for a message. */
function failureWords(f: Fastening, r: FasteningSafety): string {
  const each = f.kind === "glue" ? "" : ` on the most loaded of ${f.count} ${f.kind}`;
  switch (r.check) {
    case "thread stripping":
      return `pull-out ${show(r.tension, "force")}${each} against a stripping force of ${show(r.allowable, "force")} in the ${f.kind === "screws" ? f.into : ""} (${f.kind === "screws" ? f.thread : ""} thread)`;
    case "screw":
    case "bolt":
      return `${r.check} stress ${show(r.stress, "pressure")} (tension ${show(r.tension, "force")}, shear ${show(r.shear, "force")}${each}) against ${show(r.allowable, "pressure")}`;
    case "hole bearing":
      return `the ${f.kind === "screws" ? f.into : "part"} bears ${show(r.stress, "pressure")} against the screw (shear ${show(r.shear, "force")}${each}), against ${show(r.allowable, "pressure")}`;
    case "glue shear":
      return `glue shear ${show(r.stress, "pressure")} against its lap-shear strength ${show(r.allowable, "pressure")}`;
    case "glue peel":
      return `the glue is pulled open: ${show(r.stress, "pressure")} across the bond against its lap-shear strength ${show(r.allowable, "pressure")}, which a bond in peel does not reach`;
    case "cannot hold a moment":
      return `one ${f.kind === "bolts" ? "bolt" : "screw"} cannot hold the moment: the parts turn about it (give two, with a spacing)`;
  }
}

export function checkFastenings(ctx: CheckContext): void {
  const { model, sweep } = ctx;
  const need = model.require.safety;
  for (const use of usesOf(model, sweep)) {
    const f = use.fastening;
    const mats = materialsOf(model, f);
    let worst: { r: FasteningSafety; pose: Pose; ci: number; words: string } | undefined;
    for (const pose of sweep.poses) {
      if (pastDeadline(ctx.options.deadline)) break;
      for (let ci = 0; ci < pose.cases.length; ci++) {
        const at = use.at(pose, ci);
        if (!at) continue;
        const r = safetyAt(f, use, mats, at);
        if (r && (!worst || r.safety < worst.r.safety)) worst = { r, pose, ci, words: at.words };
      }
    }
    if (!worst) continue;
    const w = worst;
    const where = describePose(sweep, w.pose, w.ci);
    const notes = [...use.notes];
    if (f.kind === "glue") notes.push(PEEL_CAUTION);
    if (f.kind === "screws" && f.thread === "formed")
      notes.push(
        `A thread the screw forms in its pilot hole counts ${Math.round(FORMED_THREAD_ENGAGEMENT_SHARE * 100)} % of its engagement (common practice, no source).`,
      );
    if (!Number.isFinite(w.r.safety)) {
      // nothing pulls or shears it anywhere in range (a base its own weight holds down)
      addFigures(
        ctx.readouts,
        f.id,
        "fastening",
        [],
        [`At ${use.words}: no load reaches it anywhere in range.`, ...notes],
      );
      continue;
    }
    addFigures(
      ctx.readouts,
      f.id,
      "fastening",
      [
        {
          label: `at ${use.words}: largest tension on one ${unit(f)}`,
          value: w.r.tension,
          dimension: "force",
          where,
        },
        {
          label: `at ${use.words}: largest shear on one ${unit(f)}`,
          value: w.r.shear,
          dimension: "force",
          where,
        },
        { label: `at ${use.words}: safety factor`, value: w.r.safety, dimension: "dimensionless", where },
      ],
      notes,
    );
    const what = `${use.key.replace("_", " ")} ${f.id}`;
    addFigures(ctx.readouts, use.subject, use.subjectKind, [
      { label: `${what} safety factor`, value: w.r.safety, dimension: "dimensionless", where },
    ]);
    noteSafety(
      ctx.readouts,
      f.id,
      "fastening",
      w.r.safety,
      `fastening at ${use.words} (${w.r.check})`,
      where,
    );
    noteSafety(
      ctx.readouts,
      use.subject,
      use.subjectKind,
      w.r.safety,
      `fastening ${f.id} (${w.r.check})`,
      where,
    );
    if (w.r.safety < need)
      ctx.findings.push(
        finding(
          "strength.fastening",
          spanOf(use.origin, use.key),
          `fastening ${f.id} at ${use.words}: ${failureWords(f, w.r)}: safety ${showSafety(w.r.safety)} < ${showSafety(need)} required (${w.words} ${where})`,
          {
            related: [{ span: f.origin.name ?? f.origin.declaration, message: `fastening ${f.id}` }],
            data: {
              subject: use.subject,
              fastening: f.id,
              use: use.key,
              check: w.r.check,
              safety: w.r.safety,
              required: need,
              shear: w.r.shear,
              tension: w.r.tension,
            },
          },
        ),
      );
  }
}

function unit(f: Fastening): string {
  return f.kind === "screws" ? "screw" : f.kind === "bolts" ? "bolt" : "bond";
}
