import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { Readable } from "node:stream";
import { afterAll, describe, expect, it } from "vitest";
import { sheetCommand, verifyCommand } from "../../src/cli/sheet.ts";
import type { Io } from "../../src/cli/io.ts";
import { DEMOS } from "../../src/demo/index.ts";
import { chromiumBelow } from "../pdf/processes.ts";

const dir = mkdtempSync(join(tmpdir(), "hoopwise-cli-sheet-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const receiver = DEMOS.find((d) => d.id === "receiver")!.document;
const receiverFile = join(dir, "receiver.json");
writeFileSync(receiverFile, JSON.stringify(receiver));

/** Standard streams in memory. */
function memoryIo(stdin = "") {
  const out: (string | Uint8Array)[] = [];
  const err: string[] = [];
  const io: Io = {
    stdin: Readable.from([stdin]),
    stdout: { write: (s: string | Uint8Array) => out.push(s) },
    stderr: { write: (s: string) => err.push(s) },
  };
  return {
    io,
    stdout: () => out.map((c) => (typeof c === "string" ? c : Buffer.from(c).toString("latin1"))).join(""),
    stderr: () => err.join(""),
  };
}

const RENDER = { timeout: 90_000 };

describe("sheet and verify commands", () => {
  it("write a sheet (exit 0) that verifies (exit 0), and leave no Chromium running", RENDER, async () => {
    const pdf = join(dir, "receiver.pdf");
    const made = memoryIo();
    expect(await sheetCommand([receiverFile, "--out", pdf, "--paper", "Letter"], made.io)).toBe(0);
    expect(readFileSync(pdf).subarray(0, 5).toString("latin1")).toBe("%PDF-");
    expect(made.stderr()).toMatch(/^wrote .*receiver\.pdf: verdict pass \(passes this screening check\), fingerprint [0-9a-f]{64}\n$/);
    // The command closed the shared pool: nothing keeps the process alive.
    expect(chromiumBelow()).toEqual([]);

    const text = memoryIo();
    expect(await verifyCommand([pdf], text.io)).toBe(0);
    expect(text.stdout()).toMatch(/^Sheet .*receiver\.pdf: VERIFIED$/m);
    expect(text.stdout()).toMatch(/Results\s+the same as recorded/);

    const json = memoryIo();
    expect(await verifyCommand(["--json", pdf], json.io)).toBe(0);
    const report = JSON.parse(json.stdout());
    expect(report).toMatchObject({ ok: true, input: { found: true, valid: true }, fingerprint: { matches: true }, problems: [] });
  });

  it("reads the check from standard input and writes the PDF to standard output with - and -", RENDER, async () => {
    const piped = memoryIo(JSON.stringify(receiver));
    expect(await sheetCommand(["-", "--out=-"], piped.io)).toBe(0);
    expect(piped.stdout().startsWith("%PDF-")).toBe(true);
  });

  it("answers invalid input with the errors document and exit 2, writing nothing", async () => {
    const pdf = join(dir, "never.pdf");
    const bad = memoryIo(JSON.stringify({ ...receiver, shell: { ...receiver.shell, radius_mm: "wide" } }));
    expect(await sheetCommand(["-", "--out", pdf], bad.io)).toBe(2);
    expect(JSON.parse(bad.stdout())).toEqual({ errors: [{ path: "shell.radius_mm", message: "the radius must be a number" }] });
    expect(existsSync(pdf)).toBe(false);

    const args = memoryIo();
    expect(await sheetCommand([receiverFile, "--paper", "Legal", "--colour"], args.io)).toBe(2);
    expect(JSON.parse(args.stdout()).errors.map((e: { path: string }) => e.path)).toEqual(["--colour", "--out", "--paper"]);
  });

  it("exits 1 with a plain message when there is no Chromium", RENDER, async () => {
    const pdf = join(dir, "no-chromium.pdf");
    const saved = process.env.CHROME_PATH;
    process.env.CHROME_PATH = join(dir, "no-such-chromium");
    try {
      const run = memoryIo();
      expect(await sheetCommand([receiverFile, "--out", pdf], run.io)).toBe(1);
      expect(run.stderr()).toMatch(/^hoopwise: cannot make the sheet: No Chromium found at .*no-such-chromium \(from CHROME_PATH\)/);
      expect(run.stdout()).toBe("");
      expect(existsSync(pdf)).toBe(false);
    } finally {
      if (saved === undefined) delete process.env.CHROME_PATH;
      else process.env.CHROME_PATH = saved;
    }
  });

  it("verify exits 1 for a file that is not a sheet, and 2 without a file", async () => {
    const notPdf = join(dir, "not.pdf");
    writeFileSync(notPdf, "this is not a PDF");
    const run = memoryIo();
    expect(await verifyCommand([notPdf], run.io)).toBe(1);
    expect(run.stdout()).toMatch(/DOES NOT VERIFY/);
    expect(run.stdout()).toMatch(/cannot be read as a PDF/);

    const none = memoryIo();
    expect(await verifyCommand([], none.io)).toBe(2);
    expect(none.stderr()).toMatch(/give one sheet to verify/);
    const missing = memoryIo();
    expect(await verifyCommand([join(dir, "absent.pdf")], missing.io)).toBe(2);
    expect(missing.stderr()).toMatch(/cannot read .*absent\.pdf: ENOENT/);
  });
});
