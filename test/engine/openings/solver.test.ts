import { describe, expect, it } from "vitest";
import { discretize, ellipse, periodicSpline, roundedRectangle } from "../../../src/engine/openings/geometry.ts";
import { buildOperator, edgeStress, solve, stressAt } from "../../../src/engine/openings/solver.ts";

/**
 * Edge stress of an elliptical hole, half-axes a along x and b along y, remote σxx = Sx, σyy = Sy,
 * at the point x = a cos η, y = b sin η: Muskhelishvili's conformal-map solution (Some Basic
 * Problems of the Mathematical Theory of Elasticity, §§82–83), with m = (a − b)/(a + b),
 *   σ = [Sx(1 − m² + 2m − 2cos2η) + Sy(1 − m² − 2m + 2cos2η)]/(1 − 2m cos2η + m²).
 * It gives Inglis' 1 + 2b/a at the ends of b under Sx (Inglis 1913; Peterson §4.5) and Kirsch's
 * 1 − 2cos2η for a circle (Kirsch 1898; Peterson Chart 4.1).
 */
function inglis(a: number, b: number, sx: number, sy: number, x: number, y: number): number {
  const m = (a - b) / (a + b);
  const c2 = Math.cos(2 * Math.atan2(y / b, x / a));
  return (sx * (1 - m * m + 2 * m - 2 * c2) + sy * (1 - m * m - 2 * m + 2 * c2)) / (1 - 2 * m * c2 + m * m);
}

/** Largest error at any node over the largest edge stress: the "1 % at every boundary point" measure. */
function ellipseError(a: number, b: number, lambda: number, opts = {}): { error: number; nodes: number } {
  const d = discretize([ellipse(a, b)], opts);
  const st = edgeStress(solve(buildOperator(d), { sxx: 1, syy: lambda }));
  let err = 0;
  let peak = 0;
  for (let i = 0; i < d.n; i++) {
    const ref = inglis(a, b, 1, lambda, d.x[i], d.y[i]);
    err = Math.max(err, Math.abs(st[i] - ref));
    peak = Math.max(peak, Math.abs(ref));
  }
  return { error: err / peak, nodes: d.n };
}

describe("integral-equation solver for traction-free holes", () => {
  it("reproduces Kirsch for a circle at every node, biaxial ratios −1 to 3 (Kirsch 1898; Peterson Chart 4.1)", () => {
    for (const lambda of [-1, 0, 0.5, 1, 2, 3]) expect(ellipseError(1, 1, lambda).error).toBeLessThan(1e-6);
  });

  it("reproduces Inglis for ellipses of several aspect ratios, both orientations, λ from −1 to 3, within 1 % everywhere (Muskhelishvili §83)", () => {
    for (const [a, b] of [
      [2, 1],
      [1, 2],
      [4, 1],
      [1, 4],
      [3, 2],
    ])
      for (const lambda of [-1, 0, 0.5, 1, 3]) expect(ellipseError(a, b, lambda).error).toBeLessThan(0.01);
  });

  it("peaks at Inglis' 1 + 2b/a for a 1:3 ellipse across the load (Inglis 1913: 7)", () => {
    const d = discretize([ellipse(1, 3)]);
    const st = edgeStress(solve(buildOperator(d), { sxx: 1, syy: 0 }));
    // the node nearest the end of the 3-long axis
    let best = 0;
    for (let i = 0; i < d.n; i++) if (Math.abs(d.y[i]) > Math.abs(d.y[best])) best = i;
    expect(st[best]).toBeCloseTo(7, 2);
  });

  it("converges as the outline is refined: the error falls with the panel size (convergence table)", () => {
    // Refinement: equal panels of 8 Gauss points, 1, 2, 3, 4, 6 and 8 per quarter of a 3:1 ellipse, λ = 0.5.
    const table: { panelsPerQuarter: number; nodes: number; error: number }[] = [];
    for (const k of [1, 2, 3, 4, 6, 8]) {
      const r = ellipseError(3, 1, 0.5, { adaptive: false, panelsPerPiece: k, p: 8 });
      table.push({ panelsPerQuarter: k, nodes: r.nodes, error: r.error });
    }
    console.table(table);
    for (let k = 1; k < table.length; k++) expect(table[k].error).toBeLessThan(table[k - 1].error);
    expect(table[table.length - 1].error).toBeLessThan(1e-4);
    expect(table[0].error).toBeGreaterThan(100 * table[table.length - 1].error);
  });

  it("gives the full stress state inside the plate as Kirsch's field around a circle (Timoshenko & Goodier, Theory of Elasticity, §35)", () => {
    const d = discretize([ellipse(1, 1)]);
    const sol = solve(buildOperator(d), { sxx: 1, syy: 0 });
    for (const [r, th] of [
      [1.05, 0.3],
      [1.5, 1.2],
      [3, 2.0],
      [1.2, -2.6],
    ]) {
      const q = stressAt(sol, r * Math.cos(th), r * Math.sin(th));
      const c2 = Math.cos(2 * th);
      const s2 = Math.sin(2 * th);
      const a2 = 1 / (r * r);
      const srr = 0.5 * (1 - a2) + 0.5 * (1 - 4 * a2 + 3 * a2 * a2) * c2;
      const stt = 0.5 * (1 + a2) - 0.5 * (1 + 3 * a2 * a2) * c2;
      const srt = -0.5 * (1 + 2 * a2 - 3 * a2 * a2) * s2;
      const c = Math.cos(th);
      const s = Math.sin(th);
      expect(q.sxx).toBeCloseTo(srr * c * c + stt * s * s - 2 * srt * s * c, 6);
      expect(q.syy).toBeCloseTo(srr * s * s + stt * c * c + 2 * srt * s * c, 6);
      expect(q.sxy).toBeCloseTo((srr - stt) * s * c + srt * (c * c - s * s), 6);
    }
  });

  it("tends to the remote field far from the hole and to a free edge at it (equilibrium properties)", () => {
    const d = discretize([roundedRectangle(1, 0.6, 0.2)]);
    const sol = solve(buildOperator(d), { sxx: 1, syy: 0.5 });
    const far = stressAt(sol, 40, 30);
    expect(far.sxx).toBeCloseTo(1, 2);
    expect(far.syy).toBeCloseTo(0.5, 2);
    // just off the straight top side, σyy and σxy vanish (traction-free edge)
    const near = stressAt(sol, 0.1, 0.6001);
    expect(Math.abs(near.syy)).toBeLessThan(2e-3);
    expect(Math.abs(near.sxy)).toBeLessThan(2e-3);
  });

  it("solves two holes together: two equal circles far apart each tend to Kirsch (Kirsch 1898)", () => {
    const d = discretize([ellipse(1, 1, -30, 0), ellipse(1, 1, 30, 0)]);
    const st = edgeStress(solve(buildOperator(d), { sxx: 0, syy: 1 }));
    let peak = 0;
    for (let i = 0; i < d.n; i++) peak = Math.max(peak, st[i]);
    // two holes 60 radii apart: interaction of order (a/d)² ≈ 0.1 %
    expect(peak).toBeGreaterThan(2.999);
    expect(peak).toBeLessThan(3.01);
  });

  it("raises the edge stress of two circles in a row across the load (Peterson Chart 4.22 trend: Ling 1948)", () => {
    // Two equal holes, centres 3 radii apart on a line across the load: the ligament stress rises
    // above Kirsch's 3 (Ling's solution, Peterson Chart 4.22, about 3.2 at this spacing, from memory).
    const d = discretize([ellipse(1, 1, 0, -1.5), ellipse(1, 1, 0, 1.5)]);
    const st = edgeStress(solve(buildOperator(d), { sxx: 1, syy: 0 }));
    let peak = 0;
    for (let i = 0; i < d.n; i++) peak = Math.max(peak, st[i]);
    expect(peak).toBeGreaterThan(3.1);
    expect(peak).toBeLessThan(3.4);
  });

  it("smooths a closed outline by a periodic spline that runs clockwise and passes through the points", () => {
    const pts: [number, number][] = [];
    for (let k = 0; k < 24; k++) pts.push([2 * Math.cos((2 * Math.PI * k) / 24), Math.sin((2 * Math.PI * k) / 24)]);
    const { pieces, clockwise } = periodicSpline(pts);
    expect(clockwise).toBe(false);
    expect(pieces).toHaveLength(24);
    // a spline through 24 points of a 2:1 ellipse stays within 0.1 % of its radius
    for (const piece of pieces) {
      const q = piece(0.5);
      expect(Math.abs(Math.hypot(q.x / 2, q.y) - 1)).toBeLessThan(1e-3);
    }
    // and its Kt comes within 1 % of Inglis' 1 + 2·1/2 = 2 for a load along the long axis... and 5 across it
    const d = discretize([{ pieces, inside: [0, 0] }]);
    const st = edgeStress(solve(buildOperator(d), { sxx: 0, syy: 1 }));
    let peak = 0;
    for (let i = 0; i < d.n; i++) peak = Math.max(peak, st[i]);
    expect(Math.abs(peak - 5) / 5).toBeLessThan(0.01);
  });
});
