// Messages of our own between the Counterpoise client and server (beyond the standard protocol).
// Imports nothing, so the client can share it.

/** Server → client, after each analysis of an open document: a one-line summary of the spec. */
export const SPEC_SUMMARY_NOTIFICATION = "counterpoise/specSummary";

export interface SpecSummary {
  uri: string;
  version: number;
  /** Short text for a status bar, already in the user's display units. */
  text: string;
  /** Longer text for its tooltip (one fact a line). */
  tooltip: string;
  /** Worst hand force over the range and load cases, N, and where. */
  worstHandForce?: { valueN: number; payload: string; limitN?: number };
  /** Least safety factor of any part. */
  worstSafety?: { value: number; part: string; what: string; limit: number };
  errors: number;
  warnings: number;
}

/** Client → server: analyse a document again at the spec's own sweep density. */
export const REANALYSE_REQUEST = "counterpoise/reanalyse";

export interface ReanalyseParams {
  uri: string;
}
