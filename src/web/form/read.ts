import { BLOCK_COLUMNS, blockField, NUMBER_FIELDS, type FormValues, type NumberFieldName } from "../../../views/form/fields.ts";
import { parseNumber, parseNumberList } from "./lists.ts";
import { toSI, type Units } from "../../schema/units.ts";

/**
 * Form → check document. Numbers are read in the user's units and written in SI. Nothing is
 * judged here: a blank field is left out and a field that is not a number is passed on as its
 * text, so the schema gives the very messages the API gives ("is required", "… must be a
 * number"). Each field read is bound to its document path, so an error can be put beside it.
 */
export interface ReadForm {
  document: Record<string, unknown>;
  /** The form field an error at this document path belongs to (the deepest bound path that contains it). */
  fieldFor(path: string): string | undefined;
}

type Obj = Record<string, unknown>;

export function readForm(v: FormValues, units: Units): ReadForm {
  const bound = new Map<string, string>();
  const bind = (name: string, path: string) => bound.set(path, name);
  const text = (name: string) => {
    const t = (v[name] ?? "").trim();
    return t === "" ? undefined : t;
  };
  const number = (name: NumberFieldName) => {
    const f = NUMBER_FIELDS[name];
    bind(name, f.path);
    return numberIn(v[name], (x) => toSI(x, f.quantity, units));
  };
  const pick = (name: string, path: string) => {
    bind(name, path);
    return text(name);
  };
  const r: Readers = { number, pick, bind };

  const doc: Obj = {
    format: "hoopwise.check/1",
    title: pick("title", "title"),
    project: pick("project", "project"),
    calcNumber: pick("calcNumber", "calcNumber"),
    notes: pick("notes", "notes"),
    display: { ...units },
    shell: {
      form: pick("shell.form", "shell.form"),
      radius_mm: number("shell.radius"),
      radiusAt: pick("shell.radiusAt", "shell.radiusAt"),
      thickness_mm: number("shell.thickness"),
      theory: pick("shell.theory", "shell.theory"),
      service: pick("shell.service", "shell.service"),
    },
    pressure: readPressure(v, units, r),
    cutout: readCutout(r),
    material: readMaterial(r),
    fatigue: readFatigue(v, r),
  };
  bind("pressure.mode", "pressure");
  bind("cutout.kind", "cutout");

  const axial = { max_MPa: number("axial.max"), min_MPa: number("axial.min") };
  if (axial.max_MPa !== undefined || axial.min_MPa !== undefined) doc.axialExtra = axial;
  const stat = {
    basis: pick("static.basis", "static.basis"),
    yieldFactor: number("static.yieldFactor"),
    allowableStress_MPa: number("static.allowableStress"),
    jointEfficiency: number("static.jointEfficiency"),
    corrosionAllowance_mm: number("static.corrosionAllowance"),
    thicknessTolerance_mm: number("static.thicknessTolerance"),
    minimumGauge_mm: number("static.minimumGauge"),
    limitFactor: number("static.limitFactor"),
    ultimateFactor: number("static.ultimateFactor"),
  };
  if (Object.values(stat).some((x) => x !== undefined)) doc.static = stat;
  if (v["crack.on"]) doc.crack = readCrack(v, r);
  const fleetSize = number("fleet.size");
  if (fleetSize !== undefined || number("fleet.logStdDev") !== undefined)
    doc.fleet = { size: fleetSize, logStdDev: number("fleet.logStdDev") };
  if (v["evidence.on"]) {
    bind("evidence.lives", "evidence.lives_cycles");
    doc.evidence = {
      lives_cycles: parseNumberList(v["evidence.lives"] ?? ""),
      reliability: number("evidence.reliability"),
      confidence: number("evidence.confidence"),
      assumedLogStdDev: number("evidence.logStdDev"),
    };
  }

  return {
    document: prune(doc) as Obj,
    fieldFor(path) {
      for (let p = path; p !== ""; p = p.includes(".") ? p.slice(0, p.lastIndexOf(".")) : "") {
        const name = bound.get(p);
        if (name !== undefined) return name;
      }
      return undefined;
    },
  };
}

/** A typed number in SI, or the text itself when it is not a number (the schema words the error). */
function numberIn(raw: string | undefined, convert: (x: number) => number): number | string | undefined {
  const t = (raw ?? "").trim();
  if (t === "") return undefined;
  const x = parseNumber(t);
  return x === undefined ? t : convert(x);
}

interface Readers {
  /** A number field, in SI. */
  number(name: NumberFieldName): number | string | undefined;
  /** A text or choice field, trimmed; undefined when blank. */
  pick(name: string, path: string): string | undefined;
  bind(name: string, path: string): void;
}

function readPressure(v: FormValues, units: Units, r: Readers): Obj {
  switch (v["pressure.mode"]) {
    case "altitude":
      return {
        fromAltitude: { flight_m: r.number("altitude.flight"), cabin_m: r.number("altitude.cabin") },
        min_MPa: r.number("altitude.min"),
      };
    case "history": {
      r.bind("history.text", "pressure.history_MPa");
      const list = parseNumberList(v["history.text"] ?? "");
      return { history_MPa: list.map((x) => (typeof x === "number" ? toSI(x, "pressure", units) : x)) };
    }
    case "blocks":
      return { blocks: readBlocks(v, units, r.bind) };
    default:
      return { max_MPa: r.number("pressure.max"), min_MPa: r.number("pressure.min") };
  }
}

/** Filled rows of the block table, in order; blank rows are skipped and each kept row is bound to its document index. */
function readBlocks(v: FormValues, units: Units, bind: (n: string, p: string) => void): Obj[] {
  bind("blocks", "pressure.blocks");
  const out: Obj[] = [];
  for (const row of blockRows(v)) {
    const cols = Object.keys(BLOCK_COLUMNS) as (keyof typeof BLOCK_COLUMNS)[];
    if (cols.every((c) => (v[blockField(row, c)] ?? "").trim() === "")) continue;
    const i = out.length;
    const cell = (c: keyof typeof BLOCK_COLUMNS) => {
      bind(blockField(row, c), `pressure.blocks.${i}.${c === "cycles" ? "cycles" : `${c}_MPa`}`);
      return numberIn(v[blockField(row, c)], (x) => toSI(x, BLOCK_COLUMNS[c], units));
    };
    out.push({ max_MPa: cell("max"), min_MPa: cell("min"), cycles: cell("cycles") });
  }
  return out;
}

/** Row numbers of the block table present in the posted values, ascending. */
export function blockRows(v: FormValues): number[] {
  const rows = new Set<number>();
  for (const k of Object.keys(v)) {
    const m = /^blocks\.(\d+)\.(max|min|cycles)$/.exec(k);
    if (m && Number(m[1]) < 10_000) rows.add(Number(m[1]));
  }
  return [...rows].sort((a, b) => a - b);
}

function readCutout(r: Readers): Obj {
  const kind = r.pick("cutout.kind", "cutout.kind");
  switch (kind) {
    case "circular-hole":
      return { kind, radius_mm: r.number("circle.radius") };
    case "elliptical-hole":
      return { kind, halfAxisAlongHoop_mm: r.number("ellipse.hoop"), halfAxisAlongAxial_mm: r.number("ellipse.axial") };
    case "rounded-rectangle":
      return {
        kind,
        halfWidthAlongHoop_mm: r.number("rect.hoop"),
        halfLengthAlongAxial_mm: r.number("rect.axial"),
        cornerRadius_mm: r.number("rect.corner"),
      };
    case "outline":
      return { kind };
    case "given":
      return { kind, kt: r.number("given.kt"), rootRadius_mm: r.number("given.rootRadius"), basis: r.pick("given.basis", "cutout.basis") };
    default:
      return { kind: kind ?? "none" };
  }
}

function readMaterial(r: Readers): Obj {
  return {
    id: r.pick("material.id", "material.id"),
    name: r.pick("material.name", "material.name"),
    ultimate_MPa: r.number("material.ultimate"),
    yield_MPa: r.number("material.yield"),
    modulus_MPa: r.number("material.modulus"),
    fatigueStrengthCoefficient_MPa: r.number("material.sigmaF"),
    fatigueStrengthExponent: r.number("material.b"),
    enduranceLimit_MPa: r.number("material.endurance"),
    toughness_MPaSqrtM: r.number("material.toughness"),
    parisC: r.number("material.parisC"),
    parisM: r.number("material.parisM"),
  };
}

function readFatigue(v: FormValues, r: Readers): Obj {
  const notch = v["fatigue.notch"];
  const criterion = r.pick("fatigue.meanStress", "fatigue.meanStress");
  const curve = r.pick("fatigue.curve", "fatigue.curve");
  const modifiers = {
    surface: r.pick("fatigue.surface", "fatigue.modifiers.surface"),
    reliability: r.number("fatigue.reliability"),
    sizeDiameter_mm: r.number("fatigue.size"),
  };
  return {
    meanStress: criterion,
    walkerGamma: criterion === "walker" ? r.number("fatigue.walkerGamma") : undefined,
    notchSensitivity: notch === "q" ? r.number("fatigue.q") : undefined,
    notchConstant: notch === "peterson" || notch === "neuber" ? r.pick("fatigue.notch", "fatigue.notchConstant") : undefined,
    designLife_cycles: r.number("fatigue.designLife"),
    scatterFactor: r.number("fatigue.scatterFactor"),
    curve,
    detailCategory_MPa: curve === "welded" || curve === "en13445-welded" ? r.number("fatigue.detailCategory") : undefined,
    gammaMf: curve === "welded" ? r.number("fatigue.gammaMf") : undefined,
    weldDetail: curve === "en13445-welded" || curve === undefined ? r.pick("fatigue.weldDetail", "fatigue.weldDetail") : undefined,
    temperature_C: curve?.startsWith("en13445") || curve === undefined ? r.number("fatigue.temperature") : undefined,
    roughnessRz_um: curve === "en13445-unwelded" ? r.number("fatigue.roughness") : undefined,
    localYield: r.pick("fatigue.localYield", "fatigue.localYield"),
    modifiers: Object.values(modifiers).some((x) => x !== undefined) ? modifiers : undefined,
  };
}

function readCrack(v: FormValues, r: Readers): Obj {
  const geometry = r.pick("crack.geometry", "crack.geometry");
  const atHole = r.pick("crack.cracksAtHole", "crack.cracksAtHole");
  return {
    geometry,
    initial_mm: r.number("crack.initial"),
    width_mm: r.number("crack.width"),
    holeRadius_mm: geometry === "hole-through" ? r.number("crack.holeRadius") : undefined,
    cracksAtHole: geometry === "hole-through" && atHole !== undefined ? (parseNumber(atHole) ?? atHole) : undefined,
    inspectionFactor: r.number("crack.inspectionFactor"),
    detectable_mm: r.number("crack.detectable"),
    detectableBy: r.pick("crack.detectableBy", "crack.detectableBy") || undefined,
    orientation: r.pick("crack.orientation", "crack.orientation") || undefined,
    openingDistance_mm: geometry === "hole-through" ? r.number("crack.openingDistance") : undefined,
    minimumInterval_cycles: r.number("crack.minimumInterval"),
    leakBeforeBreak: r.pick("crack.leakBeforeBreak", "crack.leakBeforeBreak") || undefined,
    // Bulging is on unless the box is cleared (off is unconservative).
    bulging: v["crack.bulging"] ? undefined : false,
  };
}

/** Drop undefined keys so the document holds only what the user gave. */
function prune(x: unknown): unknown {
  if (Array.isArray(x)) return x.map(prune);
  if (x === null || typeof x !== "object") return x;
  const out: Obj = {};
  for (const [k, val] of Object.entries(x)) {
    if (val === undefined) continue;
    out[k] = prune(val);
  }
  return out;
}
