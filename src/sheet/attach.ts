/**
 * The sheet carries its own inputs: the check's input JSON rides in the PDF as an attached file,
 * and the fingerprint sits in the document information, so `verify` can recompute a sheet from
 * the sheet alone.
 *
 *   const signed = await attachInput(pdf, JSON.stringify(input, null, 2), {
 *     title, subject, fingerprint: fingerprint(input), engineVersion: ENGINE_VERSION });
 *   const json = await extractAttachment(signed, INPUT_ATTACHMENT);   // Uint8Array | null
 *   const info = await readSheetInfo(signed);                        // { fingerprint, ... }
 *
 * Where it sits in the PDF (ISO 32000-1): the file is an embedded file stream (7.11.4) referred
 * to by a file specification (7.11.3), listed under the catalog's /Names /EmbeddedFiles name tree
 * (7.7.4, 7.9.6) and, for PDF/A-3 readers, in the catalog's /AF array with
 * /AFRelationship /Source: it is the data the document was made from. Viewers show it as an
 * attachment; poppler's `pdfdetach -list` lists it.
 */
import { INPUT_ATTACHMENT } from "../schema/attachments.ts";
import { inflateSync } from "node:zlib";
import {
  AFRelationship,
  PDFArray,
  PDFDict,
  PDFDocument,
  PDFHexString,
  PDFName,
  PDFNumber,
  PDFRawStream,
  PDFString,
  type PDFObject,
} from "pdf-lib";

export interface SheetInfo {
  /** Document title: the check's title. */
  title: string;
  /** Document subject, e.g. "Pressure-cycle check of a cylindrical shell skin". */
  subject: string;
  /** SHA-256 (hex) of the canonical input and the engine version (src/schema/canonical.ts). */
  fingerprint: string;
  /** The engine version the fingerprint was made with. */
  engineVersion: string;
}

/** Information dictionary keys of our own beside the standard ones (ISO 32000-1, 14.3.3 allows them). */
const FINGERPRINT_KEY = PDFName.of("HoopwiseFingerprint");
const ENGINE_KEY = PDFName.of("HoopwiseEngine");

/**
 * Attach `inputJson` as INPUT_ATTACHMENT and set the title, subject, keywords (which hold
 * `sha256:<fingerprint>` so ordinary viewers show it) and the fingerprint fields. Returns the new
 * PDF; the bytes passed in are not changed.
 */
export async function attachInput(
  pdf: Uint8Array,
  inputJson: string,
  info: SheetInfo,
  more?: (doc: PDFDocument) => Promise<void>,
): Promise<Uint8Array> {
  const doc = await PDFDocument.load(pdf);
  // Further attachments go in the same load/save pass: each pass re-parses and re-writes the whole PDF.
  await more?.(doc);
  const now = new Date();
  await doc.attach(new TextEncoder().encode(inputJson), INPUT_ATTACHMENT, {
    mimeType: "application/json",
    description: "The check input this sheet was computed from; recompute it to verify the sheet.",
    creationDate: now,
    modificationDate: now,
    afRelationship: AFRelationship.Source,
  });
  doc.setTitle(info.title, { showInWindowTitleBar: true });
  doc.setSubject(info.subject);
  doc.setKeywords(["hoopwise", `sha256:${info.fingerprint}`, info.engineVersion]);
  doc.setCreator("Hoopwise");
  doc.setProducer("Hoopwise (Chromium, pdf-lib)");
  const infoDict = doc.context.lookup(doc.context.trailerInfo.Info, PDFDict);
  infoDict.set(FINGERPRINT_KEY, PDFString.of(info.fingerprint));
  infoDict.set(ENGINE_KEY, PDFHexString.fromText(info.engineVersion));
  return doc.save();
}

/** What readSheetInfo finds; a field is absent when the PDF does not have it. */
export interface SheetInfoFound {
  title?: string;
  subject?: string;
  keywords?: string;
  fingerprint?: string;
  engineVersion?: string;
}

/** The document information attachInput wrote, as far as it is there. */
export async function readSheetInfo(pdf: Uint8Array): Promise<SheetInfoFound> {
  const doc = await PDFDocument.load(pdf, { updateMetadata: false });
  const info = doc.context.lookup(doc.context.trailerInfo.Info);
  if (!(info instanceof PDFDict)) return {};
  return {
    title: text(info.lookup(PDFName.Title)),
    subject: text(info.lookup(PDFName.Subject)),
    keywords: text(info.lookup(PDFName.Keywords)),
    fingerprint: text(info.lookup(FINGERPRINT_KEY)),
    engineVersion: text(info.lookup(ENGINE_KEY)),
  };
}

export interface ExtractOptions {
  /** Refuse a file larger than this once decoded (a small PDF can inflate to gigabytes). Default 16 MiB. */
  maxBytes?: number;
}

/** Deeper than any real name tree; a bound for malformed ones. */
const MAX_TREE_DEPTH = 32;

/**
 * The bytes of the attached file `name`, or null when the PDF has no such attachment.
 * Throws an Error with a plain message when the file is there but cannot be read (an encoding
 * this reader does not decode, or larger than `maxBytes`). Meant for PDFs from anywhere: cycles
 * and odd object types in the name tree are passed over, not followed.
 */
export async function extractAttachment(pdf: Uint8Array, name: string, options: ExtractOptions = {}): Promise<Uint8Array | null> {
  const maxBytes = options.maxBytes ?? 16 * 1024 * 1024;
  const doc = await PDFDocument.load(pdf, { updateMetadata: false });
  const tree = dictAt(dictAt(doc.catalog, "Names"), "EmbeddedFiles");
  const spec = tree && findInNameTree(tree, name);
  const files = spec && dictAt(spec, "EF");
  // UF is the Unicode file name's stream where a writer gives both; they are the same file.
  const stream = files && (files.lookup(PDFName.of("UF")) ?? files.lookup(PDFName.of("F")));
  if (!(stream instanceof PDFRawStream)) return null;
  return decodeStream(stream, name, maxBytes);
}

/**
 * Search a name tree (ISO 32000-1, 7.9.6): a node holds either /Kids (further nodes) or /Names
 * (key, value, key, value, ...). Intermediate /Limits are not trusted; every node is looked at.
 */
function findInNameTree(root: PDFDict, wanted: string): PDFDict | null {
  const visited = new Set<PDFDict>();
  const stack: Array<{ node: PDFDict; depth: number }> = [{ node: root, depth: 0 }];
  while (stack.length > 0) {
    const { node, depth } = stack.pop()!;
    if (visited.has(node) || depth > MAX_TREE_DEPTH) continue;
    visited.add(node);
    const names = node.lookup(PDFName.of("Names"));
    if (names instanceof PDFArray) {
      for (let i = 0; i + 1 < names.size(); i += 2) {
        const value = names.lookup(i + 1);
        if (text(names.lookup(i)) === wanted && value instanceof PDFDict) return value;
      }
    }
    const kids = node.lookup(PDFName.of("Kids"));
    if (kids instanceof PDFArray) {
      for (let i = kids.size() - 1; i >= 0; i -= 1) {
        const kid = kids.lookup(i);
        if (kid instanceof PDFDict) stack.push({ node: kid, depth: depth + 1 });
      }
    }
  }
  return null;
}

/** Unfiltered or FlateDecode (what pdf-lib and most writers use), inflated with a size cap. */
function decodeStream(stream: PDFRawStream, name: string, maxBytes: number): Uint8Array {
  const filter = stream.dict.lookup(PDFName.of("Filter"));
  const filters = filter instanceof PDFArray ? filter.asArray().map((f) => stream.dict.context.lookup(f)) : filter ? [filter] : [];
  const tooLarge = () => new Error(`The attached file ${name} is larger than ${maxBytes} bytes; it was not read.`);
  if (filters.length === 0) {
    if (stream.contents.length > maxBytes) throw tooLarge();
    return stream.contents;
  }
  if (filters.length === 1 && filters[0] === PDFName.of("FlateDecode") && !usesPredictor(stream)) {
    try {
      return new Uint8Array(inflateSync(stream.contents, { maxOutputLength: maxBytes }));
    } catch (cause) {
      if ((cause as NodeJS.ErrnoException).code === "ERR_BUFFER_TOO_LARGE") throw tooLarge();
      throw new Error(`The attached file ${name} is damaged: ${(cause as Error).message}`, { cause });
    }
  }
  const described = filters.map((f) => (f instanceof PDFName ? f.decodeText() : String(f))).join(", ");
  throw new Error(`The attached file ${name} is encoded with ${described}, which this reader does not decode.`);
}

function usesPredictor(stream: PDFRawStream): boolean {
  const parms = stream.dict.lookup(PDFName.of("DecodeParms"));
  const predictor = parms instanceof PDFDict ? parms.lookup(PDFName.of("Predictor")) : undefined;
  return predictor instanceof PDFNumber && predictor.asNumber() > 1;
}

function dictAt(dict: PDFDict | undefined, key: string): PDFDict | undefined {
  const value = dict?.lookup(PDFName.of(key));
  return value instanceof PDFDict ? value : undefined;
}

function text(value: PDFObject | undefined): string | undefined {
  return value instanceof PDFString || value instanceof PDFHexString ? value.decodeText() : undefined;
}
