// The editor's tune command (issue 13): runs the design search over a document's `tune` lines in
// the analysis worker (cancellable from the editor's progress), reports LSP work-done progress,
// and writes the re-checked values into the document in its own units (a versioned edit, so a
// text changed meanwhile is never overwritten); with `{ write: false }` as its second argument it
// only shows the result in the arm drawing and offers to write it. Either way the run is kept for
// the drawing (ctx.tuneRuns). The quick fix that runs it lives with the other code actions
// (code-actions.ts).
import {
  TextDocumentEdit,
  WorkDoneProgressReporter,
  type CancellationToken,
  type ExecuteCommandParams,
  type TextEdit,
} from "vscode-languageserver";
import type { FeatureContext, ServerFeature } from "../context";
import { guarded } from "../safe";
import { LineIndex } from "../../syntax/span";
import { TUNE_COMMAND, type TuneCommandResult } from "../custom-protocol";

/** The action of the message that offers to write values only shown. */
const WRITE_ACTION = "Write the tuned values";

/** Hand forces to the hundredth of a newton. */
const newtons = (n: number | undefined) => (n === undefined ? "-" : `${n.toFixed(2)} N`);

async function reporterFor(
  ctx: FeatureContext,
  workDone: WorkDoneProgressReporter | undefined,
): Promise<{ reporter: WorkDoneProgressReporter; token?: CancellationToken }> {
  if (workDone && !WorkDoneProgressReporter.isNullInstance(workDone)) return { reporter: workDone };
  if (ctx.client().window?.workDoneProgress) {
    const r = await ctx.connection.window.createWorkDoneProgress();
    return { reporter: r, token: r.token };
  }
  return { reporter: { begin: () => {}, report: () => {}, done: () => {} } };
}

async function tuneDocument(
  ctx: FeatureContext,
  uri: string,
  write: boolean,
  token: CancellationToken,
  workDone: WorkDoneProgressReporter | undefined,
): Promise<TuneCommandResult> {
  const doc = ctx.documents.get(uri);
  if (!doc) return { improved: false, applied: false, message: `${uri} is not open` };
  const text = doc.getText();
  const version = doc.version;
  const { reporter, token: progressToken } = await reporterFor(ctx, workDone);
  reporter.begin("Counterpoise: tuning springs", 0, "analysing the present design", true);
  const handle = ctx.scheduler.tune(text, (fraction, message) =>
    reporter.report(Math.round(fraction * 100), message),
  );
  token.onCancellationRequested(() => handle.cancel());
  progressToken?.onCancellationRequested(() => handle.cancel());
  const outcome = await handle.outcome;
  reporter.done();
  if (outcome.kind === "cancelled" || (outcome.kind === "done" && outcome.tune.cancelled))
    return { improved: false, applied: false, message: "Tuning cancelled." };
  if (outcome.kind === "timeout")
    return { improved: false, applied: false, message: "Tuning ran out of time." };
  if (outcome.kind === "failed")
    return { improved: false, applied: false, message: `Tuning could not run: ${outcome.message}` };
  const r = outcome.tune;
  if (!r.improved) {
    const message = `No tuned design: ${r.reason ?? "nothing better found"}.`;
    void ctx.connection.window.showInformationMessage(message);
    return { improved: false, applied: false, message };
  }
  // The drawing lays the run over whichever of the two texts the editor holds (before the edit
  // below lands, so the drawing's refresh after it finds the run).
  if (r.preview && r.tunedText !== undefined)
    ctx.tuneRuns.set(uri, { presentText: text, tunedText: r.tunedText, preview: r.preview });
  const now = ctx.documents.get(uri);
  if (!now || now.version !== version) {
    const message = "The text changed while tuning: run the tune command again.";
    void ctx.connection.window.showWarningMessage(message);
    return { improved: true, applied: false, message };
  }
  const index = new LineIndex(text);
  const edits: TextEdit[] = r.edits.map((e) => ({
    range: { start: index.position(e.span.start), end: index.position(e.span.end) },
    newText: e.newText,
  }));
  const summary = `Tuned ${r.changes.join("; ")}: worst hand force ${newtons(r.worstBefore)} → ${newtons(r.worstAfter)}${
    r.errors > 0 ? ` (the design still has ${r.errors} error${r.errors === 1 ? "" : "s"})` : ""
  }${r.stopped ? " (the search stopped at its time budget: the best found by then)" : ""}.`;
  const writeEdit = () =>
    ctx.connection.workspace.applyEdit({
      label: "Tune springs",
      edit: { documentChanges: [TextDocumentEdit.create({ uri, version }, edits)] },
    });
  if (!write) {
    // Shown, not written: the drawing has the tuned design beside the present one; the values go
    // into the text only when asked (and only into the text they were found for).
    const message = `${summary} Shown in the arm drawing, not written.`;
    void ctx.connection.window
      .showInformationMessage(message, { title: WRITE_ACTION })
      .then(async (choice) => {
        if (choice?.title !== WRITE_ACTION) return;
        if (ctx.documents.get(uri)?.version !== version)
          return void ctx.connection.window.showWarningMessage(
            "The text changed since the search: run it again.",
          );
        await writeEdit();
      })
      .catch(() => undefined);
    return { improved: true, applied: false, message };
  }
  const applied = await writeEdit();
  if (applied.applied) void ctx.connection.window.showInformationMessage(summary);
  return {
    improved: true,
    applied: applied.applied,
    message: applied.applied
      ? summary
      : `The editor did not apply the tuned values${applied.failureReason ? `: ${applied.failureReason}` : ""}.`,
  };
}

export const tuneCommandFeature: ServerFeature = {
  name: "tune command",
  capabilities: () => ({ executeCommandProvider: { commands: [TUNE_COMMAND] } }),
  register(ctx: FeatureContext) {
    ctx.connection.onExecuteCommand(
      guarded(
        "tune command",
        undefined as TuneCommandResult | undefined,
        async (
          params: ExecuteCommandParams,
          token: CancellationToken,
          workDone?: WorkDoneProgressReporter,
        ) => {
          if (params.command !== TUNE_COMMAND) return undefined;
          const uri = params.arguments?.[0];
          if (typeof uri !== "string")
            return { improved: false, applied: false, message: "no document named" };
          const options = params.arguments?.[1] as { write?: unknown } | undefined;
          const write = !(typeof options === "object" && options !== null && options.write === false);
          return tuneDocument(ctx, uri, write, token, workDone);
        },
      ),
    );
  },
};
