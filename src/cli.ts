/**
 * @module cli
 * The command line's entry point (`npm run -s cli -- …`): the help text, the table of commands and
 * `main`, which is handed the arguments and an Io (standard input, output and error, so tests can
 * drive it without a process; cli/io.ts) and answers the exit code: 0 done, 2 the input or the
 * arguments are wrong, 1 something else failed. Each command lives in its own file under src/cli
 * (check, batch, sheet and verify, user, key, materials and schema); this file only dispatches to
 * them, and, run as a script, starts `main` on the process's own streams.
 */
import { batchCommand } from "./cli/batch.ts";
import { checkCommand } from "./cli/check.ts";
import { materialsCommand, schemaCommand } from "./cli/info.ts";
import type { Io } from "./cli/io.ts";
import { sheetCommand, verifyCommand } from "./cli/sheet.ts";
import { keyShowCommand } from "./cli/key.ts";
import { userAddCommand } from "./cli/user.ts";

const HELP = `Hoopwise — fatigue screening of pressurized shell skins

Usage: npm run -s cli -- <command> [options]

Commands:
  check FILE|-                 run a check; prints the result JSON (exit 0), or the errors (exit 2)
  batch FILE|- [--workers N]   one check per line (NDJSON) in, one result or errors document per line
                               out, in input order; N worker threads (default one per core); exit 2
                               if any line had errors
  sheet FILE|- --out SHEET.pdf [--paper A4|Letter]
                               print the check sheet (PDF, with the input embedded); needs Chromium
  verify SHEET.pdf [--json] [--key KEY.pem | --records URL]
                               recompute a sheet from its embedded input and check its signed sign-offs
                               against the records' public key; exit 0 when it still matches
  user add NAME --role admin|engineer
                               add a person to the records (passphrase from standard input or a prompt)
  key show                     print the records' public signing key (PEM) and its fingerprint
  materials [--json]           list the material library (typical values — verify against certified data)
  schema [--result]            print the check format (or the result format) as JSON Schema
  help                         this text

Exit codes: 0 done, 2 the input is wrong (the errors document names each field), 1 something else failed.
A screening check, not a code-compliance certificate: the governing pressure-vessel or
airworthiness code and a licensed or authorized engineer decide.
`;

type Command = (args: string[], io: Io) => number | Promise<number>;

const COMMANDS: Record<string, Command> = {
  check: checkCommand,
  batch: batchCommand,
  sheet: sheetCommand,
  verify: verifyCommand,
  user: (args, io) => {
    if (args[0] !== "add") {
      io.stderr.write("usage: user add NAME --role admin|engineer\n");
      return 2;
    }
    return userAddCommand(args.slice(1), { ...io, isTTY: Boolean(io.stdin.isTTY) });
  },
  key: keyShowCommand,
  materials: materialsCommand,
  schema: schemaCommand,
};

export async function main(argv: string[], io: Io): Promise<number> {
  const [name, ...args] = argv;
  if (!name || name === "help" || name === "--help" || name === "-h") {
    io.stdout.write(HELP);
    return name ? 0 : 2;
  }
  const command = COMMANDS[name];
  if (!command) {
    io.stderr.write(`unknown command "${name}"\n\n${HELP}`);
    return 2;
  }
  return command(args, io);
}

const isEntry = process.argv[1] && import.meta.url === new URL(`file://${process.argv[1]}`).href;
if (isEntry) {
  main(process.argv.slice(2), { stdin: process.stdin, stdout: process.stdout, stderr: process.stderr }).then(
    (code) => {
      process.exitCode = code;
    },
    (err) => {
      process.stderr.write(`hoopwise: ${(err as Error).stack ?? err}\n`);
      process.exitCode = 1;
    },
  );
}
