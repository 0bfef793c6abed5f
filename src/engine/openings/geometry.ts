import { gaussRule, type GaussRule } from "./gauss.ts";

/**
 * Hole outlines as chains of smooth pieces, and their discretization into Gauss–Legendre panels.
 *
 * Coordinates: x along the hoop direction, y along the axis, in the units the caller uses (mm).
 * Every outline runs clockwise, so that the plate lies on its left: the side from which the
 * boundary values of the integral equation are taken.
 */

/** A point of a piece with its first and second derivatives with respect to the piece parameter u ∈ [0, 1]. */
export interface PiecePoint {
  x: number;
  y: number;
  dx: number;
  dy: number;
  ddx: number;
  ddy: number;
}

/** One smooth piece of an outline; pieces meet with a common tangent (the outline is C¹ at least). */
export type Piece = (u: number) => PiecePoint;

export interface Outline {
  pieces: Piece[];
  /** A point strictly inside the hole (the pole of the hole's added ψ term). */
  inside: [number, number];
}

/** Ellipse centred at (cx, cy), half-axis a along x and b along y, clockwise, as four quarter pieces. */
export function ellipse(a: number, b: number, cx = 0, cy = 0): Outline {
  const pieces: Piece[] = [];
  for (let q = 0; q < 4; q++) {
    const t0 = (q * Math.PI) / 2;
    const k = Math.PI / 2;
    pieces.push((u) => {
      const t = t0 + k * u;
      const c = Math.cos(t);
      const s = Math.sin(t);
      // z(t) = a cos t − i b sin t runs clockwise from (a, 0).
      return { x: cx + a * c, y: cy - b * s, dx: -a * s * k, dy: -b * c * k, ddx: -a * c * k * k, ddy: b * s * k * k };
    });
  }
  return { pieces, inside: [cx, cy] };
}

function segment(x0: number, y0: number, x1: number, y1: number): Piece {
  const dx = x1 - x0;
  const dy = y1 - y0;
  return (u) => ({ x: x0 + dx * u, y: y0 + dy * u, dx, dy, ddx: 0, ddy: 0 });
}

/** Circular arc about (cx, cy) of radius r from angle a0 to a1 (a1 < a0 runs clockwise). */
function arc(cx: number, cy: number, r: number, a0: number, a1: number): Piece {
  const k = a1 - a0;
  return (u) => {
    const t = a0 + k * u;
    const c = Math.cos(t);
    const s = Math.sin(t);
    return { x: cx + r * c, y: cy + r * s, dx: -r * s * k, dy: r * c * k, ddx: -r * c * k * k, ddy: -r * s * k * k };
  };
}

/**
 * Rectangle with rounded corners: half-width hx along x, half-length hy along y, corner radius r
 * (r ≤ min(hx, hy)), clockwise from the top side. Straight sides of zero length are left out.
 */
export function roundedRectangle(hx: number, hy: number, r: number): Outline {
  const pieces: Piece[] = [];
  const ax = hx - r;
  const ay = hy - r;
  const tiny = 1e-12 * Math.max(hx, hy);
  const side = (x0: number, y0: number, x1: number, y1: number) => {
    if (Math.hypot(x1 - x0, y1 - y0) > tiny) pieces.push(segment(x0, y0, x1, y1));
  };
  side(-ax, hy, ax, hy);
  pieces.push(arc(ax, ay, r, Math.PI / 2, 0));
  side(hx, ay, hx, -ay);
  pieces.push(arc(ax, -ay, r, 0, -Math.PI / 2));
  side(ax, -hy, -ax, -hy);
  pieces.push(arc(-ax, -ay, r, -Math.PI / 2, -Math.PI));
  side(-hx, -ay, -hx, ay);
  pieces.push(arc(-ax, ay, r, Math.PI, Math.PI / 2));
  return { pieces, inside: [0, 0] };
}

/** Solve a cyclic tridiagonal system (sub a, diagonal b, super c, right side d), Sherman–Morrison on the Thomas algorithm. */
function cyclicTridiagonal(a: number[], b: number[], c: number[], d: number[]): number[] {
  const n = d.length;
  const gamma = -b[0];
  const bb = b.slice();
  bb[0] -= gamma;
  bb[n - 1] -= (c[n - 1] * a[0]) / gamma;
  const solve = (rhs: number[]) => {
    const cp = new Array<number>(n);
    const dp = new Array<number>(n);
    cp[0] = c[0] / bb[0];
    dp[0] = rhs[0] / bb[0];
    for (let i = 1; i < n; i++) {
      const m = bb[i] - a[i] * cp[i - 1];
      cp[i] = c[i] / m;
      dp[i] = (rhs[i] - a[i] * dp[i - 1]) / m;
    }
    const x = new Array<number>(n);
    x[n - 1] = dp[n - 1];
    for (let i = n - 2; i >= 0; i--) x[i] = dp[i] - cp[i] * x[i + 1];
    return x;
  };
  const y = solve(d);
  const u = new Array<number>(n).fill(0);
  u[0] = gamma;
  u[n - 1] = c[n - 1];
  const zz = solve(u);
  const fact = (y[0] + (a[0] * y[n - 1]) / gamma) / (1 + zz[0] + (a[0] * zz[n - 1]) / gamma);
  return y.map((yi, i) => yi - fact * zz[i]);
}

/**
 * Closed interpolating cubic spline through the points (periodic: continuous position, slope and
 * curvature all round), parametrized by chord length; one piece per span. The points are put in
 * clockwise order if they were given anticlockwise.
 * Periodic cubic spline: de Boor, A Practical Guide to Splines (1978), Ch. IV; the second-derivative
 * form of the end conditions as in Press et al., Numerical Recipes, §3.3, closed up cyclically.
 */
export function periodicSpline(points: ReadonlyArray<readonly [number, number]>): { pieces: Piece[]; clockwise: boolean } {
  let pts = points.map((p) => [p[0], p[1]] as [number, number]);
  const n0 = pts.length;
  let area2 = 0;
  for (let i = 0; i < n0; i++) {
    const [x0, y0] = pts[i];
    const [x1, y1] = pts[(i + 1) % n0];
    area2 += x0 * y1 - x1 * y0;
  }
  const givenClockwise = area2 < 0;
  if (!givenClockwise) pts = pts.reverse();
  const n = pts.length;
  const h = pts.map((p, i) => Math.hypot(pts[(i + 1) % n][0] - p[0], pts[(i + 1) % n][1] - p[1]));
  const second = (coord: 0 | 1) => {
    // h[i−1]·M[i−1] + 2(h[i−1] + h[i])·M[i] + h[i]·M[i+1] = 6[(y[i+1] − y[i])/h[i] − (y[i] − y[i−1])/h[i−1]]
    const a: number[] = [];
    const b: number[] = [];
    const c: number[] = [];
    const d: number[] = [];
    for (let i = 0; i < n; i++) {
      const hm = h[(i - 1 + n) % n];
      const hi = h[i];
      const ym = pts[(i - 1 + n) % n][coord];
      const y0 = pts[i][coord];
      const yp = pts[(i + 1) % n][coord];
      a.push(hm);
      b.push(2 * (hm + hi));
      c.push(hi);
      d.push(6 * ((yp - y0) / hi - (y0 - ym) / hm));
    }
    return cyclicTridiagonal(a, b, c, d);
  };
  const mx = second(0);
  const my = second(1);
  const pieces: Piece[] = [];
  for (let i = 0; i < n; i++) {
    const j = (i + 1) % n;
    const hi = h[i];
    const [x0, y0] = pts[i];
    const [x1, y1] = pts[j];
    const m0x = mx[i];
    const m1x = mx[j];
    const m0y = my[i];
    const m1y = my[j];
    // S(s) = M0 (h − s)³/6h + M1 s³/6h + (y0/h − M0 h/6)(h − s) + (y1/h − M1 h/6) s, s = u·h.
    const ev = (y0v: number, y1v: number, m0: number, m1: number, s: number) => {
      const r = hi - s;
      const v = (m0 * r * r * r + m1 * s * s * s) / (6 * hi) + (y0v / hi - (m0 * hi) / 6) * r + (y1v / hi - (m1 * hi) / 6) * s;
      const dv = (-m0 * r * r + m1 * s * s) / (2 * hi) - (y0v / hi - (m0 * hi) / 6) + (y1v / hi - (m1 * hi) / 6);
      const ddv = (m0 * r + m1 * s) / hi;
      return [v, dv * hi, ddv * hi * hi];
    };
    pieces.push((u) => {
      const s = u * hi;
      const [x, dx, ddx] = ev(x0, x1, m0x, m1x, s);
      const [y, dy, ddy] = ev(y0, y1, m0y, m1y, s);
      return { x, y, dx, dy, ddx, ddy };
    });
  }
  return { pieces, clockwise: givenClockwise };
}

/** The nearest point of an outline to (px, py): sampled along every piece, then refined by golden section. */
export function nearestOnOutline(outline: Outline, px: number, py: number): { x: number; y: number; distance_mm: number } {
  const d2 = (piece: Outline["pieces"][number], u: number) => {
    const q = piece(u);
    return (q.x - px) ** 2 + (q.y - py) ** 2;
  };
  const per = 64;
  let best = { piece: 0, u: 0, d: Infinity };
  outline.pieces.forEach((piece, k) => {
    for (let i = 0; i <= per; i++) {
      const d = d2(piece, i / per);
      if (d < best.d) best = { piece: k, u: i / per, d };
    }
  });
  const piece = outline.pieces[best.piece];
  let lo = Math.max(best.u - 1 / per, 0);
  let hi = Math.min(best.u + 1 / per, 1);
  const g = (Math.sqrt(5) - 1) / 2;
  for (let it = 0; it < 60; it++) {
    const a = hi - g * (hi - lo);
    const b = lo + g * (hi - lo);
    if (d2(piece, a) < d2(piece, b)) hi = b;
    else lo = a;
  }
  const q = piece((lo + hi) / 2);
  return { x: q.x, y: q.y, distance_mm: Math.hypot(q.x - px, q.y - py) };
}

/** A panel: the part [u0, u1] of one piece of one outline. */
export interface Panel {
  hole: number;
  piece: number;
  u0: number;
  u1: number;
}

/** Nodes of all panels, panel after panel, holes in order. Derivatives are with respect to the panel's local ξ ∈ [−1, 1]. */
export interface Discretization {
  rule: GaussRule;
  outlines: Outline[];
  panels: Panel[];
  /** Number of nodes. */
  n: number;
  x: Float64Array;
  y: Float64Array;
  dx: Float64Array;
  dy: Float64Array;
  ddx: Float64Array;
  ddy: Float64Array;
  /** Gauss weight of each node (for integration in ξ). */
  w: Float64Array;
  /** Which hole each node lies on. */
  hole: Int32Array;
  /** First node and node count of each hole. */
  holeStart: number[];
  holeCount: number[];
  /** Perimeter and arc-length centroid of each hole. */
  perimeter: number[];
  centroid: [number, number][];
}

export interface DiscretizeOptions {
  /** Gauss points per panel (default 16). */
  p?: number;
  /** A panel spans at most this many radii of curvature (default 3). */
  curvature?: number;
  /** A panel is at most this share of its outline's perimeter (default 1/4). */
  perimeterShare?: number;
  /** A panel is at most this many times its distance to another, non-adjacent panel (default 3). */
  proximity?: number;
  /** Neighbouring panels differ in length by at most this factor (default 3). */
  balance?: number;
  /** Refuse beyond this many panels (default 400). */
  maxPanels?: number;
  /** Start from this many equal panels per piece (default 1). */
  panelsPerPiece?: number;
  /** Refine by the rules above (default true); false keeps the equal starting panels, for convergence studies. */
  adaptive?: boolean;
}

interface PanelInfo {
  length: number;
  maxCurvature: number;
  cx: number;
  cy: number;
  radius: number;
  xs: Float64Array;
  ys: Float64Array;
}

function panelInfo(o: Outline, pan: Panel, rule: GaussRule): PanelInfo {
  const { p, x: xi, w } = rule;
  const half = (pan.u1 - pan.u0) / 2;
  const xs = new Float64Array(p);
  const ys = new Float64Array(p);
  let length = 0;
  let kmax = 0;
  let cx = 0;
  let cy = 0;
  for (let i = 0; i < p; i++) {
    const q = o.pieces[pan.piece](pan.u0 + half * (xi[i] + 1));
    const sp = Math.hypot(q.dx, q.dy);
    length += sp * half * w[i];
    kmax = Math.max(kmax, Math.abs(q.dx * q.ddy - q.dy * q.ddx) / sp ** 3);
    xs[i] = q.x;
    ys[i] = q.y;
    cx += q.x / p;
    cy += q.y / p;
  }
  let radius = 0;
  for (let i = 0; i < p; i++) radius = Math.max(radius, Math.hypot(xs[i] - cx, ys[i] - cy));
  return { length, maxCurvature: kmax, cx, cy, radius, xs, ys };
}

function panelDistance(a: PanelInfo, b: PanelInfo): number {
  const far = Math.hypot(a.cx - b.cx, a.cy - b.cy) - a.radius - b.radius;
  if (far > 0) return far;
  let d = Infinity;
  for (let i = 0; i < a.xs.length; i++)
    for (let j = 0; j < b.xs.length; j++) d = Math.min(d, Math.hypot(a.xs[i] - b.xs[j], a.ys[i] - b.ys[j]));
  return d;
}

export class TooManyPanels extends Error {}

/**
 * Split every piece into panels until each panel is short beside its radius of curvature, its
 * outline's perimeter and its distance to any panel that is not its neighbour (so that a nearby hole
 * or the far side of a slender hole is integrated accurately), and neighbours grade smoothly.
 */
export function discretize(outlines: Outline[], opts: DiscretizeOptions = {}): Discretization {
  const rule = gaussRule(opts.p ?? 16);
  const curv = opts.curvature ?? 3;
  const share = opts.perimeterShare ?? 1 / 4;
  const prox = opts.proximity ?? 3;
  const balance = opts.balance ?? 3;
  const maxPanels = opts.maxPanels ?? 400;
  // Panels per hole, kept in order round the hole.
  const start = opts.panelsPerPiece ?? 1;
  const perHole: Panel[][] = outlines.map((o, h) =>
    o.pieces.flatMap((_, k) => Array.from({ length: start }, (_, j) => ({ hole: h, piece: k, u0: j / start, u1: (j + 1) / start }))),
  );
  const perim = outlines.map((o, h) => perHole[h].reduce((s, pan) => s + panelInfo(o, pan, rule).length, 0));
  for (let round = 0; round < (opts.adaptive === false ? 0 : 60); round++) {
    const infos = perHole.map((list, h) => list.map((pan) => panelInfo(outlines[h], pan, rule)));
    const all: { h: number; i: number; info: PanelInfo; at: number }[] = [];
    infos.forEach((list, h) => {
      let at = 0;
      list.forEach((info, i) => {
        all.push({ h, i, info, at: at + info.length / 2 });
        at += info.length;
      });
    });
    const split = perHole.map((list) => new Array<boolean>(list.length).fill(false));
    let any = false;
    for (const a of all) {
      const n = perHole[a.h].length;
      const L = a.info.length;
      let s = L * a.info.maxCurvature > curv || L > share * perim[a.h];
      if (!s) {
        const prev = infos[a.h][(a.i - 1 + n) % n];
        const next = infos[a.h][(a.i + 1) % n];
        if (L > balance * prev.length || L > balance * next.length) s = true;
      }
      if (!s) {
        for (const b of all) {
          let along = Infinity;
          if (b.h === a.h) {
            const gap = Math.abs(b.i - a.i);
            if (gap <= 1 || gap === n - 1) continue;
            const arc = Math.abs(b.at - a.at);
            along = Math.min(arc, perim[a.h] - arc) - (a.info.length + b.info.length) / 2;
          }
          const dist = panelDistance(a.info, b.info);
          // A panel of the same outline counts only where the outline folds back towards itself.
          if (along < 3 * dist) continue;
          if (L > prox * dist) {
            s = true;
            break;
          }
        }
      }
      if (s) {
        split[a.h][a.i] = true;
        any = true;
      }
    }
    if (!any) break;
    for (let h = 0; h < perHole.length; h++) {
      const next: Panel[] = [];
      perHole[h].forEach((pan, i) => {
        if (!split[h][i]) next.push(pan);
        else {
          const m = (pan.u0 + pan.u1) / 2;
          next.push({ ...pan, u1: m }, { ...pan, u0: m });
        }
      });
      perHole[h] = next;
    }
    const total = perHole.reduce((s, l) => s + l.length, 0);
    if (total > maxPanels) throw new TooManyPanels(`the outlines need more than ${maxPanels} panels`);
  }
  const panels = perHole.flat();
  const { p, x: xi, w: gw } = rule;
  const n = panels.length * p;
  const d: Discretization = {
    rule,
    outlines,
    panels,
    n,
    x: new Float64Array(n),
    y: new Float64Array(n),
    dx: new Float64Array(n),
    dy: new Float64Array(n),
    ddx: new Float64Array(n),
    ddy: new Float64Array(n),
    w: new Float64Array(n),
    hole: new Int32Array(n),
    holeStart: [],
    holeCount: [],
    perimeter: [],
    centroid: [],
  };
  let k = 0;
  for (let h = 0; h < outlines.length; h++) {
    d.holeStart.push(k);
    let L = 0;
    let sx = 0;
    let sy = 0;
    for (const pan of perHole[h]) {
      const half = (pan.u1 - pan.u0) / 2;
      for (let i = 0; i < p; i++) {
        const q = outlines[h].pieces[pan.piece](pan.u0 + half * (xi[i] + 1));
        d.x[k] = q.x;
        d.y[k] = q.y;
        d.dx[k] = q.dx * half;
        d.dy[k] = q.dy * half;
        d.ddx[k] = q.ddx * half * half;
        d.ddy[k] = q.ddy * half * half;
        d.w[k] = gw[i];
        d.hole[k] = h;
        const ds = Math.hypot(d.dx[k], d.dy[k]) * gw[i];
        L += ds;
        sx += q.x * ds;
        sy += q.y * ds;
        k++;
      }
    }
    d.holeCount.push(k - d.holeStart[h]);
    d.perimeter.push(L);
    d.centroid.push([sx / L, sy / L]);
  }
  return d;
}

/** Points round an outline, `perPiece` per smooth piece, in its own order: what a picture of the opening draws to scale. */
export function trace(outline: Outline, perPiece = 16): [number, number][] {
  const pts: [number, number][] = [];
  for (const piece of outline.pieces)
    for (let k = 0; k < perPiece; k++) {
      const p = piece(k / perPiece);
      pts.push([p.x, p.y]);
    }
  return pts;
}
