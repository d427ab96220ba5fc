// Source positions: every syntax node and model object carries the character span it came from.
// The Span type itself is the findings layer's (the leaf below syntax); the helpers are here.
import type { Span } from "../findings/span";

export type { Span };

export function span(start: number, end: number): Span {
  return { start, end };
}

/** The smallest span covering both. */
export function joinSpans(a: Span, b: Span): Span {
  return { start: Math.min(a.start, b.start), end: Math.max(a.end, b.end) };
}

export function spanContains(outer: Span, offset: number): boolean {
  return offset >= outer.start && offset <= outer.end;
}

/** 0-based line and character (UTF-16) of a position, as editors count them. */
export interface LineCharacter {
  line: number;
  character: number;
}

/** Maps offsets to lines and characters; built once per text. */
export class LineIndex {
  private readonly lineStarts: number[];

  constructor(readonly text: string) {
    const starts = [0];
    for (let i = 0; i < text.length; i++) {
      const c = text.charCodeAt(i);
      if (c === 10) starts.push(i + 1);
      else if (c === 13) {
        if (text.charCodeAt(i + 1) === 10) i++;
        starts.push(i + 1);
      }
    }
    this.lineStarts = starts;
  }

  get lineCount(): number {
    return this.lineStarts.length;
  }

  position(offset: number): LineCharacter {
    const clamped = Math.max(0, Math.min(offset, this.text.length));
    let lo = 0;
    let hi = this.lineStarts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (this.lineStarts[mid]! <= clamped) lo = mid;
      else hi = mid - 1;
    }
    return { line: lo, character: clamped - this.lineStarts[lo]! };
  }

  offset(pos: LineCharacter): number {
    if (pos.line < 0) return 0;
    if (pos.line >= this.lineStarts.length) return this.text.length;
    const start = this.lineStarts[pos.line]!;
    const next = pos.line + 1 < this.lineStarts.length ? this.lineStarts[pos.line + 1]! : this.text.length;
    return Math.min(start + Math.max(0, pos.character), next);
  }
}
