/**
 * One HTTP request on a connection of its own (no keep-alive reuse). A pooled connection that the
 * server closes as idle just as a new request is written on it fails in the client, not the
 * server; with one connection per request, every failure seen is the server's.
 */
import { request, type IncomingHttpHeaders } from "node:http";

export interface Answer {
  status: number;
  headers: IncomingHttpHeaders;
  body: Buffer;
}

export function send(url: string, init: { method?: string; headers?: Record<string, string>; body?: string } = {}): Promise<Answer> {
  return new Promise((resolve, reject) => {
    const req = request(url, { method: init.method ?? "GET", headers: init.headers, agent: false }, (res) => {
      const chunks: Buffer[] = [];
      res.on("data", (c: Buffer) => chunks.push(c));
      res.on("end", () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
      res.on("error", reject);
    });
    req.on("error", reject);
    req.end(init.body);
  });
}

export const jsonOf = (a: Answer): unknown => JSON.parse(a.body.toString("utf8"));
