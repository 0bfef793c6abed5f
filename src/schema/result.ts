/**
 * @module schema/result
 * The result document, format "hoopwise.result/1", as a zod schema: the one definition of what a
 * check answers. The engine's `CheckResult` type is inferred from it, the CLI prints it as JSON
 * Schema (`schema --result`), and the tests parse every result they make against it strictly, so
 * a key the engine adds without a home here fails at once. Keys listed in the check format never
 * change meaning. Numbers are SI (MPa, mm, cycles); `null` stands where a quantity is unbounded
 * or undefined (an unlimited life, no reserve).
 */
import { z } from "zod";
import { MEAN_STRESS_CRITERIA } from "./check.ts";
import { FATIGUE_CURVES, SERVICES, STATIC_BASES, WELD_DETAILS } from "./service.ts";
import { QUANTITIES } from "./units.ts";

const num = z.number();
const nullableNum = z.number().nullable();
const orientation = z.enum(["axial", "circumferential"]);
const curvePoint = z.strictObject({ a_mm: num, n_cycles: num });

export const stepSchema = z.strictObject({
  id: z.string(),
  title: z.string(),
  /** The equation in symbols, e.g. "σθ = p·r/t". */
  equation: z.string(),
  /** The same equation with the numbers put in. */
  substituted: z.string(),
  /** null where the quantity is unbounded (an unlimited life). */
  value: nullableNum,
  unit: z.string(),
  /** Published source: handbook, standard or textbook with table or equation number where known. */
  source: z.string(),
});

/**
 * The sections of the calculation, in the order the sheet prints them and a checker redoes them;
 * the engine decides which section each step belongs to (src/engine/sections.ts).
 */
export const SECTION_HEADINGS = [
  "Load",
  "Membrane stresses",
  "Static strength",
  "Stress concentration at the opening",
  "Local stresses at the notch",
  "S-N curve from the coupons",
  "Fatigue life",
  "Crack growth",
  "Test evidence",
  "Fleet view",
  "Solution",
] as const;

export const sectionSchema = z.strictObject({ heading: z.enum(SECTION_HEADINGS), steps: z.number().int().nonnegative() });

export const VERDICTS = ["pass", "fail", "refer"] as const;
/** "refer": outside what this screening can judge, it needs an analysis beyond it. */
export const verdictSchema = z.enum(VERDICTS);
export const ROW_STATUSES = ["pass", "fail", "info", "refer"] as const;

/** A number in a sentence: its value in SI and what it measures, so a face can show it in the reader's units. */
export const phraseAmountSchema = z.strictObject({
  /** null where the amount is unbounded. */
  value: nullableNum,
  quantity: z.enum(QUANTITIES),
  digits: z.number().int().positive().optional(),
  /** Written without its unit, which the amount after it carries (the first end of a range: 150–330 MPa). */
  bare: z.literal(true).optional(),
});
export type PhraseAmount = z.infer<typeof phraseAmountSchema>;
/** A sentence in SI (`text`) and the same as words and amounts (`parts`). */
export const phraseSchema = z.strictObject({ text: z.string(), parts: z.array(z.union([z.string(), phraseAmountSchema])) });
export type Phrase = z.infer<typeof phraseSchema>;

export const verdictRowSchema = z.strictObject({
  id: z.string(),
  title: z.string(),
  status: z.enum(ROW_STATUSES),
  /** Plain-words statement of the demand against the capacity, in SI. */
  detail: z.string(),
  /** The same as words and amounts, for a face that shows other units. */
  detailParts: phraseSchema.shape.parts,
  /** Reserve: capacity / demand − 1 where it means something. */
  margin: nullableNum,
});

export const criterionRowSchema = z.strictObject({
  criterion: z.enum(MEAN_STRESS_CRITERIA),
  label: z.string(),
  equivalentAmplitude_MPa: nullableNum,
  life_cycles: nullableNum,
  allowableLife_cycles: nullableNum,
  damage: nullableNum,
  /** "no-answer": mean beyond the criterion's strength; "no-damage": never in tension. */
  status: z.enum(["ok", "no-answer", "no-damage", "unlimited"]),
  chosen: z.boolean(),
});

const openingPictureSchema = z.strictObject({
  /** Edge points [hoop_mm, axial_mm, arc length mm, edge stress per unit σθ]. */
  edge: z.array(z.tuple([num, num, num, num])),
  governing: z.strictObject({
    hoop_mm: num,
    axial_mm: num,
    kt: num,
    at: z.enum(["opening", "fastener"]),
    index: num.optional(),
  }),
  fasteners: z.array(z.strictObject({ hoop_mm: num, axial_mm: num, radius_mm: num, kt: num, solvedWithOpening: z.boolean() })),
  curvature: z.strictObject({ rho: num, beta: num, limit: num, within: z.boolean() }).nullable(),
});

const orientationResultSchema = z.strictObject({
  orientation,
  stressMax_MPa: num,
  range_MPa: num,
  critical_mm: num,
  criticalBy: z.string(),
  fad: z.strictObject({ Lr: num, Kr: num, LrMax: num, lefm_mm: num, collapse_mm: num }),
  cycles: nullableNum,
  threshold_cycles: nullableNum,
  repeatInterval_cycles: nullableNum,
  curve: z.array(curvePoint),
});

const crackSchema = z.strictObject({
  geometry: z.string(),
  /** The orientations asked for. */
  orientation: z.enum(["axial", "circumferential", "both"]),
  /** The orientation with the shorter life; critical_mm, cycles and curve are its. */
  governingOrientation: orientation,
  initial_mm: num,
  detectable_mm: nullableNum,
  critical_mm: num,
  /** "toughness" | "collapse" | "interaction" (failure assessment diagram) | "link-up" (the crack reaches an opening). */
  criticalBy: z.string(),
  /** null when the pressure does not cycle (no growth). */
  cycles: nullableNum,
  /** The repeat interval when a detectable size is given, else the threshold. */
  inspectionInterval_cycles: nullableNum,
  threshold_cycles: nullableNum,
  repeatInterval_cycles: nullableNum,
  minimumInterval_cycles: nullableNum,
  leakBeforeBreakDecides: z.boolean(),
  /** With a history or blocks: the same in passes of the spectrum. */
  passes: nullableNum.optional(),
  inspectionInterval_passes: nullableNum.optional(),
  threshold_passes: nullableNum.optional(),
  repeatInterval_passes: nullableNum.optional(),
  curve: z.array(curvePoint),
  /** A crack growing toward an opening: the same crack grown as if the stress along its path were uniform. */
  uniformCurve: z.array(curvePoint).optional(),
  uniformCycles: nullableNum.optional(),
  uniformCritical_mm: num.optional(),
  orientations: z.array(orientationResultSchema),
  leakBeforeBreak: z.strictObject({ leakBeforeBreak: z.boolean(), throughWallHalfLength_mm: num, criticalHalfLength_mm: num }).nullable(),
  /** A crack from one of the cutout's fastener holes (crack.fastener): its straight path to the opening, [hoop_mm, axial_mm] from the opening's centre. */
  path: z
    .strictObject({
      fastener: num,
      start_mm: z.tuple([num, num]),
      end_mm: z.tuple([num, num]),
      ligament_mm: num,
      angleFromAxis_deg: num,
    })
    .optional(),
});

const fleetSchema = z.strictObject({
  size: num,
  basis: z.enum(["test evidence", "computed life"]),
  logMean: num,
  logStdDev: num,
  median_cycles: num,
  /** Median life of the weakest of the fleet (first order statistic). */
  firstFailure_cycles: num,
  probabilityAnyFailsBeforeDesignLife: num,
  percentile5_cycles: num,
  probabilityOneFailsBeforeDesignLife: num,
  /** Densities per decade of life of one item's life and of the fleet's first failure, for the plot. */
  density: z.array(z.strictObject({ life_cycles: num, one: num, first: num })),
  statement: z.string(),
  designLife_cycles: num,
  testLives_cycles: z.array(num),
});

const evidenceSchema = z.strictObject({
  n: num,
  logMean: num,
  logStdDev: nullableNum,
  logStdDevFrom: z.enum(["sample", "assumed"]).nullable(),
  toleranceFactor: num,
  lowerBound_cycles: nullableNum,
  impliedScatterFactor: nullableNum,
  requiredLogStdDev: nullableNum,
  supportsDesignLife: z.boolean().nullable(),
  /** The design life the lives are compared with, in cycles (passes × cycles per pass for a spectrum). */
  designLife_cycles: num,
});

export const resultSchema = z.strictObject({
  format: z.literal("hoopwise.result/1"),
  engine: z.string(),
  fingerprint: z.string().regex(/^[0-9a-f]{64}$/),
  title: z.string().optional(),
  verdict: verdictSchema,
  /** The verdict in plain words. */
  verdictMeaning: z.string(),
  /** What governs, in words: the governing row's title and detail. */
  governs: z.string(),
  /** The same as a structure, so no face has to find the row by matching the sentence. */
  governing: z.strictObject({ rowId: z.string(), text: z.string(), parts: phraseSchema.shape.parts }),
  /** What the check was worked at, for the faces' plots and the picture of the shell. */
  workedAt: z.strictObject({
    form: z.enum(["cylinder", "sphere"]),
    thickness_mm: num,
    ultimate_MPa: num,
    yield_MPa: num,
    walkerGamma: num,
    /** The opening's outline round its centre, [hoop_mm, axial_mm]; null with no opening or only a given Kt. */
    outline: z.array(z.tuple([num, num])).nullable(),
    fasteners: z.array(z.strictObject({ hoop_mm: num, axial_mm: num, radius_mm: num })),
  }),
  load: z.strictObject({
    pressureMax_MPa: num,
    pressureMin_MPa: num,
    source: z.enum(["direct", "altitude", "history", "blocks"]),
  }),
  membrane: z.strictObject({
    theory: z.enum(["thin", "thick"]),
    theoryReason: z.string(),
    innerRadius_mm: num,
    meanRadius_mm: num,
    outerRadius_mm: num,
    hoopMax_MPa: num,
    hoopMin_MPa: num,
    axialMax_MPa: num,
    axialMin_MPa: num,
    radialMax_MPa: num,
    vonMisesMax_MPa: num,
  }),
  static: z.strictObject({
    basis: z.enum(STATIC_BASES),
    service: z.enum(SERVICES),
    yieldFactor: num,
    /** f (EN 13445-3), S (ASME VIII-1), Sy (aircraft, at limit) or Sy/n (yield). */
    allowable_MPa: num,
    vonMisesMax_MPa: num,
    /** Capacity over demand less 1: the wall over the formula's wall for the code bases, stresses otherwise. */
    margin: num,
    pass: z.boolean(),
    /** Why the static basis cannot judge the shell (refer), or null. */
    refer: z.string().nullable(),
    /** The same as words and amounts (a formula's range in the reader's units), or null. */
    referParts: phraseSchema.shape.parts.nullable(),
    /** Which check of the basis governs, in words. */
    governs: z.string(),
    jointEfficiency: num,
    corrosionAllowance_mm: num,
    thicknessTolerance_mm: num,
    minimumGauge_mm: num,
    /** Ordered wall less corrosion allowance and minus tolerance: the wall every stress is worked on. */
    analysisThickness_mm: num,
    /** The code formula's wall without allowances (code bases only). */
    formulaThickness_mm: nullableNum,
    /** The ordered wall the static basis alone asks for, allowances and gauge included. */
    requiredThickness_mm: nullableNum,
    limitFactor: nullableNum,
    ultimateFactor: nullableNum,
    /** The plain statement of what the basis's check is and is not. */
    statement: z.string().nullable(),
    /** Keys filled by a default of the service or basis, with the reason. */
    defaults: z.record(z.string(), z.string()),
  }),
  notch: z.strictObject({
    kt: num,
    ktGoverns: z.string(),
    biaxialRatio: num,
    q: num,
    kf: num,
    peakMax_MPa: num,
    peakMin_MPa: num,
    localYield: z.boolean(),
    /** Fastener holes in the order given, each Kt referred to the nominal hoop stress at maximum pressure. */
    fasteners: z
      .array(
        z.strictObject({
          kt: num,
          hoop_mm: num,
          axial_mm: num,
          radius_mm: num,
          ligament_mm: nullableNum,
          solvedWithOpening: z.boolean(),
          ktKirsch: num,
        }),
      )
      .optional(),
    /** The opening's edge stress and what governs, for its picture (per unit nominal hoop stress). */
    opening: openingPictureSchema.optional(),
    /** Plain-words reasons the opening is outside this screening's range. */
    refer: z.array(z.string()).optional(),
  }),
  fatigue: z.strictObject({
    criterion: z.enum(MEAN_STRESS_CRITERIA),
    curve: z.enum(FATIGUE_CURVES),
    amplitude_MPa: num,
    mean_MPa: num,
    equivalentAmplitude_MPa: nullableNum,
    life_cycles: nullableNum,
    allowableLife_cycles: nullableNum,
    designLife_cycles: num,
    scatterFactor: num,
    /** designLife / allowableLife; 0 where the life is unlimited, null where there is no life. */
    damage: nullableNum,
    /** "cycles" for a single cycle; "passes" when a history or block spectrum is repeated. */
    lifeCountedIn: z.enum(["cycles", "passes"]),
    modifyingFactor: num,
    curveUsed: z.strictObject({ fatigueStrengthCoefficient_MPa: num, fatigueStrengthExponent: num, enduranceLimit_MPa: nullableNum }),
    criteria: z.array(criterionRowSchema),
    pass: z.boolean(),
    /** The welded class or detail category in use (MPa at 2·10⁶ cycles), or null. */
    detailCategory_MPa: nullableNum,
    weldDetail: z.enum(WELD_DETAILS).nullable(),
    temperature_C: num,
    /** Keys filled by a default of the service, with the reason. */
    defaults: z.record(z.string(), z.string()),
    /** The largest cycle on a welded class curve (range after the route's corrections) for the S-N plot; null otherwise. */
    weldedPoint: z
      .strictObject({
        curveName: z.string(),
        class_MPa: num,
        range_MPa: num,
        life_cycles: nullableNum,
        variableAmplitude: z.boolean(),
      })
      .nullable(),
  }),
  crack: crackSchema.optional(),
  fleet: fleetSchema.optional(),
  evidence: evidenceSchema.optional(),
  materialFit: z
    .strictObject({
      fatigueStrengthCoefficient_MPa: num,
      fatigueStrengthExponent: num,
      n: num,
      runouts: num,
      logStdDev: num,
      rSquared: num,
      band: z.array(z.strictObject({ amplitude_MPa: num, lower_cycles: num, median_cycles: num, upper_cycles: num })),
    })
    .optional(),
  spectrum: z
    .strictObject({
      cycles: z.array(z.strictObject({ range_MPa: num, mean_MPa: num, count: num })),
      totalCycles: num,
      /** null when beyond what a double holds (no life). */
      damagePerPass: nullableNum,
      passesToFailure: nullableNum,
      historyPoints: num.optional(),
    })
    .optional(),
  solution: z
    .strictObject({
      /** The thickness to use: the solved minimum rounded up to the next available gauge. */
      thickness_mm: num.optional(),
      /** The solved minimum before rounding. */
      requiredThickness_mm: num.optional(),
      /** Which thicknesses it was rounded to, in words. */
      roundedTo: z.string().optional(),
      /** Fatigue damage and static margin at the rounded thickness. */
      damageAtThickness: nullableNum.optional(),
      staticMarginAtThickness: num.optional(),
      pressureMax_MPa: num.optional(),
      /** The check that binds at the solution. */
      governs: z.string(),
      iterations: num,
      evaluations: num,
    })
    .optional(),
  lifeVsThickness: z.array(z.strictObject({ thickness_mm: num, life_cycles: nullableNum })),
  verdictTable: z.array(verdictRowSchema),
  material: z.strictObject({ id: z.string().optional(), name: z.string(), source: z.string(), typical: z.boolean() }),
  /** The worked steps, in the order of the sheet's sections. */
  steps: z.array(stepSchema),
  /** The sections the steps fall into, in order: each heading and how many consecutive steps it holds. */
  sections: z.array(sectionSchema),
  /** Where a method was used near or past the edge of its range, or an assumption carries the answer; in SI. */
  warnings: z.array(z.string()),
  /** The same warnings as words and amounts, one parts list per warning in the same order, for a face in other units. */
  warningParts: z.array(phraseSchema.shape.parts),
});

export type ResultDocument = z.infer<typeof resultSchema>;
