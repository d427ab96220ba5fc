// Inlay hints: at the end of each declaration's first line, its least safety factor or, without
// one, its first figure from the analysis (setting counterpoise.inlayHints turns them off).
import { InlayHintKind, type InlayHint } from "vscode-languageserver";
import { formatNumber, formatResult } from "../../units/format";
import type { ServerFeature } from "../context";
import { guarded } from "../safe";
import type { Figure, PartReadout } from "../../checks/readout";
import { shownUnits } from "../session/settings";

/** The figure most worth a glance for a part without a safety factor: a payload's hand force, a
 * spring's force, else the first the checks give. */
function keyFigure(readout: PartReadout): Figure | undefined {
  const preferred =
    readout.kind === "payload" ? /hand force/i : readout.kind === "spring" ? /force/i : undefined;
  return (preferred && readout.figures.find((f) => preferred.test(f.label))) || readout.figures[0];
}

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
        const system = shownUnits(ctx.settings(), analysis);
        const hints: InlayHint[] = [];
        for (const d of view.tree.arms[0]?.declarations ?? []) {
          if (!d.name) continue;
          const readout = analysis.readouts[d.name.text];
          if (!readout) continue;
          let label: string | undefined;
          if (readout.worstSafety) label = `safety ${formatNumber(readout.worstSafety.value)}`;
          else {
            const fig = keyFigure(readout);
            if (fig) {
              const low = formatResult(fig.value, fig.dimension, system);
              label = `${fig.label} ${fig.high !== undefined ? `${low} .. ${formatResult(fig.high, fig.dimension, system)}` : low}`;
            }
          }
          if (!label) continue;
          // After the opening brace of the declaration (end of its first line).
          const line = view.lines.position(d.bodySpan.start).line;
          const position = view.lines.position(d.bodySpan.start + 1);
          if (position.line !== line) continue;
          if (line < params.range.start.line || line > params.range.end.line) continue;
          const tooltip = readout.worstSafety
            ? `${readout.worstSafety.what}${readout.worstSafety.where ? `, ${readout.worstSafety.where}` : ""}`
            : undefined;
          hints.push({
            position,
            label,
            kind: InlayHintKind.Parameter,
            paddingLeft: true,
            ...(tooltip ? { tooltip } : {}),
          });
        }
        return hints;
      }),
    );
  },
};
