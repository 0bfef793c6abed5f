import { blockField, errorId, fieldId } from "./fields.ts";
import { PRESSURE_UNITS, unitLabel } from "../../src/schema/units.ts";
import { Choice, ErrorSlot, NumberInput, Panel, Select, TextInput } from "./controls.tsx";
import type { FormState } from "./state.ts";

/** The pressure cycle, given one of four ways. Pressures are differential: inside minus outside. */
export function PressureSection({ s }: { s: FormState }) {
  return (
    <fieldset class="section" id="sec-pressure">
      <legend>2 · Pressure cycle</legend>
      <p class="hint">Differential pressure: inside minus outside.</p>
      <Choice
        s={s}
        name="pressure.mode"
        legend="Give the pressure as"
        fallback="direct"
        options={[
          { value: "direct", label: "one cycle, highest and lowest" },
          { value: "altitude", label: "flight and cabin altitudes" },
          { value: "history", label: "a recorded history" },
          { value: "log", label: "a logger's file (CSV or TSV)" },
          { value: "blocks", label: "blocks of repeated cycles" },
        ]}
      />
      <Panel name="pressure.mode" value="direct">
        <div class="grid">
          <NumberInput s={s} name="pressure.max" />
          <NumberInput s={s} name="pressure.min" placeholder="0" />
        </div>
      </Panel>
      <Panel name="pressure.mode" value="altitude">
        <div class="grid">
          <NumberInput s={s} name="altitude.flight" />
          <NumberInput s={s} name="altitude.cabin" />
          <NumberInput s={s} name="altitude.min" label="Lowest pressure on the ground" placeholder="0" />
        </div>
        <p class="hint">The highest pressure is the standard-atmosphere pressure at the cabin altitude less that at the flight altitude.</p>
      </Panel>
      <Panel name="pressure.mode" value="history">
        <HistoryInput s={s} />
      </Panel>
      <Panel name="pressure.mode" value="log">
        <LogInput s={s} />
      </Panel>
      <Panel name="pressure.mode" value="blocks">
        <BlockTable s={s} />
      </Panel>
    </fieldset>
  );
}

function HistoryInput({ s }: { s: FormState }) {
  const name = "history.text";
  const errs = s.errors.get(name);
  const unit = unitLabel("pressure", s.units);
  return (
    <div class="grid">
      <div class="field wide">
        <label for={fieldId(name)}>
          Pressure history <span class="unit">({unit})</span>
        </label>
        <textarea
          id={fieldId(name)}
          name={name}
          rows={5}
          spellcheck={false}
          aria-describedby={`${errorId(name)} ${fieldId(name)}-hint`}
          aria-invalid={errs ? "true" : undefined}
        >
          {s.values[name] ?? ""}
        </textarea>
        <p class="hint" id={`${fieldId(name)}-hint`}>
          Numbers in order, separated by spaces, commas or new lines; or a CSV table, of which the last column is read. It is counted into
          cycles by rainflow (ASTM E1049); one pass of the history counts as one use against the design life.
        </p>
        <ErrorSlot name={name} messages={errs} />
      </div>
      <div class="field wide">
        <label for={fieldId("history.file")}>…or read it from a file (CSV or plain text)</label>
        <input type="file" id={fieldId("history.file")} name="history.file" accept=".csv,.txt,.tsv,text/csv,text/plain" />
        <p class="hint">Choosing a file fills the box above; without scripting, press “Work it out” after choosing.</p>
      </div>
    </div>
  );
}

/**
 * A pressure logger's file, read on the server with the same reader as the command line's --log:
 * the column, its unit, the decimal separator and the header lines to skip; a hysteresis gate
 * drops ripples smaller than the size given. The file stays in its input and is sent with each
 * recalculation; "Preview" draws the history as logged without counting it.
 */
function LogInput({ s }: { s: FormState }) {
  const file = "log.file";
  const errs = s.errors.get(file);
  const unit = s.values["log.unit"] || s.units.pressure;
  return (
    <div class="log-input">
      <div class="grid">
        <div class="field wide">
          <label for={fieldId(file)}>Logger's file (CSV or TSV, one reading a line)</label>
          <input
            type="file"
            id={fieldId(file)}
            name={file}
            accept=".csv,.tsv,.txt,text/csv,text/tab-separated-values,text/plain"
            aria-describedby={`${errorId(file)} ${fieldId(file)}-hint`}
            aria-invalid={errs ? "true" : undefined}
          />
          <p class="hint" id={`${fieldId(file)}-hint`}>
            Cells separated by tabs, semicolons or commas. The file is read on the server each time the check is worked out; without
            scripting, choose it again after each “Work it out”.
          </p>
          <ErrorSlot name={file} messages={errs} />
        </div>
        <TextInput
          s={s}
          name="log.column"
          label="Column"
          placeholder="1"
          hint="Counted from 1, or the column's name in the last header line."
        />
        <Select
          s={s}
          name="log.unit"
          label="Unit of the readings"
          options={PRESSURE_UNITS.map((u) => ({ value: u, label: u }))}
          fallback={unit}
        />
        <Select
          s={s}
          name="log.decimal"
          label="Decimal separator"
          options={[
            { value: ".", label: "point (12.5)" },
            { value: ",", label: "comma (12,5)" },
          ]}
        />
        <TextInput s={s} name="log.skip" label="Header lines to skip" placeholder="0" />
        <TextInput
          s={s}
          name="log.gate"
          label={`Hysteresis gate (${unit})`}
          placeholder="none"
          hint="Ripples smaller than this pressure range are dropped before counting; the result says how many reversals it removed."
        />
      </div>
      <div class="log-actions">
        <button
          type="submit"
          class="secondary"
          id="log-preview-button"
          hx-post="/log/preview"
          hx-target="#log-preview"
          hx-swap="innerHTML"
          hx-indicator="#log-progress"
        >
          Preview the log
        </button>
        <div id="log-progress" class="log-progress" hidden>
          <progress max={100} value={0} aria-label="Sending the log" />
          <span class="log-progress-text" role="status" aria-live="polite" />
        </div>
      </div>
      <div id="log-preview" class="log-preview" aria-live="polite" />
    </div>
  );
}

function BlockTable({ s }: { s: FormState }) {
  const unit = unitLabel("pressure", s.units);
  return (
    <div class="blocks">
      <table>
        <caption>
          Blocks of cycles <span class="hint">— one pass through all blocks counts as one use against the design life</span>
        </caption>
        <thead>
          <tr>
            <th scope="col">Block</th>
            <th scope="col">Highest ({unit})</th>
            <th scope="col">Lowest ({unit})</th>
            <th scope="col">Cycles</th>
          </tr>
        </thead>
        <tbody>
          {s.blockRows.map((row) => (
            <tr>
              <th scope="row">{row + 1}</th>
              <BlockCell s={s} row={row} col="max" label={`Block ${row + 1}, highest pressure (${unit})`} />
              <BlockCell s={s} row={row} col="min" label={`Block ${row + 1}, lowest pressure (${unit})`} />
              <BlockCell s={s} row={row} col="cycles" label={`Block ${row + 1}, number of cycles`} />
            </tr>
          ))}
        </tbody>
      </table>
      <ErrorSlot name="blocks" messages={s.errors.get("blocks")} />
      <button type="submit" name="blocks.more" value="1" class="secondary" hx-post="/recalc">
        More rows
      </button>
    </div>
  );
}

function BlockCell({ s, row, col, label }: { s: FormState; row: number; col: "max" | "min" | "cycles"; label: string }) {
  const name = blockField(row, col);
  const errs = s.errors.get(name);
  return (
    <td>
      <input
        type="text"
        inputmode="decimal"
        autocomplete="off"
        id={fieldId(name)}
        name={name}
        value={s.values[name] ?? ""}
        aria-label={label}
        aria-describedby={errorId(name)}
        aria-invalid={errs ? "true" : undefined}
      />
      <ErrorSlot name={name} messages={errs} />
    </td>
  );
}
