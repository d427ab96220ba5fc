// HTML tables shared by the panel and the report: safety factors, findings, and the pose table
// summary (extremes per degree of freedom, payload and spring, and a sampled pose list).
import type { ViewModel } from "./view-model";
import { esc, fig } from "./text";
import { shownForce, shownLength, shownTorque, type Shown } from "./display-units";

export function safetyTableHtml(vm: ViewModel): string {
  if (vm.safety.length === 0)
    return `<p class="none">No safety factors yet: the strength checks have not run on a solved arm.</p>`;
  let out = `<table class="safety"><thead><tr><th>part</th><th>governing check</th><th>safety factor</th><th>required</th><th>where</th></tr></thead><tbody>`;
  for (const row of vm.safety) {
    const ok = row.value >= row.required;
    out +=
      `<tr class="${ok ? "ok" : "fail"}" data-part="${esc(row.partId)}" data-status="${ok ? "ok" : "error"}"><td>${esc(row.id)}</td><td>${esc(row.what)}</td>` +
      `<td class="num">${fig(row.value)}${ok ? "" : " ✗"}</td><td class="num">${fig(row.required)}</td><td>${esc(row.where ?? "")}</td></tr>`;
  }
  return out + "</tbody></table>";
}

export function findingsHtml(vm: ViewModel): string {
  if (vm.findings.length === 0) return `<p class="none">No diagnostics.</p>`;
  let out = `<ul class="findings">`;
  for (const [i, f] of vm.findings.entries()) {
    out +=
      `<li class="${f.severity}" data-finding="${i}"${f.partId ? ` data-part="${esc(f.partId)}"` : ""}><span class="where">line ${f.range.start.line + 1}:${f.range.start.character + 1}</span> ` +
      `<span class="severity">${f.severity}</span> <code>${esc(f.code)}</code> ${esc(f.message)}</li>`;
  }
  return out + "</ul>";
}

function extreme(vm: ViewModel, value: (p: number) => number, sign: 1 | -1): { v: number; p: number } {
  let best = { v: NaN, p: -1 };
  vm.poses.forEach((_, p) => {
    const v = value(p);
    if (Number.isFinite(v) && (best.p < 0 || sign * v > sign * best.v)) best = { v, p };
  });
  return best;
}

function at(vm: ViewModel, p: number): string {
  if (p < 0) return "";
  return vm.dofs.map((d, i) => `${d.id} ${fig(vm.poses[p]!.anglesDeg[i]!)}°`).join(", ");
}

/** Extremes over the sweep: the figures a reader looks for first. */
export function poseSummaryHtml(vm: ViewModel): string {
  if (vm.poses.length === 0) return `<p class="none">No poses were solved.</p>`;
  let out = `<table class="summary"><thead><tr><th>quantity</th><th>least</th><th>where</th><th>greatest</th><th>where</th></tr></thead><tbody>`;
  const [torque, force, length] = [shownTorque(vm.units), shownForce(vm.units), shownLength(vm.units)];
  const row = (label: string, value: (p: number) => number, unit: Shown) => {
    const lo = extreme(vm, value, -1);
    const hi = extreme(vm, value, 1);
    out +=
      `<tr><td>${esc(label)}</td><td class="num">${fig(lo.v * unit.scale)} ${unit.symbol}</td><td>${esc(at(vm, lo.p))}</td>` +
      `<td class="num">${fig(hi.v * unit.scale)} ${unit.symbol}</td><td>${esc(at(vm, hi.p))}</td></tr>`;
  };
  vm.dofs.forEach((d, i) => row(`holding torque at ${d.id}`, (p) => vm.poses[p]!.netTorque[i]!, torque));
  for (const payload of vm.payloads) {
    vm.loadCases.forEach((lc, c) =>
      row(
        `hand force at ${payload.id}${vm.loadCases.length > 1 ? ` (${lc.label})` : ""}`,
        (p) => vm.poses[p]!.handForce[payload.id]?.[c] ?? NaN,
        force,
      ),
    );
  }
  for (const s of vm.springs) {
    if (s.kind !== "torsion") {
      row(
        `length of ${s.id}`,
        (p) => {
          const h = vm.poses[p]!.springs[s.id];
          return h ? Math.hypot(h[2] - h[0], h[3] - h[1]) : NaN;
        },
        length,
      );
    }
    row(
      `${s.kind === "torsion" ? "torque" : "tension"} of ${s.id}`,
      (p) => vm.poses[p]!.springForce[s.id] ?? NaN,
      s.kind === "torsion" ? torque : force,
    );
  }
  return out + "</tbody></table>";
}

/** The largest finite value (JSON turns a missing NaN into null), NaN if none. */
function largest(values: readonly (number | null)[] | undefined): number {
  const finite = (values ?? []).filter((v): v is number => typeof v === "number" && Number.isFinite(v));
  return finite.length ? Math.max(...finite) : NaN;
}

/** At most this many rows of the pose list go in a report: enough to follow the curves by hand. */
const MAX_POSE_ROWS = 25;

export function poseTableHtml(vm: ViewModel): string {
  if (vm.poses.length === 0) return "";
  const stride = Math.max(1, Math.ceil(vm.poses.length / MAX_POSE_ROWS));
  const [torque, force] = [shownTorque(vm.units), shownForce(vm.units)];
  let out =
    `<table class="poses"><thead><tr>${vm.dofs.map((d) => `<th>${esc(d.id)}, deg</th>`).join("")}` +
    `${vm.dofs.map((d) => `<th>torque ${esc(d.id)}, ${torque.symbol}</th>`).join("")}${vm.payloads.map((p) => `<th>hand ${esc(p.id)}, ${force.symbol}</th>`).join("")}</tr></thead><tbody>`;
  for (let p = 0; p < vm.poses.length; p += stride) {
    const pose = vm.poses[p]!;
    out +=
      `<tr>${pose.anglesDeg.map((a) => `<td class="num">${fig(a)}</td>`).join("")}${pose.netTorque.map((t) => `<td class="num">${fig(t * torque.scale)}</td>`).join("")}` +
      `${vm.payloads.map((pl) => `<td class="num">${fig(largest(pose.handForce[pl.id]) * force.scale)}</td>`).join("")}</tr>`;
  }
  out += `</tbody></table>`;
  if (stride > 1)
    out += `<p class="note">Every ${stride}th of ${vm.poses.length} poses; hand force is the largest over the load cases. <code>poise sweep</code> lists them all.</p>`;
  return out;
}
