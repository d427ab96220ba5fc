// The tune command through the real server over stdio (issue 13): offered as a quick fix on a
// balance diagnostic, it runs the design search in the analysis worker with work-done progress,
// asks the editor to apply a versioned edit with the balancing rate in the spec's own unit, and
// stops when the request is cancelled.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  CodeActionRequest,
  ExecuteCommandRequest,
  ApplyWorkspaceEditRequest,
  type ApplyWorkspaceEditParams,
  type CodeAction,
  type TextDocumentEdit,
} from "vscode-languageserver-protocol/node";
import { CancellationTokenSource } from "vscode-jsonrpc";
import { TextDocument } from "vscode-languageserver-textdocument";
import { ProtocolSession, ensureBuilt } from "./protocol-client";
import { TUNE_COMMAND, TUNE_FIX_TITLE, type TuneCommandResult } from "../../server/src/lsp/custom-protocol";

/** Standard gravity, m/s^2 (SI Brochure, 9th ed.; the language's default `gravity`). */
const G0 = 9.80665;

const LAMP = `# Invented for the tests: a desk lamp on a boom, balanced by a spring led over a pulley.
arm "Lamp" {
  base post {
    point pivot (0 mm, 300 mm)
    point anchor (0 mm, 350 mm)
  }
  link boom {
    length 450 mm
    mass 0 kg
  }
  joint shoulder {
    connects post.pivot to boom.start
    range -50 deg .. 50 deg
  }
  spring lift {
    zero_length
    between post.anchor and boom(100 mm, 0 mm)
    rate 0.5 N/mm
    tune rate 0.1 N/mm .. 2 N/mm
  }
  payload shade {
    mass 1 kg
    at boom(400 mm, 0 mm)
  }
}
`;

let session: ProtocolSession;
const edits: ApplyWorkspaceEditParams[] = [];
const progress: unknown[] = [];

beforeAll(async () => {
  ensureBuilt();
  session = new ProtocolSession({ stepsWhileTyping: 0, diagnosticsDelayMs: 10 });
  session.connection.onRequest(ApplyWorkspaceEditRequest.type, (p) => {
    edits.push(p);
    return { applied: true };
  });
  session.connection.onNotification("$/progress", (p: { token: string; value: unknown }) => {
    progress.push(p);
  });
  session.connection.onNotification("window/showMessage", () => {});
  await session.initialize();
}, 120000);

afterAll(async () => {
  await session?.stop();
});

describe("tune command over the protocol", () => {
  const uri = "file:///work/lamp-tune.poise";

  it("is offered on a balance diagnostic and writes k a b = m g l into the document", async () => {
    const published = await session.open(uri, LAMP, 1);
    const balance = published.diagnostics.find((d) => d.code === "balance.unbalanced")!;
    expect(balance).toBeDefined();
    const actions = (await session.connection.sendRequest(CodeActionRequest.type, {
      textDocument: { uri },
      range: balance.range,
      context: { diagnostics: [balance], only: ["quickfix"] },
    })) as CodeAction[];
    const tune = actions.find((a) => a.title === TUNE_FIX_TITLE);
    expect(tune?.command?.command).toBe(TUNE_COMMAND);
    const result = (await session.connection.sendRequest(ExecuteCommandRequest.type, {
      command: tune!.command!.command,
      arguments: tune!.command!.arguments,
      workDoneToken: "tune-1",
    })) as TuneCommandResult;
    expect(result.improved).toBe(true);
    expect(result.applied).toBe(true);
    // Work-done progress on the token the request gave: begin, reports, end
    const kinds = progress
      .filter((p) => (p as { token: string }).token === "tune-1")
      .map((p) => (p as { value: { kind: string } }).value.kind);
    expect(kinds[0]).toBe("begin");
    expect(kinds[kinds.length - 1]).toBe("end");
    expect(kinds).toContain("report");
    // A versioned edit of this document with the rate of k a b = m g l (Streit and Gilmore 1989)
    const change = edits[0]!.edit.documentChanges![0] as TextDocumentEdit;
    expect(change.textDocument).toEqual({ uri, version: 1 });
    const tuned = TextDocument.applyEdits(
      TextDocument.create(uri, "counterpoise", 1, LAMP),
      change.edits as { range: (typeof change.edits)[0]["range"]; newText: string }[],
    );
    const k = (1 * G0 * 0.4) / (0.05 * 0.1);
    expect(tuned).toBe(LAMP.replace("rate 0.5 N/mm", `rate ${Number((k / 1000).toPrecision(4))} N/mm`));
  }, 60000);

  it("is offered inside a spring that has a tune line, with no diagnostic", async () => {
    const at = LAMP.indexOf("tune rate");
    const line = LAMP.slice(0, at).split("\n").length - 1;
    const actions = (await session.connection.sendRequest(CodeActionRequest.type, {
      textDocument: { uri },
      range: { start: { line, character: 6 }, end: { line, character: 6 } },
      context: { diagnostics: [] },
    })) as CodeAction[];
    expect(actions.map((a) => a.title)).toContain(TUNE_FIX_TITLE);
  });

  it("stops when the request is cancelled and writes nothing", async () => {
    const before = edits.length;
    const source = new CancellationTokenSource();
    // Cancelled as soon as the search reports progress: it is running in the worker then.
    const reported = new Promise<void>((resolve) =>
      session.connection.onNotification("$/progress", (p: { token: string; value: { kind: string } }) => {
        if (p.token === "tune-2" && p.value.kind === "report") resolve();
      }),
    );
    const pending = session.connection.sendRequest(
      ExecuteCommandRequest.type,
      { command: TUNE_COMMAND, arguments: [uri], workDoneToken: "tune-2" },
      source.token,
    );
    await reported;
    source.cancel();
    const answer = (await pending) as TuneCommandResult;
    expect(answer.applied).toBe(false);
    expect(answer.message).toBe("Tuning cancelled.");
    expect(edits.length).toBe(before);
  }, 60000);
});
