// Document formatting: replaces the text with its canonical layout (format-text.ts).
import type { TextEdit } from "vscode-languageserver";
import type { ServerFeature } from "../context";
import { formatSpec } from "../../services/format-text";
import { guarded } from "../safe";
import { MAX_SPEC_CHARS } from "../../limits";

export const formattingFeature: ServerFeature = {
  name: "formatting",
  capabilities: () => ({ documentFormattingProvider: true }),
  register(ctx) {
    ctx.connection.onDocumentFormatting(
      guarded("formatting", [] as TextEdit[], (params) => {
        const doc = ctx.documents.get(params.textDocument.uri);
        if (!doc) return [];
        const text = doc.getText();
        if (text.length > MAX_SPEC_CHARS) return []; // not read (its finding says so): left as it is
        const formatted = formatSpec(text);
        if (formatted === text) return [];
        return [
          {
            range: { start: { line: 0, character: 0 }, end: doc.positionAt(text.length) },
            newText: formatted,
          },
        ];
      }),
    );
  },
};
