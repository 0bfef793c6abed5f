import type { Quantity } from "../../src/schema/units.ts";

/**
 * The form's number fields: each field's name on the page, where its value lands in the check
 * document, and what it measures (so it is shown and read in the chosen units).
 * The names carry no unit because the unit follows the user's choice.
 */
export interface NumberField {
  path: string;
  quantity: Quantity;
}

export const NUMBER_FIELDS = {
  "shell.radius": { path: "shell.radius_mm", quantity: "length" },
  "shell.thickness": { path: "shell.thickness_mm", quantity: "length" },
  "pressure.max": { path: "pressure.max_MPa", quantity: "pressure" },
  "pressure.min": { path: "pressure.min_MPa", quantity: "pressure" },
  "altitude.flight": { path: "pressure.fromAltitude.flight_m", quantity: "altitude" },
  "altitude.cabin": { path: "pressure.fromAltitude.cabin_m", quantity: "altitude" },
  "altitude.min": { path: "pressure.min_MPa", quantity: "pressure" },
  "axial.max": { path: "axialExtra.max_MPa", quantity: "stress" },
  "axial.min": { path: "axialExtra.min_MPa", quantity: "stress" },
  "circle.radius": { path: "cutout.radius_mm", quantity: "length" },
  "ellipse.hoop": { path: "cutout.halfAxisAlongHoop_mm", quantity: "length" },
  "ellipse.axial": { path: "cutout.halfAxisAlongAxial_mm", quantity: "length" },
  "rect.hoop": { path: "cutout.halfWidthAlongHoop_mm", quantity: "length" },
  "rect.axial": { path: "cutout.halfLengthAlongAxial_mm", quantity: "length" },
  "rect.corner": { path: "cutout.cornerRadius_mm", quantity: "length" },
  "given.kt": { path: "cutout.kt", quantity: "plain" },
  "given.rootRadius": { path: "cutout.rootRadius_mm", quantity: "length" },
  "material.ultimate": { path: "material.ultimate_MPa", quantity: "stress" },
  "material.yield": { path: "material.yield_MPa", quantity: "stress" },
  "material.modulus": { path: "material.modulus_MPa", quantity: "stress" },
  "material.sigmaF": { path: "material.fatigueStrengthCoefficient_MPa", quantity: "stress" },
  "material.b": { path: "material.fatigueStrengthExponent", quantity: "plain" },
  "material.endurance": { path: "material.enduranceLimit_MPa", quantity: "stress" },
  "material.toughness": { path: "material.toughness_MPaSqrtM", quantity: "toughness" },
  "material.parisC": { path: "material.parisC", quantity: "plain" },
  "material.parisM": { path: "material.parisM", quantity: "plain" },
  "fatigue.walkerGamma": { path: "fatigue.walkerGamma", quantity: "plain" },
  "fatigue.q": { path: "fatigue.notchSensitivity", quantity: "plain" },
  "fatigue.designLife": { path: "fatigue.designLife_cycles", quantity: "plain" },
  "fatigue.scatterFactor": { path: "fatigue.scatterFactor", quantity: "plain" },
  "fatigue.detailCategory": { path: "fatigue.detailCategory_MPa", quantity: "stress" },
  "fatigue.gammaMf": { path: "fatigue.gammaMf", quantity: "plain" },
  "fatigue.reliability": { path: "fatigue.modifiers.reliability", quantity: "plain" },
  "fatigue.size": { path: "fatigue.modifiers.sizeDiameter_mm", quantity: "length" },
  "static.yieldFactor": { path: "static.yieldFactor", quantity: "plain" },
  "static.allowableStress": { path: "static.allowableStress_MPa", quantity: "stress" },
  "static.jointEfficiency": { path: "static.jointEfficiency", quantity: "plain" },
  "static.corrosionAllowance": { path: "static.corrosionAllowance_mm", quantity: "length" },
  "static.thicknessTolerance": { path: "static.thicknessTolerance_mm", quantity: "length" },
  "static.minimumGauge": { path: "static.minimumGauge_mm", quantity: "length" },
  "static.limitFactor": { path: "static.limitFactor", quantity: "plain" },
  "static.ultimateFactor": { path: "static.ultimateFactor", quantity: "plain" },
  "fatigue.temperature": { path: "fatigue.temperature_C", quantity: "plain" },
  "fatigue.roughness": { path: "fatigue.roughnessRz_um", quantity: "plain" },
  "crack.initial": { path: "crack.initial_mm", quantity: "length" },
  "crack.width": { path: "crack.width_mm", quantity: "length" },
  "crack.holeRadius": { path: "crack.holeRadius_mm", quantity: "length" },
  "crack.inspectionFactor": { path: "crack.inspectionFactor", quantity: "plain" },
  "crack.detectable": { path: "crack.detectable_mm", quantity: "length" },
  "crack.openingDistance": { path: "crack.openingDistance_mm", quantity: "length" },
  "crack.minimumInterval": { path: "crack.minimumInterval_cycles", quantity: "plain" },
  "fleet.size": { path: "fleet.size", quantity: "plain" },
  "fleet.logStdDev": { path: "fleet.logStdDev", quantity: "plain" },
  "evidence.reliability": { path: "evidence.reliability", quantity: "plain" },
  "evidence.confidence": { path: "evidence.confidence", quantity: "plain" },
  "evidence.logStdDev": { path: "evidence.assumedLogStdDev", quantity: "plain" },
} as const satisfies Record<string, NumberField>;

export type NumberFieldName = keyof typeof NUMBER_FIELDS;

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
