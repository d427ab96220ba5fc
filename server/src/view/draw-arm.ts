// Draws the arm in its plane, to scale, for one pose of the view model: an SVG string with
// presentation attributes only (no style attributes, so a strict content-security policy holds).
import type { ViewModel, ViewPose, ViewSpring, PartStatus } from "./view-model";
import { place } from "./geometry";
import { PALETTE } from "./palette";
import { c2, esc } from "./text";
import { displayUnit, formatFigure, formatFigureWithUnit, formatQuantity, unitLabel } from "../units/format";
import { CODES, type Code } from "../findings/codes";
import { fixedTextBox, placeLabels, type Box, type LabelRequest, type PlacedLabel } from "./label-place";

/** The drawing's user unit is the millimetre: the view model's metres are scaled by this, so that
 * coordinates written to 0.01 (c2) stay far below a pixel at any zoom. */
const MM_PER_M = 1000;
/** Bodies without a section are drawn this thick, mm (a schematic bar). */
const DEFAULT_DEPTH_MM = 6;
/** Pins without a diameter are drawn this wide, mm. */
const DEFAULT_PIN_MM = 4;
/** Coil count drawn for an extension spring: enough to read as a coil, not a true count. */
const ZIGZAGS = 12;

interface Frame {
  /** About one screen pixel at the panel's usual width, in mm: sizes labels and marks. */
  u: number;
  /** The view model's bounds, mm: [minX, minY, maxX, maxY]. */
  bounds: [number, number, number, number];
}

/** A length of the view model in drawing units (mm). */
const mm = (m: number): number => m * MM_PER_M;

/** A local point of a body, placed in the pose, in drawing units (mm). */
function at(pose: ViewPose, bodyId: string, local: readonly [number, number]): [number, number] | undefined {
  const w = place(pose, bodyId, local);
  return w ? [mm(w[0]), mm(w[1])] : undefined;
}

const statusColour = (s: PartStatus | undefined) =>
  s === "error" ? PALETTE.error : s === "warning" ? PALETTE.warning : undefined;

/** SVG y runs down; the arm's y runs up. */
const Y = (y: number) => -y;

function pts(list: readonly [number, number][]): string {
  return list.map(([x, y]) => `${c2(x)},${c2(Y(y))}`).join(" ");
}

function bench(vm: ViewModel, f: Frame): string {
  const [minX, , maxX] = f.bounds;
  const y = mm(vm.surface);
  const hatch: string[] = [];
  const step = 12 * f.u;
  for (let x = minX; x < maxX; x += step)
    hatch.push(`M${c2(x)} ${c2(Y(y))}l${c2(-step * 0.7)} ${c2(step * 0.7)}`);
  let out = `<g class="bench"><path d="${hatch.join("")}" stroke="${PALETTE.benchHatch}" stroke-width="${c2(f.u)}" fill="none"/>`;
  out += `<line x1="${c2(minX)}" y1="${c2(Y(y))}" x2="${c2(maxX)}" y2="${c2(Y(y))}" stroke="${PALETTE.bench}" stroke-width="${c2(2.5 * f.u)}"/>`;
  if (vm.footprint !== undefined) {
    const h = 8 * f.u;
    const width = mm(vm.footprint);
    out += `<rect class="footprint" x="${c2(-width / 2)}" y="${c2(Y(y + h))}" width="${c2(width)}" height="${c2(h)}" fill="${PALETTE.base}" opacity="0.55"/>`;
  }
  return out + "</g>";
}

function envelope(vm: ViewModel, f: Frame): string {
  let out = `<g class="envelope">`;
  for (const [id, paths] of Object.entries(vm.envelope)) {
    for (const path of paths) {
      out += `<polyline data-payload="${esc(id)}" points="${pts(path.map(([x, y]) => [mm(x), mm(y)]))}" fill="none" stroke="${PALETTE.envelope}" stroke-width="${c2(1.5 * f.u)}" stroke-dasharray="${c2(5 * f.u)} ${c2(3 * f.u)}"/>`;
    }
  }
  return out + "</g>";
}

function bodies(vm: ViewModel, pose: ViewPose, status: Map<string, PartStatus>, f: Frame): string {
  let out = "";
  // Base first, then bars, links and heads on top, so pivots sit over everything.
  const order = { base: 0, bar: 1, link: 2, head: 3 } as const;
  for (const body of [...vm.bodies].sort((a, b) => order[a.kind] - order[b.kind])) {
    const line = body.line
      .map((p) => at(pose, body.id, p))
      .filter((w): w is [number, number] => w !== undefined);
    if (line.length < 2) continue;
    const st = status.get(body.partId);
    const depth = Math.max(body.depth !== undefined ? mm(body.depth) : DEFAULT_DEPTH_MM, 2 * f.u);
    const colour =
      body.kind === "base"
        ? PALETTE.base
        : body.kind === "bar"
          ? PALETTE.bar
          : body.kind === "head"
            ? PALETTE.head
            : PALETTE.link;
    const mark = statusColour(st);
    out += `<g class="part body" data-part="${esc(body.partId)}" data-body="${esc(body.id)}" data-status="${st ?? "ok"}"><title>${esc(body.id)}${st && st !== "ok" ? ` (${st})` : ""}</title>`;
    if (mark)
      out += `<polyline class="halo" points="${pts(line)}" fill="none" stroke="${mark}" stroke-opacity="0.35" stroke-width="${c2(depth + 8 * f.u)}" stroke-linecap="round" stroke-linejoin="round"/>`;
    for (const br of body.brackets) {
      const a = at(pose, body.id, [br[0], br[1]]);
      const b = at(pose, body.id, [br[2], br[3]]);
      if (a && b)
        out += `<line class="bracket" x1="${c2(a[0])}" y1="${c2(Y(a[1]))}" x2="${c2(b[0])}" y2="${c2(Y(b[1]))}" stroke="${colour}" stroke-width="${c2(Math.max(depth * 0.35, 1.5 * f.u))}" stroke-linecap="round"/>`;
    }
    out += `<polyline class="centre" points="${pts(line)}" fill="none" stroke="${colour}" stroke-width="${c2(depth)}" stroke-linecap="round" stroke-linejoin="round"/>`;
    if (mark)
      out += `<polyline points="${pts(line)}" fill="none" stroke="${mark}" stroke-width="${c2(1.6 * f.u)}" stroke-dasharray="${c2(4 * f.u)} ${c2(2.5 * f.u)}"/>`;
    out += "</g>";
  }
  return out;
}

function coilPath(a: [number, number], b: [number, number], f: Frame): string {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const len = Math.hypot(dx, dy) || 1;
  const ux = dx / len,
    uy = dy / len,
    nx = -uy,
    ny = ux;
  const amp = Math.min(Math.max(0.06 * len, 3 * f.u), 10 * f.u);
  const lead = 0.12 * len;
  const p: [number, number][] = [a, [a[0] + ux * lead, a[1] + uy * lead]];
  for (let i = 1; i <= ZIGZAGS; i++) {
    const t = lead + ((len - 2 * lead) * (i - 0.5)) / ZIGZAGS;
    const side = i % 2 ? 1 : -1;
    p.push([a[0] + ux * t + nx * amp * side, a[1] + uy * t + ny * amp * side]);
  }
  p.push([b[0] - ux * lead, b[1] - uy * lead], b);
  return pts(p);
}

function cordPath(a: [number, number], b: [number, number], f: Frame): string {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const len = Math.hypot(dx, dy) || 1;
  const nx = -dy / len,
    ny = dx / len;
  const amp = Math.min(Math.max(0.025 * len, 1.5 * f.u), 5 * f.u);
  const p: [number, number][] = [];
  for (let i = 0; i <= 48; i++) {
    const t = i / 48;
    const w = Math.sin(t * Math.PI * 6) * amp * Math.sin(t * Math.PI);
    p.push([a[0] + dx * t + nx * w, a[1] + dy * t + ny * w]);
  }
  return pts(p);
}

function springMark(
  vm: ViewModel,
  spring: ViewSpring,
  hooks: [number, number, number, number],
  st: PartStatus | undefined,
  force: number | undefined,
  f: Frame,
): string {
  const a: [number, number] = [mm(hooks[0]), mm(hooks[1])];
  const b: [number, number] = [mm(hooks[2]), mm(hooks[3])];
  const mark = statusColour(st);
  const atJoint = spring.jointId !== undefined;
  const dimension = atJoint ? "torque" : "force";
  const tip = `${spring.id}: ${spring.kind}${force !== undefined ? `, ${formatFigureWithUnit(Math.abs(force), dimension, vm.units)}` : ""}${st && st !== "ok" ? ` (${st})` : ""}`;
  let out = `<g class="part spring" data-part="${esc(spring.id)}" data-spring="${esc(spring.id)}" data-kind="${spring.kind}" data-status="${st ?? "ok"}"><title>${esc(tip)}</title>`;
  const w = 1.8 * f.u;
  if (atJoint) {
    const r = 9 * f.u;
    let d = `M${c2(a[0] + r)} ${c2(Y(a[1]))}`;
    for (let i = 1; i <= 40; i++) {
      const t = (i / 40) * Math.PI * 3.5;
      const rr = r * (1 - i / 60);
      d += `L${c2(a[0] + rr * Math.cos(t))} ${c2(Y(a[1] + rr * Math.sin(t)))}`;
    }
    out += `<path d="${d}" fill="none" stroke="${mark ?? PALETTE.coil}" stroke-width="${c2(w)}"/>`;
  } else if (spring.kind === "gas") {
    const len = Math.hypot(b[0] - a[0], b[1] - a[1]) || 1;
    const cyl = Math.min(spring.cylinder !== undefined ? mm(spring.cylinder) : len * 0.55, len * 0.9) / len;
    const m: [number, number] = [a[0] + (b[0] - a[0]) * cyl, a[1] + (b[1] - a[1]) * cyl];
    out += `<line x1="${c2(m[0])}" y1="${c2(Y(m[1]))}" x2="${c2(b[0])}" y2="${c2(Y(b[1]))}" stroke="${PALETTE.gasRod}" stroke-width="${c2(3 * f.u)}" stroke-linecap="round"/>`;
    out += `<line class="cylinder" x1="${c2(a[0])}" y1="${c2(Y(a[1]))}" x2="${c2(m[0])}" y2="${c2(Y(m[1]))}" stroke="${mark ?? PALETTE.gasBody}" stroke-width="${c2(8 * f.u)}" stroke-linecap="butt"/>`;
  } else if (spring.kind === "elastic") {
    out += `<polyline points="${cordPath(a, b, f)}" fill="none" stroke="${mark ?? PALETTE.cord}" stroke-width="${c2(w * 1.4)}" stroke-linecap="round"/>`;
  } else {
    out += `<polyline points="${coilPath(a, b, f)}" fill="none" stroke="${mark ?? PALETTE.coil}" stroke-width="${c2(w)}" stroke-linejoin="round"/>`;
  }
  for (const h of atJoint ? [] : [a, b])
    out += `<circle cx="${c2(h[0])}" cy="${c2(Y(h[1]))}" r="${c2(2 * f.u)}" fill="${PALETTE.coil}"/>`;
  return out + "</g>";
}

function pivots(vm: ViewModel, pose: ViewPose, status: Map<string, PartStatus>, f: Frame): string {
  let out = "";
  for (const pv of vm.pivots) {
    const w = at(pose, pv.body, pv.local);
    if (!w) continue;
    const st = status.get(pv.partId);
    const ring = statusColour(st) ?? PALETTE.pivotRing;
    const r = Math.max((pv.pin !== undefined ? mm(pv.pin) : DEFAULT_PIN_MM) / 2 + 1, 3 * f.u);
    out += `<g class="part pivot" data-part="${esc(pv.partId)}" data-joint="${esc(pv.jointId)}" data-status="${st ?? "ok"}"><title>${esc(pv.jointId)} (${pv.mode})${st && st !== "ok" ? ` (${st})` : ""}</title>`;
    if (pv.mode === "fixed")
      out += `<rect x="${c2(w[0] - r)}" y="${c2(Y(w[1]) - r)}" width="${c2(2 * r)}" height="${c2(2 * r)}" fill="${PALETTE.pivotFill}" stroke="${ring}" stroke-width="${c2(1.6 * f.u)}"/>`;
    else
      out += `<circle cx="${c2(w[0])}" cy="${c2(Y(w[1]))}" r="${c2(r)}" fill="${PALETTE.pivotFill}" stroke="${ring}" stroke-width="${c2((st && st !== "ok" ? 2.6 : 1.6) * f.u)}"/>`;
    if (pv.mode === "range")
      out += `<circle cx="${c2(w[0])}" cy="${c2(Y(w[1]))}" r="${c2(r * 0.35)}" fill="${ring}"/>`;
    out += "</g>";
  }
  return out;
}

/** Text drawn with a halo of paper colour so that it reads over lines. */
function haloText(
  x: number,
  baseline: number,
  text: string,
  size: number,
  fill: string,
  bold = false,
): string {
  return `<text x="${c2(x)}" y="${c2(baseline)}" font-size="${c2(size)}"${bold ? ` font-weight="bold"` : ""} font-family="sans-serif" fill="${fill}" stroke="${PALETTE.paper}" stroke-width="${c2(size * 0.27)}" paint-order="stroke" stroke-linejoin="round">${esc(text)}</text>`;
}

/** A label waiting for its place, with what it is drawn with once placed. */
interface PendingLabel extends LabelRequest {
  fill: string;
  className: string;
  part: string;
}

function payloads(
  vm: ViewModel,
  pose: ViewPose,
  status: Map<string, PartStatus>,
  f: Frame,
  labels: PendingLabel[],
): string {
  let out = "";
  for (const p of vm.payloads) {
    const w = at(pose, p.body, p.local);
    if (!w) continue;
    const st = status.get(p.id);
    const r = Math.min(Math.max(7 * f.u * Math.cbrt(Math.max(p.mass, 0.01) / 0.5), 4 * f.u), 16 * f.u);
    const grams = formatQuantity(p.mass, "mass", vm.units);
    out += `<g class="part payload" data-part="${esc(p.id)}" data-payload="${esc(p.id)}" data-status="${st ?? "ok"}"><title>${esc(p.id)}, ${grams}</title>`;
    out += `<line x1="${c2(w[0])}" y1="${c2(Y(w[1]))}" x2="${c2(w[0])}" y2="${c2(Y(w[1]) + r * 2.2)}" stroke="${PALETTE.payload}" stroke-width="${c2(1.2 * f.u)}"/>`;
    out += `<path d="M${c2(w[0] - r * 0.4)} ${c2(Y(w[1]) + r * 1.7)}L${c2(w[0])} ${c2(Y(w[1]) + r * 2.4)}L${c2(w[0] + r * 0.4)} ${c2(Y(w[1]) + r * 1.7)}" fill="none" stroke="${PALETTE.payload}" stroke-width="${c2(1.2 * f.u)}"/>`;
    out += `<circle cx="${c2(w[0])}" cy="${c2(Y(w[1]))}" r="${c2(r)}" fill="${PALETTE.payload}" fill-opacity="0.85" stroke="${statusColour(st) ?? PALETTE.ink}" stroke-width="${c2((st && st !== "ok" ? 2.6 : 1) * f.u)}"/>`;
    out += "</g>";
    labels.push({
      text: `${p.id} ${grams}`,
      at: [w[0], Y(w[1])],
      gap: r + 3 * f.u,
      fontSize: 11 * f.u,
      fill: PALETTE.ink,
      className: "payload-label",
      part: p.id,
    });
  }
  return out;
}

/** At most two problems on a flag, in words, so it stays a label; the panel's list has them all. */
export function troubleWords(codes: readonly string[]): string {
  const words = [...new Set(codes.map((c) => CODES[c as Code]?.words ?? c))];
  return words.length <= 2 ? words.join(", ") : `${words.slice(0, 2).join(", ")} +${words.length - 2}`;
}

/** Where a failing part is drawn: the middle of its bar, its pivot, its spring or its payload. */
function partPoint(vm: ViewModel, pose: ViewPose, partId: string): [number, number] | undefined {
  const body = vm.bodies.find((b) => b.partId === partId && b.line.length >= 2);
  if (body) {
    const a = at(pose, body.id, body.line[0]!);
    const b = at(pose, body.id, body.line[body.line.length - 1]!);
    if (a && b) return [(a[0] + b[0]) / 2, (a[1] + b[1]) / 2];
  }
  const pivot = vm.pivots.find((p) => p.partId === partId);
  const atPivot = pivot && at(pose, pivot.body, pivot.local);
  if (atPivot) return atPivot;
  const hooks = pose.springs[partId];
  if (hooks) return [(mm(hooks[0]) + mm(hooks[2])) / 2, (mm(hooks[1]) + mm(hooks[3])) / 2];
  const payload = vm.payloads.find((p) => p.id === partId);
  return payload && at(pose, payload.body, payload.local);
}

/** Small flags marking each failing part next to it, with its trouble in words, so the trouble
 * reads without hovering. Errors first, so their words get the best places. */
function trouble(vm: ViewModel, pose: ViewPose, f: Frame, labels: PendingLabel[]): string {
  let out = `<g class="trouble">`;
  const marks: [number, number][] = [];
  const failing = vm.parts
    .filter((p) => p.status !== "ok")
    .sort((a, b) => (a.status === b.status ? 0 : a.status === "error" ? -1 : 1));
  for (const part of failing) {
    const point = partPoint(vm, pose, part.id);
    if (!point) continue;
    const colour = part.status === "error" ? PALETTE.error : PALETTE.warning;
    const x = point[0] + 6 * f.u;
    let y = Y(point[1]) - 10 * f.u;
    // Two failing parts close together: the second mark goes above the first, not on it.
    while (marks.some(([mx, my]) => Math.hypot(mx - x, my - y) < 13 * f.u)) y -= 14 * f.u;
    marks.push([x, y]);
    const words = troubleWords(part.codes);
    out += `<g class="flag" data-part="${esc(part.id)}" data-status="${part.status}"><title>${esc(part.id)}: ${esc(words)}</title>`;
    out += `<circle cx="${c2(x)}" cy="${c2(y)}" r="${c2(6 * f.u)}" fill="${colour}"/>`;
    // The "!" drawn as a stroke and a dot, not text, so it never counts as a label.
    out += `<path d="M${c2(x)} ${c2(y - 3.6 * f.u)}V${c2(y + 0.8 * f.u)}" stroke="#ffffff" stroke-width="${c2(1.8 * f.u)}" stroke-linecap="round"/>`;
    out += `<circle cx="${c2(x)}" cy="${c2(y + 3.2 * f.u)}" r="${c2(1 * f.u)}" fill="#ffffff"/></g>`;
    labels.push({
      text: `${part.id}: ${words}`,
      at: [x, y],
      gap: 9 * f.u,
      fontSize: 11 * f.u,
      bold: true,
      fill: colour,
      className: "flag-label",
      part: part.id,
    });
  }
  return out + "</g>";
}

/** The scale bar, and the box its figure takes (kept clear of labels). */
function scaleBar(vm: ViewModel, f: Frame): { svg: string; box: Box } {
  const [minX, minY, maxX] = f.bounds;
  const span = maxX - minX;
  // Drawing units (mm) per unit of length the reader works in.
  const perUnit = mm(displayUnit("length", vm.units).factor);
  // A round length in the reader's unit, about a sixth of the frame.
  const shown = [0.5, 1, 2, 5, 10, 20, 50, 100, 200, 500, 1000].find((s) => s * perUnit >= span / 6) ?? 1000;
  const nice = shown * perUnit;
  const x = minX + 8 * f.u;
  const y = Y(minY) - 8 * f.u;
  const text = `${shown} ${unitLabel("length", vm.units)}`;
  const size = 10 * f.u;
  const textBox = fixedTextBox(text, x, y - 4 * f.u, size);
  return {
    svg:
      `<g class="scale"><line x1="${c2(x)}" y1="${c2(y)}" x2="${c2(x + nice)}" y2="${c2(y)}" stroke="${PALETTE.ink}" stroke-width="${c2(1.5 * f.u)}"/>` +
      `<text x="${c2(x)}" y="${c2(y - 4 * f.u)}" font-size="${c2(size)}" font-family="sans-serif" fill="${PALETTE.muted}">${esc(text)}</text></g>`,
    box: { x: textBox.x, y: textBox.y, w: Math.max(textBox.w, nice), h: textBox.h + 6 * f.u },
  };
}

/** The pose's angles at the top left, broken into lines that fit the frame. */
function caption(vm: ViewModel, pose: ViewPose, f: Frame): { svg: string; boxes: Box[] } {
  const [minX, , maxX, maxY] = f.bounds;
  const parts = vm.dofs.map((d, i) => `${d.id} ${formatFigure(pose.angles[i]!, "angle", vm.units)}°`);
  const size = 11 * f.u;
  const room = maxX - minX - 16 * f.u;
  const lines: string[] = [];
  for (const part of parts) {
    const last = lines[lines.length - 1];
    const joined = last === undefined ? part : `${last}, ${part}`;
    if (last !== undefined && fixedTextBox(joined, 0, 0, size).w > room) lines.push(part);
    else if (last === undefined) lines.push(part);
    else lines[lines.length - 1] = joined;
  }
  let svg = "";
  const boxes: Box[] = [];
  lines.forEach((line, i) => {
    const x = minX + 8 * f.u;
    const baseline = -maxY + 16 * f.u + i * 14 * f.u;
    svg += `<text class="pose-caption" x="${c2(x)}" y="${c2(baseline)}" font-size="${c2(size)}" font-family="sans-serif" fill="${PALETTE.muted}">${esc(line)}</text>`;
    boxes.push(fixedTextBox(line, x, baseline, size));
  });
  return { svg, boxes };
}

/** The labels, each at the first free spot around its part; a label with no free spot is left
 * out (the mark's tooltip and the panel's list still name the part). */
function drawLabels(labels: readonly PendingLabel[], f: Frame, reserved: readonly Box[]): string {
  const [minX, minY, maxX, maxY] = f.bounds;
  const frame: Box = {
    x: minX + 2 * f.u,
    y: -maxY + 2 * f.u,
    w: maxX - minX - 4 * f.u,
    h: maxY - minY - 4 * f.u,
  };
  const placed = placeLabels(labels, frame, reserved) as (PlacedLabel & PendingLabel)[];
  let out = `<g class="labels">`;
  for (const l of placed)
    out += `<g class="${l.className}" data-part="${esc(l.part)}">${haloText(l.x, l.baseline, l.text, l.fontSize, l.fill, l.bold)}</g>`;
  return out + "</g>";
}

/** A tune run's overlay (docs/tuning.md, "The preview"): each tuned spring at the other
 * design's place, dashed in the overlay's colour; the anchor points that float the arm at the
 * reference pose, dotted; those that balance it at every pose, as diamonds. */
function tuneMarks(vm: ViewModel, pose: ViewPose, f: Frame, labels: PendingLabel[]): string {
  const tune = vm.tune;
  if (!tune) return "";
  let out = `<g class="tune" data-text-is="${tune.textIs}">`;
  for (const l of tune.locus) {
    if (l.reason) continue;
    for (const line of l.atReference) {
      const placed = line
        .map((p) => at(pose, l.body, p))
        .filter((w): w is [number, number] => w !== undefined);
      if (placed.length > 1)
        out += `<polyline class="locus" data-spring="${esc(l.spring)}" points="${pts(placed)}" fill="none" stroke="${PALETTE.locus}" stroke-width="${c2(1.4 * f.u)}" stroke-dasharray="${c2(1.2 * f.u)} ${c2(2.4 * f.u)}" stroke-linecap="round"/>`;
    }
    for (const p of l.exact) {
      const w = at(pose, l.body, p);
      if (w)
        out += `<path class="locus-exact" data-spring="${esc(l.spring)}" d="${diamond(w, 4.5 * f.u)}" fill="${PALETTE.locus}" stroke="${PALETTE.ink}" stroke-width="${c2(0.8 * f.u)}"/>`;
    }
  }
  for (const s of tune.springs) {
    if (!s.other || !s.moved) continue;
    const a = at(pose, s.other[0].body, s.other[0].local);
    const b = at(pose, s.other[1].body, s.other[1].local);
    if (!a || !b) continue;
    const dash = `stroke-dasharray="${c2(4 * f.u)} ${c2(2.5 * f.u)}"`;
    const w = 1.8 * f.u;
    out += `<g class="tuned-spring" data-spring="${esc(s.id)}"><title>${esc(`${s.id} ${tune.otherLabel}: ${s.changes.join(", ")}`)}</title>`;
    if (s.kind === "elastic")
      out += `<polyline points="${cordPath(a, b, f)}" fill="none" stroke="${PALETTE.tuned}" stroke-width="${c2(w * 1.4)}" ${dash}/>`;
    else if (s.kind === "gas")
      out += `<line x1="${c2(a[0])}" y1="${c2(Y(a[1]))}" x2="${c2(b[0])}" y2="${c2(Y(b[1]))}" stroke="${PALETTE.tuned}" stroke-width="${c2(4 * f.u)}" ${dash}/>`;
    else
      out += `<polyline points="${coilPath(a, b, f)}" fill="none" stroke="${PALETTE.tuned}" stroke-width="${c2(w)}" stroke-linejoin="round" ${dash}/>`;
    for (const h of [a, b])
      out += `<circle cx="${c2(h[0])}" cy="${c2(Y(h[1]))}" r="${c2(2.4 * f.u)}" fill="${PALETTE.paper}" stroke="${PALETTE.tuned}" stroke-width="${c2(1.2 * f.u)}"/>`;
    out += "</g>";
    labels.push({
      text: `${s.id} ${tune.otherLabel}`,
      at: [(a[0] + b[0]) / 2, Y((a[1] + b[1]) / 2)],
      gap: 8 * f.u,
      fontSize: 10 * f.u,
      fill: PALETTE.tuned,
      className: "tune-label",
      part: s.id,
    });
  }
  return out + "</g>";
}

function diamond(w: [number, number], r: number): string {
  const [x, y] = [w[0], Y(w[1])];
  return `M${c2(x)} ${c2(y - r)}L${c2(x + r)} ${c2(y)}L${c2(x)} ${c2(y + r)}L${c2(x - r)} ${c2(y)}Z`;
}

/** The overlay's legend in words, one entry a line under the pose caption, each with a swatch
 * of its mark; lines that would leave the frame are left out (their words stay in the marks'
 * tooltips and the panel's tune section). */
function tuneLegend(vm: ViewModel, f: Frame, below: number): { svg: string; boxes: Box[] } {
  const tune = vm.tune;
  if (!tune) return { svg: "", boxes: [] };
  const entries: { text: string; swatch: (x: number, y: number) => string }[] = [];
  const swatchLine = (colour: string, dash: string) => (x: number, y: number) =>
    `<line x1="${c2(x)}" y1="${c2(y)}" x2="${c2(x + 16 * f.u)}" y2="${c2(y)}" stroke="${colour}" stroke-width="${c2(1.8 * f.u)}" stroke-dasharray="${dash}"/>`;
  for (const s of tune.springs) {
    const moved = s.other !== undefined && s.moved;
    const place = moved ? "" : ", same place";
    entries.push({
      text:
        tune.textIs === "present"
          ? `${s.id} as tuned${place}: ${s.changes.join(", ")}`
          : `${s.id} before tuning${place} (now ${s.changes.join(", ")})`,
      swatch: moved ? swatchLine(PALETTE.tuned, `${c2(4 * f.u)} ${c2(2.5 * f.u)}`) : () => "",
    });
  }
  const worst = (n: number | undefined) =>
    n === undefined ? "?" : formatFigureWithUnit(n, "force", vm.units);
  if (tune.worstBefore !== undefined || tune.worstAfter !== undefined)
    entries.push({
      text: `worst hand force ${worst(tune.worstBefore)} before tuning, ${worst(tune.worstAfter)} tuned`,
      swatch: () => "",
    });
  for (const l of tune.locus) {
    if (l.reason) continue;
    if (l.atReference.length)
      entries.push({
        text: `${l.spring}'s anchor here floats the arm at the reference pose`,
        swatch: swatchLine(PALETTE.locus, `${c2(1.2 * f.u)} ${c2(2.4 * f.u)}`),
      });
    entries.push(
      l.exact.length
        ? {
            text: `${l.spring}'s anchor here balances every pose at its present rate`,
            swatch: (x, y) =>
              `<path d="${diamond([x + 8 * f.u, -y], 4 * f.u)}" fill="${PALETTE.locus}" stroke="${PALETTE.ink}" stroke-width="${c2(0.8 * f.u)}"/>`,
          }
        : {
            text: `no anchor place in reach balances every pose at ${l.spring}'s present rate`,
            swatch: () => "",
          },
    );
  }
  const [minX, minY, maxX] = f.bounds;
  const size = 10 * f.u;
  const x = minX + 8 * f.u;
  let baseline = below + 14 * f.u;
  let svg = `<g class="tune-legend">`;
  const boxes: Box[] = [];
  for (const e of entries) {
    const box = fixedTextBox(e.text, x + 20 * f.u, baseline, size);
    if (box.x + box.w > maxX - 4 * f.u || box.y + box.h > Y(minY) - 24 * f.u) continue;
    svg += e.swatch(x, baseline - size * 0.35);
    svg += haloText(x + 20 * f.u, baseline, e.text, size, PALETTE.ink);
    boxes.push({ ...box, x: x, w: box.w + 20 * f.u });
    baseline += 13 * f.u;
  }
  return { svg: svg + "</g>", boxes };
}

export interface DrawOptions {
  /** Rendered width in CSS pixels (the height follows the arm's proportions). */
  widthPx?: number;
  /** Draw a tune run's overlay when the view model has one (default true; small figures leave
   * it out). */
  tuneOverlay?: boolean;
}

/** The arm in pose `poseIndex` (or at its exact reference pose) as an SVG string. */
export function renderArmSvg(
  vm: ViewModel,
  poseIndex: number | "reference",
  options: DrawOptions = {},
): string {
  const bounds = vm.bounds.map(mm) as Frame["bounds"];
  const [minX, minY, maxX, maxY] = bounds;
  const w = maxX - minX;
  const h = maxY - minY;
  const widthPx = options.widthPx ?? 640;
  const f: Frame = { u: w / widthPx, bounds };
  const heightPx = Math.round((widthPx * h) / w);
  const head = `<svg xmlns="http://www.w3.org/2000/svg" class="arm-drawing" viewBox="${c2(minX)} ${c2(-maxY)} ${c2(w)} ${c2(h)}" width="${widthPx}" height="${heightPx}" role="img" aria-label="${esc(vm.title)}">`;
  const ground = `<rect x="${c2(minX)}" y="${c2(-maxY)}" width="${c2(w)}" height="${c2(h)}" fill="${PALETTE.paper}"/>`;
  const pose = poseIndex === "reference" ? (vm.reference ?? vm.poses[vm.referencePose]) : vm.poses[poseIndex];
  if (!pose) {
    // Nothing solved: a short strip with the reason, not an empty frame the size of an arm.
    return (
      `<svg xmlns="http://www.w3.org/2000/svg" class="arm-drawing empty" viewBox="0 0 ${widthPx} 64" width="${widthPx}" height="64" role="img" aria-label="${esc(vm.title)}">` +
      `<rect x="0" y="0" width="${widthPx}" height="64" fill="${PALETTE.paper}"/><text x="${widthPx / 2}" y="37" text-anchor="middle" font-size="14" font-family="sans-serif" fill="${PALETTE.muted}">${esc(vm.emptyReason ?? "Nothing to draw")}</text></svg>`
    );
  }
  const status = new Map(vm.parts.map((p) => [p.id, p.status]));
  let springs = "";
  for (const s of vm.springs) {
    const hooks = pose.springs[s.id];
    if (hooks) springs += springMark(vm, s, hooks, status.get(s.id), pose.springForce[s.id], f);
  }
  const labels: PendingLabel[] = [];
  const flags = trouble(vm, pose, f, labels);
  const weights = payloads(vm, pose, status, f, labels);
  const overlay = options.tuneOverlay === false ? undefined : vm;
  const tuned = overlay ? tuneMarks(overlay, pose, f, labels) : "";
  const scale = scaleBar(vm, f);
  const top = caption(vm, pose, f);
  const lastCaption = top.boxes[top.boxes.length - 1];
  const legend = overlay
    ? tuneLegend(overlay, f, lastCaption ? lastCaption.y + lastCaption.h : -bounds[3] + 4 * f.u)
    : { svg: "", boxes: [] };
  return (
    head +
    ground +
    bench(vm, f) +
    envelope(vm, f) +
    bodies(vm, pose, status, f) +
    springs +
    tuned +
    pivots(vm, pose, status, f) +
    weights +
    flags +
    scale.svg +
    top.svg +
    legend.svg +
    drawLabels(labels, f, [scale.box, ...top.boxes, ...legend.boxes]) +
    "</svg>"
  );
}
