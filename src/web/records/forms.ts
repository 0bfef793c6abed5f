import type { Context } from "hono";

/**
 * The text fields of a posted form. A body that is not a form reads as an empty one, so each
 * field then says what it is missing rather than the server failing.
 */
export async function postedFields(c: Context): Promise<Record<string, string>> {
  try {
    const body = await c.req.parseBody();
    return Object.fromEntries(Object.entries(body).filter((e): e is [string, string] => typeof e[1] === "string"));
  } catch {
    return {};
  }
}
