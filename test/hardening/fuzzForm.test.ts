/**
 * The checker page's form and link routes, and the records pages' forms, under hostile input:
 * 1 000 generated posts, files and links. Every answer is a page (or fragment, or a redirect after
 * a save) — a result, or the message beside the field — and never a 5xx.
 */
import { postedForm } from "../web/postedForm.ts";
import { deflateRawSync } from "node:zlib";
import fc from "fast-check";
import { afterAll, describe, expect, it } from "vitest";
import { DEMOS } from "../../src/demo/index.ts";
import { NUMBER_FIELDS } from "../../src/web/form/index.ts";
import { bounded, expectErrorsDoc } from "./answers.ts";
import { wholeApp } from "./app.ts";
import { BASES, bodyOf, documentOf, hostileValue, plan } from "./hostile.ts";

const whole = wholeApp();
const { app } = whole;
const saved = await whole.store.createCheck({ input: { ...DEMOS[0].document, calcNumber: "FORM-FUZZ-1" } });
afterAll(() => whole.close());

const formOf = (doc: unknown) => postedForm(doc);

const NAMES = [
  ...Object.keys(NUMBER_FIELDS),
  ...[
    "title",
    "project",
    "calcNumber",
    "notes",
    "material.name",
    "given.basis",
    "shell.form",
    "shell.radiusAt",
    "shell.theory",
    "pressure.mode",
    "cutout.kind",
  ],
  ...[
    "material.id",
    "material.shown",
    "fatigue.meanStress",
    "fatigue.curve",
    "fatigue.localYield",
    "fatigue.surface",
    "fatigue.notch",
    "crack.geometry",
  ],
  ...[
    "crack.cracksAtHole",
    "crack.on",
    "crack.bulging",
    "evidence.on",
    "evidence.lives",
    "history.text",
    "units.length",
    "units.stress",
    "units.pressure",
  ],
  ...["units.altitude", "units.shown", "use", "solve", "blocks.more", "blocks.0.max", "blocks.1.cycles", "blocks.40.min", "record"],
];
const formValue = fc.oneof(
  fc.constantFrom(
    "",
    " ",
    "NaN",
    "Infinity",
    "-Infinity",
    "1e999",
    "-1e999",
    "1e-400",
    "-0",
    "5e-324",
    "1e308",
    "0x10",
    "1,5",
    "1 000",
    "١٢٣",
    "−2",
    "\u0000",
  ),
  fc.constantFrom(
    "direct",
    "altitude",
    "history",
    "blocks",
    "none",
    "given",
    "elliptical-hole",
    "walker",
    "swt",
    "welded",
    "hole-through",
    "on",
    "q",
    "peterson",
  ),
  fc.constantFrom(
    "in",
    "psi",
    "ksi",
    "ft",
    "bar",
    "kPa",
    "mm MPa kPa m",
    "in ksi psi ft",
    "thickness",
    "pressure",
    "thickness:1.2",
    "pressure:1e999",
    "thickness:-1",
  ),
  fc.constantFrom("0, 0.8, 0.2, 0.9, 0", "time,p\n0,0\n1,0.5\n2,0", "41000 52000 x", "1e12, 1e12"),
  fc.double().map(String),
  fc.string({ maxLength: 30 }),
  fc.integer({ min: 1_000, max: 100_000 }).map((n) => "9".repeat(n)),
);
const formEdit = fc.record({
  name: fc.oneof({ weight: 5, arbitrary: fc.constantFrom(...NAMES) }, { weight: 1, arbitrary: fc.string({ maxLength: 20 }) }),
  value: fc.option(formValue, { nil: undefined }),
});
const form = fc.record({ base: fc.nat({ max: BASES.length - 1 }), edits: fc.array(formEdit, { maxLength: 6 }) }).map(({ base, edits }) => {
  const values = formOf(BASES[base]);
  for (const e of edits) {
    if (e.value === undefined) delete values[e.name];
    else values[e.name] = e.value;
  }
  return values;
});

/** The link the page writes for a check: raw DEFLATE of the JSON text, in base64url. */
const linkOf = (text: string) => deflateRawSync(Buffer.from(text, "utf8")).toString("base64url");

/** A request as plain data, so fast-check can print a failing one; built into a Request when sent. */
type Sent =
  | { kind: "urlencoded"; path: string; values: Record<string, string>; type?: string; hx?: boolean }
  | { kind: "multipart"; path: string; values: Record<string, string> }
  | { kind: "file"; text: string }
  | { kind: "link"; path: string; json: string }
  | { kind: "records"; path: string; values: Record<string, string> };

function requestOf(s: Sent): Request {
  const url = (path: string) => `http://127.0.0.1${path}`;
  switch (s.kind) {
    case "urlencoded": {
      const headers: Record<string, string> = s.type === undefined ? {} : { "content-type": s.type };
      if (s.hx) headers["hx-request"] = "true";
      return new Request(url(s.path), { method: "POST", headers, body: new URLSearchParams(s.values).toString() });
    }
    case "multipart": {
      const body = new FormData();
      for (const [k, v] of Object.entries(s.values)) body.append(k, v);
      body.append("history.file", new Blob(["time,p\n0,0\n1,0.4\n2,0"]), "log.csv");
      return new Request(url(s.path), { method: "POST", body });
    }
    case "file": {
      const body = new FormData();
      body.append("file", new Blob([s.text]), "check.json");
      return new Request(url("/import"), { method: "POST", body });
    }
    case "link":
      return new Request(url(`${s.path}?c=${linkOf(s.json)}`), { headers: s.path === "/plots" ? { "hx-request": "true" } : {} });
    case "records":
      return new Request(url(s.path), {
        method: "POST",
        headers: { "content-type": URLENCODED },
        body: new URLSearchParams(s.values).toString(),
      });
  }
}

/** A records form field: a fair value most of the time, hostile text otherwise. */
const recordField = (...fair: string[]) =>
  fc.option(fc.oneof({ weight: 3, arbitrary: fc.constantFrom(...fair) }, { weight: 1, arbitrary: formValue }), { nil: undefined });
const defined = (r: Record<string, string | undefined>) =>
  Object.fromEntries(Object.entries(r).filter((e): e is [string, string] => e[1] !== undefined));
const PASSPHRASE = "quiet copper heron at dusk";
const recordsPost: fc.Arbitrary<Sent> = fc.oneof(
  fc
    .record({
      form,
      savedBy: recordField("Odile Farthing", ""),
      record: recordField(saved.id, "no-such-check", ""),
      as: recordField("new"),
    })
    .map(({ form, ...more }) => ({
      kind: "records" as const,
      path: "/records/save",
      values: { ...form, ...defined(more) },
    })),
  fc
    .record({
      revision: recordField("1", "2", "0", "x"),
      role: recordField("prepared", "checked", "approved", "boss"),
      name: recordField("Odile Farthing", "Pim Aldous"),
      passphrase: recordField(PASSPHRASE, "short"),
    })
    .map((v) => ({
      kind: "records" as const,
      path: `/records/${saved.id}/sign`,
      values: defined(v),
    })),
  fc
    .record({
      name: recordField("Odile Farthing", "Pim Aldous", " "),
      role: recordField("engineer", "admin", "boss"),
      passphrase: recordField(PASSPHRASE, "short"),
      again: recordField(PASSPHRASE, "other words entirely"),
    })
    .map((v) => ({
      kind: "records" as const,
      path: "/records/people",
      values: defined(v),
    })),
  fc
    .record({
      document: fc.oneof(
        plan.map((p) => bodyOf(documentOf(p))),
        hostileValue.map((v) => String(v)),
      ),
      savedBy: recordField("Odile Farthing"),
    })
    .map((v) => ({
      kind: "records" as const,
      path: `/records/${saved.id}/revisions`,
      values: defined(v),
    })),
);

const URLENCODED = "application/x-www-form-urlencoded";
const sent: fc.Arbitrary<Sent> = fc.oneof(
  fc.record({
    kind: fc.constant("urlencoded" as const),
    path: fc.constantFrom("/", "/recalc", "/export"),
    values: form,
    type: fc.constant(URLENCODED),
    hx: fc.boolean(),
  }),
  fc.record({ kind: fc.constant("multipart" as const), path: fc.constantFrom("/", "/recalc"), values: form }),
  fc.record({
    kind: fc.constant("urlencoded" as const),
    path: fc.constantFrom("/", "/recalc"),
    values: form,
    type: fc.constantFrom("text/plain", "application/json", undefined),
  }),
  fc.record({
    kind: fc.constant("file" as const),
    text: fc.oneof(
      plan.map((p) => bodyOf(documentOf(p))),
      fc.constant("{ not json"),
    ),
  }),
  fc.record({
    kind: fc.constant("link" as const),
    path: fc.constantFrom("/", "/plots", "/export", "/recalc"),
    json: plan.map((p) => bodyOf(documentOf(p))),
  }),
  recordsPost,
);

/** A page that refuses says why: a message beside a field, in the list of general problems, or as a notice. */
function saysWhy(html: string): boolean {
  return (
    /<p class="field-error"[^>]*>[^<\s][^<]*<\/p>/.test(html) ||
    /<p class="notice" role="alert">/.test(html) ||
    /class="stale-note"[\s\S]*?<li>/.test(html)
  );
}

describe("the page's form and link routes under 1 000 generated requests", () => {
  it("answer with a page or fragment that shows the result or says what to correct, never a 5xx", { timeout: 300_000 }, async () => {
    let results = 0;
    await fc.assert(
      fc.asyncProperty(sent, async (s) => {
        const label = `${s.kind} ${"path" in s ? s.path : "/import"}`;
        const res = await bounded(label, app.request(requestOf(s)));
        if (s.kind === "records") {
          // A save or a signature redirects to the record; a refusal is the page with the reason;
          // the sign and register forms take 64 KiB at most.
          expect([200, 303, 403, 404, 409, 413, 422, 429], label).toContain(res.status);
          if (res.status === 303) expect(res.headers.get("location")).toMatch(/^\/records\//);
          else {
            if (res.status !== 413) expect(res.headers.get("content-type"), label).toMatch(/^text\/html/);
            expect((await res.text()).trim(), label).not.toBe("");
          }
          return;
        }
        expect([200, 422], label).toContain(res.status);
        const type = res.headers.get("content-type") ?? "";
        const text = await res.text();
        if (type.startsWith("application/json")) {
          // The download of a valid check, or the errors document of GET /export.
          const json = JSON.parse(text);
          if (res.status === 200)
            expect(res.headers.get("content-disposition")).toMatch(/^attachment; filename="hoopwise-[a-z0-9-]+\.json"$/);
          else expectErrorsDoc(json);
          return;
        }
        expect(type, label).toMatch(/^text\/html/);
        if (res.status === 422) expect(saysWhy(text), `${label}: a 422 page must say what to correct`).toBe(true);
        if (/class="verdict verdict-(pass|fail|refer)"/.test(text)) results += 1;
      }),
      { numRuns: 1_000 },
    );
    // The generator is worth its name only if many of its posts get as far as a result.
    expect(results).toBeGreaterThan(50);
  });
});
