/**
 * @module engine/input
 * From a parsed check to the values the engine works with: the material from the library with the
 * user's overrides, the fatigue curve and its defaults, and the cross-field rules the schema cannot
 * see one field at a time (a crack at a hole needs its radius, a crack from a fastener hole names a
 * hole the cutout lists, strengths in a sensible order). Every problem is a field error naming its path.
 */
import { toFieldErrors, type FieldError } from "../schema/errors.ts";
import { MATERIALS, findMaterial, TYPICAL_FLAG } from "../materials/library.ts";
import { checkSchema, type MaterialFamily, type ParsedCheck, type SurfaceFinish } from "../schema/check.ts";
import { defaultAt } from "../schema/defaults.ts";

/**
 * The engine's input: a check document validated by the schema, then resolved against the
 * materials library and the cross-field rules. The schema knows neither the engine nor the
 * library; this is where the two meet.
 */
import {
  BASIS_DEFAULTS,
  SERVICE_DEFAULTS,
  WELD_DETAIL_INFO,
  type FatigueCurve,
  type Service,
  type StaticBasis,
  type WeldDetail,
} from "../schema/service.ts";

/** A material with every value the engine needs; optional ones only where a method may go without. */
export interface ResolvedMaterial {
  id?: string;
  name: string;
  family: MaterialFamily;
  ultimate_MPa: number;
  yield_MPa: number;
  modulus_MPa: number;
  /** Absent only while coupons are still to be fitted. */
  fatigueStrengthCoefficient_MPa?: number;
  fatigueStrengthExponent?: number;
  enduranceLimit_MPa?: number;
  toughness_MPaSqrtM?: number;
  parisC?: number;
  parisM?: number;
  coupons?: { amplitude_MPa: number; life_cycles: number; runout: boolean }[];
  /** The library entry's as-delivered surface finish (surface factor when the user names none). */
  surface?: SurfaceFinish;
  /** The library's σ'f and b when the user's coupons replace them: shown for comparison only. */
  libraryCurve?: { fatigueStrengthCoefficient_MPa: number; fatigueStrengthExponent: number };
  source: string;
}

/** The static basis with every value it needs; `defaults` names each key a default filled, with the reason. */
export interface ResolvedStatic {
  basis: StaticBasis;
  yieldFactor: number;
  allowableStress_MPa?: number;
  jointEfficiency: number;
  corrosionAllowance_mm: number;
  thicknessTolerance_mm: number;
  minimumGauge_mm: number;
  limitFactor: number;
  ultimateFactor: number;
  defaults: Record<string, string>;
}

export type ResolvedFatigue = Omit<ParsedCheck["fatigue"], "curve"> & {
  curve: FatigueCurve;
  temperature_C: number;
  roughnessRz_um: number;
  defaults: Record<string, string>;
};

/** The parsed document (defaults filled in) is kept beside the resolved values: it is what gets fingerprinted. */
export type ResolvedCheck = Omit<ParsedCheck, "material" | "static" | "fatigue"> & {
  material: ResolvedMaterial;
  static: ResolvedStatic;
  fatigue: ResolvedFatigue;
  document: ParsedCheck;
};

const STEEL_FAMILIES: readonly MaterialFamily[] = ["steel", "stainless"];

function resolveStatic(parsed: ParsedCheck): ResolvedStatic {
  const service: Service = parsed.shell.service;
  const sd = SERVICE_DEFAULTS[service];
  const given = parsed.static;
  const defaults: Record<string, string> = {};
  const pick = <T>(key: string, value: T | undefined, d: { value: T; why: string }): T => {
    if (value !== undefined) return value;
    defaults[key] = d.why;
    return d.value;
  };
  const basis = pick("basis", given?.basis, sd.basis);
  const code = basis === "en13445-3" || basis === "asme-viii-1";
  const jointEfficiency = code
    ? pick("jointEfficiency", given?.jointEfficiency, BASIS_DEFAULTS.jointEfficiency)
    : (given?.jointEfficiency ?? 1);
  const aircraft = basis === "aircraft";
  return {
    basis,
    // With no static section at all, the schema's own default (the section's defaults apply only when it is given).
    yieldFactor: given?.yieldFactor ?? (defaultAt("static.yieldFactor") as number),
    allowableStress_MPa: given?.allowableStress_MPa,
    jointEfficiency,
    corrosionAllowance_mm: pick("corrosionAllowance_mm", given?.corrosionAllowance_mm, sd.corrosionAllowance_mm),
    thicknessTolerance_mm: pick("thicknessTolerance_mm", given?.thicknessTolerance_mm, sd.thicknessTolerance_mm),
    minimumGauge_mm: pick("minimumGauge_mm", given?.minimumGauge_mm, sd.minimumGauge_mm),
    limitFactor: aircraft
      ? pick("limitFactor", given?.limitFactor, BASIS_DEFAULTS.limitFactor)
      : (given?.limitFactor ?? BASIS_DEFAULTS.limitFactor.value),
    ultimateFactor: aircraft
      ? pick("ultimateFactor", given?.ultimateFactor, BASIS_DEFAULTS.ultimateFactor)
      : (given?.ultimateFactor ?? BASIS_DEFAULTS.ultimateFactor.value),
    defaults,
  };
}

function resolveFatigue(parsed: ParsedCheck, family: MaterialFamily, errors: FieldError[]): ResolvedFatigue {
  const f = parsed.fatigue;
  const sd = SERVICE_DEFAULTS[parsed.shell.service];
  const defaults: Record<string, string> = {};
  const steel = STEEL_FAMILIES.includes(family);
  let curve: FatigueCurve;
  if (f.curve !== undefined) curve = f.curve;
  else if (f.weldDetail !== undefined) curve = "en13445-welded";
  else if (sd.steelCurve.value !== "basquin" && steel) {
    curve = sd.steelCurve.value;
    defaults.curve = sd.steelCurve.why;
  } else {
    curve = "basquin";
    if (sd.steelCurve.value !== "basquin")
      defaults.curve = `the material curve: the vessel code's welded classes are for steels, and the material is "${family}"`;
  }
  let detailCategory_MPa = f.detailCategory_MPa;
  let weldDetail: WeldDetail | undefined = f.weldDetail;
  if (curve === "en13445-welded" && detailCategory_MPa === undefined) {
    if (weldDetail === undefined) {
      weldDetail = sd.weldDetail.value;
      defaults.weldDetail = sd.weldDetail.why;
    }
    detailCategory_MPa = WELD_DETAIL_INFO[weldDetail].class_MPa;
    defaults.detailCategory_MPa = `the class of the ${WELD_DETAIL_INFO[weldDetail].label.toLowerCase()} detail`;
  }
  const welded = curve === "welded" || curve === "en13445-welded";
  if (welded && !steel && f.detailCategory_MPa === undefined) {
    errors.push({
      path: "fatigue.detailCategory_MPa",
      message: `the welded classes here are for steels; for a "${family}" shell give the class of your own welded curve as detailCategory_MPa (for aluminium, EN 1999-1-3), or use the material curve`,
    });
  }
  const temperature_C = f.temperature_C ?? 20;
  if (f.temperature_C === undefined && curve.startsWith("en13445"))
    defaults.temperature_C = "20 °C: no temperature correction below 100 °C";
  const roughnessRz_um = f.roughnessRz_um ?? 200;
  if (f.roughnessRz_um === undefined && curve === "en13445-unwelded") defaults.roughnessRz_um = "200 µm, as-rolled plate (conservative)";
  return { ...f, curve, detailCategory_MPa, weldDetail, temperature_C, roughnessRz_um, defaults };
}

/**
 * Cross-field rules the schema cannot see one field at a time: the library lookup with
 * overrides, the values a chosen method needs, strengths in a sensible order.
 */
export function resolveCheck(parsed: ParsedCheck): { ok: true; value: ResolvedCheck } | { ok: false; errors: FieldError[] } {
  const errors: FieldError[] = [];
  const m = parsed.material;
  let base: Partial<ResolvedMaterial> = {};
  if (m.id !== undefined) {
    const lib = findMaterial(m.id);
    if (!lib) {
      errors.push({
        path: "material.id",
        message: `unknown material "${m.id}"; the library holds ${MATERIALS.map((x) => x.id).join(", ")}`,
      });
      return { ok: false, errors };
    }
    base = { ...lib, source: `${lib.source} (${TYPICAL_FLAG})` };
    // The user's own coupons win over the library's curve: the fit replaces σ'f and b unless the user gave them too.
    if (m.coupons && m.fatigueStrengthCoefficient_MPa === undefined && m.fatigueStrengthExponent === undefined) {
      const { fatigueStrengthCoefficient_MPa, fatigueStrengthExponent, ...rest } = lib;
      base = {
        ...rest,
        source: `${lib.source} (${TYPICAL_FLAG})`,
        libraryCurve: { fatigueStrengthCoefficient_MPa, fatigueStrengthExponent },
      };
    }
  }
  const merged = { ...base, ...stripUndefined(m) } as Partial<ResolvedMaterial> & { name?: string };
  const need = (key: keyof ResolvedMaterial, words: string, why = "") => {
    if (merged[key] === undefined) errors.push({ path: `material.${key}`, message: `${words} is required${why}` });
  };
  need("ultimate_MPa", "the ultimate strength");
  need("yield_MPa", "the yield strength");
  need("modulus_MPa", "the elastic modulus");
  const fatigue = resolveFatigue(parsed, merged.family ?? "other", errors);
  const curve = fatigue.curve;
  if (curve === "basquin" && !merged.coupons) {
    need("fatigueStrengthCoefficient_MPa", "the fatigue strength coefficient σ'f", " (or give coupons to fit it)");
    need("fatigueStrengthExponent", "the Basquin exponent b", " (or give coupons to fit it)");
  }
  if (parsed.crack) {
    const why = " because a crack is given";
    need("toughness_MPaSqrtM", "the fracture toughness", why);
    need("parisC", "the Paris coefficient C", why);
    need("parisM", "the Paris exponent m", why);
    if (
      parsed.crack.geometry === "hole-through" &&
      parsed.crack.holeRadius_mm === undefined &&
      parsed.crack.fastener === undefined &&
      !(parsed.cutout.kind === "circular-hole" && parsed.cutout.radius_mm)
    ) {
      errors.push({ path: "crack.holeRadius_mm", message: "a crack from a hole needs the hole radius (here or as cutout.radius_mm)" });
    }
    const c = parsed.crack;
    const cut = parsed.cutout;
    if (c.fastener !== undefined) {
      const holes = cut.kind !== "given" ? (cut.fasteners ?? []) : [];
      const hole = holes[c.fastener - 1];
      if (!hole)
        errors.push({
          path: "crack.fastener",
          message: holes.length
            ? `crack.fastener is ${c.fastener}, but cutout.fasteners lists ${holes.length} hole${holes.length === 1 ? "" : "s"}: give a number from 1 to ${holes.length}`
            : "crack.fastener names a hole of cutout.fasteners, but the cutout lists no fastener holes",
        });
      else if (c.holeRadius_mm !== undefined && Math.abs(c.holeRadius_mm - hole.radius_mm) > 1e-9 * hole.radius_mm)
        errors.push({
          path: "crack.holeRadius_mm",
          message: `the crack's hole radius (${c.holeRadius_mm} mm) differs from fastener hole ${c.fastener}'s (${hole.radius_mm} mm): the crack grows from that hole, so it must use the radius the fatigue check uses; leave crack.holeRadius_mm out`,
        });
      if (cut.kind === "none" || cut.kind === "given" || (cut.kind === "circular-hole" && cut.radius_mm === undefined))
        errors.push({
          path: "crack.fastener",
          message:
            "a crack growing from a fastener hole toward the opening needs the opening's shape: give its outline or dimensions as the cutout",
        });
      if (c.orientation === "circumferential")
        errors.push({
          path: "crack.orientation",
          message:
            'the crack from a fastener hole toward the opening takes the place of the axial crack (it is driven by the hoop stress, with the stress normal to its path from both membrane stresses): choose "axial" or "both"',
        });
    } else if (c.openingDistance_mm !== undefined) {
      if (c.holeRadius_mm === undefined)
        errors.push({
          path: "crack.holeRadius_mm",
          message: "a crack from a fastener hole near the opening needs the fastener hole's radius",
        });
      if (
        cut.kind !== "elliptical-hole" &&
        cut.kind !== "rounded-rectangle" &&
        !(cut.kind === "circular-hole" && cut.radius_mm !== undefined)
      )
        errors.push({
          path: "crack.openingDistance_mm",
          message:
            "the stress along the crack's path is known for an elliptical opening or a circular one with its radius; give one as the cutout",
        });
    } else if (
      c.geometry === "hole-through" &&
      cut.kind === "circular-hole" &&
      cut.radius_mm !== undefined &&
      c.holeRadius_mm !== undefined &&
      Math.abs(c.holeRadius_mm - cut.radius_mm) > 1e-9 * cut.radius_mm
    ) {
      errors.push({
        path: "crack.holeRadius_mm",
        message: `the crack's hole radius (${c.holeRadius_mm} mm) differs from the opening's (${cut.radius_mm} mm): a crack at the opening must use the radius the fatigue check uses; for a crack at a fastener hole near the opening, give crack.openingDistance_mm`,
      });
    }
  }
  if (parsed.fleet && parsed.fleet.logStdDev === undefined && !parsed.evidence)
    errors.push({
      path: "fleet.logStdDev",
      message: "the fleet view needs the scatter of lives: give test evidence, or the log10 standard deviation of life here",
    });
  if (merged.yield_MPa !== undefined && merged.ultimate_MPa !== undefined && merged.yield_MPa > merged.ultimate_MPa) {
    errors.push({
      path: "material.yield_MPa",
      message: `the yield strength (${merged.yield_MPa} MPa) must not exceed the ultimate strength (${merged.ultimate_MPa} MPa)`,
    });
  }
  if (merged.enduranceLimit_MPa !== undefined && merged.ultimate_MPa !== undefined && merged.enduranceLimit_MPa >= merged.ultimate_MPa) {
    errors.push({ path: "material.enduranceLimit_MPa", message: "the endurance limit must be below the ultimate strength" });
  }
  if (
    merged.fatigueStrengthCoefficient_MPa !== undefined &&
    merged.ultimate_MPa !== undefined &&
    merged.fatigueStrengthCoefficient_MPa < 0.5 * merged.ultimate_MPa
  ) {
    errors.push({
      path: "material.fatigueStrengthCoefficient_MPa",
      message: `σ'f (${merged.fatigueStrengthCoefficient_MPa} MPa) is below half the ultimate strength; σ'f is normally near or above the ultimate strength — check the value`,
    });
  }
  if (parsed.fatigue.notchConstant !== undefined) {
    const family = merged.family ?? "other";
    const steelLike = family === "steel" || family === "stainless";
    if (parsed.fatigue.notchConstant === "neuber" && !steelLike) {
      errors.push({
        path: "fatigue.notchConstant",
        message: "Neuber's constant is published here for steels only; use peterson or give notchSensitivity",
      });
    } else if (!steelLike && family !== "aluminium") {
      errors.push({
        path: "fatigue.notchConstant",
        message: `Peterson's constant is published here for steels and aluminium alloys, not for the "${family}" family; give notchSensitivity`,
      });
    }
    const radiusKnown =
      parsed.cutout.kind === "elliptical-hole" ||
      (parsed.cutout.kind === "circular-hole" && parsed.cutout.radius_mm !== undefined) ||
      (parsed.cutout.kind === "given" && parsed.cutout.rootRadius_mm !== undefined);
    if (!radiusKnown) {
      errors.push({
        path: "fatigue.notchConstant",
        message: "notch sensitivity from a constant needs the root radius: give cutout.radius_mm or cutout.rootRadius_mm",
      });
    }
  }
  if (errors.length) return { ok: false, errors };
  const material: ResolvedMaterial = {
    ...(merged as ResolvedMaterial),
    name: merged.name ?? "own material",
    family: merged.family ?? "other",
    source: merged.source ?? "entered by the user",
  };
  return { ok: true, value: { ...parsed, material, static: resolveStatic(parsed), fatigue, document: parsed } };
}

function stripUndefined<T extends object>(o: T): Partial<T> {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as Partial<T>;
}

export type ParseResult = { ok: true; value: ResolvedCheck } | { ok: false; errors: FieldError[] };

/** Validate a check document: schema first, then the cross-field rules. Never throws. */
export function parseCheck(json: unknown, pathPrefix = ""): ParseResult {
  // A long, clean pressure history is validated once by a plain loop: the schema then sees a
  // two-point stand-in with the same top (all its history rules read beyond the points themselves),
  // and the original array goes back into the parsed document, uncopied. A history with any point
  // the schema would refuse takes the schema's own path, so every error message stays the schema's.
  const history = cleanHistory(json);
  const parsed = history
    ? checkSchema.safeParse({
        ...(json as object),
        pressure: { ...(json as { pressure: object }).pressure, history_MPa: standIn(history) },
      })
    : checkSchema.safeParse(json);
  if (parsed.success && history && parsed.data.pressure.history_MPa) parsed.data.pressure.history_MPa = history;
  if (!parsed.success) return { ok: false, errors: toFieldErrors(parsed.error.issues, json, pathPrefix) };
  const resolved = resolveCheck(parsed.data);
  if (!resolved.ok && pathPrefix) return { ok: false, errors: resolved.errors.map((e) => ({ ...e, path: `${pathPrefix}.${e.path}` })) };
  return resolved;
}

/** The longest pressure history the schema takes, and the bound on each of its points (MPa). */
const HISTORY_MAX_POINTS = 5_000_000;
const HISTORY_POINT_BOUND = 1e4;

/**
 * A history every point of which the schema would take as it is (finite numbers within ±10 000 MPa,
 * at least two, at most five million). Checking that is one plain loop; the schema's per-element
 * path costs about a tenth of a microsecond per point and copies the array.
 */
function cleanHistory(json: unknown): number[] | undefined {
  if (json === null || typeof json !== "object") return undefined;
  const p = (json as { pressure?: unknown }).pressure;
  if (p === null || typeof p !== "object") return undefined;
  const h = (p as { history_MPa?: unknown }).history_MPa;
  if (!Array.isArray(h) || h.length < 2 || h.length > HISTORY_MAX_POINTS) return undefined;
  for (let i = 0; i < h.length; i++) {
    const x = h[i];
    if (typeof x !== "number" || !(x >= -HISTORY_POINT_BOUND && x <= HISTORY_POINT_BOUND)) return undefined;
  }
  return h as number[];
}

/** Its largest point first, then a point the history also holds: what the schema's history rules read (count ≥ 2 and the top). */
function standIn(h: number[]): number[] {
  let top = h[0];
  for (let i = 1; i < h.length; i++) if (h[i] > top) top = h[i];
  return [top, h[0]];
}
