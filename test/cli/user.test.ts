import { PassThrough, Readable } from "node:stream";
import { describe, expect, it } from "vitest";
import { userAddCommand, type UserIo } from "../../src/cli/user.ts";
import { openDatabase, openStore } from "../../src/store/index.ts";
import { FAST_SCRYPT, tempDbPath } from "../store/helpers.ts";

const PHRASE = "lichen on the north wall";

class Collect extends PassThrough {
  text = "";
  constructor() {
    super();
    this.setEncoding("utf8").on("data", (c: string) => (this.text += c));
  }
}

function pipedIo(input: string): UserIo & { stdout: Collect; stderr: Collect } {
  return { stdin: Readable.from([input]), stdout: new Collect(), stderr: new Collect(), isTTY: false };
}

/** A terminal stand-in: records raw-mode switches, and types each entry once its prompt has appeared. */
function terminalIo(entries: string[]) {
  const stdin = Object.assign(new PassThrough(), { rawModes: [] as boolean[], setRawMode: (m: boolean) => stdin.rawModes.push(m) });
  const stdout = new Collect();
  const stderr = new Collect();
  let prompts = 0;
  stderr.on("data", (c: string) => {
    if (/: $/.test(c) && prompts < entries.length) stdin.write(entries[prompts++]);
  });
  return { stdin, stdout, stderr, isTTY: true };
}

async function registered(path: string): Promise<string[]> {
  const db = openDatabase(path);
  const names = (db.prepare("SELECT name FROM users").all() as { name: string }[]).map((r) => r.name);
  db.close();
  return names;
}

describe("user add", () => {
  it("adds the first admin with the passphrase piped on standard input, who can then sign in", async () => {
    const dbPath = tempDbPath();
    const io = pipedIo(`${PHRASE}\n`);
    expect(await userAddCommand(["Mira Solberg", "--role", "admin"], io, { dbPath, passphraseCost: FAST_SCRYPT })).toBe(0);
    expect(io.stdout.text).toBe('added admin "Mira Solberg" (user id 1)\n');
    const store = await openStore({ path: dbPath });
    // The trailing newline is not part of the passphrase.
    await expect(store.signIn({ name: "Mira Solberg", passphrase: PHRASE }, "test")).resolves.toMatchObject({
      user: { name: "Mira Solberg", role: "admin" },
    });
    await store.close();
  });

  it("refuses an engineer as the first person, and a role that is not one, with exit code 2", async () => {
    const dbPath = tempDbPath();
    const first = pipedIo(`${PHRASE}\n`);
    expect(await userAddCommand(["Mira Solberg", "--role", "engineer"], first, { dbPath })).toBe(2);
    expect(first.stderr.text).toMatch(/first person must be an admin/);
    const odd = pipedIo(`${PHRASE}\n`);
    expect(await userAddCommand(["Mira Solberg", "--role", "boss"], odd, { dbPath })).toBe(2);
    expect(odd.stderr.text).toMatch(/--role must be admin or engineer/);
    expect(await registered(dbPath)).toEqual([]);
  });

  it("refuses a common or trivially repeated passphrase, saying why", async () => {
    const dbPath = tempDbPath();
    for (const weak of ["password1234", "aaaaaaaaaaaaaaaa", "abcabcabcabcabc"]) {
      const io = pipedIo(`${weak}\n`);
      expect(await userAddCommand(["Mira Solberg", "--role", "admin"], io, { dbPath })).toBe(2);
      expect(io.stderr.text).toMatch(/too easy to guess/);
    }
    expect(await registered(dbPath)).toEqual([]);
  });

  it("asks twice in a terminal with echo off, and never prints the passphrase", async () => {
    const dbPath = tempDbPath();
    const io = terminalIo([`${PHRASE}\r`, `${PHRASE}\r`]);
    expect(await userAddCommand(["Mira Solberg", "--role", "admin"], io, { dbPath, passphraseCost: FAST_SCRYPT })).toBe(0);
    expect(io.stdin.rawModes).toEqual([true, false, true, false]);
    expect(io.stderr.text).toContain("Passphrase for Mira Solberg: ");
    expect(io.stderr.text).toContain("Same passphrase again: ");
    expect(io.stderr.text + io.stdout.text).not.toContain(PHRASE);
    expect(await registered(dbPath)).toEqual(["Mira Solberg"]);
  });

  it("treats backspace as a correction while typing", async () => {
    const dbPath = tempDbPath();
    const io = terminalIo([`${PHRASE}x\u007f\r`, `${PHRASE}\r`]);
    expect(await userAddCommand(["Mira Solberg", "--role", "admin"], io, { dbPath, passphraseCost: FAST_SCRYPT })).toBe(0);
  });

  it("registers nothing when the two entries differ", async () => {
    const dbPath = tempDbPath();
    const io = terminalIo([`${PHRASE}\r`, `${PHRASE} typo\r`]);
    expect(await userAddCommand(["Mira Solberg", "--role", "admin"], io, { dbPath, passphraseCost: FAST_SCRYPT })).toBe(2);
    expect(io.stderr.text).toMatch(/the two entries differ/);
    expect(await registered(dbPath)).toEqual([]);
  });

  it("stops on Ctrl-C with exit code 130", async () => {
    const dbPath = tempDbPath();
    const io = terminalIo(["lich\u0003"]);
    expect(await userAddCommand(["Mira Solberg", "--role", "admin"], io, { dbPath })).toBe(130);
    expect(io.stdin.rawModes.at(-1)).toBe(false);
    expect(await registered(dbPath)).toEqual([]);
  });

  it("refuses a taken name before asking for a passphrase", async () => {
    const dbPath = tempDbPath();
    await userAddCommand(["Mira Solberg", "--role", "admin"], pipedIo(PHRASE), { dbPath, passphraseCost: FAST_SCRYPT });
    const io = terminalIo([]);
    expect(await userAddCommand(["mira solberg", "--role", "engineer"], io, { dbPath })).toBe(1);
    expect(io.stderr.text).toMatch(/already registered/);
    expect(io.stdin.rawModes).toEqual([]);
  });

  it("refuses a short passphrase, several lines, or no name, with exit code 2 and the reason", async () => {
    const dbPath = tempDbPath();
    const short = pipedIo("too short\n");
    expect(await userAddCommand(["Mira Solberg", "--role", "admin"], short, { dbPath })).toBe(2);
    expect(short.stderr.text).toMatch(/passphrase: must be at least 12 characters/);
    const lines = pipedIo(`${PHRASE}\n${PHRASE}\n`);
    expect(await userAddCommand(["Mira Solberg", "--role", "admin"], lines, { dbPath })).toBe(2);
    expect(lines.stderr.text).toMatch(/more than one line/);
    const none = pipedIo(PHRASE);
    expect(await userAddCommand([], none, { dbPath })).toBe(2);
    expect(none.stderr.text).toMatch(/usage: user add NAME --role/);
    const blank = pipedIo(PHRASE);
    expect(await userAddCommand(["   ", "--role", "admin"], blank, { dbPath })).toBe(2);
    expect(blank.stderr.text).toMatch(/name must not be empty/);
    expect(await registered(dbPath)).toEqual([]);
  });
});
