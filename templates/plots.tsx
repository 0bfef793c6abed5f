import { raw } from "hono/html";
import { crackGrowthPlot, haighDiagram, lifeThicknessPlot, snCurve, spectrumPlot, type PlotOptions } from "../src/plots/index.ts";
import type { Units } from "../src/schema/units.ts";
import type { SheetModel } from "./model.ts";

interface Figure {
  caption: string;
  svg: string;
}

/** The plots draw stresses in MPa, ksi or psi; pressure-style units (kPa, bar) stay in MPa there. The sheet captions each plot itself. */
function plotOptions(units: Units): PlotOptions {
  const stress = units.stress === "ksi" || units.stress === "psi" ? units.stress : "MPa";
  return { title: "", units: { stress, length: units.length } };
}

/** The same plots as the page, each where the check gives it something to draw. */
export function figures(m: SheetModel): Figure[] {
  const r = m.result;
  const f = r.fatigue;
  const opts = plotOptions(m.units);
  const singleCycle = f.lifeCountedIn === "cycles";
  const basquin = f.curve === "basquin";
  const out: Figure[] = [];
  if (basquin && singleCycle && f.equivalentAmplitude_MPa !== null) {
    out.push({
      caption:
        "Haigh diagram: the constant-life line of each mean-stress criterion through the same equivalent amplitude, with the local cycle at the notch.",
      svg: haighDiagram(
        {
          operating: { mean_MPa: f.mean_MPa, amplitude_MPa: f.amplitude_MPa },
          equivalentAmplitude_MPa: f.equivalentAmplitude_MPa,
          ultimate_MPa: m.material.ultimate_MPa,
          yield_MPa: m.material.yield_MPa,
          fatigueStrengthCoefficient_MPa: f.curveUsed.fatigueStrengthCoefficient_MPa,
          walkerGamma: m.document.fatigue.walkerGamma,
          selected: f.criterion,
        },
        opts,
      ),
    });
  }
  if (basquin && singleCycle) {
    out.push({
      caption: "S-N curve used, with the operating point, the design life and the life the scatter factor asks for.",
      svg: snCurve(
        {
          fatigueStrengthCoefficient_MPa: f.curveUsed.fatigueStrengthCoefficient_MPa,
          fatigueStrengthExponent: f.curveUsed.fatigueStrengthExponent,
          enduranceLimit_MPa: f.curveUsed.enduranceLimit_MPa,
          operating: { equivalentAmplitude_MPa: f.equivalentAmplitude_MPa ?? Number.NaN, life_cycles: f.life_cycles },
          designLife_cycles: f.designLife_cycles,
          scatterFactor: f.scatterFactor,
          allowableLife_cycles: f.allowableLife_cycles,
        },
        opts,
      ),
    });
  }
  if (r.lifeVsThickness.length > 1) {
    out.push({
      caption: `Fatigue life (${f.lifeCountedIn}) against wall thickness around the value checked; the required life is the design life times the scatter factor.`,
      svg: lifeThicknessPlot(
        {
          points: r.lifeVsThickness,
          current_mm: m.document.shell.thickness_mm,
          requiredLife_cycles: f.designLife_cycles * f.scatterFactor,
          minimumThickness_mm: r.solution?.thickness_mm,
          lifeUnit: f.lifeCountedIn,
        },
        opts,
      ),
    });
  }
  if (r.crack) {
    out.push({
      caption: "Crack size against pressure cycles (Paris law), with the critical size and the inspections.",
      svg: crackGrowthPlot(
        {
          curve: r.crack.curve,
          critical_mm: r.crack.critical_mm,
          inspectionInterval_cycles: r.crack.inspectionInterval_cycles,
          initial_mm: r.crack.initial_mm,
        },
        opts,
      ),
    });
  }
  if (r.spectrum) {
    out.push({
      caption: "The counted cycles of one pass, by range of the nominal hoop stress.",
      svg: spectrumPlot({ cycles: r.spectrum.cycles }, opts),
    });
  }
  return out;
}

export function Plots({ m, num }: { m: SheetModel; num: number }) {
  const figs = figures(m);
  const f = m.result.fatigue;
  return (
    <section>
      <h2>
        <span class="num">{num}</span>Plots
      </h2>
      {!(f.curve === "basquin" && f.lifeCountedIn === "cycles") ? (
        <p class="note">
          {f.curve === "basquin"
            ? "No Haigh or S-N plot: they show a single cycle, and this check sums the damage of a spectrum (see the calculation)."
            : "No Haigh or S-N plot of the material: the welded detail curve is worked in the calculation."}
        </p>
      ) : null}
      {figs.map((fig, i) => (
        <figure>
          {/* SVG from src/plots, which escapes every text it draws; it is inlined so nothing is fetched. */}
          {raw(fig.svg)}
          <figcaption>
            <b>Figure {i + 1}.</b>
            {fig.caption}
          </figcaption>
        </figure>
      ))}
    </section>
  );
}
