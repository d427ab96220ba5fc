// The last few analyses, by text and options, so the drawing panel's view model is built from
// the very analysis whose diagnostics were published (in the worker, off the request thread),
// without analysing again.
import type { Analysis, AnalysisOptions } from "../../analysis";

/** Analyses kept: the last full and quick runs of a document, or of two. Each can hold a large
 * sweep, so few. Common practice, no source. */
const KEPT = 2;

export function cacheKey(text: string, options: AnalysisOptions): string {
  const { stepsOverride, quickSteps, budgetMs, modelOnly, units } = options;
  // The units are part of the result: the messages are written in them.
  const key = [
    stepsOverride ?? null,
    quickSteps ?? null,
    budgetMs ?? null,
    modelOnly ?? false,
    units ?? null,
  ];
  return `${JSON.stringify(key)}\n${text}`;
}

export class AnalysisCache {
  private readonly entries = new Map<string, Analysis>();

  get(text: string, options: AnalysisOptions): Analysis | undefined {
    return this.entries.get(cacheKey(text, options));
  }

  put(text: string, options: AnalysisOptions, analysis: Analysis): void {
    const key = cacheKey(text, options);
    this.entries.delete(key);
    this.entries.set(key, analysis);
    while (this.entries.size > KEPT) this.entries.delete(this.entries.keys().next().value!);
  }
}
