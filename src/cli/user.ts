import {
  openStore,
  RecordConflictError,
  RecordError,
  USER_ROLES,
  type ScryptCost,
  type OpenedStore,
  type UserRole,
} from "../store/index.ts";
import { personNameField, safeParseFields, zodFieldErrors } from "../store/fields.ts";
import { assertNameFree } from "../store/users.ts";

/** The streams the command talks through; the real process's, or test doubles. */
export interface UserIo {
  stdin: NodeJS.ReadableStream & { setRawMode?: (mode: boolean) => unknown };
  stdout: { write(s: string): unknown };
  stderr: { write(s: string): unknown };
  /** Whether standard input is a terminal: then the passphrase is prompted for, without echo, twice. */
  isTTY: boolean;
}

export interface UserCommandOptions {
  /** The SQLite database file; otherwise DATABASE_URL's PostgreSQL when set, else `HOOPWISE_DB` or the default file. */
  dbPath?: string;
  passphraseCost?: ScryptCost;
}

const USAGE =
  'usage: user add NAME --role admin|engineer   (quote a name with spaces: user add "Ana Reyes" --role admin)\n' +
  "The passphrase is read from standard input when it is piped, or asked for twice without echo in a terminal.\n" +
  "Whoever can write the database file may add people this way; the first person must be an admin.\n";

/** Exit codes: 0 registered; 1 the name is already registered or the database failed; 2 a usage or input mistake; 130 cancelled. */
const EXIT = { ok: 0, refused: 1, usage: 2, cancelled: 130 } as const;

/** The user pressed Ctrl-C or Ctrl-D at a prompt. */
class Cancelled extends Error {}
/** A passphrase that cannot be used, told in words for the terminal. */
class InputMistake extends Error {}
/**
 * `user add NAME --role admin|engineer`: register a person, with a passphrase kept only as a
 * hash. `args` are the words after `user add`.
 */
export async function userAddCommand(args: string[], io: UserIo, options: UserCommandOptions = {}): Promise<number> {
  const fail = (code: number, message: string) => {
    io.stderr.write(`user add: ${message}\n`);
    return code;
  };
  const words = [...args];
  let role: string | undefined;
  const at = words.findIndex((w) => w === "--role" || w.startsWith("--role="));
  if (at >= 0) {
    const w = words[at];
    role = w.includes("=") ? w.slice("--role=".length) : words[at + 1];
    words.splice(at, w.includes("=") ? 1 : 2);
  }
  if (words.some((w) => w.startsWith("--"))) return fail(EXIT.usage, `unknown option ${words.find((w) => w.startsWith("--"))}\n${USAGE}`);
  if (words.length !== 1)
    return fail(EXIT.usage, words.length === 0 ? `a name is required\n${USAGE}` : `give the name as one argument\n${USAGE}`);
  if (role === undefined) return fail(EXIT.usage, `give the role with --role admin or --role engineer\n${USAGE}`);
  if (!(USER_ROLES as readonly string[]).includes(role)) return fail(EXIT.usage, `--role must be admin or engineer (got "${role}")`);
  const parsedName = safeParseFields(personNameField, words[0]);
  if (!parsedName.success) return fail(EXIT.usage, `name ${zodFieldErrors(parsedName.error)[0].message}`);
  const name = parsedName.data;

  let store: OpenedStore;
  try {
    store = await openStore({ path: options.dbPath, passphraseCost: options.passphraseCost });
  } catch (err) {
    return fail(EXIT.refused, `cannot open the records database: ${(err as Error).message}`);
  }
  try {
    // Say so before asking for a passphrase that could not be used.
    await assertNameFree(store.sql, name);
    if ((await store.countUsers()) === 0 && role !== "admin")
      return fail(EXIT.usage, "the first person must be an admin: use --role admin");
    const passphrase = io.isTTY ? await promptTwice(io, name) : await readPiped(io.stdin);
    const user = await store.addUser({ name, role: role as UserRole, passphrase }, "database-owner", "cli");
    io.stdout.write(`added ${user.role} "${user.name}" (user id ${user.id})\n`);
    return EXIT.ok;
  } catch (err) {
    if (err instanceof Cancelled) return fail(EXIT.cancelled, "cancelled; nothing was registered");
    if (err instanceof RecordConflictError) return fail(EXIT.refused, err.message);
    if (err instanceof RecordError || err instanceof InputMistake) return fail(EXIT.usage, err.message);
    return fail(EXIT.refused, (err as Error).message);
  } finally {
    await store.close();
  }
}

async function promptTwice(io: UserIo, name: string): Promise<string> {
  const first = await promptHidden(io, `Passphrase for ${name}: `);
  const second = await promptHidden(io, "Same passphrase again: ");
  if (first !== second) throw new InputMistake("passphrase: the two entries differ; nothing was registered");
  return first;
}

/** One line typed with echo off: a passphrase must not stay on the screen or in a terminal log. */
function promptHidden(io: UserIo, prompt: string): Promise<string> {
  const { stdin, stderr } = io;
  if (!stdin.setRawMode)
    return Promise.reject(new InputMistake("cannot turn off echo on this terminal; pipe the passphrase on standard input instead"));
  stderr.write(prompt);
  stdin.setRawMode(true);
  stdin.setEncoding("utf8");
  stdin.resume();
  return new Promise((resolve, reject) => {
    let typed = "";
    const finish = (settle: () => void) => {
      stdin.removeListener("data", onData);
      stdin.setRawMode?.(false);
      stdin.pause();
      stderr.write("\n");
      settle();
    };
    const onData = (chunk: string | Buffer) => {
      const text = String(chunk);
      // An escape sequence is a cursor or function key, not part of a passphrase.
      if (text.startsWith("\u001b")) return;
      for (const ch of text) {
        if (ch === "\r" || ch === "\n") return finish(() => resolve(typed));
        if (ch === "\u0003") return finish(() => reject(new Cancelled()));
        if (ch === "\u0004" && typed === "") return finish(() => reject(new Cancelled()));
        if (ch === "\u007f" || ch === "\b") typed = [...typed].slice(0, -1).join("");
        else if (ch === "\u0015") typed = "";
        else if (ch >= " ") typed += ch;
      }
    };
    stdin.on("data", onData);
  });
}

/** The passphrase piped in: one line, its line ending dropped. */
async function readPiped(stdin: NodeJS.ReadableStream): Promise<string> {
  let text = "";
  for await (const chunk of stdin) text += String(chunk);
  const line = text.replace(/\r?\n$/, "");
  if (line === "")
    throw new InputMistake("passphrase: standard input is empty; pipe the passphrase in, or run in a terminal to be asked for it");
  if (/[\r\n]/.test(line))
    throw new InputMistake("passphrase: standard input holds more than one line; give the passphrase on a single line");
  return line;
}
