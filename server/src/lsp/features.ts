// The list of editor features the server installs. A new feature is one file exporting a
// ServerFeature and one line in FEATURES below.
import type { ServerFeature } from "./context";
import { documentSymbolsFeature } from "./features/document-symbols";
import { navigationFeature } from "./features/navigation";
import { completionFeature } from "./features/completion";
import { hoverFeature } from "./features/hover";
import { foldingFeature } from "./features/folding";
import { semanticTokensFeature } from "./features/semantic-tokens";
import { formattingFeature } from "./features/formatting";
import { inlayHintsFeature } from "./features/inlay-hints";
import { codeActionsFeature } from "./features/code-actions";
import { previewFeature } from "./features/preview-request";
import { tuneCommandFeature } from "./features/tune-command";

export const FEATURES: ServerFeature[] = [
  documentSymbolsFeature,
  navigationFeature,
  completionFeature,
  hoverFeature,
  foldingFeature,
  semanticTokensFeature,
  formattingFeature,
  inlayHintsFeature,
  // ---- Features added by later work go here, one line each (e.g. code actions from
  // ---- ./code-actions, the preview's requests from ./preview-*).
  codeActionsFeature,
  previewFeature,
  tuneCommandFeature,
];
