/**
 * Stress intensity of a through-crack growing into a stress gradient, from the stress along its
 * path in the uncracked part, by a Green's function (weight function).
 *
 * Edge crack of depth a in a half-plane, a pair of splitting forces P (per unit thickness) at
 * distance x from the free edge (Tada, Paris & Irwin, The Stress Analysis of Cracks Handbook,
 * edge crack with point loads on its faces; the Hartranft–Sih form, within about 1 %, from memory):
 *   K = (2P/√(πa))·F(x/a)/√(1 − (x/a)²),  F(ξ) = 1.3 − 0.3·ξ^(5/4).
 * For a stress σ(x) along the path, K = (2/√(πa))·∫₀^a σ(x)·F(x/a)/√(1 − (x/a)²) dx; with
 * x = a·sin θ the integrand is smooth: K = (2/π)·σ̄·√(πa), σ̄ = ∫₀^{π/2} σ(a sin θ)·F(sin θ) dθ.
 * A uniform σ gives 1.122·σ√(πa), the half-plane's 1.1215.
 *
 * A crack at a fastener hole in a gradient: Bowie's factor F_B is exact for the hole in a uniform
 * field, where the stress along the path is the hole's own Kirsch field σ_n·k(x). In a field that
 * varies, the Bowie K is corrected by the ratio of the Green's-function integrals of the actual
 * stress along the path and of the uniform-field Kirsch stress (a compounding of the two
 * solutions, as in Cartwright & Rooke's compounding method; common practice in damage-tolerance
 * analysis of fastener holes):
 *   K = F_B(a)·√(πa)·σ_eff(a),  σ_eff = ∫σ(x)·m(x, a) dx / ∫k(x)·m(x, a) dx.
 * In a uniform field σ(x) = σ_n·k(x), so σ_eff = σ_n and K is Bowie's exactly.
 */

/** Gauss–Legendre nodes and weights on [−1, 1], found once by Newton's method on P_n. */
function gaussLegendre(n: number): { x: number[]; w: number[] } {
  const x: number[] = [];
  const w: number[] = [];
  for (let i = 1; i <= n; i++) {
    let z = Math.cos((Math.PI * (i - 0.25)) / (n + 0.5));
    let dp = 0;
    for (let it = 0; it < 100; it++) {
      let p0 = 1;
      let p1 = z;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * z * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      dp = (n * (z * p1 - p0)) / (z * z - 1);
      const dz = p1 / dp;
      z -= dz;
      if (Math.abs(dz) < 1e-15) break;
    }
    x.push(z);
    w.push(2 / ((1 - z * z) * dp * dp));
  }
  return { x, w };
}

const GL = gaussLegendre(24);

/** Edge-crack point-load Green's function factor F(ξ) = 1.3 − 0.3·ξ^(5/4), ξ = x/a. */
export function edgeCrackF(xi: number): number {
  return 1.3 - 0.3 * xi ** 1.25;
}

/**
 * σ̄ = ∫₀^{π/2} σ(a sin θ)·F(sin θ) dθ, so that K = (2/π)·σ̄·√(πa) for an edge crack of depth a (mm)
 * under the stress σ(x) along its path, x from the free edge (mm).
 */
export function edgeCrackIntegral(stress: (x_mm: number) => number, a_mm: number): number {
  let sum = 0;
  const h = Math.PI / 4; // half of [0, π/2]
  for (let i = 0; i < GL.x.length; i++) {
    const theta = h * (GL.x[i] + 1);
    const s = Math.sin(theta);
    sum += GL.w[i] * stress(a_mm * s) * edgeCrackF(s);
  }
  return sum * h;
}

/** Geometry factor of an edge crack under σ(x)/σ_ref: Y = (2/π)·σ̄/σ_ref, K = Y·σ_ref·√(πa). */
export function edgeCrackFactor(stress: (x_mm: number) => number, a_mm: number, sigmaRef = 1): number {
  return ((2 / Math.PI) * edgeCrackIntegral(stress, a_mm)) / sigmaRef;
}

/**
 * Kirsch's stress across the line through a hole of radius R in a uniaxial field σ_n normal to it,
 * at distance x from the hole's edge: σ/σ_n = 1 + ½(R/r)² + (3/2)(R/r)⁴, r = R + x
 * (Kirsch 1898; Peterson's Stress Concentration Factors; Timoshenko & Goodier §35).
 */
export function kirschUniaxial(x_mm: number, R_mm: number): number {
  const q = (R_mm / (R_mm + x_mm)) ** 2;
  return 1 + 0.5 * q + 1.5 * q * q;
}

/**
 * The effective nominal stress σ_eff that Bowie's factor multiplies for a crack of size a (mm) at a
 * hole of radius R (mm) in a field σ(x) along the path (the stress the part would carry there
 * without the hole, MPa; x from the hole's edge): σ_eff = ∫σ(x)k(x)m dx / ∫k(x)m dx.
 */
export function effectiveStress(field: (x_mm: number) => number, a_mm: number, R_mm: number): number {
  const k = (x: number) => kirschUniaxial(x, R_mm);
  return edgeCrackIntegral((x) => field(x) * k(x), a_mm) / edgeCrackIntegral(k, a_mm);
}
