import type { Discretization } from "./geometry.ts";
import { interpolationRow } from "./gauss.ts";

/**
 * Plane elasticity of an infinite plate with traction-free holes under a remote uniform stress
 * (σxx∞, σyy∞, τxy∞), by a second-kind integral equation of Sherman–Lauricella type solved by
 * the Nyström method on Gauss–Legendre panels.
 *
 * Complex potentials (Muskhelishvili, Some Basic Problems of the Mathematical Theory of Elasticity,
 * §§32–41): σxx + σyy = 4 Re φ′(z), σyy − σxx + 2iσxy = 2[z̄ φ″(z) + ψ′(z)]. The remote field is
 * φ₀ = Γz, ψ₀ = Γ′z with Γ = (σxx∞ + σyy∞)/4, Γ′ = (σyy∞ − σxx∞)/2 + iτxy∞. A hole is free of
 * traction when f = φ + z·conj(φ′) + conj(ψ) is constant along its edge (§41).
 *
 * The disturbance is written with one complex density ω on all edges L (clockwise, plate on the
 * left), Sherman's representation (Muskhelishvili §100; Mikhlin, Integral Equations, 1957):
 *   φ₁(z) = (1/2πi) ∫ ω dt/(t − z),
 *   ψ₁(z) = (1/2πi) ∫ (conj(ω) dt + ω conj(dt))/(t − z) − (1/2πi) ∫ conj(t) ω dt/(t − z)² + Σ_k b_k/(z − z_k),
 * with a real b_k and a pole z_k inside each hole. On the edge (Plemelj) this gives the equation
 *   ω(t₀) + (1/π) ∫ ω d arg(t − t₀) − (1/2πi) ∫ conj(ω) d[(t − t₀)/conj(t − t₀)] + Σ_k b_k/conj(t₀ − z_k)
 *      + (1/L_k) ∫_{L_k} ω ds = −(2Γ t₀ + Γ′ conj(t₀)),
 * both kernels smooth on a smooth edge (diagonal limits κ/2π·|t′| and −κ/2π·t′²/|t′|). The last
 * term fixes the edge constant C_k = −(1/L_k)∫ω ds, and b_k = (1/L_k) Re ∫_{L_k} ω conj(t − t̄_k) ds
 * (t̄_k the arc centroid): together they remove the null space ω = c_k + a_k t (a_k real) that the
 * representation has on each edge, leaving a uniquely solvable equation of the second kind. The
 * constant and real-residue terms play the part of Sherman's modification for several contours.
 *
 * The tangential stress on a free edge is σtt = σxx + σyy = 4 Re φ′ (σnn = 0), with
 * φ₁′(t₀) = (1/2πi) ∫_{L_k} (W(t) − W(t₀)) dt/(t − t₀) + (1/2πi) ∫_{L∖L_k} W dt/(t − t₀), W = dω/dt,
 * the principal value of ∫_{L_k} dt/(t − t₀) on a clockwise edge cancelling the jump ½W(t₀).
 * The trapezoidal or panel Nyström method for smooth kernels converges as fast as the density is
 * smooth (Kress, Linear Integral Equations, Ch. 12); GMRES (Saad & Schultz 1986) solves the system.
 */

export interface RemoteStress {
  sxx: number;
  syy: number;
  sxy?: number;
}

export interface Operator {
  disc: Discretization;
  /** Real kernel of the ω term, row-major n×n (K1[i·n + j] multiplies ω_j in the equation at node i). */
  k1: Float64Array;
  /** Complex kernel of the conj(ω) term. */
  k2re: Float64Array;
  k2im: Float64Array;
  /** Arc-length element |t′|·w at each node. */
  ds: Float64Array;
  /** Each hole's interior pole z_k. */
  poles: [number, number][];
}

export function buildOperator(disc: Discretization): Operator {
  const { n, x, y, dx, dy, ddx, ddy, w } = disc;
  const k1 = new Float64Array(n * n);
  const k2re = new Float64Array(n * n);
  const k2im = new Float64Array(n * n);
  const ds = new Float64Array(n);
  for (let j = 0; j < n; j++) ds[j] = Math.hypot(dx[j], dy[j]) * w[j];
  const invPi = 1 / Math.PI;
  for (let i = 0; i < n; i++) {
    const xi = x[i];
    const yi = y[i];
    const row = i * n;
    for (let j = 0; j < n; j++) {
      if (j === i) continue;
      const ex = x[j] - xi;
      const ey = y[j] - yi;
      // q = Im(t′ conj(Δ))·w/π ; K1 = q/|Δ|² ; K2 = −q·Δ²/|Δ|⁴
      const q = (dy[j] * ex - dx[j] * ey) * w[j] * invPi;
      const r2 = ex * ex + ey * ey;
      const f = q / (r2 * r2);
      k1[row + j] = q / r2;
      k2re[row + j] = -f * (ex * ex - ey * ey);
      k2im[row + j] = -f * 2 * ex * ey;
    }
    const sp = Math.hypot(dx[i], dy[i]);
    const kappa = (dx[i] * ddy[i] - dy[i] * ddx[i]) / (sp * sp * sp);
    k1[row + i] = (kappa * sp * w[i]) / (2 * Math.PI);
    const c = -(kappa * w[i]) / (2 * Math.PI * sp);
    k2re[row + i] = c * (dx[i] * dx[i] - dy[i] * dy[i]);
    k2im[row + i] = c * 2 * dx[i] * dy[i];
  }
  // Rows of nodes close to another panel: that panel's part by the near rule, so that a kernel which
  // varies quickly there (a node beside a panel end where the curvature jumps, or a nearby hole) is
  // integrated accurately.
  const p = disc.rule.p;
  const np = disc.panels.length;
  const pc: [number, number, number][] = [];
  for (let pi = 0; pi < np; pi++) {
    let cx = 0;
    let cy = 0;
    let len = 0;
    for (let j = pi * p; j < pi * p + p; j++) {
      cx += x[j] / p;
      cy += y[j] / p;
      len += ds[j];
    }
    pc.push([cx, cy, len]);
  }
  for (let i = 0; i < n; i++) {
    const own = Math.floor(i / p);
    const xi = x[i];
    const yi = y[i];
    const row = i * n;
    for (let pi = 0; pi < np; pi++) {
      if (pi === own || Math.hypot(xi - pc[pi][0], yi - pc[pi][1]) >= 1.0 * pc[pi][2]) continue;
      const base = pi * p;
      for (let j = 0; j < p; j++) {
        k1[row + base + j] = 0;
        k2re[row + base + j] = 0;
        k2im[row + base + j] = 0;
      }
      nearRule(disc, pi, xi, yi, (tx, ty, dtx, dty, weight, lag) => {
        const ex = tx - xi;
        const ey = ty - yi;
        const q = (dty * ex - dtx * ey) * weight * invPi;
        const r2 = ex * ex + ey * ey;
        const f = q / (r2 * r2);
        const a = q / r2;
        const br = -f * (ex * ex - ey * ey);
        const bi = -f * 2 * ex * ey;
        for (let j = 0; j < p; j++) {
          const l = lag[j];
          k1[row + base + j] += a * l;
          k2re[row + base + j] += br * l;
          k2im[row + base + j] += bi * l;
        }
      });
    }
  }
  const poles = disc.outlines.map((o) => o.inside);
  return { disc, k1, k2re, k2im, ds, poles };
}

/** b_k = (1/L_k) Re ∫_{L_k} ω conj(t − t̄_k) ds */
function residues(op: Operator, ure: Float64Array, uim: Float64Array): number[] {
  const { disc, ds } = op;
  const b: number[] = [];
  for (let h = 0; h < disc.holeStart.length; h++) {
    const [cx, cy] = disc.centroid[h];
    let s = 0;
    const end = disc.holeStart[h] + disc.holeCount[h];
    for (let j = disc.holeStart[h]; j < end; j++) s += (ure[j] * (disc.x[j] - cx) + uim[j] * (disc.y[j] - cy)) * ds[j];
    b.push(s / disc.perimeter[h]);
  }
  return b;
}

/** Apply the operator of the integral equation to ω = u + iv (vectors of length 2n: real parts, then imaginary parts). */
function apply(op: Operator, v: Float64Array, out: Float64Array): void {
  const { disc, k1, k2re, k2im, ds, poles } = op;
  const n = disc.n;
  const ure = v.subarray(0, n);
  const uim = v.subarray(n, 2 * n);
  const b = residues(op, ure, uim);
  const mean: [number, number][] = [];
  for (let h = 0; h < disc.holeStart.length; h++) {
    let sr = 0;
    let si = 0;
    const end = disc.holeStart[h] + disc.holeCount[h];
    for (let j = disc.holeStart[h]; j < end; j++) {
      sr += ure[j] * ds[j];
      si += uim[j] * ds[j];
    }
    mean.push([sr / disc.perimeter[h], si / disc.perimeter[h]]);
  }
  for (let i = 0; i < n; i++) {
    const row = i * n;
    let ar = 0;
    let ai = 0;
    for (let j = 0; j < n; j++) {
      const a = k1[row + j];
      const br = k2re[row + j];
      const bi = k2im[row + j];
      const wr = ure[j];
      const wi = uim[j];
      // K1·ω + K2·conj(ω)
      ar += a * wr + br * wr + bi * wi;
      ai += a * wi + bi * wr - br * wi;
    }
    const [mr, mi] = mean[disc.hole[i]];
    ar += ure[i] + mr;
    ai += uim[i] + mi;
    for (let k = 0; k < b.length; k++) {
      // b_k / conj(t₀ − z_k) = b_k (t₀ − z_k)/|t₀ − z_k|²
      const ex = disc.x[i] - poles[k][0];
      const ey = disc.y[i] - poles[k][1];
      const r2 = ex * ex + ey * ey;
      ar += (b[k] * ex) / r2;
      ai += (b[k] * ey) / r2;
    }
    out[i] = ar;
    out[n + i] = ai;
  }
}

export class NoConvergence extends Error {}

/** Restarted GMRES with modified Gram–Schmidt and Givens rotations (Saad & Schultz 1986). */
function gmres(op: Operator, rhs: Float64Array, tol = 1e-10, restart = 80, maxIter = 400): { x: Float64Array; iterations: number } {
  const m = rhs.length;
  const x = new Float64Array(m);
  const bnorm = Math.hypot(...rhs) || 1;
  const r = new Float64Array(m);
  const tmp = new Float64Array(m);
  let iterations = 0;
  while (iterations < maxIter) {
    apply(op, x, tmp);
    for (let i = 0; i < m; i++) r[i] = rhs[i] - tmp[i];
    let beta = 0;
    for (let i = 0; i < m; i++) beta += r[i] * r[i];
    beta = Math.sqrt(beta);
    if (beta <= tol * bnorm) return { x, iterations };
    const V: Float64Array[] = [r.map((ri) => ri / beta)];
    const H: number[][] = [];
    const cs: number[] = [];
    const sn: number[] = [];
    const g = [beta];
    let k = 0;
    for (; k < restart && iterations < maxIter; k++, iterations++) {
      const wv = new Float64Array(m);
      apply(op, V[k], wv);
      const hcol: number[] = [];
      for (let j = 0; j <= k; j++) {
        let h = 0;
        const vj = V[j];
        for (let i = 0; i < m; i++) h += wv[i] * vj[i];
        for (let i = 0; i < m; i++) wv[i] -= h * vj[i];
        hcol.push(h);
      }
      let hn = 0;
      for (let i = 0; i < m; i++) hn += wv[i] * wv[i];
      hn = Math.sqrt(hn);
      hcol.push(hn);
      for (let j = 0; j < k; j++) {
        const t = cs[j] * hcol[j] + sn[j] * hcol[j + 1];
        hcol[j + 1] = -sn[j] * hcol[j] + cs[j] * hcol[j + 1];
        hcol[j] = t;
      }
      const den = Math.hypot(hcol[k], hcol[k + 1]);
      cs.push(hcol[k] / den);
      sn.push(hcol[k + 1] / den);
      hcol[k] = den;
      hcol[k + 1] = 0;
      g.push(-sn[k] * g[k]);
      g[k] = cs[k] * g[k];
      H.push(hcol);
      if (hn > 0) V.push(wv.map((wi) => wi / hn));
      if (Math.abs(g[k + 1]) <= tol * bnorm || hn === 0) {
        k++;
        iterations++;
        break;
      }
    }
    // back substitution
    const yk = new Array<number>(k).fill(0);
    for (let i = k - 1; i >= 0; i--) {
      let s = g[i];
      for (let j = i + 1; j < k; j++) s -= H[j][i] * yk[j];
      yk[i] = s / H[i][i];
    }
    for (let j = 0; j < k; j++) {
      const vj = V[j];
      for (let i = 0; i < m; i++) x[i] += yk[j] * vj[i];
    }
    if (Math.abs(g[k]) <= tol * bnorm) {
      apply(op, x, tmp);
      let res = 0;
      for (let i = 0; i < m; i++) res += (rhs[i] - tmp[i]) ** 2;
      if (Math.sqrt(res) <= 10 * tol * bnorm) return { x, iterations };
    }
  }
  throw new NoConvergence("the integral equation did not converge");
}

export interface Solution {
  op: Operator;
  load: RemoteStress;
  gamma: number;
  gammaPrime: [number, number];
  /** Density ω at the nodes. */
  wre: Float64Array;
  wim: Float64Array;
  /** dω/dt at the nodes. */
  Wre: Float64Array;
  Wim: Float64Array;
  b: number[];
  iterations: number;
}

export function solve(op: Operator, load: RemoteStress): Solution {
  const { disc } = op;
  const n = disc.n;
  const gamma = (load.sxx + load.syy) / 4;
  const gpr = (load.syy - load.sxx) / 2;
  const gpi = load.sxy ?? 0;
  // right side −(2Γ t + Γ′ conj(t))
  const rhs = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) {
    const tx = disc.x[i];
    const ty = disc.y[i];
    rhs[i] = -(2 * gamma * tx + gpr * tx + gpi * ty);
    rhs[n + i] = -(2 * gamma * ty + gpi * tx - gpr * ty);
  }
  const { x, iterations } = gmres(op, rhs);
  const wre = x.slice(0, n);
  const wim = x.slice(n, 2 * n);
  const { Wre, Wim } = derivative(disc, wre, wim);
  return { op, load, gamma, gammaPrime: [gpr, gpi], wre, wim, Wre, Wim, b: residues(op, wre, wim), iterations };
}

/** dω/dt at the nodes: panel-wise spectral differentiation in ξ divided by dt/dξ. */
function derivative(disc: Discretization, fre: Float64Array, fim: Float64Array): { Wre: Float64Array; Wim: Float64Array } {
  const { p, D } = disc.rule;
  const n = disc.n;
  const Wre = new Float64Array(n);
  const Wim = new Float64Array(n);
  for (let s = 0; s < n; s += p) {
    for (let i = 0; i < p; i++) {
      let ar = 0;
      let ai = 0;
      for (let j = 0; j < p; j++) {
        ar += D[i * p + j] * fre[s + j];
        ai += D[i * p + j] * fim[s + j];
      }
      // divide by t′ = dx + i dy
      const tx = disc.dx[s + i];
      const ty = disc.dy[s + i];
      const m2 = tx * tx + ty * ty;
      Wre[s + i] = (ar * tx + ai * ty) / m2;
      Wim[s + i] = (ai * tx - ar * ty) / m2;
    }
  }
  return { Wre, Wim };
}

function panelEnds(disc: Discretization, pi: number): [number, number, number, number] {
  const pan = disc.panels[pi];
  const piece = disc.outlines[pan.hole].pieces[pan.piece];
  const a = piece(pan.u0);
  const b = piece(pan.u1);
  return [a.x, a.y, b.x, b.y];
}

/**
 * Quadrature of a panel for a point z near it: the panel is halved until each part is farther
 * from z than 0.6 times its length (adaptive subdivision); each sub-node comes with the edge
 * recomputed exactly, its weight in the panel's ξ and the Lagrange row that carries the density
 * from the panel's own nodes to it.
 */
export function nearRule(
  disc: Discretization,
  pi: number,
  zx: number,
  zy: number,
  visitNode: (x: number, y: number, dx: number, dy: number, weight: number, row: Float64Array) => void,
): void {
  const rule = disc.rule;
  const { p, x: xi, w: gw } = rule;
  const pan = disc.panels[pi];
  const piece = disc.outlines[pan.hole].pieces[pan.piece];
  const half = (pan.u1 - pan.u0) / 2;
  const row = new Float64Array(p);
  const visit = (a: number, b: number, depth: number) => {
    const sh = (b - a) / 2;
    const q0 = piece(pan.u0 + half * (a + 1));
    const q1 = piece(pan.u0 + half * (b + 1));
    const qm = piece(pan.u0 + half * ((a + b) / 2 + 1));
    const len = Math.hypot(q1.x - qm.x, q1.y - qm.y) + Math.hypot(qm.x - q0.x, qm.y - q0.y);
    const dmin = Math.min(Math.hypot(q0.x - zx, q0.y - zy), Math.hypot(q1.x - zx, q1.y - zy), Math.hypot(qm.x - zx, qm.y - zy));
    if (dmin < 0.6 * len && depth < 40) {
      const m = (a + b) / 2;
      visit(a, m, depth + 1);
      visit(m, b, depth + 1);
      return;
    }
    for (let k = 0; k < p; k++) {
      const s = a + sh * (xi[k] + 1);
      const q = piece(pan.u0 + half * (s + 1));
      interpolationRow(rule, s, row);
      visitNode(q.x, q.y, q.dx * half, q.dy * half, gw[k] * sh, row);
    }
  };
  visit(-1, 1, 0);
}

/** ∫_panel ω dt/(t − z)² for a point z near the panel, by the near rule. */
function nearCauchy2(sol: Solution, pi: number, zx: number, zy: number): [number, number] {
  const p = sol.op.disc.rule.p;
  const base = pi * p;
  let sr = 0;
  let si = 0;
  nearRule(sol.op.disc, pi, zx, zy, (tx, ty, dtx, dty, weight, row) => {
    let wr = 0;
    let wi = 0;
    for (let j = 0; j < p; j++) {
      wr += row[j] * sol.wre[base + j];
      wi += row[j] * sol.wim[base + j];
    }
    const ex = tx - zx;
    const ey = ty - zy;
    const r2 = ex * ex + ey * ey;
    const ir = ex / r2;
    const ii = -ey / r2;
    const i2r = ir * ir - ii * ii;
    const i2i = 2 * ir * ii;
    const odr = (wr * dtx - wi * dty) * weight;
    const odi = (wr * dty + wi * dtx) * weight;
    sr += odr * i2r - odi * i2i;
    si += odr * i2i + odi * i2r;
  });
  return [sr, si];
}

/**
 * Tangential stress σtt at every node of every edge. For a node t₀ on panel P:
 *   ∫_L W dt/(t − t₀) (left limit) = ∫_P (W − W(t₀)) dt/(t − t₀) + W(t₀)·log((e − t₀)/(s − t₀))
 *        + ω(s)/(s − t₀) − ω(e)/(e − t₀) + ∫_{L∖P} ω dt/(t − t₀)²,
 * integrating by parts off P (s, e the ends of P; the log's imaginary part in (0, 2π) is the limit
 * from the plate's side). Panels near t₀ use the special quadrature above; far ones plain Gauss.
 */
export function edgeStress(sol: Solution): Float64Array {
  const { disc } = sol.op;
  const { n, x, y, dx, dy, w } = disc;
  const rule = disc.rule;
  const p = rule.p;
  const np = disc.panels.length;
  const pcx = new Float64Array(np);
  const pcy = new Float64Array(np);
  const plen = new Float64Array(np);
  const ends: [number, number, number, number][] = [];
  // density at the panel ends, by Lagrange extrapolation from the panel's nodes
  const endW: [number, number, number, number][] = [];
  const rowS = new Float64Array(p);
  const rowE = new Float64Array(p);
  interpolationRow(rule, -1, rowS);
  interpolationRow(rule, 1, rowE);
  for (let pi = 0; pi < np; pi++) {
    let len = 0;
    let a = 0;
    let b = 0;
    let c = 0;
    let d = 0;
    for (let j = 0; j < p; j++) {
      const k = pi * p + j;
      pcx[pi] += x[k] / p;
      pcy[pi] += y[k] / p;
      len += Math.hypot(dx[k], dy[k]) * w[k];
      a += rowS[j] * sol.wre[k];
      b += rowS[j] * sol.wim[k];
      c += rowE[j] * sol.wre[k];
      d += rowE[j] * sol.wim[k];
    }
    plen[pi] = len;
    ends.push(panelEnds(disc, pi));
    endW.push([a, b, c, d]);
  }
  const { Wre, Wim } = sol;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const own = Math.floor(i / p);
    const ti = x[i];
    const tq = y[i];
    let si = 0;
    // own panel: subtracted Cauchy integral of W
    for (let j = own * p; j < own * p + p; j++) {
      if (j === i) continue;
      const fr = Wre[j] - Wre[i];
      const fi = Wim[j] - Wim[i];
      const ex = x[j] - ti;
      const ey = y[j] - tq;
      const r2 = ex * ex + ey * ey;
      const ar = fr * dx[j] - fi * dy[j];
      const ai = fr * dy[j] + fi * dx[j];
      si += ((ai * ex - ar * ey) / r2) * w[j];
    }
    {
      // diagonal: (W(t) − W(t₀))·t′/(t − t₀) → dW/dξ
      let di = 0;
      const li = i - own * p;
      for (let j = 0; j < p; j++) di += rule.D[li * p + j] * Wim[own * p + j];
      si += di * w[i];
      const [sx, sy, ex2, ey2] = ends[own];
      const er = ex2 - ti;
      const ei = ey2 - tq;
      const br = sx - ti;
      const bi = sy - tq;
      const lr = 0.5 * Math.log((er * er + ei * ei) / (br * br + bi * bi));
      let lim = Math.atan2(ei * br - er * bi, er * br + ei * bi);
      if (lim <= 0) lim += 2 * Math.PI;
      si += Wre[i] * lim + Wim[i] * lr;
      // ω(s)/(s − t₀) − ω(e)/(e − t₀)
      const [oa, ob, oc, od] = endW[own];
      const bm = br * br + bi * bi;
      const em = er * er + ei * ei;
      si += (ob * br - oa * bi) / bm - (od * er - oc * ei) / em;
    }
    for (let pi = 0; pi < np; pi++) {
      if (pi === own) continue;
      if (Math.hypot(ti - pcx[pi], tq - pcy[pi]) < 1.0 * plen[pi]) {
        const [, ii] = nearCauchy2(sol, pi, ti, tq);
        si += ii;
        continue;
      }
      for (let j = pi * p; j < pi * p + p; j++) {
        const ex = x[j] - ti;
        const ey = y[j] - tq;
        const r2 = ex * ex + ey * ey;
        const invr = ex / r2;
        const invi = -ey / r2;
        const i2r = invr * invr - invi * invi;
        const i2i = 2 * invr * invi;
        const odr = (sol.wre[j] * dx[j] - sol.wim[j] * dy[j]) * w[j];
        const odi = (sol.wre[j] * dy[j] + sol.wim[j] * dx[j]) * w[j];
        si += odr * i2i + odi * i2r;
      }
    }
    // φ₁′ = (1/2πi)(sr + i si) ⇒ Re φ₁′ = si/2π: only the imaginary sum si is needed, so sr is never summed
    out[i] = 4 * (sol.gamma + si / (2 * Math.PI));
  }
  return out;
}

export interface PlaneStress {
  sxx: number;
  syy: number;
  sxy: number;
}

/**
 * Stress at a point of the plate: the five Cauchy-type integrals of the density by Gauss on far
 * panels and by the near rule on panels close to the point, then the potentials' formulas.
 */
export function stressAt(sol: Solution, px: number, py: number): PlaneStress {
  const { disc } = sol.op;
  const { p } = disc.rule;
  // I1 = ∫ω dt/(t−z)², I2 = ∫ω dt/(t−z)³, I3 = ∫conj(ω) dt/(t−z)², I4 = ∫ω conj(dt)/(t−z)², I5 = ∫conj(t) ω dt/(t−z)³
  const acc = new Float64Array(10);
  const add = (tx: number, ty: number, dtx: number, dty: number, wr: number, wi: number, weight: number) => {
    const ex = tx - px;
    const ey = ty - py;
    const r2 = ex * ex + ey * ey;
    const ir = ex / r2;
    const ii = -ey / r2;
    const i2r = ir * ir - ii * ii;
    const i2i = 2 * ir * ii;
    const i3r = i2r * ir - i2i * ii;
    const i3i = i2r * ii + i2i * ir;
    const odr = (wr * dtx - wi * dty) * weight;
    const odi = (wr * dty + wi * dtx) * weight;
    acc[0] += odr * i2r - odi * i2i;
    acc[1] += odr * i2i + odi * i2r;
    acc[2] += odr * i3r - odi * i3i;
    acc[3] += odr * i3i + odi * i3r;
    const cdr = (wr * dtx + wi * dty) * weight;
    const cdi = (wr * dty - wi * dtx) * weight;
    acc[4] += cdr * i2r - cdi * i2i;
    acc[5] += cdr * i2i + cdi * i2r;
    const ocr = (wr * dtx + wi * dty) * weight;
    const oci = (wi * dtx - wr * dty) * weight;
    acc[6] += ocr * i2r - oci * i2i;
    acc[7] += ocr * i2i + oci * i2r;
    const tor = tx * odr + ty * odi;
    const toi = tx * odi - ty * odr;
    acc[8] += tor * i3r - toi * i3i;
    acc[9] += tor * i3i + toi * i3r;
  };
  for (let pi = 0; pi < disc.panels.length; pi++) {
    const base = pi * p;
    let len = 0;
    let dmin = Infinity;
    for (let j = base; j < base + p; j++) {
      len += Math.hypot(disc.dx[j], disc.dy[j]) * disc.w[j];
      dmin = Math.min(dmin, Math.hypot(disc.x[j] - px, disc.y[j] - py));
    }
    if (dmin < 0.6 * len) {
      nearRule(disc, pi, px, py, (tx, ty, dtx, dty, weight, row) => {
        let wr = 0;
        let wi = 0;
        for (let j = 0; j < p; j++) {
          wr += row[j] * sol.wre[base + j];
          wi += row[j] * sol.wim[base + j];
        }
        add(tx, ty, dtx, dty, wr, wi, weight);
      });
    } else {
      for (let j = base; j < base + p; j++) add(disc.x[j], disc.y[j], disc.dx[j], disc.dy[j], sol.wre[j], sol.wim[j], disc.w[j]);
    }
  }
  const c = 1 / (2 * Math.PI);
  // (1/2πi)·I = (Im I − i Re I)/2π
  const div = (re: number, im: number): [number, number] => [im * c, -re * c];
  const [f1r] = div(acc[0], acc[1]); // φ₁′
  const [f2r, f2i] = div(2 * acc[2], 2 * acc[3]); // φ₁″
  let [g1r, g1i] = div(acc[4] + acc[6] - 2 * acc[8], acc[5] + acc[7] - 2 * acc[9]); // ψ₁′ without poles
  for (let k = 0; k < sol.b.length; k++) {
    const [zx, zy] = sol.op.poles[k];
    const ex = px - zx;
    const ey = py - zy;
    const r2 = ex * ex + ey * ey;
    // −b/(z − z_k)² = −b·conj(e)²/|e|⁴
    g1r -= (sol.b[k] * (ex * ex - ey * ey)) / (r2 * r2);
    g1i -= (sol.b[k] * (-2 * ex * ey)) / (r2 * r2);
  }
  const s1 = 4 * (sol.gamma + f1r);
  // 2(z̄ φ″ + Γ′ + ψ₁′)
  const s2r = 2 * (px * f2r + py * f2i + sol.gammaPrime[0] + g1r);
  const s2i = 2 * (px * f2i - py * f2r + sol.gammaPrime[1] + g1i);
  return { sxx: (s1 - s2r) / 2, syy: (s1 + s2r) / 2, sxy: s2i / 2 };
}
