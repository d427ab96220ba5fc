// The bundled language server driven over stdio by a real protocol client: every feature it
// announces answers on a sample, diagnostics follow edits, and bad input never silences it.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import {
  HoverRequest,
  DefinitionRequest,
  ReferencesRequest,
  CompletionRequest,
  PrepareRenameRequest,
  RenameRequest,
  DocumentSymbolRequest,
  FoldingRangeRequest,
  DocumentFormattingRequest,
  SemanticTokensRequest,
  InlayHintRequest,
  type CompletionItem,
  type CompletionList,
  type DocumentSymbol,
  type Hover,
  type Location,
  type MarkupContent,
  type TextEdit,
  type WorkspaceEdit,
} from "vscode-languageserver-protocol/node";
import { TextDocument } from "vscode-languageserver-textdocument";
import { ProtocolSession, ROOT, ensureBuilt, positionOf } from "./protocol-client";
import { INCH_M } from "../../server/src/units/unit-table";
import { SPEC_SUMMARY_NOTIFICATION, type SpecSummary } from "../../server/src/lsp/custom-protocol";
import { poise } from "../cli/run-cli";
import { CODES } from "../../server/src/findings/codes";

const CAMERA = readFileSync(join(ROOT, "samples", "camera-arm.poise"), "utf8");
/** The stage's `length N mm` as the sample has it, and its number. */
const LENGTH = /length (\d+) mm/.exec(CAMERA)!;
const LENGTH_MM = Number(LENGTH[1]);
const uri = "file:///work/camera-arm.poise";
const doc = { textDocument: { uri } };

let session: ProtocolSession;

beforeAll(async () => {
  ensureBuilt();
  session = new ProtocolSession({ stepsWhileTyping: 5, diagnosticsDelayMs: 20 });
  const init = await session.initialize();
  expect(init.serverInfo?.name).toBe("counterpoise");
});

afterAll(async () => {
  const code = await session.stop();
  expect(code).toBe(0);
});

function hoverText(h: Hover | null): string {
  return h ? (h.contents as MarkupContent).value : "";
}

function labels(c: CompletionList | CompletionItem[] | null): string[] {
  const items = Array.isArray(c) ? c : (c?.items ?? []);
  return items.map((i) => i.label);
}

function apply(text: string, edits: TextEdit[]): string {
  return TextDocument.applyEdits(TextDocument.create(uri, "counterpoise", 0, text), edits);
}

describe("a sample over the protocol", () => {
  it("announces the features it serves", async () => {
    const fresh = new ProtocolSession();
    const init = await fresh.initialize();
    const caps = init.capabilities;
    expect(caps.hoverProvider).toBeTruthy();
    expect(caps.definitionProvider).toBeTruthy();
    expect(caps.referencesProvider).toBeTruthy();
    expect(caps.renameProvider).toEqual({ prepareProvider: true });
    expect(caps.completionProvider).toBeTruthy();
    expect(caps.documentSymbolProvider).toBeTruthy();
    expect(caps.foldingRangeProvider).toBeTruthy();
    expect(caps.documentFormattingProvider).toBeTruthy();
    expect(caps.semanticTokensProvider?.legend.tokenTypes).toContain("unit");
    expect(caps.inlayHintProvider).toBeTruthy();
    expect(await fresh.stop()).toBe(0);
  });

  it("publishes the sample's diagnostics on open, each with code, source and data", async () => {
    const published = await session.open(uri, CAMERA);
    expect(published.version).toBe(1);
    for (const d of published.diagnostics) {
      expect(d.source).toBe("counterpoise");
      expect(typeof d.code).toBe("string");
      expect((d.data as { code: string }).code).toBe(d.code);
    }
    // The camera sample is written to be free of syntax errors.
    expect(published.diagnostics.filter((d) => d.code === "syntax.error")).toEqual([]);
  });

  it("hovers a quantity with its value in the other unit system", async () => {
    const h = await session.connection.sendRequest(HoverRequest.type, {
      ...doc,
      position: positionOf(CAMERA, LENGTH[0], "length ".length + 1),
    });
    // 1 in = 0.0254 m exactly (NIST SP 811, 2008, B.8): e.g. 350 mm = 13.78 in to 4 figures.
    expect(hoverText(h)).toContain(`${Number((LENGTH_MM / 1000 / INCH_M).toPrecision(4))} in`);
  });

  it("hovers a name with what it is", async () => {
    const h = await session.connection.sendRequest(HoverRequest.type, {
      ...doc,
      position: positionOf(CAMERA, "spring lift", 8),
    });
    expect(hoverText(h)).toMatch(/\*\*lift\*\* — spring/);
    // The figures that matter lead, in the first few lines; the spring's settings and the rest
    // follow under "More", so the hover answers without scrolling.
    const [lead, more] = hoverText(h).split("**More**");
    expect(lead).toMatch(/force range: /);
    expect(lead!.trim().split("\n").length).toBeLessThanOrEqual(10);
    expect(more).toMatch(/extension spring · rate /);
    const p = await session.connection.sendRequest(HoverRequest.type, {
      ...doc,
      position: positionOf(CAMERA, "reach.head(30", 7),
    });
    expect(hoverText(p)).toMatch(/reach\.head\*\* — parallelogram head/);
  });

  it("goes from a generated body's prefix to its parallelogram", async () => {
    const def = (await session.connection.sendRequest(DefinitionRequest.type, {
      ...doc,
      position: positionOf(CAMERA, "reach.lower(100", 1),
    })) as Location | null;
    expect(def?.range.start).toEqual(positionOf(CAMERA, "parallelogram reach", "parallelogram ".length));
    const point = (await session.connection.sendRequest(DefinitionRequest.type, {
      ...doc,
      position: positionOf(CAMERA, "bench_clamp.anchor", "bench_clamp.".length + 2),
    })) as Location | null;
    expect(point?.range.start).toEqual(positionOf(CAMERA, "point anchor", "point ".length));
  });

  it("finds every reference of the base", async () => {
    const refs =
      (await session.connection.sendRequest(ReferencesRequest.type, {
        ...doc,
        position: positionOf(CAMERA, "base bench_clamp", 6),
        context: { includeDeclaration: true },
      })) ?? [];
    const occurrences = CAMERA.split("bench_clamp").length - 1;
    expect(refs).toHaveLength(occurrences);
  });

  it("renames a parallelogram, prefixes of its bodies included", async () => {
    const position = positionOf(CAMERA, "parallelogram reach", "parallelogram ".length + 1);
    const prepared = await session.connection.sendRequest(PrepareRenameRequest.type, { ...doc, position });
    expect(prepared).toMatchObject({ placeholder: "reach" });
    const edit = (await session.connection.sendRequest(RenameRequest.type, {
      ...doc,
      position,
      newName: "stage",
    })) as WorkspaceEdit;
    const renamed = apply(CAMERA, edit.changes![uri]!);
    expect(renamed).toContain("parallelogram stage");
    expect(renamed).toContain("stage.lower(100 mm, 0 mm)");
    expect(renamed).toContain("stage.head(30 mm, -60 mm)");
    expect(renamed).not.toMatch(/\breach\b/);
    // A generated body cannot be renamed on its own.
    const lower = await session.connection.sendRequest(PrepareRenameRequest.type, {
      ...doc,
      position: positionOf(CAMERA, "reach.lower", "reach.".length + 1),
    });
    expect(lower).toBeNull();
  });

  it("completes what fits the position", async () => {
    const at = (needle: string, shift: number) =>
      session.connection.sendRequest(CompletionRequest.type, {
        ...doc,
        position: positionOf(CAMERA, needle, shift),
      });
    // Declaration keywords at the top of the arm.
    expect(labels(await at("  base bench_clamp", 2))).toEqual(
      expect.arrayContaining(["link", "joint", "spring", "payload", "require"]),
    );
    // Bodies after `between`.
    expect(labels(await at("between bench_clamp", "between ".length))).toEqual(
      expect.arrayContaining(["bench_clamp", "reach.lower", "reach.head"]),
    );
    // Points after `body.`.
    expect(labels(await at("bench_clamp.anchor and", "bench_clamp.".length))).toEqual(
      expect.arrayContaining(["pivot", "anchor"]),
    );
    // Stiffness units after the number of `rate`.
    const rate = /rate [\d.]+ /.exec(CAMERA)![0]; // e.g. `rate 0.27 `, as the sample has it
    expect(labels(await at(rate, rate.length))).toEqual(["N/mm", "N/m", "lbf/in"]);
    // An extension spring's properties not yet written, none of a gas strut's.
    const spring = labels(await at(`    ${rate}`, 4));
    expect(spring).toEqual(expect.arrayContaining(["wire", "coil", "coils", "material"]));
    expect(spring).not.toContain("progression");
    expect(spring).not.toContain("max_length");
  });

  it("outlines the arm and folds its declarations", async () => {
    const symbols = (await session.connection.sendRequest(
      DocumentSymbolRequest.type,
      doc,
    )) as DocumentSymbol[];
    expect(symbols[0]!.name).toBe("Overhead camera arm over a leather bench");
    expect(symbols[0]!.children!.map((s) => s.name)).toEqual([
      "bench_clamp",
      "reach",
      "lift",
      "camera",
      "require",
      "sweep",
    ]);
    const folds = (await session.connection.sendRequest(FoldingRangeRequest.type, doc)) ?? [];
    // The arm, six declarations and the two-line comment at the top.
    expect(folds.length).toBe(8);
  });

  it("colours the text with semantic tokens", async () => {
    const tokens = await session.connection.sendRequest(SemanticTokensRequest.type, doc);
    expect(tokens!.data.length % 5).toBe(0);
    // At least one token per number, unit and property key of the sample.
    expect(tokens!.data.length / 5).toBeGreaterThan(60);
  });

  it("formats to a layout that formatting leaves alone", async () => {
    const edits =
      (await session.connection.sendRequest(DocumentFormattingRequest.type, {
        ...doc,
        options: { tabSize: 2, insertSpaces: true },
      })) ?? [];
    const once = apply(CAMERA, edits);
    await session.replace(uri, once, 2);
    const again =
      (await session.connection.sendRequest(DocumentFormattingRequest.type, {
        ...doc,
        options: { tabSize: 2, insertSpaces: true },
      })) ?? [];
    expect(again).toEqual([]);
    await session.replace(uri, CAMERA, 3);
  });

  it("hints each part's least safety factor at its declaration, unless turned off", async () => {
    const range = { start: { line: 0, character: 0 }, end: { line: 60, character: 0 } };
    const hints = (await session.connection.sendRequest(InlayHintRequest.type, { ...doc, range })) ?? [];
    const onBase = hints.find((h) => h.position.line === positionOf(CAMERA, "base bench_clamp").line);
    expect(onBase?.label).toMatch(/^safety \d/);
    const quiet = new ProtocolSession({ inlayHints: false });
    await quiet.initialize();
    await quiet.open(uri, CAMERA);
    expect(await quiet.connection.sendRequest(InlayHintRequest.type, { ...doc, range })).toEqual([]);
    expect(await quiet.stop()).toBe(0);
  });

  it("sends the status-bar summary: the worst hand force is the sweep's largest", async () => {
    const u = "file:///work/summary.poise";
    const summary = new Promise<SpecSummary>((resolve) =>
      session.connection.onNotification(SPEC_SUMMARY_NOTIFICATION, (p: SpecSummary) => {
        if (p.uri === u) resolve(p);
      }),
    );
    await session.open(u, CAMERA);
    const s = await summary;
    const table = JSON.parse(poise("sweep", "samples/camera-arm.poise").stdout) as {
      poses: { hand_force: Record<string, number> }[];
    };
    const largest = Math.max(...table.poses.map((p) => p.hand_force.camera!));
    expect(s.worstHandForce?.payload).toBe("camera");
    // The sweep table rounds to 0.0001 N.
    expect(Math.abs(s.worstHandForce!.valueN - largest)).toBeLessThan(1e-4);
    expect(s.text).toContain("hand");
  });
});

describe("the sample full of mistakes", () => {
  const MISTAKES = readFileSync(join(ROOT, "samples", "mistakes.poise"), "utf8");
  const u = "file:///work/mistakes.poise";

  it("hovers a finding with what its code means", async () => {
    await session.open(u, MISTAKES);
    const h = await session.connection.sendRequest(HoverRequest.type, {
      textDocument: { uri: u },
      position: positionOf(MISTAKES, "plaa", 2),
    });
    expect(hoverText(h)).toContain(`\`name.unknown\` — ${CODES["name.unknown"].explanation}`);
  });

  it("hovers a part's name with the findings about it, found by their subject", async () => {
    const h = await session.connection.sendRequest(HoverRequest.type, {
      textDocument: { uri: u },
      position: positionOf(MISTAKES, "link boom", 6),
    });
    const text = hoverText(h);
    expect(text).toMatch(/\*\*boom\*\* — link/);
    expect(text).toMatch(/\*\*boom\*\* — link \(rigid bar\) — \d+ errors?/);
    expect(text).toContain(`- **${CODES["name.unknown"].words}** (error): unknown material \`plaa\``);
    expect(text).toContain(`- **${CODES["value.impossible"].words}** (error): `);
  });

  it("carries related places and the finding's detail in its diagnostics", async () => {
    const published = await session.diagnosticsFor(u, 1);
    const duplicate = published.diagnostics.find((d) => d.code === "name.duplicate");
    // The second `payload lamp` points back at the first.
    expect(duplicate?.range.start).toEqual(positionOf(MISTAKES, "payload lamp", 8, 1));
    expect(duplicate?.relatedInformation?.[0]?.location).toEqual({
      uri: u,
      range: expect.objectContaining({ start: positionOf(MISTAKES, "payload lamp", 8, 0) }),
    });
    const unknown = published.diagnostics.find((d) => d.code === "name.unknown");
    expect(unknown?.data).toMatchObject({ code: "name.unknown", detail: { suggestion: "pla" } });
  });

  it("refuses a rename onto a name already taken, and a name that is not one", async () => {
    const position = positionOf(MISTAKES, "link boom", 6);
    const taken = session.connection.sendRequest(RenameRequest.type, {
      textDocument: { uri: u },
      position,
      newName: "forearm",
    });
    await expect(taken).rejects.toThrow(/already a name/);
    const bad = session.connection.sendRequest(RenameRequest.type, {
      textDocument: { uri: u },
      position,
      newName: "2nd boom",
    });
    await expect(bad).rejects.toThrow(/cannot be a name/);
    const fine = (await session.connection.sendRequest(RenameRequest.type, {
      textDocument: { uri: u },
      position,
      newName: "upper_arm",
    })) as WorkspaceEdit;
    // `link boom`, `boom.start`, `boom.tip`, `boom(80 mm, 0 mm)`, `boom.end`: every `boom` but
    // the one in a comment.
    const outsideComments = MISTAKES.replace(/#.*$/gm, "");
    expect(fine.changes![u]).toHaveLength(outsideComments.split(/\bboom\b/).length - 1);
  });
});

describe("diagnostics follow the text", () => {
  const editUri = "file:///work/edit.poise";
  it("a broken unit brings a unit finding; the fix takes it away", async () => {
    const opened = await session.open(editUri, CAMERA);
    expect(opened.diagnostics.some((d) => String(d.code).startsWith("unit."))).toBe(false);
    const broken = await session.replace(editUri, CAMERA.replace(LENGTH[0], `${LENGTH[0]}m`), 2);
    const unit = broken.diagnostics.find((d) => d.code === "unit.unknown");
    expect(unit?.range.start).toEqual(positionOf(CAMERA, LENGTH[0], `length ${LENGTH_MM} `.length));
    const fixed = await session.replace(editUri, CAMERA, 3);
    expect(fixed.diagnostics.some((d) => d.code === "unit.unknown")).toBe(false);
  });

  it("a lost brace brings a syntax error; putting it back takes it away", async () => {
    const broken = await session.replace(
      editUri,
      CAMERA.replace("  sweep {\n    steps 37\n  }", "  sweep {\n    steps 37\n"),
      4,
    );
    expect(broken.diagnostics.some((d) => d.code === "syntax.error")).toBe(true);
    const fixed = await session.replace(editUri, CAMERA, 5);
    expect(fixed.diagnostics.some((d) => d.code === "syntax.error")).toBe(false);
  });

  it("publishes only the latest of a burst of edits", async () => {
    const burst = [6, 7, 8, 9, 10];
    for (const v of burst.slice(0, -1))
      void session.replace(editUri, CAMERA.replace(LENGTH[0], `length ${300 + v} mm`), v);
    const last = await session.replace(editUri, CAMERA, 10);
    expect(last.version).toBe(10);
  });
});

describe("bounded work", () => {
  const ENGRAVER = readFileSync(join(ROOT, "samples", "engraver-arm.poise"), "utf8");
  // Two degrees of freedom at 2001 steps each: the sweep is capped at 20,000 poses, seconds of work.
  const HEAVY = ENGRAVER.replace(/steps \d+/, "steps 2001");
  it("has a heavy spec to work on", () => expect(HEAVY).not.toBe(ENGRAVER));

  it("answers hover and completion while a heavy analysis runs, then drops it for the newer text", async () => {
    const u = "file:///work/heavy.poise";
    const order: string[] = [];
    const heavyDiagnostics = session.diagnosticsFor(u, 1).then(() => order.push("heavy diagnostics"));
    await session.connection.sendNotification("textDocument/didOpen", {
      textDocument: { uri: u, languageId: "counterpoise", version: 1, text: HEAVY },
    });
    const hover = await session.connection.sendRequest(HoverRequest.type, {
      textDocument: { uri: u },
      position: positionOf(HEAVY, "parallelogram inner", 15),
    });
    order.push("hover");
    expect(hoverText(hover)).toContain("inner");
    const completion = await session.connection.sendRequest(CompletionRequest.type, {
      textDocument: { uri: u },
      position: positionOf(HEAVY, "  base stand", 2),
    });
    order.push("completion");
    expect(labels(completion)).toContain("spring");
    // The text changes while the heavy run is under way: only the new text's diagnostics come.
    const light = await session.replace(u, ENGRAVER, 2);
    order.push("light diagnostics");
    expect(light.version).toBe(2);
    expect(light.diagnostics.some((d) => d.code === "sweep.capped")).toBe(false);
    expect(order.slice(0, 3)).toEqual(["hover", "completion", "light diagnostics"]);
    void heavyDiagnostics;
  });
});

describe("bad input never silences the server", () => {
  const cases: [string, string][] = [
    ["empty", ""],
    ["garbage", '}}}{{ ((( ;;; ... "unterminated\n\u0000\u0007 # \n arm arm arm {'],
    [
      "unicode",
      'arm "Bras d\'équilibre — 平衡臂 🦾" {\n  base Sockel { point oben (0 mm, 300 mm) }\n  link 腕 { length 300 mm }\n}\n',
    ],
    ["half-typed", 'arm "x" {\n  spring s {\n    between \n    rate 0.3 N/\n  link'],
  ];
  for (const [name, text] of cases) {
    it(`${name}: diagnostics arrive and requests answer`, async () => {
      const u = `file:///work/bad-${name}.poise`;
      const published = await session.open(u, text);
      expect(Array.isArray(published.diagnostics)).toBe(true);
      const lines = text.split("\n");
      const end = { line: lines.length - 1, character: lines[lines.length - 1]!.length };
      for (const position of [{ line: 0, character: 0 }, end, { line: 999, character: 999 }]) {
        await session.connection.sendRequest(HoverRequest.type, { textDocument: { uri: u }, position });
        await session.connection.sendRequest(CompletionRequest.type, { textDocument: { uri: u }, position });
        await session.connection.sendRequest(DefinitionRequest.type, { textDocument: { uri: u }, position });
      }
      await session.connection.sendRequest(DocumentSymbolRequest.type, { textDocument: { uri: u } });
      await session.connection.sendRequest(SemanticTokensRequest.type, { textDocument: { uri: u } });
      const edits =
        (await session.connection.sendRequest(DocumentFormattingRequest.type, {
          textDocument: { uri: u },
          options: { tabSize: 2, insertSpaces: true },
        })) ?? [];
      // Formatting keeps every word of even a broken text.
      expect(apply(text, edits).replace(/\s+/g, "")).toBe(text.replace(/\s+/g, ""));
    });
  }

  it("a 5,000-line spec is analysed and the server keeps answering", async () => {
    const links: string[] = [];
    for (let i = 0; links.length * 4 < 5000; i++)
      links.push(`  link l${i} {\n    length ${100 + (i % 50)} mm\n    mass 20 g\n  }\n`);
    const text = `arm "long" {\n  base b { point top (0 mm, 100 mm) }\n${links.join("")}}\n`;
    expect(text.split("\n").length).toBeGreaterThanOrEqual(5000);
    const u = "file:///work/long.poise";
    const published = await session.open(u, text);
    expect(Array.isArray(published.diagnostics)).toBe(true);
    const h = await session.connection.sendRequest(HoverRequest.type, {
      textDocument: { uri: u },
      position: positionOf(text, "link l900", 7),
    });
    expect(hoverText(h)).toContain("l900");
  });
});
