/** Debian's poppler-utils, as an outside reader of the PDFs we write. */
import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";

/** Run `fn` with `pdf` written to a temporary file and a scratch directory beside it. */
export function withPdfFile<T>(pdf: Uint8Array, fn: (file: string, dir: string) => T): T {
  const dir = mkdtempSync(join(tmpdir(), "hoopwise-test-"));
  try {
    const file = join(dir, "sheet.pdf");
    writeFileSync(file, pdf);
    return fn(file, dir);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

function run(tool: string, args: string[]): string {
  return execFileSync(tool, args, { encoding: "utf8" });
}

export const pdfText = (pdf: Uint8Array): string => withPdfFile(pdf, (f) => run("pdftotext", ["-layout", f, "-"]));

export const pdfInfo = (pdf: Uint8Array): string => withPdfFile(pdf, (f) => run("pdfinfo", ["-enc", "UTF-8", f]));

export const pdfdetachList = (pdf: Uint8Array): string => withPdfFile(pdf, (f) => run("pdfdetach", ["-list", f]));

/** The bytes pdfdetach saves for attachment number `n` (1-based, as pdfdetach counts). */
export function pdfdetachSave(pdf: Uint8Array, n: number): Buffer {
  return withPdfFile(pdf, (f, dir) => {
    const out = join(dir, "saved");
    run("pdfdetach", ["-save", String(n), "-o", out, f]);
    return readFileSync(out);
  });
}
