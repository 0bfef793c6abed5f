/**
 * @module engine/openings/field
 * An opening of any shape, with its fastener holes, shell curvature and reinforcement, as the
 * boundary field the fatigue check reads: points with hoop and axial influence coefficients, the
 * worked steps, warnings, the reasons to refer, and what the picture of the opening needs.
 */
import { fmt, step, type Step } from "../step.ts";
import { n, say, type Warning } from "../phrase.ts";
import { kirschPeak, peakAt, solveOpening, type EdgePoint, type EdgeSample, type FastenerInput, type ShapeCutout } from "./index.ts";

export interface Reinforcement {
  /** Cross-section area added round the opening's edge (mm²), e.g. a ring, frame or pad. */
  area_mm2: number;
  /** Radial width of that reinforcement (mm). */
  width_mm: number;
}

export interface ShellGeometry {
  form: "cylinder" | "sphere";
  meanRadius_mm: number;
  thickness_mm: number;
}

export interface FastenerSummary {
  index: number;
  hoop_mm: number;
  axial_mm: number;
  radius_mm: number;
  ligament_mm: number;
  solvedWithOpening: boolean;
  /** Edge stress per unit hoop stress at the biaxial ratio of maximum pressure. */
  kt: number;
  /** Kirsch in the opening's local field at the hole's centre (for a hole solved with the opening, for comparison). */
  ktKirsch: number;
}

export interface OpeningPicture {
  edge: EdgeSample[];
  fasteners: { index: number; x_mm: number; y_mm: number; radius_mm: number; edge: EdgeSample[] }[];
  curvature: { rho: number; beta: number; limit: number; within: boolean } | null;
}

export interface ShapeField {
  points: EdgePoint[];
  basis: string;
  assumed: false;
  steps: Step[];
  warnings: Warning[];
  /** Plain-words reasons this screening cannot judge the opening; a verdict row refers on them. */
  refer: string[];
  /** Factor applied to every coefficient for shell curvature and reinforcement (1 when none). */
  factor: number;
  picture: OpeningPicture;
  /** Fastener holes at a biaxial ratio: call with λ at maximum pressure. */
  fastenersAt(lambda: number): FastenerSummary[];
}

/** Poisson's ratio taken for the curvature parameter (metals; the factor moves by 0.1 % between 0.3 and 0.33). */
export const POISSON = 0.3;
/** Upper end of the small-curvature correction's range. */
export const CURVATURE_LIMIT = 0.5;
/** Coefficient of the small-curvature correction Kt = Kt,flat·(1 + C·β²). */
export const CURVATURE_COEFFICIENT = 1.3;

export const SOLVER_SOURCE =
  "plane elasticity of the infinite plate: Sherman–Lauricella integral equation (Muskhelishvili, Some Basic Problems of the Mathematical Theory of Elasticity, §§41, 100), Nyström method on Gauss–Legendre panels; verified against Kirsch and Inglis";
const CURVATURE_SOURCE =
  "curvature parameter of shallow-shell theory (Lekkerkerker 1964; Van Dyke 1965) as charted in Peterson's Stress Concentration Factors (Pilkey), holes in cylindrical shells; coefficient read from the chart's membrane curve for internal pressure, from memory";
const RING_SOURCE =
  "ring-reinforced circular hole under equal biaxial stress, compatibility of the ring and the plate (Timoshenko & Goodier, Theory of Elasticity, §§30–35 method; neutral ring A = a·t/(1 − ν), Mansfield, ARC R&M 2815, 1953); the deviatoric part is left unreinforced, conservatively";

export function shapeField(
  cutout: ShapeCutout,
  fasteners: FastenerInput[],
  shell: ShellGeometry,
  reinforcement?: Reinforcement,
): ShapeField {
  const sol = solveOpening(cutout, fasteners);
  const steps: Step[] = [];
  const warnings: Warning[] = [];
  const refer: string[] = [];
  const kt0 = peakAt(sol.edge, 0).kt;
  const ktB = peakAt(sol.edge, 0.5).kt;
  steps.push(
    step(
      "opening-solution",
      "Edge stress of the opening in the flat plate, solved for its shape",
      "σ_edge = c_θ·σθ + c_x·σx at each edge point (unit hoop and unit axial stress solved separately)",
      `${sol.nodes} nodes, ${sol.iterations} iterations; Kt under hoop stress alone ${fmt(kt0)}, under σx = σθ/2 ${fmt(ktB)}`,
      ktB,
      "—",
      SOLVER_SOURCE,
    ),
  );
  let factor = 1;
  const a = sol.circumradius_mm;
  const curv = curvature(a, shell);
  steps.push(...curv.steps);
  warnings.push(...curv.warnings);
  refer.push(...curv.refer);
  factor *= curv.factor;
  // Reinforcement
  if (reinforcement) {
    const circle = cutout.kind === "circular-hole";
    const r = circle ? cutout.radius_mm : a;
    const mu = reinforcement.area_mm2 / (r * shell.thickness_mm);
    const nu = POISSON;
    if (!circle) {
      refer.push(
        "the reinforced-opening approach here covers circular holes only: a reinforced opening of another shape needs an analysis beyond this screening",
      );
    } else if (reinforcement.width_mm > r / 2) {
      refer.push(
        `the reinforcement is ${fmt(reinforcement.width_mm)} mm wide, more than half the hole's radius (${fmt(r / 2)} mm): it acts as a doubler rather than a ring, outside the ring approach's range`,
      );
    } else if (mu > 3) {
      refer.push(`the reinforcement area is ${fmt(mu)} times a·t, beyond the range (up to 3) this screening takes the ring approach to`);
    } else {
      // mean-stress part reduced by the ring; deviatoric part unreinforced
      const f = (nu * mu + 1) / ((1 + nu) * mu + 1);
      steps.push(
        step(
          "reinforcement-ratio",
          "Reinforcement area ratio",
          "μ = A_r/(a·t)",
          `μ = ${fmt(reinforcement.area_mm2)}/(${fmt(r)} × ${fmt(shell.thickness_mm)})`,
          mu,
          "—",
          RING_SOURCE,
        ),
      );
      // Kirsch split: σ_edge = 2P·f + 4|Q| with P = (σθ + σx)/2, Q = (σθ − σx)/2, referred to the field's own peak
      const peakFlat = (l: number) => 1 + l + 2 * Math.abs(1 - l);
      const peakRing = (l: number) => (1 + l) * f + 2 * Math.abs(1 - l);
      const lr = shell.form === "sphere" ? 1 : 0.5;
      const g = peakRing(lr) / peakFlat(lr);
      steps.push(
        step(
          "reinforcement-factor",
          "Ring reinforcement: reduction of the edge stress (axisymmetric part reduced, the rest kept)",
          "σ_edge = 2P·(νμ + 1)/((1 + ν)μ + 1) + 4|Q|,  P = (σθ + σx)/2, Q = (σθ − σx)/2",
          `k_ring = [(1 + ${lr}) × ${fmt(f)} + 2 × ${fmt(1 - lr)}]/[1 + ${lr} + 2 × ${fmt(1 - lr)}]  at the shell's own ratio σx/σθ = ${lr}`,
          g,
          "—",
          RING_SOURCE,
        ),
      );
      factor *= g;
      warnings.push(
        "the reinforcement is taken as a compact ring of the skin's material bonded at the hole's edge; the ring's own stress, its attachment and any eccentricity (bending) are not checked here",
      );
    }
  }
  const scale = (p: EdgePoint): EdgePoint => ({ ...p, hoopCoeff: p.hoopCoeff * factor, axialCoeff: p.axialCoeff * factor });
  const points = [...sol.points.map(scale)];
  for (const f of sol.fasteners) points.push(...f.points);
  for (const f of sol.fasteners) {
    if (f.solvedWithOpening)
      steps.push(
        step(
          `fastener-${f.index + 1}-joint`,
          `Fastener hole ${f.index + 1} close to the opening's edge: solved with it`,
          "both edges in one solution (the interaction is not the product of the two concentrations)",
          `centre (${fmt(f.hoop_mm)}, ${fmt(f.axial_mm)}) mm, radius ${fmt(f.radius_mm)} mm, ligament ${fmt(f.ligament_mm)} mm`,
          peakAt(f.edge, 0.5).kt,
          "—",
          SOLVER_SOURCE,
        ),
      );
    else {
      const h = f.localPerHoop;
      steps.push(
        step(
          `fastener-${f.index + 1}-field`,
          `Stress at fastener hole ${f.index + 1}'s centre from the opening, per unit hoop stress`,
          "σxx, σyy, τxy at the centre (hole left out), hoop stress alone",
          `σxx = ${fmt(h.sxx)}, σyy = ${fmt(h.syy)}, τxy = ${fmt(h.sxy)} at (${fmt(f.hoop_mm)}, ${fmt(f.axial_mm)}) mm`,
          h.sxx,
          "per unit σθ",
          SOLVER_SOURCE,
        ),
      );
    }
  }
  if (factor !== 1 && sol.fasteners.length)
    warnings.push(
      "the fastener holes' concentrations are worked in the flat, unreinforced field of the opening, without the curvature or reinforcement factor",
    );
  const fastenersAt = (lambda: number): FastenerSummary[] =>
    sol.fasteners.map((f) => {
      const local = {
        sxx: f.localPerHoop.sxx + lambda * f.localPerAxial.sxx,
        syy: f.localPerHoop.syy + lambda * f.localPerAxial.syy,
        sxy: f.localPerHoop.sxy + lambda * f.localPerAxial.sxy,
      };
      const kirsch = kirschPeak(local).peak;
      return {
        index: f.index,
        hoop_mm: f.hoop_mm,
        axial_mm: f.axial_mm,
        radius_mm: f.radius_mm,
        ligament_mm: f.ligament_mm,
        solvedWithOpening: f.solvedWithOpening,
        kt: f.solvedWithOpening ? peakAt(f.edge, lambda).kt : kirsch,
        ktKirsch: kirsch,
      };
    });
  return {
    points,
    basis: SOLVER_SOURCE,
    assumed: false,
    steps,
    warnings,
    refer,
    factor,
    picture: {
      edge: sol.edge.map((s) => ({ ...s, hoopCoeff: s.hoopCoeff * factor, axialCoeff: s.axialCoeff * factor })),
      fasteners: sol.fasteners.map((f) => ({ index: f.index, x_mm: f.hoop_mm, y_mm: f.axial_mm, radius_mm: f.radius_mm, edge: f.edge })),
      curvature: { rho: curv.rho, beta: curv.beta, limit: CURVATURE_LIMIT, within: curv.within },
    },
    fastenersAt,
  };
}

/** Kirsch steps for a fastener hole far from the opening, at the biaxial ratio of maximum pressure. */
export function fastenerSteps(field: ShapeField, lambda: number): Step[] {
  return field
    .fastenersAt(lambda)
    .map((f) =>
      step(
        `fastener-${f.index + 1}-kt`,
        f.solvedWithOpening
          ? `Kt of fastener hole ${f.index + 1} (solved with the opening), referred to the nominal hoop stress`
          : `Kt of fastener hole ${f.index + 1} in the opening's local field (Kirsch), referred to the nominal hoop stress`,
        f.solvedWithOpening ? "Kt = max over its edge of (c_θ + c_x·λ)" : "Kt = 3σ₁ − σ₂ of the local field at the centre, per unit σθ",
        f.solvedWithOpening
          ? `Kt = ${fmt(f.kt)} (Kirsch in the local field alone would give ${fmt(f.ktKirsch)})   (λ = ${fmt(lambda)})`
          : `Kt = ${fmt(f.kt)}   (λ = ${fmt(lambda)})`,
        f.kt,
        "—",
        f.solvedWithOpening ? SOLVER_SOURCE : "Kirsch (1898) in the local biaxial field; Peterson's Stress Concentration Factors, §4.5",
      ),
    );
}

export interface Curvature {
  rho: number;
  beta: number;
  within: boolean;
  factor: number;
  steps: Step[];
  warnings: Warning[];
  refer: string[];
}

/**
 * The opening's curvature parameter β = [3(1 − ν²)]^¼·a/(2√(R·t)) and, within β ≤ 0.5, the
 * small-curvature correction of the flat-plate concentration; beyond it the opening is referred.
 */
export function curvature(a: number, shell: ShellGeometry): Curvature {
  const steps: Step[] = [];
  const warnings: Warning[] = [];
  const refer: string[] = [];
  const rt = Math.sqrt(shell.meanRadius_mm * shell.thickness_mm);
  const rho = a / rt;
  const k4 = (3 * (1 - POISSON * POISSON)) ** 0.25;
  const beta = (k4 * rho) / 2;
  let factor = 1;
  steps.push(
    step(
      "opening-curvature",
      "Curvature parameter of the opening",
      "β = [3(1 − ν²)]^¼ · a/(2√(R·t)),  a the radius of the circle that holds the opening",
      `β = ${fmt(k4)} × ${fmt(a)}/(2 × √(${fmt(shell.meanRadius_mm)} × ${fmt(shell.thickness_mm)}))   (ν = ${POISSON})`,
      beta,
      "—",
      CURVATURE_SOURCE,
    ),
  );
  const within = beta <= CURVATURE_LIMIT;
  if (within) {
    factor = 1 + CURVATURE_COEFFICIENT * beta * beta;
    steps.push(
      step(
        "opening-curvature-factor",
        `Small-curvature correction of the flat-plate concentration (${shell.form})`,
        `k_curv = 1 + ${CURVATURE_COEFFICIENT}·β²   (β ≤ ${CURVATURE_LIMIT})`,
        `k_curv = 1 + ${CURVATURE_COEFFICIENT} × ${fmt(beta)}²`,
        factor,
        "—",
        CURVATURE_SOURCE,
      ),
    );
    if (beta > 0.05)
      warnings.push(
        say`the opening's curvature correction (β = ${n(beta, 3)}) rests on a coefficient recalled from a published chart, not read in this session: verify it against the chart for holes in ${shell.form === "cylinder" ? "cylindrical" : "spherical"} shells`,
      );
    if (shell.form === "sphere")
      warnings.push(
        "the small-curvature correction is charted for cylinders; for a sphere it is applied as for a cylinder, an estimate to verify",
      );
  } else {
    refer.push(
      `the opening is too large for a membrane screening of this shell (curvature parameter β = ${fmt(beta, 3)} above ${CURVATURE_LIMIT}): bending at the opening's edge and its reinforcement govern, and they need a shell analysis`,
    );
  }
  return { rho, beta, within, factor, steps, warnings, refer };
}
