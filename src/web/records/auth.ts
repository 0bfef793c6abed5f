import type { Context, MiddlewareHandler } from "hono";
import { getCookie, setCookie, deleteCookie } from "hono/cookie";
import { SESSION_HOURS, type Actor, type Session, type Store } from "../../store/index.ts";
import { errorsDoc } from "../api.ts";

/**
 * Who a request acts for. A browser carries the session in an HttpOnly, SameSite=Strict cookie,
 * which no script can read and no other site's page can make it send; a script sends
 * `Authorization: Bearer TOKEN`. Either way the store looks the token up; nothing is written.
 */
export const SESSION_COOKIE = "hoopwise_session";

export type RecordsEnv = { Variables: { user: Actor } };

export function tokenOf(c: Context): string | undefined {
  const auth = c.req.header("authorization");
  const bearer = auth?.match(/^Bearer\s+(\S+)\s*$/i)?.[1];
  return bearer ?? getCookie(c, SESSION_COOKIE);
}

export async function currentUser(c: Context, store: Store): Promise<Actor | undefined> {
  const token = tokenOf(c);
  return token ? store.userForToken(token) : undefined;
}

/**
 * The client's address, which guessing delays are kept against. Behind a reverse proxy every
 * request comes from the proxy; with HOOPWISE_TRUST_PROXY=1 the address the proxy appended last
 * to X-Forwarded-For is taken instead (set it only when a proxy you run is the only way in, or
 * a client could name any address). Requests made in-process (the tests' app.request) have no
 * socket and share one source.
 */
export function sourceOf(c: Context): string {
  const incoming = (c.env as { incoming?: { socket?: { remoteAddress?: string } } } | undefined)?.incoming;
  const socket = incoming?.socket?.remoteAddress ?? "in-process";
  if (process.env.HOOPWISE_TRUST_PROXY === "1") {
    const forwarded = c.req.header("x-forwarded-for")?.split(",").at(-1)?.trim();
    if (forwarded && /^[0-9a-fA-F:.]{2,45}$/.test(forwarded)) return forwarded;
  }
  return socket;
}

/**
 * Whether the request comes from this machine itself: a loopback socket, and no proxy in
 * between (a proxy on this machine would make every client look local).
 */
export function isLocalRequest(c: Context): boolean {
  const source = sourceOf(c);
  const proxied =
    c.req.header("x-forwarded-for") !== undefined || c.req.header("forwarded") !== undefined || c.req.header("via") !== undefined;
  return !proxied && (source === "in-process" || source === "::1" || /^(::ffff:)?127\./.test(source));
}

export function setSessionCookie(c: Context, session: Session): void {
  setCookie(c, SESSION_COOKIE, session.token, {
    httpOnly: true,
    sameSite: "Strict",
    path: "/",
    // Behind a TLS proxy the browser sees https; the cookie then never travels in clear.
    secure: new URL(c.req.url).protocol === "https:" || c.req.header("x-forwarded-proto") === "https",
    // Max-Age rather than Expires: the browser counts it from now, whatever the server's clock says.
    maxAge: SESSION_HOURS * 3600,
  });
}

export function clearSessionCookie(c: Context): void {
  deleteCookie(c, SESSION_COOKIE, { path: "/" });
}

/** Records answers are never kept by a browser or a proxy: they may hold what only a signed-in user may see. */
export const noStore: MiddlewareHandler = async (c, next) => {
  await next();
  c.res.headers.set("Cache-Control", "no-store");
};

/**
 * A signed-in user or 401. `answer401` words the refusal for the kind of route: JSON for the
 * API, a sign-in page for the records pages.
 */
export function requireUser(store: Store, answer401?: (c: Context) => Response | Promise<Response>): MiddlewareHandler<RecordsEnv> {
  return async (c, next) => {
    const user = await currentUser(c, store);
    if (!user) {
      c.header("Cache-Control", "no-store");
      if (answer401) return answer401(c);
      c.header("WWW-Authenticate", 'Bearer realm="hoopwise records"');
      return c.json(
        errorsDoc("(session)", "sign in first: POST /api/v1/session with your name and passphrase, then send Authorization: Bearer TOKEN"),
        401,
      );
    }
    c.set("user", user);
    return next();
  };
}
