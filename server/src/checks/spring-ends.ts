// The ends of coil springs (`strength.spring-end`), from the coil a spring gives: extension hooks
// in bending and torsion at the largest pull, the body's solid length against the room between
// the hooks, the initial tension against what a spring maker can wind, and a torsion spring's
// wire in bending at its largest torque (Shigley ch. 10; formulas in mechanics/hardware/
// spring-ends.ts, wire strength in model/spring-wire.ts). Rules in docs/checks.md.
import type { ExtensionSpring, TorsionSpring } from "../model/types";
import type { Pose } from "../mechanics/types";
import {
  defaultHook,
  hookBendingStress,
  hookTorsionStress,
  initialStressRange,
  initialTensionForStress,
  initialTensionStress,
  shortestFreeLength,
  torsionSpringWireStress,
} from "../mechanics/hardware/spring-ends";
import { springIndex } from "../model/coil";
import type { CheckContext } from "./index";
import { finding } from "../findings/finding";
import type { SpringEndData } from "../findings/data";
import { addFigures, noteSafety, type Figure } from "./readout";
import { springWireStrength } from "./spring-strength";
import { describePose, pastDeadline, show, showSafety, spanOf } from "./part-words";

/** Lengths within this of a limit are at it (a sweep step lands on it to rounding). */
const LENGTH_SLACK_M = 1e-6;

const DEFAULT_HOOK_NOTE =
  "Hooks taken as full loops on the coil's radius, bent out of the body on twice the wire diameter (common practice): a tighter bend raises the hook's stress.";

interface Largest {
  value: number;
  pose: Pose;
  ci: number;
}

/** Largest |spring force| over the range and load cases (tension N, or torsion torque N*m), and
 * the shortest hook-to-hook length. */
function extremes(ctx: CheckContext, id: string): { force?: Largest; shortest?: Largest } {
  let force: Largest | undefined;
  let shortest: Largest | undefined;
  for (const pose of ctx.sweep.poses) {
    if (pastDeadline(ctx.options.deadline)) break;
    const st = pose.springs[id];
    if (st && Number.isFinite(st.length) && (!shortest || st.length < shortest.value))
      shortest = { value: st.length, pose, ci: 0 };
    pose.cases.forEach((c, ci) => {
      const f = c.springForce[id];
      if (f !== undefined && (!force || Math.abs(f) > force.value)) force = { value: Math.abs(f), pose, ci };
    });
  }
  return { ...(force ? { force } : {}), ...(shortest ? { shortest } : {}) };
}

export function checkSpringEnds(ctx: CheckContext): void {
  for (const s of ctx.model.springs) {
    if (s.kind === "extension" && s.coil) extensionEnds(ctx, s);
    else if (s.kind === "torsion" && s.coil) torsionWire(ctx, s);
  }
}

function report(
  ctx: CheckContext,
  s: ExtensionSpring | TorsionSpring,
  keys: string[],
  message: string,
  data: Omit<SpringEndData, "subject">,
  severity?: "warning" | "information",
): void {
  ctx.findings.push(
    finding("strength.spring-end", spanOf(s.origin, ...keys), message, {
      data: { subject: s.id, ...data },
      ...(severity ? { severity } : {}),
    }),
  );
}

function extensionEnds(ctx: CheckContext, s: ExtensionSpring): void {
  const coil = s.coil!;
  const wire = springWireStrength(ctx, coil);
  const { force, shortest } = extremes(ctx, s.id);
  const need = ctx.model.require.safety;
  const D = coil.meanDiameter;
  const d = coil.wireDiameter;
  const figures: Figure[] = [];
  const notes: string[] = [];

  // Hooks at the largest pull.
  if (wire && force) {
    const hook = defaultHook(D, d);
    const where = describePose(ctx.sweep, force.pose, force.ci);
    const checks = [
      {
        check: "hook bending" as const,
        stress: hookBendingStress(force.value, D, d, hook),
        allowable: wire.allowables.extensionHookBending * wire.tensile,
        share: wire.allowables.extensionHookBending,
      },
      {
        check: "hook torsion" as const,
        stress: hookTorsionStress(force.value, D, d, hook),
        allowable: wire.allowables.extensionHookTorsion * wire.tensile,
        share: wire.allowables.extensionHookTorsion,
      },
    ];
    notes.push(DEFAULT_HOOK_NOTE);
    for (const c of checks) {
      const sf = c.stress > 0 ? c.allowable / c.stress : Infinity;
      figures.push(
        { label: `${c.check} stress`, value: c.stress, dimension: "pressure", where },
        { label: `${c.check} safety factor`, value: sf, dimension: "dimensionless", where },
      );
      noteSafety(ctx.readouts, s.id, "spring", sf, c.check, where);
      if (sf < need)
        report(
          ctx,
          s,
          ["wire", "coil"],
          `spring ${s.id}: ${c.check === "hook bending" ? "bending at the inside of its hook" : "torsion where its hook bends out of the body"} ${show(c.stress, "pressure")} at ${show(force.value, "force")} against ${Math.round(c.share * 100)} % of S_ut ${show(wire.tensile, "pressure")}: safety ${showSafety(sf)} < ${showSafety(need)} required (${where}); the hook breaks before the coils`,
          { check: c.check, safety: sf, required: need, stress: c.stress, allowable: c.allowable },
        );
    }
  }

  // The body is close-wound: it cannot be shorter than its solid length plus two hooks.
  const least = shortestFreeLength(coil.bodyCoils, D, d);
  figures.push({ label: "shortest free length of the coil", value: least, dimension: "length" });
  if (s.freeLength > 0 && s.freeLength < least - LENGTH_SLACK_M)
    report(
      ctx,
      s,
      ["free_length"],
      `spring ${s.id}: free_length ${show(s.freeLength, "length")} is shorter than its coil can be: ${coil.bodyCoils} coils of ${show(d, "length")} wire make a solid body of ${show((coil.bodyCoils + 1) * d, "length")}, and two full-loop hooks add ${show(2 * (D - d), "length")} (${show(least, "length")} in all)`,
      { check: "body room", shortest: least, length: s.freeLength },
    );
  else if (shortest && shortest.value < least - LENGTH_SLACK_M)
    report(
      ctx,
      s,
      ["between"],
      `spring ${s.id}: the arm brings its hooks to ${show(shortest.value, "length")} apart, less than the ${show(least, "length")} its solid body and hooks need: the body is pushed against itself and bows (${describePose(ctx.sweep, shortest.pose)})`,
      { check: "body room", shortest: least, length: shortest.value },
    );

  // Initial tension within what a spring maker can wind.
  if (s.initialTension > 0) {
    const C = springIndex(D, d);
    const range = initialStressRange(C);
    const tau = initialTensionStress(s.initialTension, D, d);
    const low = initialTensionForStress(range.low, D, d);
    const high = initialTensionForStress(range.high, D, d);
    figures.push({ label: "initial tension a maker can wind", value: low, high, dimension: "force" });
    if (tau > range.high || tau < range.low) {
      const above = tau > range.high;
      report(
        ctx,
        s,
        ["initial_tension"],
        `spring ${s.id}: initial tension ${show(s.initialTension, "force")} (stress ${show(tau, "pressure")}) is ${above ? "more than a spring maker can wind" : "less than a spring maker usually winds"} into a coil of index ${C.toFixed(1)}: ${show(low, "force")} to ${show(high, "force")} (Shigley's preferred range of initial stress)${above ? "" : "; ask for it, or expect more"}`,
        { check: "initial tension", stress: tau, allowable: above ? range.high : range.low },
        above ? "warning" : "information",
      );
    }
  }
  if (figures.length > 0 || notes.length > 0) addFigures(ctx.readouts, s.id, "spring", figures, notes);
}

function torsionWire(ctx: CheckContext, s: TorsionSpring): void {
  const coil = s.coil!;
  const wire = springWireStrength(ctx, coil);
  const { force } = extremes(ctx, s.id);
  if (!wire || !force) return;
  const need = ctx.model.require.safety;
  const sigma = torsionSpringWireStress(force.value, coil.meanDiameter, coil.wireDiameter);
  const share = wire.allowables.torsionSpringBending;
  const allow = share * wire.tensile;
  const sf = sigma > 0 ? allow / sigma : Infinity;
  const where = describePose(ctx.sweep, force.pose, force.ci);
  addFigures(ctx.readouts, s.id, "spring", [
    { label: "wire bending stress", value: sigma, dimension: "pressure", where },
    { label: "wire safety factor", value: sf, dimension: "dimensionless", where },
  ]);
  noteSafety(ctx.readouts, s.id, "spring", sf, "torsion wire", where);
  if (sf < need)
    report(
      ctx,
      s,
      ["wire", "coil"],
      `torsion spring ${s.id}: wire bending stress ${show(sigma, "pressure")} at ${show(force.value, "torque")} against ${Math.round(share * 100)} % of S_ut ${show(wire.tensile, "pressure")}: safety ${showSafety(sf)} < ${showSafety(need)} required (${where})`,
      { check: "torsion wire", safety: sf, required: need, stress: sigma, allowable: allow },
    );
}
