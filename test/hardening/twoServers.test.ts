import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { DEMOS } from "../../src/demo/index.ts";
import { FAST_SCRYPT, PEOPLE, pgSchema, PG_URL, registerPeople, tempDir, type Who } from "../store/helpers.ts";
import { openStore, type CheckRecord, type OpenedStore } from "../../src/store/index.ts";
import { startServer, type ServerChild } from "./server.ts";

/**
 * Two server processes sharing one PostgreSQL database, as an office that has outgrown one
 * machine runs them: sign-offs and revisions sent to both at once. No sign-off is lost or
 * given twice, none lands on a revision after it was superseded, and each server counts every
 * sign-off the other made as valid (one signing key).
 */
const servers: ServerChild[] = [];
afterAll(async () => {
  for (const s of servers) await s.dispose();
});

describe.skipIf(!PG_URL)(`two servers on one PostgreSQL database${PG_URL ? "" : " (skipped: HOOPWISE_TEST_PG_URL is not set)"}`, () => {
  it("neither lose nor duplicate a sign-off under concurrent sign-offs and revisions", { timeout: 180_000 }, async () => {
    const { schema, closeFirst } = await pgSchema();
    const keyPath = join(tempDir(), "records.signing-key.pem");
    const setup: OpenedStore = await openStore({ databaseUrl: PG_URL, pgSchema: schema, keyPath, passphraseCost: FAST_SCRYPT });
    closeFirst.push(setup);
    await registerPeople(setup);
    // An invented demo check, each revision a thicker skin.
    const demo = DEMOS[0].document;
    const input = (t: number) => ({ ...demo, calcNumber: "HW-TWO-1", shell: { ...demo.shell, thickness_mm: t } });
    const { id } = await setup.createCheck({ input: input(1.6) });

    const url = new URL(PG_URL ?? "");
    url.searchParams.set("options", `-c search_path=${schema}`);
    // Each person at a machine of their own (as the proxy in front would say), so the guessing
    // delay kept per address does not slow three people's sign-offs sent at one moment.
    const env = { DATABASE_URL: url.toString(), HOOPWISE_SIGNING_KEY: keyPath, HOOPWISE_TRUST_PROXY: "1" };
    const address: Record<Who, string> = { ana: "10.9.0.1", bo: "10.9.0.2", cy: "10.9.0.3" };
    const [a, b] = await Promise.all([startServer(env), startServer(env)]);
    servers.push(a, b);

    // One session per person, made on one server and used on both: the sessions are in the database.
    const token: Record<Who, string> = { ana: "", bo: "", cy: "" };
    for (const who of ["ana", "bo", "cy"] as const) {
      const res = await fetch(`${a.base}/api/v1/session`, {
        method: "POST",
        headers: { "content-type": "application/json", "x-forwarded-for": address[who] },
        body: JSON.stringify(PEOPLE[who]),
      });
      expect(res.status).toBe(201);
      token[who] = ((await res.json()) as { token: string }).token;
    }
    const post = async (server: ServerChild, who: Who, path: string, body: unknown) => {
      const res = await fetch(`${server.base}${path}`, {
        method: "POST",
        headers: { "content-type": "application/json", authorization: `Bearer ${token[who]}`, "x-forwarded-for": address[who] },
        body: JSON.stringify(body),
      });
      return { status: res.status, body: (await res.json()) as Record<string, unknown> };
    };
    const sign = (server: ServerChild, who: Who, revision: number, role: string) =>
      post(server, who, `/api/v1/checks/${id}/signoffs`, { revision, role, passphrase: PEOPLE[who].passphrase });

    const ROUNDS = 6;
    let accepted = 0;
    for (let round = 1; round <= ROUNDS; round++) {
      const rev = round;
      // All three ask both servers at once to sign as preparer: exactly one may.
      const prepared = await Promise.all([sign(a, "ana", rev, "prepared"), sign(b, "bo", rev, "prepared"), sign(b, "cy", rev, "prepared")]);
      expect(prepared.filter((r) => r.status === 201)).toHaveLength(1);
      for (const r of prepared.filter((r) => r.status !== 201)) expect(r.status).toBe(409);
      accepted++;
      const preparer = (["ana", "bo", "cy"] as const)[prepared.findIndex((r) => r.status === 201)];
      const others = (["ana", "bo", "cy"] as const).filter((w) => w !== preparer);
      // A checker signs on one server while the preparer saves a new revision on the other: the
      // sign-off lands on the revision before it is superseded, or is refused.
      const [checked, saved] = await Promise.all([
        sign(round % 2 ? a : b, others[0], rev, "checked"),
        post(round % 2 ? b : a, preparer, `/api/v1/checks/${id}/revisions`, { input: input(1.6 + round / 10) }),
      ]);
      expect(saved.status).toBe(201);
      expect(saved.body.revision).toBe(rev + 1);
      expect([201, 409]).toContain(checked.status);
      if (checked.status === 201) accepted++;
      else expect(JSON.stringify(checked.body)).toMatch(/superseded/);
    }

    const seen = async (server: ServerChild) => {
      const res = await fetch(`${server.base}/api/v1/checks/${id}`, { headers: { authorization: `Bearer ${token.ana}` } });
      return (await res.json()) as CheckRecord;
    };
    const [fromA, fromB] = await Promise.all([seen(a), seen(b)]);
    expect(fromA).toEqual(fromB);
    const signoffs = fromA.revisions.flatMap((r) => r.signoffs.map((s) => ({ revision: r.number, ...s })));
    expect(signoffs).toHaveLength(accepted);
    expect(signoffs.every((s) => s.valid)).toBe(true);
    expect(fromA.events.filter((e) => e.kind === "signed")).toHaveLength(accepted);
    expect(fromA.revisions.map((r) => r.number)).toEqual(Array.from({ length: ROUNDS + 1 }, (_, i) => i + 1));
    // No sign-off after its revision was superseded: in the event log, "signed" for revision n
    // never follows "superseded" for n.
    for (const r of fromA.revisions) {
      const kinds = fromA.events.filter((e) => e.revision === r.number).map((e) => e.kind);
      const superseded = kinds.indexOf("superseded");
      if (superseded >= 0) expect(kinds.slice(superseded + 1)).not.toContain("signed");
    }
  });
});
