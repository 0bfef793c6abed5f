import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  ALTITUDE_UNITS,
  formNumber,
  fromSI,
  LENGTH_UNITS,
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
