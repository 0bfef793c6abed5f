import { describe, expect, it } from "vitest";
import { cabinDifferential, isaPressure_Pa } from "../../src/engine/atmosphere.ts";

describe("ICAO standard atmosphere", () => {
  // ICAO Standard Atmosphere table (ICAO Doc 7488 / ISO 2533), pressure in Pa at geopotential altitude (from memory)
  const table: [number, number][] = [
    [0, 101325],
    [1000, 89874.6],
    [2000, 79495.2],
    [5000, 54019.9],
    [8000, 35599.8],
    [11000, 22632.1],
    [15000, 12044.6],
    [20000, 5474.9],
  ];
  for (const [h, p] of table) {
    it(`pressure at ${h} m is ${p} Pa`, () => {
      expect(Math.abs(isaPressure_Pa(h) - p)).toBeLessThan(0.6);
    });
  }

  it("is continuous at the tropopause", () => {
    expect(isaPressure_Pa(11000 - 1e-6)).toBeCloseTo(isaPressure_Pa(11000 + 1e-6), 3);
  });

  it("a cabin at 2440 m (8000 ft) cruising at 12 000 m holds about 8 psi, roughly half an atmosphere", () => {
    // common practice: transport cabins are held near 8000 ft altitude, giving about 8 psi (55 kPa) at cruise
    const { differential_MPa, steps } = cabinDifferential(12000, 2440);
    expect(differential_MPa * 145.0377).toBeGreaterThan(7.5);
    expect(differential_MPa * 145.0377).toBeLessThan(8.6);
    expect(differential_MPa / 0.101325).toBeGreaterThan(0.45);
    expect(differential_MPa / 0.101325).toBeLessThan(0.6);
    expect(steps.map((s) => s.id)).toEqual(["isa-flight", "isa-cabin", "differential"]);
  });
});
