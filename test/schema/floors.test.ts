import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { checkDocument } from "../../src/engine/index.ts";
import { parseCheck } from "../../src/engine/input.ts";
import { nonFiniteNumbers } from "../hardening/answers.ts";

/** The format example with the crack and evidence sections, so every floored field is in play. */
const example = JSON.parse(readFileSync(new URL("../fixtures/format-example.json", import.meta.url), "utf8"));
const withValue = (path: string, value: unknown) => {
  const doc = structuredClone(example);
  const keys = path.split(".");
  let at = doc;
  for (const k of keys.slice(0, -1)) at = at[k];
  at[keys[keys.length - 1]] = value;
  return doc;
};

// Each floored field: the smallest value taken, and a value just below it.
const FLOORS: [string, number, number][] = [
  ["shell.thickness_mm", 0.001, 0.0009],
  ["crack.initial_mm", 0.001, 0.0009],
  ["material.modulus_MPa", 1, 0.9],
  ["material.toughness_MPaSqrtM", 0.1, 0.09],
  ["material.parisC", 1e-20, 1e-21],
  ["material.fatigueStrengthExponent", -0.01, -0.009],
  ["fatigue.designLife_cycles", 1, 0.5],
  ["pressure.max_MPa", 1e-6, 1e-7],
  ["evidence.reliability", 0.5, 0.49],
  ["evidence.lives_cycles", [1, 2, 3] as unknown as number, [0.5, 2, 3] as unknown as number],
];

describe("the schema's floors", () => {
  it.each(FLOORS)("%s: refuses a value below its floor, naming the field", (path, _, below) => {
    const r = parseCheck(withValue(path, below));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors.map((e) => e.path)).toContainEqual(expect.stringMatching(new RegExp(`^${path.replace(/\./g, "\\.")}`)));
  });

  it.each(FLOORS)("%s: takes the floor itself, and the engine gives finite numbers there", (path, floor) => {
    const out = checkDocument(withValue(path, floor));
    if (!out.ok)
      expect(out.errors.map((e) => e.path)).not.toContain(path); // another field may object to so odd a value
    else expect(nonFiniteNumbers(out.result)).toEqual([]);
  });

  it("keeps the plainer message for zero and below", () => {
    const r = parseCheck(withValue("shell.thickness_mm", 0));
    expect(r.ok ? [] : r.errors).toEqual([{ path: "shell.thickness_mm", message: "the wall thickness must be greater than 0" }]);
  });
});
