/**
 * @module test/present/faces.test
 * The page and the sheet read one result and say the same thing, in the reader's units.
 */
import { describe, expect, it } from "vitest";
import { DEMOS, findDemo } from "../../src/demo/index.ts";
import { checkDocument, type CheckResult } from "../../src/engine/index.ts";
import { parseCheck } from "../../src/engine/input.ts";
import { haighDiagram } from "../../src/plots/index.ts";
import { CRITERION_NAMES, VERDICT_COLUMNS } from "../../src/present/words.ts";
import { MEAN_STRESS_CRITERIA } from "../../src/schema/check.ts";
import { SI_UNITS } from "../../src/schema/units.ts";
import { sheetHtml } from "../../src/sheet/sheet.ts";
import { createApp } from "../../src/web/app.ts";
import { pageRoutes } from "../../src/web/page.tsx";
import { encodeCheck } from "../../src/web/link.ts";
import { VerdictSummary } from "../../views/results/verdict.tsx";
import { VerdictTable } from "../../templates/results.tsx";

/**
 * The page and the sheet read one result, so they must say the same thing. Each case here is a
 * drift the two faces once had; the property under test is agreement between the faces (or with
 * the engine's own structure), not a reference value.
 */
const app = createApp({ mounts: [pageRoutes()] });
const page = async (demo: string) => (await app.request(`/?demo=${demo}`)).text();
const sheet = (doc: unknown) => {
  const out = sheetHtml(doc, { now: new Date("2026-01-01T00:00:00Z") });
  if (!out.ok) throw new Error(JSON.stringify(out.errors));
  return out.html;
};
const strip = (html: string) => html.replace(/<[^>]+>/g, "").trim();

describe("page and sheet agree", () => {
  it.each(DEMOS.map((d) => d.id))("%s: every verdict row shows the same reserve on the page and on the sheet", async (id) => {
    const doc = findDemo(id)!.document;
    const table = (html: string, start: string) => html.slice(html.indexOf(start), html.indexOf("</table>", html.indexOf(start)));
    const onPage = [...table(await page(id), 'class="verdict-table"').matchAll(/<td class="num">([^<]*)<\/td>/g)].map((m) => m[1]);
    const onSheet = [...table(sheet(doc), '<table class="verdict">').matchAll(/<td class="n">([^<]*)<\/td>/g)].map((m) => m[1]);
    expect(onPage.length).toBeGreaterThan(1);
    expect(onSheet).toEqual(onPage);
    // A reserve of 0.2345 reads "+23 %" on both (one formatter, src/present/numbers.ts).
    expect(onPage.some((t) => /^[+−]\d[\d\u2009]* %$|^over/.test(t))).toBe(true);
  });

  it("the verdict table's columns carry the same headings on the page and on the sheet (the sheet said Margin, the page Reserve)", async () => {
    const headings = (html: string, start: string) => {
      const at = html.indexOf(start);
      const head = html.slice(at, html.indexOf("</thead>", at));
      return [...head.matchAll(/<th[^>]*>([^<]*)<\/th>/g)].map((m) => m[1]).sort();
    };
    const onPage = headings(await page("cabin"), 'class="verdict-table"');
    const onSheet = headings(sheet(findDemo("cabin")!.document), '<table class="verdict">');
    expect(onPage).toEqual(Object.values(VERDICT_COLUMNS).sort());
    expect(onSheet).toEqual(onPage);
  });

  it("the receiver's life-against-thickness axis counts passes on the page as on the sheet", async () => {
    const axis = (html: string) => /class="hoopwise-plot plot-life-thickness"[^>]*aria-label="([^"]*)"/.exec(html)?.[1];
    const receiver = findDemo("receiver")!.document;
    const onPage = axis(await page("receiver"));
    const onSheet = axis(sheet(receiver));
    expect(onPage).toBeDefined();
    expect(onPage).toMatch(/passes/);
    expect(onSheet).toBe(onPage);
  });

  it("both faces mark the row the engine names as governing, without reading its sentence", () => {
    const run = checkDocument(findDemo("cabin")!.document);
    if (!run.ok) throw new Error("cabin demo must run");
    // A paraphrased sentence must not move the mark: only governing.rowId decides it.
    const r: CheckResult = {
      ...run.result,
      governs: "something else entirely",
      governing: { rowId: "static", text: "Static strength", parts: ["Static strength"] },
    };
    const onSheet = String(VerdictTable({ r, units: SI_UNITS }));
    expect(/<tr class="governs"><td>([^<]*)/.exec(onSheet)?.[1]).toMatch(/^Static strength/);
    const onPage = String(VerdictSummary({ result: r, units: SI_UNITS }));
    // The page's headline gives the governing row's reserve: the static one.
    expect(onPage).toContain(`reserve +${Math.round(r.static.margin * 100)}`);
  });

  it("the cautions say the same on the page and the sheet", async () => {
    const html = await page("cabin");
    const printed = strip(sheet(findDemo("cabin")!.document));
    for (const sentence of ["not a code-compliance certificate", "licensed or authorized engineer", "verify them against certified data"]) {
      expect(html).toContain(sentence);
      expect(printed).toContain(sentence);
    }
  });
});

describe("one list of criterion names", () => {
  it("the Haigh legend names every criterion as the engine and the form do", () => {
    const svg = haighDiagram(
      {
        operating: { mean_MPa: 40, amplitude_MPa: 40 },
        equivalentAmplitude_MPa: 50,
        ultimate_MPa: 480,
        yield_MPa: 345,
        fatigueStrengthCoefficient_MPa: 900,
        walkerGamma: 0.5,
      },
      { units: SI_UNITS },
    );
    const label = /aria-label="[^"]*lines: ([^"]*)"/.exec(svg)?.[1];
    expect(label?.split(", ")).toEqual(MEAN_STRESS_CRITERIA.map((c) => CRITERION_NAMES[c]));
  });
});

describe("the engine orders the calculation", () => {
  it("with Marin factors the sheet prints the membrane stresses before the fatigue life", () => {
    const doc = structuredClone(findDemo("receiver")!.document) as Record<string, any>;
    doc.fatigue = { meanStress: "goodman", designLife_cycles: 20, modifiers: { surface: "machined" } };
    expect(parseCheck(doc).ok).toBe(true);
    const headings = [...sheet(doc).matchAll(/<h3>3\.\d+ ([^<]+)<\/h3>/g)].map((m) => m[1]);
    expect(headings.indexOf("Membrane stresses")).toBeGreaterThanOrEqual(0);
    expect(headings.indexOf("Membrane stresses")).toBeLessThan(headings.indexOf("Fatigue life"));
    // Each heading once: a section is never split around another.
    expect(new Set(headings).size).toBe(headings.length);
  });

  it("the welded method keeps its own steps and warnings", () => {
    const doc = structuredClone(findDemo("receiver")!.document) as Record<string, any>;
    doc.pressure = { max_MPa: 1.1, min_MPa: 0 };
    // The EN 1993-1-9 curve ("welded") on the receiver, in place of its vessel-code class.
    const { weldDetail: _detail, ...fatigue } = doc.fatigue;
    doc.fatigue = { ...fatigue, curve: "welded", detailCategory_MPa: 70, designLife_cycles: 2000 };
    const run = checkDocument(doc);
    if (!run.ok) throw new Error(JSON.stringify(run.errors));
    const ids = run.result.steps.map((s) => s.id);
    // EN 1993-1-9 §7.1: the design fatigue limit and the slope-3 life of the detail, as welded.ts works them.
    expect(ids).toContain("welded-fatigue-limit");
    expect(ids).toContain("welded-life");
    // 70 MPa is not a detail category of EN 1993-1-9 Table 8.x; welded.ts warns, and the warning must reach the result.
    expect(run.result.warnings.some((w) => /not one of the EN 1993-1-9 detail categories/.test(w))).toBe(true);
  });
});

describe("the reader's units reach the warnings", () => {
  const US = { length: "in", stress: "ksi", pressure: "psi", altitude: "ft" } as const;
  // The cabin demo with a wall thin enough that the notch yields, read in US units.
  const doc = structuredClone(findDemo("cabin")!.document) as Record<string, any>;
  doc.shell.thickness_mm *= 0.3;
  doc.display = US;
  const section = (html: string, start: string, end: string) => {
    const at = html.indexOf(start);
    expect(at, start).toBeGreaterThanOrEqual(0);
    return strip(html.slice(at, html.indexOf(end, at)));
  };
  const expectUS = (text: string) => {
    // The detectable size of a surface eddy-current inspection, 2.54 mm = 0.1 in exactly (1 in = 25.4 mm).
    expect(text).toContain("The detectable crack size (0.1 in)");
    // The library's yield strength of 2024-T3, 345 MPa = 345/6.894757 ksi = 50.04 ksi (1 ksi = 6.894757 MPa, NIST SP 811).
    expect(text).toContain("exceeds the yield strength (50.04 ksi)");
    expect(text).not.toMatch(/\d ?(MPa|mm)\b/);
  };

  it("on the page", async () => {
    const html = await (await app.request(`/?c=${encodeCheck(doc)}`)).text();
    expectUS(section(html, 'class="block warnings"', "</section>"));
  });

  it("on the sheet", () => {
    expectUS(section(sheet(doc), '<ul class="warnings">', "</ul>"));
  });
});

describe("the reader's units reach the Paris constants and the toughness", () => {
  const US = { length: "in", stress: "ksi", pressure: "psi", altitude: "ft" } as const;
  // The receiver's steel takes Barsom & Rolfe's ferrite–pearlite constants, da/dN = 6.9×10⁻¹² ΔK³ (m/cycle, MPa·√m),
  // which the same source gives as 3.6×10⁻¹⁰ ΔK³ in in/cycle with ΔK in ksi·√in (from memory). Worked by hand:
  // 1 ksi·√in = 6.894757 × √0.0254 = 1.098843 MPa·√m; 6.9×10⁻¹² × 1.098843³ / 0.0254 = 3.604×10⁻¹⁰.
  // Its toughness, 90 MPa·√m, is 90 / 1.098843 = 81.90 ksi·√in.
  const receiver = { ...findDemo("receiver")!.document, display: US };

  it("on the sheet's material rows, with SI beside", () => {
    const html = sheet(receiver);
    const row = (label: string) => {
      const at = html.indexOf(label);
      expect(at, label).toBeGreaterThanOrEqual(0);
      return strip(html.slice(at, html.indexOf("</tr>", at)));
    };
    expect(row("Paris coefficient C")).toMatch(/3\.604 × 10⁻¹⁰ in\/cycle per \(ksi·√in\)\^m.*6\.9 × 10⁻¹² m\/cycle per \(MPa·√m\)\^m/);
    expect(row("Fracture toughness")).toMatch(/81\.9 ksi·√in.*90 MPa·√m/);
  });

  it("on the page's form, as the library's values behind the blank fields", async () => {
    const html = await (await app.request("/?demo=receiver&length=in&stress=ksi&pressure=psi")).text();
    // A field's label and input: from its <div class="field"> to the end of its input.
    const field = (name: string) => {
      const at = html.indexOf(`name="${name}"`);
      expect(at, name).toBeGreaterThanOrEqual(0);
      return html.slice(html.lastIndexOf('<div class="field">', at), html.indexOf(">", at));
    };
    const c = field("material.parisC");
    expect(c).toContain("in/cycle per (ksi·√in)^m");
    expect(c).toMatch(/placeholder="3\.60432e-10"/);
    expect(field("material.toughness")).toMatch(/ksi·√in[\s\S]*placeholder="81\.9043"/);
  });

  it("read back from a form in US units into the format's SI", async () => {
    const { readForm } = await import("../../src/web/form/read.ts");
    const read = readForm({ "material.id": "", "material.parisC": "3.6e-10", "material.parisM": "3", "material.toughness": "100" }, US);
    const m = read.document.material as { parisC: number; toughness_MPaSqrtM: number };
    // Barsom & Rolfe's SI form of the same law: 6.89×10⁻¹² (from memory); 3.6×10⁻¹⁰ × 0.0254 / 1.098843³ = 6.892×10⁻¹².
    expect(Math.abs(m.parisC / 6.89e-12 - 1)).toBeLessThan(0.01);
    // 100 ksi·√in × 1.098843 = 109.88 MPa·√m.
    expect(m.toughness_MPaSqrtM).toBeCloseTo(109.88, 2);
  });

  it("written to the form in US units, switched to SI and read back, with the exponent typed or the library's", async () => {
    const { readForm } = await import("../../src/web/form/read.ts");
    const { convertValues, writeForm } = await import("../../src/web/form/write.ts");
    const own = { ...receiver, material: { ...receiver.material, parisC: 6.9e-12 } };
    const v = writeForm(own, US);
    // The library's m = 3 goes with a coefficient typed beside the library entry: 3.604×10⁻¹⁰ as worked above.
    expect(v["material.parisC"]).toBe("3.60432e-10");
    expect(Math.abs((readForm(v, US).document.material as { parisC: number }).parisC / 6.9e-12 - 1)).toBeLessThan(1e-5);
    // Switched to SI from the six figures the field shows: back to 6.9×10⁻¹² within the field's rounding.
    expect(Math.abs(Number(convertValues(v, US, SI_UNITS)["material.parisC"]) / 6.9e-12 - 1)).toBeLessThan(1e-5);
    // A typed exponent replaces the library's: with m = 4 the factor is 1.098843⁴ / 0.0254 = 57.40.
    const typed = writeForm({ ...own, material: { ...own.material, parisM: 4 } }, US);
    expect(Number(typed["material.parisC"]) / 6.9e-12).toBeCloseTo(57.4, 1);
  });
});

describe("the reader's units reach the error limits", () => {
  const fieldError = (html: string, name: string) => {
    const m = new RegExp(`<p class="field-error" id="e-${name.replace(/\./g, "-")}"[^>]*>([^<]*)</p>`).exec(html);
    return m?.[1];
  };
  const doc = (display: Record<string, string>) => {
    const d = structuredClone(findDemo("receiver")!.document) as Record<string, any>;
    d.shell.thickness_mm = 20_000;
    d.shell.radius_mm = 0.0005;
    d.pressure = { max_MPa: 20_000, min_MPa: 0 };
    d.display = display;
    return d;
  };
  const page = async (display: Record<string, string>) => (await app.request(`/?c=${encodeCheck(doc(display))}`)).text();

  it("states each limit in the form's units, taken from the schema's own limits", async () => {
    const html = await page({ length: "in", stress: "ksi", pressure: "psi", altitude: "ft" });
    // 10 000 mm / 25.4 = 393.7 in; 0.001 mm / 25.4 = 3.937×10⁻⁵ in (1 in = 25.4 mm exactly).
    expect(fieldError(html, "shell.thickness")).toBe("the wall thickness must be at most 393.7 in");
    expect(fieldError(html, "shell.radius")).toBe("the radius must be at least 3.937 × 10⁻⁵ in");
    // 10 000 MPa / 0.006894757 MPa per psi = 1 450 377 psi (NIST SP 811).
    expect(fieldError(html, "pressure.max")).toBe("the highest pressure must be at most 1.45 × 10⁶ psi");
  });

  it("and in SI with the unit the schema's number leaves out", async () => {
    const html = await page({ length: "mm", stress: "MPa", pressure: "MPa", altitude: "m" });
    expect(fieldError(html, "shell.thickness")).toBe("the wall thickness must be at most 10\u2009000 mm");
    expect(fieldError(html, "pressure.max")).toBe("the highest pressure must be at most 10\u2009000 MPa");
  });
});
