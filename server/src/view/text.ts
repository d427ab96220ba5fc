// Escaping and coordinates for the SVG and HTML strings the view builds (figures a reader reads go
// through units/format).

export function esc(s: string): string {
  return s
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/"/g, "&quot;")
    .replace(/'/g, "&#39;");
}

/** Coordinates in SVG: 0.01 mm is far below a pixel at any zoom the panel offers. */
export function c2(x: number): string {
  return (Math.round(x * 100) / 100).toString();
}
