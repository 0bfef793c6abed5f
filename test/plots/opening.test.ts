/**
 * The opening's pictures: the outline coloured by edge stress with the fastener holes and the
 * crack's path, and the edge stress against arc length.
 */
import { describe, expect, it } from "vitest";
import { DEMOS } from "../../src/demo/index.ts";
import { checkDocument } from "../../src/engine/index.ts";
import { edgeStressPlot, openingPicture } from "../../src/plots/index.ts";

describe("the opening's pictures", () => {
  const out = checkDocument(DEMOS[0].document);
  if (!out.ok) throw new Error("the cabin demo must run");
  const opening = out.result.notch.opening;
  if (!opening) throw new Error("the cabin demo has a shaped opening");

  it("draws the outline, the governing point, every fastener hole with its Kt and the curvature parameter", () => {
    const svg = openingPicture(opening);
    expect(svg.startsWith("<svg")).toBe(true);
    expect(svg.match(/class="fastener"/g)).toHaveLength(opening.fasteners.length);
    expect(svg).toContain("governing-point");
    expect(svg).toContain(`governs: Kt ${opening.governing.kt.toPrecision(3)}`);
    expect(svg).toMatch(/curvature parameter β = [\d.]+ \(beyond 0\.5: refer\)/);
  });

  it("marks the demo crack's path from its fastener hole to the window's edge", () => {
    const path = out.result.crack?.path;
    if (!path) throw new Error("the cabin demo grows its crack from a fastener hole");
    const svg = openingPicture({ ...opening, crackPath: path });
    expect(svg).toContain("crack-path");
    expect(svg).toContain(`crack path from hole ${path.fastener}`);
    expect(openingPicture(opening)).not.toContain("crack-path");
  });

  it("plots the edge stress against arc length up to the perimeter", () => {
    const svg = edgeStressPlot(opening);
    expect(svg).toContain("edge-stress");
    const sMax = Math.max(...opening.edge.map((e) => e[2]));
    // a 230 × 320 mm window with 55 mm corners: perimeter 2(120 + 210) + 2π·55 = 1006 mm (hand calculation)
    expect(sMax).toBeGreaterThan(990);
    expect(sMax).toBeLessThan(1010);
  });
});
