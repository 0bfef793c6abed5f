import { z } from "zod";
import { ALTITUDE_UNITS, LENGTH_UNITS, PRESSURE_UNITS, STRESS_UNITS } from "./units.ts";
import { FATIGUE_CURVES, SERVICES, STATIC_BASES, WELD_DETAILS } from "./service.ts";

/**
 * The check format, version 1: the one definition of a check.
 * Every face (form, JSON API, CLI, sheet) parses through this schema; the TypeScript
 * types come from it with z.infer. Units are in the key names (mm, MPa, cycles).
 */

/**
 * A number input. `what` is the input's name in words ("the wall thickness"): the error messages
 * say it, and the same words, kept as the schema's metadata, give the label the form and the sheet
 * show (src/schema/inputs.ts), so the three cannot drift apart.
 */
const num = (what: string) => z.number({ error: `${what} must be a number` }).meta({ words: what });

/**
 * Smallest magnitudes the check takes. No real shell, material or test comes near them; below
 * them a value only drives the arithmetic into underflow (a crack that cannot grow, a life of
 * 10^400 cycles), and the answer would be noise or no number at all.
 */
const FLOORS = {
  length: { min: 0.001, words: "0.001 mm (1 µm)" },
  strength: { min: 1, words: "1 MPa" },
  toughness: { min: 0.1, words: "0.1 MPa·√m" },
  parisC: { min: 1e-20, words: "1e-20 (da/dN in m/cycle, ΔK in MPa·√m)" },
  cycles: { min: 1, words: "1 cycle" },
  blockCycles: { min: 0.001, words: "0.001 cycles" },
  pressure_MPa: 1e-6,
} as const;
type Floor = { min: number; words: string };

/** How a limit binds a number. */
export type LimitRelation = "at most" | "at least";
/** A limit of a number input: its value in SI and the text its error message writes it with. */
export interface Limit {
  relation: LimitRelation;
  value: number;
  text: string;
  /** Why the limit is there, in words, where the message says it. */
  why?: string;
}
/**
 * How an error message states a limit: "the radius must be at most 100000". The schema writes it
 * with the limit's SI text; the form writes the same sentence with the limit in its own units, from
 * the limits kept as the schema's metadata (src/schema/inputs.ts), so no limit is typed twice.
 */
export function limitMessage(what: string, relation: LimitRelation, value: string, why?: string): string {
  return `${what} must be ${relation} ${value}${why ? ` (${why})` : ""}`;
}
const limit = (relation: LimitRelation, value: number, text: string, why?: string): Limit => ({
  relation,
  value,
  text,
  ...(why ? { why } : {}),
});
/** A number between two limits, each stated in its SI text, with the limits kept as metadata for the faces. */
const between = (what: string, min: Limit, max: Limit) =>
  num(what)
    .min(min.value, { error: limitMessage(what, min.relation, min.text, min.why) })
    .max(max.value, { error: limitMessage(what, max.relation, max.text, max.why) })
    .meta({ words: what, limits: [min, max] });

/** Above zero and at most `max`; with a floor, also at least that (zero and below keep the plainer message). */
const positive = (what: string, max: number, floor?: Floor) => {
  const limits = [limit("at most", max, String(max)), ...(floor ? [limit("at least", floor.min, floor.words)] : [])];
  const p = num(what)
    .positive({ error: `${what} must be greater than 0` })
    .max(max, { error: limitMessage(what, "at most", String(max)) });
  return (floor ? p.refine((x) => x <= 0 || x >= floor.min, { error: limitMessage(what, "at least", floor.words) }) : p).meta({
    words: what,
    limits,
  });
};
/** A probability for a lower bound: below one half it would bound the better half of the items, not the weaker. */
const fraction = (what: string) =>
  num(what)
    .gt(0, { error: `${what} must be between 0 and 1 (exclusive)` })
    .lt(1, { error: `${what} must be between 0 and 1 (exclusive)` })
    .refine((x) => x <= 0 || x >= 0.5, { error: `${what} must be at least 0.5 for a lower bound on life` });
/** A stress or pressure of either sign, within what any shell sees. */
const signedStress = (what: string) =>
  num(what)
    .min(-1e4, { error: limitMessage(what, "at least", "−10 000 MPa") })
    .max(1e4, { error: limitMessage(what, "at most", "10 000 MPa") })
    .meta({ words: what, limits: [limit("at least", -1e4, "−10 000 MPa"), limit("at most", 1e4, "10 000 MPa")] });
/** Zero or more, at most `max` (an allowance or a gauge). */
const nonNegative = (what: string, max: number) =>
  num(what)
    .min(0, { error: `${what} must be 0 or more` })
    .max(max, { error: limitMessage(what, "at most", String(max)) })
    .meta({ words: what, limits: [limit("at most", max, String(max))] });
const text = (what: string, max: number) =>
  z.string({ error: `${what} must be text` }).max(max, { error: `${what} must be at most ${max} characters` });

export const MEAN_STRESS_CRITERIA = ["goodman", "gerber", "soderberg", "asme-elliptic", "swt", "morrow", "walker"] as const;
export const SURFACE_FINISHES = ["ground", "machined", "hot-rolled", "as-forged"] as const;
export const MATERIAL_FAMILIES = ["aluminium", "steel", "stainless", "titanium", "other"] as const;
export const GAUGE_LISTS = ["aircraft-sheet", "vessel-plate"] as const;

export const shellSchema = z
  .strictObject({
    form: z.enum(["cylinder", "sphere"], { error: 'shell form must be "cylinder" or "sphere"' }),
    radius_mm: positive("the radius", 1e5, FLOORS.length).describe("Shell radius in mm, measured where radiusAt says"),
    radiusAt: z.enum(["inner", "mean", "outer"], { error: 'radiusAt must be "inner", "mean" or "outer"' }).default("mean"),
    thickness_mm: positive("the wall thickness", 1e4, FLOORS.length).meta({ symbol: "t" }).describe("Skin or wall thickness in mm"),
    theory: z
      .enum(["auto", "thin", "thick"], { error: 'theory must be "auto", "thin" or "thick"' })
      .default("auto")
      .describe("auto: thick-wall (Lamé) below mean radius / thickness = 10"),
    service: z
      .enum(SERVICES, { error: `service must be one of ${SERVICES.join(", ")}` })
      .default("other")
      .describe("The kind of shell; it sets the defaults of the static basis and of the fatigue route"),
  })
  .superRefine((s, ctx) => {
    const inner =
      s.radiusAt === "inner" ? s.radius_mm : s.radiusAt === "mean" ? s.radius_mm - s.thickness_mm / 2 : s.radius_mm - s.thickness_mm;
    if (inner <= 0) {
      ctx.addIssue({
        code: "custom",
        path: ["radius_mm"],
        message: `the radius is too small for its wall: a ${s.radiusAt} radius of ${s.radius_mm} mm with a ${s.thickness_mm} mm wall leaves no inside`,
      });
    }
  });

const altitudeSchema = z
  .strictObject({
    flight_m: between(
      "the flight altitude",
      limit("at least", -500, "−500 m"),
      limit("at most", 20000, "20 000 m", "the standard atmosphere is modelled to 20 km"),
    ),
    cabin_m: between("the cabin altitude", limit("at least", -500, "−500 m"), limit("at most", 20000, "20 000 m")),
  })
  .superRefine((a, ctx) => {
    if (a.cabin_m >= a.flight_m) {
      ctx.addIssue({
        code: "custom",
        path: ["cabin_m"],
        message: "the cabin altitude must be below the flight altitude, or the shell is not pressurized",
      });
    }
  });

const blockSchema = z
  .strictObject({
    max_MPa: signedStress("the block's maximum pressure"),
    min_MPa: signedStress("the block's minimum pressure").default(0),
    cycles: positive("the block's cycle count", 1e12, FLOORS.blockCycles),
  })
  .superRefine((b, ctx) => {
    if (b.min_MPa > b.max_MPa)
      ctx.addIssue({ code: "custom", path: ["min_MPa"], message: "the block's minimum pressure must not exceed its maximum" });
  });

export const pressureSchema = z
  .strictObject({
    max_MPa: signedStress("the highest pressure").meta({ symbol: "p_max" }).optional(),
    min_MPa: signedStress("the lowest pressure").meta({ symbol: "p_min" }).optional(),
    fromAltitude: altitudeSchema.optional(),
    history_MPa: z
      .array(signedStress("each pressure in the history"), { error: "the pressure history must be a list of numbers" })
      .max(5_000_000, {
        error: "the pressure history may hold at most 5 000 000 points",
      })
      .optional(),
    gate_MPa: num("the hysteresis gate")
      .min(0, { error: "the hysteresis gate must be 0 or more" })
      .max(1e4, { error: "the hysteresis gate must be at most 10 000 MPa" })
      .optional(),
    blocks: z
      .array(blockSchema, { error: "the blocks must be a list" })
      .min(1, { error: "give at least one block" })
      .max(10000, {
        error: "at most 10 000 blocks",
      })
      .optional(),
  })
  .superRefine((p, ctx) => {
    const modes = [p.max_MPa !== undefined, p.fromAltitude !== undefined, p.history_MPa !== undefined, p.blocks !== undefined].filter(
      Boolean,
    ).length;
    if (modes !== 1) {
      ctx.addIssue({
        code: "custom",
        path: [],
        message: "give the pressure one way: max_MPa (with min_MPa), fromAltitude, history_MPa or blocks",
      });
      return;
    }
    if (p.max_MPa !== undefined && p.max_MPa <= 0) {
      ctx.addIssue({
        code: "custom",
        path: ["max_MPa"],
        message:
          "the highest pressure must be greater than 0 (inside above outside): a shell under outside pressure alone needs a buckling check to the governing code, which this tool does not make; a vacuum part of a cycle is taken (min_MPa below 0) and refers the check",
      });
    } else if (p.max_MPa !== undefined && p.max_MPa < FLOORS.pressure_MPa) {
      ctx.addIssue({
        code: "custom",
        path: ["max_MPa"],
        message: `the highest pressure must be at least ${FLOORS.pressure_MPa} MPa (1 Pa)`,
      });
    }
    const top = p.max_MPa ?? Infinity;
    if (p.min_MPa !== undefined && p.min_MPa > top)
      ctx.addIssue({ code: "custom", path: ["min_MPa"], message: "the lowest pressure must not exceed the highest" });
    if ((p.history_MPa || p.blocks) && p.min_MPa !== undefined) {
      ctx.addIssue({
        code: "custom",
        path: ["min_MPa"],
        message: "min_MPa applies only to a single cycle; a history or blocks carry their own minima",
      });
    }
    if (p.gate_MPa !== undefined && !p.history_MPa) {
      ctx.addIssue({
        code: "custom",
        path: ["gate_MPa"],
        message: "the hysteresis gate filters a pressure history; give history_MPa with it",
      });
    }
    if (p.history_MPa && p.history_MPa.length < 2) {
      ctx.addIssue({ code: "custom", path: ["history_MPa"], message: "the pressure history needs at least two points to make a cycle" });
    }
    const historyTop = p.history_MPa && p.history_MPa.length >= 2 ? Math.max(...sampleMax(p.history_MPa)) : undefined;
    if (historyTop !== undefined && historyTop <= 0) {
      ctx.addIssue({
        code: "custom",
        path: ["history_MPa"],
        message: "the pressure history never rises above 0: the shell is never pressurized",
      });
    } else if (historyTop !== undefined && historyTop < FLOORS.pressure_MPa) {
      ctx.addIssue({
        code: "custom",
        path: ["history_MPa"],
        message: `the pressure history never reaches ${FLOORS.pressure_MPa} MPa (1 Pa): the shell is hardly pressurized`,
      });
    }
    if (p.blocks?.every((b) => b.max_MPa <= 0)) {
      ctx.addIssue({ code: "custom", path: ["blocks"], message: "no block rises above 0 MPa: the shell is never pressurized" });
    } else if (p.blocks?.every((b) => b.max_MPa < FLOORS.pressure_MPa)) {
      ctx.addIssue({
        code: "custom",
        path: ["blocks"],
        message: `no block reaches ${FLOORS.pressure_MPa} MPa (1 Pa): the shell is hardly pressurized`,
      });
    }
  });

/** Largest value without spreading a million-element array into Math.max's arguments. */
function sampleMax(xs: number[]): [number] {
  let m = -Infinity;
  for (const x of xs) if (x > m) m = x;
  return [m];
}

const coordinate = (what: string) =>
  num(what)
    .min(-1e5, { error: `${what} must be within ±100 000 mm` })
    .max(1e5, { error: `${what} must be within ±100 000 mm` });

/** Small holes near the opening (rivets, bolts), centres from the opening's centre. */
export const fastenersSchema = z
  .array(
    z.strictObject({
      hoop_mm: coordinate("the fastener's offset along the hoop"),
      axial_mm: coordinate("the fastener's offset along the axis"),
      radius_mm: positive("the fastener hole radius", 1e3, FLOORS.length),
    }),
    { error: "fasteners must be a list of { hoop_mm, axial_mm, radius_mm }" },
  )
  .max(200, { error: "at most 200 fastener holes" })
  .describe("Fastener holes round the opening, centres relative to the opening's centre (mm)");

/** Area added round the opening (ring, frame, pad) and its radial width. */
export const reinforcementSchema = z
  .strictObject({
    area_mm2: positive("the reinforcement area", 1e7, { min: 1e-6, words: "0.000001 mm²" }),
    width_mm: positive("the reinforcement width", 1e4, FLOORS.length),
  })
  .describe("Reinforcement round the opening: cross-section area added (mm²) and its radial width (mm)");

const openingExtras = { fasteners: fastenersSchema.optional(), reinforcement: reinforcementSchema.optional() };

const outlinePoint = z.tuple([coordinate("an outline point's hoop coordinate"), coordinate("an outline point's axial coordinate")], {
  error: "each outline point is [hoop_mm, axial_mm]",
});

export const cutoutSchema = z.discriminatedUnion(
  "kind",
  [
    z.strictObject({ kind: z.literal("none"), fasteners: fastenersSchema.optional() }),
    z.strictObject({
      kind: z.literal("circular-hole"),
      radius_mm: positive("the hole radius", 1e4, FLOORS.length)
        .optional()
        .describe("Needed for notch sensitivity from the root radius, the curvature check, fasteners and reinforcement"),
      ...openingExtras,
    }),
    z.strictObject({
      kind: z.literal("elliptical-hole"),
      halfAxisAlongHoop_mm: positive("the half-axis along the hoop direction", 1e4, FLOORS.length),
      halfAxisAlongAxial_mm: positive("the half-axis along the axial direction", 1e4, FLOORS.length),
      ...openingExtras,
    }),
    z.strictObject({
      kind: z.literal("rounded-rectangle"),
      halfWidthAlongHoop_mm: positive("the half-width along the hoop direction", 1e4, FLOORS.length),
      halfLengthAlongAxial_mm: positive("the half-length along the axial direction", 1e4, FLOORS.length),
      cornerRadius_mm: positive("the corner radius", 1e4, FLOORS.length).describe(
        "Radius of the corners; at most the smaller half-dimension (equal to both: a circle)",
      ),
      ...openingExtras,
    }),
    z.strictObject({
      kind: z.literal("outline"),
      points_mm: z
        .array(outlinePoint, { error: "points_mm must be a list of [hoop_mm, axial_mm] points" })
        .min(6, { error: "an outline needs at least 6 points round the opening" })
        .max(400, { error: "an outline takes at most 400 points" })
        .describe("Closed outline, points in order round the opening, centred on it; smoothed by a periodic spline"),
      ...openingExtras,
    }),
    z.strictObject({
      kind: z.literal("given"),
      kt: num("Kt").min(1, { error: "Kt must be at least 1" }).max(20, { error: "Kt must be at most 20" }),
      rootRadius_mm: positive("the notch root radius", 1e4, FLOORS.length).optional(),
      basis: text("the basis of Kt", 500).optional().describe("Where the given Kt comes from (chart, FE model, test)"),
    }),
  ],
  {
    error: 'cutout kind must be "none", "circular-hole", "elliptical-hole", "rounded-rectangle", "outline" or "given"',
  },
);

const couponSchema = z.strictObject({
  amplitude_MPa: positive("the coupon stress amplitude", 1e4, FLOORS.strength),
  life_cycles: positive("the coupon life", 1e12, FLOORS.cycles),
  runout: z.boolean({ error: "runout must be true or false" }).default(false),
});

export const materialSchema = z.strictObject({
  id: text("the material id", 100).optional().describe("A library material; values given beside it override the library's"),
  name: text("the material name", 200).optional(),
  family: z.enum(MATERIAL_FAMILIES, { error: `family must be one of ${MATERIAL_FAMILIES.join(", ")}` }).optional(),
  ultimate_MPa: positive("the ultimate strength", 1e4, FLOORS.strength).optional(),
  yield_MPa: positive("the yield strength", 1e4, FLOORS.strength).optional(),
  modulus_MPa: positive("the elastic modulus", 1e7, FLOORS.strength).optional(),
  fatigueStrengthCoefficient_MPa: positive("the fatigue strength coefficient σ'f", 1e5, FLOORS.strength).optional(),
  fatigueStrengthExponent: num("the Basquin exponent b")
    .lt(0, { error: "the Basquin exponent b must be negative (strength falls as life rises); typical values lie between −0.05 and −0.15" })
    .gt(-1, { error: "the Basquin exponent b must be above −1" })
    .refine((b) => b >= 0 || b <= -0.01, {
      error: "the Basquin exponent b must be −0.01 or below; typical values lie between −0.05 and −0.15",
    })
    .optional(),
  enduranceLimit_MPa: positive("the endurance limit", 1e4, FLOORS.strength).optional(),
  toughness_MPaSqrtM: positive("the fracture toughness", 1e4, FLOORS.toughness).optional(),
  parisC: positive("the Paris coefficient C", 1, FLOORS.parisC).optional(),
  parisM: num("the Paris exponent m")
    .min(1, { error: "the Paris exponent m must be between 1 and 10" })
    .max(10, { error: "the Paris exponent m must be between 1 and 10" })
    .optional(),
  coupons: z.array(couponSchema, { error: "coupons must be a list" }).max(10000, { error: "at most 10 000 coupons" }).optional(),
  source: text("the material source", 500).optional(),
});

export const fatigueSchema = z
  .strictObject({
    meanStress: z.enum(MEAN_STRESS_CRITERIA, { error: `meanStress must be one of ${MEAN_STRESS_CRITERIA.join(", ")}` }).default("goodman"),
    walkerGamma: num("the Walker exponent γ")
      .gt(0, { error: "the Walker exponent γ must be above 0" })
      .max(1, { error: "the Walker exponent γ must be at most 1" })
      .default(0.5),
    notchSensitivity: num("the notch sensitivity q")
      .min(0, { error: "the notch sensitivity q must be between 0 and 1" })
      .max(1, { error: "the notch sensitivity q must be between 0 and 1" })
      .optional(),
    notchConstant: z.enum(["peterson", "neuber"], { error: 'notchConstant must be "peterson" or "neuber"' }).optional(),
    designLife_cycles: positive("the design life", 1e12, FLOORS.cycles),
    scatterFactor: num("the scatter factor")
      .min(1, { error: "the scatter factor must be at least 1" })
      .max(100, { error: "the scatter factor must be at most 100" })
      .default(1),
    curve: z
      .enum(FATIGUE_CURVES, { error: `curve must be one of ${FATIGUE_CURVES.join(", ")}` })
      .optional()
      .describe(
        "basquin (the material curve), welded (EN 1993-1-9), en13445-welded or en13445-unwelded; the default follows shell.service",
      ),
    detailCategory_MPa: positive("the detail category", 1000, FLOORS.strength).optional(),
    weldDetail: z
      .enum(WELD_DETAILS, { error: `weldDetail must be one of ${WELD_DETAILS.join(", ")}` })
      .optional()
      .describe("A weld detail of the picker; it sets the class unless detailCategory_MPa is given"),
    temperature_C: num("the fatigue temperature")
      .min(-200, { error: "the fatigue temperature must be at least −200 °C" })
      .max(600, { error: "the fatigue temperature must be at most 600 °C" })
      .optional()
      .describe("T* = 0.75·T_max + 0.25·T_min of the cycle, for the temperature correction of the vessel curves (default 20 °C)"),
    roughnessRz_um: positive("the surface roughness Rz", 1000)
      .optional()
      .describe("Peak-to-valley roughness Rz in µm for the unwelded vessel curve (default 200 µm, as-rolled plate)"),
    gammaMf: num("the partial factor γMf")
      .min(1, { error: "γMf must be at least 1" })
      .max(2, { error: "γMf must be at most 2" })
      .default(1),
    localYield: z.enum(["elastic", "shakedown"], { error: 'localYield must be "elastic" or "shakedown"' }).default("elastic"),
    belowEnduranceLimit: z
      .enum(["haibach", "elementary"], { error: 'belowEnduranceLimit must be "haibach" or "elementary"' })
      .default("haibach")
      .describe("Spectra: how the S-N curve continues below the endurance limit (Haibach slope 2m − 1, or elementary Miner slope m)"),
    modifiers: z
      .strictObject({
        surface: z.enum(SURFACE_FINISHES, { error: `surface must be one of ${SURFACE_FINISHES.join(", ")}` }).optional(),
        reliability: num("the reliability")
          .min(0.5, { error: "the reliability factor needs a reliability between 0.5 and 0.9999" })
          .max(0.9999, { error: "the reliability factor needs a reliability between 0.5 and 0.9999" })
          .optional(),
        sizeDiameter_mm: num("the effective size")
          .min(2.79, { error: "the size factor is published for 2.79 to 254 mm" })
          .max(254, { error: "the size factor is published for 2.79 to 254 mm" })
          .optional(),
      })
      .optional(),
  })
  .superRefine((f, ctx) => {
    if (f.notchSensitivity !== undefined && f.notchConstant !== undefined) {
      ctx.addIssue({ code: "custom", path: ["notchConstant"], message: "give either notchSensitivity or notchConstant, not both" });
    }
    if (f.curve === "welded" && f.detailCategory_MPa === undefined) {
      ctx.addIssue({
        code: "custom",
        path: ["detailCategory_MPa"],
        message: "a welded curve needs its detail category (stress range at 2 million cycles, MPa)",
      });
    }
    if (f.weldDetail !== undefined && f.curve !== undefined && f.curve !== "en13445-welded") {
      ctx.addIssue({
        code: "custom",
        path: ["weldDetail"],
        message: 'a weld detail picks a class of the EN 13445-3 welded curves: choose curve "en13445-welded" or leave the detail out',
      });
    }
  });

/** Inspection methods with a typical detectable crack size (typical values: verify against a qualified procedure). */
export const INSPECTION_METHODS = ["bolt-hole-eddy-current", "surface-eddy-current", "detailed-visual", "general-visual"] as const;
export const CRACK_ORIENTATIONS = ["axial", "circumferential", "both"] as const;

export const crackSchema = z
  .strictObject({
    geometry: z.enum(["center-through", "edge-through", "hole-through"], {
      error: 'crack geometry must be "center-through", "edge-through" or "hole-through"',
    }),
    initial_mm: positive("the initial crack size", 1e4, FLOORS.length).describe(
      "The flaw assumed at the start of service: sets the inspection threshold",
    ),
    detectable_mm: positive("the detectable crack size", 1e4, FLOORS.length)
      .optional()
      .describe("The crack an inspection finds reliably: sets the repeat interval"),
    detectableBy: z
      .enum(INSPECTION_METHODS, { error: `detectableBy must be one of ${INSPECTION_METHODS.join(", ")}` })
      .optional()
      .describe("Take the detectable size as the typical value of an inspection method (typical: verify against a qualified procedure)"),
    width_mm: positive("the panel width", 1e5, FLOORS.length).meta({ symbol: "W" }).optional(),
    holeRadius_mm: positive("the hole radius", 1e4, FLOORS.length).meta({ symbol: "R" }).optional(),
    cracksAtHole: z
      .union([z.literal(1), z.literal(2)], { error: "cracksAtHole must be 1 or 2" })
      .default(2)
      .describe("2 (default) is conservative"),
    orientation: z
      .enum(CRACK_ORIENTATIONS, { error: 'crack orientation must be "axial", "circumferential" or "both"' })
      .optional()
      .describe('Default "both" when an axial extra stress is given, "axial" otherwise'),
    openingDistance_mm: positive("the distance from the fastener hole to the opening", 1e4, FLOORS.length)
      .optional()
      .describe(
        "Centre of a fastener hole (of holeRadius_mm) to the opening's edge, on the opening's axial centre line; the crack grows toward the opening. For one of the cutout's own holes use fastener",
      ),
    fastener: num("the fastener hole the crack grows from")
      .int({ error: "crack.fastener must be a whole number: the place of the hole in cutout.fasteners, counting from 1" })
      .min(1, { error: "crack.fastener counts the holes of cutout.fasteners from 1" })
      .max(200, { error: "crack.fastener must be at most 200, the most fastener holes a cutout takes" })
      .optional()
      .describe(
        "The fastener hole of cutout.fasteners the crack grows from (1 = the first): it grows straight to the nearest point of the opening's edge",
      ),
    inspectionFactor: num("the inspection factor")
      .min(1, { error: "the inspection factor must be at least 1" })
      .max(100, { error: "the inspection factor must be at most 100" })
      .default(2),
    minimumInterval_cycles: positive("the shortest practical inspection interval", 1e12, FLOORS.cycles)
      .optional()
      .describe("A repeat interval shorter than this fails the crack check"),
    leakBeforeBreak: z
      .enum(["inform", "decide"], { error: 'leakBeforeBreak must be "inform" or "decide"' })
      .default("inform")
      .describe('"decide": a vessel that leaks before it breaks passes the crack check without inspections'),
    bulging: z.boolean({ error: "bulging must be true or false" }).default(true).describe("Off is unconservative and warns"),
    walkerGamma: num("the crack-growth Walker exponent")
      .gt(0, { error: "the crack-growth Walker exponent must be above 0" })
      .max(1, { error: "the crack-growth Walker exponent must be at most 1" })
      .optional(),
  })
  .superRefine((c, ctx) => {
    if (c.detectable_mm !== undefined && c.detectableBy !== undefined)
      ctx.addIssue({ code: "custom", path: ["detectableBy"], message: "give either detectable_mm or detectableBy, not both" });
    if (c.openingDistance_mm !== undefined && c.geometry !== "hole-through")
      ctx.addIssue({
        code: "custom",
        path: ["openingDistance_mm"],
        message: 'a crack growing toward an opening starts at a fastener hole: choose the "hole-through" geometry',
      });
    if (c.fastener !== undefined && c.openingDistance_mm !== undefined)
      ctx.addIssue({
        code: "custom",
        path: ["fastener"],
        message:
          "give either crack.fastener (a hole of cutout.fasteners) or crack.openingDistance_mm (a hole on the opening's axial centre line), not both",
      });
    if (c.fastener !== undefined && c.geometry !== "hole-through")
      ctx.addIssue({
        code: "custom",
        path: ["fastener"],
        message: 'a crack from a fastener hole starts at that hole: choose the "hole-through" geometry',
      });
    if (c.openingDistance_mm !== undefined && c.holeRadius_mm !== undefined && c.openingDistance_mm <= c.holeRadius_mm)
      ctx.addIssue({
        code: "custom",
        path: ["openingDistance_mm"],
        message: "the fastener hole's centre must lie farther from the opening than its radius, or the hole cuts into the opening",
      });
  });

export const fleetSchema = z.strictObject({
  size: num("the fleet size")
    .int({ error: "the fleet size must be a whole number" })
    .min(1, { error: "the fleet size must be at least 1" })
    .max(1e7, { error: "the fleet size must be at most 10 000 000" }),
  logStdDev: positive("the fleet's log standard deviation of life", 5)
    .optional()
    .describe("Scatter of log10 life; needed only without test evidence"),
});

export const evidenceSchema = z.strictObject({
  lives_cycles: z
    .array(positive("each test life", 1e12, FLOORS.cycles), { error: "the test lives must be a list of numbers" })
    .min(1, { error: "give at least one test life" })
    .max(10000, { error: "at most 10 000 test lives" }),
  reliability: fraction("the reliability").default(0.9),
  confidence: fraction("the confidence").default(0.95),
  assumedLogStdDev: positive("the assumed log standard deviation", 5).optional(),
});

export const displaySchema = z.strictObject({
  length: z.enum(LENGTH_UNITS, { error: `length unit must be ${LENGTH_UNITS.map((u) => `"${u}"`).join(" or ")}` }).default("mm"),
  stress: z.enum(STRESS_UNITS, { error: `stress unit must be one of ${STRESS_UNITS.join(", ")}` }).default("MPa"),
  pressure: z.enum(PRESSURE_UNITS, { error: `pressure unit must be one of ${PRESSURE_UNITS.join(", ")}` }).default("MPa"),
  altitude: z.enum(ALTITUDE_UNITS, { error: `altitude unit must be ${ALTITUDE_UNITS.map((u) => `"${u}"`).join(" or ")}` }).default("m"),
});

export const checkSchema = z.strictObject({
  format: z.literal("hoopwise.check/1", { error: 'format must be "hoopwise.check/1"' }),
  title: text("the title", 300).optional(),
  project: text("the project", 300).optional(),
  calcNumber: text("the calculation number", 100).optional(),
  notes: text("the notes", 5000).optional(),
  display: displaySchema.optional().describe("The units the user reads and types in; the check itself is always SI"),
  shell: shellSchema,
  pressure: pressureSchema,
  axialExtra: z
    .strictObject({
      max_MPa: signedStress("the extra axial stress at the highest pressure").default(0),
      min_MPa: signedStress("the extra axial stress at the lowest pressure").default(0),
    })
    .optional(),
  cutout: cutoutSchema.default({ kind: "none" }),
  material: materialSchema,
  fatigue: fatigueSchema,
  static: z
    .strictObject({
      basis: z
        .enum(STATIC_BASES, { error: `the static basis must be one of ${STATIC_BASES.join(", ")}` })
        .optional()
        .describe("en13445-3, asme-viii-1, aircraft or yield; the default follows shell.service"),
      yieldFactor: num("the yield factor")
        .min(1, { error: "the yield factor must be at least 1" })
        .max(10, { error: "the yield factor must be at most 10" })
        .default(1.5),
      allowableStress_MPa: positive("the allowable stress", 1e4, FLOORS.strength)
        .optional()
        .describe("The code's nominal design stress f or allowable stress S, when the user has it from the code's tables"),
      jointEfficiency: num("the joint efficiency")
        .gt(0, { error: "the joint efficiency must be above 0 and at most 1" })
        .max(1, { error: "the joint efficiency must be above 0 and at most 1" })
        .optional()
        .describe("Weld joint coefficient z (EN 13445-3) or joint efficiency E (ASME VIII-1)"),
      corrosionAllowance_mm: nonNegative("the corrosion allowance", 100).meta({ symbol: "c" }).optional(),
      thicknessTolerance_mm: nonNegative("the minus tolerance", 100)
        .meta({ symbol: "δ" })
        .optional()
        .describe("The plate's minus tolerance"),
      minimumGauge_mm: nonNegative("the minimum gauge", 1000)
        .optional()
        .describe("Least wall, exclusive of the corrosion allowance; the solved wall is never below it plus the allowance"),
      limitFactor: num("the limit pressure factor")
        .min(1, { error: "the limit pressure factor must be at least 1" })
        .max(5, { error: "the limit pressure factor must be at most 5" })
        .optional(),
      ultimateFactor: num("the ultimate factor")
        .min(1, { error: "the ultimate factor must be at least 1" })
        .max(5, { error: "the ultimate factor must be at most 5" })
        .optional(),
    })
    .optional(),
  crack: crackSchema.optional(),
  evidence: evidenceSchema.optional(),
  fleet: fleetSchema.optional(),
  solve: z
    .strictObject({
      for: z.enum(["thickness", "pressure"], { error: 'solve for "thickness" or "pressure"' }),
      gauges: z
        .enum(GAUGE_LISTS, { error: `gauges must be one of ${GAUGE_LISTS.join(", ")}` })
        .optional()
        .describe(
          "Thicknesses a solved wall is rounded up to: aircraft sheet gauges or vessel plate thicknesses (default by service, else by material family)",
        ),
      gauges_mm: z
        .array(positive("each gauge", 1e4, FLOORS.length), { error: "gauges_mm must be a list of thicknesses in mm" })
        .min(1, { error: "give at least one gauge" })
        .max(1000, { error: "at most 1000 gauges" })
        .optional()
        .describe("Your own list of available thicknesses (mm); a solved wall is rounded up to the next one"),
      step_mm: positive("the thickness step", 1e3, FLOORS.length)
        .optional()
        .describe("Round a solved wall up to the next multiple of this step (mm)"),
    })
    .superRefine((s, ctx) => {
      const given = [s.gauges !== undefined, s.gauges_mm !== undefined, s.step_mm !== undefined].filter(Boolean).length;
      if (given > 1)
        ctx.addIssue({ code: "custom", path: ["gauges"], message: "give one way of rounding the thickness: gauges, gauges_mm or step_mm" });
    })
    .optional(),
});

export type CheckDocument = z.input<typeof checkSchema>;
export type ParsedCheck = z.output<typeof checkSchema>;
export type MeanStressCriterion = (typeof MEAN_STRESS_CRITERIA)[number];
export type SurfaceFinish = (typeof SURFACE_FINISHES)[number];
export type MaterialFamily = (typeof MATERIAL_FAMILIES)[number];
export type GaugeList = (typeof GAUGE_LISTS)[number];
export * from "./service.ts";
