import { Hono } from "hono";
import { bodyLimit } from "hono/body-limit";
import { sharedPool, WorkPoolBusy, type WorkPool } from "../pool/index.ts";
import { formatValue } from "../plots/format.ts";
import { escapeXml as escapeHtml } from "../plots/index.ts";
import { logChoice, logField } from "./form/log.ts";

/** A log of 10⁷ readings of about ten characters each, with room to spare. */
export const MAX_LOG_BYTES = 160 * 1024 * 1024;

const limit = bodyLimit({
  maxSize: MAX_LOG_BYTES,
  onError: (c) => c.html(`<p class="field-error" role="alert">The log is larger than ${MAX_LOG_BYTES / 1048576} MiB.</p>`, 413),
});

const DELIMITERS: Record<string, string> = { "\t": "tabs", ";": "semicolons", ",": "commas" };

/**
 * POST /log/preview — the page's logger's file read with the form's choices and drawn as logged
 * (min/max per pixel column), in a worker thread so a long log holds up no one. Answers an HTML
 * fragment for the preview box; a log that cannot be read gets its messages there, as a 200, so
 * htmx shows them.
 */
export function logPreviewRoutes(opts: { pool?: WorkPool } = {}): Hono {
  const app = new Hono();
  app.post("/log/preview", limit, async (c) => {
    let form: FormData;
    try {
      form = await c.req.raw.formData();
    } catch {
      return c.html(problems(["the form could not be read; choose the file again"]));
    }
    const values: Record<string, string> = {};
    form.forEach((v, k) => {
      if (typeof v === "string") values[k] = v;
    });
    const file = form.get("log.file");
    if (!(file instanceof File) || file.size === 0) return c.html(problems(["choose the logger's file (CSV or TSV) to preview"]));
    const choice = logChoice(values);
    if (choice.errors.size) return c.html(problems([...choice.errors].flatMap(([f, m]) => m.map((x) => `${label(f)}: ${x}`))));
    let answer: Awaited<ReturnType<WorkPool["previewLog"]>>;
    try {
      answer = await (opts.pool ?? sharedPool()).previewLog(new Uint8Array(await file.arrayBuffer()), choice.opts);
    } catch (err) {
      if (!(err instanceof WorkPoolBusy)) throw err;
      return c.html(problems(["every worker is busy with large documents; try again shortly"]), 503, { "retry-after": "2" });
    }
    if (!answer.ok) return c.html(problems(answer.errors.map((e) => `${label(logField(e.path))}: ${e.message}`)));
    const unit = choice.opts.unit ?? "MPa";
    const summary = `${formatValue(answer.rows, 9)} readings from column ${choice.opts.column}, cells separated by ${DELIMITERS[answer.delimiter] ?? `"${answer.delimiter}"`}; pressure from ${formatValue(answer.min)} to ${formatValue(answer.max)} ${unit}.`;
    return c.html(
      `<p class="log-summary">${escapeHtml(summary)}</p>${answer.svg}<p class="hint">Drawn in ${answer.drawn_ms.toFixed(0)} ms as the lowest and highest reading of each pixel column. The check counts every reading.</p>`,
    );
  });
  return app;
}

function label(field: string): string {
  return field === "log.file" ? "the file" : field.replace(/^log\./, "");
}

function problems(lines: string[]): string {
  return `<ul class="field-error log-errors" role="alert">${lines.map((l) => `<li>${escapeHtml(l)}</li>`).join("")}</ul>`;
}
