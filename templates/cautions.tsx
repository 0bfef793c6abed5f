/**
 * What the sheet is and is not, in plain words. CAUTIONS is exported so the tests can look for
 * each sentence in the printed text.
 */
export const CAUTIONS = [
  "This sheet is a screening check made on membrane theory and published methods. It is not a certificate of compliance with any code or rule.",
  "The governing pressure-vessel or airworthiness code decides, and a licensed or authorized engineer must review the work and sign for the item before it is built, repaired or returned to service.",
  "Material values are typical values, not design allowables. Verify every one against certified data (mill certificates, the material specification or the code's own tables).",
  "Outside this check: bending at frames, stiffeners, heads, nozzles and joints; residual, thermal and assembly stresses; buckling; corrosion, wear and environmental effects on fatigue and crack growth; manufacturing defects beyond the crack assumed here.",
  "Qualified test evidence outranks the estimates on this sheet wherever the code asks for it.",
] as const;

/** One line for page 1 and the footer of every page. */
export const CAUTION_SHORT =
  "Screening check — not a certificate of compliance. The governing code and a licensed or authorized engineer decide.";

export function Cautions({ num }: { num: number }) {
  return (
    <section class="keep">
      <h2>
        <span class="num">{num}</span>Cautions and the governing code
      </h2>
      <div class="cautions">
        <ul>
          {CAUTIONS.map((c) => (
            <li>{c}</li>
          ))}
        </ul>
      </div>
    </section>
  );
}
