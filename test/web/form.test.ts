import { describe, expect, it } from "vitest";
import { DEMOS } from "../../src/demo/index.ts";
import { parseCheck } from "../../src/engine/input.ts";
import { applyCarried, unshownParts } from "../../src/web/form/carry.ts";
import { convertValues, parseNumberList, readForm, understand, writeForm } from "../../src/web/form/index.ts";
import { defaultAt } from "../../src/schema/defaults.ts";
import { SI_UNITS, unitsKey, type Units } from "../../src/schema/units.ts";
import { inputAt, NUMBER_INPUTS } from "../../src/schema/inputs.ts";
import { sheetHtml } from "../../src/sheet/sheet.ts";
import { FORM_FIELDS, type FieldSpec, NUMBER_FIELDS } from "../../views/form/fields.ts";
import { CheckForm } from "../../views/form/index.tsx";

const US: Units = { length: "in", stress: "psi", pressure: "psi", altitude: "ft" };

/** Every number in a document, by path, for comparing two documents to a relative tolerance. */
function numbers(x: unknown, path = ""): Map<string, number> {
  const out = new Map<string, number>();
  if (typeof x === "number") out.set(path, x);
  else if (x && typeof x === "object")
    for (const [k, v] of Object.entries(x)) for (const [p, n] of numbers(v, `${path}.${k}`)) out.set(p, n);
  return out;
}

/** Numbers of `b` beyond those of `a` must be the schema's own defaults (the form spells out the choices it shows). */
function expectSameNumbers(a: unknown, b: unknown, rel = 1e-5) {
  const na = numbers(a);
  const nb = numbers(b);
  for (const [p, x] of [...nb]) if (!na.has(p) && defaultAt(p.slice(1)) === x) nb.delete(p);
  expect([...nb.keys()].sort()).toEqual([...na.keys()].sort());
  for (const [p, x] of na) expect(Math.abs((nb.get(p) as number) - x), p).toBeLessThanOrEqual(rel * Math.max(Math.abs(x), 1e-300));
}

describe("lists of numbers typed into one field", () => {
  it("reads numbers separated by spaces, commas, semicolons and new lines, in order", () => {
    expect(parseNumberList("0 0.8, 0.2;0.9\n0")).toEqual([0, 0.8, 0.2, 0.9, 0]);
    expect(parseNumberList("1e-3 −2")).toEqual([0.001, -2]);
  });

  it("reads the last column of a CSV table and skips a header line", () => {
    expect(parseNumberList("time,pressure\n0,0\n10,0.8\n20,0.1")).toEqual([0, 0.8, 0.1]);
    expect(parseNumberList("0\t5\n1\t7")).toEqual([5, 7]);
  });

  it("keeps entries that are not numbers as text, for the schema to point at", () => {
    expect(parseNumberList("0, 0.8, oops, 0")).toEqual([0, 0.8, "oops", 0]);
  });
});

describe("form ↔ check document", () => {
  it.each(DEMOS.map((d) => [d.id, d.document] as const))("the %s example survives the form in SI units", (_id, doc) => {
    const back = readForm(writeForm(doc, SI_UNITS), SI_UNITS).document;
    // what the form has no field for (the window's fastener holes) rides along in the carried field
    applyCarried(back, JSON.stringify(unshownParts(doc, SI_UNITS) ?? {}));
    const parsed = parseCheck(back);
    expect(parsed.ok).toBe(true);
    expectSameNumbers({ ...doc, display: SI_UNITS }, back);
  });

  it.each(DEMOS.map((d) => [d.id, d.document] as const))("the %s example survives the form in US units", (_id, doc) => {
    const back = readForm(writeForm(doc, US), US).document;
    applyCarried(back, JSON.stringify(unshownParts(doc, US) ?? {}));
    expectSameNumbers({ ...doc, display: US }, back);
  });

  it("gives the same SI document from millimetres and megapascals as from inches and psi", () => {
    const si = readForm(
      { "shell.thickness": "1.6", "pressure.mode": "direct", "pressure.max": "0.06", "material.ultimate": "470" },
      SI_UNITS,
    ).document;
    const us = readForm(
      { "shell.thickness": "0.0629921", "pressure.mode": "direct", "pressure.max": "8.70226", "material.ultimate": "68167.7" },
      US,
    ).document;
    expectSameNumbers({ ...si, display: {} }, { ...us, display: {} }, 1e-5);
  });

  it("leaves a blank field out and passes a non-number on as its text", () => {
    const doc = readForm({ "shell.radius": "", "shell.thickness": "abc" }, SI_UNITS).document as { shell: Record<string, unknown> };
    expect("radius_mm" in doc.shell).toBe(false);
    expect(doc.shell.thickness_mm).toBe("abc");
  });

  it("puts an error on a block back on the row it came from, past blank rows", () => {
    const read = readForm(
      {
        "pressure.mode": "blocks",
        "blocks.0.max": "",
        "blocks.0.min": "",
        "blocks.0.cycles": "",
        "blocks.1.max": "1",
        "blocks.1.cycles": "x",
      },
      SI_UNITS,
    );
    expect((read.document.pressure as { blocks: unknown[] }).blocks).toHaveLength(1);
    expect(read.fieldFor("pressure.blocks.0.cycles")).toBe("blocks.1.cycles");
    expect(read.fieldFor("pressure.blocks")).toBe("blocks");
    expect(read.fieldFor("pressure")).toBe("pressure.mode");
  });

  it("converts what is on the page when the units change, and keeps what is not a number", () => {
    const v = convertValues({ "shell.thickness": "25.4", "shell.radius": "big", "history.text": "0 100 0" }, SI_UNITS, {
      ...US,
      pressure: "kPa",
    });
    expect(v["shell.thickness"]).toBe("1");
    expect(v["shell.radius"]).toBe("big");
    expect(v["history.text"]).toBe("0, 100000, 0");
  });

  it("reads a post in the units it was drawn in, and shows it back in the units now chosen", () => {
    const p = understand({ "units.shown": unitsKey(SI_UNITS), "units.length": "in", "shell.thickness": "2.54", "pressure.mode": "direct" });
    expect((p.document.shell as { thickness_mm: number }).thickness_mm).toBeCloseTo(2.54, 12);
    expect(p.values["shell.thickness"]).toBe("0.1");
    expect(p.document.display).toEqual({ ...SI_UNITS, length: "in" });
    expect(p.redraw).toBe(true);
  });

  it("fills blank material fields from the library entry being left for own values", () => {
    const p = understand({ "material.shown": "al-2024-t3", "material.id": "", "material.yield": "300" });
    expect(p.values["material.ultimate"]).toBe("483");
    expect(p.values["material.yield"]).toBe("300");
    expect(p.values["material.name"]).toBe("Aluminium 2024-T3 sheet");
  });

  it("draws block rows for what is filled in, not for the highest row number posted", () => {
    const p = understand({ "pressure.mode": "blocks", "blocks.0.max": "1", "blocks.0.cycles": "10", "blocks.9999.min": "" });
    expect(p.rows.length).toBeLessThan(10);
  });
});

describe("the form is one table of fields over the format's registry", () => {
  // Inputs the form has no single field for, each with where it is handled instead.
  const NOT_A_FIELD: Record<string, string> = {
    "pressure.history_MPa[]": "the history box (a list)",
    "pressure.gate_MPa": "a logger's file (its gate, in the log's unit)",
    "pressure.blocks[].max_MPa": "the block table",
    "pressure.blocks[].min_MPa": "the block table",
    "pressure.blocks[].cycles": "the block table",
    "evidence.lives_cycles[]": "the test lives box (a list)",
    "cutout.fasteners[].hoop_mm": "carried (a list the form does not edit)",
    "cutout.fasteners[].axial_mm": "carried",
    "cutout.fasteners[].radius_mm": "carried",
    "cutout.reinforcement.area_mm2": "carried",
    "cutout.reinforcement.width_mm": "carried",
    "material.coupons[].amplitude_MPa": "carried",
    "material.coupons[].life_cycles": "carried",
    "crack.walkerGamma": "carried",
    "solve.gauges_mm[]": "the solve buttons (API only)",
    "solve.step_mm": "the solve buttons (API only)",
  };

  it("has a field for every number input of the format, or names where that input is handled", () => {
    const onForm = new Set(Object.values(NUMBER_FIELDS).map((f) => f.path));
    const missing = [...NUMBER_INPUTS.keys()].filter((p) => !onForm.has(p) && !(p in NOT_A_FIELD));
    expect(missing).toEqual([]);
    // And the list of exceptions holds nothing the form has a field for.
    expect(Object.keys(NOT_A_FIELD).filter((p) => onForm.has(p))).toEqual([]);
  });

  it("reads back every field it writes, in other units too, for every demo", () => {
    for (const units of [SI_UNITS, US])
      for (const d of DEMOS) {
        const v = writeForm(d.document, units);
        expect(writeForm(readForm(v, units).document, units), `${d.id} ${unitsKey(units)}`).toEqual(v);
      }
  });
});

describe("a choice with no value shows the schema's default", () => {
  it("every choice the schema defaults is drawn with that default selected on an empty form", () => {
    const html = String(
      CheckForm({
        s: { values: { "crack.on": "on", "crack.geometry": "hole-through" }, errors: new Map(), units: SI_UNITS, blockRows: [0] },
      }),
    );
    const chosen = (name: string) => {
      const select = new RegExp(`<select[^>]*name="${name}"[^>]*>([\\s\\S]*?)</select>`).exec(html)?.[1] ?? "";
      return /<option value="([^"]*)" selected/.exec(select)?.[1];
    };
    const defaulted = Object.entries(FORM_FIELDS as Record<string, FieldSpec>).filter(
      ([, f]) => f.showsDefault && defaultAt(f.path) !== undefined,
    );
    // Cracks at a hole default to two (the schema's conservative choice: Bowie's two-crack factor is the larger).
    expect(defaulted.map(([n]) => n)).toContain("crack.cracksAtHole");
    for (const [name, f] of defaulted) expect(chosen(name), name).toBe(String(defaultAt(f.path)));
  });
});

describe("the aircraft basis's factors and the allowances say the same on the page and the sheet", () => {
  it("labels each with the schema's words on both faces", () => {
    const doc = structuredClone(DEMOS[0].document) as Record<string, any>;
    doc.shell.service = "aircraft-cabin";
    doc.static = { basis: "aircraft" };
    const sheet = sheetHtml(doc);
    if (!sheet.ok) throw new Error(JSON.stringify(sheet.errors));
    const page = String(CheckForm({ s: { values: writeForm(doc, SI_UNITS), errors: new Map(), units: SI_UNITS, blockRows: [0] } }));
    for (const p of ["static.limitFactor", "static.ultimateFactor", "static.minimumGauge_mm", "static.thicknessTolerance_mm"]) {
      const label = inputAt(p).label;
      expect(sheet.html, p).toContain(label);
      expect(page, p).toMatch(new RegExp(`<label[^>]*>${label}`));
    }
  });
});
