/**
 * @module views/results/figures
 * The key numbers of the check in the user's units, grouped as the work goes: load, membrane, notch, fatigue.
 * A panel of the results on the page (views/results/index.tsx), handed the engine's result and the
 * reader's units; each number is converted from SI and written by the one number formatter
 * (src/present/numbers.ts, through views/format.ts). Nothing here works a value out.
 */
import type { Child } from "hono/jsx";
import type { CheckResult } from "../../src/engine/index.ts";
import type { Units } from "../../src/schema/units.ts";
import { cycles, quantity, sig } from "../format.ts";

function Figure({ label, children }: { label: Child; children: Child }) {
  return (
    <div>
      <dt>{label}</dt>
      <dd>{children}</dd>
    </div>
  );
}

export function KeyFigures({ result, units }: { result: CheckResult; units: Units }) {
  const { load, membrane: m, notch: n, fatigue: f } = result;
  const stress = (x: number | null) => quantity(x, "stress", units);
  const lifeUnit = f.lifeCountedIn === "passes" ? "passes" : "cycles";
  return (
    <section class="block" aria-labelledby="h-figures">
      <h3 id="h-figures">Key figures</h3>
      <div class="figures">
        <dl>
          <dt class="group">Load</dt>
          <Figure label="Highest pressure">{quantity(load.pressureMax_MPa, "pressure", units)}</Figure>
          <Figure label="Lowest pressure">{quantity(load.pressureMin_MPa, "pressure", units)}</Figure>
        </dl>
        <dl>
          <dt class="group">Membrane ({m.theory === "thin" ? "thin wall" : "thick wall, Lamé"})</dt>
          <Figure label="Hoop, highest">{stress(m.hoopMax_MPa)}</Figure>
          <Figure label="Axial, highest">{stress(m.axialMax_MPa)}</Figure>
          <Figure label="Von Mises, highest">{stress(m.vonMisesMax_MPa)}</Figure>
          <Figure label="Mean radius">{quantity(m.meanRadius_mm, "length", units)}</Figure>
        </dl>
        <dl>
          <dt class="group">Notch</dt>
          <Figure label="Kt">{sig(n.kt, 3)}</Figure>
          <Figure label="q, Kf">
            {sig(n.q, 3)}, {sig(n.kf, 3)}
          </Figure>
          <Figure label="Local stress, highest">{stress(n.peakMax_MPa)}</Figure>
          <Figure label="Local stress, lowest">{stress(n.peakMin_MPa)}</Figure>
        </dl>
        <dl>
          <dt class="group">Fatigue</dt>
          <Figure label="Amplitude, mean">
            {stress(f.amplitude_MPa)}, {stress(f.mean_MPa)}
          </Figure>
          <Figure label="Equivalent amplitude σar">{stress(f.equivalentAmplitude_MPa)}</Figure>
          <Figure label="Life">
            <span data-testid="life" data-value={f.life_cycles === null ? "unlimited" : String(f.life_cycles)}>
              {cycles(f.life_cycles, lifeUnit)}
            </span>
          </Figure>
          <Figure label={`Allowable (÷ ${sig(f.scatterFactor, 3)})`}>{cycles(f.allowableLife_cycles, lifeUnit)}</Figure>
        </dl>
      </div>
      <p class="hint">
        {m.theoryReason}. Kt at {n.ktGoverns}.
      </p>
    </section>
  );
}
