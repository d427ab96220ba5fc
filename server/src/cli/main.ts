// The `poise` command (bundled to dist/cli.js; bin/poise.js launches it): check, sweep, results, tune, report,
// and the language server over stdio for editors other than VS Code.
import { runCheck } from "./check";
import { runSweep } from "./sweep";
import { runReport } from "./report";
import { runResults } from "./results";
import { runTune } from "./tune";
import { processOutput, startBundledServer, type Output } from "./io";
import { switchOptimiserPerSpec } from "./optimiser";
import packageJson from "../../../package.json";

const HELP = `poise — checks spring-balanced arm specs (*.poise)

usage:
  poise check FILE... [--json]     diagnostics, one per line (path:line:column: severity code: message)
  poise sweep FILE [--json|--csv]  the pose table: angles deg, lengths mm, forces N, torques N*m
  poise results FILE [--json] [--units si|us]
                                   every figure behind the checks, pass or fail
  poise tune FILE [--json] [--write]
                                   the spring settings and places that balance best (tune lines)
  poise report FILE [-o OUT.html] [--units si|us]
                                   a self-contained HTML report
  poise lsp --stdio                the language server over stdin/stdout, for any editor
  poise --help | --version

exit status: 0 no errors, 1 the spec has errors, 2 the command could not run
`;

async function runLsp(args: string[], out: Output): Promise<number> {
  if (!args.includes("--stdio")) {
    out.err("poise lsp: only --stdio is supported (poise lsp --stdio)\n");
    return 2;
  }
  // The server's own bundle (io.ts). `--stdio` on the command line: the connection reads stdin
  // (behind the frame guard), writes stdout and sends console output to the client's log, so
  // nothing stray corrupts the stream.
  if (!startBundledServer()) {
    out.err("poise lsp: dist/server.js is missing; run `npm run build` first\n");
    return 2;
  }
  return new Promise<number>(() => {}); // runs until the client ends it (exit notification)
}

export async function main(argv: string[], out: Output = processOutput): Promise<number> {
  const [command, ...rest] = argv;
  switch (command) {
    case "check": {
      const json = rest.includes("--json");
      const unknown = rest.find((a) => a.startsWith("-") && a !== "--json");
      if (unknown) {
        out.err(`poise check: unknown option ${unknown} (poise check FILE... [--json])\n`);
        return 2;
      }
      return runCheck(
        rest.filter((a) => a !== "--json"),
        json,
        out,
      );
    }
    case "sweep":
      return runSweep(rest, out);
    case "results":
      return runResults(rest, out);
    case "report":
      return runReport(rest, out);
    case "tune":
      return runTune(rest, out);
    case "lsp":
      return runLsp(rest, out);
    case "--version":
    case "-v":
    case "version":
      out.out(`${packageJson.version}\n`);
      return 0;
    case "--help":
    case "-h":
    case "help":
      out.out(HELP);
      return 0;
    case undefined:
      out.err(HELP);
      return 2;
    default:
      out.err(`poise: unknown command ${command}\n\n${HELP}`);
      return 2;
  }
}

switchOptimiserPerSpec();
main(process.argv.slice(2)).then(
  (code) => {
    process.exitCode = code;
  },
  (err: unknown) => {
    process.stderr.write(
      `poise: internal fault: ${err instanceof Error ? (err.stack ?? err.message) : String(err)}\n`,
    );
    process.exitCode = 2;
  },
);
