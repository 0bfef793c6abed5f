/**
 * @module test/engine/endurance.test
 * The endurance limit in use and the modifying factors, with the warnings they raise.
 */
import { describe, expect, it } from "vitest";
import { base, example, run } from "./exampleRun.ts";
import { basquinLife, enduranceLimitInUse, modifyingFactors } from "../../src/engine/sn.ts";
import { normalQuantile } from "../../src/engine/special.ts";
import { warningText } from "../../src/engine/phrase.ts";

describe("endurance limit against the curve", () => {
  it("a limit above the curve at 10⁶ cycles is brought down to it, with a warning", () => {
    // 2024-T351 constants (Dowling Table 14.1, from memory): 900·(2×10⁶)^−0.102 = 204.9 MPa (hand calculation)
    const se = enduranceLimitInUse(250, 900, -0.102, "steel", false);
    expect(se.value).toBeCloseTo(900 * 2e6 ** -0.102, 10);
    expect(se.value).toBeCloseTo(204.9, 1);
    expect(warningText(se.warnings[0])).toMatch(/above the material's own S-N curve at 10⁶ cycles/);
    expect(enduranceLimitInUse(150, 900, -0.102, "steel", false).warnings).toHaveLength(0);
  });

  it("an endurance limit for aluminium warns that aluminium alloys have none; titanium warns too", () => {
    expect(enduranceLimitInUse(100, 900, -0.102, "aluminium", false).warnings.map(warningText).join(" ")).toMatch(
      /aluminium alloys have none/,
    );
    expect(enduranceLimitInUse(300, 2030, -0.104, "titanium", false).warnings.map(warningText).join(" ")).toMatch(
      /no dependable endurance limit/,
    );
  });

  it("surface and size factors on aluminium warn that they are published for steels", () => {
    const m = modifyingFactors({ surface: "machined" }, 470, normalQuantile, "aluminium");
    expect(m.warnings.map(warningText).join(" ")).toMatch(/published for steels/);
    expect(modifyingFactors({ surface: "machined" }, 470, normalQuantile, "steel").warnings).toHaveLength(0);
  });

  it("below the limit a spectrum continues the curve: Haibach slope 2m − 1, or elementary Miner slope m", () => {
    // σ'f = 1000, b = −0.1 (m = 10): Se at the knee = 1000·(2×10⁶)^−0.1, whose life is 10⁶ (hand calculation).
    const se = 1000 * 2e6 ** -0.1;
    const curve = { coefficient_MPa: 1000, exponent: -0.1, enduranceLimit_MPa: se, factor: 1 };
    expect(basquinLife(se / 2, { ...curve, belowLimit: "haibach" as const })).toBeNull(); // constant amplitude: unlimited
    // Haibach (1970, from memory): N = 10⁶·2^(2·10 − 1) = 5.243×10¹¹ at half the limit
    expect(basquinLife(se / 2, { ...curve, belowLimit: "haibach" as const }, true)! / (1e6 * 2 ** 19)).toBeCloseTo(1, 9);
    // elementary Miner: N = 10⁶·2^10
    expect(basquinLife(se / 2, { ...curve, belowLimit: "elementary" as const }, true)! / (1e6 * 2 ** 10)).toBeCloseTo(1, 9);
  });

  it("small cycles of a block spectrum below the limit now do damage (Haibach), said on a step", () => {
    // 4340 steel from the library (Se 425 MPa, machined: k·Se = 0.693 × 425 = 295 MPa). t = 4 mm, σθ = 1.0 × 1500/4 = 375 MPa.
    // Block 2 (0.9 ↔ 1.0 MPa) at Kt = 2.5: σa = 46.9, σm = 890.6, Goodman σar = 46.9/(1 − 890.6/1172) = 195 MPa,
    // below k·Se, so it did no damage before (hand calculation).
    const doc = base({
      material: { id: "steel-4340" },
      shell: { ...example.shell, thickness_mm: 4 },
      pressure: {
        blocks: [
          { max_MPa: 1.0, min_MPa: 0, cycles: 1 },
          { max_MPa: 1.0, min_MPa: 0.9, cycles: 1000 },
        ],
      },
      fatigue: { ...example.fatigue, designLife_cycles: 10 },
    });
    const r = run(doc);
    const st = r.steps.find((s) => s.id === "below-endurance-limit")!;
    expect(st.source).toMatch(/Haibach/);
    // slope 2m − 1 with m = 1/0.0977 (hand calculation)
    expect(st.value).toBeCloseTo(2 / 0.0977 - 1, 9);
    const big = r.spectrum!.cycles[0];
    const small = r.spectrum!.cycles[1];
    expect(small.range_MPa / 2).toBeCloseTo((2.5 * 37.5) / 2, 9);
    // the small block's damage is now counted: more than the big block alone
    const bigAlone = run({ ...doc, pressure: { blocks: [{ max_MPa: 1.0, min_MPa: 0, cycles: 1 }] } });
    expect(r.spectrum!.damagePerPass!).toBeGreaterThan(bigAlone.spectrum!.damagePerPass! * (1 + 1e-6));
    expect(big.count).toBe(1);
    const elementary = run({ ...doc, fatigue: { ...doc.fatigue, belowEnduranceLimit: "elementary" } });
    // elementary Miner keeps the steeper-damage slope m below the limit, so it is the more damaging one
    expect(elementary.spectrum!.damagePerPass!).toBeGreaterThan(r.spectrum!.damagePerPass!);
    const surface = r.steps.find((s) => s.id === "marin-ka")!;
    // Shigley Table 6-2, machined: ka = 4.51·1172^−0.265 (hand calculation)
    expect(surface.value).toBeCloseTo(4.51 * 1172 ** -0.265, 10);
    expect(surface.title).toMatch(/as-delivered/);
  });

  it("the thickness solver names the endurance limit when the knee sets the answer", () => {
    // 4340 (Se = 426 MPa) under a design life of 10⁸ cycles: no finite life reaches it (the knee is at
    // about 10⁶ cycles), so the least wall is the one whose amplitude falls to k·Se.
    const r = run(
      base({
        material: { id: "steel-4340" },
        pressure: { max_MPa: 0.3, min_MPa: 0 },
        fatigue: { ...example.fatigue, designLife_cycles: 1e8 },
        solve: { for: "thickness" },
      }),
    );
    expect(r.solution!.governs).toMatch(/endurance limit/);
    const t = r.solution!.requiredThickness_mm!;
    const at = run(
      base({
        material: { id: "steel-4340" },
        shell: { ...example.shell, thickness_mm: t },
        pressure: { max_MPa: 0.3, min_MPa: 0 },
        fatigue: { ...example.fatigue, designLife_cycles: 1e8 },
      }),
    );
    expect(at.fatigue.life_cycles).toBeNull();
    const thinner = run(
      base({
        material: { id: "steel-4340" },
        shell: { ...example.shell, thickness_mm: t * 0.999 },
        pressure: { max_MPa: 0.3, min_MPa: 0 },
        fatigue: { ...example.fatigue, designLife_cycles: 1e8 },
      }),
    );
    expect(thinner.fatigue.life_cycles).not.toBeNull();
    expect(thinner.fatigue.damage!).toBeGreaterThan(1);
  });
});
