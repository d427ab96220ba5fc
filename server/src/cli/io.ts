// The command's only contact with the outside: reading spec files, writing to the streams, and
// loading the language server's bundle for `poise lsp`.
import { closeSync, existsSync, openSync, readSync, realpathSync, statSync, writeFileSync } from "node:fs";
import { join, resolve } from "node:path";
import { MAX_SPEC_CHARS } from "../limits";

/** Longest spec file read, bytes: the core's limit (1 MiB; a file of no more bytes holds no more
 * characters). A longer file, or one without end (`/dev/zero`), is refused after reading one byte
 * past it. */
export const MAX_SPEC_BYTES = MAX_SPEC_CHARS;

export interface Output {
  out(text: string): void;
  err(text: string): void;
}

/** A reader that stops early (`poise sweep x.poise --csv | head`) closes the pipe: that is the
 * reader's choice, not a fault, so the command ends quietly instead of printing a stack. */
function endQuietlyOnClosedPipe(stream: NodeJS.WriteStream): void {
  stream.on("error", (err: NodeJS.ErrnoException) => {
    if (err.code === "EPIPE") process.exit(0);
    throw err;
  });
}
endQuietlyOnClosedPipe(process.stdout);

export const processOutput: Output = {
  out: (text) => void process.stdout.write(text),
  err: (text) => void process.stderr.write(text),
};

/** The file's text, or undefined after saying on stderr why it cannot be read. */
export function readSpec(file: string, out: Output, command: string): string | undefined {
  try {
    if (statSync(file).isDirectory()) {
      out.err(`poise ${command}: ${file} is a folder, not a .poise file\n`);
      return undefined;
    }
    const text = readAtMost(file, MAX_SPEC_BYTES);
    if (text === undefined) {
      out.err(
        `poise ${command}: ${file} is larger than ${MAX_SPEC_BYTES.toLocaleString("en-US")} bytes (1 MiB), the limit for one spec: not read\n`,
      );
      return undefined;
    }
    return text;
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    out.err(
      `poise ${command}: cannot read ${file}${code === "ENOENT" ? ": no such file" : code ? ` (${code})` : ""}\n`,
    );
    return undefined;
  }
}

/** The file's text, or undefined when it holds more than `limit` bytes (reading stops there). */
function readAtMost(file: string, limit: number): string | undefined {
  const fd = openSync(file, "r");
  try {
    const buffer = Buffer.alloc(limit + 1);
    let length = 0;
    while (length < buffer.length) {
      const n = readSync(fd, buffer, length, buffer.length - length, null);
      if (n === 0) break;
      length += n;
    }
    return length > limit ? undefined : buffer.toString("utf8", 0, length);
  } finally {
    closeSync(fd);
  }
}

/** Why writing to `out` would destroy a spec, or undefined when it would not: `out` is the input
 * itself (by any path to it), or another spec (a `.poise` file). Output never replaces a spec. */
export function overwritesSpec(out: string, input: string): string | undefined {
  if (/\.poise$/i.test(out)) return "it is a spec (.poise); name the page .html";
  try {
    const o = statSync(out);
    const i = statSync(input);
    if (o.dev === i.dev && o.ino === i.ino) return `it is the spec being read (${input})`;
  } catch {
    // out does not exist yet (or input cannot be read: that is reported when it is read)
  }
  const real = (p: string) => {
    try {
      return realpathSync(p);
    } catch {
      return resolve(p);
    }
  };
  return real(out) === real(input) ? `it is the spec being read (${input})` : undefined;
}

/** Writes a text file; false after saying on stderr why it cannot be written. */
export function writeTextFile(file: string, text: string, out: Output, command: string): boolean {
  try {
    writeFileSync(file, text, "utf8");
    return true;
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    out.err(`poise ${command}: cannot write ${file}${code ? ` (${code})` : ""}\n`);
    return false;
  }
}

/** Loads the language server's own bundle beside the command's (dist/server.js, from
 * lsp/main.ts), which starts the server on load. It is kept out of the command's bundle so that
 * `poise check` does not load (parse) the protocol libraries, a third of the bundle. False when
 * the bundle is missing. */
export function startBundledServer(): boolean {
  if (!existsSync(join(__dirname, "server.js"))) return false;
  // A literal name that scripts/build.mjs leaves outside the bundle: dist/cli.js requires
  // dist/server.js beside it.
  require("./server.js");
  return true;
}
