import { spawnSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { DEMOS } from "../../src/demo/index.ts";
import { checkDocument } from "../../src/engine/index.ts";

const root = new URL("../..", import.meta.url).pathname;
// 44 whole result documents (steps, a–N curves of each crack orientation, the fleet's density) run past
// spawnSync's default 1 MiB of output, which would kill the child; allow what a batch really writes.
const cli = (args: string[], input?: string) =>
  spawnSync(process.execPath, ["--import", "tsx", "src/cli.ts", ...args], {
    cwd: root,
    input,
    encoding: "utf8",
    timeout: 90_000,
    maxBuffer: 64 * 1024 * 1024,
  });
const example = JSON.parse(readFileSync(new URL("../fixtures/format-example.json", import.meta.url), "utf8"));

describe("batch", () => {
  it("answers each line on its own line, in input order, an invalid line with its errors, and the run goes on", {
    timeout: 120_000,
  }, () => {
    // Thicknesses that differ per line, so an answer out of order would show in its title and its hoop stress.
    const docs = Array.from({ length: 40 }, (_, i) => ({
      ...example,
      title: `line ${i}`,
      shell: { ...example.shell, thickness_mm: 1.2 + 0.02 * i },
    }));
    const lines = docs.map((d) => JSON.stringify(d));
    lines.splice(7, 0, "{not json");
    lines.splice(20, 0, JSON.stringify({ ...example, shell: { ...example.shell, thickness_mm: -1 } }));
    lines.splice(30, 0, "");
    lines.push(JSON.stringify(DEMOS[0].document));
    const r = cli(["batch", "-", "--workers", "2"], `${lines.join("\n")}\n`);
    expect(r.status, r.stderr).toBe(2); // some lines had errors
    const out = r.stdout
      .trimEnd()
      .split("\n")
      .map((l) => JSON.parse(l));
    expect(out).toHaveLength(lines.length);
    expect(out[7].errors[0].path).toBe("(document)");
    expect(out[7].errors[0].message).toMatch(/the line is not valid JSON/);
    expect(out[20].errors.map((e: { path: string }) => e.path)).toContain("shell.thickness_mm");
    expect(out[30].errors[0].path).toBe("(line)");
    let k = 0;
    for (let i = 0; i < out.length - 1; i++) {
      if (i === 7 || i === 20 || i === 30) continue;
      expect(out[i].title).toBe(`line ${k}`);
      // The same numbers as the check run alone (the engine in-process is the reference for the pool's plumbing).
      const alone = checkDocument(docs[k]);
      expect(alone.ok && out[i].membrane.hoopMax_MPa).toBe(alone.ok && alone.result.membrane.hoopMax_MPa);
      // thin wall σθ = p·r/t (Roark Ch. 13): 0.06 × 1500 / t
      expect(out[i].membrane.hoopMax_MPa).toBeCloseTo((0.06 * 1500) / (1.2 + 0.02 * k), 9);
      k++;
    }
    expect(out.at(-1).title).toBe(DEMOS[0].document.title);
    expect(r.stderr).toMatch(/batch: 44 of 44 lines answered, 3 with errors/);
  });

  it("exits 0 when every line gives a result; refuses a bad --workers and a missing file with exit 2", { timeout: 180_000 }, () => {
    const ok = cli(["batch", "-", "--workers", "1"], `${JSON.stringify(example)}\n${JSON.stringify(example)}`);
    expect(ok.status).toBe(0);
    expect(ok.stdout.trimEnd().split("\n")).toHaveLength(2);
    const bad = cli(["batch", "-", "--workers", "0"], "");
    expect(bad.status).toBe(2);
    expect(JSON.parse(bad.stdout).errors[0].path).toBe("--workers");
    const missing = cli(["batch", "no/such.ndjson"]);
    expect(missing.status).toBe(2);
    expect(JSON.parse(missing.stdout).errors[0].path).toBe("(file)");
  });
});
