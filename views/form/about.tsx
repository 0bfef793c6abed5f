import { TextInput } from "./controls.tsx";
import type { FormState } from "./state.ts";

/** What the check is about: free text that heads the result and the printed sheet. */
export function AboutSection({ s }: { s: FormState }) {
  return (
    <fieldset class="section" id="sec-about">
      <legend>About this check</legend>
      <div class="grid">
        <TextInput s={s} name="title" label="Title" wide placeholder="e.g. skin bay at the door surround" />
        <TextInput s={s} name="project" label="Project" />
        <TextInput s={s} name="calcNumber" label="Calculation number" />
        <TextInput s={s} name="notes" label="Notes" wide multiline />
      </div>
    </fieldset>
  );
}
