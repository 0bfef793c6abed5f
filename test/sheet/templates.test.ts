import fc from "fast-check";
import { Fragment, jsx } from "hono/jsx";
import { describe, expect, it } from "vitest";
import { DEMOS } from "../../src/demo/index.ts";
import type { Step } from "../../src/engine/index.ts";
import { sheetHtml } from "../../src/sheet/sheet.ts";
import { life, margin, sig, signedAtText } from "../../templates/format.ts";
import { typeset } from "../../templates/math.tsx";
import { dualText } from "../../templates/quantities.ts";
import { statusMark } from "../../templates/status.ts";
import { groupSteps } from "../../templates/stepGroups.ts";

const set = (text: string) => String(jsx(Fragment, {}, ...typeset(text)));

describe("typeset", () => {
  it("writes powers and subscripts as a hand calculation does", () => {
    expect(set("p = p₀·(1 − L·h/T₀)^(g₀/(R·L))")).toBe("p = p₀·(1 − L·h/T₀)<sup>g₀/(R·L)</sup>");
    expect(set("N_allow = 1.909×10^12/3")).toBe("N<sub>allow</sub> = 1.909 × 10<sup>12</sup>/3");
    expect(set("C = 1.6×10^-11")).toBe("C = 1.6 × 10<sup>−11</sup>");
    expect(set("σvm = √(σθ² − σθ·σx + σx²)")).toBe("σ<sub>vm</sub> = √(σ<sub>θ</sub>² − σ<sub>θ</sub>·σ<sub>x</sub> + σ<sub>x</sub>²)");
    expect(set("σ_max = Kf·σθ,max")).toBe("σ<sub>max</sub> = K<sub>f</sub>·σ<sub>θ,max</sub>");
    expect(set("x̄ = Σ log10 Nᵢ / n")).toBe("x̄ = Σ log₁₀ Nᵢ / n");
    expect(set("SF = 10^x̄ / N_L, z_γσ/√n")).toBe("SF = 10<sup>x̄</sup> / N<sub>L</sub>, z<sub>γ</sub>σ/√n");
    expect(set("a - b, (-2)")).toBe("a - b, (−2)"); // a hyphen between words stays; a negative number gets U+2212
  });

  it("leaves plain words alone and escapes every character of what it is given", () => {
    expect(set("Static strength (von Mises against yield / factor)")).toBe("Static strength (von Mises against yield / factor)");
    expect(set("Kirsch (1898); Peterson's Chart 4.1")).toBe("Kirsch (1898); Peterson&#39;s Chart 4.1");
    // Whatever the text, no markup but our own <sup>/<sub> comes out.
    fc.assert(
      fc.property(fc.string({ unit: "grapheme", maxLength: 60 }), (s) => {
        const html = set(s).replace(/<\/?su[bp]>/g, "");
        expect(html).not.toMatch(/[<>]/);
      }),
    );
  });
});

describe("numbers on the sheet", () => {
  it("uses four significant figures, a true minus, thin-spaced thousands and written powers of ten", () => {
    expect(sig(43.2933176758025)).toBe("43.29");
    expect(sig(-0.102)).toBe("−0.102");
    expect(sig(159619.935)).toBe("159\u2009600");
    expect(sig(1150)).toBe("1150");
    expect(sig(1909211780589.5)).toBe("1.909 × 10¹²");
    expect(sig(9.427974509167368e-8)).toBe("9.428 × 10⁻⁸");
    expect(sig(null)).toBe("—");
    expect(life(null)).toBe("unlimited");
    // One way to show a reserve on every face: a signed percentage (src/present/numbers.ts).
    expect(margin(5.1344)).toBe("+513 %");
    expect(margin(-0.25)).toBe("−25 %");
  });

  it("prints a sign-off time in UTC and anything else as given", () => {
    expect(signedAtText("2025-03-10T09:15:00+01:00")).toBe("2025-03-10 08:15 UTC");
    expect(signedAtText("last Tuesday")).toBe("last Tuesday");
  });

  it("shows the user's unit with SI beside it only when they differ", () => {
    const us = { length: "in", stress: "ksi", pressure: "psi", altitude: "ft" } as const;
    // 1 in = 25.4 mm exactly; 1 ksi = 6.894757 MPa (NIST SP 811, B.8).
    expect(dualText(25.4, "length", us)).toBe("1 in (25.4 mm)");
    expect(dualText(68.94757293168, "stress", us)).toBe("10 ksi (68.95 MPa)");
    expect(dualText(43.29, "stress", { length: "mm", stress: "MPa", pressure: "kPa", altitude: "m" })).toBe("43.29 MPa");
  });
});

describe("status mark", () => {
  const at = "2025-01-01T00:00:00Z";
  it("follows the sign-offs, and a superseded revision is superseded whatever it carries", () => {
    expect(statusMark([], false).state).toBe("draft");
    expect(statusMark([{ role: "prepared", name: "A", signedAt: at }], false).words).toBe("PREPARED — AWAITING CHECK");
    const all = (["prepared", "checked", "approved"] as const).map((role) => ({ role, name: "A", signedAt: at }));
    expect(statusMark(all, false).words).toBe("CHECKED AND APPROVED");
    expect(statusMark(all, true).words).toBe("SUPERSEDED — DO NOT USE");
  });
});

describe("calculation headings", () => {
  const step = (id: string): Step => ({ id, title: id, equation: "", substituted: "", value: 1, unit: "—", source: "" });
  it("groups consecutive steps by kind, numbers them in order, and keeps an unknown step in its place", () => {
    const groups = groupSteps(["hoop", "axial", "some-new-step", "kt", "kf", "crack-range"].map(step));
    expect(groups.map((g) => [g.title, g.steps.map((s) => s.no)])).toEqual([
      ["Membrane stresses", [1, 2, 3]],
      ["Stress concentration at the opening", [4, 5]],
      ["Crack growth", [6]],
    ]);
  });
});

describe("sheetHtml", () => {
  it("sets every part of the sheet in order, with the status and page count in the header and the fingerprint in the footer", () => {
    const out = sheetHtml(DEMOS[1].document, { now: new Date("2025-03-14T12:00:00Z") });
    if (!out.ok) throw new Error(JSON.stringify(out.errors));
    const headings = [...out.html.matchAll(/<h2><span class="num">(\d)<\/span>([^<]+)<\/h2>/g)].map((m) => `${m[1]} ${m[2]}`);
    expect(headings).toEqual([
      "1 Scope and assumptions",
      "2 Inputs",
      "3 Calculation",
      "4 Results",
      "5 Plots",
      "6 Cautions and the governing code",
      "7 Sign-off",
    ]);
    expect(out.headerHtml).toContain("UNCHECKED DRAFT — NOT FOR USE");
    expect(out.headerHtml).toContain("2025-03-14");
    expect(out.footerHtml).toContain(out.result.fingerprint);
    expect(out.headerHtml).toContain('<span class="pageNumber"></span>');
    // Nothing in the document refers outside it.
    expect(out.html).not.toMatch(/\b(src|href)=|url\(|@import|@font-face/);
  });
});

describe("sheet options", () => {
  it("takes the records' sign-off rows as they are, extra fields and all", () => {
    const row = { role: "prepared" as const, name: "Invented Preparer Ann", signedAt: "2025-03-10T08:15:00Z", imported: false };
    const out = sheetHtml(DEMOS[1].document, { revision: 1, signoffs: [row] });
    if (!out.ok) throw new Error(JSON.stringify(out.errors));
    expect(out.model.signoffs).toEqual([{ role: "prepared", name: "Invented Preparer Ann", signedAt: "2025-03-10T08:15:00Z" }]);
    expect(out.headerHtml).toContain("PREPARED — AWAITING CHECK");
  });

  it("refuses a role signed twice, naming the entry", () => {
    const twice = [
      { role: "checked" as const, name: "A", signedAt: "2025-01-01" },
      { role: "checked" as const, name: "B", signedAt: "2025-01-02" },
    ];
    const out = sheetHtml(DEMOS[1].document, { signoffs: twice });
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.errors).toEqual([{ path: "(sheet).signoffs.1.role", message: 'the role "checked" is signed twice' }]);
  });
});
