// Guards the message stream of `--stdio` before the protocol library reads it. The library's
// reader (vscode-jsonrpc's ReadableStreamMessageReader) stops for good at the first header
// without a valid Content-Length: it reports the error once and then reads whatever follows as
// more header, so one malformed frame left the server alive but deaf. It also takes any
// integer `parseInt` finds (`-5`) as a length. This guard checks each frame's header (every
// line `Name: value`, a Content-Length of digits within MAX_FRAME_BYTES) and passes well-formed
// frames through with their header written plainly (only Content-Length, which is all the
// library reads: a stray control character before a name it would not trim); a malformed one is
// reported and skipped up to the next line that starts a header, so the next message is read. Decoding, dispatch and replies stay the
// library's.
import { Transform, type TransformCallback } from "node:stream";

/** Longest message body accepted, bytes: the 1 MiB spec limit written as JSON, where every
 * character may take up to six bytes (`\u0000`), with room to spare. */
export const MAX_FRAME_BYTES = 16 * 1024 * 1024;
/** Longest header block: a few short lines. */
const MAX_HEADER_BYTES = 4096;
const HEADER_END = Buffer.from("\r\n\r\n");
const LENGTH_NAME = /^content-length$/i;
/** Where a header can start again after a malformed frame (frames follow each other with no
 * separator, so anywhere). */
const RESYNC = /content-length:/i;

export class FrameGuard extends Transform {
  private pending: Buffer = Buffer.alloc(0);
  /** Bytes of body still to pass through unchecked (a frame whose header was good). */
  private bodyLeft = 0;
  /** Set from a malformed frame until the next good one: one report per run of bad bytes. */
  private skipping = false;

  constructor(private readonly report: (message: string) => void) {
    super();
  }

  override _transform(chunk: Buffer, _encoding: BufferEncoding, done: TransformCallback): void {
    this.pending = this.pending.length ? Buffer.concat([this.pending, chunk]) : chunk;
    try {
      this.drain();
    } catch (err) {
      this.report(`Counterpoise: fault in the message guard: ${String(err)}`);
      this.pending = Buffer.alloc(0);
      this.bodyLeft = 0;
    }
    done();
  }

  private drain(): void {
    for (;;) {
      if (this.bodyLeft > 0) {
        if (this.pending.length === 0) return;
        const n = Math.min(this.bodyLeft, this.pending.length);
        this.push(this.pending.subarray(0, n));
        this.pending = this.pending.subarray(n);
        this.bodyLeft -= n;
        continue;
      }
      if (this.pending.length === 0) return;
      const end = this.pending.indexOf(HEADER_END);
      if (end < 0) {
        if (this.pending.length > MAX_HEADER_BYTES)
          this.skip("a header longer than 4096 bytes without an end");
        else return; // wait for the rest of the header
        continue;
      }
      const header = this.pending.subarray(0, end).toString("ascii");
      const problem = headerProblem(header);
      if (typeof problem === "string") {
        this.skip(problem);
        continue;
      }
      this.skipping = false;
      // The library reads the header again, by its own rules (a name with a stray control
      // character before it is not Content-Length there, and it stops for good): it is given
      // the one header it needs, written plainly.
      this.push(Buffer.from(`Content-Length: ${problem}\r\n\r\n`, "ascii"));
      this.pending = this.pending.subarray(end + HEADER_END.length);
      this.bodyLeft = problem;
      if (this.bodyLeft === 0) continue;
    }
  }

  /** Reports a malformed frame and drops bytes up to the next header start. */
  private skip(problem: string): void {
    const rest = this.pending.subarray(1).toString("latin1");
    const next = RESYNC.exec(rest);
    let drop: number;
    if (next) drop = 1 + next.index;
    else drop = Math.max(1, this.pending.length - 16); // keep a tail that may start a header
    if (!this.skipping)
      this.report(
        `Counterpoise: malformed message from the editor (${problem}); skipped to the next header. A request in it goes unanswered.`,
      );
    this.skipping = true;
    this.pending = this.pending.subarray(drop);
  }
}

/** The body length, or what is wrong with the header. */
function headerProblem(header: string): number | string {
  let length: number | undefined;
  for (const line of header.split("\r\n")) {
    const colon = line.indexOf(":");
    if (colon <= 0) return `a header line without "name: value": ${JSON.stringify(line.slice(0, 80))}`;
    const name = line.slice(0, colon).trim();
    const value = line.slice(colon + 1).trim();
    if (!LENGTH_NAME.test(name)) continue;
    if (!/^\d{1,12}$/.test(value))
      return `Content-Length is not a whole number of bytes: ${JSON.stringify(value.slice(0, 40))}`;
    length = Number(value);
    if (length > MAX_FRAME_BYTES) return `Content-Length ${length} is over the ${MAX_FRAME_BYTES}-byte limit`;
  }
  return length ?? "no Content-Length header";
}
