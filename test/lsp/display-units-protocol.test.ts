// The `displayUnits` setting through a real protocol connection: "auto" (the default) shows a spec
// written in inches in US units, messages and hovers alike; "si" shows the same spec in SI,
// messages included, and a setting changed while the spec is open re-writes its messages.
import { afterEach, beforeAll, describe, expect, it } from "vitest";
import {
  DidChangeConfigurationNotification,
  HoverRequest,
  type Hover,
  type MarkupContent,
  type PublishDiagnosticsParams,
} from "vscode-languageserver-protocol/node";
import { ProtocolSession, ensureBuilt, positionOf } from "./protocol-client";
import { INCH_TEXT } from "../units/inch-boom";

// Exact definitions (NIST SP 811, appendix B): 1 in = 0.0254 m, 1 lb = 0.45359237 kg,
// 1 lbf = 0.45359237 kg x 9.80665 m/s^2.
const LBF_N = 0.45359237 * 9.80665;
// Pivoting link with a zero-free-length spring (Streit and Gilmore 1989; docs/formulas.md): the
// hand force is (m g l - k a b) / l at theta = 0: (2 lbf x 16 in - 3 lbf/in x 2 in x 4 in) / 16 in.
const HAND_FORCE_LBF = (2 * 16 - 3 * 2 * 4) / 16;

const URI = "file:///boom-in-inches.poise";
let session: ProtocolSession | undefined;

beforeAll(() => ensureBuilt());
afterEach(async () => {
  await session?.stop();
  session = undefined;
});

function balanceMessage(p: PublishDiagnosticsParams): string | undefined {
  const m = p.diagnostics.find((d) => d.code === "balance.unbalanced")?.message;
  return typeof m === "string" ? m : m?.value;
}

async function hoverOn(s: ProtocolSession, word: string): Promise<string> {
  const h = (await s.connection.sendRequest(HoverRequest.type, {
    textDocument: { uri: URI },
    position: positionOf(INCH_TEXT, word),
  })) as Hover | null;
  return h ? (h.contents as MarkupContent).value : "";
}

describe("displayUnits", () => {
  it('"auto" (the default) shows an inch spec in lbf, messages and hovers alike', async () => {
    session = new ProtocolSession({ diagnosticsDelayMs: 10 });
    await session.initialize();
    const published = await session.open(URI, INCH_TEXT);
    const message = balanceMessage(published);
    expect(message, JSON.stringify(published.diagnostics)).toBeDefined();
    expect(Number(/takes ([\d.]+) lbf/.exec(message!)?.[1])).toBeCloseTo(HAND_FORCE_LBF, 3);
    expect(await hoverOn(session, "lift {")).toMatch(/\d lbf\b/);
  });

  it('"si" shows the same spec in newtons, its messages included', async () => {
    session = new ProtocolSession({ diagnosticsDelayMs: 10, displayUnits: "si" });
    await session.initialize();
    const published = session.diagnosticsWhere(URI, (p) => /takes [\d.]+ N\b/.test(balanceMessage(p) ?? ""));
    await session.open(URI, INCH_TEXT);
    const message = balanceMessage(await published)!;
    // The same force in newtons, to the figures shown.
    expect(Number(/takes ([\d.]+) N\b/.exec(message)![1])).toBeCloseTo(HAND_FORCE_LBF * LBF_N, 2);
    const hover = await hoverOn(session, "lift {");
    expect(hover).toMatch(/\d N\b/);
    expect(hover).not.toMatch(/\d lbf\b/);
  });

  it("a setting changed while the spec is open re-writes its messages", async () => {
    session = new ProtocolSession({ diagnosticsDelayMs: 10 });
    await session.initialize();
    expect(balanceMessage(await session.open(URI, INCH_TEXT))).toMatch(/lbf/);
    const rewritten = session.diagnosticsWhere(URI, (p) => /takes [\d.]+ N\b/.test(balanceMessage(p) ?? ""));
    await session.connection.sendNotification(DidChangeConfigurationNotification.type, {
      settings: { counterpoise: { displayUnits: "si" } },
    });
    expect(balanceMessage(await rewritten)).toMatch(/takes [\d.]+ N\b/);
  });
});
