import { describe, expect, it } from "vitest";
import { NUMBER_INPUTS, inputAt, labelOfWords, quantityOfKey } from "../../src/schema/inputs.ts";
import { checkSchema } from "../../src/schema/check.ts";
import { NUMBER_FIELDS } from "../../views/form/fields.ts";

describe("the number inputs live once, on the schema", () => {
  it("every number field of the form is an input of the format, with the quantity its key's unit says", () => {
    for (const [name, f] of Object.entries(NUMBER_FIELDS)) {
      const i = inputAt(f.path);
      expect(f.quantity, name).toBe(i.quantity);
      expect(f.label, name).toBe(i.label);
    }
  });

  it("reads the quantity from the unit in the key (the format's convention)", () => {
    expect(quantityOfKey("shell.thickness_mm")).toBe("length");
    expect(quantityOfKey("pressure.max_MPa")).toBe("pressure");
    expect(quantityOfKey("pressure.history_MPa[]")).toBe("pressure");
    expect(quantityOfKey("axialExtra.max_MPa")).toBe("stress");
    expect(quantityOfKey("material.toughness_MPaSqrtM")).toBe("toughness");
    expect(quantityOfKey("pressure.fromAltitude.flight_m")).toBe("altitude");
    expect(quantityOfKey("fatigue.designLife_cycles")).toBe("plain");
  });

  it("labels an input with the words its error messages use", () => {
    expect(labelOfWords("the wall thickness")).toBe("Wall thickness");
    expect(inputAt("shell.thickness_mm")).toMatchObject({ label: "Wall thickness", symbol: "t", quantity: "length" });
    // The error message for a bad value says the same words as the label.
    const bad = checkSchema.shape.shell.safeParse({ form: "cylinder", radius_mm: 100, thickness_mm: -1 });
    expect(bad.success).toBe(false);
    const message = bad.error?.issues.find((x) => x.path.join(".") === "thickness_mm")?.message ?? "";
    expect(message.startsWith(inputAt("shell.thickness_mm").words)).toBe(true);
  });

  it("knows every number the format takes, lists included", () => {
    for (const p of ["pressure.blocks[].cycles", "material.coupons[].life_cycles", "evidence.lives_cycles[]", "crack.openingDistance_mm"])
      expect(NUMBER_INPUTS.has(p), p).toBe(true);
    expect(() => inputAt("shell.nothing_mm")).toThrow(/no number input/);
  });
});
