/**
 * @module test/present/phrase.test
 * Phrases: the engine's sentences as words and amounts, shown in the reader's units.
 */
import { describe, expect, it } from "vitest";
import { DEMOS } from "../../src/demo/index.ts";
import { checkDocument } from "../../src/engine/index.ts";
import { bare, MPa, mm, n, say } from "../../src/engine/phrase.ts";
import { phraseText } from "../../src/present/numbers.ts";
import { SI_UNITS, type Units } from "../../src/schema/units.ts";
import { VerdictTable } from "../../views/results/table.tsx";
import { PARTS, SPARSE, WARNED } from "../fixtures/documents.ts";

const US: Units = { length: "in", stress: "ksi", pressure: "psi", altitude: "ft" };

describe("numbers in the engine's sentences reach the reader's units", () => {
  it("converts each amount of a phrase and keeps its words", () => {
    const p = say`σ = ${MPa(100)} at a wall of ${mm(25.4)} after ${n(60000)} cycles`;
    expect(p.text).toBe("σ = 100 MPa at a wall of 25.4 mm after 60000 cycles");
    // 1 ksi = 6.894757 MPa and 1 in = 25.4 mm (exact by definition): 100 MPa = 14.50 ksi
    expect(phraseText(p.parts, US)).toBe("σ = 14.5 ksi at a wall of 1 in after 60\u2009000 cycles");
  });

  it("writes a range with the unit once, converting both ends", () => {
    const p = say`between ${bare(MPa(150))}–${MPa(330)}`;
    expect(p.text).toBe("between 150–330 MPa");
    // 150 / 6.894757 = 21.76 ksi and 330 / 6.894757 = 47.86 ksi (1 ksi = 6.894757 MPa, NIST SP 811).
    expect(phraseText(p.parts, US)).toBe("between 21.76–47.86 ksi");
  });

  it("every verdict row's parts say the same as its SI sentence", () => {
    for (const [name, doc] of [...SPARSE, ...PARTS, ...DEMOS.map((d) => [d.id, d.document] as const)]) {
      const out = checkDocument(doc);
      if (!out.ok) throw new Error(name);
      for (const row of out.result.verdictTable) {
        // Numbers are written by two formatters (the engine's fmt and the faces' sig), so compare the words only.
        const words = (s: string) => s.replace(/[−-]?[\d.,\u2009 ]*\d(×10\^[−-]?\d+| × 10[⁰¹²³⁴⁵⁶⁷⁸⁹⁻]+)?|∞/g, "#");
        expect(words(phraseText(row.detailParts, SI_UNITS)), `${name} ${row.id}`).toBe(words(row.detail));
      }
    }
  });

  it("every warning's parts say the same as its SI text, and no length or stress is left as bare words", () => {
    const words = (s: string) => s.replace(/[−-]?[\d.,\u2009 ]*\d(×10\^[−-]?\d+| × 10[⁰¹²³⁴⁵⁶⁷⁸⁹⁻]+)?|∞/g, "#");
    let amounts = 0;
    for (const [name, doc] of [...SPARSE, ...PARTS, ...WARNED, ...DEMOS.map((d) => [d.id, d.document] as const)]) {
      const out = checkDocument(doc);
      if (!out.ok) continue;
      const r = out.result;
      expect(r.warningParts.length, name).toBe(r.warnings.length);
      r.warningParts.forEach((parts, i) => {
        expect(words(phraseText(parts, SI_UNITS)), `${name}: ${r.warnings[i]}`).toBe(words(r.warnings[i]));
        for (const p of parts) {
          if (typeof p === "string") expect(p, `${name}: a number with an SI unit in the words`).not.toMatch(/\d ?(mm|MPa)\b/);
          else if (p.quantity !== "plain") amounts++;
        }
      });
    }
    // The documents reach warnings that carry lengths, stresses and pressures.
    expect(amounts).toBeGreaterThan(10);
  });

  it("the static row's reason to refer, a code formula past its range, follows the reader's units", () => {
    // ASME VIII-1 UG-27(c)(1) holds for P ≤ 0.385SE; 50 MPa on the receiver's nozzle course is above it.
    const doc = structuredClone(DEMOS[1].document) as Record<string, any>;
    delete doc.crack;
    doc.static = { basis: "asme-viii-1" };
    doc.pressure = { max_MPa: 50, min_MPa: 0 };
    doc.shell.thickness_mm = 60;
    const out = checkDocument(doc);
    if (!out.ok) throw new Error(JSON.stringify(out.errors));
    const row = out.result.verdictTable.find((r) => r.id === "static")!;
    expect(row.status).toBe("refer");
    expect(row.detail).toMatch(/^P = 50 MPa is above 0\.385SE = [\d.]+ MPa \(UG-27\(c\)\(1\)\)/);
    // 50 MPa / 0.006894757 MPa per psi = 7252 psi (NIST SP 811); both sides of the comparison are pressures.
    expect(phraseText(row.detailParts, US)).toMatch(/^P = 7252 psi is above 0\.385SE = [\d.]+ psi \(UG-27/);
    expect(phraseText(row.detailParts, US)).not.toMatch(/MPa|\d mm\b/);
  });

  it("the cabin demo's verdict table in US units shows no SI unit", () => {
    const out = checkDocument(DEMOS[0].document);
    if (!out.ok) throw new Error("the cabin demo must run");
    const html = String(VerdictTable({ result: out.result, units: US }));
    expect(html).not.toMatch(/\bMPa\b|\d mm\b/);
    expect(html).toMatch(/\d in\b/);
  });
});
