import { postedForm } from "./postedForm.ts";
import { gunzipSync } from "node:zlib";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { DEMOS, findDemo } from "../../src/demo/index.ts";
import { createApp } from "../../src/web/app.ts";
import { decodeCheck, encodeCheck } from "../../src/web/link.ts";
import { pageRoutes } from "../../src/web/page.tsx";
import { unitsFrom, type Units } from "../../src/schema/units.ts";

const app = createApp({ mounts: [pageRoutes()] });
const cabin = findDemo("cabin")!.document;
const receiver = findDemo("receiver")!.document;

const formFor = postedForm;

const cabinUnits = unitsFrom(cabin.display);
const cabinForm = formFor(cabin, cabinUnits);

async function post(path: string, fields: Record<string, string>, htmx = false) {
  const res = await app.request(path, { method: "POST", body: new URLSearchParams(fields), headers: htmx ? { "HX-Request": "true" } : {} });
  return { res, html: await res.text() };
}

/** Text of an element with this id (first level only), or undefined. */
function textOf(html: string, id: string): string | undefined {
  const m = new RegExp(`id="${id}"[^>]*>([^<]*)<`).exec(html);
  return m?.[1];
}

/** The life shown in the key figures. */
const lifeIn = (html: string) => /data-testid="life"[^>]*>([^<]*)</.exec(html)?.[1];

describe("the checker page", () => {
  it("opens on the cabin example with a result, the cautions and its scripts from /assets/", async () => {
    const res = await app.request("/");
    const html = await res.text();
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toMatch(/text\/html/);
    expect(html.startsWith("<!doctype html>")).toBe(true);
    expect(html).toContain('value="Cabin barrel skin at the window belt"');
    expect(html).toMatch(/class="badge">Refer</);
    expect(html).toContain("not a code-compliance certificate");
    expect(html).toContain("licensed or authorized engineer");
    expect(html).toContain("verify them against certified data");
    expect(html).toMatch(/<script src="\/assets\/htmx\.min\.js\?v=[0-9a-f]{12}" defer=""><\/script>/);
    expect(lifeIn(html)).toMatch(/cycles$/);
  });

  it("gzips a whole page for a browser that accepts it", async () => {
    const res = await app.request("/", { headers: { "Accept-Encoding": "gzip" } });
    expect(res.headers.get("content-encoding")).toBe("gzip");
    const packed = Buffer.from(await res.arrayBuffer());
    const html = gunzipSync(packed).toString("utf8");
    expect(html).toContain('value="Cabin barrel skin at the window belt"');
    expect(packed.length).toBeLessThan(html.length / 3);
  });

  it("sends a Content-Security-Policy that allows only its own scripts and styles, and the page needs nothing more", async () => {
    const res = await app.request("/");
    const csp = res.headers.get("content-security-policy") ?? "";
    expect(csp).toContain("script-src 'self'");
    expect(csp).toContain("style-src 'self'");
    const html = await res.text();
    expect(html).not.toMatch(/\sstyle="/);
    expect(html).not.toMatch(/<script(?![^>]*\ssrc=)[^>]*>/);
    expect(html).not.toMatch(/\son[a-z]+="/);
  });

  it("opens either example from the picker", async () => {
    const html = await (await app.request("/?demo=receiver")).text();
    expect(html).toContain('value="Shell course at the outlet nozzle"');
    expect(html).toMatch(/<option value="bar" selected="">bar<\/option>/);
    for (const d of DEMOS) expect(html).toContain(`<option value="${d.id}">`);
  });

  it("answers an htmx edit with the result fragment, the verdict out of band and the link in the address bar", async () => {
    const { res, html } = await post("/recalc", { ...cabinForm, "shell.thickness": "1.2" }, true);
    expect(res.status).toBe(200);
    expect(html).not.toContain("<html");
    expect(html).toContain('<div id="verdict" hx-swap-oob="innerHTML">');
    expect(html).toContain("The calculation, line by line");
    const url = res.headers.get("hx-replace-url") ?? "";
    const decoded = decodeCheck(new URL(url, "http://x").searchParams.get("c") ?? "");
    expect(decoded.ok && (decoded.value as { shell: { thickness_mm: number } }).shell.thickness_mm).toBeCloseTo(1.2, 12);
  });

  it("gives the same result to a plain form post (no scripting) as a whole page", async () => {
    const frag = await post("/recalc", { ...cabinForm, "shell.thickness": "0.8" }, true);
    const full = await post("/", { ...cabinForm, "shell.thickness": "0.8" });
    expect(full.res.status).toBe(200);
    expect(full.html.startsWith("<!doctype html>")).toBe(true);
    expect(lifeIn(full.html)).toBeDefined();
    expect(lifeIn(full.html)).toBe(lifeIn(frag.html));
    expect(lifeIn(full.html)).not.toBe(lifeIn((await post("/", cabinForm)).html));
    expect(full.html).toContain('name="shell.thickness" value="0.8"');
  });

  it("reaches the fragment route as a whole page too", async () => {
    const res = await app.request(`/recalc?c=${encodeCheck(receiver)}`);
    const html = await res.text();
    expect(res.status).toBe(200);
    expect(html.startsWith("<!doctype html>")).toBe(true);
    expect(html).toContain('value="Shell course at the outlet nozzle"');
  });

  it("puts the API's message beside a bad field and shows no result as valid (plain post)", async () => {
    const { res, html } = await post("/", { ...cabinForm, "shell.thickness": "abc" });
    expect(res.status).toBe(422);
    const api = await app.request("/api/v1/check", {
      method: "POST",
      headers: { "Content-Type": "application/json" },
      body: JSON.stringify({ ...cabin, shell: { ...cabin.shell, thickness_mm: "abc" } }),
    });
    const apiErrors = ((await api.json()) as { errors: { path: string; message: string }[] }).errors;
    const message = apiErrors.find((e) => e.path === "shell.thickness_mm")?.message;
    expect(message).toBe("the wall thickness must be a number");
    expect(textOf(html, "e-shell-thickness")).toBe(message);
    expect(html).toMatch(/id="f-shell-thickness"[^>]*aria-describedby="e-shell-thickness"[^>]*aria-invalid="true"/);
    expect(html).toContain('value="abc"');
    expect(html).not.toContain('class="badge"');
    expect(html).not.toContain("The calculation, line by line");
    expect(html).toContain("No result.");
  });

  it("says a blank required field is required, beside it", async () => {
    const { html } = await post("/", { ...cabinForm, "fatigue.designLife": "" });
    expect(textOf(html, "e-fatigue-designLife")).toBe("is required");
  });

  it("keeps the last result in place but marks it out of date when an htmx edit is bad", async () => {
    const { res, html } = await post("/recalc", { ...cabinForm, "shell.thickness": "-1" }, true);
    expect(res.status).toBe(200);
    expect(res.headers.get("hx-reswap")).toBe("none");
    expect(res.headers.get("hx-replace-url")).toBeNull();
    expect(html).toContain("Out of date.");
    expect(html).not.toContain('id="verdict"');
    expect(html).not.toContain("The calculation, line by line");
    expect(textOf(html, "e-shell-thickness")).toBe("the wall thickness must be greater than 0");
  });

  it("refreshes every error slot of the page with each htmx answer, so a corrected error disappears", async () => {
    const page = await (await app.request("/?demo=receiver")).text();
    const slots = (h: string) => new Set([...h.matchAll(/class="field-error" id="([^"]+)"/g)].map((m) => m[1]));
    const { html } = await post("/recalc", { ...formFor(receiver, unitsFrom(receiver.display)), "shell.thickness": "x" }, true);
    expect(slots(page).size).toBeGreaterThan(50);
    expect(slots(html)).toEqual(slots(page));
  });

  it("gives the same SI check from millimetres and megapascals as from inches and psi", async () => {
    const us: Units = { length: "in", stress: "psi", pressure: "psi", altitude: "ft" };
    const docOf = async (fields: Record<string, string>) => {
      const { res } = await post("/recalc", fields, true);
      const c = new URL(res.headers.get("hx-replace-url") ?? "", "http://x").searchParams.get("c") ?? "";
      const d = decodeCheck(c);
      if (!d.ok) throw new Error(d.message);
      return d.value as {
        shell: { thickness_mm: number; radius_mm: number };
        pressure: { max_MPa: number };
        material: { ultimate_MPa: number };
      };
    };
    const base = { ...receiver, pressure: { max_MPa: 1.1, min_MPa: 0 }, material: { id: "steel-p265gh", ultimate_MPa: 420 } };
    const si = await docOf(formFor(base, unitsFrom({})));
    const usDoc = await docOf(formFor(base, us));
    // The form shows six significant figures, so inches and psi read back within 1 part in 10⁵.
    const near = (a: number, b: number) => expect(Math.abs(a - b) / b).toBeLessThan(1e-5);
    near(usDoc.shell.thickness_mm, si.shell.thickness_mm);
    near(usDoc.shell.radius_mm, si.shell.radius_mm);
    near(usDoc.pressure.max_MPa, si.pressure.max_MPa);
    near(usDoc.material.ultimate_MPa, si.material.ultimate_MPa);
    expect(si.shell.thickness_mm).toBe(5);
  });

  it("redraws the form in the new units when the choice changes, with the same result", async () => {
    const before = await post("/recalc", cabinForm, true);
    const { res, html } = await post("/recalc", { ...cabinForm, "units.length": "in", "units.stress": "ksi" }, true);
    expect(res.headers.get("hx-retarget")).toBe("#workspace");
    expect(html).toContain('name="shell.thickness" value="0.0393701"');
    expect(html).toContain('<input type="hidden" name="units.shown" value="in ksi kPa m"/>');
    expect(lifeIn(html)).toBe(lifeIn(before.html));
  });

  it("takes a units choice from the address, over the one the check carries", async () => {
    const html = await (await app.request("/?demo=receiver&length=in&pressure=psi")).text();
    expect(html).toContain('name="shell.thickness" value="0.19685"');
    expect(html).toContain('<input type="hidden" name="units.shown" value="in MPa psi m"/>');
    expect(html).toMatch(/Highest pressure<\/dt><dd>159\.5 psi</);
  });

  it("reopens a check from its link, exactly", async () => {
    const doc = { ...receiver, title: "Link test ✓", shell: { ...receiver.shell, thickness_mm: 6.35 } };
    const c = encodeCheck(doc);
    expect(c).toMatch(/^[A-Za-z0-9_-]+$/);
    const round = decodeCheck(c);
    expect(round.ok && round.value).toEqual(doc);
    const html = await (await app.request(`/?c=${c}`)).text();
    expect(html).toContain('value="Link test ✓"');
    expect(html).toContain('name="shell.thickness" value="6.35"');
  });

  it("explains a damaged link instead of failing", async () => {
    const res = await app.request("/?c=not*a*check");
    expect(res.status).toBe(422);
    expect(await res.text()).toContain("The link could not be opened");
    const truncated = await app.request(`/?c=${encodeCheck(cabin).slice(0, 40)}`);
    expect(truncated.status).toBe(422);
  });

  it("finds the least thickness when asked, and says what sets it", async () => {
    const { html } = await post("/recalc", { ...cabinForm, solve: "thickness" }, true);
    expect(html).toContain("Least wall thickness that passes");
    expect(/data-testid="solution">([^<]*)</.exec(html)?.[1]).toMatch(/^\d[\d.]* mm$/);
    expect(html).toMatch(/name="use" value="thickness:[\d.]+"/);
  });

  it("puts a solved thickness into the form when asked, in the units shown", async () => {
    const { res, html } = await post("/recalc", { ...cabinForm, use: "thickness:0.635" }, true);
    expect(res.headers.get("hx-retarget")).toBe("#workspace");
    expect(html).toContain('name="shell.thickness" value="0.635"');
    const inches = await post("/recalc", { ...formFor(cabin, { ...cabinUnits, length: "in" }), use: "thickness:0.635" }, true);
    expect(inches.html).toContain('name="shell.thickness" value="0.025"');
  });

  it("sends the plots after the numbers: the edit's answer carries a loader, /plots draws them", async () => {
    const { html } = await post("/recalc", { ...cabinForm, "shell.thickness": "0.9" }, true);
    expect(html).not.toContain("<svg");
    const url = /hx-get="(\/plots\?c=[^"]+)"/.exec(html)?.[1].replace(/&amp;/g, "&") ?? "";
    expect(url).not.toBe("");
    const plots = await app.request(url, { headers: { "HX-Request": "true" } });
    const svg = await plots.text();
    expect(plots.status).toBe(200);
    expect(svg).not.toContain("<html");
    expect(svg).toContain('id="plot-haigh"');
    expect(svg).toContain("current thickness 0.9 mm");
    const whole = await (await app.request(url)).text();
    expect(whole.startsWith("<!doctype html>")).toBe(true);
    expect(whole).toContain('name="shell.thickness" value="0.9"');
  });

  it("downloads the check as JSON from a link and from the form", async () => {
    const res = await app.request(`/export?c=${encodeCheck(receiver)}`);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-disposition")).toBe('attachment; filename="hoopwise-shell-course-at-the-outlet-nozzle.json"');
    expect(await res.json()).toEqual(receiver);
    const fromForm = await post("/export", cabinForm);
    const doc = JSON.parse(fromForm.html) as { format: string; shell: { thickness_mm: number }; display: unknown };
    expect(doc.format).toBe("hoopwise.check/1");
    expect(doc.shell.thickness_mm).toBe(1);
    expect(doc.display).toEqual(cabinUnits);
  });

  it("refuses to download a form with errors, showing them instead", async () => {
    const { res, html } = await post("/export", { ...cabinForm, "shell.radius": "" });
    expect(res.status).toBe(422);
    expect(textOf(html, "e-shell-radius")).toBe("is required");
  });

  it("opens an uploaded JSON check (multipart post, works without scripting)", async () => {
    const body = new FormData();
    body.set("file", new File([JSON.stringify(receiver)], "receiver.json", { type: "application/json" }));
    const res = await app.request("/import", { method: "POST", body });
    const html = await res.text();
    expect(res.status).toBe(200);
    expect(html).toContain('value="Shell course at the outlet nozzle"');
    expect(html).toMatch(/class="badge">Passes</);
  });

  it("explains an upload that is not JSON, or not a valid check", async () => {
    const bad = new FormData();
    bad.set("file", new File(["{not json"], "broken.json"));
    const res = await app.request("/import", { method: "POST", body: bad });
    expect(res.status).toBe(422);
    expect(await res.text()).toContain("“broken.json” is not valid JSON");
    const invalid = new FormData();
    invalid.set("file", new File([JSON.stringify({ ...receiver, shell: { ...receiver.shell, radius_mm: -3 } })], "neg.json"));
    const html = await (await app.request("/import", { method: "POST", body: invalid })).text();
    expect(textOf(html, "e-shell-radius")).toContain("the radius must be greater than 0");
  });

  it("reads a pressure history from an uploaded file into the form", async () => {
    const body = new FormData();
    for (const [k, v] of Object.entries(cabinForm)) body.set(k, v);
    body.set("history.file", new File(["time,dp\n0,0\n1,0.06\n2,0.01\n3,0.06\n4,0"], "log.csv", { type: "text/csv" }));
    const res = await app.request("/recalc", { method: "POST", body, headers: { "HX-Request": "true" } });
    const html = await res.text();
    expect(res.headers.get("hx-retarget")).toBe("#workspace");
    expect(html).toMatch(/<input type="radio" name="pressure.mode" value="history" checked=""/);
    expect(html).toContain("time,dp\n0,0\n1,0.06");
    expect(html).toMatch(/class="badge">(Passes|Fails|Refer)</);
  });

  it("escapes a hostile title everywhere it appears", async () => {
    const hostile = "<script>alert(1)</script>";
    const viaLink = await (await app.request(`/?c=${encodeCheck({ ...cabin, title: hostile, notes: hostile })}`)).text();
    const viaForm = (await post("/", { ...cabinForm, title: hostile, project: hostile, "material.name": hostile })).html;
    for (const html of [viaLink, viaForm]) {
      expect(html).not.toContain(hostile);
      expect(html).toContain("&lt;script&gt;alert(1)&lt;/script&gt;");
    }
  });

  it("serves htmx and its own assets with the right types and cache headers", async () => {
    const page = await (await app.request("/")).text();
    const htmxUrl = /src="(\/assets\/htmx\.min\.js\?v=[0-9a-f]+)"/.exec(page)?.[1] ?? "";
    const res = await app.request(htmxUrl);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("text/javascript; charset=utf-8");
    expect(res.headers.get("cache-control")).toContain("immutable");
    expect(await res.text()).toContain("htmx");
    const css = await app.request("/assets/site.css");
    expect(css.headers.get("content-type")).toBe("text/css; charset=utf-8");
    expect(css.headers.get("cache-control")).not.toContain("immutable");
    const etag = css.headers.get("etag") ?? "";
    expect((await app.request("/assets/site.css", { headers: { "If-None-Match": etag } })).status).toBe(304);
    const gz = await app.request("/assets/htmx.min.js", { headers: { "Accept-Encoding": "gzip" } });
    expect(gz.headers.get("content-encoding")).toBe("gzip");
    expect((await app.request("/assets/nothing.js")).status).toBe(404);
  });

  it("never answers a server error to whatever a user posts", async () => {
    const names = [...Object.keys(cabinForm), "solve", "use", "blocks.0.max", "blocks.9999.cycles", "units.shown"];
    await fc.assert(
      fc.asyncProperty(
        fc.dictionary(
          fc.constantFrom(...names),
          fc.oneof(fc.string(), fc.constantFrom("", "0", "-1", "1e308", "NaN", "thickness:-5", "in psi psi ft")),
        ),
        async (junk) => {
          const { res } = await post("/recalc", { ...cabinForm, ...junk }, true);
          expect(res.status).toBe(200);
        },
      ),
      { numRuns: 40 },
    );
    const notAForm = await app.request("/", { method: "POST", body: "{}", headers: { "Content-Type": "application/json" } });
    expect(notAForm.status).toBe(422);
  }, 60_000);
});
