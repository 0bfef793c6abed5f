import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { checkDocument, type CheckResult } from "../../src/engine/index.ts";
import {
  meanStressFactor,
  plasticityFactor,
  surfaceFactor,
  temperatureFactor,
  unweldedRange,
  vesselLife,
  weldedThicknessFactor,
  type VesselCurve,
} from "../../src/engine/vessel/fatigue.ts";
import { DEMOS } from "../../src/demo/index.ts";
import { equivalentRange } from "../../src/engine/equivalent.ts";

function run(doc: unknown): CheckResult {
  const out = checkDocument(doc);
  if (!out.ok) throw new Error(JSON.stringify(out.errors));
  return out.result;
}

const welded = (over: Partial<VesselCurve> = {}): VesselCurve => ({
  kind: "en13445-welded",
  family: "steel",
  yield_MPa: 265,
  ultimate_MPa: 410,
  class_MPa: 71,
  thickness_mm: 10,
  temperature_C: 20,
  rz_um: 200,
  ...over,
});

describe("EN 13445-3 clause 18 pieces", () => {
  it("Tresca range at a hole edge with σr = −p: |2.5 − (−1)| = 3.5 per MPa (hand calculation)", () => {
    // one MPa of pressure range: edge stress 2.5, nothing across the free edge, σr = −1 at the bore
    expect(equivalentRange([2.5, 0, -1], [0, 0, 0], "tresca")).toBeCloseTo(3.5, 12);
    // plain cylinder wall, r/t = 30: hoop 30, axial 15, radial −1 ⇒ 31
    expect(equivalentRange([30, 15, -1], [0, 0, 0], "tresca")).toBeCloseTo(31, 12);
  });

  it("ke for a range above 2·Rp0.2: 1 + 0.5·(700/530 − 1) = 1.1604 (§18.8.1, hand calculation)", () => {
    expect(plasticityFactor(700, 265, "steel", 410)).toBeCloseTo(1.160377, 6);
    // A0 = 0.4 + 650/1250 = 0.92 for a 650 MPa ferritic steel (from memory): 1 + 0.92 × (900/800 − 1) = 1.115
    expect(plasticityFactor(900, 400, "steel", 650)).toBeCloseTo(1.115, 10);
    // at or below 2·Rp0.2 no correction
    expect(plasticityFactor(530, 265, "steel", 410)).toBe(1);
  });

  it("welded class 71 at 40 mm: f_ew = (25/40)^0.25 = 0.88914; N = 2×10⁶·(71/112.468)³ = 503 170 cycles (hand calculation)", () => {
    expect(weldedThicknessFactor(40)).toBeCloseTo(0.8891397, 6);
    expect(weldedThicknessFactor(20)).toBe(1);
    const N = vesselLife(welded({ thickness_mm: 40 }), 100, 0, false);
    expect(N).toBeCloseTo(503170.4, 0);
    // the same range on a 20 mm wall: 2×10⁶·(71/100)³ = 715 822 cycles
    expect(vesselLife(welded(), 100, 0, false)).toBeCloseTo(2e6 * 0.71 ** 3, 3);
  });

  it("below the constant-amplitude endurance limit 0.737·Δσ_R the life is unlimited (§18.10.5)", () => {
    expect(vesselLife(welded(), 0.73 * 71, 0, false)).toBeNull();
    expect(vesselLife(welded(), 0.73 * 71, 0, true)).toBeGreaterThan(5e6);
  });

  it("temperature factor: 1.03 − 1.5×10⁻⁴·200 − 1.5×10⁻⁶·200² = 0.94 for ferritic steel (§18.10.6.3, hand calculation)", () => {
    expect(temperatureFactor(200, "steel")).toBeCloseTo(0.94, 12);
    expect(temperatureFactor(200, "stainless")).toBeCloseTo(1.043 - 0.086, 12);
    expect(temperatureFactor(80, "steel")).toBe(1);
  });

  it("unwelded curve: Δσ_R(10⁴) = 460 + 0.63 × 410 + 11.5 = 729.8 MPa (§18.11.2, hand calculation)", () => {
    expect(unweldedRange(1e4, 410)).toBeCloseTo(729.8, 10);
  });

  it("mean-stress factor: 1 at zero mean, continuous at σm = Δσ_R/(2(1+M)), falling with the mean (properties)", () => {
    expect(meanStressFactor(0, 500, 410)).toBe(1);
    const M = 0.00035 * 410 - 0.1;
    const edge = 500 / (2 * (1 + M));
    expect(meanStressFactor(edge - 1e-9, 500, 410)).toBeCloseTo(meanStressFactor(edge + 1e-9, 500, 410), 6);
    expect(meanStressFactor(edge, 500, 410)).toBeCloseTo(1 / (1 + M), 10);
    fc.assert(
      fc.property(fc.double({ min: 0, max: 250, noNaN: true }), fc.double({ min: 0.1, max: 50, noNaN: true }), (m, d) => {
        expect(meanStressFactor(m + d, 500, 410)).toBeLessThanOrEqual(meanStressFactor(m, 500, 410) + 1e-12);
      }),
    );
  });

  it("surface factor is 1 for a smooth surface (Rz = 1 µm ⇒ F_s = 1) and below 1 for as-rolled plate", () => {
    expect(surfaceFactor(1e5, 410, 1)).toBeCloseTo(1, 12);
    expect(surfaceFactor(1e5, 410, 200)).toBeLessThan(1);
  });

  it("unwelded life solves the curve: the corrected range at the life equals the applied range", () => {
    const c = welded({ kind: "en13445-unwelded" });
    const N = vesselLife(c, 500, 0, false) as number;
    const R = unweldedRange(N, 410) * surfaceFactor(N, 410, 200);
    expect(R).toBeCloseTo(500, 6);
  });
});

describe("the vessel path through the whole check", () => {
  const receiver = DEMOS.find((d) => d.id === "receiver")!;

  it("the receiver demo runs the vessel route with the EN 13445-3 basis and the nozzle fillet detail", () => {
    const r = run(receiver.document);
    expect(r.static.basis).toBe("en13445-3");
    expect(r.fatigue.curve).toBe("en13445-welded");
    expect(r.fatigue.weldDetail).toBe("nozzle-fillet");
    expect(r.fatigue.detailCategory_MPa).toBe(63);
    expect(r.steps.some((s) => s.id === "vessel-equivalent-range")).toBe(true);
    expect(r.steps.some((s) => s.id === "static-formula-thickness")).toBe(true);
    expect(r.static.statement).toContain("not a statement of compliance");
  });

  it("a plain thin receiver wall on class 63: Δσ_eq = Δp·(r_m/e_a + 1) with σr = −p, N = 2×10⁶·(63/Δσ_eq)³ (hand calculation)", () => {
    const r = run({
      format: "hoopwise.check/1",
      shell: { form: "cylinder", radius_mm: 300, radiusAt: "inner", thickness_mm: 5, service: "pressure-vessel" },
      pressure: { max_MPa: 1.1, min_MPa: 0 },
      material: { id: "steel-p265gh" },
      fatigue: { designLife_cycles: 1000, weldDetail: "nozzle-fillet" },
      static: { basis: "en13445-3", corrosionAllowance_mm: 1, thicknessTolerance_mm: 0.3 },
    });
    // analysis wall e_a = 5 − 1 − 0.3 = 3.7 mm (EN 13445-3 §5.2, from memory) outside the corroded inner radius
    // R = 300 + 1 = 301 mm (UG-27: R in the corroded condition, from memory) ⇒ r_m = 301 + 3.7/2 = 302.85 mm
    // principal ranges at the bore: σθ = 1.1 × 301.85/3.7, σx = half of it, σr = −1.1 ⇒ Tresca = σθ − σr (§18.6, from memory)
    const range = 1.1 * (302.85 / 3.7 + 1);
    expect(2 * r.fatigue.amplitude_MPa).toBeCloseTo(range, 9);
    // 5 mm ≤ 25 mm: no thickness correction; 20 °C: no temperature correction; range < 2·Rp0.2: ke = 1
    // welded class 63 (nozzle fillet, EN 13445-3 Table 18-4 from memory), slope 3: N = 2×10⁶·(63/91.14)³ ≈ 660 600 cycles
    expect(r.fatigue.life_cycles).toBeCloseTo(2e6 * (63 / range) ** 3, 3);
    expect(r.fatigue.weldedPoint?.range_MPa).toBeCloseTo(range, 9);
  });

  it("the welded route is refused for aluminium unless a class is given", () => {
    const doc = {
      format: "hoopwise.check/1",
      shell: { form: "cylinder", radius_mm: 300, radiusAt: "inner", thickness_mm: 5, service: "pressure-vessel" },
      pressure: { max_MPa: 1, min_MPa: 0 },
      material: { id: "al-2024-t3" },
      fatigue: { designLife_cycles: 1000, curve: "en13445-welded", weldDetail: "nozzle-fillet" },
    };
    const out = checkDocument(doc);
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.errors[0].path).toBe("fatigue.detailCategory_MPa");
    const given = checkDocument({ ...doc, fatigue: { designLife_cycles: 1000, curve: "en13445-welded", detailCategory_MPa: 25 } });
    expect(given.ok).toBe(true);
    // left to its default, an aluminium vessel keeps the material curve
    const dflt = run({ ...doc, fatigue: { designLife_cycles: 1000 }, static: { basis: "asme-viii-1" } });
    expect(dflt.fatigue.curve).toBe("basquin");
  });

  it("vacuum in a block refers the check with the words a checker needs", () => {
    const doc = structuredClone(receiver.document) as Record<string, any>;
    doc.pressure = { blocks: [{ max_MPa: 1.1, min_MPa: -0.09, cycles: 300 }] };
    const r = run(doc);
    const row = r.verdictTable.find((x) => x.id === "external-pressure");
    expect(row?.status).toBe("refer");
    expect(row?.detail).toContain("needs a buckling check to the governing code");
    expect(r.verdict === "refer" || r.verdict === "fail").toBe(true);
  });

  it("a single cycle down to vacuum refers a check that otherwise passes", () => {
    const doc = structuredClone(receiver.document) as Record<string, any>;
    doc.pressure = { max_MPa: 1, min_MPa: -0.1 };
    delete doc.crack;
    const r = run(doc);
    expect(r.verdictTable.filter((x) => x.status === "fail")).toEqual([]);
    expect(r.verdict).toBe("refer");
    expect(r.load.pressureMin_MPa).toBeCloseTo(-0.1, 12);
  });
});

describe("the vessel route's own warnings reach the result", () => {
  const receiver = DEMOS.find((d) => d.id === "receiver")!.document;
  it("a ferritic vessel above 380 °C is warned that the clause 18 curves do not cover creep", () => {
    // EN 13445-3 clause 18 covers temperatures below the creep range, about 380 °C for ferritic steels (from memory).
    const hot = run({ ...receiver, fatigue: { ...receiver.fatigue, temperature_C: 450 } });
    expect(hot.warnings.some((w) => w.startsWith("at 450 °C a ferritic steel creeps"))).toBe(true);
    const warm = run({ ...receiver, fatigue: { ...receiver.fatigue, temperature_C: 300 } });
    expect(warm.warnings.some((w) => w.includes("creeps"))).toBe(false);
  });

  it("a welded vessel wall over 150 mm is warned that its thickness correction is held at 150 mm", () => {
    // EN 13445-3 §18.10.6.2: f_ew is published for 25 < e ≤ 150 mm (from memory).
    const r = run({ ...receiver, shell: { ...receiver.shell, thickness_mm: 200 } });
    expect(r.warnings).toContain("the thickness correction of the welded classes is published to 150 mm; it is held at 150 mm");
  });
});
