import { describe, expect, it } from "vitest";
import { InputError } from "../../../src/engine/errors.ts";
import { checkDocument } from "../../../src/engine/index.ts";
import { curvature, shapeField } from "../../../src/engine/openings/field.ts";
import { peakAt, solveOpening } from "../../../src/engine/openings/index.ts";

const flatShell = { form: "cylinder" as const, meanRadius_mm: 1e9, thickness_mm: 1 };

/**
 * Curve fit of the chart for a rectangular hole with rounded corners in an infinite plate under
 * uniaxial tension (Peterson's Stress Concentration Factors, Pilkey, 3rd ed., rounded-rectangle
 * chart after Sobey, ARC R&M 3407, 1963): 2a across the load, 2b along it, 0.2 ≤ r/b ≤ 1,
 * 0.3 ≤ b/a ≤ 1. Coefficients as published with the chart (reproduced by amesweb.info's calculator).
 */
function sobeyFit(a: number, b: number, r: number): number {
  const x = r / b;
  const s = Math.sqrt(x);
  const c1 = 14.815 - 15.774 * s + 8.149 * x;
  const c2 = -11.201 - 9.75 * s + 9.6 * x;
  const c3 = 0.202 + 38.662 * s - 27.374 * x;
  const c4 = 3.232 - 23.002 * s + 15.482 * x;
  const q = b / a;
  return c1 + c2 * q + c3 * q * q + c4 * q * q * q;
}

const rr = (hx: number, hy: number, r: number) =>
  ({ kind: "rounded-rectangle", halfWidthAlongHoop_mm: hx, halfLengthAlongAxial_mm: hy, cornerRadius_mm: r }) as const;

describe("openings of their own shape", () => {
  it("matches the rounded-rectangle chart within 3 % inside the chart's range (Pilkey, after Sobey 1963)", () => {
    // load along the hoop (x): b = half-width along the hoop, a = half-length across it
    for (const [b, a, r] of [
      [100, 100, 25],
      [100, 100, 50],
      [100, 200, 25],
      [100, 200, 50],
      [100, 150, 40],
    ]) {
      const kt = peakAt(solveOpening(rr(b, a, r)).edge, 0).kt;
      const chart = sobeyFit(a, b, r);
      expect(Math.abs(kt - chart) / chart).toBeLessThan(0.03);
    }
  });

  it("puts a rounded square with small corner radii above 3 in uniaxial tension (common practice)", () => {
    for (const r of [5, 10, 15]) expect(peakAt(solveOpening(rr(100, 100, r)).edge, 0).kt).toBeGreaterThan(3);
  });

  it("turns into Kirsch's circle when the corner radius equals both half-sizes (Kirsch 1898: 3 − λ)", () => {
    const edge = solveOpening(rr(50, 50, 50)).edge;
    for (const lambda of [-1, 0, 0.5, 1, 3]) {
      const expected = lambda <= 1 ? 3 - lambda : 3 * lambda - 1;
      expect(peakAt(edge, lambda).kt).toBeCloseTo(expected, 2);
    }
  });

  it("smooths an outline through points of an ellipse to Inglis' value (Inglis 1913: 1 + 2·60/40 = 4)", () => {
    const pts: [number, number][] = [];
    for (let k = 0; k < 40; k++) pts.push([40 * Math.cos((2 * Math.PI * k) / 40), 60 * Math.sin((2 * Math.PI * k) / 40)]);
    const kt = peakAt(solveOpening({ kind: "outline", points_mm: pts }).edge, 0).kt;
    expect(Math.abs(kt - 4) / 4).toBeLessThan(0.01);
  });

  it("refuses an outline that crosses itself, naming the field", () => {
    const bow: [number, number][] = [
      [-50, -50],
      [0, -10],
      [50, -50],
      [50, 50],
      [0, 10],
      [-50, 50],
      [50, -30],
    ];
    expect(() => solveOpening({ kind: "outline", points_mm: bow })).toThrow(InputError);
  });
});

describe("fastener holes in the field of an opening", () => {
  const opening = rr(100, 140, 40);

  it("gives a hole far from the opening Kirsch's value in the remote field (Kirsch 1898: 3 − λ)", () => {
    const field = shapeField(opening, [{ hoop_mm: 20000, axial_mm: 0, radius_mm: 2.5 }], flatShell);
    for (const lambda of [0, 0.5, 1]) expect(field.fastenersAt(lambda)[0].kt).toBeCloseTo(3 - lambda, 2);
  });

  it("works a hole beside the opening in the local field, and solves one close to the edge together with it", () => {
    const fasteners = [
      { hoop_mm: 0, axial_mm: 140 + 30, radius_mm: 2.5 }, // 27.5 mm of ligament: Kirsch in the local field
      { hoop_mm: 0, axial_mm: -(140 + 6), radius_mm: 2.5 }, // 3.5 mm of ligament: solved together
    ];
    const field = shapeField(opening, fasteners, flatShell);
    const [far, near] = field.fastenersAt(0.5);
    expect(far.solvedWithOpening).toBe(false);
    expect(near.solvedWithOpening).toBe(true);
    // Beside the axial end of the opening the hoop stress is raised, so each hole sees more than the remote 2.5.
    expect(far.kt).toBeGreaterThan(2.5);
    // The interaction through a thin ligament raises the hole's edge stress above the product estimate (property).
    expect(near.kt).toBeGreaterThan(near.ktKirsch);
  });

  it("refuses a hole whose ligament to the opening is under half its radius, and a hole inside the opening", () => {
    expect(() => shapeField(opening, [{ hoop_mm: 0, axial_mm: 141, radius_mm: 2.5 }], flatShell)).toThrow(/ligament/);
    expect(() => shapeField(opening, [{ hoop_mm: 0, axial_mm: 0, radius_mm: 2.5 }], flatShell)).toThrow(/inside the opening/);
  });
});

describe("shell curvature and reinforcement", () => {
  it("works the curvature parameter by hand: a = 100, R = 1000, t = 2 gives β = 1.285 × 2.236/2 = 1.437 and refers", () => {
    const c = curvature(100, { form: "cylinder", meanRadius_mm: 1000, thickness_mm: 2 });
    // (3(1 − 0.09))^¼ = 1.2854; 100/√2000 = 2.2361
    expect(c.beta).toBeCloseTo(1.4372, 3);
    expect(c.within).toBe(false);
    expect(c.refer[0]).toMatch(/too large for a membrane screening/);
  });

  it("applies the small-curvature correction within its range: a = 5, R = 1500, t = 2 gives 1 + 1.3 × 0.0587² (from memory)", () => {
    const c = curvature(5, { form: "cylinder", meanRadius_mm: 1500, thickness_mm: 2 });
    expect(c.beta).toBeCloseTo((1.2854 * 5) / (2 * Math.sqrt(3000)), 4);
    expect(c.factor).toBeCloseTo(1 + 1.3 * c.beta * c.beta, 10);
    expect(c.refer).toHaveLength(0);
  });

  it("makes a neutral hole with Mansfield's ring A = a·t/(1 − ν) under equal biaxial stress (Mansfield 1953)", () => {
    const a = 10;
    const t = 2;
    const field = shapeField(
      { kind: "circular-hole", radius_mm: a },
      [],
      { form: "sphere", meanRadius_mm: 1e9, thickness_mm: t },
      { area_mm2: (a * t) / (1 - 0.3), width_mm: 3 },
    );
    expect(peakAt(field.picture.edge, 1).kt).toBeCloseTo(1, 2);
  });
});

describe("the check with an opening of its own shape", () => {
  const base = {
    format: "hoopwise.check/1",
    shell: { form: "cylinder", radius_mm: 1500, thickness_mm: 2 },
    pressure: { max_MPa: 0.06 },
    material: { id: "al-2024-t3" },
    fatigue: { designLife_cycles: 60000 },
  };

  it("reports each fastener's Kt in the order given, and the governing point sets notch.kt", () => {
    const out = checkDocument({
      ...base,
      cutout: {
        kind: "rounded-rectangle",
        halfWidthAlongHoop_mm: 6,
        halfLengthAlongAxial_mm: 8,
        cornerRadius_mm: 3,
        fasteners: [
          { hoop_mm: 20, axial_mm: 0, radius_mm: 0.5 },
          { hoop_mm: 0, axial_mm: 8 + 1.5, radius_mm: 0.5 },
        ],
      },
    });
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    const n = out.result.notch;
    expect(n.fasteners).toHaveLength(2);
    expect(n.fasteners?.[0].hoop_mm).toBe(20);
    expect(n.fasteners?.[1].solvedWithOpening).toBe(true);
    const all = [n.opening?.governing.kt ?? 0, ...(n.fasteners ?? []).map((f) => f.kt)];
    expect(n.kt).toBeCloseTo(Math.max(...all), 10);
    expect(out.result.steps.some((s) => s.id === "opening-curvature")).toBe(true);
  });

  it("refers an opening too large for a membrane screening, in plain words", () => {
    const out = checkDocument({
      ...base,
      cutout: { kind: "rounded-rectangle", halfWidthAlongHoop_mm: 120, halfLengthAlongAxial_mm: 170, cornerRadius_mm: 50 },
    });
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    const row = out.result.verdictTable.find((r) => r.id === "opening");
    expect(row?.status).toBe("refer");
    expect(out.result.verdict === "refer" || out.result.verdict === "fail").toBe(true);
  });

  it("refuses a slot too slender for the solver's panels as an error on the cutout, and solves a moderately slender one", () => {
    // A 230 × 2 mm slot: its long sides stand 2 mm apart, so panels short beside that gap (the
    // discretizer's proximity rule) would number far past the solver's limit. This had thrown
    // past the engine and answered 500.
    const slot = checkDocument({ ...base, cutout: rr(115, 1, 0.5) });
    expect(slot.ok).toBe(false);
    if (slot.ok) return;
    expect(slot.errors[0].path).toBe("cutout");
    expect(slot.errors[0].message).toContain("too slender");
    // 10:1 is well inside what the panels resolve: a result, not a refusal.
    expect(checkDocument({ ...base, cutout: rr(40, 4, 2) }).ok).toBe(true);
  });

  it("answers an error that names the field for a corner radius beyond the half-size", () => {
    const out = checkDocument({
      ...base,
      cutout: { kind: "rounded-rectangle", halfWidthAlongHoop_mm: 10, halfLengthAlongAxial_mm: 20, cornerRadius_mm: 12 },
    });
    expect(out.ok).toBe(false);
    if (out.ok) return;
    expect(out.errors[0].path).toBe("cutout.cornerRadius_mm");
  });
});
