// The command's only contact with the outside: reading spec files and writing to the streams.
import { readFileSync, statSync } from "node:fs";

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
    return readFileSync(file, "utf8");
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    out.err(
      `poise ${command}: cannot read ${file}${code === "ENOENT" ? ": no such file" : code ? ` (${code})` : ""}\n`,
    );
    return undefined;
  }
}
