// The arm preview's webview script (bundled for the browser into dist/preview-page.js): draws the
// view model the extension posts, poses the drawing from the sliders, and asks the extension to
// reveal a part's declaration when it is clicked. Rendering is the shared pure view layer.
import type { ViewModel } from "../../server/src/view/view-model";
import { renderArmSvg } from "../../server/src/view/draw-arm";
import { renderTopViewSvg } from "../../server/src/view/draw-top";
import { renderPlotSvg } from "../../server/src/view/draw-plot";
import { handForcePlot, torquePlot } from "../../server/src/view/plots";
import { nearestPose } from "../../server/src/view/pose-lines";
import { findingsHtml, safetyTableHtml } from "../../server/src/view/tables";
import { resultsTableHtml } from "../../server/src/view/results-table";
import { MODEL_LIMITS, SAFETY_CAUTIONS } from "../../server/src/view/limits";
import { formatFigure } from "../../server/src/units/format";

/** What the extension posts to the page, and what the page posts back. */
export type ToPage = { type: "view"; model: ViewModel | null; uri: string };
export type FromPage =
  | { type: "ready" }
  | { type: "reveal"; uri: string; partId: string; range?: ViewModel["parts"][number]["range"] };

interface HostApi {
  postMessage(message: FromPage): void;
  getState(): unknown;
  setState(state: unknown): void;
}
declare function acquireVsCodeApi(): HostApi;

const host = acquireVsCodeApi();
let vm: ViewModel | null = null;
let uri = "";
/** Slider value per dof id, rad: kept across updates so editing does not snap the pose back, and
 * in the webview's state so that hiding and showing the panel keeps the pose. */
const sliderAngle = new Map<string, number>();
/** Heading per swivel id, rad, for the top view: kept like the pose (0 is the drawing plane). */
const heading = new Map<string, number>();
const saved = host.getState() as
  { uri?: string; sliderAngles?: Record<string, number>; headings?: Record<string, number> } | undefined;
if (saved?.uri) uri = saved.uri;
for (const [id, rad] of Object.entries(saved?.sliderAngles ?? {}))
  if (typeof rad === "number") sliderAngle.set(id, rad);
for (const [id, rad] of Object.entries(saved?.headings ?? {}))
  if (typeof rad === "number" && Number.isFinite(rad)) heading.set(id, rad);

function saveState(): void {
  host.setState({
    uri,
    sliderAngles: Object.fromEntries(sliderAngle),
    headings: Object.fromEntries(heading),
  });
}
let pose = 0;
/** The heading sliders' step, deg. */
const HEADING_STEP_DEG = 5;

const $ = (id: string) => document.getElementById(id)!;

function currentPose(model: ViewModel): number {
  const target = model.dofs.map((d) => sliderAngle.get(d.id) ?? d.reference);
  return nearestPose(
    model.poses.map((p) => p.angles),
    target,
    model.dofs.map((d) => d.range[1] - d.range[0]),
  );
}

function renderStatus(model: ViewModel): void {
  const errors = model.findings.filter((f) => f.severity === "error").length;
  const warnings = model.findings.filter((f) => f.severity === "warning").length;
  const el = $("status");
  el.textContent = "";
  const span = document.createElement("span");
  span.className = errors ? "bad" : warnings ? "warn" : "";
  span.textContent =
    errors || warnings ? `${errors} error(s), ${warnings} warning(s)` : "No errors or warnings";
  const poses = model.thinned
    ? `${model.thinned.shown} of ${model.thinned.solved} poses`
    : `${model.poses.length} poses`;
  el.append(span, document.createTextNode(model.poses.length ? ` — ${poses}` : ""));
  if (model.staleNote) {
    const stale = document.createElement("div");
    stale.className = "stale";
    stale.textContent = model.staleNote;
    el.append(stale);
  }
}

function renderSliders(model: ViewModel): void {
  const box = $("sliders");
  box.textContent = "";
  model.dofs.forEach((d, i) => {
    const label = document.createElement("label");
    label.htmlFor = `dof-${i}`;
    label.textContent = d.id;
    const input = document.createElement("input");
    input.type = "range";
    input.id = `dof-${i}`;
    input.dataset["dof"] = d.id;
    input.min = "0";
    input.max = String(Math.max(0, d.values.length - 1));
    input.step = "1";
    const value = model.poses[pose]?.angles[i] ?? d.reference;
    input.value = String(Math.max(0, d.values.indexOf(value)));
    const out = document.createElement("output");
    out.id = `dof-${i}-value`;
    const shown = (rad: number) => `${formatFigure(rad, "angle", model.units)}°`;
    out.textContent = shown(value);
    input.addEventListener("input", () => {
      const rad = d.values[Number(input.value)] ?? d.reference;
      sliderAngle.set(d.id, rad);
      saveState();
      out.textContent = shown(rad);
      pose = currentPose(model);
      renderPose(model);
    });
    box.append(label, input, out);
  });
  // A slider per swivel turns it in the top view; the side view stays the drawing plane.
  for (const s of model.swivels ?? []) {
    const label = document.createElement("label");
    label.htmlFor = `heading-${s.id}`;
    label.textContent = `${s.id} heading`;
    const input = document.createElement("input");
    input.type = "range";
    input.id = `heading-${s.id}`;
    const toDeg = (rad: number) => Math.round((rad * 180) / Math.PI);
    input.min = String(toDeg(s.heading[0]));
    input.max = String(toDeg(s.heading[1]));
    input.step = String(HEADING_STEP_DEG);
    const h = Math.min(s.heading[1], Math.max(s.heading[0], heading.get(s.id) ?? 0));
    // a kept heading the spec's range no longer reaches turns to its nearest end
    if (heading.has(s.id)) heading.set(s.id, h);
    input.value = String(toDeg(h));
    const out = document.createElement("output");
    const shown = (rad: number) => `${formatFigure(rad, "angle", model.units)}°`;
    out.textContent = shown(h);
    input.addEventListener("input", () => {
      const rad = (Number(input.value) * Math.PI) / 180;
      heading.set(s.id, rad);
      saveState();
      out.textContent = shown(rad);
      renderPose(model);
    });
    box.append(label, input, out);
  }
}

function renderPose(model: ViewModel): void {
  $("drawing").innerHTML = renderArmSvg(model, pose, { widthPx: 720 });
  $("top").innerHTML = model.swivels
    ? renderTopViewSvg(model, pose, Object.fromEntries(heading), { widthPx: 420 })
    : "";
  const plots: string[] = [];
  model.dofs.forEach((_, d) => {
    plots.push(renderPlotSvg(torquePlot(model, d, pose)));
    if (model.payloads.length) plots.push(renderPlotSvg(handForcePlot(model, d, pose)));
  });
  $("plots").innerHTML = plots.join("");
}

function render(): void {
  if (!vm) {
    $("title").textContent = "No arm to show";
    $("status").textContent = "Open a .poise file to see its arm.";
    for (const id of ["drawing", "sliders", "top", "plots", "safety", "figures", "findings"])
      $(id).textContent = "";
    return;
  }
  $("title").textContent = vm.title;
  renderStatus(vm);
  pose = vm.poses.length ? currentPose(vm) : 0;
  renderSliders(vm);
  renderPose(vm);
  $("safety").innerHTML = safetyTableHtml(vm);
  // Deflection, tilt, frequency and the rest, whether they pass or not: what the designer tunes.
  $("figures").innerHTML = resultsTableHtml(vm.results, vm.units);
  $("findings").innerHTML = findingsHtml(vm);
  $("method").textContent = vm.poses.length ? vm.torqueMethod : (vm.emptyReason ?? "");
}

function renderLimits(): void {
  const list = (items: readonly string[]) => {
    const ul = document.createElement("ul");
    for (const text of items) {
      const li = document.createElement("li");
      li.textContent = text;
      ul.append(li);
    }
    return ul;
  };
  $("limits").append(list(MODEL_LIMITS));
  $("cautions").append(list(SAFETY_CAUTIONS));
}

window.addEventListener("message", (event: MessageEvent<ToPage>) => {
  const msg = event.data;
  if (msg?.type !== "view") return;
  if (msg.uri !== uri) (sliderAngle.clear(), heading.clear());
  uri = msg.uri;
  vm = msg.model;
  saveState();
  render();
});

document.addEventListener("click", (event) => {
  const target = event.target as Element | null;
  // A diagnostic in the list reveals its own words; a part (drawing, table) its declaration.
  const item = target?.closest("[data-finding]");
  const finding = item ? vm?.findings[Number(item.getAttribute("data-finding"))] : undefined;
  if (vm && finding)
    return host.postMessage({ type: "reveal", uri, partId: finding.partId ?? "", range: finding.range });
  const el = target?.closest("[data-part]");
  const partId = el?.getAttribute("data-part");
  if (!vm || !partId) return;
  const part = vm.parts.find((p) => p.id === partId);
  host.postMessage({ type: "reveal", uri, partId, ...(part ? { range: part.range } : {}) });
});

renderLimits();
host.postMessage({ type: "ready" });
