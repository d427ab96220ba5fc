// Quick fixes and the preview request through the real server over stdio: ask for the code
// actions of a diagnostic, apply the edit, and check that the diagnostic goes away.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import {
  CodeActionRequest,
  type CodeAction,
  type Diagnostic,
  type PublishDiagnosticsParams,
} from "vscode-languageserver-protocol/node";
import { TextDocument } from "vscode-languageserver-textdocument";
import { ProtocolSession, ROOT, ensureBuilt } from "./protocol-client";
import { ARM_VIEW_REQUEST, type ArmViewResult } from "../../server/src/lsp/preview-protocol";
import { PENDULUM_TEXT } from "../view/pendulum-fixture";

let session: ProtocolSession;

beforeAll(async () => {
  ensureBuilt();
  session = new ProtocolSession({ stepsWhileTyping: 0, diagnosticsDelayMs: 10 });
  await session.initialize();
}, 120000);

afterAll(async () => {
  await session?.stop();
});

async function actionsFor(uri: string, diagnostic: Diagnostic): Promise<CodeAction[]> {
  const result = await session.connection.sendRequest(CodeActionRequest.type, {
    textDocument: { uri },
    range: diagnostic.range,
    context: { diagnostics: [diagnostic], only: ["quickfix"] },
  });
  return (result ?? []) as CodeAction[];
}

function applied(uri: string, text: string, action: CodeAction): string {
  const edits = action.edit?.changes?.[uri] ?? [];
  return TextDocument.applyEdits(TextDocument.create(uri, "counterpoise", 1, text), edits);
}

const codes = (p: PublishDiagnosticsParams) => p.diagnostics.map((d) => d.code);

describe("balance quick fix over the protocol", () => {
  const uri = "file:///work/unbalanced-pendulum.poise";
  let first: PublishDiagnosticsParams;

  it("an unbalanced arm gets the balance diagnostic and a fix that names both hand forces", async () => {
    first = await session.open(uri, PENDULUM_TEXT, 1);
    const balance = first.diagnostics.find((d) => d.code === "balance.unbalanced");
    expect(balance, `diagnostics: ${codes(first).join(", ")}`).toBeDefined();
    const actions = await actionsFor(uri, balance!);
    const fix = actions.find((a) => a.title.startsWith("Set lift's rate"));
    expect(fix, actions.map((a) => a.title).join(" | ")).toBeDefined();
    expect(fix!.title).toMatch(/worst hand force [\d.]+ N → [\d.]+ N/);
    const edited = applied(uri, PENDULUM_TEXT, fix!);
    const after = await session.replace(uri, edited, 2);
    expect(codes(after)).not.toContain("balance.unbalanced");
  });

  it("answers the preview's request with a drawable view model", async () => {
    const vm = await session.connection.sendRequest<ArmViewResult>(ARM_VIEW_REQUEST, { uri });
    expect(vm).not.toBeNull();
    expect(vm!.poses.length).toBeGreaterThan(2);
    expect(vm!.bodies.map((b) => b.id)).toContain("boom");
    expect(vm!.dofs.map((d) => d.id)).toEqual(["shoulder"]);
  });
});

describe("balance quick fix on the unbalanced sample", () => {
  const uri = "file:///work/engraver-arm.poise";
  const text = readFileSync(join(ROOT, "samples", "engraver-arm.poise"), "utf8");

  it("the engraver arm's too-strong cable: the fix on its spring makes the arm balance", async () => {
    const published = await session.open(uri, text, 1);
    const balance = published.diagnostics.find((d) => d.code === "balance.unbalanced");
    expect(balance, `diagnostics: ${codes(published).join(", ")}`).toBeDefined();
    const fix = (await actionsFor(uri, balance!)).find((a) => a.title.startsWith("Set inner_lift's rate"));
    expect(fix).toBeDefined();
    const edited = applied(uri, text, fix!);
    expect(edited).not.toEqual(text);
    const after = await session.replace(uri, edited, 2);
    expect(codes(after)).not.toContain("balance.unbalanced");
    expect(after.diagnostics.filter((d) => d.severity === 1)).toHaveLength(0);
  });
});

describe("pin quick fix over the protocol", () => {
  const uri = "file:///work/weak-pin.poise";
  const text = PENDULUM_TEXT.replace(
    "  base post {",
    "  material soft_pin {\n    density 1.2 g/cm^3\n    modulus 1 GPa\n    strength 5 MPa\n  }\n  base post {",
  ).replace("pin 3 mm steel_1018", "pin 2 mm soft_pin");

  it("widens the pin and its strength diagnostic goes", async () => {
    const published = await session.open(uri, text, 1);
    const pin = published.diagnostics.find(
      (d) => d.code === "strength.overstress" && String(d.message).includes("pin"),
    );
    expect(pin, `diagnostics: ${codes(published).join(", ")}`).toBeDefined();
    const fix = (await actionsFor(uri, pin!)).find((a) => a.title.startsWith("Widen shoulder's pin"));
    expect(fix).toBeDefined();
    const after = await session.replace(uri, applied(uri, text, fix!), 2);
    expect(
      after.diagnostics.filter((d) => d.code === "strength.overstress" && String(d.message).includes("pin")),
    ).toHaveLength(0);
  });
});

describe("missing unit quick fix over the protocol", () => {
  const uri = "file:///work/mistakes.poise";
  const text = readFileSync(join(ROOT, "samples", "mistakes.poise"), "utf8");

  it("adds the usual unit and the diagnostic goes", async () => {
    const published = await session.open(uri, text, 1);
    const missing = published.diagnostics.find((d) => d.code === "unit.missing");
    expect(missing, `diagnostics: ${codes(published).join(", ")}`).toBeDefined();
    const fix = (await actionsFor(uri, missing!)).find((a) => a.title.startsWith("Add the unit"));
    expect(fix).toBeDefined();
    const edited = applied(uri, text, fix!);
    expect(edited).toContain("length 250 mm");
    const after = await session.replace(uri, edited, 2);
    expect(after.diagnostics.filter((d) => d.code === "unit.missing")).toHaveLength(0);
  });

  it("replaces an unknown name by the suggestion", async () => {
    const now = await session.diagnosticsFor(uri, 2);
    const unknown = now.diagnostics.find(
      (d) => d.code === "name.unknown" && String(d.message).includes("plaa"),
    );
    expect(
      unknown,
      `diagnostics: ${now.diagnostics.map((d) => `${d.code}: ${d.message}`).join(" | ")}`,
    ).toBeDefined();
    const fix = (await actionsFor(uri, unknown!)).find((a) => a.title.includes("pla"));
    expect(fix).toBeDefined();
  });
});
