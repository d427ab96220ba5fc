// What every editor feature of the server is handed: the connection, the open documents, the
// analyses, the fast parse of the current text, and the settings.
import type {
  ClientCapabilities,
  Connection,
  ServerCapabilities,
  TextDocuments,
} from "vscode-languageserver";
import type { TextDocument } from "vscode-languageserver-textdocument";
import type { Analysis } from "../analysis";
import type { TextFix } from "../findings/fix";
import type { FixJob } from "./session/worker-protocol";
import type { AnalysisScheduler } from "./session/scheduler";
import type { Settings } from "./session/settings";
import type { SyntaxView } from "./session/syntax-view";
import type { TuneReply } from "./session/tune-run";

/** The last tune run the user asked for on a document: the text it ran on, the text with the
 * tuned values written, and what the drawing shows of it. */
export interface TuneRun {
  presentText: string;
  tunedText: string;
  preview: NonNullable<TuneReply["preview"]>;
}

export interface FeatureContext {
  connection: Connection;
  documents: TextDocuments<TextDocument>;
  scheduler: AnalysisScheduler;
  settings(): Settings;
  client(): ClientCapabilities;
  /** The fast parse of the document's current text (undefined if the document is not open). */
  syntax(uri: string): SyntaxView | undefined;
  /** The best analysis to read figures from now (may be of an earlier text). */
  figures(uri: string): Analysis | undefined;
  /** The fixes of each request that survive their re-check on a copy of the text, found in the
   * analysis worker; undefined when that could not be done in time (offer none then). */
  checkFixes(text: string, job: FixJob): Promise<TextFix[][] | undefined>;
  log(message: string): void;
  /** The last tune run per document uri (the drawing lays it over whichever of its two texts the
   * editor holds); forgotten when the document closes. */
  tuneRuns: Map<string, TuneRun>;
}

/** One editor feature: the capabilities it announces and the handlers it installs. Handlers must
 * be wrapped with `guarded` (safe.ts) so that no exception reaches the connection. */
export interface ServerFeature {
  name: string;
  capabilities(client: ClientCapabilities): ServerCapabilities;
  register(ctx: FeatureContext): void;
}
