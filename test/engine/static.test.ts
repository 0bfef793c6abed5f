import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { checkDocument, type CheckResult } from "../../src/engine/index.ts";
import { codeFormula, staticPlan } from "../../src/engine/static/index.ts";
import type { ResolvedStatic } from "../../src/engine/input.ts";

function run(doc: unknown): CheckResult {
  const out = checkDocument(doc);
  if (!out.ok) throw new Error(JSON.stringify(out.errors));
  return out.result;
}

/** A plain cylinder under internal pressure: Di = 600 mm, P = 1.1 MPa, P265GH (Rp0.2 265, Rm 410 MPa). */
function cylinder(stat: Record<string, unknown>, extra: Record<string, unknown> = {}) {
  return {
    format: "hoopwise.check/1",
    shell: { form: "cylinder", radius_mm: 300, radiusAt: "inner", thickness_mm: 5 },
    pressure: { max_MPa: 1.1, min_MPa: 0 },
    material: { id: "steel-p265gh" },
    fatigue: { designLife_cycles: 1000, curve: "basquin" },
    static: stat,
    ...extra,
  };
}

const plain = { corrosionAllowance_mm: 0, thicknessTolerance_mm: 0, minimumGauge_mm: 0 };
const allowances = { corrosionAllowance_mm: 1, thicknessTolerance_mm: 0.3, minimumGauge_mm: 1.5 };

describe("EN 13445-3 design by formula", () => {
  it("cylinder without allowances, by hand", () => {
    const r = run(cylinder({ basis: "en13445-3", jointEfficiency: 0.85, ...plain }));
    // EN 13445-3 Table 6-1: f = min(265/1.5, 410/2.4) = min(176.67, 170.83) = 170.83 MPa
    expect(r.static.allowable_MPa).toBeCloseTo(410 / 2.4, 10);
    // §7.4.2: e = P·Di/(2fz − P) = 1.1 × 600/(2 × 170.833 × 0.85 − 1.1) = 660/289.317 = 2.2812 mm (hand calculation)
    expect(r.static.formulaThickness_mm).toBeCloseTo(2.28124, 4);
    expect(r.static.requiredThickness_mm).toBeCloseTo(2.28124, 4);
    // margin on the wall: 5/2.28124 − 1
    expect(r.static.margin).toBeCloseTo(5 / 2.2812374 - 1, 5);
    expect(r.verdictTable[0].title).toContain("EN 13445-3");
  });

  it("cylinder with corrosion allowance and tolerance, by hand", () => {
    const r = run(cylinder({ basis: "en13445-3", jointEfficiency: 0.85, ...allowances }));
    // corroded Di = 602 mm: e = 1.1 × 602/289.317 = 2.2888 mm; e + c + δ = 2.2888 + 1 + 0.3 = 3.5888 mm (hand calculation)
    expect(r.static.formulaThickness_mm).toBeCloseTo(2.28884, 4);
    expect(r.static.requiredThickness_mm).toBeCloseTo(3.58884, 4);
    // analysis wall e_a = 5 − 1 − 0.3 = 3.7 mm (EN 13445-3 §5.2)
    expect(r.static.analysisThickness_mm).toBeCloseTo(3.7, 12);
    expect(r.steps.find((s) => s.id === "static-formula-thickness")?.source).toContain("§7.4.2");
  });

  it("says which side each allowance comes off, and what the other side for the minus tolerance would change", () => {
    const r = run(cylinder({ basis: "en13445-3", jointEfficiency: 0.85, ...allowances }));
    const words = r.steps.find((s) => s.id === "static-analysis-thickness")?.source ?? "";
    expect(words).toContain("corrosion is taken off the bore");
    expect(words).toContain("minus tolerance off the outer face");
    // δ/R = 0.3/(300 + 1) = 0.0997 % (hand calculation), stated to two significant figures
    expect(words).toContain("δ/R = 0.1 %");
    // An independent check of those words: the same 0.3 mm taken off the bore instead (as more
    // corrosion) raises the hoop stress by about δ/R. Thin-wall hoop stress P·R_m/e: the mean
    // radius grows from 301 + 1.85 to 301.3 + 1.85, so the ratio is 303.15/302.85 = 1.00099 (hand calculation).
    const bore = run(
      cylinder({ basis: "en13445-3", jointEfficiency: 0.85, ...allowances, corrosionAllowance_mm: 1.3, thicknessTolerance_mm: 0 }),
    );
    expect(bore.membrane.hoopMax_MPa / r.membrane.hoopMax_MPa).toBeCloseTo(303.15 / 302.85, 3);
  });

  it("the formula is the mean-diameter hoop equilibrium P·Dm = 2fz·e (an independent identity)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.05, max: 20, noNaN: true }),
        fc.double({ min: 50, max: 3000, noNaN: true }),
        fc.double({ min: 0.5, max: 1, noNaN: true }),
        (P, R, z) => {
          const plan = staticPlan(stat("en13445-3", z), "cylinder", { family: "steel", yield_MPa: 265, ultimate_MPa: 410 });
          const e = codeFormula(plan, P, R).formula_mm;
          const Dm = 2 * R + e;
          expect((P * Dm) / (2 * e)).toBeCloseTo(plan.allowable_MPa * z, 6);
        },
      ),
    );
  });

  it("sphere: e = P·Di/(4fz − P), half the cylinder's wall nearly (§7.4.3)", () => {
    const r = run({
      ...cylinder({ basis: "en13445-3", jointEfficiency: 1, ...plain }),
      shell: { form: "sphere", radius_mm: 300, radiusAt: "inner", thickness_mm: 5 },
    });
    // 1.1 × 600/(4 × 170.833 − 1.1) = 660/682.233 = 0.96741 mm (hand calculation)
    expect(r.static.formulaThickness_mm).toBeCloseTo(660 / (4 * (410 / 2.4) - 1.1), 8);
  });

  it("a family the code gives no rule for is referred, with the field to give named", () => {
    const doc = cylinder(
      { basis: "en13445-3", ...plain },
      {
        material: {
          ultimate_MPa: 400,
          yield_MPa: 250,
          modulus_MPa: 200000,
          fatigueStrengthCoefficient_MPa: 700,
          fatigueStrengthExponent: -0.1,
        },
      },
    );
    const r = run(doc);
    expect(r.verdictTable[0].status).toBe("refer");
    expect(r.verdict).toBe("refer");
    expect(r.static.refer).toContain("static.allowableStress_MPa");
  });
});

describe("ASME VIII-1 UG-27", () => {
  it("the textbook case: P = 100 psi, R = 30 in, S = 17 500 psi, E = 0.85 gives t = 0.2025 in", () => {
    // UG-27(c)(1): t = PR/(SE − 0.6P) = 3000/(14 875 − 60) = 0.20250 in (hand calculation)
    const plan = staticPlan({ ...stat("asme-viii-1", 0.85), allowableStress_MPa: 17500 }, "cylinder", {
      family: "steel",
      yield_MPa: 1,
      ultimate_MPa: 1,
    });
    const f = codeFormula(plan, 100, 30);
    expect(f.formula_mm).toBeCloseTo(0.2024975, 6);
    expect(f.governs).toContain("UG-27(c)(1)");
  });

  it("cylinder without and with allowances, by hand", () => {
    const bare = run(cylinder({ basis: "asme-viii-1", jointEfficiency: 0.85, ...plain }));
    // II-D App. 1: S = min(410/3.5, 2 × 265/3) = min(117.14, 176.67) = 117.14 MPa
    expect(bare.static.allowable_MPa).toBeCloseTo(410 / 3.5, 10);
    // UG-27(c)(1): t = 1.1 × 300/(117.143 × 0.85 − 0.66) = 330/98.911 = 3.3363 mm; (c)(2) gives 1.6534 mm (hand calculation)
    expect(bare.static.formulaThickness_mm).toBeCloseTo(3.33632, 4);
    expect(bare.steps.find((s) => s.id === "static-asme-longitudinal")?.value).toBeCloseTo(1.65345, 4);
    const r = run(cylinder({ basis: "asme-viii-1", jointEfficiency: 0.85, ...allowances }));
    // corroded R = 301: t = 331.1/98.911 = 3.3474; + 1 + 0.3 = 4.6474 mm (hand calculation)
    expect(r.static.requiredThickness_mm).toBeCloseTo(4.64744, 4);
  });

  it("sphere: t = PR/(2SE − 0.2P), UG-27(d)", () => {
    const plan = staticPlan({ ...stat("asme-viii-1", 1), allowableStress_MPa: 100 }, "sphere", {
      family: "steel",
      yield_MPa: 1,
      ultimate_MPa: 1,
    });
    // 2 × 500/(200 − 0.4) = 5.01002 mm (hand calculation)
    expect(codeFormula(plan, 2, 500).formula_mm).toBeCloseTo(1000 / 199.6, 10);
  });

  it("above 0.385SE the thin formula is outside its range and the static row refers", () => {
    const r = run(
      cylinder(
        { basis: "asme-viii-1", jointEfficiency: 1, allowableStress_MPa: 20, ...plain },
        { pressure: { max_MPa: 10, min_MPa: 0 }, shell: { form: "cylinder", radius_mm: 300, radiusAt: "inner", thickness_mm: 400 } },
      ),
    );
    expect(r.verdictTable[0].status).toBe("refer");
    expect(r.static.refer).toContain("0.385SE");
  });
});

describe("aircraft and yield bases", () => {
  const cabin = (basis: string) => ({
    format: "hoopwise.check/1",
    shell: { form: "cylinder", radius_mm: 1500, radiusAt: "mean", thickness_mm: 1.6, service: "aircraft-cabin" },
    pressure: { max_MPa: 0.06, min_MPa: 0 },
    material: { id: "al-2024-t3" },
    fatigue: { designLife_cycles: 60000 },
    static: { basis },
  });

  it("aircraft: limit 1.33 p against yield, ultimate 1.33 × 1.5 p against Su, by hand", () => {
    const r = run(cabin("aircraft"));
    // σvm = 0.06 × 1500/1.6 × √3/2 = 48.714 MPa (Roark Ch. 13, von Mises 2:1)
    const vm = ((0.06 * 1500) / 1.6) * (Math.sqrt(3) / 2);
    // limit 345/(1.33 vm) = 5.325; ultimate 483/(1.995 vm) = 4.970 ⇒ ultimate governs
    expect(r.static.margin).toBeCloseTo(483 / (1.995 * vm) - 1, 8);
    expect(r.static.governs).toContain("ultimate");
    // thin wall: t = 1.995 × 0.06 × 1500 × (√3/2)/483 = 0.32194 mm (hand calculation)
    expect(r.static.requiredThickness_mm).toBeCloseTo((1.995 * 90 * (Math.sqrt(3) / 2)) / 483, 5);
    expect(r.static.defaults.limitFactor).toContain("1.33");
  });

  it("yield: today's check; required wall where σvm = Sy/1.5", () => {
    const r = run({ ...cabin("yield"), shell: { form: "cylinder", radius_mm: 1500, radiusAt: "mean", thickness_mm: 1.6 } });
    // 90 × (√3/2)/(345/1.5) = 0.33889 mm (hand calculation)
    expect(r.static.requiredThickness_mm).toBeCloseTo((90 * (Math.sqrt(3) / 2)) / 230, 5);
    expect(r.static.allowable_MPa).toBeCloseTo(230, 10);
  });

  it("the basis follows the service when not given", () => {
    const vessel = run(
      cylinder({}, { shell: { form: "cylinder", radius_mm: 300, radiusAt: "inner", thickness_mm: 5, service: "pressure-vessel" } }),
    );
    expect(vessel.static.basis).toBe("en13445-3");
    expect(vessel.static.jointEfficiency).toBe(0.7);
    expect(vessel.static.corrosionAllowance_mm).toBe(1);
    expect(vessel.static.defaults.basis).toContain("pressure-vessel");
    const other = run(cylinder({}));
    expect(other.static.basis).toBe("yield");
    expect(other.static.corrosionAllowance_mm).toBe(0);
  });
});

describe("solved wall and minimum gauge", () => {
  it("a small pressure solves to the minimum gauge plus the corrosion allowance, never below", () => {
    const r = run(
      cylinder(
        { basis: "en13445-3", jointEfficiency: 1, ...allowances },
        { pressure: { max_MPa: 0.01, min_MPa: 0 }, solve: { for: "thickness" } },
      ),
    );
    // UG-16(b) convention (from memory): 1.5 mm exclusive of the 1 mm corrosion allowance ⇒ at least 2.5 mm,
    // rounded up to the next stocked plate, 3 mm (vessel plate list, common practice)
    expect(r.solution?.requiredThickness_mm).toBeLessThan(2.5);
    expect(r.solution?.thickness_mm).toBe(3);
    expect(r.solution?.governs).toBe("minimum gauge");
    // with a step of 0.1 mm the floor itself is the answer
    const stepped = run(
      cylinder(
        { basis: "en13445-3", jointEfficiency: 1, ...allowances },
        { pressure: { max_MPa: 0.01, min_MPa: 0 }, solve: { for: "thickness", step_mm: 0.1 } },
      ),
    );
    expect(stepped.solution?.thickness_mm).toBeCloseTo(2.5, 9);
  });

  it("a wall below the minimum gauge fails its row", () => {
    const r = run(
      cylinder({ basis: "en13445-3", jointEfficiency: 1, corrosionAllowance_mm: 0, thicknessTolerance_mm: 0, minimumGauge_mm: 6 }),
    );
    const row = r.verdictTable.find((x) => x.id === "minimum-gauge");
    expect(row?.status).toBe("fail");
    expect(r.verdict).toBe("fail");
  });

  it("allowances that leave no wall are refused with the field named", () => {
    const out = checkDocument(cylinder({ corrosionAllowance_mm: 5 }));
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.errors[0].path).toBe("static.corrosionAllowance_mm");
  });
});

function stat(basis: ResolvedStatic["basis"], z: number): ResolvedStatic {
  return {
    basis,
    yieldFactor: 1.5,
    jointEfficiency: z,
    corrosionAllowance_mm: 0,
    thicknessTolerance_mm: 0,
    minimumGauge_mm: 0,
    limitFactor: 1.33,
    ultimateFactor: 1.5,
    defaults: {},
  };
}

describe("the static defaults come from the schema", () => {
  it("a check with no static section uses the schema's yield factor, as one that gives an empty section does", () => {
    const { static: _, ...withoutStatic } = cylinder({});
    // 1.5 on yield: the schema's documented default (README, input keys; common practice for a proof-to-yield margin).
    const none = run(withoutStatic);
    const empty = run(cylinder({}));
    expect(none.static.yieldFactor).toBe(1.5);
    expect(empty.static.yieldFactor).toBe(none.static.yieldFactor);
  });
});
