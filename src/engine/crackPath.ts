/**
 * The stress along the path of a crack that grows from a fastener hole toward an opening.
 *
 * An opening's field along a path is given as influence coefficients, as its boundary points are
 * (see concentration.ts): the stress normal to the path at a point of it (the stress that opens a
 * crack lying along the path) is σ = hoopCoeff·σ_hoop + axialCoeff·σ_axial. Three sources:
 * - on the axial centre line beyond an elliptical or circular opening, Inglis's and Kirsch's
 *   closed forms (below);
 * - on that line beyond a rounded rectangle, the plane-elasticity solver (roundedRectangleAxisField);
 * - along any straight path, from any outline and the holes solved with it, the solver read as the
 *   stress normal to the path (solvedPathField), and for a crack from one of the opening's own
 *   fastener holes the path to the nearest point of the opening's edge (fastenerPath).
 * The solver's coordinates are those of openings/: x around the hoop, y along the axis. The closed
 * forms below use their own frame (x along the axis), stated where they are.
 *
 * Inglis's elliptical hole, semi-axes A along the axis (x) and B around the hoop (y), in remote
 * stresses σx∞ (axial) and σy∞ (hoop), on the x-axis beyond the vertex (x ≥ A): Muskhelishvili's
 * potentials with the mapping z = R(ζ + m/ζ), R = (A + B)/2, m = (A − B)/(A + B), for a remote
 * tension p at angle α (c = e^{2iα}):
 *   φ(ζ) = (pR/4)·[ζ + (2c − m)/ζ],
 *   ψ(ζ) = −(pR/2)·[c·ζ + ((1 − mc + m²)ζ² − c)/(ζ(ζ² − m))]
 * (Muskhelishvili, Some Basic Problems of the Mathematical Theory of Elasticity, §82; from
 * memory). σx + σy = 4 Re Φ, σy − σx + 2iτ = 2[z̄Φ′(z) + Ψ(z)], Φ = φ′/ω′, Ψ = ψ′/ω′. On the axis
 * every quantity is real. At the vertex σy = (1 + 2A/B)·σy∞ − σx∞ (Inglis 1913); with A = B
 * (m = 0) the potentials are Kirsch's.
 */
import type { PathField } from "./crack.ts";
import { InputError } from "./errors.ts";
import { ellipse, nearestOnOutline, type Outline } from "./openings/geometry.ts";
import { discretizeCutout, JOINT_PANELS, outlineOf, unitSolutions } from "./openings/index.ts";
import { type PlaneStress, stressAt } from "./openings/solver.ts";
import { fmt } from "./step.ts";

/** σy on the x-axis at x ≥ A for a unit remote tension along y (c = −1) or along x (c = +1). */
function inglisAxis(x_mm: number, A_mm: number, B_mm: number, c: 1 | -1): number {
  const R = (A_mm + B_mm) / 2;
  const m = (A_mm - B_mm) / (A_mm + B_mm);
  const X = Math.max(x_mm, A_mm) / R;
  const zeta = (X + Math.sqrt(Math.max(X * X - 4 * m, 0))) / 2;
  const z2 = zeta * zeta;
  const z3 = z2 * zeta;
  const w1 = R * (1 - m / z2); // ω′
  const w2 = (2 * R * m) / z3; // ω″
  const f1 = (R / 4) * (1 - (2 * c - m) / z2); // φ′
  const f2 = (R / 4) * ((2 * (2 * c - m)) / z3); // φ″
  const k = 1 - m * c + m * m;
  const N = k * z2 - c;
  const D = z3 - m * zeta;
  const dQ = (2 * k * zeta * D - N * (3 * z2 - m)) / (D * D);
  const p1 = -(R / 2) * (c + dQ); // ψ′
  const Phi = f1 / w1;
  const dPhi = (f2 * w1 - f1 * w2) / (w1 * w1) / w1; // Φ′(z)
  const Psi = p1 / w1;
  const x = R * (zeta + m / zeta);
  return 2 * Phi + x * dPhi + Psi;
}

/**
 * The hoop-direction stress on the axial line beyond an elliptical opening's vertex, at distance s
 * from its edge, as coefficients of the remote hoop and axial stresses.
 */
export function ellipseAxisField(halfAxisAlongAxial_mm: number, halfAxisAlongHoop_mm: number): (s_mm: number) => PathField {
  const A = halfAxisAlongAxial_mm;
  const B = halfAxisAlongHoop_mm;
  return (s) => ({ hoopCoeff: inglisAxis(A + Math.max(s, 0), A, B, -1), axialCoeff: inglisAxis(A + Math.max(s, 0), A, B, 1) });
}

export const INGLIS_SOURCE =
  "Inglis (1913) elliptical hole, stress along the axis by Muskhelishvili's potentials (§82, from memory); Kirsch (1898) for a circle";

/** Stress normal to a straight path of unit direction (dx, dy): σnn = n·σ·n with n = (−dy, dx). */
function normalStress(q: PlaneStress, dx: number, dy: number): number {
  const [nx, ny] = [-dy, dx];
  return nx * nx * q.sxx + ny * ny * q.syy + 2 * nx * ny * q.sxy;
}

/**
 * The field along a straight path out from an opening of any smooth outline (and any holes solved
 * with it), by the plane-elasticity solver of openings/, in its coordinates: x around the hoop, y
 * along the axis, as outlineOf builds outlines. Two unit solutions, remote hoop stress (σxx = 1)
 * and remote axial stress (σyy = 1), read at each point of the path as the stress normal to it:
 * the stress that opens a crack lying along the path. s is the distance from `start`.
 */
export function solvedPathField(
  outlines: Outline | Outline[],
  start: [number, number],
  direction: [number, number] = [0, 1],
): (s_mm: number) => PathField {
  const { hoop, axial } = unitSolutions(discretizeCutout(Array.isArray(outlines) ? outlines : [outlines], JOINT_PANELS));
  const len = Math.hypot(direction[0], direction[1]);
  const [dx, dy] = [direction[0] / len, direction[1] / len];
  return (s) => {
    const px = start[0] + dx * Math.max(s, 0);
    const py = start[1] + dy * Math.max(s, 0);
    return { hoopCoeff: normalStress(stressAt(hoop, px, py), dx, dy), axialCoeff: normalStress(stressAt(axial, px, py), dx, dy) };
  };
}

/** Nodes of the table of an opening's field along a crack's path (Chebyshev, first kind). */
export const PATH_NODES = 16;

/**
 * The field along a path of length L, tabulated once at Chebyshev nodes of the first kind on
 * [0, L] and read between them by barycentric Lagrange interpolation (Berrut & Trefethen, SIAM
 * Review 46 (2004) 501). An opening's field along a path in the material is analytic, so the
 * interpolant converges geometrically with the number of nodes; the nodes stay clear of the ends,
 * so the field is never read on the opening's edge itself. Beyond [0, L] the field is read directly.
 *
 * This is what makes a crack growing into an opening's field affordable: the stress intensity
 * reads the field at every Gauss point of its Green's-function integral, at every crack size the
 * growth integral and the failure assessment visit, while the opening is solved once and its
 * field read at the nodes once.
 */
export function tabulatePathField(field: (s_mm: number) => PathField, length_mm: number, nodes = PATH_NODES): (s_mm: number) => PathField {
  const s: number[] = [];
  const w: number[] = [];
  const hoop: number[] = [];
  const axial: number[] = [];
  for (let j = 0; j < nodes; j++) {
    const theta = ((2 * j + 1) * Math.PI) / (2 * nodes);
    s.push((length_mm * (1 - Math.cos(theta))) / 2);
    w.push((j % 2 === 0 ? 1 : -1) * Math.sin(theta));
    const f = field(s[j]);
    hoop.push(f.hoopCoeff);
    axial.push(f.axialCoeff);
  }
  return (x) => {
    if (!(x >= 0 && x <= length_mm)) return field(x);
    let num = 0;
    let numA = 0;
    let den = 0;
    for (let j = 0; j < nodes; j++) {
      const d = x - s[j];
      if (d === 0) return { hoopCoeff: hoop[j], axialCoeff: axial[j] };
      const q = w[j] / d;
      num += q * hoop[j];
      numA += q * axial[j];
      den += q;
    }
    return { hoopCoeff: num / den, axialCoeff: numA / den };
  };
}

export interface RoundedRectangle {
  halfWidthAlongHoop_mm: number;
  halfLengthAlongAxial_mm: number;
  cornerRadius_mm: number;
}

/** Tables of solved openings' fields along a path, by geometry: the solution depends on the shape only, not on the load. */
const solvedAxisCache = new Map<string, (s_mm: number) => PathField>();

/**
 * The hoop-direction stress on the axial line beyond the end of a rounded-rectangular opening, at
 * distance s from its edge (0 ≤ s ≤ length), as coefficients of the remote hoop and axial stresses:
 * the plane-elasticity solver of openings/ (Sherman–Lauricella integral equation; x around the
 * hoop, y along the axis) solved once per geometry for a unit hoop and a unit axial stress, and
 * read at the nodes of the table once (superposition: the field is linear in the remote stresses).
 */
export function roundedRectangleAxisField(cut: RoundedRectangle, length_mm: number): (s_mm: number) => PathField {
  const key = JSON.stringify([cut.halfWidthAlongHoop_mm, cut.halfLengthAlongAxial_mm, cut.cornerRadius_mm, length_mm]);
  const known = solvedAxisCache.get(key);
  if (known) return known;
  const { halfWidthAlongHoop_mm, halfLengthAlongAxial_mm, cornerRadius_mm } = cut;
  const outline = outlineOf({ kind: "rounded-rectangle", halfWidthAlongHoop_mm, halfLengthAlongAxial_mm, cornerRadius_mm });
  const { hoop, axial } = unitSolutions(discretizeCutout([outline]));
  const end = cut.halfLengthAlongAxial_mm;
  const direct = (s: number): PathField => ({
    hoopCoeff: stressAt(hoop, 0, end + Math.max(s, 0)).sxx,
    axialCoeff: stressAt(axial, 0, end + Math.max(s, 0)).sxx,
  });
  const table = tabulatePathField(direct, length_mm);
  if (solvedAxisCache.size > 32) solvedAxisCache.clear();
  solvedAxisCache.set(key, table);
  return table;
}

/** A fastener hole round the opening, centre from the opening's centre (x around the hoop, y along the axis). */
export interface PathHole {
  hoop_mm: number;
  axial_mm: number;
  radius_mm: number;
}

/** The straight path of a crack from one fastener hole to the opening, and the opening's field along it. */
export interface FastenerPath {
  /** 0-based index of the hole in the cutout's list. */
  index: number;
  /** Where the crack starts: the point of the hole's edge facing the opening (x hoop, y axial, mm). */
  start_mm: [number, number];
  /** Where it links up: the nearest point of the opening's outline. */
  end_mm: [number, number];
  /** Unit direction of the path. */
  direction: [number, number];
  /** Clear ligament from the hole's edge to the opening's edge along the path (mm). */
  ligament_mm: number;
  /** Angle of the path from the axial direction, 0°–90°. */
  angleFromAxis_deg: number;
  /** 0-based indices of the other holes solved with the opening because they stand close to the path. */
  neighbours: number[];
  /** Stress normal to the path at x mm from the hole's edge (0 ≤ x ≤ ligament), per unit remote hoop and axial stress. */
  field: (x_mm: number) => PathField;
  /** With neighbours: the same field with the opening alone, so the crack can take the larger of the two. */
  fieldWithoutNeighbours?: (x_mm: number) => PathField;
}

/** Clear gap from a hole's edge to the segment p→q. */
function gapToSegment(h: PathHole, p: [number, number], q: [number, number]): number {
  const [ux, uy] = [q[0] - p[0], q[1] - p[1]];
  const L2 = ux * ux + uy * uy;
  const t = Math.min(Math.max(((h.hoop_mm - p[0]) * ux + (h.axial_mm - p[1]) * uy) / L2, 0), 1);
  return Math.hypot(h.hoop_mm - p[0] - t * ux, h.axial_mm - p[1] - t * uy) - h.radius_mm;
}

const fastenerPathCache = new Map<string, FastenerPath>();

/**
 * The crack from fastener hole `index` toward the opening, along the straight line from the hole's
 * centre to the nearest point of the opening's outline: the shortest ligament, so the crack links
 * up soonest (the conservative choice of path); near an edge that line is also normal to the edge,
 * across the tangential stress that opens the crack. The field is the stress normal to the path in
 * the plane-elasticity solution of the opening, with the other fastener holes that stand within
 * `jointRadii` of their radius of the path (the openings module's rule for holes that interact) and
 * without the crack's own hole, whose effect Bowie's factor carries. Solved once per geometry for a
 * unit hoop and a unit axial stress and tabulated at the Chebyshev nodes along the path.
 */
export function fastenerPath(opening: Outline, openingKey: string, holes: PathHole[], index: number, jointRadii: number): FastenerPath {
  const key = JSON.stringify([openingKey, holes, index, jointRadii]);
  const known = fastenerPathCache.get(key);
  if (known) return known;
  const h = holes[index];
  const near = nearestOnOutline(opening, h.hoop_mm, h.axial_mm);
  const ligament = near.distance_mm - h.radius_mm;
  if (!(ligament > 0))
    throw new InputError(
      "crack.fastener",
      `fastener hole ${index + 1} reaches into the opening (its edge is ${fmt(-ligament)} mm past the opening's edge): a crack from it has no ligament to grow across`,
    );
  const direction: [number, number] = [(near.x - h.hoop_mm) / near.distance_mm, (near.y - h.axial_mm) / near.distance_mm];
  const start: [number, number] = [h.hoop_mm + h.radius_mm * direction[0], h.axial_mm + h.radius_mm * direction[1]];
  const end: [number, number] = [near.x, near.y];
  const neighbours: number[] = [];
  holes.forEach((g, j) => {
    if (j === index) return;
    const gap = gapToSegment(g, start, end);
    if (gap <= 0)
      throw new InputError(
        "crack.fastener",
        `fastener hole ${j + 1} stands across the path from hole ${index + 1} to the opening: the crack would reach that hole first; choose the hole nearer the opening`,
      );
    if (gap < jointRadii * g.radius_mm) neighbours.push(j);
  });
  const outlines = [
    opening,
    ...neighbours.map((j) => ellipse(holes[j].radius_mm, holes[j].radius_mm, holes[j].hoop_mm, holes[j].axial_mm)),
  ];
  // Read only along the ligament: beyond it the path runs inside the opening.
  const along = (direct: (s_mm: number) => PathField) => tabulatePathField((x) => direct(Math.min(Math.max(x, 0), ligament)), ligament);
  const field = along(solvedPathField(outlines, start, direction));
  const fieldWithoutNeighbours = neighbours.length ? along(solvedPathField([opening], start, direction)) : undefined;
  const path: FastenerPath = {
    index,
    start_mm: start,
    end_mm: end,
    direction,
    ligament_mm: ligament,
    angleFromAxis_deg: (Math.acos(Math.min(Math.abs(direction[1]), 1)) * 180) / Math.PI,
    neighbours,
    field,
    ...(fieldWithoutNeighbours ? { fieldWithoutNeighbours } : {}),
  };
  if (fastenerPathCache.size > 32) fastenerPathCache.clear();
  fastenerPathCache.set(key, path);
  return path;
}
