import { postedForm } from "./postedForm.ts";
import { describe, expect, it } from "vitest";
import { findDemo } from "../../src/demo/index.ts";
import { validateCheckDocument } from "../../src/store/checkValidator.ts";
import { seedDemos } from "../../src/web/records/seed.ts";
import { wholeApp } from "../../src/web/whole.ts";
import { testStore } from "../store/helpers.ts";

/** Invented people; their passphrases must never come back in any answer. Mira is the admin. */
const MIRA = { name: "Mira Castellanos-Ode", passphrase: "lantern over the saltmarsh" };
const TEO = { name: "Teo Vantongeren", passphrase: "blue heron at low tide" };
const RUI = { name: "Rui Adebayo-Lund", passphrase: "paper kites above the quarry" };
const SECRETS = [MIRA.passphrase, TEO.passphrase, RUI.passphrase, "wrong but long enough"];
type Person = typeof MIRA;

const cabin = findDemo("cabin")!.document;

/** The fields a browser posts for the cabin example as the checker shows it. */
function cabinForm(changes: Record<string, string> = {}): Record<string, string> {
  return { ...postedForm(cabin), ...changes };
}

/**
 * The records pages over a fresh database with the real check validator, Mira (admin), Teo and
 * Rui (engineers) registered. Requests go as Mira, signed in through the sign-in form with her
 * session cookie, unless `as` names another; every body read is kept for the passphrase sweep.
 */
async function site(seed = false) {
  let t = Date.parse("2030-03-01T08:00:00.000Z");
  const store = testStore({ validate: validateCheckDocument, now: () => new Date((t += 60_000)) });
  if (seed) seedDemos(store);
  const mira = await store.addUser({ ...MIRA, role: "admin" }, null);
  await store.addUser({ ...TEO, role: "engineer" }, mira);
  await store.addUser({ ...RUI, role: "engineer" }, mira);
  const app = wholeApp(store);
  const bodies: string[] = [];
  const cookies = new Map<string, string>();
  const request = async (path: string, init: RequestInit = {}, cookie?: string) => {
    const res = await app.request(path, { redirect: "manual", ...init, headers: cookie ? { cookie } : {} });
    const html = await res.text();
    bodies.push(html, res.headers.get("location") ?? "");
    return { status: res.status, location: res.headers.get("location") ?? "", html, headers: res.headers };
  };
  const signIn = async (who: Person) => {
    const res = await request("/signin", { method: "POST", body: new URLSearchParams({ name: who.name, passphrase: who.passphrase }) });
    expect(res.status).toBe(303);
    cookies.set(who.name, (res.headers.get("set-cookie") ?? "").split(";")[0]);
  };
  for (const who of [MIRA, TEO, RUI]) await signIn(who);
  const as = (who: Person | null) => ({
    get: (path: string) => request(path, {}, who ? cookies.get(who.name) : undefined),
    post: (path: string, fields: Record<string, string>) =>
      request(path, { method: "POST", body: new URLSearchParams(fields) }, who ? cookies.get(who.name) : undefined),
  });
  return { store, ...as(MIRA), as, bodies };
}

type Site = Awaited<ReturnType<typeof site>>;

/** The text of the element with this id (no nested elements). */
function textOf(html: string, id: string): string | undefined {
  return new RegExp(`id="${id}"[^>]*>([^<]*)<`).exec(html)?.[1];
}

/** The state badge of revision n on a check page. */
function stateOf(html: string, n: number): string | undefined {
  return new RegExp(`<tr id="revision-${n}"[^>]*data-state="([a-z]+)"`).exec(html)?.[1];
}

async function saveCabin(s: Site, changes: Record<string, string> = {}) {
  const res = await s.post("/records/save", cabinForm(changes));
  expect(res.status).toBe(303);
  return { ...res, id: /^\/records\/([^?]+)\?/.exec(res.location)![1] };
}

const sign = (s: Site, id: string, revision: number, role: string, who: Person, passphrase = who.passphrase) =>
  s.as(who).post(`/records/${id}/sign`, { revision: String(revision), role, passphrase });

describe("the list of saved checks", () => {
  it("lists the seeded checks with their number, title, latest revision and state, under the caution", async () => {
    const s = await site(true);
    const { status, html } = await s.get("/records");
    expect(status).toBe(200);
    for (const c of await s.store.listChecks()) {
      const row = new RegExp(`<tr data-check="${c.id}">[\\s\\S]*?</tr>`).exec(html)?.[0] ?? "";
      expect(row).toContain(`href="/records/${c.id}"`);
      expect(row).toContain(c.calcNumber);
      expect(row).toContain(c.title);
      expect(row).toMatch(/<td class="num">1<\/td>/);
      expect(row).toContain('data-state="draft"');
      expect(row).toContain(`/api/v1/checks/${c.id}/revisions/1/sheet`);
    }
    expect((await s.store.listChecks()).map((c) => c.calcNumber).sort()).toEqual(["AR500-SHELL-003", "L30-FUS-017"]);
    expect(html).toContain("not a code-compliance certificate");
    expect(html).toContain("licensed or authorized engineer");
    expect(html).not.toMatch(/\sstyle="|<script(?![^>]*\ssrc=)/);
  });

  it("answers an unknown check with a 404 page, not a server error", async () => {
    const s = await site();
    const res = await s.get("/records/no-such-check");
    expect(res.status).toBe(404);
    expect(res.html).toContain("no saved check has the id &quot;no-such-check&quot;");
    expect(res.html).toContain("not a code-compliance certificate");
  });
});

describe("saving from the checker", () => {
  it("saves revision 1, then a changed thickness as revision 2 that supersedes it; an unchanged input saves nothing", async () => {
    const s = await site();
    // The saver is the signed-in user, whatever name the form carries.
    const first = await saveCabin(s, { savedBy: "Someone Else Entirely" });
    expect(first.location).toBe(`/records/${first.id}?saved=1`);
    const page1 = await s.get(first.location);
    expect(page1.html).toContain("Saved as revision 1");
    expect(page1.html).toContain("L30-FUS-017");
    expect(stateOf(page1.html, 1)).toBe("draft");
    expect((await s.store.getCheck(first.id)).revisions[0].savedBy).toBe("Mira Castellanos-Ode");

    // Opened from the records, the checker carries the check's id, so saving adds a revision to it.
    const open = await s.get(`/records/${first.id}/revisions/1/open`);
    expect(open.status).toBe(303);
    expect(open.location).toMatch(new RegExp(`^/\\?c=[A-Za-z0-9_-]+&record=${first.id}$`));
    const checker = await s.get(open.location);
    expect(checker.html).toContain(`name="record" value="${first.id}"`);
    expect(checker.html).toContain("Save as a new revision");

    const second = await saveCabin(s, { record: first.id, "shell.thickness": "1.2" });
    expect(second.location).toBe(`/records/${first.id}?saved=2`);
    const page2 = await s.get(second.location);
    expect(page2.html).toContain("Saved as revision 2");
    expect(stateOf(page2.html, 1)).toBe("superseded");
    expect(stateOf(page2.html, 2)).toBe("draft");
    expect(page2.html).toMatch(/Superseded<\/strong> revision 1 by revision 2/);

    const input = await s.get(`/records/${first.id}/revisions/2/input`);
    expect(input.status).toBe(200);
    expect(JSON.parse(input.html)).toEqual((await s.store.getCheck(first.id)).revisions[1].input);
    expect((await s.get(`/records/${first.id}/revisions/x/input`)).status).toBe(404);

    const again = await saveCabin(s, { record: first.id, "shell.thickness": "1.2" });
    expect(again.location).toBe(`/records/${first.id}?unchanged=2`);
    expect((await s.get(again.location)).html).toContain("Nothing changed since revision 2");
    expect((await s.store.getCheck(first.id)).revisions).toHaveLength(2);
  });

  it("asks before saving onto a calculation number already in the records, and saves the revision once confirmed", async () => {
    const s = await site(true);
    const existing = (await s.store.listChecks()).find((c) => c.calcNumber === "L30-FUS-017")!;
    const ask = await s.post("/records/save", cabinForm({ "shell.thickness": "1.1" }));
    expect(ask.status).toBe(409);
    expect(ask.html).toContain("Save as revision 2 of L30-FUS-017");
    expect((await s.store.getCheck(existing.id)).revisions).toHaveLength(1);
    const document = /name="document" value="([^"]*)"/
      .exec(ask.html)![1]
      .replace(/&quot;/g, '"')
      .replace(/&amp;/g, "&");
    const done = await s.post(`/records/${existing.id}/revisions`, { document });
    expect(done.location).toBe(`/records/${existing.id}?saved=2`);
    expect(
      ((await s.store.getCheck(existing.id)).revisions[1].input as { shell: { thickness_mm: number } }).shell.thickness_mm,
    ).toBeCloseTo(1.1, 12);
  });

  it("sends a check with mistakes back to the checker with the message beside the field, and saves nothing", async () => {
    const s = await site();
    const res = await s.post("/records/save", cabinForm({ "shell.thickness": "abc" }));
    expect(res.status).toBe(422);
    expect(res.html).toContain("Not saved: correct the marked fields first.");
    expect(textOf(res.html, "e-shell-thickness")).toBe("the wall thickness must be a number");
    expect(await s.store.listChecks()).toEqual([]);
  });

  it("answers a save onto a check that does not exist with the checker and the reason, and a 404 page for a confirmed one", async () => {
    const s = await site();
    const res = await s.post("/records/save", cabinForm({ record: "gone-check" }));
    expect(res.status).toBe(404);
    expect(res.html).toContain("Not saved: no saved check has the id &quot;gone-check&quot;");
    expect(res.html).toContain('name="shell.thickness" value="1"');
    const confirmed = await s.post("/records/gone-check/revisions", { document: JSON.stringify(cabin) });
    expect(confirmed.status).toBe(404);
    expect(confirmed.html).toContain("<h1>Not found</h1>");
    expect(await s.store.listChecks()).toEqual([]);
  });

  it("answers every records page without a session with 401 and the sign-in form, and no-store", async () => {
    const s = await site(true);
    for (const path of ["/records", "/records/people", `/records/${(await s.store.listChecks())[0].id}`]) {
      const res = await s.as(null).get(path);
      expect(res.status, path).toBe(401);
      expect(res.html).toContain('id="signin"');
      expect(res.headers.get("cache-control")).toBe("no-store");
    }
    const save = await s.as(null).post("/records/save", cabinForm());
    expect(save.status).toBe(401);
    expect(await s.store.listChecks()).toHaveLength(2);
    // The checker itself stays open.
    expect((await s.as(null).get("/")).status).toBe(200);
  });
});

describe("people, and signing", () => {
  it("lets the admin add someone, refusing mismatched, weak and look-alike names beside the field; an engineer may not add", async () => {
    const s = await site();
    const dee = { name: "Dee Marchetti", passphrase: "lilac thunder pebble road" };
    const mismatch = await s.post("/records/people", {
      name: dee.name,
      role: "engineer",
      passphrase: dee.passphrase,
      again: TEO.passphrase,
    });
    expect(mismatch.status).toBe(422);
    expect(textOf(mismatch.html, "user-again-error")).toMatch(/does not match/);
    const weak = await s.post("/records/people", { name: dee.name, role: "engineer", passphrase: "password1234", again: "password1234" });
    expect(textOf(weak.html, "user-passphrase-error")).toMatch(/too easy to guess/);
    const added = await s.post("/records/people", { name: dee.name, role: "engineer", passphrase: dee.passphrase, again: dee.passphrase });
    expect(added.status).toBe(303);
    expect((await s.get(added.location)).html).toContain(`${dee.name} is added as engineer and can now sign in.`);
    const lookalike = await s.post("/records/people", {
      name: "D\u0435e Marchetti",
      role: "engineer",
      passphrase: TEO.passphrase,
      again: TEO.passphrase,
    });
    expect(lookalike.status).toBe(409);
    expect(textOf(lookalike.html, "user-name-error")).toMatch(/looks the same/);
    const byEngineer = await s
      .as(TEO)
      .post("/records/people", { name: "Eli Other", role: "engineer", passphrase: dee.passphrase, again: dee.passphrase });
    expect(byEngineer.status).toBe(403);
    expect((await s.store.listUsers()).map((p) => p.name)).toEqual([dee.name, MIRA.name, RUI.name, TEO.name]);
    for (const secret of [...SECRETS, dee.passphrase, "password1234"]) for (const body of s.bodies) expect(body).not.toContain(secret);
  });

  it("signs prepared, checked and approved as three people; refuses a second role for one person and a wrong passphrase beside the field", async () => {
    const s = await site();
    const { id } = await saveCabin(s);
    const second = await saveCabin(s, { record: id, "shell.thickness": "1.2" });
    expect(second.location).toContain("saved=2");

    const prepared = await sign(s, id, 2, "prepared", MIRA);
    expect(prepared).toMatchObject({ status: 303, location: `/records/${id}?signed=2&role=prepared` });
    expect((await s.get(prepared.location)).html).toContain(`Revision 2 signed as prepared by ${MIRA.name}.`);

    const twice = await sign(s, id, 2, "checked", MIRA);
    expect(twice.status).toBe(409);
    expect(twice.html).toContain("three different people");
    expect(twice.html).toContain("Not signed");

    const wrong = await sign(s, id, 2, "checked", TEO, "wrong but long enough");
    expect(wrong.status).toBe(403);
    expect(textOf(wrong.html, "sign-passphrase-error")).toContain(`is not ${TEO.name}&#39;s passphrase`);
    // The choices come back; the passphrase field is always empty.
    expect(wrong.html).toMatch(/<option value="checked" selected/);
    expect(wrong.html).toMatch(/<input type="password" id="sign-passphrase" name="passphrase" autocomplete="current-password" required=""/);

    const outOfOrder = await sign(s, id, 1, "approved", RUI);
    expect(outOfOrder.status).toBe(409);
    expect(textOf(outOfOrder.html, "sign-revision-error")).toContain("superseded by revision 2");

    expect((await sign(s, id, 2, "checked", TEO)).status).toBe(303);
    expect((await sign(s, id, 2, "approved", MIRA)).status).toBe(409);
    expect((await sign(s, id, 2, "approved", RUI)).status).toBe(303);

    const page = await s.get(`/records/${id}`);
    expect(stateOf(page.html, 2)).toBe("approved");
    expect(stateOf(page.html, 1)).toBe("superseded");
    expect(page.html).toContain("Revision 2 is approved");
    expect(page.html).not.toContain(`action="/records/${id}/sign"`);
    const log = /<ol class="log">([\s\S]*?)<\/ol>/.exec(page.html)![1];
    expect(log.match(/<strong>Signed<\/strong>/g)).toHaveLength(3);
    for (const secret of SECRETS) for (const body of s.bodies) expect(body).not.toContain(secret);
  });
});

describe("comparing two revisions", () => {
  it("lists shell.thickness_mm as changed, with its unit, and marks the life as changed", async () => {
    const s = await site();
    const { id } = await saveCabin(s);
    await saveCabin(s, { record: id, "shell.thickness": "1.2" });
    const { status, html } = await s.get(`/records/${id}/compare?from=1&to=2`);
    expect(status).toBe(200);
    const thickness = /<tr class="diff-(\w+)" data-path="shell\.thickness_mm">([\s\S]*?)<\/tr>/.exec(html);
    expect(thickness?.[1]).toBe("changed");
    expect(thickness?.[2]).toMatch(/<td>mm<\/td><td class="before">1<\/td><td class="after">1\.2<\/td>/);
    // Only the thickness was changed in the form.
    expect(html.match(/data-path=/g)).toHaveLength(1);
    const life = /<tr class="(diff-changed|same)" data-figure="life">([\s\S]*?)<\/tr>/.exec(html);
    expect(life?.[1]).toBe("diff-changed");
    // A thicker skin carries less stress per cycle: the life rises, and the change says so.
    expect(life?.[2]).toMatch(/<td class="change">\+[0-9., ]+%<\/td>/);
    expect(/<tr class="(diff-changed|same)" data-figure="hoop">/.exec(html)?.[1]).toBe("diff-changed");
    expect(/<tr class="(diff-changed|same)" data-figure="kt">/.exec(html)?.[1]).toBe("same");
    expect(html).toContain("not a code-compliance certificate");
  });

  it("says beside the field when a revision asked for does not exist", async () => {
    const s = await site();
    const { id } = await saveCabin(s);
    const res = await s.get(`/records/${id}/compare?from=1&to=7`);
    expect(res.status).toBe(422);
    expect(textOf(res.html, "cmp-to-error")).toBe("there is no revision “7”; this check has revisions 1 to 1");
  });
});

describe("hostile text", () => {
  it("escapes a hostile title and signer name wherever they are shown", async () => {
    const s = await site();
    const hostile = `<script>alert("t")</script><img src=x onerror=alert(1)>`;
    const { id } = await saveCabin(s, { title: hostile });
    await saveCabin(s, { record: id, "shell.thickness": "1.2" });
    const add = await s.post("/records/people", {
      name: hostile.slice(0, 90),
      role: "engineer",
      passphrase: "lilac thunder pebble road",
      again: "lilac thunder pebble road",
    });
    expect(add.status).toBe(303);
    for (const path of ["/records", `/records/${id}`, `/records/${id}/compare`, "/records/people", add.location]) {
      const { html } = await s.get(path);
      expect(html, path).not.toContain("<script>alert");
      expect(html, path).not.toContain("<img src=x");
      expect(html, path).not.toMatch(/\sstyle="|<script(?![^>]*\ssrc=)|\son[a-z]+="/);
    }
    expect((await s.get("/records")).html).toContain("&lt;script&gt;alert(");
  });
});
