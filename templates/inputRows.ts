/**
 * @module templates/inputRows
 * The sheet's input rows, grouped as the form asks for them: each value in the reader's unit with
 * the SI value beside it, its label and quantity from the format's registry, and where it came from.
 */
import { inputAt } from "../src/schema/inputs.ts";
import { parisCFromSI, parisCUnit, SI_UNITS, type Quantity, type Units } from "../src/schema/units.ts";
import { numberList, percent, sig } from "./format.ts";
import { CRITERION_NAMES, CUTOUT_NAMES, CRACK_NAMES } from "./names.ts";
import type { SheetModel } from "./model.ts";
import { dual } from "./quantities.ts";
import { SERVICE_LABEL, STATIC_BASIS_LABEL, WELD_DETAIL_INFO } from "../src/schema/service.ts";

/** One input as the sheet lists it: the value in the user's unit, SI beside it, and where it came from. */
export interface InputRow {
  label: string;
  shown: string;
  si: string;
  note: string;
}

export interface InputGroup {
  title: string;
  rows: InputRow[];
}

/** Long lists (blocks, test lives) are cut short on paper; the full input rides in the PDF. */
const MAX_BLOCK_ROWS = 20;

/** The inputs of the check, grouped as the form asks for them, after defaults were filled in. */
export function inputGroups(m: SheetModel): InputGroup[] {
  const d = m.document;
  const u = m.units;
  const q = (label: string, x: number | null | undefined, kind: Quantity, note = ""): InputRow => ({ label, ...dual(x, kind, u), note });
  const t = (label: string, shown: string, note = ""): InputRow => ({ label, shown, si: "", note });
  // An input as the format names it: its label and symbol and its quantity from the registry, so the form and the sheet say the same.
  const input = (path: string, x: number | null | undefined, note = ""): InputRow => {
    const i = inputAt(path);
    return q(i.symbol ? `${i.label} ${i.symbol}` : i.label, x, i.quantity, note);
  };
  const groups: InputGroup[] = [];

  const shell = d.shell;
  groups.push({
    title: "Shell",
    rows: [
      t("Form", shell.form === "cylinder" ? "cylinder (closed ends)" : "sphere"),
      q(
        `Radius, measured at the ${shell.radiusAt} surface`,
        shell.radius_mm,
        "length",
        shell.radiusAt === "mean" ? "" : "mean radius worked out in the calculation",
      ),
      input("shell.thickness_mm", shell.thickness_mm),
      t("Wall theory asked for", THEORY_ASKED[shell.theory]),
    ],
  });

  groups.push({ title: "Pressure (inside minus outside)", rows: pressureRows(m, q, t, input) });

  const c = d.cutout;
  const cutoutRows: InputRow[] = [t("Opening", CUTOUT_NAMES[c.kind])];
  if (c.kind === "circular-hole" && c.radius_mm !== undefined) cutoutRows.push(input("cutout.radius_mm", c.radius_mm));
  if (c.kind === "elliptical-hole") {
    cutoutRows.push(input("cutout.halfAxisAlongHoop_mm", c.halfAxisAlongHoop_mm));
    cutoutRows.push(input("cutout.halfAxisAlongAxial_mm", c.halfAxisAlongAxial_mm));
  }
  if (c.kind === "rounded-rectangle") {
    cutoutRows.push(input("cutout.halfWidthAlongHoop_mm", c.halfWidthAlongHoop_mm));
    cutoutRows.push(input("cutout.halfLengthAlongAxial_mm", c.halfLengthAlongAxial_mm));
    cutoutRows.push(input("cutout.cornerRadius_mm", c.cornerRadius_mm));
  }
  if (c.kind === "outline")
    cutoutRows.push(
      t(
        "Outline points (hoop, axial)",
        c.points_mm.map(([x, y]) => `(${sig(x, 4)}, ${sig(y, 4)})`).join(" "),
        "mm from the opening's centre, smoothed by a periodic spline",
      ),
    );
  if (c.kind !== "given" && c.fasteners?.length)
    cutoutRows.push(
      t(
        "Fastener holes (hoop, axial; radius)",
        c.fasteners.map((f) => `(${sig(f.hoop_mm, 4)}, ${sig(f.axial_mm, 4)}; ${sig(f.radius_mm, 3)})`).join(" "),
        "mm from the opening's centre",
      ),
    );
  if (
    (c.kind === "circular-hole" || c.kind === "elliptical-hole" || c.kind === "rounded-rectangle" || c.kind === "outline") &&
    c.reinforcement
  ) {
    cutoutRows.push(t("Reinforcement area", `${sig(c.reinforcement.area_mm2, 4)} mm²`));
    cutoutRows.push(input("cutout.reinforcement.width_mm", c.reinforcement.width_mm));
  }
  if (c.kind === "given") {
    cutoutRows.push(t("Kt given", sig(c.kt, 4), "referred to the nominal hoop stress"));
    if (c.rootRadius_mm !== undefined) cutoutRows.push(input("cutout.rootRadius_mm", c.rootRadius_mm));
    cutoutRows.push(t("Basis of the given Kt", c.basis ?? "not stated", c.basis ? "as entered" : "state where the value comes from"));
  }
  groups.push({ title: "Opening", rows: cutoutRows });

  groups.push({ title: "Material", rows: materialRows(m, q, t) });
  groups.push({ title: "Fatigue", rows: fatigueRows(m, t, q, input) });
  groups.push({ title: "Static strength", rows: staticRows(m, t, input) });

  if (d.crack) {
    const k = d.crack;
    const rows = [
      t("Crack", CRACK_NAMES[k.geometry]),
      q(k.geometry === "center-through" ? "Initial half-length a₀" : "Initial depth a₀", k.initial_mm, "length"),
    ];
    if (k.width_mm !== undefined) rows.push(input("crack.width_mm", k.width_mm, "finite-width correction"));
    if (k.holeRadius_mm !== undefined) rows.push(input("crack.holeRadius_mm", k.holeRadius_mm));
    if (k.geometry === "hole-through") rows.push(t("Cracks at the hole", String(k.cracksAtHole)));
    rows.push(t("Inspection factor", sig(k.inspectionFactor, 4)));
    rows.push(t("Bulging of the curved skin", k.bulging ? "included" : "not included"));
    if (k.walkerGamma !== undefined) rows.push(t("Crack-growth Walker exponent", sig(k.walkerGamma, 4)));
    groups.push({ title: "Crack growth", rows });
  }

  if (d.evidence) {
    const e = d.evidence;
    const rows = [
      t(`Test lives (${e.lives_cycles.length})`, `${numberList(e.lives_cycles)} cycles`),
      t("Reliability (proportion surviving)", percent(e.reliability)),
      t("Confidence", percent(e.confidence)),
    ];
    if (e.assumedLogStdDev !== undefined) rows.push(t("Assumed log₁₀ standard deviation", sig(e.assumedLogStdDev, 4), "taken as known"));
    groups.push({ title: "Test evidence", rows });
  }

  if (d.solve)
    groups.push({
      title: "Solve",
      rows: [t("Solve for", d.solve.for === "thickness" ? "the least wall thickness" : "the highest pressure")],
    });
  return groups;
}

type Q = (label: string, x: number | null | undefined, kind: Quantity, note?: string) => InputRow;
type T = (label: string, shown: string, note?: string) => InputRow;
type I = (path: string, x: number | null | undefined, note?: string) => InputRow;

const THEORY_ASKED: Record<"auto" | "thin" | "thick", string> = {
  auto: "chosen from mean radius ÷ thickness (thick wall below 10)",
  thin: "thin wall (membrane), as asked",
  thick: "thick wall (Lamé), as asked",
};

function pressureRows(m: SheetModel, q: Q, t: T, input: I): InputRow[] {
  const p = m.document.pressure;
  const rows: InputRow[] = [];
  if (p.max_MPa !== undefined) {
    rows.push(input("pressure.max_MPa", p.max_MPa));
    rows.push(input("pressure.min_MPa", p.min_MPa ?? 0, p.min_MPa === undefined ? "default" : ""));
  } else if (p.fromAltitude) {
    rows.push(input("pressure.fromAltitude.flight_m", p.fromAltitude.flight_m, "standard atmosphere"));
    rows.push(input("pressure.fromAltitude.cabin_m", p.fromAltitude.cabin_m, "standard atmosphere"));
    rows.push(input("pressure.min_MPa", p.min_MPa ?? 0, p.min_MPa === undefined ? "default" : ""));
  } else if (p.history_MPa) {
    const h = p.history_MPa;
    let lo = Infinity;
    let hi = -Infinity;
    for (const x of h) {
      lo = Math.min(lo, x);
      hi = Math.max(hi, x);
    }
    rows.push(t("Points in the pressure history", sig(h.length, 7), "rainflow-counted; the full history is in the attached input"));
    rows.push(q("Highest pressure in the history", hi, "pressure"));
    rows.push(q("Lowest pressure in the history", lo, "pressure"));
  } else if (p.blocks) {
    const u = m.units;
    p.blocks.slice(0, MAX_BLOCK_ROWS).forEach((b, i) => {
      const hi = dual(b.max_MPa, "pressure", u);
      const lo = dual(b.min_MPa, "pressure", u);
      rows.push({
        label: `Block ${i + 1}`,
        shown: `${hi.shown} to ${lo.shown}`,
        si: hi.si ? `${hi.si} to ${lo.si}` : "",
        note: `${sig(b.cycles, 6)} cycles per pass`,
      });
    });
    if (p.blocks.length > MAX_BLOCK_ROWS)
      rows.push(t("Further blocks", `${p.blocks.length - MAX_BLOCK_ROWS} more`, "in the attached input"));
  }
  const a = m.document.axialExtra;
  if (a && (a.max_MPa !== 0 || a.min_MPa !== 0)) {
    rows.push(input("axialExtra.max_MPa", a.max_MPa));
    rows.push(input("axialExtra.min_MPa", a.min_MPa));
  }
  return rows;
}

function materialRows(m: SheetModel, q: Q, t: T): InputRow[] {
  const entered = m.document.material as Record<string, unknown>;
  const fromLibrary = entered.id !== undefined;
  // A value the user typed beside a library id overrides the library's.
  const origin = (key: string) => (entered[key] !== undefined ? "entered" : fromLibrary ? "library, typical" : "");
  const mat = m.material;
  const rows: InputRow[] = [t("Name", mat.name, entered.name !== undefined ? "as entered" : "")];
  if (mat.id) rows.push(t("Library entry", mat.id));
  const num = (label: string, key: keyof typeof mat & string, kind: Quantity) => {
    const v = mat[key];
    if (typeof v === "number") rows.push(q(label, v, kind, origin(key)));
  };
  num("Ultimate strength Su", "ultimate_MPa", "stress");
  num("Yield strength Sy", "yield_MPa", "stress");
  num("Elastic modulus E", "modulus_MPa", "stress");
  num("Fatigue strength coefficient σ'f", "fatigueStrengthCoefficient_MPa", "stress");
  if (mat.fatigueStrengthExponent !== undefined)
    rows.push(t("Basquin exponent b", sig(mat.fatigueStrengthExponent, 4), origin("fatigueStrengthExponent")));
  num("Endurance limit Se", "enduranceLimit_MPa", "stress");
  num("Fracture toughness Kc", "toughness_MPaSqrtM", "toughness");
  if (mat.parisC !== undefined) rows.push(parisRow(mat.parisC, mat.parisM, m.units, origin("parisC")));
  if (mat.parisM !== undefined) rows.push(t("Paris exponent m", sig(mat.parisM, 4), origin("parisM")));
  if (mat.coupons)
    rows.push(t("Coupon results", `${mat.coupons.length} coupons`, "fitted in the calculation; listed in the attached input"));
  rows.push(t("Source of the values", mat.source));
  return rows;
}

/**
 * The Paris coefficient in the sheet's units, with the format's SI value beside it when they differ;
 * its factor depends on the exponent it goes with (src/schema/units.ts, parisCFromSI).
 */
function parisRow(C: number, m: number | undefined, units: Units, origin: string): InputRow {
  const si = parisCUnit(SI_UNITS);
  const shownUnit = parisCUnit(units);
  const note = origin;
  if (shownUnit === si || m === undefined) return { label: "Paris coefficient C", shown: `${sig(C, 4)} ${si}`, si: "", note };
  return { label: "Paris coefficient C", shown: `${sig(parisCFromSI(C, m, units), 4)} ${shownUnit}`, si: `${sig(C, 4)} ${si}`, note };
}

/** The static basis and its values, each marked where a default of the kind of shell or of the basis filled it. */
function staticRows(m: SheetModel, t: T, input: I): InputRow[] {
  const s = m.result.static;
  const why = (key: string) => (s.defaults[key] ? `default: ${s.defaults[key]}` : "as entered");
  const rows: InputRow[] = [
    t("Kind of shell", SERVICE_LABEL[s.service], m.document.shell.service === "other" ? "default" : "as entered"),
    t("Static basis", STATIC_BASIS_LABEL[s.basis], why("basis")),
  ];
  if (s.basis === "en13445-3" || s.basis === "asme-viii-1")
    rows.push(
      t(s.basis === "en13445-3" ? "Weld joint coefficient z" : "Joint efficiency E", sig(s.jointEfficiency, 3), why("jointEfficiency")),
    );
  if (s.basis === "aircraft") {
    rows.push(input("static.limitFactor", s.limitFactor, `on the pressure differential; ${why("limitFactor")}`));
    rows.push(input("static.ultimateFactor", s.ultimateFactor, why("ultimateFactor")));
  }
  if (s.basis === "yield") rows.push(t("Yield factor n_y", sig(s.yieldFactor, 4), m.document.static ? "" : "default"));
  rows.push(input("static.corrosionAllowance_mm", s.corrosionAllowance_mm, why("corrosionAllowance_mm")));
  rows.push(input("static.thicknessTolerance_mm", s.thicknessTolerance_mm, why("thicknessTolerance_mm")));
  rows.push(input("static.minimumGauge_mm", s.minimumGauge_mm, `without the corrosion allowance; ${why("minimumGauge_mm")}`));
  return rows;
}

function fatigueRows(m: SheetModel, t: T, q: Q, input: I): InputRow[] {
  const f = m.document.fatigue;
  const lifeUnit = m.result.fatigue.lifeCountedIn;
  const rows: InputRow[] = [
    t("Design life", `${sig(f.designLife_cycles, 6)} ${lifeUnit}`),
    t("Scatter factor on life", sig(f.scatterFactor, 4), f.scatterFactor === 1 ? "no statistical allowance" : ""),
  ];
  const rf = m.result.fatigue;
  const fd = (key: string) => (rf.defaults[key] ? `default: ${rf.defaults[key]}` : "as entered");
  if (rf.curve === "en13445-welded" || rf.curve === "en13445-unwelded") {
    rows.push(
      t(
        "S-N curve",
        rf.curve === "en13445-welded" ? "EN 13445-3 clause 18, welded class" : "EN 13445-3 clause 18, unwelded curve from Rm",
        fd("curve"),
      ),
    );
    if (rf.weldDetail) rows.push(t("Weld detail", WELD_DETAIL_INFO[rf.weldDetail].label, fd("weldDetail")));
    if (rf.curve === "en13445-welded")
      rows.push(q("Class Δσ_R (at 2 × 10⁶ cycles)", rf.detailCategory_MPa, "stress", fd("detailCategory_MPa")));
    rows.push(t("Temperature T*", `${sig(rf.temperature_C, 4)} °C`, fd("temperature_C")));
  } else if (rf.curve === "welded") {
    rows.push(t("S-N curve", "welded detail category (EN 1993-1-9)"));
    rows.push(q("Detail category Δσ_C (at 2 × 10⁶ cycles)", f.detailCategory_MPa, "stress"));
    rows.push(t("Partial factor γ_Mf", sig(f.gammaMf, 4)));
  } else {
    rows.push(t("S-N curve", "material curve (Basquin)"));
    rows.push(t("Mean-stress criterion", CRITERION_NAMES[f.meanStress]));
    if (f.meanStress === "walker") rows.push(t("Walker exponent γ", sig(f.walkerGamma, 4)));
  }
  if (f.notchSensitivity !== undefined) rows.push(t("Notch sensitivity q", sig(f.notchSensitivity, 4), "as entered"));
  else if (f.notchConstant !== undefined)
    rows.push(
      t(
        "Notch sensitivity q",
        `from ${f.notchConstant === "peterson" ? "Peterson's" : "Neuber's"} constant`,
        "worked out in the calculation",
      ),
    );
  else rows.push(t("Notch sensitivity q", "1 (Kf = Kt)", "default, the cautious choice"));
  rows.push(t("Local yield at the notch", f.localYield === "shakedown" ? "shakedown allowed" : "elastic"));
  const mod = f.modifiers;
  if (mod?.surface) rows.push(t("Surface finish", mod.surface));
  if (mod?.reliability !== undefined) rows.push(t("Reliability asked of the Marin factor", percent(mod.reliability)));
  if (mod?.sizeDiameter_mm !== undefined) rows.push(input("fatigue.modifiers.sizeDiameter_mm", mod.sizeDiameter_mm, "for the size factor"));
  return rows;
}
