import type { MiddlewareHandler } from "hono";
import { networkInterfaces } from "node:os";
import { errorsDoc } from "./api.ts";

/**
 * Refuse a request whose Host header is not an address this server is served at. A page on
 * another site can point its own domain name at this machine's address (DNS rebinding); the
 * browser then sends that foreign name as Host and treats the answers as the other site's, so
 * the same-origin rule no longer protects the records. Checking Host against the served
 * addresses closes that hole.
 *
 * An entry is a host name or address, with or without a port: "records.example.org" matches on
 * any port, "records.example.org:8443" only on that one. IPv6 addresses are written in brackets.
 */
export const LOOPBACK_HOSTS = ["localhost", "127.0.0.1", "[::1]"] as const;

/** The Host names a server bound to `host`:`port` answers to, plus `HOOPWISE_ALLOWED_HOSTS` (comma-separated). */
export function servedHosts(host: string, port: number, env: NodeJS.ProcessEnv = process.env): string[] {
  const out = new Set<string>(LOOPBACK_HOSTS.map((h) => `${h}:${port}`));
  const bracket = (a: string) => (a.includes(":") ? `[${a}]` : a);
  if (host === "0.0.0.0" || host === "::") {
    for (const list of Object.values(networkInterfaces())) for (const a of list ?? []) out.add(`${bracket(a.address)}:${port}`);
  } else {
    out.add(`${bracket(host.replace(/^\[|\]$/g, ""))}:${port}`);
  }
  for (const extra of (env.HOOPWISE_ALLOWED_HOSTS ?? "").split(",")) {
    const h = extra.trim().toLowerCase();
    if (h) out.add(h);
  }
  return [...out].map((h) => h.toLowerCase());
}

function matches(hostHeader: string, allowed: readonly string[]): boolean {
  const h = hostHeader.trim().toLowerCase();
  const name = h.replace(/:\d+$/, "");
  return allowed.some((a) => a === h || (!/:\d+$/.test(a) && a === name));
}

/**
 * `allowed` undefined: the loopback names on any port (in-process tests, and a server that was
 * not told its address). A request without a Host header (HTTP/1.0) is refused as well.
 */
export function refuseForeignHost(allowed?: readonly string[]): MiddlewareHandler {
  const list = allowed ?? LOOPBACK_HOSTS;
  return async (c, next) => {
    const host = c.req.header("host") ?? new URL(c.req.url).host;
    if (!host || !matches(host, list)) {
      return c.json(
        errorsDoc(
          "(host)",
          `this server does not answer to the name "${host ?? ""}"; open it at its own address, or have whoever runs it add the name to HOOPWISE_ALLOWED_HOSTS`,
        ),
        421,
      );
    }
    return next();
  };
}
