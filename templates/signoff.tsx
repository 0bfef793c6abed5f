import { INPUT_ATTACHMENT } from "../src/sheet/attach.ts";
import { signedAtText } from "./format.ts";
import type { SheetModel, SignOffRole } from "./model.ts";
import { statusMark } from "./status.ts";

const ROLES: { role: SignOffRole; label: string }[] = [
  { role: "prepared", label: "Prepared by" },
  { role: "checked", label: "Checked by" },
  { role: "approved", label: "Approved by" },
];

/**
 * Prepared, checked and approved: name, date and a line for a signature in ink. Names and dates
 * come from the records when the revision was signed there; otherwise the lines are blank to be
 * filled in by hand.
 */
export function SignOffBlock({ m, num }: { m: SheetModel; num: number }) {
  const mark = statusMark(m.signoffs, m.superseded);
  return (
    <section class="keep">
      <h2>
        <span class="num">{num}</span>Sign-off
      </h2>
      <p class="revision-line">
        {m.revision !== undefined ? (
          <>
            <b>Revision {m.revision}</b> of calculation <span class="user">{m.document.calcNumber ?? "(no number given)"}</span>.{" "}
          </>
        ) : (
          <>
            <b>No revision:</b> printed from a check that is not saved in the records.{" "}
          </>
        )}
      </p>
      <p class="revision-line">
        Status: <span class={`mark mark-${mark.state}`}>{mark.words}</span>
      </p>
      {m.superseded ? (
        <p>
          <b>This revision is superseded.</b> A later revision of this calculation exists in the records; this sheet is kept for the record
          only and must not be used.
        </p>
      ) : null}
      <table class="signoff">
        <thead>
          <tr>
            <th class="role">Role</th>
            <th>Name</th>
            <th>Date</th>
            <th>Signature</th>
          </tr>
        </thead>
        <tbody>
          {ROLES.map(({ role, label }) => {
            const s = m.signoffs.find((x) => x.role === role);
            return (
              <tr>
                <th class="role">{label}</th>
                <td>{s ? <span class="user">{s.name}</span> : <div class="line" />}</td>
                <td>{s ? signedAtText(s.signedAt) : <div class="line" />}</td>
                <td class="sig">
                  <div class="line" />
                  {s ? <span class="blank">signed in the records</span> : null}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      <p class="note">
        The input of this sheet is attached to the PDF as <span class="mono">{INPUT_ATTACHMENT}</span>. To check that the paper still
        matches its input and this engine, run <span class="mono">npm run -s cli -- verify SHEET.pdf</span> and compare the fingerprint it
        reports with the one printed on every page.
      </p>
    </section>
  );
}
