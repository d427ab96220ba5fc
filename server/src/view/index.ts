// The view's one entry for the shells: the arm view model of an analysis (the preview panel asks
// for it) and the self-contained report page (`poise report`). Pure: strings and plain values.
import { buildViewModel, type ViewInput, type ViewOptions } from "./build-view-model";
import { renderReportHtml } from "./report-page";
import { withTuneOverlay, type TuneOverlayInput } from "./tune-overlay";

export { buildViewModel, type ViewInput, type ViewOptions } from "./build-view-model";
export type { ViewModel } from "./view-model";

export interface ReportPageOptions {
  /** The spec's path as the user gave it. */
  file: string;
  /** Unit system of the figures (default SI). */
  units?: "si" | "us";
  /** A tune run of this text, laid over the drawing and the hand-force curves. */
  tune?: TuneOverlayInput;
}

/** The report page of an analysis: drawing, curves, tables, diagnostics, limits and cautions. */
export function reportPage(analysis: ViewInput, options: ReportPageOptions): string {
  // The poses the panel gets (at most MAX_VIEW_POSES, thinned evenly): every drawing of the page
  // traces the payload's path along each run of them, so a grid of many degrees of freedom drawn
  // whole made pages of hundreds of megabytes.
  const viewOptions: ViewOptions = options.units ? { units: options.units } : {};
  const vm = buildViewModel(analysis, viewOptions);
  return renderReportHtml(options.tune ? withTuneOverlay(vm, options.tune, "present") : vm, {
    file: options.file,
  });
}
export { withTuneOverlay, type TuneOverlayInput } from "./tune-overlay";
