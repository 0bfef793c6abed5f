import { describe, expect, it } from "vitest";
import { fmt } from "../../src/engine/step.ts";

describe("numbers in substituted equations", () => {
  it("four significant figures, no exponent between 10⁻³ and 10⁶, true minus signs", () => {
    expect(fmt(60000)).toBe("60000");
    expect(fmt(48.713928)).toBe("48.71");
    expect(fmt(-3.14171)).toBe("−3.142");
    expect(fmt(100)).toBe("100");
  });
  it("exponent form outside that range", () => {
    expect(fmt(2.5e-5)).toBe("2.5×10^−5");
    expect(fmt(1234567)).toBe("1.235×10^6");
    expect(fmt(-7.3e9)).toBe("−7.3×10^9");
  });
  it("infinities print as ∞", () => {
    expect(fmt(Infinity)).toBe("∞");
  });
});
