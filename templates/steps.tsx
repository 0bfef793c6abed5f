import type { Step } from "../src/engine/index.ts";
import { sig } from "./format.ts";
import { splitAtEquals, typeset } from "./math.tsx";
import type { SheetModel } from "./model.ts";
import { groupSteps } from "./stepGroups.ts";

/**
 * The calculation, set like a hand calculation: each step numbered, its title, the equation in
 * symbols, the same equation with the numbers put in (equals signs aligned), the result in the
 * right-hand column, and the published source beneath.
 */
export function Calculation({ m, num }: { m: SheetModel; num: number }) {
  const groups = groupSteps(m.result.steps, m.result.sections);
  return (
    <section class="calc">
      <h2>
        <span class="num">{num}</span>Calculation
      </h2>
      <p>
        Worked in N, mm, MPa and cycles unless a step says otherwise. Numbers in the working are rounded to four significant figures for
        reading; each result is computed at full precision.
      </p>
      {groups.map((g, i) => (
        <div>
          {/* The heading travels with the first step, so it is never left alone at the foot of a page. */}
          <div class="keep">
            <h3>
              {num}.{i + 1} {g.title}
            </h3>
            {i === 0 ? <CalcHead /> : null}
            <StepRow step={g.steps[0].step} no={g.steps[0].no} />
          </div>
          {g.steps.slice(1).map((s) => (
            <StepRow step={s.step} no={s.no} />
          ))}
        </div>
      ))}
    </section>
  );
}

function CalcHead() {
  return (
    <div class="calc-head">
      <span>No.</span>
      <span>Working</span>
      <span class="r">Result</span>
    </div>
  );
}

/** The result as printed in the right-hand column; the tests read the PDF for exactly this text. */
export function stepResultText(step: Step): { value: string; unit: string } {
  if (step.value === null) return { value: "unlimited", unit: "" };
  return { value: sig(step.value, 4), unit: step.unit && step.unit !== "—" ? step.unit : "" };
}

function StepRow({ step, no }: { step: Step; no: number }) {
  const res = stepResultText(step);
  return (
    <div class="step" id={`step-${step.id}`}>
      <div class="no">({no})</div>
      <div>
        <div class="title">{typeset(step.title)}</div>
        <Working equation={step.equation} substituted={step.substituted} />
        <div class="src">Source: {typeset(step.source)}</div>
      </div>
      <div class="res">
        {res.value}
        {res.unit ? <span class="u"> {typeset(res.unit)}</span> : null}
      </div>
    </div>
  );
}

/**
 * Where the substituted line repeats the quantity of the equation ("σθ = …"), it is printed
 * under the equation as "= …" with the equals signs in one column, as on paper.
 */
function Working({ equation, substituted }: { equation: string; substituted: string }) {
  const eq = splitAtEquals(equation);
  const sub = splitAtEquals(substituted);
  if (eq && sub && sub.lhs === eq.lhs) {
    return (
      <div class="work">
        <span class="lhs">{typeset(eq.lhs)}</span>
        <span>=</span>
        <span class="rhs">{typeset(eq.rhs)}</span>
        <span />
        <span>=</span>
        <span class="rhs">{typeset(sub.rhs)}</span>
      </div>
    );
  }
  return (
    <div class="work">
      <span class="line">{typeset(equation)}</span>
      {substituted && substituted !== equation ? <span class="line">{typeset(substituted)}</span> : null}
    </div>
  );
}
