// Whether V8's optimising compiler works during a one-shot analysis. `poise` runs once and exits:
// on a spec of the usual size the optimised code never pays for its compilation, which runs on
// background threads and costs about a third of `poise check`'s CPU on the engraver sample (1.0 s
// against 0.65 s without it, least of several runs) while the analysis ends no sooner. On a large
// spec it pays: a 120-body chain takes 4.1 s of CPU with it and 6.0 s without, a 60-body chain
// (8 kB) about the same either way. So it is switched off below that size and on above it.
import { setFlagsFromString } from "node:v8";

/** Specs shorter than this (characters) are analysed without the optimising compiler. */
export const SMALL_SPEC_CHARS = 8 * 1024;

let optimising = true;
/** Only the `poise` process itself switches (main.ts): the flag is the whole process's, and a
 * test that runs the command's functions in its own process keeps its optimiser. */
let switching = false;

/** Lets optimiseFor switch the compiler: called once by the command's entry. */
export function switchOptimiserPerSpec(): void {
  switching = true;
}

/** Sets the optimising compiler for the analysis of `text` (before it starts: the flag is read
 * when a function gets hot, so switching between analyses is safe). */
export function optimiseFor(text: string): void {
  if (!switching) return;
  const want = text.length >= SMALL_SPEC_CHARS;
  if (want === optimising) return;
  setFlagsFromString(want ? "--opt" : "--no-opt");
  optimising = want;
}

/** Turns the optimising compiler on for a search that analyses the spec many times over (the
 * tune preview of `poise report`), which runs long enough to pay for it. */
export function optimiseForSearch(): void {
  if (!switching || optimising) return;
  setFlagsFromString("--opt");
  optimising = true;
}
