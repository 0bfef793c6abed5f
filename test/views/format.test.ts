import { describe, expect, it } from "vitest";
import { cycles, inUnits, margin, quantity, sig } from "../../views/format.ts";
import { SI_UNITS } from "../../src/schema/units.ts";

describe("numbers as the page shows them", () => {
  it("writes four significant figures with a true minus and thin-space thousands", () => {
    expect(sig(43.29331)).toBe("43.29");
    expect(sig(-0.102)).toBe("−0.102");
    expect(sig(60000)).toBe("60\u2009000");
    expect(sig(1234)).toBe("1234");
  });

  it("writes powers of ten out rather than in computer notation", () => {
    expect(sig(1.909e12, 3)).toBe("1.91 × 10¹²");
    expect(sig(9.43e-8, 3)).toBe("9.43 × 10⁻⁸");
    expect(sig(2e6)).toBe("2 × 10⁶");
  });

  it("marks what has no value, and unlimited lives", () => {
    expect(sig(null)).toBe("—");
    expect(cycles(null)).toBe("unlimited");
    expect(cycles(256.8, "passes")).toBe("257 passes");
    expect(cycles(41000, "")).toBe("41\u2009000");
  });

  it("converts to the display unit and names it", () => {
    expect(quantity(0.06, "pressure", { ...SI_UNITS, pressure: "kPa" })).toBe("60 kPa");
    expect(quantity(25.4, "length", { ...SI_UNITS, length: "in" })).toBe("1 in");
    expect(inUnits(6.894757, "stress", { ...SI_UNITS, stress: "ksi" })).toBe("1");
  });

  it("shows a reserve as a signed percentage, and a huge one as 'over'", () => {
    expect(margin(0.23)).toBe("+23 %");
    expect(margin(-0.125)).toBe("−13 %");
    expect(margin(5.1345)).toBe("+513 %");
    expect(margin(1.06e7)).toBe("over +10\u2009000 %");
    expect(margin(null)).toBe("—");
  });
});
