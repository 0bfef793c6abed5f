/**
 * Longest link the page offers. Many servers, proxies and mail programs refuse or cut URLs
 * past 8 KiB (common practice); a long pressure history makes a check far longer than that, so
 * such a check is kept as a file or in the records instead of a link.
 */
export const MAX_SHARE_LINK_CHARS = 8000;

/** Ways to keep or pass on the check: a link that reopens it, the JSON document, and the API for scripts. */
export function Share({ link }: { link: string }) {
  const href = `/?c=${link}`;
  const fits = link.length <= MAX_SHARE_LINK_CHARS;
  return (
    <section class="block share" aria-labelledby="h-share">
      <h3 id="h-share">Keep or pass on this check</h3>
      <ul>
        {fits ? null : (
          <li id="link-too-long">
            This check is too long for a link ({link.length.toLocaleString("en-GB")} characters packed, more than{" "}
            {MAX_SHARE_LINK_CHARS.toLocaleString("en-GB")}; a long pressure history does this). Keep it with “Download as JSON” or “Save to
            the records” above, and open the file again with “Open file”.
          </li>
        )}
        {fits ? (
          <>
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
          </>
        ) : null}
        <li>
          Scripts: send the JSON to <code>POST /api/v1/check</code> and get the result as JSON, for example{" "}
          <code class="cmd">curl -H 'Content-Type: application/json' --data @hoopwise-check.json http://127.0.0.1:8080/api/v1/check</code>
        </li>
      </ul>
    </section>
  );
}
