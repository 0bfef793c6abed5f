/** Ways to keep or pass on the check: a link that reopens it, the JSON document, and the API for scripts. */
export function Share({ link }: { link: string }) {
  const href = `/?c=${link}`;
  return (
    <section class="block share" aria-labelledby="h-share">
      <h3 id="h-share">Keep or pass on this check</h3>
      <ul>
        <li>
          <a href={href} id="check-link" rel="bookmark">
            Link that reopens this check
          </a>{" "}
          <span class="hint">(the inputs travel in the link; nothing is stored on the server)</span>
        </li>
        <li>
          <a href={`/export?c=${link}`} download="hoopwise-check.json">
            Download the check as JSON
          </a>{" "}
          <span class="hint">(format hoopwise.check/1 — opens again here, or runs from the command line)</span>
        </li>
        <li>
          Scripts: send the JSON to <code>POST /api/v1/check</code> and get the result as JSON, for example{" "}
          <code class="cmd">curl -H 'Content-Type: application/json' --data @hoopwise-check.json http://127.0.0.1:8080/api/v1/check</code>
        </li>
      </ul>
    </section>
  );
}
