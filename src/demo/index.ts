import type { CheckDocument } from "../schema/check.ts";

/**
 * Demo checks. Both scenarios are invented for this tool: no real aircraft, vessel, company or person.
 * Their numbers are illustrative, not data for any real item.
 */
export interface Demo {
  id: string;
  label: string;
  document: CheckDocument;
}

const cabinBarrel: CheckDocument = {
  format: "hoopwise.check/1",
  title: "Cabin barrel skin at the window belt",
  project: "Larkspur L-30 commuter (invented demo)",
  calcNumber: "L30-FUS-017",
  notes:
    "Demo scenario: skin bay between two frames at a passenger window; the window opening is a rounded rectangle with a row of fastener holes round its upper aft corner." +
    " A crack is grown from fastener hole 5 of that row (the one with the highest stress concentration, near the top of the corner) straight to the nearest point of the corner's edge, into the window's stress field; a fleet of 150 invented aircraft is assumed.",
  display: { length: "mm", stress: "MPa", pressure: "kPa", altitude: "m" },
  shell: { form: "cylinder", radius_mm: 1150, radiusAt: "mean", thickness_mm: 1.0, theory: "auto", service: "aircraft-cabin" },
  pressure: { fromAltitude: { flight_m: 7620, cabin_m: 2440 }, min_MPa: 0 },
  cutout: {
    kind: "rounded-rectangle",
    halfWidthAlongHoop_mm: 115,
    halfLengthAlongAxial_mm: 160,
    cornerRadius_mm: 55,
    // A row of 4.8 mm rivet holes on an arc 12 mm outside the corner's edge, at 15° to 75° round it.
    fasteners: [15, 30, 45, 60, 75].map((deg) => ({
      hoop_mm: Math.round((60 + 67 * Math.cos((deg * Math.PI) / 180)) * 10) / 10,
      axial_mm: Math.round((105 + 67 * Math.sin((deg * Math.PI) / 180)) * 10) / 10,
      radius_mm: 2.4,
    })),
  },
  material: { id: "al-2024-t3" },
  fatigue: { meanStress: "goodman", designLife_cycles: 60000, scatterFactor: 3 },
  crack: {
    geometry: "hole-through",
    initial_mm: 1.27,
    fastener: 5,
    detectableBy: "surface-eddy-current",
    width_mm: 480,
    inspectionFactor: 2,
  },
  evidence: { lives_cycles: [410000], reliability: 0.9, confidence: 0.95, assumedLogStdDev: 0.14 },
  fleet: { size: 150 },
};

const airReceiver: CheckDocument = {
  format: "hoopwise.check/1",
  title: "Shell course at the outlet nozzle",
  project: "500-litre workshop air receiver (invented demo)",
  calcNumber: "AR500-SHELL-003",
  notes:
    "Demo scenario: one pass is one year of service — daily start-ups from empty and compressor load/unload cycles. Longitudinal seam spot-examined (z = 0.85); the outlet socket is fillet-welded to the shell.",
  display: { length: "mm", stress: "MPa", pressure: "bar", altitude: "m" },
  shell: { form: "cylinder", radius_mm: 300, radiusAt: "inner", thickness_mm: 5, theory: "auto", service: "pressure-vessel" },
  pressure: {
    blocks: [
      { max_MPa: 1.1, min_MPa: 0, cycles: 300 },
      { max_MPa: 1.1, min_MPa: 0.8, cycles: 20000 },
    ],
  },
  cutout: { kind: "circular-hole", radius_mm: 30 },
  material: { id: "steel-p265gh" },
  fatigue: { meanStress: "goodman", curve: "en13445-welded", weldDetail: "nozzle-fillet", designLife_cycles: 20, scatterFactor: 1 },
  static: { basis: "en13445-3", jointEfficiency: 0.85, corrosionAllowance_mm: 1, thicknessTolerance_mm: 0.3, minimumGauge_mm: 1.5 },
  crack: { geometry: "center-through", initial_mm: 2, inspectionFactor: 2 },
};

export const DEMOS: readonly Demo[] = [
  { id: "cabin", label: "Commuter cabin barrel with a window (invented)", document: cabinBarrel },
  { id: "receiver", label: "Workshop air receiver at a nozzle (invented)", document: airReceiver },
];

export function findDemo(id: string): Demo | undefined {
  return DEMOS.find((d) => d.id === id);
}
