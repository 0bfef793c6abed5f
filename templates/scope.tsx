import { CRITERION_NAMES } from "./names.ts";
import { STATIC_BASIS_LABEL, WELD_DETAIL_INFO } from "../src/schema/service.ts";
import { capitalise, sig } from "./format.ts";
import { typeset } from "./math.tsx";
import type { SheetModel } from "./model.ts";
import { dualText } from "./quantities.ts";

/**
 * Scope and assumptions: the choices behind the numbers, stated before the numbers, so a checker
 * knows what was and was not checked and can disagree with a choice rather than a result.
 */
export function Scope({ m, num }: { m: SheetModel; num: number }) {
  const d = m.document;
  const r = m.result;
  const f = r.fatigue;
  const shape = d.shell.form === "cylinder" ? "cylindrical shell with closed ends" : "spherical shell";
  const checks = [
    "static strength",
    "fatigue life at the opening",
    r.crack ? "crack growth and the inspection interval" : "",
    r.evidence ? "the test evidence" : "",
    r.fleet ? "the fleet view" : "",
  ].filter(Boolean);
  return (
    <section>
      <h2>
        <span class="num">{num}</span>Scope and assumptions
      </h2>
      <ul>
        <li>
          <b>What is checked.</b> The skin of a {shape} under a cycling internal pressure differential: {listWords(checks)}.
        </li>
        <li>
          <b>Membrane theory.</b> Stresses are the membrane stresses of an unstiffened shell of uniform wall. Bending at frames, stiffeners,
          heads, nozzles and joints is not part of the calculation.
        </li>
        <li>
          <b>Shell theory.</b> {typeset(capitalise(r.membrane.theoryReason))}.{" "}
          {r.membrane.theory === "thin"
            ? "Thin wall: hoop stress p·r/t and axial stress p·r/(2t) on the mean radius."
            : "Thick wall: Lamé's solution with closed ends, stresses taken at the inner surface where they are largest."}
        </li>
        <li>
          <b>Load.</b> {LOAD_WORDS[r.load.source]}
        </li>
        <li>
          <b>Stress concentration.</b> {ktWords(m)} It governs {typeset(r.notch.ktGoverns)}; the biaxial ratio σ<sub>x</sub>/σ<sub>θ</sub>{" "}
          is {sig(r.notch.biaxialRatio, 3)}. {qWords(m)}
        </li>
        <li>
          <b>Fatigue criterion.</b>{" "}
          {f.curve === "welded"
            ? `Welded detail category ${dualText(d.fatigue.detailCategory_MPa, "stress", m.units)}: the stress range counts without a mean-stress correction (EN 1993-1-9).`
            : f.curve === "en13445-welded"
              ? `EN 13445-3 clause 18 welded class ${dualText(f.detailCategory_MPa ?? undefined, "stress", m.units)}${f.weldDetail ? ` (${WELD_DETAIL_INFO[f.weldDetail].label.toLowerCase()})` : ""}: the equivalent (Tresca) stress range, corrected for plasticity (ke), thickness and temperature, without a mean-stress correction.`
              : f.curve === "en13445-unwelded"
                ? "EN 13445-3 clause 18 unwelded curve from Rm: the equivalent (Tresca) range with the surface, thickness, mean-stress and temperature factors."
                : `Mean stress by the ${CRITERION_NAMES[f.criterion]} criterion on the material's Basquin curve; the other criteria are compared in section 4.`}
        </li>
        <li>
          <b>Static basis.</b> {STATIC_BASIS_LABEL[r.static.basis]}.{" "}
          {r.static.statement ?? "A stress check on membrane theory, not a code's design-by-formula rule."}
        </li>
        <li>
          <b>Scatter factor.</b> The life read from the curve is divided by {sig(f.scatterFactor, 3)} to allow for the spread of lives
          between nominally equal items.{" "}
          {f.scatterFactor === 1
            ? "With 1 there is no such allowance: the life is a median estimate."
            : "The code or the authority that governs the item sets the factor to use."}
        </li>
        {r.crack ? (
          <li>
            <b>Damage tolerance.</b> Paris law driven by the nominal stress range opening the crack:{" "}
            {r.crack.orientation === "both"
              ? `a crack along the axis (hoop stress) and a crack around the shell (axial stress) are both grown; the ${r.crack.governingOrientation} crack has the shorter life and governs.`
              : r.crack.orientation === "circumferential"
                ? "the crack runs around the shell and is opened by the axial stress."
                : "the crack lies along the axis and is opened by the hoop stress."}{" "}
            {d.crack?.bulging === false
              ? "The bulging of the shell at the crack is switched off, which is unconservative."
              : "The shell's bulging at the crack (Folias) raises its stress intensity."}{" "}
            The critical size comes from the BS 7910 / R6 Option 1 failure assessment diagram (fracture against collapse).{" "}
            {r.crack.uniformCurve
              ? "The crack grows from a fastener hole toward the opening, through the opening's rising stress (Green's function). "
              : ""}
            The first inspection (threshold) is the growth life from the initial flaw to critical divided by the inspection factor; the
            repeat interval is the growth life from the detectable size to critical divided by the same factor. The compressive part of a
            cycle is left out of the range.
          </li>
        ) : null}
        {r.fleet ? (
          <li>
            <b>What a single test article can and cannot show.</b> {r.fleet.statement}
          </li>
        ) : null}
        {r.evidence ? (
          <li>
            <b>Test evidence.</b> Test lives are taken as lognormal; the lower bound is the one-sided tolerance limit at the stated
            reliability and confidence.
          </li>
        ) : null}
        <li>
          <b>Material.</b> <span class="user">{m.material.name}</span>:{" "}
          {m.result.material.typical
            ? "typical values — verify against certified data."
            : "values as entered — verify against certified data."}
        </li>
        <li>
          <b>Units.</b> Inputs and results are printed in the units chosen for this check with SI beside them; the calculation is worked in
          N, mm, MPa and cycles.
        </li>
      </ul>
      {d.notes ? (
        <>
          <h3>Notes from the preparer</h3>
          <p class="user pre">{d.notes}</p>
        </>
      ) : null}
    </section>
  );
}

const LOAD_WORDS = {
  direct: "One pressure cycle between the lowest and the highest differential given, repeated for the design life.",
  altitude:
    "One cycle per flight: the differential between the cabin and the outside pressure of the ICAO standard atmosphere, from the lowest pressure given to that differential.",
  history:
    "The pressure history is counted into cycles by rainflow (ASTM E1049); one pass of the history is one unit of life, and the damage of its cycles is summed (Palmgren–Miner).",
  blocks: "Blocks of cycles make up one pass, the unit of life; the damage of the blocks is summed (Palmgren–Miner).",
} as const;

function ktWords(m: SheetModel): string {
  const c = m.document.cutout;
  switch (c.kind) {
    case "none":
      return "No opening: Kt = 1 for the plain skin. Fastener holes, joints and other details need their own check.";
    case "circular-hole":
      return "A circular hole in the biaxial membrane field (Kirsch's solution).";
    case "elliptical-hole":
      return "An elliptical opening in the biaxial membrane field (Inglis's solution, superposed for the two stresses); Kt is the larger boundary stress.";
    case "rounded-rectangle":
    case "outline":
      return "An opening of its own shape in the biaxial membrane field: the edge stress is solved by plane elasticity for the shape (an integral equation checked against Kirsch and Inglis), and Kt is the largest edge stress, at the opening or at a fastener hole beside it.";
    case "given":
      return `Kt = ${sig(c.kt, 4)} as given in the input (basis printed with the inputs).`;
  }
}

function qWords(m: SheetModel): string {
  const f = m.document.fatigue;
  const q = sig(m.result.notch.q, 3);
  if (f.notchSensitivity !== undefined) return `Fatigue notch factor Kf = 1 + q·(Kt − 1) with q = ${q} as entered.`;
  if (f.notchConstant !== undefined)
    return `Fatigue notch factor Kf = 1 + q·(Kt − 1) with q = ${q} from ${f.notchConstant === "peterson" ? "Peterson's" : "Neuber's"} constant.`;
  return "Fatigue notch factor Kf = Kt (q = 1, the cautious default).";
}

function listWords(items: string[]): string {
  return items.length <= 1 ? items.join("") : `${items.slice(0, -1).join(", ")} and ${items[items.length - 1]}`;
}
