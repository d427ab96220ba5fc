// The layer rules of docs/architecture.md, enforced: the core (findings, syntax, units, model,
// mechanics, checks, view, services, analysis.ts, fixes.ts, limits.ts, stop.ts) imports no editor or
// protocol package and nothing that does IO; only server/src/lsp touches protocol types; and every
// import follows the page's per-folder "may import" table (read from the page itself), so an
// upward import fails here.
import { describe, expect, it } from "vitest";
import { existsSync, readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative, sep } from "node:path";
import { layerViolations, readLayerTable, resolveImport, rowOf, type ImportEdge } from "./layer-table";

const root = join(__dirname, "..");
const src = join(root, "server", "src");
const CORE_DIRS = ["findings", "syntax", "units", "model", "mechanics", "checks", "view", "services"];

/** Packages the core must not import: editor and protocol libraries, and Node's IO, process,
 * network and worker modules (the core takes a string and returns values). */
const FORBIDDEN_IN_CORE = [
  /^vscode($|-)/,
  /^vscode-languageserver/,
  /^vscode-languageclient/,
  /^vscode-jsonrpc/,
  /^(node:)?(fs|fs\/promises|child_process|net|http|https|http2|dgram|tls|worker_threads|cluster|os|process|readline|inspector|vm)$/,
];
const PROTOCOL = [/^vscode-languageserver/, /^vscode-jsonrpc/, /^vscode-languageclient/, /^vscode$/];

function filesUnder(dir: string): string[] {
  if (!existsSync(dir)) return [];
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? filesUnder(path) : path.endsWith(".ts") ? [path] : [];
  });
}

/** Every module specifier a file imports or re-exports, statically or dynamically, or requires. */
export function importsOf(source: string): string[] {
  const out: string[] = [];
  const patterns = [
    /\bimport\s+(?:type\s+)?(?:[\w*{}\s,]+\s+from\s+)?["']([^"']+)["']/g,
    /\bexport\s+(?:type\s+)?(?:\*|\{[^}]*\})\s*from\s*["']([^"']+)["']/g,
    /\bimport\s*\(\s*["']([^"']+)["']\s*\)/g,
    /\brequire\s*\(\s*["']([^"']+)["']\s*\)/g,
  ];
  for (const p of patterns) for (const m of source.matchAll(p)) out.push(m[1]!);
  return out;
}

// The core's own files at the top: analysis.ts and fixes.ts, and the limits and the cooperative stop it reads.
const coreFiles = [
  ...CORE_DIRS.flatMap((d) => filesUnder(join(src, d))),
  ...readdirSync(src)
    .filter((f) => f.endsWith(".ts"))
    .map((f) => join(src, f)),
];

describe("layer rules", () => {
  it("the import scanner sees every form of import", () => {
    const sample = `import a from "fs";\nimport type { B } from 'vscode';\nimport "node:net";\nexport * from "vscode-jsonrpc";\nconst c = await import("node:child_process");\nconst d = require("vscode-languageserver/node");`;
    expect(importsOf(sample)).toEqual([
      "fs",
      "vscode",
      "node:net",
      "vscode-jsonrpc",
      "node:child_process",
      "vscode-languageserver/node",
    ]);
  });

  it("finds the core's files", () => {
    expect(coreFiles.length).toBeGreaterThan(10);
  });

  for (const file of coreFiles) {
    it(`core file ${relative(root, file)} imports no editor, protocol or IO module`, () => {
      const bad = importsOf(readFileSync(file, "utf8")).filter((spec) =>
        FORBIDDEN_IN_CORE.some((re) => re.test(spec)),
      );
      expect(bad).toEqual([]);
    });
  }

  it("only server/src/lsp imports protocol packages among the server's folders", () => {
    const offenders = filesUnder(src)
      .filter((f) => !relative(src, f).startsWith("lsp"))
      .flatMap((f) =>
        importsOf(readFileSync(f, "utf8"))
          .filter((s) => PROTOCOL.some((re) => re.test(s)))
          .map((s) => `${relative(root, f)}: ${s}`),
      );
    expect(offenders).toEqual([]);
  });

  it("the client reaches the server only through its message declarations (lsp/*-protocol.ts)", () => {
    const clientFiles = filesUnder(join(root, "client", "src"));
    expect(clientFiles.length).toBeGreaterThan(0);
    const offenders = clientFiles.flatMap((f) =>
      importsOf(readFileSync(f, "utf8"))
        .filter((s) => s.includes("server/src/") && !/server\/src\/lsp\/[a-z-]+-protocol$/.test(s))
        .map((s) => `${relative(root, f)}: ${s}`),
    );
    expect(offenders).toEqual([]);
  });

  it("those message declarations import types only, so the client bundles no server code", () => {
    const declarations = filesUnder(join(src, "lsp")).filter((f) => f.endsWith("-protocol.ts"));
    expect(declarations.length).toBeGreaterThan(0);
    for (const f of declarations) {
      const valueImports = readFileSync(f, "utf8")
        .split("\n")
        .filter((l) => /^\s*import\s/.test(l) && !/^\s*import\s+type\s/.test(l));
      expect(valueImports, relative(root, f)).toEqual([]);
    }
  });

  it("the findings layer is a leaf: its files import only each other", () => {
    const files = filesUnder(join(src, "findings"));
    expect(files.length).toBeGreaterThan(0);
    const offenders = files.flatMap((f) =>
      importsOf(readFileSync(f, "utf8"))
        .filter((s) => !/^\.\/[a-z-]+$/.test(s))
        .map((s) => `${relative(root, f)}: ${s}`),
    );
    expect(offenders).toEqual([]);
  });

  it("the core reaches no shell folder (lsp, cli) and no client code", () => {
    const offenders = coreFiles.flatMap((f) =>
      importsOf(readFileSync(f, "utf8"))
        .filter((s) => /(^|\/)(lsp|cli)(\/|$)/.test(s) || s.includes("client/"))
        .map((s) => `${relative(root, f)}: ${s}`),
    );
    expect(offenders).toEqual([]);
  });
});

/** Path from the repository root with forward slashes. */
const repoPath = (file: string) => relative(root, file).split(sep).join("/");
const SRC = "server/src/";

/** Every import of every file under server/src: relative ones resolved (to a path under
 * server/src, or from the repository root when outside it), packages as written. */
function importGraph(): ImportEdge[] {
  const exists = (p: string) => existsSync(join(root, p)) && statSync(join(root, p)).isFile();
  return filesUnder(src).flatMap((file) => {
    const from = repoPath(file);
    return importsOf(readFileSync(file, "utf8")).map((spec) => {
      const to = spec.startsWith(".") ? resolveImport(from, spec, exists) : spec;
      return { from: from.slice(SRC.length), to: to.startsWith(SRC) ? to.slice(SRC.length) : to };
    });
  });
}

describe("the may-import table of docs/architecture.md", () => {
  const rows = readLayerTable(readFileSync(join(root, "docs", "architecture.md"), "utf8"));
  const isSource = (p: string) => existsSync(join(src, p)) && !p.startsWith("..");

  it("is read from the page, one row per folder", () => {
    expect(rows.length).toBeGreaterThan(10);
    for (const row of rows)
      for (const cover of row.covers) expect(existsSync(join(src, cover)), cover).toBe(true);
  });

  it("covers every source file", () => {
    const uncovered = filesUnder(src)
      .map((f) => repoPath(f).slice(SRC.length))
      .filter((p) => !rowOf(rows, p));
    expect(uncovered).toEqual([]);
  });

  it("allows every import of the sources, and nothing upward", () => {
    const edges = importGraph();
    expect(edges.length).toBeGreaterThan(500);
    expect(layerViolations(rows, edges, isSource)).toEqual([]);
  });

  it("fails on an upward import (a made-up graph)", () => {
    const known = new Set([
      "model/build.ts",
      "checks/balance.ts",
      "lsp/server.ts",
      "lsp/session/scheduler.ts",
      "lsp/features/hover.ts",
      "syntax/parser.ts",
      "units/format.ts",
      "units/unit-table.ts",
      "view/draw-arm.ts",
      "cli/report.ts",
      "services/names.ts",
    ]);
    const made = (p: string) => known.has(p);
    const upward: ImportEdge[] = [
      { from: "model/build.ts", to: "checks/balance.ts" },
      { from: "lsp/features/hover.ts", to: "lsp/server.ts" },
      { from: "lsp/session/scheduler.ts", to: "lsp/features/hover.ts" },
      { from: "syntax/parser.ts", to: "units/format.ts" },
      { from: "cli/report.ts", to: "view/draw-arm.ts" },
      { from: "services/names.ts", to: "lsp/session/scheduler.ts" },
      { from: "checks/balance.ts", to: "vscode-languageserver" },
    ];
    expect(layerViolations(rows, upward, made)).toEqual(upward.map((e) => `${e.from} -> ${e.to}`));
    // The same graph the right way down passes.
    const downward: ImportEdge[] = [
      { from: "checks/balance.ts", to: "model/build.ts" },
      { from: "lsp/features/hover.ts", to: "lsp/session/scheduler.ts" },
      { from: "lsp/server.ts", to: "lsp/features/hover.ts" },
      { from: "syntax/parser.ts", to: "units/unit-table.ts" },
      { from: "lsp/features/hover.ts", to: "services/names.ts" },
    ];
    expect(layerViolations(rows, downward, made)).toEqual([]);
  });
});
