// The real server over stdio, fed fuzzed texts: it answers every request it announced at random
// positions (also past the end of a line or of the document), publishes diagnostics inside the
// document, logs no handler fault and stays alive.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import fc from "fast-check";
import { existsSync, readFileSync, readdirSync } from "node:fs";
import { join } from "node:path";
import { spawnSync } from "node:child_process";
import { TextDocument } from "vscode-languageserver-textdocument";
import { ServerSession, positionInDocument, protocolLines } from "../fuzz/lsp-client";
import { familyArbitrary, type FamilyName } from "../fuzz/campaign";
import { analyse } from "../../server/src/analysis";

const root = join(__dirname, "..", "..");
const serverPath = join(root, "dist", "server.js");
/** Texts sent to the server, spread over the families; each costs one analysis and a dozen requests. */
const CASES = Number(process.env.FUZZ_LSP_CASES ?? 120);
/** Waiting longer than this for a document's diagnostics means the server is stuck. Common
 * practice, no source: far above any analysis at 3 steps. */
const DIAGNOSTICS_TIMEOUT_MS = Number(process.env.FUZZ_LSP_TIMEOUT_MS ?? 10_000);
const SEED = 4242;
/** For investigating one fault while another is open: FUZZ_LSP_SKIP=textDocument/formatting,... */
const SKIPPED = new Set((process.env.FUZZ_LSP_SKIP ?? "").split(",").filter(Boolean));

const samples = readdirSync(join(root, "samples"))
  .filter((f) => f.endsWith(".poise"))
  .map((f) => readFileSync(join(root, "samples", f), "utf8"));

function ensureBuilt(): void {
  if (existsSync(serverPath) && !process.env.ROBUSTNESS_REBUILD) return;
  const r = spawnSync(process.execPath, [join(root, "scripts", "build.mjs")], {
    cwd: root,
    encoding: "utf8",
  });
  if (r.status !== 0) throw new Error(`build failed: ${r.stderr}`);
}

/** Every range-like object anywhere in a response. */
function rangesIn(
  value: unknown,
  out: { start: { line: number; character: number }; end: { line: number; character: number } }[] = [],
  depth = 0,
): typeof out {
  if (!value || typeof value !== "object" || depth > 12) return out;
  if (Array.isArray(value)) {
    for (const v of value) rangesIn(v, out, depth + 1);
    return out;
  }
  const o = value as Record<string, unknown>;
  const isPos = (p: unknown) =>
    !!p &&
    typeof p === "object" &&
    typeof (p as { line?: unknown }).line === "number" &&
    typeof (p as { character?: unknown }).character === "number";
  if (isPos(o.start) && isPos(o.end)) out.push(o as (typeof out)[number]);
  for (const v of Object.values(o)) rangesIn(v, out, depth + 1);
  return out;
}

interface Probe {
  method: string;
  capability: string;
  params: (uri: string, pos: { line: number; character: number }, lines: string[]) => unknown;
}

const whole = (lines: string[]) => ({
  start: { line: 0, character: 0 },
  end: { line: lines.length - 1, character: lines[lines.length - 1]!.length },
});

const PROBES: Probe[] = [
  {
    method: "textDocument/hover",
    capability: "hoverProvider",
    params: (uri, position) => ({ textDocument: { uri }, position }),
  },
  {
    method: "textDocument/completion",
    capability: "completionProvider",
    params: (uri, position) => ({ textDocument: { uri }, position }),
  },
  {
    method: "textDocument/definition",
    capability: "definitionProvider",
    params: (uri, position) => ({ textDocument: { uri }, position }),
  },
  {
    method: "textDocument/references",
    capability: "referencesProvider",
    params: (uri, position) => ({ textDocument: { uri }, position, context: { includeDeclaration: true } }),
  },
  {
    method: "textDocument/documentHighlight",
    capability: "documentHighlightProvider",
    params: (uri, position) => ({ textDocument: { uri }, position }),
  },
  {
    method: "textDocument/prepareRename",
    capability: "renameProvider",
    params: (uri, position) => ({ textDocument: { uri }, position }),
  },
  {
    method: "textDocument/rename",
    capability: "renameProvider",
    params: (uri, position) => ({ textDocument: { uri }, position, newName: "renamed_part" }),
  },
  {
    method: "textDocument/documentSymbol",
    capability: "documentSymbolProvider",
    params: (uri) => ({ textDocument: { uri } }),
  },
  {
    method: "textDocument/formatting",
    capability: "documentFormattingProvider",
    params: (uri) => ({ textDocument: { uri }, options: { tabSize: 2, insertSpaces: true } }),
  },
  {
    method: "textDocument/foldingRange",
    capability: "foldingRangeProvider",
    params: (uri) => ({ textDocument: { uri } }),
  },
  {
    method: "textDocument/semanticTokens/full",
    capability: "semanticTokensProvider",
    params: (uri) => ({ textDocument: { uri } }),
  },
  {
    method: "textDocument/inlayHint",
    capability: "inlayHintProvider",
    params: (uri, _p, lines) => ({ textDocument: { uri }, range: whole(lines) }),
  },
  {
    method: "textDocument/codeAction",
    capability: "codeActionProvider",
    params: (uri, position) => ({
      textDocument: { uri },
      range: { start: position, end: position },
      context: { diagnostics: [] },
    }),
  },
];

/** Positions to probe: mostly inside the text, some past a line's end or the last line. */
function positionsFor(text: string, seed: number): { line: number; character: number }[] {
  const lines = protocolLines(text);
  return fc.sample(
    fc.oneof(
      {
        weight: 5,
        arbitrary: fc
          .nat(lines.length - 1)
          .chain((line) => fc.record({ line: fc.constant(line), character: fc.nat(lines[line]!.length) })),
      },
      { weight: 1, arbitrary: fc.record({ line: fc.nat(lines.length + 3), character: fc.nat(400) }) },
    ),
    { seed, numRuns: 3 },
  );
}

/** Texts that broke editor features before, or easily could: every kind of line end and space
 * the protocol and JavaScript disagree about, NUL, lone surrogates, an empty document. */
const NASTY_TEXTS = [
  "",
  "\0",
  "\r",
  "\r\r\n\n",
  "\u2028",
  "a\u3000b",
  'arm "x" {\u2029}',
  "\ud800",
  'arm "\udfff" {',
  '\ufeffarm "x" {}',
  "\t\v\f{}",
  "😀".repeat(50),
];

/** Inputs recorded in test/fuzz/failures/ against the server (kind "lsp") and fixed since. */
function recordedLspTexts(): string[] {
  const dir = join(root, "test", "fuzz", "failures");
  return readdirSync(dir)
    .filter((f) => f.endsWith(".json"))
    .map(
      (f) =>
        JSON.parse(readFileSync(join(dir, f), "utf8")) as {
          kind?: string;
          open?: boolean;
          text: string;
          also?: string[];
        },
    )
    .filter((r) => r.kind === "lsp" && r.open !== true)
    .flatMap((r) => [r.text, ...(r.also ?? [])]);
}

let session: ServerSession;

beforeAll(async () => {
  ensureBuilt();
  session = new ServerSession({ serverPath, settings: { diagnosticsDelayMs: 0, stepsWhileTyping: 3 } });
  await session.initialize();
}, 60_000);

afterAll(async () => {
  await session?.stop();
});

describe("the server over stdio, on fuzzed texts", () => {
  it(`answers, publishes in-document diagnostics and stays alive for ${CASES} fuzzed texts and the nasty ones`, async () => {
    const families: FamilyName[] = ["valid", "nearly-valid", "byte-mutant", "junk"];
    const texts = [
      ...NASTY_TEXTS,
      ...recordedLspTexts(),
      ...families.flatMap((f, i) =>
        fc.sample(familyArbitrary(f, samples), {
          seed: SEED + i,
          numRuns: Math.ceil(CASES / families.length),
        }),
      ),
    ];
    const uri = "file:///fuzz/robustness.poise";
    const problems: string[] = [];
    let answered = 0;
    let publishedCount = 0;
    let version = 1;
    let mirror = TextDocument.create(uri, "counterpoise", version, texts[0]!);
    await session.open(uri, texts[0]!, version);

    cases: for (let k = 0; k < texts.length && problems.length < 10; k++) {
      const text = texts[k]!;
      if (k > 0) {
        version++;
        // Every other text arrives as an incremental edit of the previous one (as typing does).
        if (k % 2 === 0) {
          const range = { start: { line: 0, character: 0 }, end: mirror.positionAt(mirror.getText().length) };
          await session.edit(uri, version, range, text);
        } else await session.change(uri, version, text);
        mirror = TextDocument.update(mirror, [{ text }], version);
      }
      const lines = protocolLines(text);
      const published = await session.waitForDiagnostics(uri, version, DIAGNOSTICS_TIMEOUT_MS);
      const label = `text #${k} ${JSON.stringify(text.slice(0, 80))}`;
      if (!published) problems.push(`${label}: no diagnostics within ${DIAGNOSTICS_TIMEOUT_MS} ms`);
      else publishedCount++;
      for (const d of published?.diagnostics ?? []) {
        if (!positionInDocument(lines, d.range.start) || !positionInDocument(lines, d.range.end))
          problems.push(
            `${label}: diagnostic ${String(d.code)} at ${JSON.stringify(d.range)} lies outside the document`,
          );
      }
      for (const position of positionsFor(text, SEED + k)) {
        for (const probe of PROBES) {
          if (
            !(session.capabilities as Record<string, unknown>)[probe.capability] ||
            SKIPPED.has(probe.method)
          )
            continue;
          try {
            const result = await session.request<unknown>(
              probe.method,
              probe.params(uri, position, lines),
              DIAGNOSTICS_TIMEOUT_MS,
            );
            answered++;
            for (const r of rangesIn(result)) {
              if (!positionInDocument(lines, r.start) || !positionInDocument(lines, r.end))
                problems.push(
                  `${label}: ${probe.method} at ${JSON.stringify(position)} returned range ${JSON.stringify(r)} outside the document`,
                );
            }
          } catch (err) {
            const code = (err as { code?: number }).code;
            // A refusal (e.g. "cannot rename here") is an answer; an internal error or silence is not.
            if (code === undefined || code === -32603)
              problems.push(
                `${label}: ${probe.method} at ${JSON.stringify(position)}: ${String((err as Error).message)}`,
              );
            // Silence means the server is stuck: the rest would only time out too.
            if (code === undefined) break cases;
          }
        }
      }
      if (!session.alive) {
        problems.push(
          `${label}: the server exited (${JSON.stringify(session.exited)}); stderr: ${session.stderr.join("").slice(-2000)}`,
        );
        break;
      }
    }
    for (const log of session.errorLogs.slice(0, 5))
      problems.push(`server logged a fault: ${log.slice(0, 1500)}`);
    expect(problems, problems.join("\n\n")).toEqual([]);
    expect(session.alive).toBe(true);
    // Every text really went through: one publish each, and most requests answered.
    expect(publishedCount).toBe(texts.length);
    expect(answered).toBeGreaterThan(texts.length * 10);
    console.log(`robustness over stdio: ${texts.length} texts, ${answered} answers`);
  }, 240_000);

  it("typed from nothing in a burst of incremental edits, the last version's diagnostics are the core's", async () => {
    const uri = "file:///fuzz/typed.poise";
    const target = samples[0]!;
    let version = 1;
    let mirror = TextDocument.create(uri, "counterpoise", version, "");
    await session.open(uri, "", version);
    // Five characters per edit, sent without waiting, as fast typing or a paste in pieces does.
    for (let i = 0; i < target.length; i += 5) {
      version++;
      const at = mirror.positionAt(mirror.getText().length);
      const piece = target.slice(i, i + 5);
      await session.edit(uri, version, { start: at, end: at }, piece);
      mirror = TextDocument.update(mirror, [{ range: { start: at, end: at }, text: piece }], version);
    }
    expect(mirror.getText()).toBe(target);
    const published = await session.waitForDiagnostics(uri, version, 30_000);
    expect(published, "no diagnostics for the last version").toBeDefined();
    const shown = (published?.diagnostics ?? []).map((d) => `${String(d.code)} ${d.message}`).sort();
    // The server may answer with its quick while-typing pass or, after a pause, the full one.
    const core = [analyse(target, { quickSteps: 3 }), analyse(target)].map((a) =>
      a.findings
        .filter((f) => f.code !== "analysis.budget")
        .map((f) => `${f.code} ${f.message}`)
        .sort(),
    );
    expect(
      core.some(
        (c) => JSON.stringify(c) === JSON.stringify(shown.filter((x) => !x.startsWith("analysis.budget"))),
      ),
    ).toBe(true);
    expect(session.alive).toBe(true);
  }, 90_000);

  it("large documents: diagnostics within the timeout, every request answered, no fault", async () => {
    const big: Record<string, string> = {
      "500 copies of a sample": samples[0]!.repeat(500),
      "one 400 kB line": `arm "x" { ${"link a { length 1 mm } ".repeat(17_000)}}`,
      // Deeper nesting formats to a quadratic size: an open bug on file
      // (test/fuzz/failures/lsp-formatting-quadratic-indent.json).
      "2,000 open braces": "{".repeat(2000),
      "50,000 open parentheses": `arm "x" { base b { point p ${"(".repeat(50_000)} } }`,
    };
    const faultsBefore = session.errorLogs.length;
    for (const [name, text] of Object.entries(big)) {
      const uri = `file:///fuzz/big-${name.replace(/\W+/g, "-")}.poise`;
      await session.open(uri, text, 1);
      expect(await session.waitForDiagnostics(uri, 1, 30_000), `${name}: no diagnostics`).toBeDefined();
      const lines = protocolLines(text);
      for (const probe of PROBES) {
        if (!(session.capabilities as Record<string, unknown>)[probe.capability]) continue;
        const answer = await session
          .request(
            probe.method,
            probe.params(uri, { line: Math.min(3, lines.length - 1), character: 2 }, lines),
            30_000,
          )
          .catch((e: unknown) => e);
        expect((answer as { code?: number } | null)?.code, `${name}: ${probe.method}`).not.toBe(-32603);
        expect(answer instanceof Error ? answer.message : "", `${name}: ${probe.method}`).not.toMatch(
          /no answer/,
        );
      }
      await session.close(uri);
    }
    expect(session.errorLogs.slice(faultsBefore)).toEqual([]);
    expect(session.alive).toBe(true);
  }, 180_000);

  it("answers a request for a document it was never sent, and one for a closed document", async () => {
    const ghost = "file:///fuzz/never-opened.poise";
    for (const probe of PROBES) {
      if (!(session.capabilities as Record<string, unknown>)[probe.capability]) continue;
      try {
        await session.request(
          probe.method,
          probe.params(ghost, { line: 0, character: 0 }, [""]),
          DIAGNOSTICS_TIMEOUT_MS,
        );
      } catch (err) {
        expect((err as { code?: number }).code, `${probe.method}: ${String(err)}`).not.toBe(-32603);
        expect((err as { code?: number }).code, `${probe.method}: ${String(err)}`).toBeDefined();
      }
    }
    const uri = "file:///fuzz/closed.poise";
    await session.open(uri, samples[0]!, 1);
    await session.waitForDiagnostics(uri, 1, DIAGNOSTICS_TIMEOUT_MS);
    await session.close(uri);
    const hover = await session
      .request("textDocument/hover", { textDocument: { uri }, position: { line: 3, character: 5 } })
      .catch((e: unknown) => e);
    expect((hover as { code?: number } | null)?.code).not.toBe(-32603);
    expect(session.alive).toBe(true);
  }, 60_000);
});
