// The list of editor features the server installs. A new feature is one file exporting a
// ServerFeature and one line in FEATURES below.
import type { ServerFeature } from "./context";
import { documentSymbolsFeature } from "./document-symbols";
import { navigationFeature } from "./navigation";
import { completionFeature } from "./completion";
import { hoverFeature } from "./hover";
import { foldingFeature } from "./folding";
import { semanticTokensFeature } from "./semantic-tokens";
import { formattingFeature } from "./formatting";
import { inlayHintsFeature } from "./inlay-hints";
import { codeActionsFeature } from "./code-actions";
import { previewFeature } from "./preview-request";

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
];
