import { postedForm } from "../web/postedForm.ts";
import { get } from "node:http";
import type { AddressInfo } from "node:net";
import { performance } from "node:perf_hooks";
import { serve } from "@hono/node-server";
import { findDemo } from "../../src/demo/index.ts";
import { createApp } from "../../src/web/app.ts";
import { pageRoutes } from "../../src/web/page.tsx";

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

/** Bytes on the wire for one GET, as a browser that accepts gzip would receive them (undici's fetch would unpack them first). */
function sentBytes(url: string): Promise<number> {
  return new Promise((resolve, reject) => {
    get(url, { headers: { "Accept-Encoding": "gzip" } }, (res) => {
      let n = 0;
      res.on("data", (chunk: Buffer) => (n += chunk.length));
      res.on("end", () => resolve(n));
    }).on("error", reject);
  });
}

/**
 * The page on loopback: the median round trip of one recalculation (the htmx fragment POST an
 * edit sends, answered in full: result, plots, steps, every error slot) over `requests` edits of
 * the cabin example's thickness, and the bytes of a first visit (the HTML and every asset it
 * links), both as sent (gzip where the server offers it) and unpacked.
 */
export async function pageBench(requests = 50) {
  const app = createApp({ mounts: [pageRoutes()] });
  const server = serve({ fetch: app.fetch, hostname: "127.0.0.1", port: 0 });
  await new Promise((r) => server.once("listening", r));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  try {
    const cabin = findDemo("cabin")!.document;
    const fields = postedForm(cabin);
    const edit = async (i: number) => {
      const body = new URLSearchParams({ ...fields, "shell.thickness": (0.8 + (i % 10) * 0.05).toFixed(2) });
      const t = performance.now();
      const res = await fetch(`${base}/recalc`, { method: "POST", body, headers: { "HX-Request": "true" } });
      const html = await res.text();
      const ms = performance.now() - t;
      if (res.status !== 200 || !html.includes('id="verdict"'))
        throw new Error(`recalculation ${i} answered ${res.status} without a verdict`);
      return { ms, bytes: Buffer.byteLength(html) };
    };
    for (let i = 0; i < 5; i++) await edit(i);
    const runs: { ms: number; bytes: number }[] = [];
    for (let i = 0; i < requests; i++) runs.push(await edit(i));

    const html = await (await fetch(`${base}/`, { headers: { "Accept-Encoding": "identity" } })).text();
    const links = [...html.matchAll(/(?:src|href)="(\/assets\/[^"]+)"/g)].map((m) => m[1].replace(/&amp;/g, "&"));
    let sent = await sentBytes(`${base}/`);
    let unpacked = Buffer.byteLength(html);
    for (const link of links) {
      const plain = await fetch(`${base}${link}`, { headers: { "Accept-Encoding": "identity" } });
      unpacked += (await plain.arrayBuffer()).byteLength;
      sent += await sentBytes(`${base}${link}`);
    }
    return {
      recalcMedian_ms: median(runs.map((r) => r.ms)),
      recalcFragment_bytes: median(runs.map((r) => r.bytes)),
      firstVisitSent_bytes: sent,
      firstVisitUnpacked_bytes: unpacked,
      firstVisitAssets: links.length,
    };
  } finally {
    await new Promise((r) => server.close(r));
  }
}
