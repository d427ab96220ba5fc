// Escaping and number formatting for the SVG and HTML strings the view builds.

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

/** A figure for a table or label with about three significant digits. */
export function fig(x: number, digits = 3): string {
  if (!Number.isFinite(x)) return "–";
  if (x === 0) return "0";
  const mag = Math.floor(Math.log10(Math.abs(x)));
  const decimals = Math.max(0, Math.min(6, digits - 1 - mag));
  return x.toFixed(decimals);
}
