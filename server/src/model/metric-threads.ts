// Coarse pitches of ISO metric screw threads (ISO 261, ISO 262 selection): the model fills in a
// fastening's pitch from its diameter, the thread formulas (mechanics/hardware/threads.ts) use it.

/** Nominal diameter mm -> coarse pitch mm. */
const COARSE_PITCH_MM: ReadonlyArray<readonly [number, number]> = [
  [1.6, 0.35],
  [2, 0.4],
  [2.5, 0.45],
  [3, 0.5],
  [3.5, 0.6],
  [4, 0.7],
  [5, 0.8],
  [6, 1.0],
  [8, 1.25],
  [10, 1.5],
  [12, 1.75],
  [14, 2.0],
  [16, 2.0],
  [20, 2.5],
  [24, 3.0],
];

/** A nominal diameter within this of a table size is that size (sizes are whole tenths of a mm). */
const SIZE_MATCH_M = 1e-6;

/** Coarse pitch of an ISO metric thread of nominal diameter d, m; undefined off the table. */
export function coarsePitch(nominalDiameter: number): number | undefined {
  const row = COARSE_PITCH_MM.find(([d]) => Math.abs(d / 1000 - nominalDiameter) < SIZE_MATCH_M);
  return row ? row[1] / 1000 : undefined;
}

/** The sizes of the table, mm, for messages. */
export const COARSE_SIZES_MM: readonly number[] = COARSE_PITCH_MM.map(([d]) => d);
