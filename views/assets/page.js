// Hoopwise page script: small touches on top of htmx. The page works without it.

// An error slot swapped in by htmx changes text only; mark its field invalid (or valid again) to match,
// so assistive technology announces the state the server decided.
function syncInvalid() {
  for (const slot of document.querySelectorAll(".field-error")) {
    const field = document.querySelector(`[aria-describedby~="${slot.id}"]`);
    if (!field) continue;
    if (slot.textContent.trim() === "") field.removeAttribute("aria-invalid");
    else field.setAttribute("aria-invalid", "true");
  }
}
document.addEventListener("htmx:afterSettle", syncInvalid);

// Printing the sheet takes a few seconds while the PDF is made: say so until the answer arrives.
const NOTE_TIMEOUT_MS = 30000;
let noteTimer;
function hideSheetNote() {
  const note = document.getElementById("sheet-note");
  if (note) note.hidden = true;
  clearTimeout(noteTimer);
}
document.addEventListener("click", (event) => {
  const button = event.target instanceof Element ? event.target.closest("#print-sheet") : null;
  const note = document.getElementById("sheet-note");
  if (!button || !note) return;
  note.hidden = false;
  noteTimer = setTimeout(hideSheetNote, NOTE_TIMEOUT_MS);
});
// Coming back to the page (back button, or a download that left the page in place) ends the wait.
window.addEventListener("pageshow", hideSheetNote);
window.addEventListener("focus", () => setTimeout(hideSheetNote, 1500));

// A logger's file can be tens of megabytes: while it is sent, show how much has gone, then that it
// is being read and counted, until the answer arrives.
const LOG_PROGRESS_FROM_BYTES = 256 * 1024;
function logProgress() {
  const box = document.getElementById("log-progress");
  const file = document.getElementById("f-log-file");
  const mode = document.querySelector('input[name="pressure.mode"]:checked');
  if (!box || !file?.files || file.files.length === 0 || (mode && mode.value !== "log")) return undefined;
  return { box, bar: box.querySelector("progress"), text: box.querySelector(".log-progress-text") };
}
const megabytes = (n) => (n / 1048576).toFixed(1);
document.addEventListener("htmx:xhr:progress", (event) => {
  const p = logProgress();
  const { loaded, total, lengthComputable } = event.detail;
  if (!p || !lengthComputable || total < LOG_PROGRESS_FROM_BYTES) return;
  p.box.hidden = false;
  if (loaded < total) {
    p.bar.value = Math.round((100 * loaded) / total);
    p.text.textContent = `Sending the log: ${megabytes(loaded)} of ${megabytes(total)} MB`;
  } else {
    p.bar.removeAttribute("value");
    p.text.textContent = `Sent ${megabytes(total)} MB; reading and counting the log…`;
  }
});
document.addEventListener("htmx:afterRequest", () => {
  const box = document.getElementById("log-progress");
  if (box) box.hidden = true;
});
