import { chmodSync, mkdirSync, mkdtempSync, readdirSync, rmSync, statSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it, onTestFinished } from "vitest";
import { removeLeftoverProfiles } from "../../src/pdf/chromium.ts";
import { keyPathFor } from "../../src/store/index.ts";
import { createApp } from "../../src/web/app.ts";
import { servedHosts } from "../../src/web/hosts.ts";
import { pageRoutes } from "../../src/web/page.tsx";
import { wholeApp } from "../../src/web/whole.ts";
import { sampleInput, testStore, tempDbPath } from "../store/helpers.ts";

describe("the server's edges", () => {
  // Attack: DNS rebinding. A page on another site points its own name at this machine; the
  // browser then sends that name as Host, and same-origin no longer protects the records.
  it("attack — foreign Host: a name the server is not served at is refused with 421, the served ones pass", async () => {
    const app = createApp({
      mounts: [pageRoutes()],
      allowedHosts: servedHosts("127.0.0.1", 8080, { HOOPWISE_ALLOWED_HOSTS: "records.example.org" }),
    });
    const get = (host: string) => app.request("http://x/healthz", { headers: { host } });
    for (const foreign of ["attacker.example:8080", "127.0.0.1.attacker.example:8080", "127.0.0.1:9999", "localhost.:8080"]) {
      const res = await get(foreign);
      expect(res.status, foreign).toBe(421);
      expect((await res.json()).errors[0]).toMatchObject({ path: "(host)", message: expect.stringMatching(/does not answer to the name/) });
    }
    for (const ok of ["127.0.0.1:8080", "localhost:8080", "[::1]:8080", "records.example.org", "RECORDS.example.org:443"]) {
      expect((await get(ok)).status, ok).toBe(200);
    }
    // A post from the rebinding page is refused before the cross-site check could be fooled by the matching Origin.
    const post = await app.request("http://attacker.example:8080/", {
      method: "POST",
      headers: {
        host: "attacker.example:8080",
        origin: "http://attacker.example:8080",
        "content-type": "application/x-www-form-urlencoded",
      },
      body: "shell.thickness=2",
    });
    expect(post.status).toBe(421);
  });

  it("serves the first-run page only to this machine, only while no one is registered", async () => {
    const store = testStore();
    const app = wholeApp(store);
    const from = (address: string) => ({ incoming: { socket: { remoteAddress: address } } });
    const setup = (address: string, headers: Record<string, string> = {}) =>
      app.request("/setup", { redirect: "manual", headers }, from(address));
    expect((await setup("127.0.0.1")).status).toBe(200);
    expect((await setup("::1")).status).toBe(200);
    // From the network, or through a proxy on this machine: sent to sign in instead.
    for (const [address, headers] of [
      ["10.0.0.7", {}],
      ["192.168.1.20", {}],
      ["127.0.0.1", { "x-forwarded-for": "203.0.113.9" }],
    ] as const) {
      const res = await setup(address, headers);
      expect(res.status).toBe(303);
      expect(res.headers.get("location")).toBe("/signin");
    }
    const made = await app.request(
      "/setup",
      {
        method: "POST",
        redirect: "manual",
        body: new URLSearchParams({ name: "Edge Tester", passphrase: "cobalt meadow lantern quay", again: "cobalt meadow lantern quay" }),
      },
      from("10.0.0.7"),
    );
    expect(made.status).toBe(303);
    expect(await store.countUsers()).toBe(0);
    await makeAdmin(store);
    expect((await setup("127.0.0.1")).status).toBe(303);
  });

  it("reports 503 in words on /healthz when the records cannot be written, 200 when they can", async () => {
    const store = testStore();
    const app = wholeApp(store);
    expect(await (await app.request("/healthz")).json()).toEqual({ status: "ok", records: "writable" });
    store.db.pragma("query_only = ON"); // the file as a read-only mount makes it
    const res = await app.request("/healthz");
    expect(res.status).toBe(503);
    expect((await res.json()).errors[0].message).toMatch(/cannot be written/);
  });

  it("answers a write to a read-only database with 503 in words, and loses nothing committed", async () => {
    const store = testStore();
    const { id } = await store.createCheck({ input: sampleInput() });
    const app = wholeApp(store);
    const session = await makeAdmin(store);
    store.db.pragma("query_only = ON");
    const res = await app.request("/api/v1/checks", {
      method: "POST",
      headers: { "content-type": "application/json", authorization: `Bearer ${session}` },
      body: JSON.stringify({ input: sampleInput(2) }),
    });
    expect(res.status).toBe(503);
    expect((await res.json()).errors[0].message).toMatch(/read-only|cannot be written|failing/);
    store.db.pragma("query_only = OFF");
    expect((await store.getCheck(id)).revisions).toHaveLength(1);
  });

  it("creates the database and the signing key readable by their owner only", async () => {
    const path = tempDbPath();
    const store = testStore({ path });
    expect(statSync(path).mode & 0o777).toBe(0o600);
    expect(statSync(keyPathFor(path)).mode & 0o777).toBe(0o600);
    await store.close();
    // An older file left readable by others is tightened on the next open.
    chmodSync(keyPathFor(path), 0o644);
    chmodSync(path, 0o644);
    testStore({ path });
    expect(statSync(path).mode & 0o777).toBe(0o600);
    expect(statSync(keyPathFor(path)).mode & 0o777).toBe(0o600);
  });

  it("removes browser profiles left by a killed server, and keeps those of live processes", async () => {
    const dir = mkdtempSync(join(tmpdir(), "hoopwise-profiles-"));
    onTestFinished(() => rmSync(dir, { recursive: true, force: true }));
    // A pid far above any live one on this machine stands for a server that was killed.
    mkdirSync(join(dir, "hoopwise-chromium-4194303-dead01"));
    writeFileSync(join(dir, "hoopwise-chromium-4194303-dead01", "Local State"), "{}");
    mkdirSync(join(dir, `hoopwise-chromium-${process.pid}-live01`));
    mkdirSync(join(dir, "someone-else-entirely"));
    expect(await removeLeftoverProfiles(dir)).toBe(1);
    expect(readdirSync(dir).sort()).toEqual([`hoopwise-chromium-${process.pid}-live01`, "someone-else-entirely"]);
  });
});

async function makeAdmin(store: ReturnType<typeof testStore>): Promise<string> {
  await store.addUser({ name: "Edge Tester", role: "admin", passphrase: "cobalt meadow lantern quay" }, null);
  return (await store.signIn({ name: "Edge Tester", passphrase: "cobalt meadow lantern quay" }, "test")).token;
}
