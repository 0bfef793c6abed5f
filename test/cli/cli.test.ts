import { spawnSync } from "node:child_process";
import { describe, expect, it } from "vitest";

const root = new URL("../..", import.meta.url).pathname;
const cli = (args: string[], input?: string) =>
  spawnSync(process.execPath, ["--import", "tsx", "src/cli.ts", ...args], { cwd: root, input, encoding: "utf8", timeout: 30_000 });

// Each case starts one or two Node processes with tsx; on a loaded machine that takes well over the default 20 s.
describe("command line", { timeout: 90_000 }, () => {
  it("check answers the format's example with a result document, exit 0", () => {
    const r = cli(["check", "test/fixtures/format-example.json"]);
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.format).toBe("hoopwise.result/1");
    expect(["pass", "fail", "refer"]).toContain(out.verdict);
    // thin wall: σθ = p·r/t = 0.06 × 1500 / 1.6 = 56.25 MPa (Roark Ch. 13; the format's example)
    expect(out.membrane.hoopMax_MPa).toBeCloseTo(56.25, 10);
    // Kirsch in the 2:1 field: Kt = 2.5 (Peterson Chart 4.1)
    expect(out.notch.kt).toBeCloseTo(2.5, 10);
  });

  it("reads standard input with -", () => {
    const r = cli(["check", "-"], JSON.stringify({ format: "hoopwise.check/1" }));
    expect(r.status).toBe(2);
    const out = JSON.parse(r.stdout);
    expect(out.errors.map((e: { path: string }) => e.path)).toEqual(expect.arrayContaining(["shell", "pressure", "material", "fatigue"]));
  });

  it("invalid JSON and a missing file are input errors, exit 2", () => {
    expect(cli(["check", "-"], "{not json").status).toBe(2);
    const r = cli(["check", "no/such/file.json"]);
    expect(r.status).toBe(2);
    expect(JSON.parse(r.stdout).errors[0].path).toBe("(file)");
  });

  it("lists materials with the typical-values flag and prints the JSON Schema", () => {
    const m = cli(["materials"]);
    expect(m.status).toBe(0);
    expect(m.stdout).toMatch(/verify against certified data/);
    expect(m.stdout).toMatch(/al-2024-t3/);
    const s = cli(["schema"]);
    const schema = JSON.parse(s.stdout);
    expect(schema.properties.shell.properties.thickness_mm.type).toBe("number");
    expect(schema.required).toEqual(expect.arrayContaining(["format", "shell", "pressure", "material", "fatigue"]));
    const r = JSON.parse(cli(["schema", "--result"]).stdout);
    expect(r.title).toBe("Hoopwise result, format hoopwise.result/1");
    expect(r.properties.verdict.enum).toEqual(["pass", "fail", "refer"]);
    expect(r.additionalProperties).toBe(false);
  });

  it("--help explains the commands and the cautions", () => {
    const r = cli(["--help"]);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/check FILE/);
    expect(r.stdout).toMatch(/not a code-compliance certificate/);
  });
});
