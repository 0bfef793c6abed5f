/**
 * The check sheet: a check document in, a PDF ready to check and sign out.
 *
 *   const out = await renderSheet(json, { paper: "A4", revision: 2, signoffs });
 *   if (out.ok) writeFileSync("sheet.pdf", out.pdf); else print(out.errors);
 *
 * Steps: parse and run the check; build the HTML from templates/; print it through the Chromium
 * pool (pdf.ts: no script, no fetch); attach the canonical input and the metadata (attach.ts);
 * attach the results record (record.ts) that `verify` compares against.
 *
 * Bad input (the check or the options) comes back as { ok: false, errors }. Renderer trouble
 * is thrown as the errors of errors.ts (BrowserUnavailableError, PoolBusyError,
 * RenderTimeoutError, BrowserCrashedError) for the face to map.
 */
import { InputError, runCheck, type CheckResult } from "../engine/index.ts";
import { parseCheck } from "../engine/input.ts";
import { canonicalJson, type FieldError } from "../schema/index.ts";
import { unitsFrom } from "../schema/units.ts";
import { sheetBody, type SheetModel, type SignOff } from "../../templates/sheet.tsx";
import { footerHtml, headerHtml, SHEET_MARGINS } from "./margins.tsx";
import { attachInput } from "./attach.ts";
import type { BrowserPool } from "../pdf/browser.ts";
import { renderPdf, type RequestRecord } from "../pdf/pdf.ts";
import { attachRecord, recordOf } from "./record.ts";
import { parseSheetOptions } from "./sheetOptions.ts";
import { attachSignoffs, type SheetSignoffs } from "./signatures.ts";

export type { SignOff } from "../../templates/sheet.tsx";

export interface SheetOptions {
  paper?: "A4" | "Letter";
  /** Revision in the records; leave out for a check that is not saved. */
  revision?: number;
  /** Sign-offs from the records; roles not given print blank lines to sign by hand. */
  signoffs?: SignOff[];
  /** A later revision exists: the sheet is marked superseded on every page. */
  superseded?: boolean;
  /** The records' calculation number, printed instead of the input's. */
  calcNumber?: string;
  /** An imported revision whose sign-offs were not kept. */
  importedUnsigned?: boolean;
  /** The sign-offs with their signatures, attached for `verify`; their key's fingerprint is printed. */
  signatures?: SheetSignoffs;
  /** The date printed on the sheet. Default: now. */
  now?: Date;
  /** Render on this pool. Default: the shared pool. */
  pool?: BrowserPool;
  /** Receives one record per request the sheet tried to make (none are expected). */
  requestLog?: RequestRecord[];
  /** Time limit of the render. Default: the pool's. */
  timeout_ms?: number;
}

export type SheetOutcome = { ok: true; pdf: Uint8Array; result: CheckResult; fingerprint: string } | { ok: false; errors: FieldError[] };

/** The sheet as Chromium prints it: the page body, and the header and footer for every page. */
export interface SheetDocument {
  html: string;
  headerHtml: string;
  footerHtml: string;
}

export type SheetHtmlOutcome =
  | ({ ok: true; result: CheckResult; model: SheetModel; canonicalInput: string } & SheetDocument)
  | { ok: false; errors: FieldError[] };

/** The sheet's HTML, header and footer without Chromium: for tests, previews and renderSheet. */
export function sheetHtml(json: unknown, opts: Omit<SheetOptions, "pool" | "requestLog" | "timeout_ms"> = {}): SheetHtmlOutcome {
  const layout = parseSheetOptions({
    paper: opts.paper,
    revision: opts.revision,
    signoffs: opts.signoffs,
    superseded: opts.superseded,
    calcNumber: opts.calcNumber,
    importedUnsigned: opts.importedUnsigned,
    keyFingerprint: opts.signatures?.keyFingerprint,
  });
  const parsed = parseCheck(json);
  if (!parsed.ok || !layout.ok) return { ok: false, errors: [...(parsed.ok ? [] : parsed.errors), ...(layout.ok ? [] : layout.errors)] };
  let result: CheckResult;
  try {
    result = runCheck(parsed.value);
  } catch (err) {
    if (err instanceof InputError) return { ok: false, errors: [{ path: err.path, message: err.message }] };
    throw err;
  }
  const model: SheetModel = {
    document: parsed.value.document,
    material: parsed.value.material,
    result,
    units: unitsFrom(parsed.value.document.display),
    revision: layout.value.revision,
    signoffs: layout.value.signoffs,
    superseded: layout.value.superseded,
    calcNumber: layout.value.calcNumber,
    importedUnsigned: layout.value.importedUnsigned,
    keyFingerprint: layout.value.keyFingerprint,
    printedOn: opts.now ?? new Date(),
    paper: layout.value.paper,
  };
  return {
    ok: true,
    result,
    model,
    canonicalInput: canonicalJson(parsed.value.document),
    html: sheetBody(model),
    headerHtml: headerHtml(model),
    footerHtml: footerHtml(model),
  };
}

export async function renderSheet(json: unknown, opts: SheetOptions = {}): Promise<SheetOutcome> {
  const sheet = sheetHtml(json, opts);
  if (!sheet.ok) return sheet;
  const { result, model } = sheet;
  const printed = await renderPdf(sheet.html, {
    paper: model.paper,
    headerHtml: sheet.headerHtml,
    footerHtml: sheet.footerHtml,
    margin: SHEET_MARGINS,
    pool: opts.pool,
    requestLog: opts.requestLog,
    timeout_ms: opts.timeout_ms,
  });
  const pdf = await attachInput(
    printed,
    sheet.canonicalInput,
    {
      title: model.document.title ?? "Check sheet",
      subject: `Pressure-cycle check of a ${model.document.shell.form === "cylinder" ? "cylindrical" : "spherical"} shell skin`,
      fingerprint: result.fingerprint,
      engineVersion: result.engine,
    },
    async (doc) => {
      await attachRecord(doc, recordOf(result), model.printedOn);
      if (opts.signatures) await attachSignoffs(doc, opts.signatures, model.printedOn);
    },
  );
  return { ok: true, pdf, result, fingerprint: result.fingerprint };
}
