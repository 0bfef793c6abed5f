import { inputAt } from "../../src/schema/inputs.ts";
import type { Quantity } from "../../src/schema/units.ts";

/**
 * The form's number fields: each field's name on the page and where its value lands in the check
 * document; what it measures (so it is shown and read in the chosen units) and its label come
 * from the format's registry (src/schema/inputs.ts). The names carry no unit because the unit
 * follows the user's choice.
 */
export interface NumberField {
  path: string;
  /** What it measures, from the format's registry (the unit in the key's name). */
  quantity: Quantity;
  /** The label the sheet shows too, from the schema's words for it. */
  label: string;
}

/** Each number field's name on the page and where its value lands in the check document. */
const FIELD_PATHS = {
  "shell.radius": "shell.radius_mm",
  "shell.thickness": "shell.thickness_mm",
  "pressure.max": "pressure.max_MPa",
  "pressure.min": "pressure.min_MPa",
  "altitude.flight": "pressure.fromAltitude.flight_m",
  "altitude.cabin": "pressure.fromAltitude.cabin_m",
  "altitude.min": "pressure.min_MPa",
  "axial.max": "axialExtra.max_MPa",
  "axial.min": "axialExtra.min_MPa",
  "circle.radius": "cutout.radius_mm",
  "ellipse.hoop": "cutout.halfAxisAlongHoop_mm",
  "ellipse.axial": "cutout.halfAxisAlongAxial_mm",
  "rect.hoop": "cutout.halfWidthAlongHoop_mm",
  "rect.axial": "cutout.halfLengthAlongAxial_mm",
  "rect.corner": "cutout.cornerRadius_mm",
  "given.kt": "cutout.kt",
  "given.rootRadius": "cutout.rootRadius_mm",
  "material.ultimate": "material.ultimate_MPa",
  "material.yield": "material.yield_MPa",
  "material.modulus": "material.modulus_MPa",
  "material.sigmaF": "material.fatigueStrengthCoefficient_MPa",
  "material.b": "material.fatigueStrengthExponent",
  "material.endurance": "material.enduranceLimit_MPa",
  "material.toughness": "material.toughness_MPaSqrtM",
  "material.parisC": "material.parisC",
  "material.parisM": "material.parisM",
  "fatigue.walkerGamma": "fatigue.walkerGamma",
  "fatigue.q": "fatigue.notchSensitivity",
  "fatigue.designLife": "fatigue.designLife_cycles",
  "fatigue.scatterFactor": "fatigue.scatterFactor",
  "fatigue.detailCategory": "fatigue.detailCategory_MPa",
  "fatigue.gammaMf": "fatigue.gammaMf",
  "fatigue.reliability": "fatigue.modifiers.reliability",
  "fatigue.size": "fatigue.modifiers.sizeDiameter_mm",
  "static.yieldFactor": "static.yieldFactor",
  "static.allowableStress": "static.allowableStress_MPa",
  "static.jointEfficiency": "static.jointEfficiency",
  "static.corrosionAllowance": "static.corrosionAllowance_mm",
  "static.thicknessTolerance": "static.thicknessTolerance_mm",
  "static.minimumGauge": "static.minimumGauge_mm",
  "static.limitFactor": "static.limitFactor",
  "static.ultimateFactor": "static.ultimateFactor",
  "fatigue.temperature": "fatigue.temperature_C",
  "fatigue.roughness": "fatigue.roughnessRz_um",
  "crack.initial": "crack.initial_mm",
  "crack.width": "crack.width_mm",
  "crack.holeRadius": "crack.holeRadius_mm",
  "crack.inspectionFactor": "crack.inspectionFactor",
  "crack.detectable": "crack.detectable_mm",
  "crack.openingDistance": "crack.openingDistance_mm",
  "crack.minimumInterval": "crack.minimumInterval_cycles",
  "fleet.size": "fleet.size",
  "fleet.logStdDev": "fleet.logStdDev",
  "evidence.reliability": "evidence.reliability",
  "evidence.confidence": "evidence.confidence",
  "evidence.logStdDev": "evidence.assumedLogStdDev",
} as const;

export type NumberFieldName = keyof typeof FIELD_PATHS;

export const NUMBER_FIELDS = Object.fromEntries(
  Object.entries(FIELD_PATHS).map(([name, path]) => {
    const input = inputAt(path);
    return [name, { path, quantity: input.quantity, label: input.label }];
  }),
) as Record<NumberFieldName, NumberField>;

/** Material values a library entry supplies; a blank field keeps the library's value. */
export const MATERIAL_VALUE_FIELDS = [
  "material.ultimate",
  "material.yield",
  "material.modulus",
  "material.sigmaF",
  "material.b",
  "material.endurance",
  "material.toughness",
  "material.parisC",
  "material.parisM",
] as const satisfies readonly NumberFieldName[];

/** Rows of the block table: `blocks.<row>.max` etc. */
export const BLOCK_COLUMNS = { max: "pressure", min: "pressure", cycles: "plain" } as const satisfies Record<string, Quantity>;
export type BlockColumn = keyof typeof BLOCK_COLUMNS;
export const blockField = (row: number, col: BlockColumn) => `blocks.${row}.${col}`;

/** Blank rows the block table offers beyond the filled ones. */
export const SPARE_BLOCK_ROWS = 2;

/** Field values as posted or as rendered: every value is the text in the field. */
export type FormValues = Record<string, string>;

/** The element id of a field and of its error slot; ids avoid dots so they work as CSS selectors unescaped. */
export const fieldId = (name: string) => `f-${name.replace(/\./g, "-")}`;
export const errorId = (name: string) => `e-${name.replace(/\./g, "-")}`;

/** Text and choice fields, each with an error slot beside it on the page. */
export const TEXT_FIELDS = [
  "title",
  "project",
  "calcNumber",
  "notes",
  "material.name",
  "given.basis",
  "history.text",
  "evidence.lives",
] as const;
export const CHOICE_FIELDS = [
  "units.length",
  "units.stress",
  "units.pressure",
  "units.altitude",
  "shell.service",
  "static.basis",
  "fatigue.weldDetail",
  "shell.form",
  "shell.radiusAt",
  "shell.theory",
  "pressure.mode",
  "cutout.kind",
  "material.id",
  "fatigue.meanStress",
  "fatigue.notch",
  "fatigue.curve",
  "fatigue.localYield",
  "fatigue.surface",
  "crack.geometry",
  "crack.cracksAtHole",
  "crack.detectableBy",
  "crack.orientation",
  "crack.leakBeforeBreak",
] as const;

/** The fields of a logger's file (pressure given as "a logger's file"); the gate is in the log's unit. */
export const LOG_FIELDS = ["log.file", "log.column", "log.unit", "log.decimal", "log.skip", "log.gate"] as const;

/** Every error slot the form shows for these block rows: a recalculation refreshes each, so an error put right disappears. */
export function errorSlotNames(rows: readonly number[]): string[] {
  const cells = rows.flatMap((r) => (Object.keys(BLOCK_COLUMNS) as BlockColumn[]).map((c) => blockField(r, c)));
  // "savedBy" sits with the save button, outside the form but posted with it.
  return [...TEXT_FIELDS, ...CHOICE_FIELDS, ...Object.keys(NUMBER_FIELDS), ...LOG_FIELDS, "blocks", "savedBy", ...cells];
}
