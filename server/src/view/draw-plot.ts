// A small line plot as an SVG string: axes with round ticks, series, an optional shaded band and a
// marker at the current pose. Presentation attributes only (strict content-security policy).
import { PALETTE } from "./palette";
import { c2, esc } from "./text";

export interface PlotSeries {
  name: string;
  colour: string;
  dashed?: boolean;
  points: [number, number][];
}

export interface PlotSpec {
  id: string;
  title: string;
  xLabel: string;
  yLabel: string;
  series: PlotSeries[];
  /** A shaded horizontal band, e.g. the allowed hand force. */
  band?: { from: number; to: number; label: string };
  /** x of the pose drawn beside the plot (an upright line, named in the legend). */
  markerX?: number;
  /** The marker's legend words; "pose drawn" if not given. */
  markerLabel?: string;
  widthPx?: number;
  heightPx?: number;
}

const PAD = { left: 54, right: 12, top: 26, bottom: 38 };
/** Legend rows sit under the title; one row is this tall, px. */
const LEGEND_ROW = 14;

/** Legend entries laid out in rows under the title, wrapping at the plot's width. */
function legendLayout(series: readonly PlotSeries[], width: number): { x: number; row: number }[] {
  const out: { x: number; row: number }[] = [];
  let x = PAD.left;
  let row = 0;
  for (const s of series) {
    const w = 22 + s.name.length * 5.6;
    if (x + w > width - PAD.right && x > PAD.left) {
      x = PAD.left;
      row++;
    }
    out.push({ x, row });
    x += w + 10;
  }
  return out;
}

/** Tick step of 1, 2 or 5 times a power of ten giving about `count` ticks. */
function tickStep(span: number, count: number): number {
  const raw = span / Math.max(count, 1);
  const p = 10 ** Math.floor(Math.log10(raw || 1));
  const m = raw / p;
  return (m < 1.5 ? 1 : m < 3.5 ? 2 : m < 7.5 ? 5 : 10) * p;
}

/** A tick label with just the decimals its step needs (0.5 → "0.5", 20 → "20"). */
function tickLabel(t: number, step: number): string {
  return t.toFixed(Math.max(0, Math.min(6, -Math.floor(Math.log10(step) + 1e-9))));
}

export function renderPlotSvg(spec: PlotSpec): string {
  const W = spec.widthPx ?? 420;
  const H = spec.heightPx ?? 230;
  const all = spec.series
    .flatMap((s) => s.points)
    .filter(([x, y]) => Number.isFinite(x) && Number.isFinite(y));
  let x0 = Math.min(...all.map((p) => p[0]));
  let x1 = Math.max(...all.map((p) => p[0]));
  let y0 = Math.min(0, ...all.map((p) => p[1]));
  let y1 = Math.max(0, ...all.map((p) => p[1]));
  if (spec.band) {
    y0 = Math.min(y0, spec.band.from);
    y1 = Math.max(y1, spec.band.to * 1.15);
  }
  if (!Number.isFinite(x0)) {
    x0 = 0;
    x1 = 1;
  }
  if (x1 === x0) {
    x0 -= 1;
    x1 += 1;
  }
  if (y1 - y0 < 1e-9) {
    y0 -= 1;
    y1 += 1;
  }
  const pad = (y1 - y0) * 0.06;
  y0 -= pad;
  y1 += pad;
  const hasMarker = spec.markerX !== undefined && Number.isFinite(spec.markerX);
  // The marker gets a legend entry like a series, so the reader knows what the upright line is.
  const markerEntry: PlotSeries = {
    name: spec.markerLabel ?? "pose drawn",
    colour: PALETTE.muted,
    dashed: true,
    points: [],
  };
  const entries = hasMarker ? [...spec.series, markerEntry] : spec.series;
  const legend = legendLayout(entries, W);
  const top = PAD.top + LEGEND_ROW * (legend.length ? Math.max(...legend.map((l) => l.row)) + 1 : 0);
  const sx = (x: number) => PAD.left + ((x - x0) / (x1 - x0)) * (W - PAD.left - PAD.right);
  const sy = (y: number) => H - PAD.bottom - ((y - y0) / (y1 - y0)) * (H - top - PAD.bottom);
  let out = `<svg xmlns="http://www.w3.org/2000/svg" class="plot" data-plot="${esc(spec.id)}" viewBox="0 0 ${W} ${H}" width="${W}" height="${H}" role="img" aria-label="${esc(spec.title)}">`;
  out += `<rect x="0" y="0" width="${W}" height="${H}" fill="${PALETTE.paper}"/>`;
  out += `<text x="${PAD.left}" y="16" font-size="12" font-weight="bold" font-family="sans-serif" fill="${PALETTE.ink}">${esc(spec.title)}</text>`;
  if (spec.band) {
    const top = sy(spec.band.to);
    const bottom = sy(spec.band.from);
    out += `<rect class="band" x="${PAD.left}" y="${c2(top)}" width="${W - PAD.left - PAD.right}" height="${c2(bottom - top)}" fill="${PALETTE.band}"/>`;
    out += `<line x1="${PAD.left}" y1="${c2(top)}" x2="${W - PAD.right}" y2="${c2(top)}" stroke="${PALETTE.payload}" stroke-dasharray="4 3"/>`;
    out += `<text x="${W - PAD.right - 4}" y="${c2(top - 4)}" text-anchor="end" font-size="10" font-family="sans-serif" fill="${PALETTE.payload}">${esc(spec.band.label)}</text>`;
  }
  const xs = tickStep(x1 - x0, 6);
  // The ends of a range sit on ticks; round-off in the angle must not drop the first one.
  for (let t = Math.ceil(x0 / xs - 1e-9) * xs; t <= x1 + 1e-9; t += xs) {
    out += `<line x1="${c2(sx(t))}" y1="${top}" x2="${c2(sx(t))}" y2="${H - PAD.bottom}" stroke="${PALETTE.grid}"/>`;
    out += `<text x="${c2(sx(t))}" y="${H - PAD.bottom + 14}" text-anchor="middle" font-size="10" font-family="sans-serif" fill="${PALETTE.muted}">${tickLabel(t, xs)}</text>`;
  }
  const ys = tickStep(y1 - y0, 5);
  for (let t = Math.ceil(y0 / ys) * ys; t <= y1 + 1e-12; t += ys) {
    const v = Math.abs(t) < ys * 1e-6 ? 0 : t;
    out += `<line x1="${PAD.left}" y1="${c2(sy(v))}" x2="${W - PAD.right}" y2="${c2(sy(v))}" stroke="${v === 0 ? PALETTE.muted : PALETTE.grid}"/>`;
    out += `<text x="${PAD.left - 5}" y="${c2(sy(v) + 3)}" text-anchor="end" font-size="10" font-family="sans-serif" fill="${PALETTE.muted}">${tickLabel(v, ys)}</text>`;
  }
  out += `<text x="${c2((PAD.left + W - PAD.right) / 2)}" y="${H - 6}" text-anchor="middle" font-size="11" font-family="sans-serif" fill="${PALETTE.ink}">${esc(spec.xLabel)}</text>`;
  out += `<text x="12" y="${c2((top + H - PAD.bottom) / 2)}" text-anchor="middle" font-size="11" font-family="sans-serif" fill="${PALETTE.ink}" transform="rotate(-90 12 ${c2((top + H - PAD.bottom) / 2)})">${esc(spec.yLabel)}</text>`;
  for (const s of spec.series) {
    // Break the line where a value is missing (NaN) rather than bridging the gap.
    const segments: [number, number][][] = [[]];
    for (const p of s.points) {
      if (Number.isFinite(p[1])) segments[segments.length - 1]!.push(p);
      else if (segments[segments.length - 1]!.length) segments.push([]);
    }
    for (const seg of segments) {
      if (seg.length === 0) continue;
      out += `<polyline class="series" data-series="${esc(s.name)}" points="${seg.map(([x, y]) => `${c2(sx(x))},${c2(sy(y))}`).join(" ")}" fill="none" stroke="${s.colour}" stroke-width="2"${s.dashed ? ` stroke-dasharray="6 3"` : ""}/>`;
    }
  }
  if (hasMarker) {
    // Neutral, not the trouble colour: it marks where the drawing is, not a fault.
    out += `<line class="marker" x1="${c2(sx(spec.markerX!))}" y1="${top}" x2="${c2(sx(spec.markerX!))}" y2="${H - PAD.bottom}" stroke="${PALETTE.muted}" stroke-width="1.2" stroke-dasharray="3 2"/>`;
  }
  entries.forEach((s, i) => {
    const { x, row } = legend[i]!;
    const y = 30 + row * LEGEND_ROW;
    out += `<line x1="${c2(x)}" y1="${y - 3}" x2="${c2(x + 16)}" y2="${y - 3}" stroke="${s.colour}" stroke-width="2"${s.dashed ? ` stroke-dasharray="4 2"` : ""}/>`;
    out += `<text x="${c2(x + 20)}" y="${y}" font-size="10" font-family="sans-serif" fill="${PALETTE.ink}">${esc(s.name)}</text>`;
  });
  return out + "</svg>";
}
