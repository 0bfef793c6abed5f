/**
 * The records routes under hostile bodies: 1 000 generated requests (saves, revisions, imports,
 * people, sign-ins, sign-offs), as a signed-in admin, against a real database file. No 5xx, every refusal names a field, and
 * nothing saved before is lost or damaged.
 */
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import fc from "fast-check";
import { afterAll, describe, expect, it } from "vitest";
import { DEMOS } from "../../src/demo/index.ts";
import { openSqliteStore as openStore } from "../../src/store/index.ts";
import { createApp } from "../../src/web/app.ts";
import { recordsApi } from "../../src/web/records/api.ts";
import { bounded, expectErrorsDoc } from "./answers.ts";
import { applyEdits, bodyOf, documentOf, edit, hostileValue, plan } from "./hostile.ts";

const dir = mkdtempSync(join(tmpdir(), "hoopwise-fuzz-records-"));
// A cheap passphrase hash: the routes' answers are under test here, not the hashing cost.
const store = openStore({ path: join(dir, "records.db"), passphraseCost: { n: 2 ** 10, r: 8, p: 1 } });
const app = createApp({ mounts: [recordsApi({ store })] });
afterAll(async () => {
  await store.close();
  rmSync(dir, { recursive: true, force: true });
});

/** Invented signers, registered once so sign-offs can get past the name check. */
const SIGNER = { name: "Ilse Marrow-Quint", passphrase: "amber lantern over the weir" };
const seeded = await store.createCheck({
  input: { ...DEMOS[0].document, calcNumber: "FUZZ-SEED-1" },
  calcNumber: "FUZZ-SEED-1",
  savedBy: SIGNER.name,
});
const exported = await store.exportCheck(seeded.id);

/** A text field as a client might send it: a fair value most of the time, anything at all otherwise. */
const field = (fair: fc.Arbitrary<unknown>) =>
  fc.option(fc.oneof({ weight: 3, arbitrary: fair }, { weight: 2, arbitrary: hostileValue }), { nil: undefined });
const person = fc.constantFrom(SIGNER.name, "Ansel Duroq", "", " ", "ilse  MARROW-quint");
const calcNumber = fc.oneof(fc.stringMatching(/^[A-Z]{2}-[0-9]{1,4}$/), fc.constantFrom("", "x".repeat(41), "a\nb", "L30-FUS-017"));

const request = fc.oneof(
  fc.record({
    path: fc.constant("/api/v1/checks"),
    body: fc.record(
      { input: plan.map(documentOf), title: field(fc.string()), calcNumber: field(calcNumber), savedBy: field(person) },
      { requiredKeys: [] },
    ),
  }),
  fc.record({
    path: fc.constantFrom(`/api/v1/checks/${seeded.id}/revisions`, "/api/v1/checks/no-such-id/revisions"),
    body: fc.record({ input: plan.map(documentOf), savedBy: field(person) }, { requiredKeys: [] }),
  }),
  fc.record({
    path: fc.constant("/api/v1/checks/import"),
    body: fc.array(edit, { minLength: 1, maxLength: 3 }).map((e) => applyEdits(exported, e)),
  }),
  fc.record({
    path: fc.constant("/api/v1/users"),
    body: fc.record(
      {
        name: field(person),
        role: field(fc.constantFrom("admin", "engineer", "boss")),
        passphrase: field(fc.string({ minLength: 8, maxLength: 30 })),
      },
      { requiredKeys: [] },
    ),
  }),
  fc.record({
    path: fc.constant(`/api/v1/checks/${seeded.id}/signoffs`),
    body: fc.record(
      {
        revision: field(fc.integer({ min: 0, max: 3 })),
        role: field(fc.constantFrom("prepared", "checked", "approved")),
        name: field(person),
        passphrase: field(fc.constant(SIGNER.passphrase)),
      },
      { requiredKeys: [] },
    ),
  }),
  fc.record({ path: fc.constantFrom("/api/v1/checks", "/api/v1/users", "/api/v1/checks/import", "/api/v1/session"), body: hostileValue }),
);
const contentType = fc.oneof(
  { weight: 9, arbitrary: fc.constant("application/json") },
  { weight: 1, arbitrary: fc.constantFrom("text/plain", "application/x-www-form-urlencoded", "") },
);

// 401: a generated sign-in that fails; 429: a sign-off passphrase guessed too soon after a wrong one.
const ALLOWED = [200, 201, 400, 401, 403, 404, 409, 415, 422, 429];

describe("records routes under 1 000 generated requests", () => {
  it("never answer 5xx, name a field in every refusal, and keep every saved check intact", { timeout: 300_000 }, async () => {
    await store.addUser({ ...SIGNER, role: "admin" }, null);
    const { token } = await store.signIn({ name: SIGNER.name, passphrase: SIGNER.passphrase }, "fuzz");
    // Every revision a 201 answer reported, by check id and number: its fingerprint must still be there at the end.
    const saved = new Map<string, Map<number, string>>([[seeded.id, new Map([[1, seeded.fingerprint]])]]);
    const statuses = new Set<number>();
    await fc.assert(
      fc.asyncProperty(request, contentType, async ({ path, body }, type) => {
        const res = await bounded(
          `POST ${path}`,
          app.request(path, { method: "POST", headers: { "content-type": type, authorization: `Bearer ${token}` }, body: bodyOf(body) }),
        );
        expect(ALLOWED).toContain(res.status);
        statuses.add(res.status);
        const json = await res.json();
        if (res.status >= 400) return expectErrorsDoc(json);
        if (path === "/api/v1/checks") saved.set(json.id, new Map([[1, json.fingerprint]]));
        if (path.endsWith("/revisions")) saved.get(seeded.id)?.set(json.revision, json.fingerprint);
      }),
      { numRuns: 1_000 },
    );
    // The generator reaches saves as well as each kind of refusal.
    for (const s of [201, 404, 415, 422]) expect(statuses).toContain(s);

    expect(store.db.pragma("integrity_check", { simple: true })).toBe("ok");
    const listed = new Set((await store.listChecks()).map((c) => c.id));
    for (const [id, revisions] of saved) {
      expect(listed.has(id)).toBe(true);
      const kept = new Map((await store.getCheck(id)).revisions.map((r) => [r.number, r.fingerprint]));
      for (const [n, fp] of revisions) expect(kept.get(n)).toBe(fp);
    }
  });
});
