// Balance checks and readouts: the hand force needed to hold each payload against `require
// balance` (balance.unbalanced, on the spring whose retuning helps most, with the best-fit
// settings for a quick fix), pivots whose friction does not hold the arm (balance.drifts), and
// the figures hovers show for joints, springs and payloads.
import type { ArmModel, Spring } from "../model/types";
import type { Pose, SweepResult } from "../mechanics/types";
import { pastDeadline } from "./part-words";
import type { CheckContext } from "./index";
import { finding, type RelatedInfo } from "../findings/finding";
import { addFigures, type Figure } from "./readout";
import { bestSpringFit, idealZeroLengthRate, type SpringFit } from "../mechanics/spring-fit";
import { atJoint, springKind } from "../model/spring-kinds";
import { signedHandForce } from "../mechanics/hand-force";
import { formatAngle, formatForce, formatTorque } from "../mechanics/format";
import { formatResult, messageUnits } from "../units/format";
import type { DimensionName } from "../units/dimension";
import { springRow } from "../mechanics/spring-table";

const formatQuantityFor = (valueSI: number, dimension: DimensionName): string =>
  formatResult(valueSI, dimension, messageUnits());

/** A best-fit first parameter (rate, force, area) below this fraction of the present one means
 * the spring is better left out: common practice, no source. */
const USELESS_FRACTION = 0.02;

/** A pose's dof angles in words, plus the load case when it is not the nominal one. */
export function poseWhere(sweep: SweepResult, pose: Pose, caseIndex = 0): string {
  const angles = sweep.dofs.map((d) => `${d.id} ${formatAngle(pose.angles[d.id]!)}`).join(", ");
  const lc = sweep.loadCases[caseIndex];
  return `at ${angles || "the reference pose"}${caseIndex > 0 && lc ? ` (${lc.label})` : ""}`;
}

/** Where a balance finding about a spring points: the first of its kind's balance keys written. */
function spanOfSpring(s: Spring) {
  for (const key of springKind(s).balanceKeys) {
    const at = s.origin.properties[key];
    if (at) return at;
  }
  return s.origin.name ?? s.origin.declaration;
}

/** The load case of the worst pose, when the sweep has one by that index. */
function caseOf(sweep: SweepResult, caseIndex: number): { caseId?: string } {
  const id = sweep.loadCases[caseIndex]?.id;
  return id === undefined ? {} : { caseId: id };
}

interface Worst {
  value: number;
  pose: Pose;
  caseIndex: number;
}

function worstHandForce(sweep: SweepResult, payloadId: string): Worst | undefined {
  let w: Worst | undefined;
  for (const pose of sweep.poses) {
    pose.cases.forEach((c, ci) => {
      const v = c.handForce[payloadId];
      if (v !== undefined && (!w || v > w.value)) w = { value: v, pose, caseIndex: ci };
    });
  }
  return w;
}

/** The best-fit settings by the property each goes in, SI: what a balance quick fix writes. */
function bestSettings(s: Spring, fit: SpringFit): Record<string, number> {
  const settings: Record<string, number> = {};
  springKind(s).fit.forEach((setting, i) => (settings[setting.key] = fit.best[i]!));
  return settings;
}

/** The best fit in words: "rate 0.39 N/mm and no initial tension", "extended force 120 N". */
function fitWords(s: Spring, fit: SpringFit): string {
  const [first, second] = springKind(s).fit;
  const [p0, p1] = fit.best;
  const head = `${first.messageWords} ${formatQuantityFor(p0, first.dimension)}`;
  if (!second) return head;
  return second.negligible !== undefined && Math.abs(p1) < second.negligible
    ? `${head} and no ${second.messageWords}`
    : `${head} with ${second.messageWords} ${formatQuantityFor(p1, second.dimension)}`;
}

export function balanceChecks(ctx: CheckContext): void {
  const { model, sweep } = ctx;
  if (sweep.poses.length === 0) return;
  const fits = new Map<string, SpringFit | undefined>();
  const fitOf = (id: string) => {
    if (!fits.has(id))
      fits.set(id, pastDeadline(ctx.options.deadline) ? undefined : bestSpringFit(model, sweep, id));
    return fits.get(id);
  };

  for (const p of model.payloads) {
    const worst = worstHandForce(sweep, p.id);
    if (!worst) continue;
    const limit = model.require.balance.byPayload[p.id] ?? model.require.balance.default;
    if (!(worst.value > limit)) continue;
    const st = worst.pose.cases[worst.caseIndex]!;
    const vec = st.handForceVector?.[p.id];
    const sinks = (vec?.y ?? 0) > 0;
    // The dof whose holding torque is the largest at the worst pose: the joint to point at.
    let dofId: string | undefined;
    for (const d of sweep.dofs)
      if (!dofId || Math.abs(st.holdingTorque[d.id] ?? 0) > Math.abs(st.holdingTorque[dofId] ?? 0))
        dofId = d.id;
    const joint = model.joints.find((j) => j.id === dofId);
    // The spring that should balance it: the one whose best fit lowers the worst hand force most.
    let chosen: { spring: Spring; fit: SpringFit } | undefined;
    for (const s of model.springs) {
      const acts = sweep.poses.some(
        (pose) => springRow(pose.springTorquePerUnit, s.id)?.some((v) => v !== 0) ?? false,
      );
      if (!acts) continue;
      const fit = fitOf(s.id);
      if (fit && (!chosen || fit.worstHandForceAfter < chosen.fit.worstHandForceAfter))
        chosen = { spring: s, fit };
    }
    const where = poseWhere(sweep, worst.pose, worst.caseIndex);
    const related: RelatedInfo[] = [
      {
        span: p.origin.name ?? p.origin.declaration,
        message: `payload ${p.id}: ${formatForce(worst.value)} to hold ${where}`,
      },
    ];
    if (joint)
      related.push({
        span: joint.origin.name ?? joint.origin.declaration,
        message: `holding torque at ${joint.id}: ${formatTorque(st.holdingTorque[joint.id] ?? 0)} ${where}`,
      });
    const head = `Holding ${p.id} takes ${formatForce(worst.value)} ${where}, over the ${formatForce(limit)} that require balance allows: the arm ${sinks ? "sinks" : "rises"} there.`;
    if (chosen) {
      const { spring, fit } = chosen;
      const better = fit.worstHandForceAfter < fit.worstHandForceBefore * (1 - 1e-6);
      // A best fit that all but removes the spring says the spring works against the balance
      // where it is: no setting written into the document would help, so offer none.
      const vanishes =
        fit.best[0] < USELESS_FRACTION * Math.abs(fit.current[0]) &&
        (fit.names[1] === undefined || Math.abs(fit.best[1]) <= USELESS_FRACTION * Math.abs(fit.current[1]));
      const advice = !better
        ? ` Spring ${spring.id} as placed cannot do better (worst ${formatForce(fit.worstHandForceAfter)}): move its anchor or hook.`
        : vanishes
          ? ` Spring ${spring.id} works against the balance where it is placed (the best setting is almost no spring at all, leaving ${formatForce(fit.worstHandForceAfter)}): move its anchor or hook.`
          : ` With spring ${spring.id} at ${fitWords(spring, fit)} the worst hand force over the range would be ${formatForce(fit.worstHandForceAfter)}.`;
      ctx.findings.push(
        finding("balance.unbalanced", spanOfSpring(spring), head + advice, {
          related,
          data: {
            subject: spring.id,
            payload: p.id,
            spring: spring.id,
            limit,
            worstHandForce: worst.value,
            worstPose: { ...worst.pose.angles },
            ...caseOf(sweep, worst.caseIndex),
            sinks,
            worstHandForceBefore: fit.worstHandForceBefore,
            worstHandForceAfter: fit.worstHandForceAfter,
            ...(better && !vanishes ? { best: bestSettings(spring, fit) } : {}),
          },
        }),
      );
    } else {
      ctx.findings.push(
        finding(
          "balance.unbalanced",
          p.origin.properties["mass"] ?? p.origin.name ?? p.origin.declaration,
          `${head} No spring balances it.`,
          {
            related,
            data: {
              subject: p.id,
              payload: p.id,
              limit,
              worstHandForce: worst.value,
              worstPose: { ...worst.pose.angles },
              ...caseOf(sweep, worst.caseIndex),
              sinks,
            },
          },
        ),
      );
    }
  }

  driftChecks(ctx);
  jointReadouts(ctx);
  springReadouts(ctx, fitOf);
  payloadReadouts(ctx);
}

/** Runs of consecutive sample values (sorted) where `bad` holds, as [low, high] pairs. */
export function subRanges(values: number[], bad: (v: number) => boolean): [number, number][] {
  const sorted = [...new Set(values)].sort((a, b) => a - b);
  const runs: [number, number][] = [];
  let start: number | undefined;
  let last: number | undefined;
  for (const v of sorted) {
    if (bad(v)) {
      if (start === undefined) start = v;
      last = v;
    } else if (start !== undefined) {
      runs.push([start, last!]);
      start = undefined;
    }
  }
  if (start !== undefined) runs.push([start, last!]);
  return runs;
}

function driftChecks(ctx: CheckContext): void {
  const { model, sweep } = ctx;
  for (const dof of sweep.dofs) {
    const joint = model.joints.find((j) => j.id === dof.jointId);
    if (!joint || joint.friction === undefined) continue;
    const friction = joint.friction;
    // The largest holding torque past friction at each angle of the dof (over the other dofs and
    // the load cases), signed: each run says its own way of turning.
    const drifting = new Map<number, number>();
    let worst = 0;
    for (const pose of sweep.poses) {
      for (const c of pose.cases) {
        const t = c.holdingTorque[dof.id] ?? 0;
        const angle = pose.angles[dof.id]!;
        if (Math.abs(t) > friction && !(Math.abs(drifting.get(angle) ?? 0) >= Math.abs(t)))
          drifting.set(angle, t);
        if (Math.abs(t) > Math.abs(worst)) worst = t;
      }
    }
    if (drifting.size === 0) continue;
    const runs = subRanges(
      sweep.poses.map((p) => p.angles[dof.id]!),
      (v) => drifting.has(v),
    );
    const runTorque = runs.map(([a, b]) => {
      let most = 0;
      for (const [angle, t] of drifting)
        if (angle >= a && angle <= b && Math.abs(t) > Math.abs(most)) most = t;
      return most;
    });
    // A positive holding torque is what the hand must add counter-clockwise: without it the arm
    // turns clockwise.
    const turn = (t: number) => (t > 0 ? "clockwise" : "counter-clockwise");
    const span = ([a, b]: [number, number]) =>
      a === b ? formatAngle(a) : `${formatAngle(a)} .. ${formatAngle(b)}`;
    const oneWay = runTorque.every((t) => Math.sign(t) === Math.sign(runTorque[0]!));
    const how = oneWay
      ? `so it turns ${turn(worst)} on its own`
      : `so it turns on its own: ${runs.map((r, i) => `${turn(runTorque[i]!)} over ${span(r)}`).join(", ")}`;
    ctx.findings.push(
      finding(
        "balance.drifts",
        joint.origin.properties["friction"] ?? joint.origin.name ?? joint.origin.declaration,
        `${isStage(model, joint.id) ? "parallelogram" : "joint"} ${joint.id} does not hold over ${runs.map(span).join(", ")}${sweep.dofs.length > 1 && sweep.grid ? " (for some position of the other joints)" : ""}: the holding torque reaches ${formatTorque(Math.abs(worst))} against friction of ${formatTorque(friction)}, ${how}.`,
        {
          data: {
            subject: joint.id,
            ranges: runs,
            turns: runTorque.map(turn),
            worstHoldingTorque: worst,
            friction,
          },
        },
      ),
    );
  }
}

function isStage(model: ArmModel, id: string): boolean {
  return model.parallelograms.some((p) => p.id === id);
}

interface Extreme {
  v: number;
  pose: Pose;
  ci: number;
}

function jointReadouts(ctx: CheckContext): void {
  const { model, sweep } = ctx;
  for (const joint of model.joints) {
    const id = joint.id;
    if (sweep.poses.length === 0 || sweep.poses[0]!.jointAngles[id] === undefined) continue;
    const figures: Figure[] = [];
    let angleLo = Infinity;
    let angleHi = -Infinity;
    const dof = sweep.dofs.find((d) => d.jointId === id);
    let most: Extreme | undefined;
    let least: Extreme | undefined;
    let reaction: Extreme | undefined;
    let lockedMax: Extreme | undefined;
    for (const pose of sweep.poses) {
      const angle = pose.jointAngles[id]!;
      if (angle < angleLo) angleLo = angle;
      if (angle > angleHi) angleHi = angle;
      for (let ci = 0; ci < pose.cases.length; ci++) {
        const c = pose.cases[ci]!;
        if (dof) {
          const t = c.holdingTorque[dof.id] ?? 0;
          if (!most || t > most.v) most = { v: t, pose, ci };
          if (!least || t < least.v) least = { v: t, pose, ci };
        }
        const r = c.reactions[id];
        if (r) {
          const m = Math.sqrt(r.x * r.x + r.y * r.y);
          if (!reaction || m > reaction.v) reaction = { v: m, pose, ci };
        }
        const lt = c.lockedTorque[id];
        if (lt !== undefined && (!lockedMax || Math.abs(lt) > Math.abs(lockedMax.v)))
          lockedMax = { v: lt, pose, ci };
      }
    }
    figures.push({ label: "angle range", value: angleLo, high: angleHi, dimension: "angle" });
    if (least && most) {
      figures.push({
        label: "holding torque, least",
        value: least.v,
        dimension: "torque",
        where: poseWhere(sweep, least.pose, least.ci),
      });
      figures.push({
        label: "holding torque, most",
        value: most.v,
        dimension: "torque",
        where: poseWhere(sweep, most.pose, most.ci),
      });
    }
    if (lockedMax)
      figures.push({
        label: "locked torque, largest",
        value: lockedMax.v,
        dimension: "torque",
        where: poseWhere(sweep, lockedMax.pose, lockedMax.ci),
      });
    if (reaction)
      figures.push({
        label: "largest reaction",
        value: reaction.v,
        dimension: "force",
        where: poseWhere(sweep, reaction.pose, reaction.ci),
      });
    addFigures(ctx.readouts, id, isStage(model, id) ? "parallelogram" : "joint", figures);
  }
}

function springReadouts(ctx: CheckContext, fitOf: (id: string) => SpringFit | undefined): void {
  const { model, sweep } = ctx;
  for (const s of model.springs) {
    if (!sweep.poses.some((p) => p.springs[s.id])) continue;
    const figures: Figure[] = [];
    const notes: string[] = [];
    const kind = springKind(s);
    if (!atJoint(s)) {
      const lengths = sweep.poses.map((p) => p.springs[s.id]!.length);
      figures.push({
        label: "length range",
        value: Math.min(...lengths),
        high: Math.max(...lengths),
        dimension: "length",
        result: { key: "length" },
      });
    } else {
      // The solver keeps the torque on the parent; the designer reads the spring from the child's
      // side, where a positive preload lifts (counter-clockwise positive), so both signs flip here.
      const turns = sweep.poses.map((p) => -(p.springs[s.id]!.windUp ?? 0));
      figures.push({
        label: "wind-up range (positive lifts the child)",
        value: Math.min(...turns),
        high: Math.max(...turns),
        dimension: "angle",
        result: { key: "wind_up" },
      });
    }
    // A spring at a joint reads as the torque on the child (see above); one between hooks as its pull.
    const sign = atJoint(s) ? -1 : 1;
    const forces = sweep.poses.map((p) => sign * (p.cases[0]!.springForce[s.id] ?? 0));
    figures.push({
      label: atJoint(s) ? "torque on the child range (counter-clockwise positive)" : "force range",
      value: Math.min(...forces),
      high: Math.max(...forces),
      dimension: atJoint(s) ? "torque" : "force",
      result: { key: atJoint(s) ? "torque" : "force" },
    });
    const ideal = idealZeroLengthRate(model, sweep, s.id);
    if (ideal)
      figures.push({
        label: "ideal rate (zero free length, k = m g l / (a b))",
        value: ideal.rate,
        dimension: "stiffness",
        where: `about ${ideal.dofId}`,
      });
    const fit = fitOf(s.id);
    if (fit) {
      kind.fit.forEach((setting, i) =>
        figures.push({ label: setting.label, value: fit.best[i]!, dimension: setting.dimension }),
      );
      figures.push({ label: "worst hand force now", value: fit.worstHandForceBefore, dimension: "force" });
      figures.push({
        label: "worst hand force with best fit",
        value: fit.worstHandForceAfter,
        dimension: "force",
      });
      notes.push(
        "Best fit: the settings that minimise the worst hand force over the whole range and every load case, with the spring where it is and the pivots' friction holding what it can (nested golden-section search; the holding torques are affine in them where the spring is taut).",
      );
    }
    notes.push(...kind.cautions);
    addFigures(ctx.readouts, s.id, "spring", figures, notes);
  }
}

function payloadReadouts(ctx: CheckContext): void {
  const { model, sweep } = ctx;
  const ref = sweep.reference;
  for (const p of model.payloads) {
    const figures: Figure[] = [];
    const jac = ref?.payloadJacobian?.[p.id];
    if (jac) {
      for (const d of sweep.dofs) {
        const dp = jac[d.id];
        // Holding torque its weight causes at the dof: m g (dp/dtheta)_y (virtual work).
        if (dp)
          figures.push({
            label: `gravity torque about ${d.id}`,
            value: p.mass * model.gravity * dp.y,
            dimension: "torque",
            where: "at the reference pose",
          });
      }
    }
    // Signed: positive where the arm sinks (the hand lifts), negative where it rises; the hand
    // supplies only what the pivots' friction does not hold.
    let lo: { v: number; pose: Pose; ci: number } | undefined;
    let hi: { v: number; pose: Pose; ci: number } | undefined;
    for (const pose of sweep.poses) {
      pose.cases.forEach((c, ci) => {
        const vec = c.handForceVector?.[p.id];
        if (!vec) return;
        const v = signedHandForce(vec);
        if (!lo || v < lo.v) lo = { v, pose, ci };
        if (!hi || v > hi.v) hi = { v, pose, ci };
      });
    }
    if (lo && hi)
      figures.push({
        label: "hand force range, beyond friction (+ the arm sinks, - it rises)",
        value: lo.v,
        high: hi.v,
        dimension: "force",
        result: {
          key: "hand_force",
          limit: model.require.balance.byPayload[p.id] ?? model.require.balance.default,
        },
        // The least is the greatest only when every pose gives the same figure (friction holding
        // the whole range, or nothing to hold, gives 0 everywhere): naming one pose for both misleads.
        where:
          lo.v === hi.v
            ? lo.v === 0
              ? "none needed at any pose"
              : "the same at every pose"
            : `least ${poseWhere(sweep, lo.pose, lo.ci)}; greatest ${poseWhere(sweep, hi.pose, hi.ci)}`,
      });
    if (figures.length > 0) addFigures(ctx.readouts, p.id, "payload", figures);
  }
}
