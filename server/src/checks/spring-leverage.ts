// A spring that works at a small lever arm against the weight's (`geometry.spring-leverage`): to
// balance the arm it must pull many times the weight it carries, and that force goes through its
// hooks and anchor, the pin it works about and the bar it hooks on. The toggle check measures the
// lever arm against the hook radius, so an anchor a few millimetres from the pivot with a long
// hook radius passes it (issue 10 item 2); this check measures the force against the weight.
import type { ArmModel, Joint, Spring } from "../model/types";
import type { Pose } from "../mechanics/types";
import { worldPoint } from "../mechanics/body-loads";
import type { CheckContext } from "./index";
import { finding } from "../findings/finding";
import { chainToBase, placingJoints } from "./arm-paths";
import { workingJoint } from "./geometry";
import { bodyWord, describePose, pastDeadline, payloadMasses, show, spanOf } from "./part-words";
import { atJoint } from "../model/spring-kinds";

/** A spring pulling more than this many times the weight it balances is flagged. A balancer of
 * the usual proportions (anchor an eighth, hook a quarter of the payload's reach from the pivot;
 * docs/formulas.md's worked example: a = 50 mm, b = 100 mm, l = 400 mm) pulls about 12 times the
 * weight at the end of its range; twice that leaves room for such designs and still catches
 * springs whose pull is out of proportion (the 3 mm anchor pulls 133 times). Common
 * practice, no source. */
export const SPRING_FORCE_RATIO_LIMIT = 25;
/** A spring whose largest lever arm over the range is below this share of the weight's largest
 * is flagged: balanced, it must then pull more than the force ratio above (F a_spring = W a_weight
 * for a balanced pivot), so the two rules agree where the arm is balanced and this one also
 * catches a spring too weak to balance yet placed where it could never do it without a huge
 * force. Common practice, no source. */
export const SPRING_LEVER_SHARE_LIMIT = 1 / SPRING_FORCE_RATIO_LIMIT;
/** The lever rule counts for a spring that pulls at least this many times the weight somewhere:
 * a weaker one loads nothing much, and whether it balances is balance.unbalanced's question. */
const LEVER_RULE_LEAST_RATIO = 1;
/** A lever arm below this (0.1 mm) is a hook on the pivot, which geometry.spring-toggle reports. */
const ON_PIVOT_M = 1e-4;
/** Below this weight (N) the arm carries nothing worth balancing. */
const NEGLIGIBLE_WEIGHT_N = 1e-6;

type TwoEnded = Exclude<Spring, { kind: "torsion" }>;

/** Bodies the joint carries: its child and every body whose chain to the base passes through it. */
function carried(model: ArmModel, joint: Joint, placing: Map<string, Joint>): Set<string> {
  const out = new Set<string>();
  for (const b of model.bodies) {
    if (b.kind === "base") continue;
    if (b.id === joint.child || chainToBase(model, b.id, placing).some((j) => j.id === joint.id))
      out.add(b.id);
  }
  return out;
}

/** The carried bodies that weigh anything and the payloads on carried bodies, as indices into
 * model.bodies and model.payloads, in the model's order (so that the sums below add in the same
 * order as over the whole model). */
interface Carried {
  bodies: number[];
  payloads: number[];
}

function carriedParts(model: ArmModel, bodies: Set<string>): Carried {
  const out: Carried = { bodies: [], payloads: [] };
  model.bodies.forEach((b, i) => bodies.has(b.id) && b.mass > 0 && out.bodies.push(i));
  model.payloads.forEach((p, k) => bodies.has(p.body) && out.payloads.push(k));
  return out;
}

/** World x of every body's centre of mass and every payload's point at one pose (NaN where the
 * pose does not place the body): the same for every spring, so worked out once a pose. */
interface PlacedX {
  body: Float64Array;
  payload: Float64Array;
}

function placedX(model: ArmModel, pose: Pose): PlacedX {
  const body = Float64Array.from(model.bodies, (b) =>
    pose.bodies[b.id] ? worldPoint(pose, b.id, b.centreOfMass, model).x : NaN,
  );
  const payload = Float64Array.from(model.payloads, (p) =>
    pose.bodies[p.body] ? worldPoint(pose, p.body, p.point, model).x : NaN,
  );
  return { body, payload };
}

interface Weighed {
  /** Total weight carried, N, and the horizontal distance of its centre from the pivot, m. */
  weight: number;
  arm: number;
}

/** The weight carried and its arm about the pivot at x `pivotX`, written into `out` (no object
 * per pose and load case: the untuned tier pays for each). */
function weighAt(
  model: ArmModel,
  at: PlacedX,
  parts: Carried,
  masses: Record<string, number>,
  pivotX: number,
  out: Weighed,
): void {
  let w = 0;
  let moment = 0;
  const g = model.gravity;
  const { bodies, payloads } = parts;
  for (let n = 0; n < bodies.length; n++) {
    const i = bodies[n]!;
    const x = at.body[i]!;
    if (Number.isNaN(x)) continue;
    const m = model.bodies[i]!.mass;
    w += m * g;
    moment += m * g * (x - pivotX);
  }
  for (let n = 0; n < payloads.length; n++) {
    const k = payloads[n]!;
    const x = at.payload[k]!;
    if (Number.isNaN(x)) continue;
    const p = model.payloads[k]!;
    const m = masses[p.id] ?? p.mass;
    w += m * g;
    moment += m * g * (x - pivotX);
  }
  out.weight = w;
  out.arm = w > 0 ? Math.abs(moment / w) : 0;
}

export function checkSpringLeverage(ctx: CheckContext): void {
  const placing = placingJoints(ctx.model);
  const xs = new Map<Pose, PlacedX>();
  const placedAt = (pose: Pose) => {
    let at = xs.get(pose);
    if (!at) xs.set(pose, (at = placedX(ctx.model, pose)));
    return at;
  };
  for (const s of ctx.model.springs) if (!atJoint(s)) checkSpring(ctx, s, placing, placedAt);
}

function checkSpring(
  ctx: CheckContext,
  s: TwoEnded,
  placing: Map<string, Joint>,
  placedAt: (pose: Pose) => PlacedX,
): void {
  const { model, sweep } = ctx;
  const joint = workingJoint(model, sweep, s);
  if (!joint) return;
  const bodies = carried(model, joint, placing);
  const parts = carriedParts(model, bodies);
  const masses = sweep.loadCases.map((_, ci) => payloadMasses(model, sweep, ci));
  // The hook is the end on a carried body; the other end is the anchor.
  const hookEnd = bodies.has(s.b.body) ? "b" : bodies.has(s.a.body) ? "a" : undefined;
  if (!hookEnd) return;
  const hookBody = model.bodies.find((b) => b.id === s[hookEnd].body);
  let worst: { ratio: number; force: number; weight: number; pose: Pose; ci: number } | undefined;
  let springArm = 0;
  let weightArm = 0;
  let reaction = 0;
  let compression = 0;
  const weighed: Weighed = { weight: 0, arm: 0 };
  for (const pose of sweep.poses) {
    if (pastDeadline(ctx.options.deadline)) break;
    const st = pose.springs[s.id];
    if (!st) continue;
    const pivot = worldPoint(pose, joint.parent, joint.parentPoint, model);
    const hook = hookEnd === "b" ? st.b : st.a;
    const anchor = hookEnd === "b" ? st.a : st.b;
    const alongX = anchor.x - hook.x;
    const alongY = anchor.y - hook.y;
    const length = Math.hypot(alongX, alongY);
    if (length > 0)
      springArm = Math.max(
        springArm,
        Math.abs(alongX * (pivot.y - hook.y) - alongY * (pivot.x - hook.x)) / length,
      );
    // Unit vector from the hook toward the pivot: the part of the pull along it squeezes the bar.
    const toPivotX = pivot.x - hook.x;
    const toPivotY = pivot.y - hook.y;
    const reach = Math.hypot(toPivotX, toPivotY);
    const at = placedAt(pose);
    for (let ci = 0; ci < pose.cases.length; ci++) {
      const c = pose.cases[ci]!;
      const tension = c.springForce[s.id] ?? 0;
      weighAt(model, at, parts, masses[ci] ?? payloadMasses(model, sweep, ci), pivot.x, weighed);
      weightArm = Math.max(weightArm, weighed.arm);
      const r = c.reactions[joint.id];
      if (r) reaction = Math.max(reaction, Math.hypot(r.x, r.y));
      if (length > 0 && reach > 0)
        compression = Math.max(
          compression,
          (tension * (alongX * toPivotX + alongY * toPivotY)) / (length * reach),
        );
      if (!(weighed.weight > NEGLIGIBLE_WEIGHT_N)) continue;
      const ratio = Math.abs(tension) / weighed.weight;
      if (!worst || ratio > worst.ratio)
        worst = {
          ratio,
          force: Math.abs(tension),
          weight: weighed.weight,
          pose,
          ci,
        };
    }
  }
  if (!worst) return;
  const leverShare = weightArm > 0 ? springArm / weightArm : Infinity;
  const forceTooBig = worst.ratio > SPRING_FORCE_RATIO_LIMIT;
  const leverTooSmall =
    leverShare < SPRING_LEVER_SHARE_LIMIT && springArm >= ON_PIVOT_M && worst.ratio >= LEVER_RULE_LEAST_RATIO;
  if (!forceTooBig && !leverTooSmall) return;
  const where = describePose(sweep, worst.pose, worst.ci);
  const why = `its lever arm about ${joint.id} is at most ${show(springArm, "length")} against the ${show(weightArm, "length")} of the weight's`;
  const effects = [
    `the pin of ${joint.id} carries up to ${show(reaction, "force")}`,
    `its hooks and anchor take the full pull`,
    ...(hookBody && compression > 0
      ? [
          `${bodyWord(hookBody)} is squeezed by up to ${show(compression, "force")} between its hook and the pivot`,
        ]
      : []),
  ];
  ctx.findings.push(
    finding(
      "geometry.spring-leverage",
      spanOf(s.origin, "between"),
      `spring ${s.id} pulls ${show(worst.force, "force")} to hold ${show(worst.weight, "force")} of weight (${formatRatio(worst.ratio)} times, ${where}) because ${why}: ${effects.join("; ")}. Move its anchor farther from the pivot (or its hook farther out) so a weaker spring does the same work`,
      {
        related: [
          {
            span: joint.origin.name ?? joint.origin.declaration,
            message: `the pivot it works about: ${joint.id}`,
          },
          ...(hookBody
            ? [
                {
                  span: hookBody.origin.name ?? hookBody.origin.declaration,
                  message: `${bodyWord(hookBody)} carries its hook`,
                },
              ]
            : []),
        ],
        data: {
          subject: s.id,
          joint: joint.id,
          force: worst.force,
          weight: worst.weight,
          ratio: worst.ratio,
          leverArm: springArm,
          weightArm,
          pinReaction: reaction,
          ...(hookBody && compression > 0 ? { body: hookBody.id, compression } : {}),
        },
      },
    ),
  );
}

function formatRatio(r: number): string {
  return r >= 10 ? String(Math.round(r)) : r.toFixed(1);
}
