// Answers the preview panel's request for a document's arm view model: the analysis of the
// document's current version (waiting briefly for it), else the latest one there is. The view
// model is built in the analysis worker from that very analysis (scheduler.viewModel), within
// the analysis's hard limit, so the server's own thread stays free for every other request.
import type { FeatureContext, ServerFeature } from "../context";
import { guarded } from "../safe";
import { ARM_VIEW_REQUEST, type ArmViewParams, type ArmViewResult } from "../preview-protocol";
import type { Analysis } from "../../analysis";
import { shownUnits } from "../session/settings";
import { withTuneOverlay, type ViewModel } from "../../view/index";

/** The drawing with the document's last tune run over it, when the text drawn is the one the run
 * searched from or the one with its values written (docs/tuning.md, "The preview"). */
function overlaid(ctx: FeatureContext, uri: string, text: string, vm: ViewModel): ViewModel {
  const run = ctx.tuneRuns.get(uri);
  if (!run) return vm;
  if (text === run.presentText) return withTuneOverlay(vm, run.preview, "present");
  if (text === run.tunedText) return withTuneOverlay(vm, run.preview, "tuned");
  return vm;
}

/** How long the request waits for the current text's analysis before answering with an older
 * one: a little over the usual typing debounce plus a sweep (common practice, no source). */
const WAIT_FOR_CURRENT_MS = 4000;

function within<T>(promise: Promise<T>, ms: number): Promise<T | undefined> {
  return new Promise((resolve) => {
    const timer = setTimeout(() => resolve(undefined), ms);
    void promise.then((v) => {
      clearTimeout(timer);
      resolve(v);
    });
  });
}

export const previewFeature: ServerFeature = {
  name: "arm preview",
  capabilities: () => ({}),
  register(ctx: FeatureContext) {
    ctx.connection.onRequest(
      ARM_VIEW_REQUEST,
      guarded("arm view", null as ArmViewResult, async (params: ArmViewParams): Promise<ArmViewResult> => {
        const doc = params?.uri ? ctx.documents.get(params.uri) : undefined;
        if (!doc) return null;
        const current: Analysis | undefined = await within(
          ctx.scheduler.whenAnalysed(doc.uri, doc.version),
          WAIT_FOR_CURRENT_MS,
        );
        const analysis = current?.model ? current : (ctx.scheduler.latest(doc.uri) ?? current);
        if (!analysis) return null;
        const built = await ctx.scheduler.viewModel(analysis, {
          units: shownUnits(ctx.settings(), analysis),
        });
        if (!built) return null;
        if ("failed" in built) {
          ctx.log(`Counterpoise: the arm drawing could not be built: ${built.failed}`);
          return null;
        }
        const vm = overlaid(ctx, doc.uri, analysis.text, built.view);
        if (analysis.text !== doc.getText())
          vm.staleNote =
            "Showing the last text that described an arm; the current text does not build one yet.";
        return vm;
      }),
    );
  },
};
