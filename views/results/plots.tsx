import type { Child } from "hono/jsx";
import { raw } from "hono/html";
import { crackGrowthPlot, haighDiagram, lifeThicknessPlot, snCurve, spectrumPlot, type PlotOptions } from "../../src/plots/index.ts";
import type { Units } from "../../src/schema/units.ts";
import type { ResultView } from "./context.ts";

/** The plots draw stresses in MPa, ksi or psi; pressures-style units (kPa, bar) fall back to MPa there. */
function plotOptions(units: Units): PlotOptions {
  const stress = units.stress === "ksi" || units.stress === "psi" ? units.stress : "MPa";
  return { units: { stress, length: units.length } };
}

/** A plot with its caption. The SVG comes from src/plots, which escapes every text it draws. */
function Plot({ id, caption, svg }: { id: string; caption: Child; svg: string }) {
  return (
    <figure class="plot" id={`plot-${id}`}>
      {raw(svg)}
      <figcaption>{caption}</figcaption>
    </figure>
  );
}

/** Haigh, S-N, life against thickness, crack growth and spectrum: each where the check gives it something to draw. */
export function Plots({ v }: { v: ResultView }) {
  const { result: r, material: m, units } = v;
  const f = r.fatigue;
  const opts = plotOptions(units);
  const singleCycle = f.lifeCountedIn === "cycles";
  const material = f.curve === "basquin";
  const lifeUnit = singleCycle ? "cycles" : "passes";
  return (
    <section class="block" aria-labelledby="h-plots">
      <h3 id="h-plots">Plots</h3>
      <div class="plots">
        {material && singleCycle && f.equivalentAmplitude_MPa !== null ? (
          <Plot
            id="haigh"
            caption="Constant-life lines of every criterion through the same equivalent amplitude, with the operating point of the notch."
            svg={haighDiagram(
              {
                operating: { mean_MPa: f.mean_MPa, amplitude_MPa: f.amplitude_MPa },
                equivalentAmplitude_MPa: f.equivalentAmplitude_MPa,
                ultimate_MPa: m.ultimate_MPa,
                yield_MPa: m.yield_MPa,
                fatigueStrengthCoefficient_MPa: f.curveUsed.fatigueStrengthCoefficient_MPa,
                walkerGamma: v.walkerGamma,
                selected: f.criterion,
              },
              opts,
            )}
          />
        ) : null}
        {material && singleCycle ? (
          <Plot
            id="sn"
            caption="The S-N curve used, with the operating point, the design life and the life the scatter factor asks for."
            svg={snCurve(
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
            )}
          />
        ) : null}
        {r.lifeVsThickness.length > 1 ? (
          <Plot
            id="thickness"
            caption={`Fatigue life (${lifeUnit}) against wall thickness around the present value; the required life is the design life times the scatter factor.`}
            svg={lifeThicknessPlot(
              {
                points: r.lifeVsThickness,
                current_mm: v.thickness_mm,
                requiredLife_cycles: f.designLife_cycles * f.scatterFactor,
                minimumThickness_mm: r.solution?.thickness_mm,
              },
              opts,
            )}
          />
        ) : null}
        {r.crack ? (
          <Plot
            id="crack"
            caption="Crack size against pressure cycles (Paris law), with the critical size and the inspections."
            svg={crackGrowthPlot(
              {
                curve: r.crack.curve,
                critical_mm: r.crack.critical_mm,
                inspectionInterval_cycles: r.crack.inspectionInterval_cycles ?? Number.NaN,
                initial_mm: r.crack.initial_mm,
              },
              opts,
            )}
          />
        ) : null}
        {r.spectrum ? (
          <Plot
            id="spectrum"
            caption="The counted cycles of one pass, by range of the nominal hoop stress."
            svg={spectrumPlot({ cycles: r.spectrum.cycles }, opts)}
          />
        ) : null}
      </div>
      {!(material && singleCycle) ? (
        <p class="hint">
          {material
            ? "The Haigh and S-N plots show a single cycle; a history or block spectrum is judged by its summed damage (see the calculation)."
            : "The Haigh and S-N plots show the material curve; the welded detail curve is worked in the calculation."}
        </p>
      ) : null}
    </section>
  );
}
