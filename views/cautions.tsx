/**
 * The cautions, in plain words. The full text heads every page; the short form sits under the
 * verdict, so no result is ever shown without it.
 */
export function Cautions() {
  return (
    <aside class="cautions" aria-labelledby="h-cautions">
      <h2 id="h-cautions">Before you rely on any result</h2>
      <ul>
        <li>
          This is a <strong>screening check</strong> on membrane theory and published methods. It is{" "}
          <strong>not a code-compliance certificate</strong>.
        </li>
        <li>
          The <strong>governing pressure-vessel or airworthiness code</strong>, qualified test evidence, and review and sign-off by a{" "}
          <strong>licensed or authorized engineer</strong> decide whether the item is fit for service.
        </li>
        <li>
          Material values in the library are <strong>typical</strong>, not design allowables:{" "}
          <strong>verify them against certified data</strong>.
        </li>
      </ul>
    </aside>
  );
}

export function CautionStrip() {
  return (
    <p class="caution-strip">
      Screening check only — not a code-compliance certificate. The governing code and a licensed or authorized engineer decide. Material
      values are typical: verify against certified data.
    </p>
  );
}
