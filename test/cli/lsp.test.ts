// `poise lsp --stdio` runs the same language server as dist/server.js, over stdin and stdout.
import { beforeAll, describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { HoverRequest } from "vscode-languageserver-protocol/node";
import { ProtocolSession, ROOT, ensureBuilt, positionOf } from "../lsp/protocol-client";
import { poise } from "./run-cli";

beforeAll(() => ensureBuilt());

describe("poise lsp", () => {
  it("serves diagnostics and hover over stdio", async () => {
    const session = new ProtocolSession({}, [join(ROOT, "bin", "poise.js"), "lsp", "--stdio"]);
    const init = await session.initialize();
    expect(init.serverInfo?.name).toBe("counterpoise");
    const text = readFileSync(join(ROOT, "samples", "mistakes.poise"), "utf8");
    const uri = "file:///work/mistakes.poise";
    const published = await session.open(uri, text);
    // The sample's first mistake: `length -300 mm`, an impossible value on line 10.
    const impossible = published.diagnostics.find((d) => d.code === "value.impossible");
    expect(impossible?.range.start.line).toBe(positionOf(text, "-300 mm").line);
    const hover = await session.connection.sendRequest(HoverRequest.type, {
      textDocument: { uri },
      position: positionOf(text, "payload lamp", 9),
    });
    expect(JSON.stringify(hover)).toContain("lamp");
    expect(await session.stop()).toBe(0);
  });

  it("refuses a transport it does not offer", () => {
    const r = poise("lsp");
    expect(r.status).toBe(2);
    expect(r.stderr).toContain("--stdio");
  });
});
