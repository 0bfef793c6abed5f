import { Hono } from "hono";
import { describe, expect, it } from "vitest";
import { recordsApi } from "../../src/web/records/api.ts";
import { revisionSheetApi } from "../../src/web/records/sheet.ts";
import { MAX_JSON_BYTES } from "../../src/web/api.ts";
import { PEOPLE, registerPeople, sampleInput, testStore, type Who } from "../store/helpers.ts";

// Response bodies are inspected field by field; the assertions themselves check their shape.
type Json = Record<string, any>;

/**
 * The records API over a fresh store with Ana (admin), Bo and Cy (engineers) registered and
 * signed in; `send` acts as Ana unless told whom, `as(who)` as another, `anonymous` as no one.
 */
async function api() {
  let t = Date.parse("2030-03-01T08:00:00.000Z");
  // A clock that moves a minute per reading, so the guessing delays of one test never reach the next request.
  const store = testStore({ now: () => new Date((t += 60_000)) });
  await registerPeople(store);
  const app = recordsApi({ store });
  const tokens: Partial<Record<Who, string>> = {};
  const request = async (who: Who | null, method: string, path: string, body?: unknown, raw?: string) => {
    const headers: Record<string, string> = { "content-type": "application/json" };
    if (who) headers.authorization = `Bearer ${tokens[who]}`;
    const res = await app.request(path, { method, headers, body: raw ?? (body === undefined ? undefined : JSON.stringify(body)) });
    const text = await res.text();
    return { status: res.status, headers: res.headers, json: (text ? JSON.parse(text) : {}) as Json };
  };
  for (const who of ["ana", "bo", "cy"] as const) {
    const res = await request(null, "POST", "/api/v1/session", { name: PEOPLE[who].name, passphrase: PEOPLE[who].passphrase });
    expect(res.status).toBe(201);
    tokens[who] = res.json.token;
  }
  const send = (method: string, path: string, body?: unknown, raw?: string) => request("ana", method, path, body, raw);
  const as = (who: Who) => (method: string, path: string, body?: unknown) => request(who, method, path, body);
  const anonymous = (method: string, path: string, body?: unknown) => request(null, method, path, body);
  return { app, store, send, as, anonymous, tokens };
}

async function withSavedCheck() {
  const ctx = await api();
  const created = await ctx.send("POST", "/api/v1/checks", { input: sampleInput(), title: "Receiver R-2 shell", calcNumber: "HW-WEB-1" });
  return { ...ctx, id: created.json.id as string, created };
}

const withSigners = withSavedCheck;

const sign = (role: "prepared" | "checked" | "approved", who: Who) => ({ revision: 1, role, passphrase: PEOPLE[who].passphrase });

describe("records API: saving", () => {
  it("creates a check as revision 1 and lists it", async () => {
    const { send, id, created } = await withSavedCheck();
    expect(created.status).toBe(201);
    expect(created.json).toMatchObject({ id, revision: 1, calcNumber: "HW-WEB-1", fingerprint: expect.stringMatching(/^[0-9a-f]{64}$/) });
    expect(created.headers.get("location")).toBe(`/api/v1/checks/${id}`);

    const list = await send("GET", "/api/v1/checks");
    expect(list.json.checks).toEqual([
      expect.objectContaining({ id, title: "Receiver R-2 shell", calcNumber: "HW-WEB-1", latestRevision: 1, state: "draft" }),
    ]);
    const check = await send("GET", `/api/v1/checks/${id}`);
    expect(check.json.revisions).toEqual([
      expect.objectContaining({ number: 1, fingerprint: created.json.fingerprint, state: "draft", signoffs: [] }),
    ]);
    expect(check.json.events.map((e: Json) => e.kind)).toEqual(["saved"]);
  });

  it("adds a revision with 201, and answers an unchanged input with 200 and the existing revision", async () => {
    const { send, id, created } = await withSavedCheck();
    const same = await send("POST", `/api/v1/checks/${id}/revisions`, { input: sampleInput() });
    expect(same).toMatchObject({ status: 200, json: { revision: 1, fingerprint: created.json.fingerprint, unchanged: true } });
    const changed = await send("POST", `/api/v1/checks/${id}/revisions`, { input: sampleInput(2.0), savedBy: "Ana Brightwater" });
    expect(changed).toMatchObject({ status: 201, json: { revision: 2, unchanged: false } });
    const check = await send("GET", `/api/v1/checks/${id}`);
    expect(check.json.revisions.map((r: Json) => r.state)).toEqual(["superseded", "draft"]);
  });

  it("answers an invalid body with 422 and every problem, the input's under input.", async () => {
    const { send } = await api();
    const res = await send("POST", "/api/v1/checks", { input: { shell: { thickness_mm: 0 } }, title: "", calcNumbr: "HW-9" });
    expect(res.status).toBe(422);
    expect(res.json.errors).toEqual(
      expect.arrayContaining([
        { path: "input.shell.thickness_mm", message: "must be a number greater than 0" },
        { path: "title", message: "must not be empty" },
        { path: "calcNumbr", message: "is not a field this record takes" },
      ]),
    );
    expect((await send("GET", "/api/v1/checks")).json.checks).toEqual([]);
  });

  it("answers a body that is JSON but not an object with 422", async () => {
    const { send } = await api();
    const res = await send("POST", "/api/v1/checks", [sampleInput()]);
    expect(res).toMatchObject({ status: 422, json: { errors: [{ path: "(document)", message: "must be a JSON object" }] } });
  });

  it("answers malformed or empty JSON with 400 and an errors document", async () => {
    const { send } = await api();
    const bad = await send("POST", "/api/v1/checks", undefined, '{"input": {');
    expect(bad.status).toBe(400);
    expect(bad.json.errors[0].message).toMatch(/not valid JSON/);
    const empty = await send("POST", "/api/v1/users", undefined, "");
    expect(empty.status).toBe(400);
    expect(empty.json.errors[0].path).toBe("(document)");
  });

  it("answers an unknown check with 404 on every route that names one", async () => {
    const { send } = await api();
    const routes: [string, string, unknown?][] = [
      ["GET", "/api/v1/checks/nope"],
      ["GET", "/api/v1/checks/nope/export"],
      ["POST", "/api/v1/checks/nope/revisions", { input: sampleInput() }],
      ["POST", "/api/v1/checks/nope/signoffs", sign("prepared", "ana")],
    ];
    for (const [method, path, body] of routes) {
      const res = await send(method, path, body);
      expect(res.status, `${method} ${path}`).toBe(404);
      expect(res.json.errors[0]).toMatchObject({ path: "id", message: expect.stringContaining("nope") });
    }
  });

  it("refuses a body declared larger than the limit with 413, and one that is not JSON with 415", async () => {
    const { app, tokens } = await api();
    const big = await app.request("/api/v1/checks", {
      method: "POST",
      headers: { "content-type": "application/json", "content-length": String(MAX_JSON_BYTES + 1), authorization: `Bearer ${tokens.ana}` },
      body: JSON.stringify({ input: sampleInput() }),
    });
    expect(big.status).toBe(413);
    const text = await app.request("/api/v1/session", { method: "POST", headers: { "content-type": "text/plain" }, body: "Ana" });
    expect(text.status).toBe(415);
    expect(((await text.json()) as Json).errors[0].message).toMatch(/application\/json/);
  });
});

describe("records API: sign-in and people", () => {
  it("answers 401 on every records route without a session, and lets the open routes be", async () => {
    const { anonymous, id } = await withSavedCheck();
    for (const [method, path] of [
      ["GET", "/api/v1/checks"],
      ["POST", "/api/v1/checks"],
      ["GET", `/api/v1/checks/${id}`],
      ["GET", `/api/v1/checks/${id}/export`],
      ["POST", "/api/v1/checks/import"],
      ["POST", `/api/v1/checks/${id}/revisions`],
      ["POST", `/api/v1/checks/${id}/signoffs`],
      ["GET", "/api/v1/users"],
      ["POST", "/api/v1/users"],
      ["GET", "/api/v1/session"],
      ["GET", "/api/v1/keys/trusted"],
    ]) {
      const res = await anonymous(method, path, method === "GET" ? undefined : {});
      expect(res.status, `${method} ${path}`).toBe(401);
      expect(res.json.errors[0].path).toBe("(session)");
    }
    const keys = await anonymous("GET", "/api/v1/keys");
    expect(keys).toMatchObject({
      status: 200,
      json: { keys: [{ algorithm: "Ed25519", fingerprint: expect.stringMatching(/^[0-9a-f]{64}$/) }] },
    });
  });

  it("signs in with a token and an HttpOnly, SameSite=Strict cookie that also works; signing out ends it", async () => {
    const { app } = await api();
    const res = await app.request("/api/v1/session", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ name: PEOPLE.bo.name, passphrase: PEOPLE.bo.passphrase }),
    });
    const body = (await res.json()) as Json;
    expect(body).toMatchObject({ token: expect.any(String), user: { name: PEOPLE.bo.name, role: "engineer" } });
    const cookie = res.headers.get("set-cookie") ?? "";
    expect(cookie).toMatch(/^hoopwise_session=[^;]+;/);
    expect(cookie).toMatch(/HttpOnly/);
    expect(cookie).toMatch(/SameSite=Strict/);
    expect(res.headers.get("cache-control")).toBe("no-store");
    const viaCookie = await app.request("/api/v1/session", { headers: { cookie: cookie.split(";")[0] } });
    expect(((await viaCookie.json()) as Json).user.name).toBe(PEOPLE.bo.name);
    expect((await app.request("/api/v1/session", { method: "DELETE", headers: { authorization: `Bearer ${body.token}` } })).status).toBe(
      204,
    );
    expect((await app.request("/api/v1/session", { headers: { authorization: `Bearer ${body.token}` } })).status).toBe(401);
  });

  it("answers a wrong passphrase and an unknown name alike, with 401", async () => {
    const { anonymous } = await api();
    const wrong = await anonymous("POST", "/api/v1/session", { name: PEOPLE.bo.name, passphrase: "not the right phrase" });
    const unknown = await anonymous("POST", "/api/v1/session", { name: "Nobody Here", passphrase: "not the right phrase" });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(unknown.json).toEqual(wrong.json);
  });

  it("lets only an admin add people: 201 for the admin, 403 for an engineer, 409 for a look-alike name, 422 for a weak passphrase", async () => {
    const { send, as } = await api();
    const dee = { name: "Dee Marchetti", role: "engineer", passphrase: "lilac thunder pebble road" };
    expect(await as("bo")("POST", "/api/v1/users", dee)).toMatchObject({ status: 403 });
    expect(await send("POST", "/api/v1/users", dee)).toMatchObject({ status: 201, json: { name: "Dee Marchetti", role: "engineer" } });
    expect((await send("POST", "/api/v1/users", { ...dee, name: "D\u0435e Marchetti" })).status).toBe(409);
    expect(await send("POST", "/api/v1/users", { ...dee, name: "Eli Short", passphrase: "password1234" })).toMatchObject({
      status: 422,
      json: { errors: [{ path: "passphrase" }] },
    });
    const list = await as("cy")("GET", "/api/v1/users");
    expect(list.json.users.map((u: Json) => u.name)).toContain("Dee Marchetti");
  });

  it("answers a lone surrogate in any text with 422 naming the field", async () => {
    // Attack: ill-formed Unicode, which no encoding can store or print.
    const { send } = await api();
    const res = await send("POST", "/api/v1/checks", undefined, '{"input":{},"title":"Bay \\ud800 seven"}');
    expect(res).toMatchObject({ status: 422, json: { errors: [{ path: "title", message: expect.stringMatching(/lone surrogate/) }] } });
    const nested = await send("POST", "/api/v1/users", undefined, '{"name":"Ana\\udfff","role":"engineer","passphrase":"x"}');
    expect(nested.json.errors[0].path).toBe("name");
  });
});

describe("records API: sign-off", () => {
  it("signs prepared, checked, approved in order, as three people, with 201", async () => {
    const { as, id, send } = await withSigners();
    const steps = [
      ["prepared", "ana"],
      ["checked", "bo"],
      ["approved", "cy"],
    ] as const;
    for (const [role, who] of steps) {
      const res = await as(who)("POST", `/api/v1/checks/${id}/signoffs`, sign(role, who));
      expect(res).toMatchObject({
        status: 201,
        json: { revision: 1, state: role, signoff: { role, name: PEOPLE[who].name, valid: true } },
      });
    }
    const list = await send("GET", "/api/v1/checks");
    expect(list.json.checks[0].state).toBe("approved");
  });

  it("answers a wrong passphrase given again with 403", async () => {
    const { send, id } = await withSigners();
    const res = await send("POST", `/api/v1/checks/${id}/signoffs`, { revision: 1, role: "prepared", passphrase: "not the right phrase" });
    expect(res).toMatchObject({ status: 403, json: { errors: [{ path: "passphrase" }] } });
  });

  // Attack: one person signing two roles; the sign-off belongs to the session's user, never to a typed name.
  it("attack — three names by one person: a typed name is refused and the preparer cannot also check (409)", async () => {
    const { send, id } = await withSigners();
    await send("POST", `/api/v1/checks/${id}/signoffs`, sign("prepared", "ana"));
    const typed = await send("POST", `/api/v1/checks/${id}/signoffs`, { ...sign("checked", "ana"), name: PEOPLE.bo.name });
    expect(typed).toMatchObject({ status: 422, json: { errors: [{ path: "name", message: "is not a field this record takes" }] } });
    const res = await send("POST", `/api/v1/checks/${id}/signoffs`, sign("checked", "ana"));
    expect(res.status).toBe(409);
    expect(res.json.errors[0].message).toMatch(/three different people/);
  });

  it("answers a sign-off out of order, or on a superseded revision, with 409", async () => {
    const { as, send, id } = await withSigners();
    const early = await as("cy")("POST", `/api/v1/checks/${id}/signoffs`, sign("approved", "cy"));
    expect(early.status).toBe(409);
    await send("POST", `/api/v1/checks/${id}/revisions`, { input: sampleInput(2.2) });
    const stale = await send("POST", `/api/v1/checks/${id}/signoffs`, sign("prepared", "ana"));
    expect(stale).toMatchObject({ status: 409, json: { errors: [{ path: "revision" }] } });
  });

  it("answers a sign-off body with bad fields with 422 naming each", async () => {
    const { send, id } = await withSigners();
    const res = await send("POST", `/api/v1/checks/${id}/signoffs`, { revision: "1", role: "stamped" });
    expect(res.status).toBe(422);
    expect(res.json.errors.map((e: Json) => e.path)).toEqual(["revision", "role", "passphrase"]);
  });
});

describe("records API: export and import", () => {
  it("exports a signed file; records that trust the key import it with its sign-offs, others unsigned", async () => {
    const { send, id, store } = await withSigners();
    await send("POST", `/api/v1/checks/${id}/signoffs`, sign("prepared", "ana"));
    const exported = await send("GET", `/api/v1/checks/${id}/export`);
    expect(exported.status).toBe(200);
    expect(exported.headers.get("content-disposition")).toBe('attachment; filename="HW-WEB-1.hoopwise.json"');
    expect(exported.headers.get("cache-control")).toBe("no-store");

    const other = await api();
    const unsigned = await other.send("POST", "/api/v1/checks/import", exported.json);
    expect(unsigned).toMatchObject({ status: 201, json: { id, revisions: 1, signed: false } });
    expect((await other.send("GET", `/api/v1/checks/${id}`)).json.revisions[0]).toMatchObject({
      state: "draft",
      importedUnsigned: true,
      signoffs: [],
    });

    const third = await api();
    const trust = await third.send("POST", "/api/v1/keys/trusted", {
      publicKeyPem: store.publicKey().publicKeyPem,
      label: "Records of the other office",
    });
    expect(trust.status).toBe(201);
    expect(
      (await third.as("bo")("POST", "/api/v1/keys/trusted", { publicKeyPem: store.publicKey().publicKeyPem, label: "x" })).status,
    ).toBe(403);
    const imported = await third.send("POST", "/api/v1/checks/import", exported.json);
    expect(imported).toMatchObject({ status: 201, json: { id, calcNumber: "HW-WEB-1", revisions: 1, signed: true } });
    const check = await third.send("GET", `/api/v1/checks/${id}`);
    expect(check.json.revisions[0]).toMatchObject({
      state: "prepared",
      signoffs: [{ role: "prepared", name: PEOPLE.ana.name, imported: true, valid: true }],
    });
    expect((await third.send("POST", "/api/v1/checks/import", exported.json)).status).toBe(409);
  });

  it("refuses a file with an edited input with 422 and imports nothing", async () => {
    const { send, id } = await withSavedCheck();
    const doc = (await send("GET", `/api/v1/checks/${id}/export`)).json;
    doc.revisions[0].input.shell.thickness_mm = 3.2;
    const other = await api();
    const res = await other.send("POST", "/api/v1/checks/import", doc);
    expect(res.status).toBe(422);
    expect(res.json.errors.map((e: Json) => e.path)).toContain("revisions.0.fingerprint");
    expect((await other.send("GET", "/api/v1/checks")).json.checks).toEqual([]);
  });
});

describe("records API: a database edited outside the tool", () => {
  // Attack: the stored input of a revision is edited in the database file (triggers dropped first).
  it("attack — db edited outside the tool: the revision's sheet is refused with 409 saying so, and the list shows it altered", async () => {
    const { store, tokens, send, id } = await withSavedCheck();
    const app = revisionSheetApi({ store });
    store.db.exec("DROP TRIGGER revisions_immutable_update");
    const row = store.db.prepare("SELECT input_json AS j FROM revisions WHERE check_id = ?").get(id) as { j: string };
    store.db
      .prepare("UPDATE revisions SET input_json = ? WHERE check_id = ?")
      .run(row.j.replace('"thickness_mm":1.6', '"thickness_mm":3.2'), id);
    const res = await app.request(`/api/v1/checks/${id}/revisions/1/sheet`, { headers: { authorization: `Bearer ${tokens.ana}` } });
    expect(res.status).toBe(409);
    expect(((await res.json()) as Json).errors[0].message).toMatch(/changed outside Hoopwise/);
    expect((await send("GET", "/api/v1/checks")).json.checks[0]).toMatchObject({ intact: false, state: "draft" });
  });
});

describe("records API mounted in a larger app", () => {
  it("still answers with its own errors documents", async () => {
    const { app, tokens } = await api();
    const outer = new Hono();
    outer.route("/", app as unknown as Hono);
    const res = await outer.request("/api/v1/checks/missing", { headers: { authorization: `Bearer ${tokens.ana}` } });
    expect(res.status).toBe(404);
    expect(((await res.json()) as Json).errors[0].path).toBe("id");
  });
});
