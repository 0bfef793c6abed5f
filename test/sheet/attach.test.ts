import { afterAll, describe, expect, it } from "vitest";
import { PDFDict, PDFDocument, PDFHexString, PDFName, PDFString, type PDFRef } from "pdf-lib";
import { ENGINE_VERSION } from "../../src/engine/version.ts";
import { INPUT_ATTACHMENT } from "../../src/schema/attachments.ts";
import { attachInput, extractAttachment, readSheetInfo } from "../../src/sheet/attach.ts";
import { createBrowserPool } from "../../src/pdf/browser.ts";
import { renderPdf } from "../../src/pdf/pdf.ts";
import { fingerprint } from "../../src/engine/fingerprint.ts";
import { pdfdetachList, pdfdetachSave, pdfInfo } from "./poppler.ts";

const pool = createBrowserPool({ concurrency: 1 });
afterAll(() => pool.close());

// Invented input; its shape follows the check format but nothing here is computed.
const input = {
  format: "hoopwise.check/1",
  title: "Invented receiver R-7 — Prüfung 圧力",
  shell: { form: "cylinder", radius_mm: 400, thickness_mm: 6 },
  pressure: { max_MPa: 1.1 },
};
const inputJson = JSON.stringify(input, null, 2);
const info = {
  title: input.title,
  subject: "Pressure-cycle check of a shell skin",
  fingerprint: fingerprint(input),
  engineVersion: ENGINE_VERSION,
};

describe("attachInput and extractAttachment", () => {
  it("round-trip the input through a Chromium sheet, readable by pdfdetach and pdfinfo", { timeout: 60_000 }, async () => {
    const sheet = await renderPdf("<p>Invented sheet</p>", { paper: "A4", pool });
    const signed = await attachInput(sheet, inputJson, info);

    const back = await extractAttachment(signed, INPUT_ATTACHMENT);
    expect(new TextDecoder().decode(back!)).toBe(inputJson);

    // poppler, an independent reader, finds the same file with the same bytes.
    expect(pdfdetachList(signed)).toMatch(/^1 embedded files\n1: hoopwise-input\.json$/m);
    expect(pdfdetachSave(signed, 1).toString("utf8")).toBe(inputJson);

    const meta = pdfInfo(signed);
    expect(meta).toMatch(/^Title:\s+Invented receiver R-7 — Prüfung 圧力$/m);
    expect(meta).toMatch(/^Subject:\s+Pressure-cycle check of a shell skin$/m);
    expect(meta).toContain(`sha256:${info.fingerprint}`);
    expect(await readSheetInfo(signed)).toMatchObject({
      title: info.title,
      subject: info.subject,
      fingerprint: info.fingerprint,
      engineVersion: ENGINE_VERSION,
    });
    // The sheet's own pages are still there.
    expect((await PDFDocument.load(signed)).getPageCount()).toBe(1);
  });

  it("finds files in a name tree split into Kids, compressed or not", async () => {
    const doc = await PDFDocument.create();
    doc.addPage();
    const ctx = doc.context;
    const spec = (name: string, stream: ReturnType<typeof ctx.stream>): PDFRef =>
      ctx.register(ctx.obj({ Type: "Filespec", F: PDFString.of(name), UF: PDFHexString.fromText(name), EF: { F: ctx.register(stream) } }));
    const bytes = (s: string) => new TextEncoder().encode(s);
    // ISO 32000-1, 7.9.6: leaves hold Names [key value ...] and Limits [first last]; the root holds Kids.
    const leaf = (name: string, ref: PDFRef) =>
      ctx.register(ctx.obj({ Limits: [PDFString.of(name), PDFString.of(name)], Names: [PDFString.of(name), ref] }));
    const kids = [
      leaf("a-plain.json", spec("a-plain.json", ctx.stream(bytes('{"a":1}'), { Type: "EmbeddedFile" }))),
      leaf("b-packed.json", spec("b-packed.json", ctx.flateStream(bytes('{"b":2}'), { Type: "EmbeddedFile" }))),
    ];
    doc.catalog.set(PDFName.of("Names"), ctx.obj({ EmbeddedFiles: ctx.obj({ Kids: kids }) }));
    const pdf = await doc.save();

    // poppler lists both, so the hand-built tree is a valid one.
    expect(pdfdetachList(pdf)).toMatch(/^2 embedded files\n1: a-plain\.json\n2: b-packed\.json$/m);
    expect(new TextDecoder().decode((await extractAttachment(pdf, "a-plain.json"))!)).toBe('{"a":1}');
    expect(new TextDecoder().decode((await extractAttachment(pdf, "b-packed.json"))!)).toBe('{"b":2}');
    expect(await extractAttachment(pdf, "c-absent.json")).toBeNull();
  });

  it("answers null for a PDF without attachments and for a name tree that loops", async () => {
    const plain = await PDFDocument.create();
    plain.addPage();
    expect(await extractAttachment(await plain.save(), INPUT_ATTACHMENT)).toBeNull();

    const looped = await PDFDocument.create();
    looped.addPage();
    const rootRef = looped.context.register(looped.context.obj({}));
    looped.context.lookup(rootRef, PDFDict).set(PDFName.of("Kids"), looped.context.obj([rootRef]));
    looped.catalog.set(PDFName.of("Names"), looped.context.obj({ EmbeddedFiles: rootRef }));
    expect(await extractAttachment(await looped.save(), INPUT_ATTACHMENT)).toBeNull();
  });

  it("refuses a file larger than maxBytes once inflated, and encodings it does not decode", async () => {
    const blank = await PDFDocument.create();
    blank.addPage();
    const signed = await attachInput(await blank.save(), inputJson, info);
    const size = new TextEncoder().encode(inputJson).length;
    await expect(extractAttachment(signed, INPUT_ATTACHMENT, { maxBytes: size - 1 })).rejects.toThrow(`larger than ${size - 1} bytes`);
    expect(await extractAttachment(signed, INPUT_ATTACHMENT, { maxBytes: size })).toHaveLength(size);

    const doc = await PDFDocument.create();
    doc.addPage();
    const ctx = doc.context;
    const hex = ctx.stream(new TextEncoder().encode("7B7D>"), { Type: "EmbeddedFile", Filter: "ASCIIHexDecode" });
    const spec = ctx.register(ctx.obj({ Type: "Filespec", F: PDFString.of("hex.json"), EF: { F: ctx.register(hex) } }));
    doc.catalog.set(PDFName.of("Names"), ctx.obj({ EmbeddedFiles: ctx.obj({ Names: [PDFString.of("hex.json"), spec] }) }));
    await expect(extractAttachment(await doc.save(), "hex.json")).rejects.toThrow(
      "encoded with ASCIIHexDecode, which this reader does not decode",
    );
  });
});
