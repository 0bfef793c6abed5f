import { describe, expect, it } from "vitest";
import { readPressureLog } from "../../src/schema/pressureLog.ts";

describe("pressure logs", () => {
  it("reads a TSV column by number, converting kPa to MPa (1 kPa = 10⁻³ MPa, SI)", () => {
    const r = readPressureLog("t\tp\n0\t0\n1\t57.2\n2\t0\n", { column: 2, unit: "kPa", skip: 1 });
    expect(r.ok && r.delimiter).toBe("\t");
    expect(r.ok && r.history_MPa).toEqual([0, 0.0572, 0]);
  });

  it("reads a semicolon file with a decimal comma, a preamble, a column by header name, and psi (1 psi = 6894.757293168 Pa, NIST SP 811 B.8)", () => {
    const text = "Logger export, invented workshop receiver\r\nsample;Pressure;temp\r\n1;8,5;20,1\r\n\r\n2;120;20,3\r\n";
    const r = readPressureLog(text, { column: "pressure", unit: "psi", decimal: ",", skip: 2 });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.rows).toBe(2);
    expect(r.history_MPa[0]).toBeCloseTo(8.5 * 0.006894757293168, 12);
    expect(r.history_MPa[1]).toBeCloseTo(120 * 0.006894757293168, 12);
  });

  it("names the line and column of a cell that is not a number, and hints at the decimal comma", () => {
    const r = readPressureLog("p\n0.1\n0,2\nabc\n", { skip: 1 });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors.map((e) => e.path)).toEqual(["log.line 3", "log.line 4"]);
    expect(r.errors[0].message).toMatch(/decimal separator ","/);
  });

  it("refuses a column that is not there, a name without a header, and a log with no data", () => {
    const short = readPressureLog("1,2\n3,4\n", { column: 3 });
    expect(!short.ok && short.errors[0].path).toBe("log.line 1");
    const noHeader = readPressureLog("1,2\n", { column: "p" });
    expect(!noHeader.ok && noHeader.errors[0].path).toBe("log.column");
    const empty = readPressureLog("header\n\n", { skip: 1 });
    expect(!empty.ok && empty.errors[0].path).toBe("log");
  });
});
