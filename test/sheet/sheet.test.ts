import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PDFArray, PDFDict, PDFDocument, PDFHexString, PDFName, PDFString } from "pdf-lib";
import { DEMOS } from "../../src/demo/index.ts";
import { checkDocument } from "../../src/engine/index.ts";
import { INPUT_ATTACHMENT } from "../../src/schema/attachments.ts";
import { createBrowserPool } from "../../src/pdf/browser.ts";
import type { RequestRecord } from "../../src/pdf/pdf.ts";
import { RESULT_ATTACHMENT } from "../../src/sheet/record.ts";
import { renderSheet, sheetHtml, type SheetOutcome } from "../../src/sheet/sheet.ts";
import { verifySheet } from "../../src/sheet/verify.ts";
import { parseCheck } from "../../src/engine/input.ts";
import { canonicalJson } from "../../src/schema/index.ts";
import { CAUTIONS, stepResultText } from "../../templates/sheet.tsx";
import { pdfdetachList, pdfdetachSave, pdfInfo, pdfText } from "./poppler.ts";

const pool = createBrowserPool({ concurrency: 2 });
afterAll(() => pool.close());

const cabin = DEMOS.find((d) => d.id === "cabin")!.document;
const receiver = DEMOS.find((d) => d.id === "receiver")!.document;
const printedOn = new Date("2025-03-14T09:30:00Z");
const RENDER = { timeout: 90_000 };

/**
 * Text compared without layout: pdftotext's spacing, the thin spaces between thousands and the
 * direction marks poppler puts around right-to-left runs are not the property under test.
 */
const squash = (s: string) => s.replace(/[\s\u2009\u202f\u202a-\u202e\u200e\u200f]+/g, "");

function pdfOf(out: SheetOutcome): Uint8Array {
  if (!out.ok) throw new Error(`expected a sheet, got errors ${JSON.stringify(out.errors)}`);
  return out.pdf;
}

/** Replace the bytes of one attached file, as someone editing the PDF by hand would. */
async function replaceAttachment(pdf: Uint8Array, name: string, bytes: Uint8Array): Promise<Uint8Array> {
  const doc = await PDFDocument.load(pdf, { updateMetadata: false });
  const names = doc.catalog
    .lookup(PDFName.of("Names"), PDFDict)
    .lookup(PDFName.of("EmbeddedFiles"), PDFDict)
    .lookup(PDFName.of("Names"), PDFArray);
  for (let i = 0; i < names.size(); i += 2) {
    const key = names.lookup(i);
    if (!(key instanceof PDFString || key instanceof PDFHexString) || key.decodeText() !== name) continue;
    const ef = names.lookup(i + 1, PDFDict).lookup(PDFName.of("EF"), PDFDict);
    const stream = doc.context.register(doc.context.flateStream(bytes, { Type: "EmbeddedFile" }));
    ef.set(PDFName.of("F"), stream);
    if (ef.has(PDFName.of("UF"))) ef.set(PDFName.of("UF"), stream);
    return doc.save();
  }
  throw new Error(`no attachment ${name}`);
}

describe("the cabin demo's sheet", () => {
  let pdf: Uint8Array;
  let text: string;
  const log: RequestRecord[] = [];
  const outcome = checkDocument(cabin);
  if (!outcome.ok) throw new Error("the cabin demo must be a valid check");
  const result = outcome.result;

  beforeAll(async () => {
    pdf = pdfOf(await renderSheet(cabin, { pool, now: printedOn, requestLog: log }));
    text = pdfText(pdf);
  }, 90_000);

  it("holds the title, the verdict, the cautions, the sign-off block and the fingerprint", () => {
    expect(text).toContain("Cabin barrel skin at the window belt");
    expect(text).toContain("Larkspur L-30 commuter (invented demo)");
    expect(text).toContain("L30-FUS-017");
    // The demo window is far too large for a membrane screening of this barrel (β above 0.5): it refers.
    expect(text).toContain("Screening outcome: REFER");
    for (const caution of CAUTIONS) expect(squash(text)).toContain(squash(caution));
    for (const role of ["Prepared by", "Checked by", "Approved by"]) expect(text).toContain(role);
    expect(text).toContain("UNCHECKED DRAFT — NOT FOR USE");
    // The full fingerprint on every page (in the footer) and in the title block on page 1.
    const pages = Number(/^Pages:\s+(\d+)$/m.exec(pdfInfo(pdf))![1]);
    expect(pages).toBeGreaterThan(1);
    expect(text.split(result.fingerprint).length - 1).toBe(pages + 1);
    expect(text).toContain(`Page ${pages} of ${pages}`);
  });

  it("prints every step of the calculation with its result as the sheet formats it", () => {
    const calc = text.slice(text.indexOf("Calculation\n"), text.search(/^\s*4\s+Results$/m));
    // Each step is numbered "(n)" at the start of its block; its result sits inside that block.
    const blocks = calc.split(/^\((\d+)\)\s/m).slice(1);
    const byNumber = new Map<number, string>();
    for (let i = 0; i < blocks.length; i += 2) byNumber.set(Number(blocks[i]), blocks[i + 1]);
    expect([...byNumber.keys()]).toEqual(result.steps.map((_, i) => i + 1));
    result.steps.forEach((step, i) => {
      const shown = stepResultText(step);
      expect(squash(byNumber.get(i + 1)!), `step ${i + 1} (${step.id})`).toContain(squash(shown.value));
    });
  });

  it("prints numbers as a person writes them: true minus signs and powers of ten", () => {
    // The life is above 10⁶, so it is written with a power of ten, never in computer notation.
    expect(text).toMatch(/\d × 10\S* cycles/);
    expect(text).not.toMatch(/\d[eE][+-]\d/); // no computer notation such as 1.9e+12
    expect(text).toContain("−0.102"); // the Basquin exponent, with U+2212
  });

  it("carries its input, which pdfdetach finds and which is the canonical JSON of the parsed check", () => {
    expect(pdfdetachList(pdf)).toMatch(new RegExp(`^1: ${INPUT_ATTACHMENT.replace(".", "\\.")}$`, "m"));
    expect(pdfdetachList(pdf)).toMatch(new RegExp(`^2: ${RESULT_ATTACHMENT.replace(".", "\\.")}$`, "m"));
    const parsed = parseCheck(cabin);
    if (!parsed.ok) throw new Error("unreachable");
    expect(pdfdetachSave(pdf, 1).toString("utf8")).toBe(canonicalJson(parsed.value.document));
    expect(pdfInfo(pdf)).toContain(`sha256:${result.fingerprint}`);
  });

  it("fetched nothing while it was printed", () => {
    expect(log).toEqual([]);
  });

  it("verifies as printed", async () => {
    const report = await verifySheet(pdf);
    expect(report.problems).toEqual([]);
    expect(report.ok).toBe(true);
    expect(report.fingerprint).toMatchObject({ recorded: result.fingerprint, recomputed: result.fingerprint, matches: true });
    expect(report.results).toMatchObject({ recorded: true, verdictThen: "refer", verdictNow: "refer", matches: true, differences: [] });
  });

  it("fails verification when the attached input was changed", async () => {
    const parsed = parseCheck(cabin);
    if (!parsed.ok) throw new Error("unreachable");
    const thinner = { ...parsed.value.document, shell: { ...parsed.value.document.shell, thickness_mm: 0.8 } };
    const forged = await replaceAttachment(pdf, INPUT_ATTACHMENT, new TextEncoder().encode(canonicalJson(thinner)));
    const report = await verifySheet(forged);
    expect(report.ok).toBe(false);
    expect(report.fingerprint.matches).toBe(false);
    expect(report.problems.join(" ")).toMatch(/input was changed after the sheet was printed/);
    // A thinner skin gives other numbers than the paper: the report names them.
    expect(report.results.differences.map((d) => d.what)).toContain("membrane.hoopMax_MPa");
  });

  it("fails verification when the recorded results were changed, or the input is not JSON", async () => {
    const record = JSON.parse(pdfdetachSave(pdf, 2).toString("utf8"));
    record.values["fatigue.damage"] = 0.5;
    const edited = await replaceAttachment(pdf, RESULT_ATTACHMENT, new TextEncoder().encode(JSON.stringify(record)));
    const report = await verifySheet(edited);
    expect(report.ok).toBe(false);
    expect(report.fingerprint.matches).toBe(true); // the input is intact; the record is not
    expect(report.results.differences).toEqual([{ what: "fatigue.damage", recorded: "0.5", now: String(result.fatigue.damage) }]);

    const garbled = await verifySheet(await replaceAttachment(pdf, INPUT_ATTACHMENT, new TextEncoder().encode("{ not json")));
    expect(garbled.ok).toBe(false);
    expect(garbled.problems.join(" ")).toMatch(/not valid JSON/);
  });
});

describe("signed, superseded and paper sizes", () => {
  it("fills the sign-off block from the records and marks a superseded revision", RENDER, async () => {
    const signoffs = [
      { role: "prepared" as const, name: "Invented Preparer Ann", signedAt: "2025-03-10T08:15:00Z" },
      { role: "checked" as const, name: "Invented Checker Bo", signedAt: "2025-03-12T16:40:00Z" },
    ];
    const signed = pdfText(pdfOf(await renderSheet(receiver, { pool, revision: 3, signoffs, now: printedOn })));
    expect(signed).toContain("Invented Preparer Ann");
    expect(signed).toContain("2025-03-10 08:15 UTC");
    expect(signed).toContain("Invented Checker Bo");
    expect(signed).toContain("Rev. 3");
    expect(signed).toContain("CHECKED — AWAITING APPROVAL");
    expect(signed).not.toContain("UNCHECKED DRAFT");

    const old = pdfText(
      pdfOf(await renderSheet(receiver, { pool, revision: 2, signoffs, superseded: true, now: printedOn, paper: "Letter" })),
    );
    expect(old).toContain("SUPERSEDED — DO NOT USE");
    expect(old).toContain("This revision is superseded.");
  });

  it("prints on A4 and on US Letter", RENDER, async () => {
    const a4 = pdfInfo(pdfOf(await renderSheet(receiver, { pool, paper: "A4" })));
    // ISO 216: A4 is 210 × 297 mm; poppler names the size.
    expect(a4).toMatch(/^Page size:.*\(A4\)$/m);
    const letter = pdfInfo(pdfOf(await renderSheet(receiver, { pool, paper: "Letter" })));
    // US Letter is 8.5 × 11 in = 612 × 792 pt.
    expect(letter).toMatch(/^Page size:\s+612 x 792 pts \(letter\)$/m);
  });
});

describe("hostile text", () => {
  const script = `<script>document.title="pwned"</script>`;
  const image = `<img src=file:///etc/passwd>`;
  const frame = `<iframe src="http://127.0.0.1:9/x"></iframe><link rel=stylesheet href=file:///etc/passwd>`;
  const hebrew = "בדיקת מעטפת";
  // No lam-alef in the Arabic: poppler writes that ligature's two letters back in reverse order.
  const arabic = "فحص قشرة الخزان";
  const cjk = "压力容器检查";
  const hostile = `${script}${image} ${hebrew} ${arabic} ${cjk}`;
  const doc = {
    ...receiver,
    title: `${hostile} ${"T".repeat(300)}`.slice(0, 300),
    project: `${frame} ${hostile}`,
    calcNumber: `${image}${cjk}`.slice(0, 100),
    notes: `${frame}\n${hostile}\n${"N".repeat(2000)}`,
    material: { id: "steel-p265gh", name: `${script} ${hebrew} ${arabic}` },
    cutout: { kind: "given" as const, kt: 2.5, basis: `${image} ${frame} ${hostile}` },
  };
  const signoffs = [{ role: "prepared" as const, name: `${script}${hebrew}${cjk}`, signedAt: `${image}` }];

  it("is refused with a clear error where the schema limits its length", () => {
    const out = sheetHtml({ ...doc, title: "T".repeat(2000) });
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.errors).toEqual([{ path: "title", message: "the title must be at most 300 characters" }]);
  });

  it("comes out escaped in the HTML, header and footer", () => {
    const out = sheetHtml(doc, { signoffs });
    if (!out.ok) throw new Error(JSON.stringify(out.errors));
    for (const html of [out.html, out.headerHtml, out.footerHtml]) {
      expect(html).not.toContain("<script>document");
      expect(html).not.toContain("<img src=file");
      expect(html).not.toContain("<iframe src=");
      expect(html).not.toContain("<link rel=stylesheet");
    }
    expect(out.html).toContain("&lt;script&gt;document.title=&quot;pwned&quot;&lt;/script&gt;");
    expect(out.headerHtml).toContain("&lt;img src=file:///etc/passwd&gt;");
    // Text in any script is passed through as it is.
    for (const s of [hebrew, arabic, cjk]) expect(out.html).toContain(s);
  });

  it("prints as literal text in every field and fetches nothing", RENDER, async () => {
    const log: RequestRecord[] = [];
    const out = await renderSheet(doc, { pool, signoffs, requestLog: log });
    const text = squash(pdfText(pdfOf(out)));
    expect(log).toEqual([]);
    expect(text).not.toMatch(/root:.*:0:0:/); // the first line of /etc/passwd
    // Title, project, notes, material name, Kt basis and the signer's name each carry the script tag.
    expect(text.split(squash(script)).length - 1).toBeGreaterThanOrEqual(6);
    // Calculation number (page 1 and header), title, Kt basis and signed-at carry the image tag.
    expect(text.split(squash(image)).length - 1).toBeGreaterThanOrEqual(4);
    expect(text).toContain(squash(frame));
    expect(text).toContain("N".repeat(500)); // the long note wraps inside the page, whole
    // Right-to-left text comes out in its logical order. (CJK is checked in the HTML and the
    // attached input: whether it has glyphs on paper depends on the fonts installed.)
    expect(text).toContain(squash(hebrew));
    expect(text).toContain(squash(arabic));
    // The sheet still verifies: every character of the input survives the PDF.
    expect((await verifySheet(pdfOf(out))).ok).toBe(true);
  });
});

describe("concurrency", () => {
  it("renders 10 sheets at once, all complete and each its own, with the pool never above its bound", RENDER, async () => {
    const titles = Array.from({ length: 10 }, (_, i) => `Invented receiver course ${i + 1} of ten`);
    const outs = await Promise.all(titles.map((title) => renderSheet({ ...receiver, title }, { pool })));
    for (const [i, out] of outs.entries()) {
      const pdf = pdfOf(out);
      expect(pdfText(pdf)).toContain(titles[i]);
      expect((await verifySheet(pdf)).ok).toBe(true);
    }
    expect(pool.stats().peakRunning).toBe(2); // the pool's concurrency, reached and not passed
    expect(pool.stats().running).toBe(0);
  });
});

describe("bad input", () => {
  it("names the field of a bad check or a bad option, without starting Chromium", async () => {
    const unused = createBrowserPool({ executablePath: "/nonexistent/chromium" });
    const bad = await renderSheet({ ...receiver, shell: { ...receiver.shell, thickness_mm: -1 } }, { pool: unused });
    expect(bad).toEqual({ ok: false, errors: [{ path: "shell.thickness_mm", message: "the wall thickness must be greater than 0" }] });
    const badOptions = await renderSheet(receiver, {
      pool: unused,
      revision: 0,
      signoffs: [{ role: "checked", name: "", signedAt: "2025-01-01" }],
    });
    expect(badOptions.ok).toBe(false);
    if (!badOptions.ok) {
      expect(badOptions.errors.map((e) => e.path)).toEqual(["(sheet).revision", "(sheet).signoffs.0.name"]);
    }
    expect(unused.stats().launches).toBe(0);
    await unused.close();
  });
});
