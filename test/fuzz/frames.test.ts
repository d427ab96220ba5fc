// Fuzzing the message stream (issue 16): generated malformed frames, each followed by well-formed
// requests, into one real server over stdio. Whatever a frame holds (a bad or missing
// Content-Length, a length that runs short or long, a header without a colon or without an end,
// a body that is not JSON or JSON that is no message, bytes of any kind), the server stays alive
// and answers a request sent after it. A length that runs long swallows the frames that follow up
// to that many bytes, as the protocol's framing says it must, so a handful of requests follow each
// frame and one answer is what counts. FUZZ_FRAMES sets the count (the long campaign's run);
// FUZZ_SEED the seed. Messages are awaited, never slept for.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import fc from "fast-check";
import { ensureBuilt, ROOT, SERVER } from "../lsp/protocol-client";
import { RawSession } from "./raw-session";

const FRAMES = Number(process.env.FUZZ_FRAMES ?? 60);
const SEED = Number(process.env.FUZZ_SEED ?? 20261202);
/** Declared lengths reach at most this far past their body, so the requests after a frame
 * (about 170 bytes each) always outrun what it swallows. */
const OVERRUN_MAX = 2000;
const REQUESTS_AFTER = 16;
/** A frame after which no request is answered within this long has made the server deaf (a
 * hang, not a slow answer: a hover of no document takes well under a millisecond). */
const DEAF_AFTER_MS = 15_000;
/** The test's own time limit grows with the frames: a long run of ten thousand at low priority on
 * a busy machine takes many minutes (a hang is caught per frame above). */
const FRAME_TIMEOUT_SHARE_MS = 200;

const goodBody = JSON.stringify({ jsonrpc: "2.0", method: "$/ping", params: {} });

const lengthWords = fc.oneof(
  fc.constantFrom("", "abc", "-5", "+3", "3.5", "1e3", "0x10", " ", "99999999999", "12abc", "٣", "NaN"),
  fc.nat({ max: 400 }).map(String),
);

const noiseText = fc.oneof(
  fc.string({ maxLength: 80 }),
  fc.string({ unit: "binary", maxLength: 80 }),
  fc.constantFrom("\r\n", "\r\n\r\n", "\n\n", ":", "Content-Length:", "Content-Length: 5\r\n", "{", "\u0000"),
);

/** One malformed (or merely odd) frame, as bytes. */
const badFrame: fc.Arbitrary<Buffer> = fc.oneof(
  // A Content-Length that is no whole number, over the limit or missing.
  lengthWords.map((w) => Buffer.from(`Content-Length: ${w}\r\n\r\n${goodBody}`)),
  fc.constant(Buffer.from(`Content-Type: application/json\r\n\r\n${goodBody}`)),
  // Header lines without a colon, or of any text.
  noiseText.map((t) => Buffer.from(`${t}\r\nContent-Length: ${goodBody.length}\r\n\r\n${goodBody}`)),
  // A length that runs short or long of the body.
  fc
    .integer({ min: -goodBody.length, max: OVERRUN_MAX })
    .map((d) => Buffer.from(`Content-Length: ${Math.max(0, goodBody.length + d)}\r\n\r\n${goodBody}`)),
  // Bodies that are not JSON, or JSON that is no message, at their right length.
  fc
    .oneof(
      fc.string({ maxLength: 120 }),
      fc.constantFrom(
        "[]",
        "1",
        '"x"',
        "null",
        '{"jsonrpc":"2.0"}',
        '{"id":5}',
        '{"jsonrpc":"2.0","id":{},"method":7}',
      ),
      fc.json({ maxDepth: 3 }),
    )
    .map((body) => {
      const bytes = Buffer.from(body, "utf8");
      return Buffer.concat([Buffer.from(`Content-Length: ${bytes.length}\r\n\r\n`), bytes]);
    }),
  // Requests for methods nobody serves, with odd parameters.
  fc
    .record({ method: fc.string({ maxLength: 30 }), params: fc.jsonValue({ maxDepth: 2 }) })
    .map(({ method, params }) => {
      const bytes = Buffer.from(JSON.stringify({ jsonrpc: "2.0", id: 900_000, method, params }), "utf8");
      return Buffer.concat([Buffer.from(`Content-Length: ${bytes.length}\r\n\r\n`), bytes]);
    }),
  // A header without an end, longer than any header.
  fc.nat({ max: 3 }).map((k) => Buffer.from(`X-Long: ${"x".repeat(4200 + 100 * k)}\r\n`)),
  // Raw bytes of any kind.
  fc.uint8Array({ maxLength: 200 }).map((a) => Buffer.from(a)),
);

let server: RawSession;
let nextId = 1000;

beforeAll(async () => {
  ensureBuilt();
  server = new RawSession(SERVER, ROOT);
  await server.initialize();
});

afterAll(() => server?.stop());

describe("fuzzing the message stream", () => {
  it(
    `answers a request after each of ${FRAMES} malformed frames and stays alive`,
    async () => {
      await fc.assert(
        fc.asyncProperty(badFrame, async (frame) => {
          const ids = Array.from({ length: REQUESTS_AFTER }, () => nextId++);
          server.send(Buffer.concat([frame, ...ids.map((id) => Buffer.from(server.hover(id)))]));
          let timer: ReturnType<typeof setTimeout> | undefined;
          const deaf = new Promise<undefined>(
            (resolve) => (timer = setTimeout(() => resolve(undefined), DEAF_AFTER_MS)),
          );
          const answer = await Promise.race([server.replyToAny(ids), deaf]);
          clearTimeout(timer);
          expect(
            answer,
            `no answer to the ${REQUESTS_AFTER} requests after ${JSON.stringify(frame.toString("latin1"))}`,
          ).toHaveProperty("result");
          expect(server.exited).toBeUndefined();
        }),
        { numRuns: FRAMES, seed: SEED, endOnFailure: true },
      );
      expect(server.exited).toBeUndefined();
      // The server reported no fault of its own (a malformed frame is the editor's, logged as such).
      expect(server.stderr.join("")).not.toMatch(/Uncaught|FATAL|heap out of memory/);
    },
    60_000 + FRAMES * FRAME_TIMEOUT_SHARE_MS,
  );
});
