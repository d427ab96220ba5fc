// The drawing's colours, in one place so the panel and the report look the same. Chosen for this
// project: a warm paper ground, slate bodies, copper springs, teal payloads, crimson for trouble.
export const PALETTE = {
  paper: "#f6f2e8",
  grid: "#e4ddcc",
  ink: "#2b2f33",
  muted: "#6b6f73",
  bench: "#5b5140",
  benchHatch: "#a89c84",
  base: "#4a4f57",
  link: "#3e6478",
  bar: "#5a86a0",
  head: "#2f5266",
  pivotFill: "#fffdf7",
  pivotRing: "#23292e",
  coil: "#b5612b",
  cord: "#84406f",
  gasBody: "#3b3f45",
  gasRod: "#9aa3ab",
  payload: "#2c7a5a",
  envelope: "#c0912a",
  error: "#c0213a",
  warning: "#d08a00",
  // plot series
  gravity: "#3e6478",
  spring: "#b5612b",
  load: "#84406f",
  net: "#23292e",
  band: "#cfe6d6",
  // a tune run's overlay: the other design's springs and curves, and the anchor locus
  tuned: "#4a56b8",
  locus: "#8a6bbf",
} as const;

/** Colours for hand-force series of several payloads and load cases. */
export const SERIES_CYCLE = ["#2c7a5a", "#b5612b", "#3e6478", "#84406f", "#c0912a", "#5b5140"] as const;
