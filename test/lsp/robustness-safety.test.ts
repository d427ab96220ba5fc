// Safety of the server and the pages it makes: no code from a document is ever run, the server
// reads no file beyond its own bundle (checked by running it under Node's permission model, which
// refuses every other file read, every child process and every write), and generated HTML carries
// a strict content-security policy.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { existsSync, readFileSync, readdirSync, statSync, mkdtempSync, rmSync } from "node:fs";
import { join, relative } from "node:path";
import { tmpdir } from "node:os";
import { spawnSync } from "node:child_process";
import { ServerSession } from "../fuzz/lsp-client";

const root = join(__dirname, "..", "..");
const dist = join(root, "dist");
const serverPath = join(dist, "server.js");

function sourceFiles(dir: string): string[] {
  if (!existsSync(dir)) return [];
  return readdirSync(dir).flatMap((f) => {
    const p = join(dir, f);
    return statSync(p).isDirectory() ? sourceFiles(p) : p.endsWith(".ts") ? [p] : [];
  });
}

/** Code without its comments and string contents, so a comment saying "no eval" is not a hit. */
function codeOnly(text: string): string {
  return text.replace(/\/\*[\s\S]*?\*\//g, "").replace(/\/\/[^\n]*/g, "");
}

const serverSources = sourceFiles(join(root, "server", "src"));
const clientSources = sourceFiles(join(root, "client", "src"));

describe("nothing in a document is ever run", () => {
  // The constructs that turn a string into running code or a process.
  const forbidden: [RegExp, string][] = [
    [/\beval\s*\(/, "eval"],
    [/\bnew\s+Function\s*\(/, "new Function"],
    [/(?<![.\w])Function\s*\(/, "Function()"],
    [/(from\s+|require\s*\(\s*|import\s*\(\s*)["'](node:)?child_process["']/, "child_process"],
    [/(from\s+|require\s*\(\s*|import\s*\(\s*)["'](node:)?vm["']/, "vm"],
    [
      /(from\s+|require\s*\(\s*|import\s*\(\s*)["'](node:)?(net|http|https|http2|dgram|tls)["']/,
      "network module",
    ],
    [/\bimport\s*\(\s*[^"'\s)]/, "import() of a computed name"],
    [/\brequire\s*\(\s*[^"'\s)]/, "require() of a computed name"],
    [/setTimeout\s*\(\s*["'`]/, "setTimeout with a string"],
  ];
  it("no eval, Function, child process, vm or network module anywhere in the server or the client", () => {
    const hits: string[] = [];
    for (const file of [...serverSources, ...clientSources]) {
      const code = codeOnly(readFileSync(file, "utf8"));
      for (const [re, what] of forbidden) if (re.test(code)) hits.push(`${relative(root, file)}: ${what}`);
    }
    expect(hits).toEqual([]);
    expect(serverSources.length).toBeGreaterThan(10);
  });

  it("the core (syntax to checks, analysis.ts) and the view layer import no Node module at all", () => {
    const core = serverSources.filter((f) =>
      /server\/src\/(syntax|units|model|mechanics|checks|view)\/|server\/src\/analysis\.ts$/.test(f),
    );
    const hits = core
      .filter((f) => /from\s+["'](node:|fs["']|path["']|os["'])/.test(codeOnly(readFileSync(f, "utf8"))))
      .map((f) => relative(root, f));
    expect(hits).toEqual([]);
  });

  it("the language server touches the file system only to find its own worker bundle", () => {
    const lsp = serverSources.filter((f) => f.includes("/server/src/lsp/"));
    const uses: string[] = [];
    for (const f of lsp) {
      const code = codeOnly(readFileSync(f, "utf8"));
      const m = /import\s*\{([^}]*)\}\s*from\s*["'](?:node:)?fs(?:\/promises)?["']/.exec(code);
      if (m)
        for (const name of m[1]!
          .split(",")
          .map((s) => s.trim())
          .filter(Boolean))
          if (name !== "existsSync") uses.push(`${relative(root, f)}: ${name}`);
      if (/import\s+\*\s+as\s+\w+\s+from\s*["'](?:node:)?fs/.test(code))
        uses.push(`${relative(root, f)}: fs namespace`);
    }
    expect(uses).toEqual([]);
  });
});

describe("the server under Node's permission model (reads only its bundle folder, no processes)", () => {
  let session: ServerSession;
  let scratch: string;

  beforeAll(async () => {
    if (!existsSync(serverPath)) {
      const r = spawnSync(process.execPath, [join(root, "scripts", "build.mjs")], {
        cwd: root,
        encoding: "utf8",
      });
      if (r.status !== 0) throw new Error(`build failed: ${r.stderr}`);
    }
    scratch = mkdtempSync(join(tmpdir(), "poise-safety-"));
    session = new ServerSession({
      serverPath,
      // Reads: the bundle folder only. Workers: the analysis worker. No child processes, no writes.
      nodeArgs: ["--experimental-permission", `--allow-fs-read=${dist}/*`, "--allow-worker", "--no-warnings"],
      settings: { diagnosticsDelayMs: 0 },
      cwd: scratch,
    });
    await session.initialize();
  }, 60_000);

  afterAll(async () => {
    await session?.stop();
    if (scratch) rmSync(scratch, { recursive: true, force: true });
  });

  it("analyses the samples and answers hovers with every other file read refused", async () => {
    let version = 1;
    for (const f of readdirSync(join(root, "samples")).filter((n) => n.endsWith(".poise"))) {
      const uri = `file://${join(root, "samples", f)}`;
      await session.open(uri, readFileSync(join(root, "samples", f), "utf8"), version);
      const published = await session.waitForDiagnostics(uri, version, 20_000);
      expect(published, `${f}: no diagnostics`).toBeDefined();
      await session
        .request("textDocument/hover", { textDocument: { uri }, position: { line: 5, character: 4 } })
        .catch((e: unknown) => e);
      version++;
    }
    expect(session.errorLogs.filter((l) => /ERR_ACCESS_DENIED|permission/i.test(l))).toEqual([]);
    expect(session.stderr.join("")).not.toMatch(/ERR_ACCESS_DENIED/);
    expect(session.alive).toBe(true);
  }, 120_000);

  it("a document full of paths and code runs none of it and opens none of it", async () => {
    const marker = join(scratch, "ran");
    const hostile = [
      `arm "\`); require('child_process').execSync('touch ${marker}'); (\`" {`,
      `  material ${"__proto__"} { density 1 g/cm^3; modulus 1 GPa; strength 1 MPa }`,
      "  base constructor { point p (0 mm, 0 mm) }",
      "  link toString { length 100 mm; mass 1 g; material ../../../../etc/passwd }",
      `  joint j { connects constructor.p to toString.start; angle 0 deg; range -1 deg .. 1 deg }`,
      `  payload p { mass 1 g; at toString.end }`,
      `  include "/etc/passwd"`,
      `  sweep { steps 3 }`,
      "}",
      `# \${process.exit(1)} {{constructor.constructor('return process')().exit()}}`,
      "",
    ].join("\n");
    const uri = "file:///hostile/etc-passwd.poise";
    await session.open(uri, hostile, 1);
    const published = await session.waitForDiagnostics(uri, 1, 20_000);
    expect(published).toBeDefined();
    for (const line of [0, 3, 6])
      await session
        .request("textDocument/hover", { textDocument: { uri }, position: { line, character: 10 } })
        .catch((e: unknown) => e);
    expect(existsSync(marker)).toBe(false);
    expect(session.errorLogs.filter((l) => /ERR_ACCESS_DENIED|permission/i.test(l))).toEqual([]);
    expect(session.alive).toBe(true);
  }, 60_000);
});

describe("generated HTML has a strict content-security policy", () => {
  it("the report page: nothing loads from anywhere, no script runs", async () => {
    const reportModule = join(root, "server", "src", "cli", "report.ts");
    if (!existsSync(reportModule)) return expect.fail("server/src/cli/report.ts is missing");
    const { reportHtml } = (await import("../../server/src/cli/report")) as {
      reportHtml: (text: string, file: string) => { html: string };
    };
    const text = readFileSync(join(root, "samples", "camera-arm.poise"), "utf8");
    const { html } = reportHtml(text, "samples/camera-arm.poise");
    const csp = /<meta\s+http-equiv="Content-Security-Policy"\s+content="([^"]+)"/i.exec(html)?.[1];
    expect(csp, "no CSP meta tag").toBeDefined();
    const directives = Object.fromEntries(
      csp!
        .split(";")
        .map((d) => d.trim().split(/\s+/))
        .filter((d) => d[0])
        .map(([k, ...v]) => [k!, v]),
    );
    // W3C Content Security Policy Level 3: default-src 'none' blocks every fetch not allowed below.
    expect(directives["default-src"]).toEqual(["'none'"]);
    expect(csp).not.toMatch(/unsafe-eval|\*|https?:/);
    const scriptSrc = directives["script-src"];
    if (scriptSrc) expect(scriptSrc.every((s) => /^'nonce-|^'sha(256|384|512)-/.test(s))).toBe(true);
    // Nothing external in the page itself.
    expect(html).not.toMatch(/<(script|link|iframe|img)[^>]+(src|href)="(https?:)?\/\//i);
  });

  it("the report page shows a hostile title and unknown words as text, never as markup", async () => {
    const { reportHtml } = (await import("../../server/src/cli/report")) as {
      reportHtml: (text: string, file: string) => { html: string };
    };
    const hostile = readFileSync(join(root, "samples", "camera-arm.poise"), "utf8")
      .replace(/arm "[^"]*"/, 'arm "<img src=x onerror=alert(1)><script>alert(2)</script>"')
      .replace("mass 600 g", "mass 600 <b>g</b>");
    const { html } = reportHtml(hostile, "samples/<svg onload=alert(3)>.poise");
    expect(html).not.toMatch(/<img src=x|<script>alert|<svg onload|<b>g<\/b>/);
    expect(html).toMatch(/&lt;img src=x/);
  });

  it("the preview's page shell: default-src 'none', the script only by its nonce, a fresh nonce each time", async () => {
    const { previewHtml, makeNonce } = (await import("../../client/src/preview-html")) as {
      previewHtml: (p: { cspSource: string; nonce: string; scriptUri: string; styleUri: string }) => string;
      makeNonce: () => string;
    };
    const nonce = makeNonce();
    const html = previewHtml({
      cspSource: "vscode-resource:",
      nonce,
      scriptUri: "vscode-resource:/dist/preview-page.js",
      styleUri: "vscode-resource:/media/preview.css",
    });
    const csp = /<meta\s+http-equiv="Content-Security-Policy"\s+content="([^"]+)"/i.exec(html)?.[1] ?? "";
    const directives = Object.fromEntries(
      csp
        .split(";")
        .map((d) => d.trim().split(/\s+/))
        .filter((d) => d[0])
        .map(([k, ...v]) => [k!, v]),
    );
    // W3C Content Security Policy Level 3: default-src 'none', scripts by nonce only, nothing inline or evaluated.
    expect(directives["default-src"]).toEqual(["'none'"]);
    expect(directives["script-src"]).toEqual([`'nonce-${nonce}'`]);
    expect(csp).not.toMatch(/unsafe-inline|unsafe-eval|\*|https?:/);
    for (const tag of html.match(/<script\b[^>]*>/g) ?? []) expect(tag).toContain(`nonce="${nonce}"`);
    expect(nonce.length).toBeGreaterThanOrEqual(32);
    expect(makeNonce()).not.toBe(nonce);
  });

  it("every page the extension or the view layer builds declares default-src 'none' and scripts only by nonce", () => {
    const viewSources = serverSources.filter(
      (f) => f.includes("/server/src/view/") || f.includes("/server/src/lsp/"),
    );
    const pages = [...clientSources, ...viewSources].filter((f) =>
      /<html|<!DOCTYPE/i.test(readFileSync(f, "utf8")),
    );
    for (const f of pages) {
      const code = readFileSync(f, "utf8");
      expect(code, relative(root, f)).toMatch(/Content-Security-Policy/);
      expect(code, relative(root, f)).toMatch(/default-src 'none'/);
      expect(code, relative(root, f)).not.toMatch(/unsafe-eval/);
      expect(code, relative(root, f)).not.toMatch(/script-src[^;"]*'unsafe-inline'/);
    }
    // Once the extension shows a webview, its page must be among those checked.
    const showsWebview = clientSources.some((f) =>
      /createWebviewPanel|\.webview\.html\s*=/.test(readFileSync(f, "utf8")),
    );
    if (showsWebview)
      expect(pages.length, "a webview is shown but no page with a CSP was found").toBeGreaterThan(0);
  });
});
