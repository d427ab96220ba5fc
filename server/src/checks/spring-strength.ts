// Springs over the swept range: past max_length, max_stretch, max_angle or a gas strut's
// stroke (`strength.overstretch`); coil body stress of extension springs against 0.45 S_ut
// (Shigley ch. 10); readouts of length use, stress and safety; the rubber creep caution.
import type { ExtensionSpring, Spring } from "../model/types";
import type { Pose } from "../mechanics/types";
import {
  coilBodyShearStress,
  EXTENSION_BODY_ALLOWABLE_RATIO,
  minimumTensileStrength,
  MUSIC_WIRE_STRENGTH,
} from "../mechanics/structure/spring-stress";
import type { CheckContext } from "./index";
import { finding } from "./finding";
import { addFigures, noteSafety } from "./readout";
import { describePose, pastDeadline, show, showSafety, spanOf } from "./part-words";

/** Lengths within this of a limit are at the limit (a sweep step lands on it to rounding). */
const LENGTH_SLACK_M = 1e-6;

/** Minimum tensile strength of a spring's wire: A / d^m for music wire (Shigley Table 10-4),
 * else the material's `strength` as given. */
export function wireTensileStrength(ctx: CheckContext, spring: ExtensionSpring): number | undefined {
  const coil = spring.coil;
  if (!coil) return undefined;
  const mat = ctx.model.materials[coil.material];
  if (/music/i.test(coil.material))
    return minimumTensileStrength(MUSIC_WIRE_STRENGTH.aMpaMm, MUSIC_WIRE_STRENGTH.m, coil.wireDiameter);
  return mat?.strength;
}

interface Extreme {
  value: number;
  pose: Pose;
  caseIndex: number;
}

function keepMax(prev: Extreme | undefined, value: number, pose: Pose, caseIndex: number): Extreme {
  return !prev || value > prev.value ? { value, pose, caseIndex } : prev;
}

function keepMin(prev: Extreme | undefined, value: number, pose: Pose, caseIndex: number): Extreme {
  return !prev || value < prev.value ? { value, pose, caseIndex } : prev;
}

export function checkSpringStrength(ctx: CheckContext): void {
  for (const spring of ctx.model.springs) checkSpring(ctx, spring);
}

function checkSpring(ctx: CheckContext, spring: Spring): void {
  const { sweep } = ctx;
  let longest: Extreme | undefined;
  let shortest: Extreme | undefined;
  let windUp: Extreme | undefined;
  let force: Extreme | undefined;
  for (const pose of sweep.poses) {
    if (pastDeadline(ctx.options.deadline)) break;
    const st = pose.springs[spring.id];
    if (!st) continue;
    if (Number.isFinite(st.length)) {
      longest = keepMax(longest, st.length, pose, 0);
      shortest = keepMin(shortest, st.length, pose, 0);
    }
    if (st.windUp !== undefined) windUp = keepMax(windUp, Math.abs(st.windUp), pose, 0);
    pose.cases.forEach((c, ci) => {
      const f = c.springForce[spring.id];
      if (f !== undefined) force = keepMax(force, Math.abs(f), pose, ci);
    });
  }
  const where = (e: Extreme) => describePose(sweep, e.pose, e.caseIndex);
  const over = (message: string, key: string, data: Record<string, unknown>) =>
    ctx.findings.push(
      finding("strength.overstretch", spanOf(spring.origin, key), message, {
        data: { spring: spring.id, ...data },
      }),
    );
  const notes: string[] = [];
  switch (spring.kind) {
    case "extension": {
      if (longest && spring.maxLength !== undefined) {
        addFigures(ctx.readouts, spring.id, "spring", [
          {
            label: "use of max length",
            value: longest.value / spring.maxLength,
            dimension: "dimensionless",
            where: where(longest),
          },
        ]);
        if (longest.value > spring.maxLength + LENGTH_SLACK_M)
          over(
            `spring ${spring.id}: stretched to ${show(longest.value, "length")}, past its max_length ${show(spring.maxLength, "length")} (${where(longest)})`,
            "max_length",
            { length: longest.value, limit: spring.maxLength },
          );
      }
      const Sut = wireTensileStrength(ctx, spring);
      if (spring.coil && force && Sut) {
        const tau = coilBodyShearStress(force.value, spring.coil.meanDiameter, spring.coil.wireDiameter);
        const allow = EXTENSION_BODY_ALLOWABLE_RATIO * Sut;
        const sf = tau > 0 ? allow / tau : Infinity;
        addFigures(ctx.readouts, spring.id, "spring", [
          { label: "body stress", value: tau, dimension: "pressure", where: where(force) },
          { label: "body safety factor", value: sf, dimension: "dimensionless" },
        ]);
        noteSafety(ctx.readouts, spring.id, "spring", sf, "coil body", where(force));
        if (sf < ctx.model.require.safety)
          ctx.findings.push(
            finding(
              "strength.overstress",
              spanOf(spring.origin, "wire", "rate"),
              `spring ${spring.id}: body stress ${show(tau, "pressure")} at ${show(force.value, "force")} against 45 % of S_ut ${show(Sut, "pressure")}: safety ${showSafety(sf)} < ${showSafety(ctx.model.require.safety)} required (${where(force)})`,
              { data: { part: spring.id, check: "coil", safety: sf, required: ctx.model.require.safety } },
            ),
          );
      } else if (!spring.coil)
        notes.push("Coil body stress needs the wire: give wire, coil and coils to check it.");
      break;
    }
    case "elastic": {
      // one caution is enough: the balance readout may already carry it
      if (!ctx.readouts[spring.id]?.notes.some((n) => /creep/i.test(n)))
        notes.push(
          "Rubber creeps under constant load and relaxes over time: expect the force to fall and re-check the balance after some days under load.",
        );
      if (longest && spring.maxStretch !== undefined) {
        const stretch = longest.value / spring.freeLength;
        addFigures(ctx.readouts, spring.id, "spring", [
          { label: "largest stretch", value: stretch, dimension: "dimensionless", where: where(longest) },
        ]);
        if (stretch > spring.maxStretch + LENGTH_SLACK_M)
          over(
            `cord ${spring.id}: stretched ${stretch.toFixed(2)} times its free length, past its max_stretch ${spring.maxStretch} (${where(longest)})`,
            "max_stretch",
            { stretch, limit: spring.maxStretch },
          );
      }
      break;
    }
    case "torsion": {
      if (windUp && spring.maxAngle !== undefined) {
        addFigures(ctx.readouts, spring.id, "spring", [
          { label: "largest wind-up", value: windUp.value, dimension: "angle", where: where(windUp) },
        ]);
        if (windUp.value > spring.maxAngle + LENGTH_SLACK_M)
          over(
            `torsion spring ${spring.id}: wound ${show(windUp.value, "angle")}, past its max_angle ${show(spring.maxAngle, "angle")} (${where(windUp)})`,
            "max_angle",
            { windUp: windUp.value, limit: spring.maxAngle },
          );
      }
      break;
    }
    case "gas": {
      const closed = spring.extendedLength - spring.stroke;
      if (shortest && shortest.value < closed - LENGTH_SLACK_M)
        over(
          `gas strut ${spring.id}: the arm needs it ${show(shortest.value, "length")} long, shorter than fully compressed ${show(closed, "length")}: it bottoms out (${where(shortest)})`,
          "stroke",
          { length: shortest.value, limit: closed },
        );
      if (longest && longest.value > spring.extendedLength + LENGTH_SLACK_M)
        over(
          `gas strut ${spring.id}: the arm pulls it to ${show(longest.value, "length")}, past its extended length ${show(spring.extendedLength, "length")} (${where(longest)})`,
          "extended_length",
          { length: longest.value, limit: spring.extendedLength },
        );
      break;
    }
    case "zero_length":
      break;
  }
  if (notes.length > 0) addFigures(ctx.readouts, spring.id, "spring", [], notes);
}
