// The arm seen from above, for an arm that turns (issue 11): each body's centre line at a pose with
// the swivels at the given headings, the footprint on the bench, each swivel's axis, and the path
// each payload sweeps over the bench as each swivel turns through its range (the others held).
// x to the right as in the side view, the side view's reader at the bottom: a positive heading
// turns counter-clockwise. An SVG string with presentation attributes only.
import type { ViewModel, ViewPose, ViewSwivel } from "./view-model";
import { place } from "./geometry";
import { PALETTE } from "./palette";
import { c2, esc } from "./text";
import { formatFigure } from "../units/format";

const MM_PER_M = 1000;
const mm = (m: number): number => m * MM_PER_M;
/** Steps of a swept path: a point every 5 deg of a full turn. */
const SWEEP_STEPS_PER_TURN = 72;

/** Heading of each swivel by id, rad (absent: 0). */
export type ViewHeadings = Readonly<Record<string, number>>;

/** A body's local point seen from above [x, z], m, with the swivels turned: each about the
 * vertical through its point, deepest first (its parent has not moved yet), as the mechanics'
 * placement turns them. */
export function topPoint(
  vm: ViewModel,
  pose: ViewPose,
  headings: ViewHeadings,
  bodyId: string,
  local: readonly [number, number],
): [number, number] | undefined {
  const w = place(pose, bodyId, local);
  if (!w) return undefined;
  let x = w[0];
  let z = 0;
  for (const s of vm.swivels ?? []) {
    const h = headings[s.id] ?? 0;
    if (h === 0 || !s.carried.includes(bodyId)) continue;
    const c = place(pose, s.parent, s.local);
    if (!c) continue;
    // a turn by h about the vertical (y): x' = x cos h + z sin h, z' = -x sin h + z cos h
    const dx = x - c[0];
    const cos = Math.cos(h);
    const sin = Math.sin(h);
    x = c[0] + dx * cos + z * sin;
    z = -dx * sin + z * cos;
  }
  return [x, z];
}

/** Where a payload goes as one swivel turns through its range, the others at `headings`. */
function sweptPath(
  vm: ViewModel,
  pose: ViewPose,
  headings: ViewHeadings,
  s: ViewSwivel,
  payload: ViewModel["payloads"][number],
): [number, number][] {
  if (!s.carried.includes(payload.body)) return [];
  const [lo, hi] = s.heading;
  const steps = Math.max(2, Math.ceil(((hi - lo) / (2 * Math.PI)) * SWEEP_STEPS_PER_TURN));
  const out: [number, number][] = [];
  for (let k = 0; k <= steps; k++) {
    const p = topPoint(
      vm,
      pose,
      { ...headings, [s.id]: lo + ((hi - lo) * k) / steps },
      payload.body,
      payload.local,
    );
    if (p) out.push(p);
  }
  return out;
}

export interface TopViewOptions {
  widthPx?: number;
}

/** The arm in pose `poseIndex` seen from above, swivels at `headings`. */
export function renderTopViewSvg(
  vm: ViewModel,
  poseIndex: number,
  headings: ViewHeadings,
  options: TopViewOptions = {},
): string {
  const pose = vm.poses[poseIndex];
  if (!pose || !vm.swivels) return "";
  // A square frame round the base's axis reaching as far as the side view's bounds do: a stage
  // turned about an axis within the reach stays inside it.
  const reach = Math.max(Math.abs(vm.bounds[0]), Math.abs(vm.bounds[2]), (vm.footprintDepth ?? 0) / 2) * 1.08;
  const r = mm(reach);
  const widthPx = options.widthPx ?? 360;
  const u = (2 * r) / widthPx;
  let out = `<svg xmlns="http://www.w3.org/2000/svg" class="top-view" viewBox="${c2(-r)} ${c2(-r)} ${c2(2 * r)} ${c2(2 * r)}" width="${widthPx}" height="${widthPx}" role="img" aria-label="${esc(vm.title)} seen from above">`;
  out += `<rect x="${c2(-r)}" y="${c2(-r)}" width="${c2(2 * r)}" height="${c2(2 * r)}" fill="${PALETTE.paper}"/>`;
  if (vm.footprint !== undefined) {
    const w = mm(vm.footprint);
    const d = mm(vm.footprintDepth ?? vm.footprint);
    out += `<rect class="footprint" x="${c2(-w / 2)}" y="${c2(-d / 2)}" width="${c2(w)}" height="${c2(d)}" fill="${PALETTE.base}" opacity="0.35"/>`;
  }
  // swept paths first, under the arm
  for (const s of vm.swivels)
    for (const p of vm.payloads) {
      const path = sweptPath(vm, pose, headings, s, p);
      if (path.length > 1)
        out += `<polyline class="swept" points="${path.map(([x, z]) => `${c2(mm(x))},${c2(mm(z))}`).join(" ")}" fill="none" stroke="${PALETTE.envelope}" stroke-width="${c2(1.5 * u)}" stroke-dasharray="${c2(5 * u)} ${c2(4 * u)}"/>`;
    }
  for (const b of vm.bodies) {
    if (b.kind === "base") continue;
    const pts = b.line
      .map((p) => topPoint(vm, pose, headings, b.id, p))
      .filter((p): p is [number, number] => !!p);
    if (pts.length < 2) continue;
    const colour = b.kind === "head" ? PALETTE.head : b.kind === "bar" ? PALETTE.bar : PALETTE.link;
    out += `<polyline data-part="${esc(b.partId)}" points="${pts.map(([x, z]) => `${c2(mm(x))},${c2(mm(z))}`).join(" ")}" fill="none" stroke="${colour}" stroke-width="${c2(5 * u)}" stroke-linecap="round" stroke-linejoin="round"/>`;
  }
  for (const s of vm.swivels) {
    const c = topPoint(vm, pose, headings, s.parent, s.local);
    if (!c) continue;
    out += `<circle data-part="${esc(s.id)}" cx="${c2(mm(c[0]))}" cy="${c2(mm(c[1]))}" r="${c2(5 * u)}" fill="${PALETTE.pivotFill}" stroke="${PALETTE.pivotRing}" stroke-width="${c2(1.5 * u)}"/>`;
  }
  for (const p of vm.payloads) {
    const c = topPoint(vm, pose, headings, p.body, p.local);
    if (c)
      out += `<circle data-part="${esc(p.id)}" cx="${c2(mm(c[0]))}" cy="${c2(mm(c[1]))}" r="${c2(6 * u)}" fill="${PALETTE.payload}"/>`;
  }
  const turned = vm.swivels
    .map((s) => `${s.id} ${formatFigure(headings[s.id] ?? 0, "angle", vm.units)}°`)
    .join(", ");
  out += `<text x="${c2(-r + 8 * u)}" y="${c2(-r + 16 * u)}" font-size="${c2(11 * u)}" font-family="sans-serif" fill="${PALETTE.muted}">${esc(`seen from above: ${turned}`)}</text>`;
  return out + "</svg>";
}
