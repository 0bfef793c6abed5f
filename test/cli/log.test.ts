import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { checkDocument } from "../../src/engine/index.ts";

const root = new URL("../..", import.meta.url).pathname;
const cli = (args: string[]) =>
  spawnSync(process.execPath, ["--import", "tsx", "src/cli.ts", ...args], { cwd: root, encoding: "utf8", timeout: 90_000 });
const example = JSON.parse(readFileSync(new URL("../fixtures/format-example.json", import.meta.url), "utf8"));
const dir = mkdtempSync(join(tmpdir(), "hoopwise-log-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("check with a pressure log", () => {
  it("takes the chosen column in kPa with a decimal comma after a preamble, and gates it, as the same history given in MPa", {
    timeout: 120_000,
  }, () => {
    const kPa = Array.from({ length: 300 }, (_, i) => Math.round((30 + 25 * Math.sin(i / 9) + (i % 2 ? 0.8 : 0)) * 10) / 10);
    const lines = ["invented receiver logger", "n;p_kPa", ...kPa.map((p, i) => `${i};${String(p).replace(".", ",")}`)];
    const file = join(dir, "log.csv");
    writeFileSync(file, lines.join("\n"));
    const doc = join(dir, "check.json");
    writeFileSync(doc, JSON.stringify({ ...example, crack: undefined }));
    const r = cli(["check", doc, "--log", file, "--column", "p_kPa", "--unit", "kPa", "--decimal", ",", "--skip", "2", "--gate", "2"]);
    expect(r.status, r.stdout).toBe(0);
    expect(r.stderr).toMatch(/300 points read/);
    const out = JSON.parse(r.stdout);
    // The same check with the history typed in MPa (1 kPa = 0.001 MPa) and the gate of 2 kPa = 0.002 MPa.
    const direct = checkDocument({ ...example, crack: undefined, pressure: { history_MPa: kPa.map((p) => p / 1000), gate_MPa: 0.002 } });
    expect(direct.ok).toBe(true);
    if (!direct.ok) return;
    expect(out.spectrum.historyPoints).toBe(300);
    expect(out.spectrum.damagePerPass).toBeCloseTo(direct.result.spectrum!.damagePerPass!, 12);
    expect(out.steps.find((s: { id: string }) => s.id === "hysteresis-gate").value).toBeGreaterThan(0);
  });

  it("reports a bad cell by line with exit 2, and log options without --log", { timeout: 180_000 }, () => {
    const file = join(dir, "bad.csv");
    writeFileSync(file, "p\n0.01\nx\n");
    const doc = join(dir, "check.json");
    writeFileSync(doc, JSON.stringify(example));
    const bad = cli(["check", doc, "--log", file, "--skip", "1"]);
    expect(bad.status).toBe(2);
    expect(JSON.parse(bad.stdout).errors[0].path).toBe("log.line 3");
    const stray = cli(["check", doc, "--unit", "kPa"]);
    expect(stray.status).toBe(2);
    expect(JSON.parse(stray.stdout).errors[0].path).toBe("--unit");
  });
});
