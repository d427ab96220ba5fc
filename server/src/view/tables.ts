// HTML tables shared by the panel and the report: safety factors, findings, and the pose table
// summary (extremes per degree of freedom, payload and spring, and a sampled pose list).
import type { ViewModel } from "./view-model";
import { esc } from "./text";
import { CODES, type Code } from "../findings/codes";
import { formatFigure, unitLabel } from "../units/format";
import type { DimensionName } from "../units/dimension";

export function safetyTableHtml(vm: ViewModel): string {
  if (vm.safety.length === 0)
    return `<p class="none">No safety factors yet: the strength checks have not run on a solved arm.</p>`;
  let out = `<table class="safety"><thead><tr><th>part</th><th>governing check</th><th>safety factor</th><th>required</th><th>where</th></tr></thead><tbody>`;
  for (const row of vm.safety) {
    const ok = row.value >= row.required;
    out +=
      `<tr class="${ok ? "ok" : "fail"}" data-part="${esc(row.partId)}" data-status="${ok ? "ok" : "error"}"><td>${esc(row.id)}</td><td>${esc(row.what)}</td>` +
      `<td class="num">${formatFigure(row.value, "dimensionless", vm.units)}${ok ? "" : " ✗"}</td><td class="num">${formatFigure(row.required, "dimensionless", vm.units)}</td><td>${esc(row.where ?? "")}</td></tr>`;
  }
  return out + "</tbody></table>";
}

export function findingsHtml(vm: ViewModel): string {
  if (vm.findings.length === 0) return `<p class="none">No diagnostics.</p>`;
  let out = `<ul class="findings">`;
  for (const [i, f] of vm.findings.entries()) {
    out +=
      `<li class="${f.severity}" data-finding="${i}"${f.partId ? ` data-part="${esc(f.partId)}"` : ""}><span class="where">line ${f.range.start.line + 1}:${f.range.start.character + 1}</span> ` +
      `<span class="severity">${f.severity}</span> <strong class="what">${esc(CODES[f.code as Code]?.words ?? f.code)}</strong> ${esc(f.message)} <code class="code" title="the rule's code, as \`poise check\` prints it">${esc(f.code)}</code></li>`;
  }
  return out + "</ul>";
}

/** Figures that agree to this share are one figure: they differ by round-off only. */
const SAME_FIGURE = 1e-9;

/** The least (sign -1) or greatest (sign 1) value over the poses, at the first pose that has it:
 * where a quantity is the same at several poses (a spring that one stage does not stretch), the
 * round-off between them does not pick one. */
function extreme(vm: ViewModel, value: (p: number) => number, sign: 1 | -1): { v: number; p: number } {
  let best = { v: NaN, p: -1 };
  vm.poses.forEach((_, p) => {
    const v = value(p);
    if (!Number.isFinite(v)) return;
    const margin = SAME_FIGURE * Math.max(Math.abs(v), Math.abs(best.v));
    if (best.p < 0 || sign * (v - best.v) > margin) best = { v, p };
  });
  return best;
}

function at(vm: ViewModel, p: number): string {
  if (p < 0) return "";
  return vm.dofs
    .map((d, i) => `${d.id} ${formatFigure(vm.poses[p]!.angles[i]!, "angle", vm.units)}°`)
    .join(", ");
}

/** Extremes over the sweep: the figures a reader looks for first. */
export function poseSummaryHtml(vm: ViewModel): string {
  if (vm.poses.length === 0) return `<p class="none">No poses were solved.</p>`;
  let out = `<table class="summary"><thead><tr><th>quantity</th><th>least</th><th>where</th><th>greatest</th><th>where</th></tr></thead><tbody>`;
  const row = (label: string, value: (p: number) => number, dimension: DimensionName) => {
    const lo = extreme(vm, value, -1);
    const hi = extreme(vm, value, 1);
    const unit = unitLabel(dimension, vm.units);
    out +=
      `<tr><td>${esc(label)}</td><td class="num">${formatFigure(lo.v, dimension, vm.units)} ${unit}</td><td>${esc(at(vm, lo.p))}</td>` +
      `<td class="num">${formatFigure(hi.v, dimension, vm.units)} ${unit}</td><td>${esc(at(vm, hi.p))}</td></tr>`;
  };
  vm.dofs.forEach((d, i) => row(`holding torque at ${d.id}`, (p) => vm.poses[p]!.netTorque[i]!, "torque"));
  for (const payload of vm.payloads) {
    vm.loadCases.forEach((lc, c) =>
      row(
        `hand force at ${payload.id}${vm.loadCases.length > 1 ? ` (${lc.label})` : ""}`,
        (p) => vm.poses[p]!.handForce[payload.id]?.[c] ?? NaN,
        "force",
      ),
    );
  }
  for (const s of vm.springs) {
    if (s.jointId === undefined) {
      row(
        `length of ${s.id}`,
        (p) => {
          const h = vm.poses[p]!.springs[s.id];
          return h ? Math.hypot(h[2] - h[0], h[3] - h[1]) : NaN;
        },
        "length",
      );
    }
    row(
      `${s.jointId !== undefined ? "torque" : "tension"} of ${s.id}`,
      (p) => vm.poses[p]!.springForce[s.id] ?? NaN,
      s.jointId !== undefined ? "torque" : "force",
    );
  }
  return out + "</tbody></table>";
}

/** The largest finite value (JSON turns a missing NaN into null), NaN if none. */
/** The value of largest size, with its sign (a signed hand force: sinks +, rises −). */
function largest(values: readonly (number | null)[] | undefined): number {
  const finite = (values ?? []).filter((v): v is number => typeof v === "number" && Number.isFinite(v));
  return finite.length ? finite.reduce((a, b) => (Math.abs(b) > Math.abs(a) ? b : a)) : NaN;
}

/** At most this many rows of the pose list go in a report: enough to follow the curves by hand. */
const MAX_POSE_ROWS = 25;

export function poseTableHtml(vm: ViewModel): string {
  if (vm.poses.length === 0) return "";
  const stride = Math.max(1, Math.ceil(vm.poses.length / MAX_POSE_ROWS));
  const [torque, force] = [unitLabel("torque", vm.units), unitLabel("force", vm.units)];
  let out =
    `<table class="poses"><thead><tr>${vm.dofs.map((d) => `<th>${esc(d.id)}, ${unitLabel("angle", vm.units)}</th>`).join("")}` +
    `${vm.dofs.map((d) => `<th>torque ${esc(d.id)}, ${torque}</th>`).join("")}${vm.payloads.map((p) => `<th>hand ${esc(p.id)}, ${force}</th>`).join("")}</tr></thead><tbody>`;
  for (let p = 0; p < vm.poses.length; p += stride) {
    const pose = vm.poses[p]!;
    out +=
      `<tr>${pose.angles.map((a) => `<td class="num">${formatFigure(a, "angle", vm.units)}</td>`).join("")}${pose.netTorque.map((t) => `<td class="num">${formatFigure(t, "torque", vm.units)}</td>`).join("")}` +
      `${vm.payloads.map((pl) => `<td class="num">${formatFigure(largest(pose.handForce[pl.id]), "force", vm.units)}</td>`).join("")}</tr>`;
  }
  out += `</tbody></table>`;
  if (stride > 1)
    out += `<p class="note">Every ${stride}th of ${vm.poses.length} poses; hand force is the largest over the load cases. <code>poise sweep</code> lists them all.</p>`;
  return out;
}
