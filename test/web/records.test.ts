import { Hono } from "hono";
import { describe, expect, it } from "vitest";
import { recordsApi } from "../../src/web/records.ts";
import { MAX_JSON_BYTES } from "../../src/web/api.ts";
import { PEOPLE, sampleInput, testStore } from "../store/helpers.ts";

// Response bodies are inspected field by field; the assertions themselves check their shape.
type Json = Record<string, any>;

function api() {
  const app = recordsApi({ store: testStore() });
  const send = async (method: string, path: string, body?: unknown, raw?: string) => {
    const res = await app.request(path, {
      method,
      headers: { "content-type": "application/json" },
      body: raw ?? (body === undefined ? undefined : JSON.stringify(body)),
    });
    return { status: res.status, headers: res.headers, json: (await res.json()) as Json };
  };
  return { app, send };
}

async function withSavedCheck() {
  const { app, send } = api();
  const created = await send("POST", "/api/v1/checks", { input: sampleInput(), title: "Receiver R-2 shell", calcNumber: "HW-WEB-1" });
  return { app, send, id: created.json.id as string, created };
}

async function withSigners() {
  const ctx = await withSavedCheck();
  for (const p of Object.values(PEOPLE)) expect((await ctx.send("POST", "/api/v1/signers", p)).status).toBe(201);
  return ctx;
}

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
    const { send } = api();
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
    const { send } = api();
    const res = await send("POST", "/api/v1/checks", [sampleInput()]);
    expect(res).toMatchObject({ status: 422, json: { errors: [{ path: "(document)", message: "must be a JSON object" }] } });
  });

  it("answers malformed or empty JSON with 400 and an errors document", async () => {
    const { send } = api();
    const bad = await send("POST", "/api/v1/checks", undefined, '{"input": {');
    expect(bad.status).toBe(400);
    expect(bad.json.errors[0].message).toMatch(/not valid JSON/);
    const empty = await send("POST", "/api/v1/signers", undefined, "");
    expect(empty.status).toBe(400);
    expect(empty.json.errors[0].path).toBe("(document)");
  });

  it("answers an unknown check with 404 on every route that names one", async () => {
    const { send } = api();
    const routes: [string, string, unknown?][] = [
      ["GET", "/api/v1/checks/nope"],
      ["GET", "/api/v1/checks/nope/export"],
      ["POST", "/api/v1/checks/nope/revisions", { input: sampleInput() }],
      ["POST", "/api/v1/checks/nope/signoffs", { revision: 1, role: "prepared", ...PEOPLE.ana }],
    ];
    for (const [method, path, body] of routes) {
      const res = await send(method, path, body);
      expect(res.status, `${method} ${path}`).toBe(404);
      expect(res.json.errors[0]).toMatchObject({ path: "id", message: expect.stringContaining("nope") });
    }
  });

  it("refuses a body declared larger than the limit with 413, and one that is not JSON with 415", async () => {
    const { app } = api();
    const big = await app.request("/api/v1/checks", {
      method: "POST",
      headers: { "content-type": "application/json", "content-length": String(MAX_JSON_BYTES + 1) },
      body: JSON.stringify({ input: sampleInput() }),
    });
    expect(big.status).toBe(413);
    const text = await app.request("/api/v1/signers", { method: "POST", headers: { "content-type": "text/plain" }, body: "Ana" });
    expect(text.status).toBe(415);
    expect(((await text.json()) as Json).errors[0].message).toMatch(/application\/json/);
  });
});

describe("records API: signers and sign-off", () => {
  it("registers a signer, refuses the same name again with 409 and a short passphrase with 422", async () => {
    const { send } = api();
    expect(await send("POST", "/api/v1/signers", PEOPLE.ana)).toMatchObject({ status: 201, json: { name: PEOPLE.ana.name } });
    const again = await send("POST", "/api/v1/signers", { name: PEOPLE.ana.name.toUpperCase(), passphrase: "a different long phrase" });
    expect(again.status).toBe(409);
    const short = await send("POST", "/api/v1/signers", { name: "Eli Short", passphrase: "tiny" });
    expect(short).toMatchObject({ status: 422, json: { errors: [{ path: "passphrase" }] } });
    expect((await send("GET", "/api/v1/signers")).json.signers.map((s: Json) => s.name)).toEqual([PEOPLE.ana.name]);
  });

  it("signs prepared, checked, approved in order with 201", async () => {
    const { send, id } = await withSigners();
    const steps = [
      ["prepared", PEOPLE.ana],
      ["checked", PEOPLE.bo],
      ["approved", PEOPLE.cy],
    ] as const;
    for (const [role, who] of steps) {
      const res = await send("POST", `/api/v1/checks/${id}/signoffs`, { revision: 1, role, ...who });
      expect(res).toMatchObject({ status: 201, json: { revision: 1, state: role, signoff: { role, name: who.name } } });
    }
    const list = await send("GET", "/api/v1/checks");
    expect(list.json.checks[0].state).toBe("approved");
  });

  it("answers a wrong passphrase with 403", async () => {
    const { send, id } = await withSigners();
    const res = await send("POST", `/api/v1/checks/${id}/signoffs`, {
      revision: 1,
      role: "prepared",
      name: PEOPLE.ana.name,
      passphrase: "not the right phrase",
    });
    expect(res).toMatchObject({ status: 403, json: { errors: [{ path: "passphrase" }] } });
  });

  // The four-eyes rule (common practice): the checker is not the preparer.
  it("answers the preparer signing as checker with 409", async () => {
    const { send, id } = await withSigners();
    await send("POST", `/api/v1/checks/${id}/signoffs`, { revision: 1, role: "prepared", ...PEOPLE.ana });
    const res = await send("POST", `/api/v1/checks/${id}/signoffs`, { revision: 1, role: "checked", ...PEOPLE.ana });
    expect(res.status).toBe(409);
    expect(res.json.errors[0].message).toMatch(/four-eyes/);
  });

  it("answers a sign-off out of order, or on a superseded revision, with 409", async () => {
    const { send, id } = await withSigners();
    const early = await send("POST", `/api/v1/checks/${id}/signoffs`, { revision: 1, role: "approved", ...PEOPLE.cy });
    expect(early.status).toBe(409);
    await send("POST", `/api/v1/checks/${id}/revisions`, { input: sampleInput(2.2) });
    const stale = await send("POST", `/api/v1/checks/${id}/signoffs`, { revision: 1, role: "prepared", ...PEOPLE.ana });
    expect(stale).toMatchObject({ status: 409, json: { errors: [{ path: "revision" }] } });
  });

  it("answers a sign-off body with bad fields with 422 naming each", async () => {
    const { send, id } = await withSigners();
    const res = await send("POST", `/api/v1/checks/${id}/signoffs`, { revision: "1", role: "stamped", name: PEOPLE.ana.name });
    expect(res.status).toBe(422);
    expect(res.json.errors.map((e: Json) => e.path)).toEqual(["revision", "role", "passphrase"]);
  });
});

describe("records API: export and import", () => {
  it("exports a check as a file another server imports with its sign-offs", async () => {
    const { send, id } = await withSigners();
    await send("POST", `/api/v1/checks/${id}/signoffs`, { revision: 1, role: "prepared", ...PEOPLE.ana });
    const exported = await send("GET", `/api/v1/checks/${id}/export`);
    expect(exported.status).toBe(200);
    expect(exported.headers.get("content-disposition")).toBe('attachment; filename="HW-WEB-1.hoopwise.json"');

    const other = api();
    const imported = await other.send("POST", "/api/v1/checks/import", exported.json);
    expect(imported).toMatchObject({ status: 201, json: { id, calcNumber: "HW-WEB-1", revisions: 1 } });
    const check = await other.send("GET", `/api/v1/checks/${id}`);
    expect(check.json.revisions[0]).toMatchObject({
      state: "prepared",
      signoffs: [{ role: "prepared", name: PEOPLE.ana.name, imported: true }],
    });
    expect((await other.send("POST", "/api/v1/checks/import", exported.json)).status).toBe(409);
  });

  it("refuses a tampered file with 422 and imports nothing", async () => {
    const { send, id } = await withSavedCheck();
    const doc = (await send("GET", `/api/v1/checks/${id}/export`)).json;
    doc.revisions[0].input.shell.thickness_mm = 3.2;
    const other = api();
    const res = await other.send("POST", "/api/v1/checks/import", doc);
    expect(res.status).toBe(422);
    expect(res.json.errors.map((e: Json) => e.path)).toContain("revisions.0.fingerprint");
    expect((await other.send("GET", "/api/v1/checks")).json.checks).toEqual([]);
  });
});

describe("records API mounted in a larger app", () => {
  it("still answers with its own errors documents", async () => {
    const outer = new Hono();
    outer.route("/", recordsApi({ store: testStore() }));
    const res = await outer.request("/api/v1/checks/missing");
    expect(res.status).toBe(404);
    expect(((await res.json()) as Json).errors[0].path).toBe("id");
  });
});
