/**
 * The damage-tolerance assessment of a check: the crack grown in each orientation that applies,
 * the governing one (the shorter life), and the inspection programme (threshold from the initial
 * flaw, repeat interval from the detectable size).
 *
 * Orientations: a crack along the axis is opened by the hoop stress, a crack around the shell by
 * the axial stress (membrane axial plus any axial extra: bending, end loads). Both are grown where
 * the axial stress is not negligible; by default both when an axial extra stress is given.
 *
 * Spectrum loading: the Paris damage-equivalent range Δσ_eq = (Σ nᵢ·Δσᵢ^m / Σ nᵢ)^(1/m) grows the
 * crack as the spectrum does, cycle for cycle, when the factors vary slowly (no load interaction;
 * Schijve, Fatigue of Structures and Materials, from memory). The compressive part of each cycle
 * is left out, as for a single cycle.
 */
import { TYPICAL_DETECTABLE_MM, TYPICAL_DETECTABLE_SOURCE } from "../materials/inspection.ts";
import type { ResolvedCheck } from "./input.ts";
import { crackGrowth, type CrackGradient, type CrackResult, type PathField } from "./crack.ts";
import type { CrackOrientation } from "./crackGeometry.ts";
import {
  ellipseAxisField,
  type FastenerPath,
  fastenerPath,
  INGLIS_SOURCE,
  PATH_NODES,
  type PathHole,
  roundedRectangleAxisField,
} from "./crackPath.ts";
import type { Evaluation } from "./evaluate.ts";
import type { Load } from "./load.ts";
import { SOLVER_SOURCE } from "./openings/field.ts";
import { JOINT_LIGAMENT_RADII, outlineOf, type ShapeCutout } from "./openings/index.ts";
import type { CheckResult } from "./result.ts";
import { fmt, step, type Step } from "./step.ts";
import { mm, say, type Warning } from "./phrase.ts";

export interface DamageTolerance {
  crack: NonNullable<CheckResult["crack"]>;
  steps: Step[];
  warnings: Warning[];
}

/** Equivalent range and peak of the stress opening the crack, per orientation; spectrum-aware. */
function drive(load: Load, e: Evaluation, orientation: CrackOrientation, m: number): { max: number; min: number; step?: Step } {
  const peak = orientation === "axial" ? e.hoopMax : e.axialMax;
  const valley = orientation === "axial" ? e.hoopMin : e.axialMin;
  if (!load.isSpectrum) return { max: peak, min: valley };
  // Stress per unit pressure in this orientation; the axial extra is taken in proportion to the pressure.
  const perPressure = orientation === "axial" ? e.unit.hoop : e.hoopMax > 0 ? (e.axialMax / e.hoopMax) * e.unit.hoop : e.unit.axial;
  let sum = 0;
  let n = 0;
  for (const c of load.cycles) {
    const hi = Math.max(perPressure * (c.mean + c.range / 2), 0);
    const lo = Math.max(perPressure * (c.mean - c.range / 2), 0);
    sum += c.count * Math.max(hi - lo, 0) ** m;
    n += c.count;
  }
  const range = (sum / n) ** (1 / m);
  const name = orientation === "axial" ? "hoop" : "axial";
  return {
    max: peak,
    min: peak - range,
    step: step(
      orientation === "axial" ? "crack-equivalent-range" : "crack-circ-equivalent-range",
      `Damage-equivalent nominal ${name} range of the spectrum`,
      "Δσ_eq = (Σ nᵢ·Δσᵢ^m / Σ nᵢ)^(1/m), compressive parts left out",
      `Δσ_eq = (Σ over ${load.cycles.length} cycle groups / ${fmt(n)})^(1/${fmt(m)})`,
      range,
      "MPa",
      "Paris law without load interaction; Schijve, Fatigue of Structures and Materials (from memory); compressive part of each cycle left out (crack closed; ASTM E647 convention, common practice)",
    ),
  };
}

/** The field along the path toward the opening, as a multiplier of the nominal hoop stress at peak. */
function openingGradient(input: ResolvedCheck, e: Evaluation, holeRadius_mm: number, distance_mm: number): CrackGradient {
  const cut = input.cutout;
  const [A, B] =
    cut.kind === "elliptical-hole"
      ? [cut.halfAxisAlongAxial_mm, cut.halfAxisAlongHoop_mm]
      : cut.kind === "circular-hole" && cut.radius_mm !== undefined
        ? [cut.radius_mm, cut.radius_mm]
        : [NaN, NaN];
  const ligament = distance_mm - holeRadius_mm;
  let field = ellipseAxisField(A, B);
  let source = INGLIS_SOURCE;
  if (cut.kind === "rounded-rectangle" && ligament > 0) {
    // (A hole reaching the opening is refused by the crack model.) Solved once per geometry, read along the path at the nodes of a table once.
    field = roundedRectangleAxisField(cut, Math.max(ligament, 0));
    source =
      "the opening's field by the plane-elasticity solver (Sherman–Lauricella integral equation), on the axial line beyond the opening, tabulated at Chebyshev nodes along the path";
  }
  const lambda = e.hoopMax > 0 ? e.axialMax / e.hoopMax : 0;
  return {
    field: (x) => {
      const f = field(ligament - x);
      return f.hoopCoeff + lambda * f.axialCoeff;
    },
    ligament_mm: ligament,
    source: `${source}, with the biaxial ratio λ = ${fmt(lambda)}; the fastener hole's Kirsch field taken in the local stress (the hole small against the opening)`,
  };
}

/** A crack from one of the opening's own fastener holes: its path, its field and the steps and warnings that name them. */
interface CornerCrack {
  gradient: CrackGradient;
  path: FastenerPath;
  steps: Step[];
  warnings: string[];
}

/**
 * The crack from fastener hole `number` (1-based) of the cutout, straight to the nearest point of
 * the opening's edge (crackPath.ts fastenerPath). Its field is the stress normal to that path,
 * hoopCoeff + λ·axialCoeff per unit nominal hoop stress at peak: both membrane stresses drive it
 * through the opening's field, and the nominal hoop stress carries it in the growth (the crack
 * takes the axial crack's place and its larger bulging factor, the conservative one of the two).
 */
function cornerCrack(input: ResolvedCheck, e: Evaluation, number: number): CornerCrack {
  const cut = input.cutout as ShapeCutout & { fasteners?: PathHole[] };
  const holes = (cut.fasteners ?? []).map((f) => ({ hoop_mm: f.hoop_mm, axial_mm: f.axial_mm, radius_mm: f.radius_mm }));
  const shape: ShapeCutout = { ...cut };
  delete (shape as { fasteners?: unknown }).fasteners;
  delete (shape as { reinforcement?: unknown }).reinforcement;
  const path = fastenerPath(outlineOf(shape), JSON.stringify(shape), holes, number - 1, JOINT_LIGAMENT_RADII);
  const lambda = e.hoopMax > 0 ? e.axialMax / e.hoopMax : 0;
  const combined = (f: PathField) => f.hoopCoeff + lambda * f.axialCoeff;
  const alone = path.fieldWithoutNeighbours;
  const normal = (x: number) => Math.max(combined(path.field(x)), alone ? combined(alone(x)) : Number.NEGATIVE_INFINITY);
  const hole = holes[number - 1];
  const [sx, sy] = path.start_mm;
  const [ex, ey] = path.end_mm;
  const bearing = (Math.atan2(path.direction[1], path.direction[0]) * 180) / Math.PI;
  const others = path.neighbours.map((j) => j + 1);
  const with_ = others.length
    ? `, with fastener hole${others.length > 1 ? "s" : ""} ${others.join(", ")} (within ${JOINT_LIGAMENT_RADII} radii of the path) in the solution and without, the larger at each point taken (a neighbour may shield the path or raise its stress; the larger is the conservative choice)`
    : `, the other fastener holes left out (none within ${JOINT_LIGAMENT_RADII} radii of the path)`;
  const source = `the opening's field by the plane-elasticity solver (${SOLVER_SOURCE}), read as the stress normal to the straight path from fastener hole ${number} to the opening${with_} and without the crack's own hole (Bowie's factor carries it), tabulated at ${PATH_NODES} Chebyshev nodes along the path, with the biaxial ratio λ = ${fmt(lambda)}`;
  const steps: Step[] = [
    step(
      "crack-path",
      `Path of the crack from fastener hole ${number}: straight to the nearest point of the opening's edge`,
      "from the hole's edge facing the opening, C + r·d, to P, d = (P − C)/|P − C|; ligament = |P − C| − r",
      `C = (${fmt(hole.hoop_mm)}, ${fmt(hole.axial_mm)}) mm, r = ${fmt(hole.radius_mm)} mm; from (${fmt(sx)}, ${fmt(sy)}) to P = (${fmt(ex)}, ${fmt(ey)}) mm (hoop, axial); direction ${fmt(bearing, 3)}° from the hoop direction, ${fmt(path.angleFromAxis_deg, 3)}° from the axis`,
      path.ligament_mm,
      "mm",
      "The shortest ligament to the opening: the crack links up soonest (conservative choice); near the edge this line is normal to the edge and so across the tangential stress that opens the crack (common practice)",
    ),
    step(
      "crack-path-field",
      `Stress normal to the path, per unit nominal hoop stress: at the hole's edge and at the opening's edge`,
      "σn(x)/σθ = c_θ(x) + λ·c_x(x), from the unit hoop and unit axial solutions",
      `σn/σθ = ${fmt(normal(0))} at the hole's edge, ${fmt(normal(path.ligament_mm))} at the opening's edge (λ = ${fmt(lambda)})`,
      normal(path.ligament_mm),
      "—",
      SOLVER_SOURCE,
    ),
  ];
  const warnings = [
    `The crack from fastener hole ${number} is taken to grow straight along the shortest line to the opening's edge, ${fmt(path.angleFromAxis_deg, 3)}° from the axis, opened by the stress normal to that line. A real crack turns to run across the largest principal stress: near the edge that is about the same line, but between the hole and the edge it may curve, and the shear along the line is left out. It is reported as the axial crack (driven by the hoop stress, with the axial crack's bulging factor).`,
  ];
  if (path.angleFromAxis_deg > 45)
    warnings.push(
      `The path from fastener hole ${number} runs nearer the hoop direction than the axis (${fmt(path.angleFromAxis_deg, 3)}° from the axis): the crack is still reported as the axial crack, with the axial crack's bulging factor (the larger of the two, so conservative), and its field carries the axial stress through λ.`,
    );
  return {
    gradient: {
      field: normal,
      ligament_mm: path.ligament_mm,
      source,
    },
    path,
    steps,
    warnings,
  };
}

/** Grow the crack of the check in each orientation that applies and set out the inspection programme. */
export function damageTolerance(input: ResolvedCheck, e: Evaluation, load: Load): DamageTolerance {
  const c = input.crack!;
  const mat = input.material;
  const steps: Step[] = [];
  const warnings: Warning[] = [];
  const requested = c.orientation ?? (input.axialExtra ? "both" : "axial");
  const orientations: CrackOrientation[] = requested === "both" ? ["axial", "circumferential"] : [requested];
  const fastener = c.openingDistance_mm !== undefined || c.fastener !== undefined;
  const corner = c.fastener !== undefined ? cornerCrack(input, e, c.fastener) : undefined;
  const holeRadius = corner
    ? input.cutout.kind !== "given" && input.cutout.fasteners
      ? input.cutout.fasteners[c.fastener! - 1].radius_mm
      : undefined
    : (c.holeRadius_mm ?? (input.cutout.kind === "circular-hole" ? input.cutout.radius_mm : undefined));
  if (corner) {
    steps.push(...corner.steps);
    warnings.push(...corner.warnings);
  }

  let detectable = c.detectable_mm;
  if (c.detectableBy) {
    const t = TYPICAL_DETECTABLE_MM[c.detectableBy];
    detectable = t.size_mm;
    steps.push(
      step(
        "crack-detectable",
        `Detectable crack size: typical for ${t.label}`,
        "a_det (chosen inspection method)",
        `a_det = ${fmt(t.size_mm)} mm`,
        t.size_mm,
        "mm",
        TYPICAL_DETECTABLE_SOURCE,
      ),
    );
    warnings.push(
      say`The detectable crack size (${mm(t.size_mm)}) is a typical value for ${t.label}: verify it against a qualified inspection procedure.`,
    );
  }

  const results: CrackResult[] = [];
  for (const o of orientations) {
    const d = drive(load, e, o, mat.parisM!);
    if (d.step) steps.push(d.step);
    const gradient =
      o !== "axial"
        ? undefined
        : corner
          ? corner.gradient
          : fastener
            ? openingGradient(input, e, holeRadius!, c.openingDistance_mm!)
            : undefined;
    results.push(
      crackGrowth({
        geometry: c.geometry,
        initial_mm: c.initial_mm,
        detectable_mm: detectable,
        width_mm: c.width_mm,
        holeRadius_mm: holeRadius,
        cracksAtHole: c.cracksAtHole,
        orientation: o,
        bulging: c.bulging,
        form: input.shell.form,
        shellRadius_mm: e.radii.mean_mm,
        thickness_mm: e.analysis_mm,
        stressMax_MPa: d.max,
        stressMin_MPa: d.min,
        yield_MPa: mat.yield_MPa,
        ultimate_MPa: mat.ultimate_MPa,
        parisC: mat.parisC!,
        parisM: mat.parisM!,
        toughness_MPaSqrtM: mat.toughness_MPaSqrtM!,
        walkerGamma: c.walkerGamma,
        inspectionFactor: c.inspectionFactor,
        gradient,
        leakCheck: o === "axial",
      }),
    );
    if (corner && o === "circumferential")
      warnings.push(
        `The circumferential crack from fastener hole ${c.fastener} is grown in the uniform axial stress, with Bowie's factor for the hole alone: the opening's field along its path is not modelled, and near the opening that field can be higher, so this crack's life may read long.`,
      );
    else if (fastener && o === "circumferential")
      warnings.push(
        "The circumferential crack from the fastener hole grows away from the opening's line of highest stress; it is grown in the uniform axial field (the opening's field along its path is not modelled).",
      );
  }
  for (const r of results) {
    steps.push(...r.steps);
    warnings.push(...r.warnings);
  }
  // The shorter life governs; with no growth, the smaller critical size.
  const life = (r: CrackResult) => r.cycles ?? Infinity;
  const gov = results.reduce((a, b) => (life(b) < life(a) || (life(b) === life(a) && b.critical_mm < a.critical_mm) ? b : a));
  const minOf = (xs: (number | null)[]) => {
    const v = xs.filter((x): x is number => x !== null);
    return v.length ? Math.min(...v) : null;
  };
  const threshold = minOf(results.map((r) => r.threshold_cycles));
  const repeat = minOf(results.map((r) => r.repeatInterval_cycles));
  if (results.length > 1) {
    const other = results.find((r) => r !== gov)!;
    steps.push(
      step(
        "crack-governs",
        `Governing orientation: the ${gov.orientation} crack (the shorter life)`,
        "N = min(N_axial, N_circumferential); threshold and repeat interval the shorter of each",
        `${gov.orientation}: ${gov.cycles === null ? "no growth" : fmt(gov.cycles)} cycles; ${other.orientation}: ${other.cycles === null ? "no growth" : fmt(other.cycles)} cycles`,
        gov.cycles,
        "cycles",
        "Damage-tolerance practice: every credible crack orientation is assessed and the shortest life governs (common practice)",
      ),
    );
  }
  const lbb = results.find((r) => r.orientation === "axial")?.leakBeforeBreak ?? null;
  const interval = detectable !== undefined ? repeat : threshold;
  const crack: NonNullable<CheckResult["crack"]> = {
    geometry: c.geometry,
    orientation: requested,
    governingOrientation: gov.orientation,
    initial_mm: c.initial_mm,
    detectable_mm: detectable ?? null,
    critical_mm: gov.critical_mm,
    criticalBy: gov.criticalBy,
    cycles: gov.cycles,
    inspectionInterval_cycles: interval,
    threshold_cycles: threshold,
    repeatInterval_cycles: detectable !== undefined ? repeat : null,
    minimumInterval_cycles: c.minimumInterval_cycles ?? null,
    leakBeforeBreakDecides: c.leakBeforeBreak === "decide",
    curve: gov.curve,
    ...(gov.uniform
      ? { uniformCurve: gov.uniform.curve, uniformCycles: gov.uniform.cycles, uniformCritical_mm: gov.uniform.critical_mm }
      : {}),
    orientations: results.map((r) => ({
      orientation: r.orientation,
      stressMax_MPa: r.stressMax_MPa,
      range_MPa: r.range_MPa,
      critical_mm: r.critical_mm,
      criticalBy: r.criticalBy,
      fad: r.fad,
      cycles: r.cycles,
      threshold_cycles: r.threshold_cycles,
      repeatInterval_cycles: r.repeatInterval_cycles,
      curve: r.curve,
    })),
    leakBeforeBreak: lbb,
    ...(corner
      ? {
          path: {
            fastener: c.fastener!,
            start_mm: corner.path.start_mm,
            end_mm: corner.path.end_mm,
            ligament_mm: corner.path.ligament_mm,
            angleFromAxis_deg: corner.path.angleFromAxis_deg,
          },
        }
      : {}),
  };
  if (load.isSpectrum) {
    const perPass = load.cycles.reduce((s, x) => s + x.count, 0);
    const passes = (x: number | null) => (x === null ? null : x / perPass);
    crack.passes = passes(gov.cycles);
    crack.inspectionInterval_passes = passes(interval);
    crack.threshold_passes = passes(threshold);
    crack.repeatInterval_passes = passes(crack.repeatInterval_cycles);
    if (c.walkerGamma !== undefined)
      warnings.push(
        "with a spectrum the crack grows under the damage-equivalent range from the peak down; the R-ratio effect is applied to that one equivalent cycle only",
      );
  }
  if (c.leakBeforeBreak === "decide" && input.shell.form === "cylinder" && input.pressure.fromAltitude)
    warnings.push(
      "Leak before break was asked to decide for a cabin: a cabin's leak is not a warning a crew can rely on; use it for vessels.",
    );
  return { crack, steps, warnings };
}
