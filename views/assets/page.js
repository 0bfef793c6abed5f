// Hoopwise page script: small touches on top of htmx. The page works without it.
"use strict";

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
