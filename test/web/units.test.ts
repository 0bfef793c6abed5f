/**
 * @module test/web/units
 * Display units: the factors against their published definitions, the Paris coefficient against a handbook pair.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  ALTITUDE_UNITS,
  formNumber,
  fromSI,
  LENGTH_UNITS,
  parisCFromSI,
  parisCToSI,
  parisCUnit,
  parseUnitsKey,
  PRESSURE_UNITS,
  type Quantity,
  SI_UNITS,
  STRESS_UNITS,
  toSI,
  unitLabel,
  unitsFrom,
  unitsKey,
  type Units,
} from "../../src/schema/units.ts";

const US: Units = { length: "in", stress: "ksi", pressure: "psi", altitude: "ft" };

describe("display units", () => {
  it("uses the exact international inch and foot", () => {
    // international yard and pound agreement (1959): 1 in = 25.4 mm, 1 ft = 0.3048 m exactly
    expect(toSI(1, "length", US)).toBe(25.4);
    expect(toSI(10_000, "altitude", US)).toBeCloseTo(3048, 9);
  });

  it("converts pressures and stresses with the NIST psi", () => {
    // NIST SP 811, B.8: 1 psi = 6.894 757 kPa; 1 bar = 100 kPa exactly
    expect(toSI(1, "pressure", US)).toBeCloseTo(6.894757e-3, 9);
    expect(toSI(1, "stress", US)).toBeCloseTo(6.894757, 6);
    expect(toSI(8.6, "pressure", { ...SI_UNITS, pressure: "bar" })).toBeCloseTo(0.86, 12);
    expect(toSI(60, "pressure", { ...SI_UNITS, pressure: "kPa" })).toBeCloseTo(0.06, 12);
  });

  it("reads toughness in ksi·√in beside US stresses and in MPa·√m otherwise", () => {
    // 1 ksi·√in = 6.894757 MPa × √(0.0254 m) = 1.0988 MPa·√m (from the NIST SP 811 psi and the exact inch)
    expect(toSI(1, "toughness", US)).toBeCloseTo(1.0988, 4);
    expect(unitLabel("toughness", US)).toBe("ksi·√in");
    expect(toSI(70, "toughness", SI_UNITS)).toBe(70);
    expect(unitLabel("toughness", SI_UNITS)).toBe("MPa·√m");
  });

  it("writes the Paris coefficient in in/cycle and ksi·√in beside US stresses, with a factor that depends on m", () => {
    // Barsom & Rolfe, Fracture and Fatigue Control in Structures, the three steel classes (from memory), in both systems:
    //   ferrite–pearlite  da/dN = 3.6×10⁻¹⁰ ΔK^3.0  (in/cycle, ksi·√in) = 6.89×10⁻¹² ΔK^3.0  (m/cycle, MPa·√m)
    //   martensitic       da/dN = 0.66×10⁻⁸ ΔK^2.25                    = 1.36×10⁻¹⁰ ΔK^2.25
    //   austenitic        da/dN = 3.0×10⁻¹⁰ ΔK^3.25                    = 5.60×10⁻¹² ΔK^3.25
    // The handbook gives two or three figures, so agreement is asked to 1 %.
    const pairs: [number, number, number][] = [
      [6.89e-12, 3.0, 3.6e-10],
      [1.36e-10, 2.25, 0.66e-8],
      [5.6e-12, 3.25, 3.0e-10],
    ];
    for (const [si, m, us] of pairs) {
      expect(Math.abs(parisCFromSI(si, m, US) / us - 1)).toBeLessThan(0.01);
      expect(Math.abs(parisCToSI(us, m, US) / si - 1)).toBeLessThan(0.01);
    }
    // Worked by hand for m = 3: 1 ksi·√in = 6.894757 × √0.0254 = 1.098843 MPa·√m, 1.098843³ = 1.326806, so
    // C_US = C_SI × 1.326806 / 0.0254 = C_SI × 52.2365.
    expect(parisCFromSI(1e-11, 3, US)).toBeCloseTo(5.22365e-10, 14);
    expect(parisCUnit(US)).toBe("in/cycle per (ksi·√in)^m");
    // In SI (and beside MPa, kPa or bar) the format's own units: nothing converts.
    expect(parisCFromSI(1.6e-11, 3.59, SI_UNITS)).toBe(1.6e-11);
    expect(parisCFromSI(1.6e-11, 3.59, { ...US, stress: "MPa" })).toBe(1.6e-11);
    expect(parisCUnit(SI_UNITS)).toBe("m/cycle per (MPa·√m)^m");
  });

  it("converts the Paris coefficient there and back for any exponent", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-14, max: 1e-6, noNaN: true }), fc.double({ min: 1, max: 10, noNaN: true }), (C, m) => {
        expect(Math.abs(parisCToSI(parisCFromSI(C, m, US), m, US) / C - 1)).toBeLessThan(1e-12);
      }),
    );
  });

  it("never converts plain numbers (counts, ratios, exponents)", () => {
    expect(toSI(-0.102, "plain", US)).toBe(-0.102);
    expect(unitLabel("plain", US)).toBe("");
  });

  it("converts there and back to the same value for every unit and quantity", () => {
    const units = fc.record({
      length: fc.constantFrom(...LENGTH_UNITS),
      stress: fc.constantFrom(...STRESS_UNITS),
      pressure: fc.constantFrom(...PRESSURE_UNITS),
      altitude: fc.constantFrom(...ALTITUDE_UNITS),
    });
    const quantity = fc.constantFrom<Quantity>("length", "stress", "pressure", "altitude", "toughness", "plain");
    fc.assert(
      fc.property(units, quantity, fc.double({ min: 1e-6, max: 1e6, noNaN: true }), (u, q, x) => {
        expect(fromSI(toSI(x, q, u), q, u)).toBeCloseTo(x, 6 - Math.max(0, Math.ceil(Math.log10(x))));
      }),
    );
  });

  it("writes form numbers to six significant figures that read back within 1 part in 10⁵", () => {
    expect(formNumber(1 / 25.4)).toBe("0.0393701");
    expect(formNumber(1.6e-11)).toBe("1.6e-11");
    expect(formNumber(60000)).toBe("60000");
    expect(formNumber(-0.102)).toBe("-0.102");
    fc.assert(
      fc.property(fc.double({ min: 1e-12, max: 1e11, noNaN: true }), (x) => {
        expect(Math.abs(Number(formNumber(x)) - x) / x).toBeLessThan(1e-5);
      }),
    );
  });

  it("falls back to SI for units it does not know, and carries a choice as a short key", () => {
    expect(unitsFrom({ length: "furlong", stress: "ksi" })).toEqual({ ...SI_UNITS, stress: "ksi" });
    expect(parseUnitsKey(unitsKey(US))).toEqual(US);
    expect(parseUnitsKey("in psi psi parsec")).toBeUndefined();
    expect(parseUnitsKey(undefined)).toBeUndefined();
  });
});
