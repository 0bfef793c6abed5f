import { InputError } from "../errors.ts";
import { fmt } from "../step.ts";
import {
  discretize,
  ellipse,
  nearestOnOutline,
  periodicSpline,
  roundedRectangle,
  TooManyPanels,
  type Discretization,
  type Outline,
} from "./geometry.ts";
import { interpolationRow } from "./gauss.ts";
import { buildOperator, edgeStress, NoConvergence, type PlaneStress, type Solution, solve, stressAt } from "./solver.ts";

/**
 * Openings of any smooth shape with the fastener holes around them, in the biaxial membrane field
 * of a shell: the plane-elasticity solution (./solver.ts) worked once per unit hoop stress and once
 * per unit axial stress, so that every edge point carries influence coefficients
 * σ_edge = hoopCoeff·σθ + axialCoeff·σx (superposition). Coordinates: x along the hoop, y along
 * the axis, mm, from the opening's centre.
 */

export interface FastenerInput {
  hoop_mm: number;
  axial_mm: number;
  radius_mm: number;
}

export type ShapeCutout =
  | { kind: "rounded-rectangle"; halfWidthAlongHoop_mm: number; halfLengthAlongAxial_mm: number; cornerRadius_mm: number }
  | { kind: "outline"; points_mm: [number, number][] }
  | { kind: "circular-hole"; radius_mm: number }
  | { kind: "elliptical-hole"; halfAxisAlongHoop_mm: number; halfAxisAlongAxial_mm: number };

/** One sampled point of an edge, with its influence coefficients. */
export interface EdgeSample {
  x_mm: number;
  y_mm: number;
  /** Arc length from the start of the edge (mm). */
  s_mm: number;
  hoopCoeff: number;
  axialCoeff: number;
  /** Direction of the edge, degrees from the hoop direction, in [0, 180). */
  edgeAngle_deg: number;
  /** Radius of curvature (mm); Infinity on a straight part. */
  radius_mm: number;
}

/** A point that can govern, in the shape the boundary field uses. */
export interface EdgePoint {
  id: string;
  label: string;
  hoopCoeff: number;
  axialCoeff: number;
  edgeAngle_deg: number;
  angle_deg: number;
  x_mm: number;
  y_mm: number;
  rootRadius_mm?: number;
}

export interface FastenerField {
  index: number;
  hoop_mm: number;
  axial_mm: number;
  radius_mm: number;
  /** Clear ligament between the hole's edge and the opening's edge (mm). */
  ligament_mm: number;
  /** true when the hole was solved together with the opening (close to its edge). */
  solvedWithOpening: boolean;
  /** Stress at the hole's centre from the opening (per unit hoop and per unit axial stress), without the hole. */
  localPerHoop: PlaneStress;
  localPerAxial: PlaneStress;
  edge: EdgeSample[];
  points: EdgePoint[];
}

export interface OpeningSolution {
  edge: EdgeSample[];
  points: EdgePoint[];
  fasteners: FastenerField[];
  /** Radius of the circle about the centre that holds the opening (mm). */
  circumradius_mm: number;
  nodes: number;
  iterations: number;
}

/** Fasteners whose clear ligament to the opening is below this many of their radii are solved with it. */
export const JOINT_LIGAMENT_RADII = 3;
/** Below this many radii of clear ligament the screening refuses the hole. */
export const MIN_LIGAMENT_RADII = 0.5;
/** At most this many fastener holes are solved together with the opening. */
export const MAX_JOINT = 8;

export function outlineOf(cutout: ShapeCutout, path = "cutout"): Outline {
  switch (cutout.kind) {
    case "circular-hole":
      return ellipse(cutout.radius_mm, cutout.radius_mm);
    case "elliptical-hole":
      return ellipse(cutout.halfAxisAlongHoop_mm, cutout.halfAxisAlongAxial_mm);
    case "rounded-rectangle": {
      const { halfWidthAlongHoop_mm: hx, halfLengthAlongAxial_mm: hy, cornerRadius_mm: r } = cutout;
      if (r > Math.min(hx, hy) * (1 + 1e-12))
        throw new InputError(
          `${path}.cornerRadius_mm`,
          `the corner radius (${fmt(r)} mm) cannot exceed the smaller half-dimension of the opening (${fmt(Math.min(hx, hy))} mm)`,
        );
      return roundedRectangle(hx, hy, Math.min(r, hx, hy));
    }
    case "outline":
      return splineOutline(cutout.points_mm, `${path}.points_mm`);
  }
}

function polygonArea2(pts: ReadonlyArray<readonly [number, number]>): number {
  let a = 0;
  for (let i = 0; i < pts.length; i++) {
    const [x0, y0] = pts[i];
    const [x1, y1] = pts[(i + 1) % pts.length];
    a += x0 * y1 - x1 * y0;
  }
  return a;
}

/** Winding number of a closed polyline about a point (non-zero inside). */
function winding(xs: ArrayLike<number>, ys: ArrayLike<number>, px: number, py: number): number {
  let w = 0;
  const n = xs.length;
  for (let i = 0; i < n; i++) {
    const ax = xs[i] - px;
    const ay = ys[i] - py;
    const bx = xs[(i + 1) % n] - px;
    const by = ys[(i + 1) % n] - py;
    w += Math.atan2(ax * by - ay * bx, ax * bx + ay * by);
  }
  return Math.round(w / (2 * Math.PI));
}

function segmentsCross(a: number[], b: number[], c: number[], d: number[]): boolean {
  const o = (p: number[], q: number[], r: number[]) => (q[0] - p[0]) * (r[1] - p[1]) - (q[1] - p[1]) * (r[0] - p[0]);
  const d1 = o(c, d, a);
  const d2 = o(c, d, b);
  const d3 = o(a, b, c);
  const d4 = o(a, b, d);
  return d1 * d2 < 0 && d3 * d4 < 0;
}

/** A closed outline through the given points, smoothed by a periodic cubic spline; refused if it crosses itself. */
function splineOutline(points: [number, number][], path: string): Outline {
  const n = points.length;
  for (let i = 0; i < n; i++) {
    const [x0, y0] = points[i];
    const [x1, y1] = points[(i + 1) % n];
    if (Math.hypot(x1 - x0, y1 - y0) < 1e-9 * (1 + Math.hypot(x0, y0)))
      throw new InputError(`${path}.${(i + 1) % n}`, "two consecutive outline points coincide; give each point once");
  }
  if (Math.abs(polygonArea2(points)) < 1e-12) throw new InputError(path, "the outline points enclose no area");
  const { pieces } = periodicSpline(points);
  // dense polyline of the spline for the self-crossing test and an inside point
  const xs: number[] = [];
  const ys: number[] = [];
  const per = 8;
  for (const piece of pieces)
    for (let k = 0; k < per; k++) {
      const q = piece(k / per);
      xs.push(q.x);
      ys.push(q.y);
    }
  const m = xs.length;
  for (let i = 0; i < m; i++)
    for (let j = i + 2; j < m; j++) {
      if (i === 0 && j === m - 1) continue;
      if (segmentsCross([xs[i], ys[i]], [xs[(i + 1) % m], ys[(i + 1) % m]], [xs[j], ys[j]], [xs[(j + 1) % m], ys[(j + 1) % m]]))
        throw new InputError(
          path,
          "the smoothed outline crosses itself; give the points in order round the opening, with enough of them at tight bends",
        );
    }
  // area centroid, or the deepest of a few candidates if the outline is not convex there
  let A = 0;
  let cx = 0;
  let cy = 0;
  for (let i = 0; i < m; i++) {
    const j = (i + 1) % m;
    const c = xs[i] * ys[j] - xs[j] * ys[i];
    A += c;
    cx += (xs[i] + xs[j]) * c;
    cy += (ys[i] + ys[j]) * c;
  }
  cx /= 3 * A;
  cy /= 3 * A;
  let inside: [number, number] = [cx, cy];
  if (winding(xs, ys, cx, cy) === 0) {
    let best = -1;
    const [x0, x1] = [Math.min(...xs), Math.max(...xs)];
    const [y0, y1] = [Math.min(...ys), Math.max(...ys)];
    for (let a = 1; a < 20; a++)
      for (let b = 1; b < 20; b++) {
        const px = x0 + ((x1 - x0) * a) / 20;
        const py = y0 + ((y1 - y0) * b) / 20;
        if (winding(xs, ys, px, py) === 0) continue;
        let d = Infinity;
        for (let i = 0; i < m; i++) d = Math.min(d, Math.hypot(xs[i] - px, ys[i] - py));
        if (d > best) {
          best = d;
          inside = [px, py];
        }
      }
  }
  return { pieces, inside };
}

/** Samples per panel for the edge picture, the peak and the governing points. */
const SAMPLES_PER_PANEL = 32;

function sampleEdges(disc: Discretization, hoop: Float64Array, axial: Float64Array): EdgeSample[][] {
  const rule = disc.rule;
  const p = rule.p;
  const row = new Float64Array(p);
  const out: EdgeSample[][] = disc.outlines.map(() => []);
  const sAt = disc.outlines.map(() => 0);
  const last = disc.outlines.map(() => null as null | [number, number]);
  for (let pi = 0; pi < disc.panels.length; pi++) {
    const pan = disc.panels[pi];
    const piece = disc.outlines[pan.hole].pieces[pan.piece];
    for (let k = 0; k < SAMPLES_PER_PANEL; k++) {
      const xi = -1 + (2 * k) / SAMPLES_PER_PANEL;
      interpolationRow(rule, xi, row);
      let h = 0;
      let a = 0;
      for (let j = 0; j < p; j++) {
        h += row[j] * hoop[pi * p + j];
        a += row[j] * axial[pi * p + j];
      }
      const q = piece(pan.u0 + ((pan.u1 - pan.u0) * (xi + 1)) / 2);
      const prev = last[pan.hole];
      if (prev) sAt[pan.hole] += Math.hypot(q.x - prev[0], q.y - prev[1]);
      last[pan.hole] = [q.x, q.y];
      const sp = Math.hypot(q.dx, q.dy);
      const kappa = Math.abs(q.dx * q.ddy - q.dy * q.ddx) / sp ** 3;
      let ang = (Math.atan2(q.dy, q.dx) * 180) / Math.PI;
      ang = ((ang % 180) + 180) % 180;
      out[pan.hole].push({
        x_mm: q.x,
        y_mm: q.y,
        s_mm: sAt[pan.hole],
        hoopCoeff: h,
        axialCoeff: a,
        edgeAngle_deg: ang,
        radius_mm: kappa > 1e-12 ? 1 / kappa : Infinity,
      });
    }
  }
  return out;
}

/**
 * The points of an edge that can govern: the vertices of the convex hull of the influence
 * coefficients (hoopCoeff, axialCoeff). The edge stress at any instant is a linear function of
 * the two coefficients, so its largest (and smallest) value over the edge is reached at a hull
 * vertex. Vertices that lie within `tol` of the chord of their neighbours are dropped.
 */
export function governingSamples(samples: EdgeSample[], tol = 1e-3): EdgeSample[] {
  const pts = samples.map((s, i) => ({ x: s.hoopCoeff, y: s.axialCoeff, i }));
  pts.sort((a, b) => a.x - b.x || a.y - b.y);
  const cross = (o: { x: number; y: number }, a: { x: number; y: number }, b: { x: number; y: number }) =>
    (a.x - o.x) * (b.y - o.y) - (a.y - o.y) * (b.x - o.x);
  const lower: typeof pts = [];
  for (const p of pts) {
    while (lower.length >= 2 && cross(lower[lower.length - 2], lower[lower.length - 1], p) <= 0) lower.pop();
    lower.push(p);
  }
  const upper: typeof pts = [];
  for (let k = pts.length - 1; k >= 0; k--) {
    const p = pts[k];
    while (upper.length >= 2 && cross(upper[upper.length - 2], upper[upper.length - 1], p) <= 0) upper.pop();
    upper.push(p);
  }
  let hull = lower.slice(0, -1).concat(upper.slice(0, -1));
  const scale = Math.max(...pts.map((p) => Math.hypot(p.x, p.y)), 1);
  let changed = true;
  while (changed && hull.length > 3) {
    changed = false;
    let best = -1;
    let bestD = Infinity;
    for (let k = 0; k < hull.length; k++) {
      const a = hull[(k - 1 + hull.length) % hull.length];
      const b = hull[k];
      const c = hull[(k + 1) % hull.length];
      const len = Math.hypot(c.x - a.x, c.y - a.y) || 1;
      const d = Math.abs(cross(a, c, b)) / len;
      if (d < bestD) {
        bestD = d;
        best = k;
      }
    }
    if (bestD < tol * scale) {
      hull = hull.filter((_, k) => k !== best);
      changed = true;
    }
  }
  return hull.map((h) => samples[h.i]).sort((a, b) => a.s_mm - b.s_mm);
}

function toPoints(samples: EdgeSample[], idPrefix: string, where: string, cx: number, cy: number): EdgePoint[] {
  return governingSamples(samples).map((s, k) => {
    const angle = (Math.atan2(s.y_mm - cy, s.x_mm - cx) * 180) / Math.PI;
    return {
      id: `${idPrefix}-${k + 1}`,
      label: `${where} at ${fmt(((angle % 360) + 360) % 360, 3)}° from the hoop direction (${fmt(s.x_mm - cx, 3)}, ${fmt(s.y_mm - cy, 3)}) mm`,
      hoopCoeff: s.hoopCoeff,
      axialCoeff: s.axialCoeff,
      edgeAngle_deg: s.edgeAngle_deg,
      angle_deg: angle,
      x_mm: s.x_mm,
      y_mm: s.y_mm,
      rootRadius_mm: Number.isFinite(s.radius_mm) ? s.radius_mm : undefined,
    };
  });
}

/**
 * Kirsch's edge stress round a small circular hole in a uniform field (σxx, σyy, τxy) at the angle
 * β from the hoop direction: σ(β) = σxx + σyy − 2(σxx − σyy)cos 2β − 4τxy sin 2β
 * (Kirsch 1898; Timoshenko & Goodier, Theory of Elasticity, §35, rotated to general axes).
 */
export function kirschEdge(s: PlaneStress, beta: number): number {
  return s.sxx + s.syy - 2 * (s.sxx - s.syy) * Math.cos(2 * beta) - 4 * s.sxy * Math.sin(2 * beta);
}

/** Largest Kirsch edge stress in a uniform field: 3σ₁ − σ₂ with σ₁ ≥ σ₂ the principal stresses. */
export function kirschPeak(s: PlaneStress): { peak: number; s1: number; s2: number } {
  const c = (s.sxx + s.syy) / 2;
  const r = Math.hypot((s.sxx - s.syy) / 2, s.sxy);
  return { peak: 3 * (c + r) - (c - r), s1: c + r, s2: c - r };
}

function circleOutline(f: FastenerInput): Outline {
  return ellipse(f.radius_mm, f.radius_mm, f.hoop_mm, f.axial_mm);
}

/** Most panels for the opening solved together with the holes beside it. */
export const JOINT_PANELS = 600;

/**
 * The outlines cut into panels for the solver. A shape past what the panels can resolve (a slot
 * so slender that its sides nearly touch, or bends too tight beside a hole) is the user's to
 * change, so it is refused as an error on `cutout`, never a fault of the server.
 */
export function discretizeCutout(outlines: Outline[], maxPanels?: number): Discretization {
  try {
    return discretize(outlines, maxPanels === undefined ? {} : { maxPanels });
  } catch (e) {
    if (e instanceof TooManyPanels)
      throw new InputError(
        "cutout",
        "the opening's outline (or a hole close to it) is too slender or bends too tightly for this screening's stress solution: widen a narrow slot, smooth its tight bends, or analyse the detail by finite elements",
      );
    throw e;
  }
}

/** The solutions for unit hoop stress (σxx = 1) and unit axial stress (σyy = 1); an outline the iteration cannot settle is refused on `cutout`. */
export function unitSolutions(disc: Discretization): { hoop: Solution; axial: Solution } {
  const op = buildOperator(disc);
  try {
    return { hoop: solve(op, { sxx: 1, syy: 0 }), axial: solve(op, { sxx: 0, syy: 1 }) };
  } catch (e) {
    if (e instanceof NoConvergence)
      throw new InputError("cutout", "the stress solution round this opening did not converge; smooth the outline");
    throw e;
  }
}

/** Cache of solved geometries: the solution depends only on the shape, not on the load level. */
const cache = new Map<string, OpeningSolution>();

export function solveOpening(cutout: ShapeCutout, fasteners: FastenerInput[] = []): OpeningSolution {
  const key = JSON.stringify([cutout, fasteners]);
  const known = cache.get(key);
  if (known) return known;
  const opening = outlineOf(cutout);
  // the opening alone, coarsely, to place the fasteners against its edge
  const lone = discretizeCutout([opening]);
  const ex = lone.x;
  const ey = lone.y;
  let circumradius = 0;
  for (let i = 0; i < lone.n; i++) circumradius = Math.max(circumradius, Math.hypot(ex[i], ey[i]));
  const ligament = fasteners.map((f, i) => {
    if (winding(ex, ey, f.hoop_mm, f.axial_mm) !== 0)
      throw new InputError(`cutout.fasteners.${i}`, "this fastener hole's centre lies inside the opening");
    // The nearest point of the outline itself, not of its nodes: along a long straight side the nodes stand far apart.
    return nearestOnOutline(opening, f.hoop_mm, f.axial_mm).distance_mm - f.radius_mm;
  });
  fasteners.forEach((f, i) => {
    if (ligament[i] <= 0)
      throw new InputError(
        `cutout.fasteners.${i}`,
        `this fastener hole cuts into the opening's edge (by ${fmt(-ligament[i], 3)} mm): the ligament is too thin for this screening; move the hole clear of the opening`,
      );
    if (ligament[i] < MIN_LIGAMENT_RADII * f.radius_mm)
      throw new InputError(
        `cutout.fasteners.${i}`,
        `this fastener hole comes within ${fmt(Math.max(ligament[i], 0), 3)} mm of the opening's edge, less than half its radius: the ligament is too thin for this screening (the two edges act as one notch); move the hole or analyse the detail by finite elements`,
      );
    fasteners.forEach((g, j) => {
      if (j <= i) return;
      const gap = Math.hypot(f.hoop_mm - g.hoop_mm, f.axial_mm - g.axial_mm) - f.radius_mm - g.radius_mm;
      if (gap < MIN_LIGAMENT_RADII * Math.max(f.radius_mm, g.radius_mm))
        throw new InputError(
          `cutout.fasteners.${j}`,
          `fastener holes ${i + 1} and ${j + 1} overlap or leave less than half a radius between them; give holes that stand apart`,
        );
    });
  });
  // joint set: close to the opening, or close to a hole already in the set
  const joint = new Set<number>();
  fasteners.forEach((f, i) => {
    if (ligament[i] < JOINT_LIGAMENT_RADII * f.radius_mm) joint.add(i);
  });
  for (let grow = true; grow; ) {
    grow = false;
    fasteners.forEach((f, i) => {
      if (joint.has(i)) return;
      for (const j of joint) {
        const g = fasteners[j];
        const gap = Math.hypot(f.hoop_mm - g.hoop_mm, f.axial_mm - g.axial_mm) - f.radius_mm - g.radius_mm;
        if (gap < JOINT_LIGAMENT_RADII * Math.max(f.radius_mm, g.radius_mm)) {
          joint.add(i);
          grow = true;
          return;
        }
      }
    });
  }
  if (joint.size > MAX_JOINT)
    throw new InputError(
      "cutout.fasteners",
      `${joint.size} fastener holes lie within ${JOINT_LIGAMENT_RADII} radii of the opening's edge or of each other; this screening solves at most ${MAX_JOINT} of them together with the opening`,
    );
  const jointList = [...joint].sort((a, b) => a - b);
  const outlines = [opening, ...jointList.map((i) => circleOutline(fasteners[i]))];
  const disc = discretizeCutout(outlines, JOINT_PANELS);
  const { hoop: hoopSol, axial: axialSol } = unitSolutions(disc);
  const sampled = sampleEdges(disc, edgeStress(hoopSol), edgeStress(axialSol));
  // The field a hole solved with the opening would stand in, without it: the opening alone.
  let loneHoop = hoopSol;
  let loneAxial = axialSol;
  if (jointList.length) ({ hoop: loneHoop, axial: loneAxial } = unitSolutions(lone));
  const edge = sampled[0];
  const points = toPoints(edge, "edge", "the opening's edge", 0, 0);
  const fast: FastenerField[] = fasteners.map((f, i) => {
    const k = jointList.indexOf(i);
    const localPerHoop = stressAt(k >= 0 ? loneHoop : hoopSol, f.hoop_mm, f.axial_mm);
    const localPerAxial = stressAt(k >= 0 ? loneAxial : axialSol, f.hoop_mm, f.axial_mm);
    let fEdge: EdgeSample[];
    if (k >= 0) fEdge = sampled[k + 1];
    else {
      // Kirsch in the local field, sampled round the hole every 2°
      fEdge = [];
      for (let m = 0; m < 180; m++) {
        const beta = (2 * Math.PI * (m + 0.5)) / 180;
        const x = f.hoop_mm + f.radius_mm * Math.cos(beta);
        const y = f.axial_mm + f.radius_mm * Math.sin(beta);
        let ang = ((beta * 180) / Math.PI + 90) % 180;
        if (ang < 0) ang += 180;
        fEdge.push({
          x_mm: x,
          y_mm: y,
          s_mm: f.radius_mm * beta,
          hoopCoeff: kirschEdge(localPerHoop, beta),
          axialCoeff: kirschEdge(localPerAxial, beta),
          edgeAngle_deg: ang,
          radius_mm: f.radius_mm,
        });
      }
    }
    return {
      index: i,
      ...f,
      ligament_mm: ligament[i],
      solvedWithOpening: k >= 0,
      localPerHoop,
      localPerAxial,
      edge: fEdge,
      points: toPoints(fEdge, `fastener-${i + 1}`, `the edge of fastener hole ${i + 1}`, f.hoop_mm, f.axial_mm),
    };
  });
  const result: OpeningSolution = {
    edge,
    points,
    fasteners: fast,
    circumradius_mm: circumradius,
    nodes: disc.n,
    iterations: hoopSol.iterations + axialSol.iterations,
  };
  if (cache.size > 32) cache.clear();
  cache.set(key, result);
  return result;
}

/** Largest edge stress per unit hoop stress at the biaxial ratio λ, with the sample where it occurs. */
export function peakAt(samples: EdgeSample[], lambda: number): { kt: number; at: EdgeSample } {
  let best = samples[0];
  let kt = -Infinity;
  for (const s of samples) {
    const v = s.hoopCoeff + lambda * s.axialCoeff;
    if (v > kt) {
      kt = v;
      best = s;
    }
  }
  return { kt, at: best };
}
