// Places the drawing's text labels so that no two overlap and none leaves the frame: each label
// names a point and tries a few spots around it, nearest first; one that fits nowhere is left out
// (its words stay in the mark's tooltip and in the panel's list).

/** A box in drawing units, SVG orientation (y down). */
export interface Box {
  x: number;
  y: number;
  w: number;
  h: number;
}

export interface LabelRequest {
  text: string;
  /** The point the label names, drawing units, SVG orientation. */
  at: [number, number];
  /** Clear distance kept from the point (the mark's radius and a gap), drawing units. */
  gap: number;
  fontSize: number;
  bold?: boolean;
}

export interface PlacedLabel extends LabelRequest {
  /** Where the text starts (left end of its baseline), drawing units. */
  x: number;
  baseline: number;
  box: Box;
}

/** Average advance of a sans-serif glyph as a share of the font size, rounded up so that the
 * estimated box holds the real one (common practice for Latin text, no source: about 0.5–0.55 em
 * regular and 0.55–0.6 em bold). */
const EM_PER_CHAR = 0.6;
const EM_PER_CHAR_BOLD = 0.66;
/** Line box as a share of the font size, with the descenders. */
const LINE_EM = 1.25;

/** The estimated box of a label whose text starts at (x, baseline). */
function textBox(req: LabelRequest, x: number, baseline: number): Box {
  const w = req.text.length * req.fontSize * (req.bold ? EM_PER_CHAR_BOLD : EM_PER_CHAR);
  const h = req.fontSize * LINE_EM;
  return { x, y: baseline - req.fontSize * 0.95, w, h };
}

export function boxesOverlap(a: Box, b: Box): boolean {
  return a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;
}

function inside(inner: Box, outer: Box): boolean {
  return (
    inner.x >= outer.x &&
    inner.y >= outer.y &&
    inner.x + inner.w <= outer.x + outer.w &&
    inner.y + inner.h <= outer.y + outer.h
  );
}

/** Text starts tried around the named point, nearest first: right, left, above, below, then the
 * same sides one and two lines further out. */
function candidates(req: LabelRequest): [number, number][] {
  const [px, py] = req.at;
  const w = textBox(req, 0, 0).w;
  const mid = py + req.fontSize * 0.35;
  const line = req.fontSize * LINE_EM;
  const out: [number, number][] = [];
  for (let ring = 0; ring < 3; ring++) {
    const d = req.gap + ring * line;
    out.push(
      [px + d, mid],
      [px - d - w, mid],
      [px - w / 2, py - d],
      [px - w / 2, py + d + req.fontSize],
      [px + d, mid - line * (ring + 1)],
      [px - d - w, mid - line * (ring + 1)],
      [px + d, mid + line * (ring + 1)],
      [px - d - w, mid + line * (ring + 1)],
    );
  }
  return out;
}

/** Places each label in turn, in the order given (the most important first), keeping clear of
 * `reserved` boxes and of labels already placed; labels that fit nowhere are dropped. */
export function placeLabels(
  requests: readonly LabelRequest[],
  frame: Box,
  reserved: readonly Box[] = [],
): PlacedLabel[] {
  const taken: Box[] = [...reserved];
  const placed: PlacedLabel[] = [];
  for (const req of requests) {
    for (const [x, baseline] of candidates(req)) {
      const box = textBox(req, x, baseline);
      if (!inside(box, frame) || taken.some((t) => boxesOverlap(t, box))) continue;
      taken.push(box);
      placed.push({ ...req, x, baseline, box });
      break;
    }
  }
  return placed;
}

/** The estimated box of a text that must be drawn where it is (a caption, the scale's figure). */
export function fixedTextBox(text: string, x: number, baseline: number, fontSize: number): Box {
  return textBox({ text, at: [x, baseline], gap: 0, fontSize }, x, baseline);
}
