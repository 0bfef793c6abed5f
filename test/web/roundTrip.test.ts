import { describe, expect, it } from "vitest";
import { DEMOS } from "../../src/demo/index.ts";
import { checkDocument } from "../../src/engine/index.ts";
import { unitsFrom } from "../../src/schema/units.ts";
import { createApp } from "../../src/web/app.ts";
import { readPosted } from "../../src/web/form/index.ts";
import { unshownParts } from "../../src/web/form/carry.ts";
import { encodeCheck } from "../../src/web/link.ts";
import { pageRoutes } from "../../src/web/page.tsx";
import { browserFields } from "./formFields.ts";
import { SPARSE } from "../fixtures/documents.ts";

/**
 * A document opened, linked or loaded as a demo must give the same result as its form posted
 * back unchanged: the page shows the document's numbers first, and "Work it out" with nothing
 * changed must not move them. The property under test is equality of the two results (no
 * reference value is involved); the fingerprint differs only because the form spells out the
 * defaults the document left to the schema.
 */

/** Every leaf of a result by path, without the fingerprint. */
function leaves(x: unknown, path = "", out = new Map<string, unknown>()): Map<string, unknown> {
  if (x !== null && typeof x === "object") for (const [k, v] of Object.entries(x)) leaves(v, path ? `${path}.${k}` : k, out);
  else if (path !== "fingerprint") out.set(path, x);
  return out;
}

function expectSameResult(a: unknown, b: unknown) {
  const la = leaves(a);
  const lb = leaves(b);
  expect([...lb.keys()].sort()).toEqual([...la.keys()].sort());
  for (const [p, x] of la) {
    const y = lb.get(p);
    // Numbers shown in a field keep six significant figures (formNumber), so a converted value may move in the 6th digit.
    if (typeof x === "number" && typeof y === "number")
      expect(Math.abs(x - y), p).toBeLessThanOrEqual(1e-5 * Math.max(Math.abs(x), 1e-300));
    else if (typeof x === "string" && typeof y === "string") expect(y.replace(/[\d.]+/g, "#"), p).toBe(x.replace(/[\d.]+/g, "#"));
    else expect(y, p).toEqual(x);
  }
}

const CASES: [string, Record<string, unknown>][] = [
  ...DEMOS.map((d) => [`demo ${d.id}`, d.document] as [string, Record<string, unknown>]),
  ...SPARSE,
];

const app = createApp({ mounts: [pageRoutes()] });

/** The check the page works out for a posted form, as the page's own reader understands it. */
async function postedDocument(fields: Record<string, string>) {
  return (await readPosted(new Request("http://x/", { method: "POST", body: new URLSearchParams(fields) }))).document;
}

describe("a document and its form posted back unchanged give one result", () => {
  it.each(CASES)("%s: opened by a link, then “Work it out” with nothing changed", async (_name, doc) => {
    const units = unitsFrom((doc as { display?: unknown }).display as Record<string, unknown> | undefined);
    const first = checkDocument({ ...doc, display: units });
    expect(first.ok).toBe(true);
    const opened = await (await app.request(`/?c=${encodeCheck(doc)}`)).text();
    const again = checkDocument(await postedDocument(browserFields(opened)));
    expect(again.ok, JSON.stringify(again.ok ? "" : again.errors)).toBe(true);
    if (first.ok && again.ok) expectSameResult(first.result, again.result);
  });

  it("shows every damage-tolerance and fleet key in a field of its own; only the crack-growth Walker exponent rides hidden", () => {
    const doc = SPARSE.find(([name]) => name.startsWith("every damage-tolerance key"))?.[1];
    expect(doc).toBeDefined();
    expect(unshownParts(doc, unitsFrom(undefined))).toEqual({ "crack.walkerGamma": 0.6 });
    const cabin = DEMOS.find((d) => d.id === "cabin")?.document;
    const carried = unshownParts(cabin, unitsFrom(cabin?.display as Record<string, unknown> | undefined)) ?? {};
    expect(Object.keys(carried).filter((k) => k.startsWith("crack.") || k.startsWith("fleet."))).toEqual([]);
  });

  it("shows every kind-of-shell, static-basis and vessel-fatigue key in a field of its own", () => {
    const vesselKey = (k: string) =>
      k === "shell.service" ||
      k.startsWith("static.") ||
      ["fatigue.curve", "fatigue.weldDetail", "fatigue.detailCategory_MPa", "fatigue.temperature_C", "fatigue.roughnessRz_um"].includes(k);
    const docs = [
      DEMOS.find((d) => d.id === "receiver")?.document,
      ...SPARSE.filter(([name]) => /vessel|aircraft cabin/.test(name)).map(([, d]) => d),
    ];
    expect(docs.length).toBe(4);
    for (const doc of docs) {
      const carried = unshownParts(doc, unitsFrom((doc as { display?: Record<string, unknown> } | undefined)?.display)) ?? {};
      expect(Object.keys(carried).filter(vesselKey)).toEqual([]);
    }
  });

  it("the cabin demo's crack row is the same before and after pressing “Work it out” unchanged", async () => {
    const opened = await (await app.request("/?demo=cabin")).text();
    const posted = await (await app.request("/", { method: "POST", body: new URLSearchParams(browserFields(opened)) })).text();
    // The row is found by the title the engine gives it, not by a copy of its words.
    const demo = checkDocument(DEMOS.find((d) => d.id === "cabin")?.document);
    const title = demo.ok ? demo.result.verdictTable.find((r) => r.id === "crack")?.title : undefined;
    expect(title).toBeDefined();
    const escaped = (title ?? "").replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
    const crackRow = (html: string) => new RegExp(`<th scope="row">${escaped}[\\s\\S]*?</tr>`).exec(html)?.[0];
    expect(crackRow(opened)).toBeDefined();
    expect(crackRow(posted)).toBe(crackRow(opened));
  });
});
