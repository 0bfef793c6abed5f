import type { JSX } from "hono/jsx/jsx-runtime";

/**
 * The text of a rendered template. The sheet's components are all synchronous, so rendering
 * gives a string at once; an asynchronous component would be a mistake in the template.
 */
export function htmlOf(node: JSX.Element): string {
  if (node instanceof Promise) throw new Error("a sheet template component rendered asynchronously");
  return node.toString();
}
