// The one-line summary of a spec for the client's status bar: the worst hand force needed to hold
// a payload anywhere in range, and the least safety factor of any part.
import type { Analysis } from "../../analysis";
import type { SpecSummary } from "../custom-protocol";
import { formatNumber, formatQuantity } from "../../units/format";
import { shownUnits, type Settings } from "../session/settings";
import { REQUIREMENT_DEFAULTS } from "../../model/schema";

export function worstHandForce(analysis: Analysis): { valueN: number; payload: string } | undefined {
  let worst: { valueN: number; payload: string } | undefined;
  for (const pose of analysis.sweep?.poses ?? []) {
    for (const statics of pose.cases) {
      for (const [payload, force] of Object.entries(statics.handForce)) {
        if (Number.isFinite(force) && (!worst || force > worst.valueN)) worst = { valueN: force, payload };
      }
    }
  }
  return worst;
}

export function worstSafety(analysis: Analysis): { value: number; part: string; what: string } | undefined {
  let worst: { value: number; part: string; what: string } | undefined;
  for (const r of Object.values(analysis.readouts)) {
    const s = r.worstSafety;
    if (s && Number.isFinite(s.value) && (!worst || s.value < worst.value))
      worst = { value: s.value, part: r.id, what: s.what };
  }
  return worst;
}

export function specSummary(
  uri: string,
  version: number,
  analysis: Analysis,
  settings: Settings,
): SpecSummary {
  const errors = analysis.findings.filter((f) => f.severity === "error").length;
  const warnings = analysis.findings.filter((f) => f.severity === "warning").length;
  const hand = worstHandForce(analysis);
  const safety = worstSafety(analysis);
  const model = analysis.model;
  const parts: string[] = [];
  const tips: string[] = [];
  const summary: SpecSummary = { uri, version, text: "", tooltip: "", errors, warnings };
  if (hand) {
    const limit = model
      ? (model.require.balance.byPayload[hand.payload] ?? model.require.balance.default)
      : REQUIREMENT_DEFAULTS.balanceN;
    summary.worstHandForce = { ...hand, limitN: limit };
    const units = shownUnits(settings, analysis);
    const shown = formatQuantity(hand.valueN, "force", units);
    parts.push(`hand ${shown}`);
    tips.push(
      `Worst hand force: ${shown} at ${hand.payload} (limit ${formatQuantity(limit, "force", units)})`,
    );
  }
  if (safety) {
    // Tipping has its own requirement; every other safety factor answers to `require safety`.
    const tipping = /tipping/i.test(safety.what);
    const limit = tipping
      ? (model?.require.tipping ?? REQUIREMENT_DEFAULTS.tipping)
      : (model?.require.safety ?? REQUIREMENT_DEFAULTS.safety);
    summary.worstSafety = { ...safety, limit };
    parts.push(`safety ${formatNumber(safety.value)}`);
    tips.push(
      `Least safety factor: ${formatNumber(safety.value)} (${safety.part}, ${safety.what}; required ${formatNumber(limit)})`,
    );
  }
  if (!model) parts.push("no model");
  tips.push(`${errors} error${errors === 1 ? "" : "s"}, ${warnings} warning${warnings === 1 ? "" : "s"}`);
  summary.text = parts.join(" · ") || "no figures yet";
  summary.tooltip = tips.join("\n");
  return summary;
}
