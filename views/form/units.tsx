/**
 * @module views/form/units
 * The units the form is read and written in. The hidden field records the units the numbers on
 * the page are in now, so that when the choice changes the server converts them rather than
 * reading them in the new unit.
 * The lists of units and the key of a choice are src/schema/units.ts's; handed the form's state
 * (state.ts), the section also carries the form's hidden `carry` field when it has one.
 */
import { ALTITUDE_UNITS, LENGTH_UNITS, PRESSURE_UNITS, STRESS_UNITS, unitsKey } from "../../src/schema/units.ts";
import { Select } from "./controls.tsx";
import type { FormState } from "./state.ts";

const opts = (xs: readonly string[]) => xs.map((x) => ({ value: x, label: x }));

export function UnitsSection({ s }: { s: FormState }) {
  const u = s.units;
  const v = {
    ...s,
    values: { ...s.values, "units.length": u.length, "units.stress": u.stress, "units.pressure": u.pressure, "units.altitude": u.altitude },
  };
  return (
    <fieldset class="section" id="sec-units">
      <legend>Units</legend>
      <input type="hidden" name="units.shown" value={unitsKey(u)} />
      {s.values.carry ? <input type="hidden" name="carry" value={s.values.carry} /> : null}
      <div class="grid four">
        <Select s={v} name="units.length" label="Lengths" options={opts(LENGTH_UNITS)} />
        <Select s={v} name="units.stress" label="Stresses" options={opts(STRESS_UNITS)} />
        <Select s={v} name="units.pressure" label="Pressures" options={opts(PRESSURE_UNITS)} />
        <Select s={v} name="units.altitude" label="Altitudes" options={opts(ALTITUDE_UNITS)} />
      </div>
      <p class="hint">The check itself is always worked in SI (mm, MPa); the worked steps below show it that way.</p>
    </fieldset>
  );
}
