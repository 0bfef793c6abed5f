/**
 * @module templates/signoff
 * Section 7 of the sheet. Prepared, checked and approved: name, date and a line for a signature in
 * ink. Names and dates come from the records when the revision was signed there; otherwise the
 * lines are blank to be filled in by hand.
 * It also says which revision of which calculation the sheet is, its status mark (status.ts), when
 * the revision is imported unsigned or superseded, the records' key fingerprint, and the names of
 * the attached files (src/schema/attachments.ts) with the command that verifies them. The roles come
 * from src/schema/signoff.ts.
 */
import { INPUT_ATTACHMENT, SIGNOFFS_ATTACHMENT } from "../src/schema/attachments.ts";
import { ROLES } from "../src/schema/signoff.ts";
import { signedAtText } from "./format.ts";
import type { SheetModel, SignOffRole } from "./model.ts";
import { statusMark } from "./status.ts";

const LABELS: Record<SignOffRole, string> = { prepared: "Prepared by", checked: "Checked by", approved: "Approved by" };

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
            <b>Revision {m.revision}</b> of calculation{" "}
            <span class="user">{m.calcNumber ?? m.document.calcNumber ?? "(no number given)"}</span>.{" "}
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
      {m.importedUnsigned ? (
        <p class="revision-line">
          <b>Imported, not signed in these records.</b> This revision came from another database without signatures these records trust, so
          it carries no sign-off here: check and sign it again before use.
        </p>
      ) : null}
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
          {ROLES.map((role) => {
            const label = LABELS[role];
            const s = m.signoffs.find((x) => x.role === role);
            return (
              <tr>
                <th class="role">{label}</th>
                <td>{s ? <span class="user">{s.name}</span> : <div class="line" />}</td>
                <td>{s ? signedAtText(s.signedAt) : <div class="line" />}</td>
                <td class="sig">
                  <div class="line" />
                  {s ? (
                    <span class="blank">
                      signed in the records
                      {s.signature ? (
                        <>
                          {" "}
                          · Ed25519 <span class="mono">{s.signature.slice(0, 16)}…</span>
                        </>
                      ) : null}
                    </span>
                  ) : null}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      {m.keyFingerprint && m.signoffs.length > 0 ? (
        <p class="note">
          Each sign-off is signed with the records' Ed25519 key, fingerprint <span class="mono">{m.keyFingerprint}</span>; the signatures
          are attached as <span class="mono">{SIGNOFFS_ATTACHMENT}</span>. Check them with{" "}
          <span class="mono">npm run -s cli -- verify SHEET.pdf --key KEY.pem</span> (the public key is served at{" "}
          <span class="mono">/api/v1/keys</span>).
        </p>
      ) : null}
      <p class="note">
        The input of this sheet is attached to the PDF as <span class="mono">{INPUT_ATTACHMENT}</span>. To check that the paper still
        matches its input and this engine, run <span class="mono">npm run -s cli -- verify SHEET.pdf</span> and compare the fingerprint it
        reports with the one printed on every page.
      </p>
    </section>
  );
}
