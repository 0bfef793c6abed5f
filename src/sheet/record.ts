/**
 * The results a sheet was printed with, kept in the PDF beside its input, so `verify` can tell
 * whether this engine still gives the numbers on the paper.
 *
 * The record is a second attached file (RESULT_ATTACHMENT), written with pdf-lib after
 * attachInput so the embedded-files name tree stays in key order (ISO 32000-1, 7.9.6).
 * It holds the verdict, the principal numbers and every step's value at full precision.
 */
import { AFRelationship, type PDFDocument } from "pdf-lib";
import type { CheckResult, Verdict } from "../engine/index.ts";
import { extractAttachment } from "./attach.ts";

export const RESULT_ATTACHMENT = "hoopwise-result.json";
export const RECORD_FORMAT = "hoopwise.sheet-record/1";

export interface SheetRecord {
  format: typeof RECORD_FORMAT;
  engine: string;
  fingerprint: string;
  verdict: Verdict;
  governs: string;
  /** The principal numbers, by their path in the result document. */
  values: Record<string, number | null>;
  /** Each verdict row's outcome and margin. */
  verdictTable: { id: string; status: string; margin: number | null }[];
  /** Every step of the calculation, in order: its id and value. */
  steps: [string, number | null][];
}

export function recordOf(r: CheckResult): SheetRecord {
  const values: Record<string, number | null> = {
    "load.pressureMax_MPa": r.load.pressureMax_MPa,
    "load.pressureMin_MPa": r.load.pressureMin_MPa,
    "membrane.hoopMax_MPa": r.membrane.hoopMax_MPa,
    "membrane.axialMax_MPa": r.membrane.axialMax_MPa,
    "membrane.vonMisesMax_MPa": r.membrane.vonMisesMax_MPa,
    "static.margin": r.static.margin,
    "notch.kt": r.notch.kt,
    "notch.kf": r.notch.kf,
    "fatigue.amplitude_MPa": r.fatigue.amplitude_MPa,
    "fatigue.mean_MPa": r.fatigue.mean_MPa,
    "fatigue.equivalentAmplitude_MPa": r.fatigue.equivalentAmplitude_MPa,
    "fatigue.life_cycles": r.fatigue.life_cycles,
    "fatigue.allowableLife_cycles": r.fatigue.allowableLife_cycles,
    "fatigue.damage": r.fatigue.damage,
  };
  if (r.crack) {
    values["crack.critical_mm"] = r.crack.critical_mm;
    values["crack.cycles"] = r.crack.cycles;
    values["crack.inspectionInterval_cycles"] = r.crack.inspectionInterval_cycles;
  }
  if (r.evidence) values["evidence.lowerBound_cycles"] = r.evidence.lowerBound_cycles;
  if (r.spectrum) values["spectrum.damagePerPass"] = r.spectrum.damagePerPass;
  if (r.solution?.thickness_mm !== undefined) values["solution.thickness_mm"] = r.solution.thickness_mm;
  if (r.solution?.pressureMax_MPa !== undefined) values["solution.pressureMax_MPa"] = r.solution.pressureMax_MPa;
  return {
    format: RECORD_FORMAT,
    engine: r.engine,
    fingerprint: r.fingerprint,
    verdict: r.verdict,
    governs: r.governs,
    values,
    verdictTable: r.verdictTable.map((v) => ({ id: v.id, status: v.status, margin: v.margin })),
    steps: r.steps.map((s) => [s.id, s.value]),
  };
}

/** One number (or outcome) that differs between the record and a fresh computation. */
export interface Difference {
  what: string;
  recorded: string;
  now: string;
}

/**
 * Numbers that agree to 1 part in 10⁹ are the same: the same engine gives the same doubles, and
 * this leaves room only for the last bits a different platform's Math library may change.
 */
const RELATIVE_TOLERANCE = 1e-9;

function same(a: number | null | undefined, b: number | null | undefined): boolean {
  if (a === null || a === undefined || b === null || b === undefined) return a === b;
  if (a === b) return true;
  return Math.abs(a - b) <= RELATIVE_TOLERANCE * Math.max(Math.abs(a), Math.abs(b));
}

const shown = (x: number | null | undefined) => (x === undefined ? "absent" : x === null ? "none (unlimited)" : String(x));

export function compareRecords(then: SheetRecord, now: SheetRecord): Difference[] {
  const out: Difference[] = [];
  if (then.verdict !== now.verdict) out.push({ what: "verdict", recorded: then.verdict, now: now.verdict });
  if (then.governs !== now.governs) out.push({ what: "what governs", recorded: then.governs, now: now.governs });
  for (const key of new Set([...Object.keys(then.values), ...Object.keys(now.values)])) {
    if (!same(then.values[key], now.values[key])) out.push({ what: key, recorded: shown(then.values[key]), now: shown(now.values[key]) });
  }
  const rows = new Map(now.verdictTable.map((v) => [v.id, v]));
  for (const row of then.verdictTable) {
    const fresh = rows.get(row.id);
    if (!fresh) out.push({ what: `verdict row ${row.id}`, recorded: row.status, now: "absent" });
    else if (fresh.status !== row.status) out.push({ what: `verdict row ${row.id}`, recorded: row.status, now: fresh.status });
    else if (!same(row.margin, fresh.margin))
      out.push({ what: `margin of ${row.id}`, recorded: shown(row.margin), now: shown(fresh.margin) });
  }
  for (const row of now.verdictTable) {
    if (!then.verdictTable.some((v) => v.id === row.id)) out.push({ what: `verdict row ${row.id}`, recorded: "absent", now: row.status });
  }
  const steps = Math.max(then.steps.length, now.steps.length);
  for (let i = 0; i < steps; i += 1) {
    const [idThen, vThen] = then.steps[i] ?? ["absent", undefined];
    const [idNow, vNow] = now.steps[i] ?? ["absent", undefined];
    if (idThen !== idNow) out.push({ what: `step ${i + 1}`, recorded: idThen, now: idNow });
    else if (!same(vThen, vNow)) out.push({ what: `step ${i + 1} (${idThen})`, recorded: shown(vThen), now: shown(vNow) });
  }
  return out;
}

/** Attach the record to a loaded document (within attachInput's pass). */
export async function attachRecord(doc: PDFDocument, record: SheetRecord, createdAt: Date): Promise<void> {
  await doc.attach(new TextEncoder().encode(JSON.stringify(record)), RESULT_ATTACHMENT, {
    mimeType: "application/json",
    description: "The verdict and results this sheet was printed with, for verification.",
    creationDate: createdAt,
    modificationDate: createdAt,
    afRelationship: AFRelationship.Supplement,
  });
}

/** The record in a sheet: null when there is none; throws with a plain message when it cannot be read. */
export async function readRecord(pdf: Uint8Array): Promise<SheetRecord | null> {
  const bytes = await extractAttachment(pdf, RESULT_ATTACHMENT);
  if (!bytes) return null;
  let parsed: unknown;
  try {
    parsed = JSON.parse(new TextDecoder().decode(bytes));
  } catch {
    throw new Error(`The attached ${RESULT_ATTACHMENT} is not valid JSON.`);
  }
  if (!isRecord(parsed)) throw new Error(`The attached ${RESULT_ATTACHMENT} is not a results record this version understands.`);
  return parsed;
}

/** A tampered or foreign record must be refused, never half-read: every field is looked at. */
function isRecord(x: unknown): x is SheetRecord {
  const r = x as Partial<SheetRecord> | null;
  const numberOrNull = (v: unknown) => v === null || typeof v === "number";
  return (
    typeof r === "object" &&
    r !== null &&
    r.format === RECORD_FORMAT &&
    typeof r.engine === "string" &&
    typeof r.fingerprint === "string" &&
    typeof r.governs === "string" &&
    (r.verdict === "pass" || r.verdict === "fail" || r.verdict === "refer") &&
    typeof r.values === "object" &&
    r.values !== null &&
    Object.values(r.values).every(numberOrNull) &&
    Array.isArray(r.verdictTable) &&
    r.verdictTable.every(
      (v) => typeof v === "object" && v !== null && typeof v.id === "string" && typeof v.status === "string" && numberOrNull(v.margin),
    ) &&
    Array.isArray(r.steps) &&
    r.steps.every((s) => Array.isArray(s) && s.length === 2 && typeof s[0] === "string" && numberOrNull(s[1]))
  );
}
