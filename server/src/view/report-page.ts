// The self-contained HTML report of `poise report`: drawing, plots, tables, diagnostics, limits
// and cautions, with inline SVG and CSS, no script and nothing fetched.
import type { ViewModel } from "./view-model";
import { renderArmSvg } from "./draw-arm";
import { renderPlotSvg, type PlotSpec } from "./draw-plot";
import { renderTopViewSvg } from "./draw-top";
import { torquePlot, handForcePlot } from "./plots";
import { nearestPose } from "./pose-lines";
import { findingsHtml, poseSummaryHtml, poseTableHtml, safetyTableHtml } from "./tables";
import { MODEL_LIMITS, SAFETY_CAUTIONS } from "./limits";
import { resultsTableHtml } from "./results-table";
import { PALETTE } from "./palette";
import { esc } from "./text";
import { formatFigureWithUnit, formatNumber, inDisplayUnit } from "../units/format";

const REPORT_CSS = `
body { font: 14px/1.45 system-ui, -apple-system, "Segoe UI", sans-serif; color: ${PALETTE.ink}; background: #fbf9f4; margin: 0; }
main { max-width: 1120px; margin: 0 auto; padding: 20px 28px 40px; }
h1 { font-size: 22px; margin: 0 0 4px; } h2 { font-size: 17px; margin: 28px 0 8px; border-bottom: 2px solid ${PALETTE.grid}; padding-bottom: 3px; }
.sub { color: ${PALETTE.muted}; margin: 0 0 12px; }
.verdict { display: inline-block; padding: 3px 10px; border-radius: 3px; font-weight: 600; color: #fff; }
.verdict.error { background: ${PALETTE.error}; } .verdict.warning { background: ${PALETTE.warning}; } .verdict.ok { background: ${PALETTE.payload}; }
.drawing svg { max-width: 100%; height: auto; border: 1px solid ${PALETTE.grid}; }
.ends { display: flex; flex-wrap: wrap; gap: 12px; } .ends figure { margin: 0; } .ends figcaption { font-size: 12px; color: ${PALETTE.muted}; }
.ends svg { border: 1px solid ${PALETTE.grid}; }
.plots { display: flex; flex-wrap: wrap; gap: 12px; } .plots svg { border: 1px solid ${PALETTE.grid}; }
table { border-collapse: collapse; margin: 6px 0; font-size: 13px; } th, td { padding: 3px 9px; border-bottom: 1px solid ${PALETTE.grid}; text-align: left; vertical-align: top; }
th { background: #efe9dc; } td.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
tr.fail td { color: ${PALETTE.error}; font-weight: 600; }
ul.findings { list-style: none; padding: 0; } ul.findings li { padding: 3px 0 3px 10px; border-left: 4px solid ${PALETTE.grid}; margin: 4px 0; }
ul.findings li.error { border-color: ${PALETTE.error}; } ul.findings li.warning { border-color: ${PALETTE.warning}; }
ul.findings code.code { color: ${PALETTE.muted}; font-size: 0.85em; }
.where { color: ${PALETTE.muted}; font-variant-numeric: tabular-nums; } .severity { font-weight: 600; }
.note, .none { color: ${PALETTE.muted}; font-size: 13px; }
.cautions { background: #fff4e0; border: 1px solid ${PALETTE.warning}; padding: 8px 16px; }
`;

function verdict(vm: ViewModel): string {
  const errors = vm.findings.filter((f) => f.severity === "error").length;
  const warnings = vm.findings.filter((f) => f.severity === "warning").length;
  if (errors)
    return `<span class="verdict error">${errors} error${errors > 1 ? "s" : ""}${warnings ? `, ${warnings} warning${warnings > 1 ? "s" : ""}` : ""}</span>`;
  if (warnings) return `<span class="verdict warning">${warnings} warning${warnings > 1 ? "s" : ""}</span>`;
  return `<span class="verdict ok">no errors or warnings</span>`;
}

/** The tune run's result in words under the drawing (the spec's `tune` lines). */
function tuneNote(vm: ViewModel): string {
  const t = vm.tune!;
  const force = (n: number | undefined) =>
    n === undefined ? "?" : formatFigureWithUnit(n, "force", vm.units);
  const springs = t.springs.map((s) => `${s.id}: ${s.changes.join(", ")}`).join("; ");
  return `<p class="note tune-note">The design search over the spec's <code>tune</code> lines found ${esc(springs)}; worst hand force over every pose and payload mass ${esc(force(t.worstBefore))} now, ${esc(force(t.worstAfter))} tuned, with every check re-run on the tuned design. The tuned springs are drawn dashed beside the present ones and their hand force is plotted ${esc(`"${t.otherLabel}"`)}; the values are not written into the spec (<code>poise tune --write</code> writes them). A starting point to build and measure, not a certificate.</p>`;
}

/** Small drawings at each end of every dof's range, the others as near their reference as the sweep has. */
function rangeEnds(vm: ViewModel): string {
  if (vm.poses.length < 2) return "";
  const spans = vm.dofs.map((d) => d.range[1] - d.range[0]);
  const angles = vm.poses.map((p) => p.angles);
  let out = `<div class="ends">`;
  vm.dofs.forEach((d, i) => {
    for (const end of [d.values[0]!, d.values[d.values.length - 1]!]) {
      const target = vm.dofs.map((o, k) => (k === i ? end : o.reference));
      const p = nearestPose(angles, target, spans);
      out += `<figure>${renderArmSvg(vm, p, { widthPx: 260, tuneOverlay: false })}<figcaption>${esc(d.id)} at ${formatNumber(inDisplayUnit(end, "angle", vm.units))}°</figcaption></figure>`;
    }
  });
  return out + "</div>";
}

/** A plot's upright line at the reference angle itself, named as such in the legend. */
function atReference(vm: ViewModel, d: number, spec: PlotSpec): PlotSpec {
  return {
    ...spec,
    markerX: inDisplayUnit(vm.dofs[d]!.reference, "angle", vm.units),
    markerLabel: "reference pose",
  };
}

/** For an arm that turns above its base: the reference pose seen from above, straight and with
 * each swivel between stages turned a quarter turn (or as far as its range goes), where a stage
 * across the one below twists it and bends it sideways. */
function topViews(vm: ViewModel): string {
  if (!vm.swivels || !vm.poses.length) return "";
  const across: Record<string, number> = {};
  for (const s of vm.swivels)
    if (s.parent !== vm.bodies.find((b) => b.kind === "base")?.id)
      across[s.id] = Math.max(s.heading[0], Math.min(s.heading[1], Math.PI / 2));
  return [
    `<h2>Seen from above</h2>`,
    `<p class="note">The reference pose from above (the side view's reader at the bottom), straight and with each swivel between stages turned across; the dashed arcs are the payload's path as each swivel turns through its range. The stiffness and strength findings name the heading where each figure is worst.</p>`,
    `<div class="drawing">${renderTopViewSvg(vm, vm.referencePose, {}, { widthPx: 370 })}${renderTopViewSvg(vm, vm.referencePose, across, { widthPx: 370 })}</div>`,
  ].join("\n");
}

export interface ReportOptions {
  /** The spec's path as the user gave it. */
  file: string;
}

export function renderReportHtml(vm: ViewModel, options: ReportOptions): string {
  const plots = vm.dofs
    .map(
      (_, d) =>
        renderPlotSvg(atReference(vm, d, torquePlot(vm, d, vm.referencePose))) +
        (vm.payloads.length ? renderPlotSvg(atReference(vm, d, handForcePlot(vm, d, vm.referencePose))) : ""),
    )
    .join("");
  const body = [
    `<h1>${esc(vm.title)}</h1>`,
    `<p class="sub">Counterpoise report for <code>${esc(options.file)}</code> — ${verdict(vm)}</p>`,
    `<h2>The arm</h2>`,
    `<p class="note">Drawn to scale in its plane at the reference pose; bodies as thick as their section depth, the dashed line the payload's path over the range. Parts flagged red fail a check; amber ones carry a warning.</p>`,
    `<div class="drawing">${renderArmSvg(vm, "reference", { widthPx: 760 })}</div>`,
    ...(vm.tune ? [tuneNote(vm)] : []),
    ...(vm.thinned
      ? [
          `<p class="note">Drawn and plotted from ${vm.thinned.shown} of the ${vm.thinned.solved} poses solved (every few values of each degree of freedom, both ends kept); the checks used them all.</p>`,
        ]
      : []),
    rangeEnds(vm),
    ...(vm.swivels && vm.poses.length ? [topViews(vm)] : []),
    `<h2>Torques and hand force</h2>`,
    vm.poses.length
      ? `<div class="plots">${plots}</div><p class="note">${esc(vm.torqueMethod)} Plotted along each degree of freedom with the others at the reference pose; the grey dashed upright line marks the reference pose itself (the drawing above), the shaded band the hand force <code>require balance</code> allows.</p>`
      : `<p class="none">No poses were solved.</p>`,
    `<h2>Safety factors</h2>`,
    `<p class="note">Required: ${vm.requiredSafety}. Lowest first.</p>`,
    safetyTableHtml(vm),
    `<h2>Figures over the range</h2>`,
    `<p class="note">The worst of each figure over every pose and load case, against its requirement, whether it passes or not (<code>poise results</code> gives them as JSON).</p>`,
    resultsTableHtml(vm.results, vm.units),
    `<h2>Diagnostics</h2>`,
    findingsHtml(vm),
    `<h2>Over the range</h2>`,
    poseSummaryHtml(vm),
    poseTableHtml(vm),
    `<h2>Limits of the model</h2>`,
    `<ul class="limits">${MODEL_LIMITS.map((l) => `<li>${esc(l)}</li>`).join("")}</ul>`,
    `<h2>Before you build</h2>`,
    `<div class="cautions"><ul>${SAFETY_CAUTIONS.map((c) => `<li>${esc(c)}</li>`).join("")}</ul></div>`,
  ].join("\n");
  return `<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${esc(vm.title)} — Counterpoise report</title>
<style>${REPORT_CSS}</style></head>
<body><main>
${body}
</main></body></html>
`;
}
