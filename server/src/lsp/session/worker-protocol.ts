// Messages between the language server and its analysis worker: analyses, view models, and the
// quick fixes of some findings re-checked on copies of the text (server/src/recheck.ts).
import type { Analysis, AnalysisOptions } from "../../analysis";
import type { FixRequest, TextFix } from "../../findings/fix";
import type { ViewModel, ViewOptions } from "../../view";
import type { TuneReply } from "./tune-run";

interface Request {
  id: number;
  text: string;
  options: AnalysisOptions;
  /** Raised (non-zero) by the server to cancel the run: a SharedArrayBuffer of 4 bytes. */
  cancel: Int32Array;
}

export type WorkerRequest =
  | (Request & { kind: "analyse" })
  /** The view model of the analysis of `text` with `options` (the worker's own, if it has it). */
  | (Request & { kind: "view"; view: ViewOptions })
  /** The fixes of each request that survive their re-check on copies of `text`, analysed with
   * `options` (the text's own analysis reused when the worker has it). */
  | (Request & { kind: "fixes"; fixes: FixJob })
  /** The design search over the text's `tune` lines (issue 13), its answer as text edits. */
  | (Request & { kind: "tune" });

/** What a fixes request asks: the findings' requests and the time for every re-check together. */
export interface FixJob {
  requests: FixRequest[];
  budgetMs: number;
}

export type WorkerReply =
  /** Sent once the worker has loaded (and built its parser): before that it cannot look at a
   * cancel flag, and its slowness is not a hang. */
  | { ready: true }
  /** The server's copy (server-copy.ts): each pose of the sweep keeps its angles and hand forces. */
  | { id: number; analysis: Analysis }
  | { id: number; view: ViewModel }
  | { id: number; fixes: TextFix[][] }
  | { id: number; tune: TuneReply }
  /** Now and then while a search runs: the fraction done and what it is doing. */
  | { id: number; progress: number; message: string }
  | { id: number; error: string };
