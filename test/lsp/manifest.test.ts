// The extension manifest agrees with the code: every setting it declares is one the server reads,
// with the same default; every command it declares is registered by the client; every file it
// names exists.
import { describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { existsSync, readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { DEFAULT_SETTINGS } from "../../server/src/lsp/session/settings";
import { ensureBuilt } from "./protocol-client";
import { tuneCommandFeature } from "../../server/src/lsp/features/tune-command";
import { TUNE_COMMAND } from "../../server/src/lsp/custom-protocol";

const root = join(__dirname, "..", "..");
const manifest = JSON.parse(readFileSync(join(root, "package.json"), "utf8"));
const clientSource = readdirSync(join(root, "client", "src"))
  .filter((f) => f.endsWith(".ts"))
  .map((f) => readFileSync(join(root, "client", "src", f), "utf8"))
  .join("\n");

describe("extension manifest", () => {
  it("declares the language for *.poise with its grammar, configuration and snippets", () => {
    const c = manifest.contributes;
    expect(c.languages[0]).toMatchObject({ id: "counterpoise", extensions: [".poise"] });
    expect(c.languages[0].aliases).toContain("Counterpoise");
    for (const path of [c.languages[0].configuration, c.grammars[0].path, c.snippets[0].path])
      expect(existsSync(join(root, path)), path).toBe(true);
    expect(manifest.main).toBe("./dist/client.js"); // built by scripts/build.mjs
    // VS Code (1.74 and later) activates on the contributed language and commands by itself and
    // flags those events as redundant; a webview panel is no contribution, so restoring the arm
    // drawing after a reload needs its own event (VS Code's webview guide, "Serialization"), named
    // by the panel's view type in client/src/preview.ts.
    expect(manifest.activationEvents).toEqual(["onWebviewPanel:counterpoise.armView"]);
    expect(readFileSync(join(root, "client", "src", "preview.ts"), "utf8")).toContain(
      'const VIEW_TYPE = "counterpoise.armView";',
    );
  });

  it("declares exactly the server's settings, with the same defaults", () => {
    const props = manifest.contributes.configuration.properties as Record<string, { default: unknown }>;
    for (const [key, value] of Object.entries(DEFAULT_SETTINGS))
      expect(props[`counterpoise.${key}`]?.default, key).toEqual(value);
    const declared = Object.keys(props).filter((k) => k !== "counterpoise.trace.server");
    expect(declared.sort()).toEqual(
      Object.keys(DEFAULT_SETTINGS)
        .map((k) => `counterpoise.${k}`)
        .sort(),
    );
  });

  it("registers every command it declares", () => {
    // The language client registers the server's own commands (executeCommandProvider) itself.
    const serverCommands = new Set(
      tuneCommandFeature.capabilities({}).executeCommandProvider?.commands ?? [],
    );
    for (const c of manifest.contributes.commands as { command: string }[])
      if (!serverCommands.has(c.command)) expect(clientSource, c.command).toContain(`"${c.command}"`);
  });

  it("puts the tune command in the command palette in plain words, for a .poise editor", () => {
    const commands = manifest.contributes.commands as {
      command: string;
      title: string;
      enablement?: string;
    }[];
    const palette = manifest.contributes.menus.commandPalette as { command: string; when?: string }[];
    for (const id of [TUNE_COMMAND, "counterpoise.tuneAndShow"]) {
      const c = commands.find((x) => x.command === id)!;
      expect(c, id).toBeDefined();
      expect(c.title).toMatch(/^[A-Z][A-Za-z ]+$/); // words, no code names
      expect(c.enablement).toBe("editorLangId == counterpoise");
      expect(palette.find((m) => m.command === id)?.when).toBe("editorLangId == counterpoise");
    }
    // The server declares the command the manifest names, and the client passes the active spec
    // to it when the palette gives no arguments
    expect(tuneCommandFeature.capabilities({}).executeCommandProvider?.commands).toEqual([TUNE_COMMAND]);
    expect(clientSource).toContain("executeCommand: (command, args, next)");
    expect(clientSource).toContain("command !== TUNE_COMMAND || args.length > 0");
  });

  it("packs only the bundles and the editor files into the .vsix", () => {
    ensureBuilt();
    const r = spawnSync(
      process.execPath,
      [join(root, "node_modules", "@vscode", "vsce", "vsce"), "ls", "--no-dependencies"],
      { cwd: root, encoding: "utf8", timeout: 60_000 },
    );
    const files = r.stdout
      .trim()
      .split("\n")
      .map((l) => l.trim());
    expect(files).toEqual(
      expect.arrayContaining([
        "package.json",
        "README.md",
        "LICENSE",
        "language-configuration.json",
        "syntaxes/counterpoise.tmLanguage.json",
        "snippets/counterpoise.json",
        "dist/client.js",
        "dist/server.js",
        "dist/analysis-worker.js",
      ]),
    );
    // Bundled: no dependency, source, test, map or command-line bundle goes in.
    const allowed =
      /^(package\.json|README\.md|LICENSE|CHANGELOG\.md|language-configuration\.json|syntaxes\/[\w.-]+\.json|snippets\/[\w.-]+\.json|dist\/(client|server|analysis-worker|preview-[\w-]+)\.js|client\/media\/[\w.-]+\.(css|svg|png))$/;
    expect(files.filter((f) => !allowed.test(f))).toEqual([]);
  });
});
