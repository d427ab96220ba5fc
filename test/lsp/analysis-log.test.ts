// The server's log: one info-level line per published analysis (which text and version, how many
// poses, how long, what it found), so that an editor's log channel shows the server at work.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { MessageType, type LogMessageParams } from "vscode-languageserver-protocol/node";
import { ProtocolSession, ROOT, ensureBuilt } from "./protocol-client";
import { poise } from "../cli/run-cli";

const CAMERA = readFileSync(join(ROOT, "samples", "camera-arm.poise"), "utf8");
const MISTAKES = readFileSync(join(ROOT, "samples", "mistakes.poise"), "utf8");

let session: ProtocolSession;
const lines: LogMessageParams[] = [];
let waiters: { test: (m: LogMessageParams) => boolean; resolve: (m: LogMessageParams) => void }[] = [];

function logLine(test: (m: LogMessageParams) => boolean): Promise<LogMessageParams> {
  const seen = lines.find(test);
  if (seen) return Promise.resolve(seen);
  return new Promise((resolve) => waiters.push({ test, resolve }));
}

beforeAll(async () => {
  ensureBuilt();
  session = new ProtocolSession();
  // This file's own handler: keeps the message type, which the shared session drops.
  session.connection.onNotification("window/logMessage", (m: LogMessageParams) => {
    lines.push(m);
    const ready = waiters.filter((w) => w.test(m));
    waiters = waiters.filter((w) => !w.test(m));
    for (const w of ready) w.resolve(m);
  });
  await session.initialize();
}, 60_000);

afterAll(async () => {
  await session?.stop();
});

describe("analysis log", () => {
  it("logs each analysis at info level with its version, poses, time and findings", async () => {
    await session.open("file:///work/camera%20arm.poise", CAMERA, 3);
    const line = await logLine((m) => m.message.includes("camera arm.poise"));
    expect(line.type).toBe(MessageType.Info);
    // The pose count the `poise sweep` command reports for the same text (docs/cli.md, `poise sweep`).
    const poses = (
      JSON.parse(poise("sweep", "--json", "samples/camera-arm.poise").stdout) as { poses: unknown[] }
    ).poses.length;
    expect(line.message).toMatch(
      new RegExp(`^analysed camera arm\\.poise version 3: ${poses} poses in \\d+ ms, 0 errors, 0 warnings$`),
    );
  });

  it("counts the errors that `poise check` finds, and no poses for an arm that cannot be solved", async () => {
    await session.open("file:///work/mistakes.poise", MISTAKES, 1);
    const line = await logLine((m) => m.message.includes("mistakes.poise"));
    const found = JSON.parse(poise("check", "--json", "samples/mistakes.poise").stdout) as {
      severity: string;
    }[];
    const count = (severity: string) => {
      const n = found.filter((f) => f.severity === severity).length;
      return `${n} ${severity}${n === 1 ? "" : "s"}`;
    };
    expect(line.message).toBe(
      `analysed mistakes.poise version 1: 0 poses in ${/in (\d+) ms/.exec(line.message)?.[1]} ms, ${count("error")}, ${count("warning")}`,
    );
  });
});
