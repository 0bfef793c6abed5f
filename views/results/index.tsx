/**
 * @module views/results
 * The result on the page, in the order a checker reads it: what was solved, the warnings, the
 * verdict table and key figures; then the criteria compared, the working and the share link.
 */
import { CriteriaTable } from "./criteria.tsx";
import { KeyFigures } from "./figures.tsx";
import { Share } from "./share.tsx";
import { Solution } from "./solution.tsx";
import { Steps } from "./steps.tsx";
import { VerdictTable } from "./table.tsx";
import { Warnings } from "./warnings.tsx";
import type { ResultView } from "./context.ts";

/*
 * The result below the verdict comes in three parts, in the order a checker reads it: the
 * numbers (#results), the plots (#plots) and the working (#details). An edit made with
 * scripting on swaps the numbers and the working at once and fetches the plots just after,
 * so the numbers are not kept waiting for the drawing.
 */

/** What was solved, the warnings, the checks weighed and the key figures. */
export function ResultTop({ v, canUsePressure }: { v: ResultView; canUsePressure: boolean }) {
  return (
    <>
      <Solution result={v.result} units={v.units} canUsePressure={canUsePressure} />
      <Warnings result={v.result} units={v.units} />
      <VerdictTable result={v.result} units={v.units} />
      <KeyFigures result={v.result} units={v.units} />
    </>
  );
}

/** The seven criteria side by side, the calculation line by line, and the ways to keep the check. */
export function ResultDetails({ v }: { v: ResultView }) {
  return (
    <>
      <CriteriaTable result={v.result} units={v.units} />
      <Steps steps={v.result.steps} sections={v.result.sections} />
      <Share link={v.link} />
    </>
  );
}

/** The plots' address: the check and, when a solve was asked for, what was solved (the thickness plot marks it). */
export function plotsUrl(v: ResultView): string {
  return `/plots?c=${v.link}${v.solve ? `&solve=${v.solve}` : ""}`;
}

/**
 * Sent out of band with an edit's answer: fetches the new plots into #plots as soon as it lands.
 * Requests queue on #plots: one still in flight finishes, then only the newest waiting one is sent.
 */
export function PlotsLoader({ v }: { v: ResultView }) {
  return (
    <div id="plots-loader" hx-swap-oob="true">
      <span hx-get={plotsUrl(v)} hx-trigger="load" hx-target="#plots" hx-swap="innerHTML" hx-sync="#plots:queue last"></span>
    </div>
  );
}
