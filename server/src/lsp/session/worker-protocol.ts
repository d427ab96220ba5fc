// Messages between the language server and its analysis worker.
import type { Analysis, AnalysisOptions } from "../../analysis";

export interface WorkerRequest {
  id: number;
  text: string;
  options: AnalysisOptions;
}

export type WorkerReply = { id: number; analysis: Analysis } | { id: number; error: string };
