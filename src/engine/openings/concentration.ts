/**
 * @module engine/openings/concentration
 * The notch result of an opening solved by the openings module (a shape, fastener holes,
 * reinforcement, shell curvature), or of a classic hole with its curvature check, in the form the
 * fatigue check reads: Kt, the governing point, steps, warnings, the reasons to refer, the picture.
 */
import type { ParsedCheck } from "../../schema/check.ts";
import type { CheckResult } from "../result.ts";
import type { Concentration } from "../concentration.ts";
import { InputError } from "../errors.ts";
import { fmt, step, type Step } from "../step.ts";
import { mm, say } from "../phrase.ts";
import { curvature, fastenerSteps, shapeField, type FastenerSummary, type ShellGeometry } from "./field.ts";
import { kirschPeak, type ShapeCutout } from "./index.ts";

type SchemaCutout = ParsedCheck["cutout"];

/** What the opening adds to the notch result: fastener holes, the reasons to refer, and the picture's numbers. */
export interface OpeningExtras {
  fasteners: FastenerSummary[];
  refer: string[];
  picture?: OpeningPictureResult;
}

/** The numbers the opening's picture draws (its definition: src/schema/result.ts). */
export type OpeningPictureResult = NonNullable<CheckResult["notch"]["opening"]>;

export type ExtendedConcentration = Concentration & Partial<OpeningExtras>;

/** Radius of the circle that holds a circle or an ellipse. */
function classicSize(c: SchemaCutout): number | undefined {
  if (c.kind === "circular-hole") return c.radius_mm;
  if (c.kind === "elliptical-hole") return Math.max(c.halfAxisAlongHoop_mm, c.halfAxisAlongAxial_mm);
  return undefined;
}

/**
 * Concentration at an opening with what the plane-elasticity solution adds: any smooth shape,
 * fastener holes in its field, shell curvature and reinforcement. Circles and ellipses without
 * fasteners or reinforcement keep their closed forms (`classic`), with the curvature check added.
 */
export function openingConcentration(
  cutout: SchemaCutout,
  lambda: number,
  shell: ShellGeometry,
  classic: () => Concentration,
): ExtendedConcentration {
  if (cutout.kind === "given") return classic();
  const fasteners = cutout.fasteners ?? [];
  if (cutout.kind === "none") {
    const base = classic();
    if (!fasteners.length) return base;
    // Holes in the plain skin: Kirsch in the membrane field itself.
    const k = kirschPeak({ sxx: 1, syy: lambda, sxy: 0 }).peak;
    const list: FastenerSummary[] = fasteners.map((f, i) => ({
      index: i,
      ...f,
      ligament_mm: Infinity,
      solvedWithOpening: false,
      kt: k,
      ktKirsch: k,
    }));
    const steps: Step[] = [
      ...base.steps,
      step(
        "fastener-kt",
        "Kt of the fastener holes in the plain skin (Kirsch), referred to the nominal hoop stress",
        "Kt = 3 − λ for λ ≤ 1, 3λ − 1 above",
        `Kt = ${fmt(k)}   (λ = ${fmt(lambda)})`,
        k,
        "—",
        "Kirsch (1898); Peterson's Stress Concentration Factors, Chart 4.1 (biaxial)",
      ),
    ];
    return {
      ...base,
      kt: Math.max(base.kt, k),
      governs: `the edge of fastener hole 1 in the plain skin`,
      rootRadius_mm: fasteners[0].radius_mm,
      steps,
      fasteners: list,
      refer: [],
    };
  }
  const reinforcement = cutout.reinforcement;
  const classicKind = cutout.kind === "circular-hole" || cutout.kind === "elliptical-hole";
  if (classicKind && !fasteners.length && !reinforcement) {
    const base = classic();
    const a = classicSize(cutout);
    if (a === undefined) {
      return {
        ...base,
        warnings: [
          ...base.warnings,
          say`the hole's radius is not given, so its curvature parameter cannot be checked: the flat-plate Kt holds only for a hole small beside √(R·t) = ${mm(Math.sqrt(shell.meanRadius_mm * shell.thickness_mm))}`,
        ],
        fasteners: [],
        refer: [],
      };
    }
    const c = curvature(a, shell);
    return {
      ...base,
      kt: base.kt * c.factor,
      steps: [
        ...base.steps,
        ...c.steps,
        ...(c.factor !== 1
          ? [
              step(
                "kt-shell",
                "Stress concentration factor with the curvature correction",
                "Kt = Kt,flat·k_curv",
                `Kt = ${fmt(base.kt)} × ${fmt(c.factor)}`,
                base.kt * c.factor,
                "—",
                "flat-plate Kt times the small-curvature correction",
              ),
            ]
          : []),
      ],
      warnings: [...base.warnings, ...c.warnings],
      fasteners: [],
      refer: c.refer,
    };
  }
  if (cutout.kind === "circular-hole" && cutout.radius_mm === undefined)
    throw new InputError("cutout.radius_mm", "give the hole's radius: fastener holes and reinforcement are placed and sized against it");
  const shape: ShapeCutout =
    cutout.kind === "circular-hole"
      ? { kind: "circular-hole", radius_mm: cutout.radius_mm as number }
      : cutout.kind === "elliptical-hole"
        ? {
            kind: "elliptical-hole",
            halfAxisAlongHoop_mm: cutout.halfAxisAlongHoop_mm,
            halfAxisAlongAxial_mm: cutout.halfAxisAlongAxial_mm,
          }
        : cutout.kind === "rounded-rectangle"
          ? {
              kind: "rounded-rectangle",
              halfWidthAlongHoop_mm: cutout.halfWidthAlongHoop_mm,
              halfLengthAlongAxial_mm: cutout.halfLengthAlongAxial_mm,
              cornerRadius_mm: cutout.cornerRadius_mm,
            }
          : { kind: "outline", points_mm: cutout.points_mm };
  const field = shapeField(shape, fasteners, shell, reinforcement);
  // the governing point at this biaxial ratio: opening edge or a fastener hole
  const list = field.fastenersAt(lambda);
  const fastenerStepList = fastenerSteps(field, lambda);
  const openingPeak = Math.max(...field.picture.edge.map((s) => s.hoopCoeff + lambda * s.axialCoeff));
  const fastenerPeak = list.length ? Math.max(...list.map((f) => f.kt)) : -Infinity;
  const governedByFastener = fastenerPeak > openingPeak;
  const gIndex = governedByFastener ? list.findIndex((f) => f.kt === fastenerPeak) : -1;
  const kt = Math.max(openingPeak, fastenerPeak);
  const steps: Step[] = [
    ...field.steps,
    ...fastenerStepList,
    step(
      "kt",
      governedByFastener
        ? `Stress concentration factor: fastener hole ${gIndex + 1} governs`
        : "Stress concentration factor: the opening's edge governs",
      "Kt = max over the opening's edge and the fastener holes of (c_θ + c_x·λ)",
      `Kt = max(${fmt(openingPeak)} at the opening${list.length ? `, ${list.map((f) => fmt(f.kt)).join(", ")} at the fasteners` : ""})   (λ = ${fmt(lambda)})`,
      kt,
      "—",
      field.basis,
    ),
  ];
  const edgeSamples = field.picture.edge;
  const stride = Math.max(1, Math.ceil(edgeSamples.length / 360));
  const edge: [number, number, number, number][] = [];
  for (let i = 0; i < edgeSamples.length; i += stride) {
    const s = edgeSamples[i];
    edge.push([s.x_mm, s.y_mm, s.s_mm, s.hoopCoeff + lambda * s.axialCoeff]);
  }
  const peakSample = edgeSamples.reduce((a, b) => (b.hoopCoeff + lambda * b.axialCoeff > a.hoopCoeff + lambda * a.axialCoeff ? b : a));
  const g = governedByFastener
    ? (() => {
        const fe = field.picture.fasteners[gIndex].edge;
        const ps = fe.reduce((a, b) => (b.hoopCoeff + lambda * b.axialCoeff > a.hoopCoeff + lambda * a.axialCoeff ? b : a));
        return { hoop_mm: ps.x_mm, axial_mm: ps.y_mm, kt, at: "fastener" as const, index: gIndex };
      })()
    : { hoop_mm: peakSample.x_mm, axial_mm: peakSample.y_mm, kt, at: "opening" as const };
  return {
    kt: Math.max(kt, 1),
    governs: governedByFastener
      ? `the edge of fastener hole ${gIndex + 1} at (${fmt(list[gIndex].hoop_mm)}, ${fmt(list[gIndex].axial_mm)}) mm`
      : `the opening's edge at (${fmt(peakSample.x_mm, 3)}, ${fmt(peakSample.y_mm, 3)}) mm`,
    rootRadius_mm: governedByFastener ? list[gIndex].radius_mm : Number.isFinite(peakSample.radius_mm) ? peakSample.radius_mm : undefined,
    steps,
    warnings: field.warnings,
    fasteners: list,
    refer: field.refer,
    picture: {
      edge,
      governing: g,
      fasteners: list.map((f) => ({
        hoop_mm: f.hoop_mm,
        axial_mm: f.axial_mm,
        radius_mm: f.radius_mm,
        kt: f.kt,
        solvedWithOpening: f.solvedWithOpening,
      })),
      curvature: field.picture.curvature,
    },
  };
}
