// Inlay hints: at the end of each declaration's first line, its least safety factor or, without
// one, its first figure from the analysis (setting counterpoise.inlayHints turns them off).
import { InlayHintKind, type InlayHint } from "vscode-languageserver";
import { formatNumber, formatQuantity } from "../units/format";
import type { ServerFeature } from "./context";
import { guarded } from "./safe";

export const inlayHintsFeature: ServerFeature = {
  name: "inlay hints",
  capabilities: () => ({ inlayHintProvider: true }),
  register(ctx) {
    ctx.connection.languages.inlayHint.on(
      guarded("inlay hints", [] as InlayHint[], (params) => {
        if (!ctx.settings().inlayHints) return [];
        const uri = params.textDocument.uri;
        const view = ctx.syntax(uri);
        const analysis = ctx.figures(uri);
        if (!view || !analysis) return [];
        const system = ctx.settings().displayUnits;
        const hints: InlayHint[] = [];
        for (const d of view.tree.arms[0]?.declarations ?? []) {
          if (!d.name) continue;
          const readout = analysis.readouts[d.name.text];
          if (!readout) continue;
          let label: string | undefined;
          if (readout.worstSafety) label = `safety ${formatNumber(readout.worstSafety.value)}`;
          else if (readout.figures[0]) {
            const fig = readout.figures[0];
            label = `${fig.label} ${formatQuantity(fig.high ?? fig.value, fig.dimension, system)}`;
          }
          if (!label) continue;
          // After the opening brace of the declaration (end of its first line).
          const line = view.lines.position(d.bodySpan.start).line;
          const position = view.lines.position(d.bodySpan.start + 1);
          if (position.line !== line) continue;
          if (line < params.range.start.line || line > params.range.end.line) continue;
          const tooltip = readout.worstSafety ? `${readout.worstSafety.what}${readout.worstSafety.where ? `, ${readout.worstSafety.where}` : ""}` : undefined;
          hints.push({ position, label, kind: InlayHintKind.Parameter, paddingLeft: true, ...(tooltip ? { tooltip } : {}) });
        }
        return hints;
      }),
    );
  },
};
