import { describe, expect, it } from "vitest";
import { DEMOS } from "../../src/demo/index.ts";
import { applyCarried, unshownParts } from "../../src/web/form/carry.ts";
import { writeForm } from "../../src/web/form/index.ts";
import { understand } from "../../src/web/form/posted.ts";
import { unitsFrom } from "../../src/schema/units.ts";

const SI = unitsFrom({});
/** A check with parts the form has no field for: coupon data and a crack-growth Walker exponent. */
const doc = structuredClone(DEMOS[0].document) as Record<string, any>;
doc.material = { ...doc.material, coupons: [{ amplitude_MPa: 200, life_cycles: 1e5, runout: false }] };
doc.crack = { ...doc.crack, walkerGamma: 0.6 };

describe("parts of a check the form cannot show", () => {
  it("are found, and only those", () => {
    const parts = unshownParts(doc, SI)!;
    expect(parts["material.coupons"]).toEqual(doc.material.coupons);
    expect(parts["crack.walkerGamma"]).toBe(0.6);
    expect(parts["shell.thickness_mm"]).toBeUndefined();
    // The cabin window's fastener holes have no field in the form: they ride along.
    const cabinCutout = DEMOS[0].document.cutout as { fasteners?: unknown };
    expect(unshownParts(DEMOS[0].document, SI)).toEqual({ "cutout.fasteners": cabinCutout.fasteners });
    expect(unshownParts(DEMOS[1].document, SI)).toBeUndefined();
  });

  it("ride along through an edit of the form and come back into the document", () => {
    const values = { ...writeForm(doc, SI), carry: JSON.stringify(unshownParts(doc, SI)), "shell.thickness": "1.2" };
    const posted = understand(values);
    const m = posted.document.material as Record<string, unknown>;
    expect(m.coupons).toEqual(doc.material.coupons);
    expect((posted.document.crack as Record<string, unknown>).walkerGamma).toBe(0.6);
    expect((posted.document.shell as Record<string, unknown>).thickness_mm).toBe(1.2);
    expect(posted.values.carry).toBe(values.carry);
  });

  it("do not bring back a section the user switched off, nor overwrite what the form says", () => {
    const target: Record<string, unknown> = { material: { id: "al-2024-t3" }, shell: { thickness_mm: 2 } };
    applyCarried(target, JSON.stringify({ "crack.walkerGamma": 0.6, "shell.thickness_mm": 9, "material.coupons": [], "__proto__.x": 1 }));
    expect(target.crack).toBeUndefined();
    expect((target.shell as Record<string, unknown>).thickness_mm).toBe(2);
    expect((target.material as Record<string, unknown>).coupons).toEqual([]);
    expect(({} as Record<string, unknown>).x).toBeUndefined();
    applyCarried(target, "{not json");
  });
});

describe("on the page", () => {
  it("a linked check with coupons keeps them through a plain form post", async () => {
    const { pageRoutes } = await import("../../src/web/page.tsx");
    const { createApp } = await import("../../src/web/app.ts");
    const { encodeCheck } = await import("../../src/web/link.ts");
    const app = createApp({ mounts: [pageRoutes()] });
    const html = await (await app.request(`/?c=${encodeCheck(doc)}`)).text();
    const carry = /name="carry" value="([^"]*)"/.exec(html);
    expect(carry).not.toBeNull();
    const value = carry![1]
      .replace(/&quot;/g, '"')
      .replace(/&amp;/g, "&")
      .replace(/&lt;/g, "<")
      .replace(/&gt;/g, ">")
      .replace(/&#39;/g, "'");
    expect(JSON.parse(value)["material.coupons"]).toEqual(doc.material.coupons);
  });
});
