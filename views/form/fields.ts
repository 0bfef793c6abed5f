import { defaultAt } from "../../src/schema/defaults.ts";
import { inputAt } from "../../src/schema/inputs.ts";
import type { Quantity } from "../../src/schema/units.ts";

/**
 * @module views/form/fields
 * The form's fields, once: each field's name on the page, the document path its value lands on,
 * its kind, and when it applies (the mode or choice that shows it). The form reader and writer
 * (src/web/form/read.ts, write.ts) walk this table; the page draws these names; a number
 * field's quantity (so it is shown and read in the chosen units) and its label come from the
 * format's registry (src/schema/inputs.ts). The names carry no unit because the unit follows the
 * user's choice. What is not a field here is a mode (how the pressure is given, how the notch is
 * treated, a section switched on) or a list, and has its own explicit code in the reader and
 * writer.
 */

/** Field values as posted or as rendered: every value is the text in the field. */
export type FormValues = Record<string, string>;

export type FieldKind = "number" | "text" | "choice";

export interface FieldSpec {
  /** Where the value lands in the check document. */
  path: string;
  kind: FieldKind;
  /** When the field applies, judged on the form's values (a mode or an earlier choice); always when absent. */
  when?: (v: FormValues) => boolean;
  /** A choice the document leaves out shows the schema's default, so the form re-posted unchanged is the same check. */
  showsDefault?: true;
  /** A choice whose options are numbers ("1", "2"): read back as a number. */
  numeric?: true;
}

/** A field's text, trimmed; undefined when blank. */
export const filled = (v: FormValues, name: string): string | undefined => {
  const t = (v[name] ?? "").trim();
  return t === "" ? undefined : t;
};
/** True when the named field holds one of the values (undefined stands for blank). */
const is =
  (name: string, ...values: (string | undefined)[]) =>
  (v: FormValues) =>
    values.includes(filled(v, name));
const on = (name: string) => (v: FormValues) => Boolean(v[name]);
const both =
  (...tests: ((v: FormValues) => boolean)[]) =>
  (v: FormValues) =>
    tests.every((t) => t(v));

const num = (path: string, when?: FieldSpec["when"]): FieldSpec & { kind: "number" } => ({
  path,
  kind: "number",
  ...(when ? { when } : {}),
});
const text = (path: string, when?: FieldSpec["when"]): FieldSpec & { kind: "text" } => ({ path, kind: "text", ...(when ? { when } : {}) });
const choice = (path: string, more: Omit<FieldSpec, "path" | "kind"> = {}): FieldSpec & { kind: "choice" } => ({
  path,
  kind: "choice",
  ...more,
});

const directPressure = (v: FormValues) => !["altitude", "history", "blocks"].includes(filled(v, "pressure.mode") ?? "");
const altitude = is("pressure.mode", "altitude");
const crackOn = on("crack.on");
const atHole = both(crackOn, is("crack.geometry", "hole-through"));
const curve = (v: FormValues) => filled(v, "fatigue.curve");

/**
 * Every field that maps to one place in the document, in the order they are read: a field's
 * `when` reads only fields above it.
 */
export const FORM_FIELDS = {
  title: text("title"),
  project: text("project"),
  calcNumber: text("calcNumber"),
  notes: text("notes"),
  "shell.form": choice("shell.form", { showsDefault: true }),
  "shell.radius": num("shell.radius_mm"),
  "shell.radiusAt": choice("shell.radiusAt", { showsDefault: true }),
  "shell.thickness": num("shell.thickness_mm"),
  "shell.theory": choice("shell.theory", { showsDefault: true }),
  "shell.service": choice("shell.service", { showsDefault: true }),
  "pressure.max": num("pressure.max_MPa", directPressure),
  "pressure.min": num("pressure.min_MPa", directPressure),
  "altitude.flight": num("pressure.fromAltitude.flight_m", altitude),
  "altitude.cabin": num("pressure.fromAltitude.cabin_m", altitude),
  "altitude.min": num("pressure.min_MPa", altitude),
  "cutout.kind": choice("cutout.kind"),
  "circle.radius": num("cutout.radius_mm", is("cutout.kind", "circular-hole")),
  "ellipse.hoop": num("cutout.halfAxisAlongHoop_mm", is("cutout.kind", "elliptical-hole")),
  "ellipse.axial": num("cutout.halfAxisAlongAxial_mm", is("cutout.kind", "elliptical-hole")),
  "rect.hoop": num("cutout.halfWidthAlongHoop_mm", is("cutout.kind", "rounded-rectangle")),
  "rect.axial": num("cutout.halfLengthAlongAxial_mm", is("cutout.kind", "rounded-rectangle")),
  "rect.corner": num("cutout.cornerRadius_mm", is("cutout.kind", "rounded-rectangle")),
  "given.kt": num("cutout.kt", is("cutout.kind", "given")),
  "given.rootRadius": num("cutout.rootRadius_mm", is("cutout.kind", "given")),
  "given.basis": text("cutout.basis", is("cutout.kind", "given")),
  "material.id": choice("material.id"),
  "material.name": text("material.name"),
  "material.ultimate": num("material.ultimate_MPa"),
  "material.yield": num("material.yield_MPa"),
  "material.modulus": num("material.modulus_MPa"),
  "material.sigmaF": num("material.fatigueStrengthCoefficient_MPa"),
  "material.b": num("material.fatigueStrengthExponent"),
  "material.endurance": num("material.enduranceLimit_MPa"),
  "material.toughness": num("material.toughness_MPaSqrtM"),
  "material.parisC": num("material.parisC"),
  "material.parisM": num("material.parisM"),
  "fatigue.meanStress": choice("fatigue.meanStress", { showsDefault: true }),
  "fatigue.walkerGamma": num("fatigue.walkerGamma", is("fatigue.meanStress", "walker")),
  "fatigue.q": num("fatigue.notchSensitivity", is("fatigue.notch", "q")),
  // The notch choice names the constant itself when it is one of the published ones.
  "fatigue.notch": choice("fatigue.notchConstant", { when: is("fatigue.notch", "peterson", "neuber") }),
  "fatigue.designLife": num("fatigue.designLife_cycles"),
  "fatigue.scatterFactor": num("fatigue.scatterFactor"),
  "fatigue.curve": choice("fatigue.curve", { showsDefault: true }),
  "fatigue.detailCategory": num("fatigue.detailCategory_MPa", is("fatigue.curve", "welded", "en13445-welded")),
  "fatigue.gammaMf": num("fatigue.gammaMf", is("fatigue.curve", "welded")),
  "fatigue.weldDetail": choice("fatigue.weldDetail", { when: is("fatigue.curve", "en13445-welded", undefined) }),
  "fatigue.temperature": num("fatigue.temperature_C", (v) => curve(v) === undefined || (curve(v) ?? "").startsWith("en13445")),
  "fatigue.roughness": num("fatigue.roughnessRz_um", is("fatigue.curve", "en13445-unwelded")),
  "fatigue.localYield": choice("fatigue.localYield", { showsDefault: true }),
  "fatigue.surface": choice("fatigue.modifiers.surface", { showsDefault: true }),
  "fatigue.reliability": num("fatigue.modifiers.reliability"),
  "fatigue.size": num("fatigue.modifiers.sizeDiameter_mm"),
  "axial.max": num("axialExtra.max_MPa"),
  "axial.min": num("axialExtra.min_MPa"),
  "static.basis": choice("static.basis"),
  "static.yieldFactor": num("static.yieldFactor"),
  "static.allowableStress": num("static.allowableStress_MPa"),
  "static.jointEfficiency": num("static.jointEfficiency"),
  "static.corrosionAllowance": num("static.corrosionAllowance_mm"),
  "static.thicknessTolerance": num("static.thicknessTolerance_mm"),
  "static.minimumGauge": num("static.minimumGauge_mm"),
  "static.limitFactor": num("static.limitFactor"),
  "static.ultimateFactor": num("static.ultimateFactor"),
  "crack.geometry": choice("crack.geometry", { when: crackOn, showsDefault: true }),
  "crack.initial": num("crack.initial_mm", crackOn),
  "crack.width": num("crack.width_mm", crackOn),
  "crack.holeRadius": num("crack.holeRadius_mm", atHole),
  "crack.cracksAtHole": choice("crack.cracksAtHole", { when: atHole, showsDefault: true, numeric: true }),
  "crack.inspectionFactor": num("crack.inspectionFactor", crackOn),
  "crack.detectable": num("crack.detectable_mm", crackOn),
  "crack.detectableBy": choice("crack.detectableBy", { when: crackOn, showsDefault: true }),
  "crack.orientation": choice("crack.orientation", { when: crackOn, showsDefault: true }),
  "crack.openingDistance": num("crack.openingDistance_mm", atHole),
  "crack.fastener": num("crack.fastener", atHole),
  "crack.minimumInterval": num("crack.minimumInterval_cycles", crackOn),
  "crack.leakBeforeBreak": choice("crack.leakBeforeBreak", { when: crackOn, showsDefault: true }),
  "fleet.size": num("fleet.size"),
  "fleet.logStdDev": num("fleet.logStdDev"),
  "evidence.reliability": num("evidence.reliability", on("evidence.on")),
  "evidence.confidence": num("evidence.confidence", on("evidence.on")),
  "evidence.logStdDev": num("evidence.assumedLogStdDev", on("evidence.on")),
} satisfies Record<string, FieldSpec>;

export type FieldName = keyof typeof FORM_FIELDS;

/**
 * The value a choice shows when the form holds none for it: the schema's default, so a section
 * switched on or a way of cracking picked afresh shows the choice the check will make.
 */
export function shownDefault(name: string): string | undefined {
  const f = (FORM_FIELDS as Record<string, FieldSpec>)[name];
  const d = f?.showsDefault ? defaultAt(f.path) : undefined;
  return d === undefined ? undefined : String(d);
}
type NumberNames<T> = { [K in keyof T]: T[K] extends { kind: "number" } ? K : never }[keyof T];
export type NumberFieldName = NumberNames<typeof FORM_FIELDS>;

export interface NumberField {
  path: string;
  /** What it measures, from the format's registry (the unit in the key's name). */
  quantity: Quantity;
  /** The label the sheet shows too, from the schema's words for it. */
  label: string;
}

/** The number fields, each with its quantity and label from the format's registry. */
export const NUMBER_FIELDS = Object.fromEntries(
  Object.entries(FORM_FIELDS as Record<string, FieldSpec>)
    .filter(([, f]) => f.kind === "number")
    .map(([name, f]) => {
      const input = inputAt(f.path);
      return [name, { path: f.path, quantity: input.quantity, label: input.label }];
    }),
) as Record<NumberFieldName, NumberField>;

/**
 * Sections of the document that the form leaves out when none of their fields is filled: they are
 * optional in the format, and an empty one would mean something else (a static basis given).
 */
export const OPTIONAL_SECTIONS = ["axialExtra", "static", "fleet", "fatigue.modifiers"] as const;

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

/** The element id of a field and of its error slot; ids avoid dots so they work as CSS selectors unescaped. */
export const fieldId = (name: string) => `f-${name.replace(/\./g, "-")}`;
export const errorId = (name: string) => `e-${name.replace(/\./g, "-")}`;

/** Fields of the form that are modes or lists, read and written by explicit code. */
const MODE_FIELDS = ["units.length", "units.stress", "units.pressure", "units.altitude", "pressure.mode", "history.text", "evidence.lives"];

/** Text and choice fields, each with an error slot beside it on the page. */
export const TEXT_AND_CHOICE_FIELDS: readonly string[] = [
  ...MODE_FIELDS,
  ...Object.entries(FORM_FIELDS as Record<string, FieldSpec>)
    .filter(([, f]) => f.kind !== "number")
    .map(([name]) => name),
];

/** The fields of a logger's file (pressure given as "a logger's file"); the gate is in the log's unit. */
export const LOG_FIELDS = ["log.file", "log.column", "log.unit", "log.decimal", "log.skip", "log.gate"] as const;

/** Every error slot the form shows for these block rows: a recalculation refreshes each, so an error put right disappears. */
export function errorSlotNames(rows: readonly number[]): string[] {
  const cells = rows.flatMap((r) => (Object.keys(BLOCK_COLUMNS) as BlockColumn[]).map((c) => blockField(r, c)));
  // "savedBy" sits with the save button, outside the form but posted with it.
  return [...TEXT_AND_CHOICE_FIELDS, ...Object.keys(NUMBER_FIELDS), ...LOG_FIELDS, "blocks", "savedBy", ...cells];
}
