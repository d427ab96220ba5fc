// Springs over the swept range: past max_length, max_stretch, max_angle or a gas strut's
// stroke (`strength.overstretch`); coil body stress of extension springs against their wire's
// share of S_ut (Shigley ch. 10, model/spring-wire.ts); readouts of length use, stress and
// safety; the rubber creep caution.
import type { CoilGeometry, Spring } from "../model/types";
import type { Pose } from "../mechanics/types";
import { coilBodyShearStress } from "../mechanics/structure/spring-stress";
import {
  DECLARED_WIRE_FAMILY,
  gradeTensileStrength,
  WIRE_ALLOWABLES,
  wireGrade,
  type WireAllowables,
} from "../model/spring-wire";
import type { CheckContext } from "./index";
import { finding, type FindingData } from "../findings/finding";
import { addFigures, noteSafety } from "./readout";
import { describePose, pastDeadline, show, showSafety, spanOf } from "./part-words";

/** Lengths within this of a limit are at the limit (a sweep step lands on it to rounding). */
const LENGTH_SLACK_M = 1e-6;

export interface SpringWireStrength {
  /** Minimum tensile strength S_ut of the wire at its size, Pa. */
  tensile: number;
  /** Shares of S_ut each part of the spring may carry statically. */
  allowables: WireAllowables;
  /** Set when a built-in wire's size lies outside Shigley's table: its nearest row is extrapolated. */
  outsideTable?: string;
}

/** The wire's minimum tensile strength and allowables: a built-in wire by its own size, S_ut =
 * A / d^m with A and m of Shigley table 10-4, and its family's shares (tables 10-7, section
 * 10-12); a declared wire material by its `strength`, as a carbon spring steel. */
export function springWireStrength(ctx: CheckContext, coil: CoilGeometry): SpringWireStrength | undefined {
  const mat = ctx.model.materials[coil.material];
  if (!mat) return undefined;
  const grade = mat.builtin ? wireGrade(mat.id) : undefined;
  if (!grade) return { tensile: mat.strength, allowables: WIRE_ALLOWABLES[DECLARED_WIRE_FAMILY] };
  const at = gradeTensileStrength(grade, coil.wireDiameter);
  const rows = grade.ranges;
  return {
    tensile: at.strength,
    allowables: WIRE_ALLOWABLES[grade.family],
    ...(at.inTable
      ? {}
      : {
          outsideTable: `${show(coil.wireDiameter, "length")} ${grade.id} is outside the ${rows[0]!.dMinMm}-${rows[rows.length - 1]!.dMaxMm} mm of Shigley table 10-4: its strength is extrapolated.`,
        }),
  };
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
  const over = (
    message: string,
    key: string,
    figures: Omit<FindingData<"strength.overstretch">, "subject" | "limitKey">,
  ) =>
    ctx.findings.push(
      finding("strength.overstretch", spanOf(spring.origin, key), message, {
        data: { subject: spring.id, limitKey: key, ...figures },
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
      const wire = spring.coil && springWireStrength(ctx, spring.coil);
      if (spring.coil && force && wire) {
        const Sut = wire.tensile;
        const share = wire.allowables.extensionBodyTorsion;
        const tau = coilBodyShearStress(force.value, spring.coil.meanDiameter, spring.coil.wireDiameter);
        const allow = share * Sut;
        const sf = tau > 0 ? allow / tau : Infinity;
        addFigures(ctx.readouts, spring.id, "spring", [
          { label: "body stress", value: tau, dimension: "pressure", where: where(force) },
          { label: "body safety factor", value: sf, dimension: "dimensionless" },
        ]);
        if (wire.outsideTable) notes.push(wire.outsideTable);
        noteSafety(ctx.readouts, spring.id, "spring", sf, "coil body", where(force));
        if (sf < ctx.model.require.safety)
          ctx.findings.push(
            finding(
              "strength.overstress",
              spanOf(spring.origin, "wire", "rate"),
              `spring ${spring.id}: body stress ${show(tau, "pressure")} at ${show(force.value, "force")} against ${Math.round(share * 100)} % of S_ut ${show(Sut, "pressure")}: safety ${showSafety(sf)} < ${showSafety(ctx.model.require.safety)} required (${where(force)})`,
              { data: { subject: spring.id, check: "coil", safety: sf, required: ctx.model.require.safety } },
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
