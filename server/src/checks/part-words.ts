// Words shared by the strength, geometry, stiffness and tipping checks: where a pose lies in the
// range, which words of the text a part's finding points at, figures in the units of this analysis's messages.
import type { ArmModel, Body, Joint, Origin } from "../model/types";
import type { Pose, SweepResult } from "../mechanics/types";
import type { Span } from "../syntax/span";
import type { DimensionName } from "../units/dimension";
import { formatNumber, formatResult, messageUnits } from "../units/format";
import type { RelatedInfo } from "../findings/finding";

/** A quantity as messages show it (in the system of this analysis's messages: units/format.ts
 * messageUnits; the editor shows hovers in either system). */
export function show(valueSI: number, dimension: DimensionName): string {
  return formatResult(valueSI, dimension, messageUnits());
}

/** A safety factor: two decimals, so 1.96 is not shown as 2.0 next to a limit of 2.0. */
/** Below this a factor shows two significant figures instead: 0.004 is not "0.00". */
const SMALL_SAFETY = 0.1;

export function showSafety(value: number): string {
  if (!Number.isFinite(value)) return "unlimited";
  return Math.abs(value) >= SMALL_SAFETY ? value.toFixed(2) : value.toPrecision(2);
}

export { formatNumber };

/** "at shoulder 45 deg" / "at stage -35 deg, lens_tilt -80 deg" (the reference pose when no dof). */
export function describePose(sweep: SweepResult, pose: Pose, caseIndex = 0): string {
  const parts = sweep.dofs.map(
    (d) => `${d.id} ${formatNumber(((pose.angles[d.id] ?? d.reference) * 180) / Math.PI)} deg`,
  );
  const where = parts.length > 0 ? `at ${parts.join(", ")}` : "at the reference pose";
  const lc = sweep.loadCases[caseIndex];
  return sweep.loadCases.length > 1 && lc ? `${where}, ${lc.label}` : where;
}

/** "at reach 10 deg (tool at 400 g), barrel turned 90 deg" */
export function describeStation(
  sweep: SweepResult,
  pose: Pose,
  ci: number,
  headings: Readonly<Record<string, number>>,
): string {
  const turned = headingWords(headings);
  return `${describePose(sweep, pose, ci)}${turned ? `, ${turned}` : ""}`;
}

/** "barrel turned 90 deg, base turned -90 deg"; empty when every swivel is at 0. */
export function headingWords(headings: Readonly<Record<string, number>>): string {
  return Object.entries(headings)
    .filter(([, h]) => h !== 0)
    .map(([id, h]) => `${id} turned ${show(h, "angle")}`)
    .join(", ");
}

/** The span of the first of `keys` present in the origin, else its name, else the declaration. */
export function spanOf(origin: Origin, ...keys: string[]): Span {
  for (const k of keys) {
    const s = origin.properties[k];
    if (s) return s;
  }
  return origin.name ?? origin.declaration;
}

/** The origin that owns the words for a body or joint: the parallelogram's for generated ones. */
export function owningOrigin(model: ArmModel, origin: Origin): { origin: Origin; parallelogram?: string } {
  if (origin.generatedBy) {
    const p = model.parallelograms.find((pp) => pp.id === origin.generatedBy);
    if (p) return { origin: p.origin, parallelogram: p.id };
  }
  return { origin };
}

/** Where the section and material of a body are written (`bars` for a parallelogram's bars). */
export function sectionSpan(model: ArmModel, body: Body): Span {
  const own = owningOrigin(model, body.origin);
  return own.parallelogram ? spanOf(own.origin, "bars") : spanOf(body.origin, "section", "material");
}

/** Where a joint's pin is written (`pins` on a parallelogram). */
export function pinSpan(model: ArmModel, joint: Joint): Span {
  const own = owningOrigin(model, joint.origin);
  return own.parallelogram ? spanOf(own.origin, "pins") : spanOf(joint.origin, "pin");
}

export function bodyWord(body: Body): string {
  return body.kind === "bar"
    ? `bar ${body.id}`
    : body.kind === "head"
      ? `head ${body.id}`
      : `link ${body.id}`;
}

export function relatedBody(body: Body, message: string): RelatedInfo {
  return { span: body.origin.name ?? body.origin.declaration, message };
}

/** True once the checks' time budget is spent or the run is cancelled (stop.ts). */
export { pastDeadline } from "../stop";

/** Payload mass of each payload in a load case (the model's nominal mass where absent). */
export function payloadMasses(
  model: ArmModel,
  sweep: SweepResult,
  caseIndex: number,
): Record<string, number> {
  const lc = sweep.loadCases[caseIndex];
  const out: Record<string, number> = {};
  for (const p of model.payloads) out[p.id] = lc?.payloadMass[p.id] ?? p.mass;
  return out;
}
