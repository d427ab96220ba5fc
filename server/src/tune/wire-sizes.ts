// Stock wire sizes for a tuned coil spring: a spring maker winds from the diameters the wire
// mills draw, so the search rounds a tuned `wire` to the nearest preferred diameter within its
// bounds (docs/tuning.md, "Wire sizes") and measures the design at that size.

/** Preferred nominal diameters of round spring-steel wire, mm: the series of EN 10270-1 (patented
 * cold-drawn unalloyed spring steel wire; the same series in EN 10270-2 and -3), from memory, not
 * checked against the standard's table. */
export const STOCK_WIRE_MM = [
  0.2, 0.22, 0.25, 0.28, 0.3, 0.32, 0.34, 0.36, 0.38, 0.4, 0.43, 0.45, 0.48, 0.5, 0.53, 0.56, 0.6, 0.63, 0.65,
  0.7, 0.75, 0.8, 0.85, 0.9, 0.95, 1.0, 1.05, 1.1, 1.2, 1.25, 1.3, 1.4, 1.5, 1.6, 1.7, 1.8, 1.9, 2.0, 2.1,
  2.25, 2.4, 2.5, 2.6, 2.8, 3.0, 3.2, 3.4, 3.6, 3.8, 4.0, 4.25, 4.5, 4.75, 5.0, 5.3, 5.6, 6.0, 6.3, 6.5, 7.0,
  7.5, 8.0, 8.5, 9.0, 9.5, 10.0,
] as const;

const STOCK_WIRE_M = STOCK_WIRE_MM.map((d) => d / 1000);

/** The stock diameters within [lo, hi], m. */
export function stockWithin(lo: number, hi: number): number[] {
  const eps = 1e-12;
  return STOCK_WIRE_M.filter((d) => d >= lo - eps && d <= hi + eps);
}

/** The stock diameter nearest `d` among `sizes` (m), or `d` itself when there is none. */
export function nearestStock(d: number, sizes: readonly number[]): number {
  let best = d;
  let gap = Infinity;
  for (const s of sizes)
    if (Math.abs(s - d) < gap) {
      gap = Math.abs(s - d);
      best = s;
    }
  return best;
}
