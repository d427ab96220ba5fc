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

/** The tune command (workspace/executeCommand, arguments `[uri]`): runs the design search over the
 * document's `tune` lines (each spring's rate and tension when it has none) and writes the
 * re-checked values into it. Offered as the quick fix TUNE_FIX_TITLE. */
export const TUNE_COMMAND = "counterpoise.tuneSprings";
export const TUNE_FIX_TITLE = "Search the spring settings that balance best (tune)";

/** What the tune command answers. */
export interface TuneCommandResult {
  /** A better design was found and passed its re-check. */
  improved: boolean;
  /** Its values were written into the document. */
  applied: boolean;
  message: string;
}
