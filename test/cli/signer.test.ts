import { PassThrough, Readable } from "node:stream";
import { describe, expect, it } from "vitest";
import { signerAddCommand, type SignerIo } from "../../src/cli/signer.ts";
import { openDatabase } from "../../src/store/index.ts";
import { verifySigner } from "../../src/store/signers.ts";
import { FAST_SCRYPT, tempDbPath } from "../store/helpers.ts";

const PHRASE = "lichen on the north wall";

class Collect extends PassThrough {
  text = "";
  constructor() {
    super();
    this.setEncoding("utf8").on("data", (c: string) => (this.text += c));
  }
}

function pipedIo(input: string): SignerIo & { stdout: Collect; stderr: Collect } {
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
  const names = (db.prepare("SELECT name FROM signers").all() as { name: string }[]).map((r) => r.name);
  db.close();
  return names;
}

describe("signer add", () => {
  it("registers a signer with the passphrase piped on standard input", async () => {
    const dbPath = tempDbPath();
    const io = pipedIo(`${PHRASE}\n`);
    expect(await signerAddCommand(["Mira Solberg"], io, { dbPath, passphraseCost: FAST_SCRYPT })).toBe(0);
    expect(io.stdout.text).toBe('registered signer "Mira Solberg"\n');
    const db = openDatabase(dbPath);
    // The trailing newline is not part of the passphrase.
    await expect(verifySigner(db, "Mira Solberg", PHRASE)).resolves.toMatchObject({ name: "Mira Solberg" });
    db.close();
  });

  it("asks twice in a terminal with echo off, and never prints the passphrase", async () => {
    const dbPath = tempDbPath();
    const io = terminalIo([`${PHRASE}\r`, `${PHRASE}\r`]);
    expect(await signerAddCommand(["Mira Solberg"], io, { dbPath, passphraseCost: FAST_SCRYPT })).toBe(0);
    expect(io.stdin.rawModes).toEqual([true, false, true, false]);
    expect(io.stderr.text).toContain("Passphrase for Mira Solberg: ");
    expect(io.stderr.text).toContain("Same passphrase again: ");
    expect(io.stderr.text + io.stdout.text).not.toContain(PHRASE);
    expect(await registered(dbPath)).toEqual(["Mira Solberg"]);
  });

  it("treats backspace as a correction while typing", async () => {
    const dbPath = tempDbPath();
    const io = terminalIo([`${PHRASE}x\u007f\r`, `${PHRASE}\r`]);
    expect(await signerAddCommand(["Mira Solberg"], io, { dbPath, passphraseCost: FAST_SCRYPT })).toBe(0);
  });

  it("registers nothing when the two entries differ", async () => {
    const dbPath = tempDbPath();
    const io = terminalIo([`${PHRASE}\r`, `${PHRASE} typo\r`]);
    expect(await signerAddCommand(["Mira Solberg"], io, { dbPath, passphraseCost: FAST_SCRYPT })).toBe(2);
    expect(io.stderr.text).toMatch(/the two entries differ/);
    expect(await registered(dbPath)).toEqual([]);
  });

  it("stops on Ctrl-C with exit code 130", async () => {
    const dbPath = tempDbPath();
    const io = terminalIo(["lich\u0003"]);
    expect(await signerAddCommand(["Mira Solberg"], io, { dbPath })).toBe(130);
    expect(io.stdin.rawModes.at(-1)).toBe(false);
    expect(await registered(dbPath)).toEqual([]);
  });

  it("refuses a taken name before asking for a passphrase", async () => {
    const dbPath = tempDbPath();
    await signerAddCommand(["Mira Solberg"], pipedIo(PHRASE), { dbPath, passphraseCost: FAST_SCRYPT });
    const io = terminalIo([]);
    expect(await signerAddCommand(["mira solberg"], io, { dbPath })).toBe(1);
    expect(io.stderr.text).toMatch(/already registered/);
    expect(io.stdin.rawModes).toEqual([]);
  });

  it("refuses a short passphrase, several lines, or no name, with exit code 2 and the reason", async () => {
    const dbPath = tempDbPath();
    const short = pipedIo("too short\n");
    expect(await signerAddCommand(["Mira Solberg"], short, { dbPath })).toBe(2);
    expect(short.stderr.text).toMatch(/passphrase: must be at least 12 characters/);
    const lines = pipedIo(`${PHRASE}\n${PHRASE}\n`);
    expect(await signerAddCommand(["Mira Solberg"], lines, { dbPath })).toBe(2);
    expect(lines.stderr.text).toMatch(/more than one line/);
    const none = pipedIo(PHRASE);
    expect(await signerAddCommand([], none, { dbPath })).toBe(2);
    expect(none.stderr.text).toMatch(/usage: signer add NAME/);
    const blank = pipedIo(PHRASE);
    expect(await signerAddCommand(["   "], blank, { dbPath })).toBe(2);
    expect(blank.stderr.text).toMatch(/name must not be empty/);
    expect(await registered(dbPath)).toEqual([]);
  });
});
