/**
 * @module present/plots
 * The plots of a result, built once for every face: which plots a check has, what each is
 * handed, its caption, and the note when the Haigh and S-N plots do not apply. The page and the
 * sheet only lay the figures out.
 */
import type { CheckResult } from "../engine/index.ts";
import {
  crackGrowthPlot,
  edgeStressPlot,
  fleetPlot,
  haighDiagram,
  lifeThicknessPlot,
  openingPicture,
  type PlotOptions,
  shellPicture,
  snCurve,
  spectrumPlot,
  weldedSnCurve,
} from "../plots/index.ts";
import type { Units } from "../schema/units.ts";

export interface Figure {
  id: "shell" | "haigh" | "sn" | "welded-sn" | "thickness" | "crack" | "spectrum" | "opening" | "edge-stress" | "fleet";
  caption: string;
  /** SVG from src/plots, which escapes every text it draws. */
  svg: string;
}

export interface PlotSet {
  figures: Figure[];
  /** Why the Haigh and S-N plots are absent, when they are. */
  note?: string;
}

/** The plot options of a face: the user's units, and a heading (the sheet captions each plot itself, so gives ""). */
export function plotOptions(units: Units, title?: string): PlotOptions {
  return { ...(title !== undefined ? { title } : {}), units: { stress: units.stress, length: units.length } };
}

/** Every plot the result gives something to draw, with its caption: the shell to scale first, what a checker looks at first. */
export function plotInputs(r: CheckResult, units: Units, face: { title?: string } = {}): PlotSet {
  const f = r.fatigue;
  const worked = r.workedAt;
  const opts = plotOptions(units, face.title);
  const singleCycle = f.lifeCountedIn === "cycles";
  const basquin = f.curve === "basquin";
  const figures: Figure[] = [
    {
      id: "shell",
      caption:
        "The shell and its opening drawn to scale from the inputs: the section with the wall and the opening's width round the hoop, and the skin round the opening developed flat with its fastener holes and the crack sizes on the same scale.",
      svg: shellPicture(
        {
          form: worked.form,
          innerRadius_mm: r.membrane.innerRadius_mm,
          outerRadius_mm: r.membrane.outerRadius_mm,
          thickness_mm: worked.thickness_mm,
          outline: worked.outline,
          fasteners: worked.fasteners,
          ...(r.crack
            ? { crack: { initial_mm: r.crack.initial_mm, critical_mm: r.crack.critical_mm, detectable_mm: r.crack.detectable_mm } }
            : {}),
        },
        opts,
      ),
    },
  ];
  if (basquin && singleCycle && f.equivalentAmplitude_MPa !== null) {
    figures.push({
      id: "haigh",
      caption:
        "Haigh diagram: the constant-life line of each mean-stress criterion through the same equivalent amplitude, with the local cycle at the notch.",
      svg: haighDiagram(
        {
          operating: { mean_MPa: f.mean_MPa, amplitude_MPa: f.amplitude_MPa },
          equivalentAmplitude_MPa: f.equivalentAmplitude_MPa,
          ultimate_MPa: worked.ultimate_MPa,
          yield_MPa: worked.yield_MPa,
          fatigueStrengthCoefficient_MPa: f.curveUsed.fatigueStrengthCoefficient_MPa,
          walkerGamma: worked.walkerGamma,
          selected: f.criterion,
        },
        opts,
      ),
    });
  }
  if (basquin && singleCycle) {
    figures.push({
      id: "sn",
      caption: "The S-N curve used, with the operating point, the design life and the life the scatter factor asks for.",
      svg: snCurve(
        {
          fatigueStrengthCoefficient_MPa: f.curveUsed.fatigueStrengthCoefficient_MPa,
          fatigueStrengthExponent: f.curveUsed.fatigueStrengthExponent,
          enduranceLimit_MPa: f.curveUsed.enduranceLimit_MPa ?? undefined,
          operating: { equivalentAmplitude_MPa: f.equivalentAmplitude_MPa ?? Number.NaN, life_cycles: f.life_cycles },
          designLife_cycles: f.designLife_cycles,
          scatterFactor: f.scatterFactor,
          allowableLife_cycles: f.allowableLife_cycles,
        },
        opts,
      ),
    });
  }
  if (f.weldedPoint) {
    const w = f.weldedPoint;
    figures.push({
      id: "welded-sn",
      caption: `Welded S-N curve (${w.curveName}) with the largest cycle as the operating point: its range after the route's corrections, at its own life in cycles.`,
      svg: weldedSnCurve(
        {
          class_MPa: w.class_MPa,
          curveName: w.curveName,
          variableAmplitude: w.variableAmplitude,
          operating: { range_MPa: w.range_MPa, life_cycles: w.life_cycles },
          designLife_cycles: f.designLife_cycles,
          designLifeUnit: f.lifeCountedIn,
        },
        opts,
      ),
    });
  }
  if (r.lifeVsThickness.length > 1) {
    figures.push({
      id: "thickness",
      caption: `Fatigue life (${f.lifeCountedIn}) against wall thickness around the value checked; the required life is the design life times the scatter factor.`,
      svg: lifeThicknessPlot(
        {
          points: r.lifeVsThickness,
          current_mm: worked.thickness_mm,
          requiredLife_cycles: f.designLife_cycles * f.scatterFactor,
          minimumThickness_mm: r.solution?.thickness_mm,
          lifeUnit: f.lifeCountedIn,
        },
        opts,
      ),
    });
  }
  if (r.crack) {
    figures.push({
      id: "crack",
      caption: r.crack.uniformCurve
        ? "Crack size against pressure cycles (Paris law) for the crack growing from the fastener hole toward the opening, beside the same crack in a uniform field: the rising stress along its path makes it accelerate. With the critical size, the detectable size and the inspections (threshold, then every repeat interval)."
        : "Crack size against pressure cycles (Paris law), with the critical size, the detectable size and the inspections (threshold, then every repeat interval).",
      svg: crackGrowthPlot(
        {
          curve: r.crack.curve,
          critical_mm: r.crack.critical_mm,
          inspectionInterval_cycles: r.crack.inspectionInterval_cycles,
          initial_mm: r.crack.initial_mm,
          threshold_cycles: r.crack.threshold_cycles,
          repeatInterval_cycles: r.crack.repeatInterval_cycles,
          detectable_mm: r.crack.detectable_mm,
          comparison: r.crack.uniformCurve ? { curve: r.crack.uniformCurve, label: "same crack, uniform stress (hole alone)" } : null,
        },
        opts,
      ),
    });
  }
  if (r.fleet) {
    figures.push({
      id: "fleet",
      caption: `Fleet view: the life of one item and of the first of ${r.fleet.size} to fail, with the test lives, the design life, the 5th percentile and the expected first failure. ${r.fleet.statement}`,
      svg: fleetPlot(
        {
          density: r.fleet.density,
          testLives_cycles: r.fleet.testLives_cycles,
          designLife_cycles: r.fleet.designLife_cycles,
          percentile5_cycles: r.fleet.percentile5_cycles,
          firstFailure_cycles: r.fleet.firstFailure_cycles,
          size: r.fleet.size,
        },
        opts,
      ),
    });
  }
  const opening = r.notch.opening;
  if (opening) {
    figures.push({
      id: "opening",
      caption: `The opening's outline coloured by its edge stress per unit nominal hoop stress at maximum pressure, the governing point, the fastener holes with their Kt, and the curvature parameter${r.crack?.path ? `; the black line is the straight path of the crack from fastener hole ${r.crack.path.fastener} to the opening's edge` : ""}.`,
      svg: openingPicture(r.crack?.path ? { ...opening, crackPath: r.crack.path } : opening, opts),
    });
    figures.push({
      id: "edge-stress",
      caption: "Edge stress per unit nominal hoop stress against arc length round the opening (plane-elasticity solution for its shape).",
      svg: edgeStressPlot(opening, opts),
    });
  }
  if (r.spectrum) {
    figures.push({
      id: "spectrum",
      caption: `The counted cycles of one pass, by range of the local stress the fatigue check counts: at ${r.notch.ktGoverns}, Kf times the nominal stresses of each instant (rainflow, ASTM E1049).`,
      svg: spectrumPlot({ cycles: r.spectrum.cycles }, opts),
    });
  }
  const note =
    basquin && singleCycle
      ? undefined
      : basquin
        ? "No Haigh or S-N plot: they show a single cycle, and this check sums the damage of a spectrum (see the calculation)."
        : f.curve === "en13445-unwelded"
          ? "No Haigh or S-N plot of the material: the vessel code's unwelded curve and its factors are worked in the calculation."
          : "No Haigh plot: a welded class is a curve of stress range, and the mean stress does not enter it.";
  return { figures, note };
}
