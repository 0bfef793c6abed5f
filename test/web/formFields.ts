/**
 * The fields a browser submits for the checker's form as the server drew it (HTML form
 * submission rules, WHATWG HTML §4.10.21.4): text and hidden inputs with their value, checked
 * checkboxes and radios, each select's selected option or else its first, textareas' text.
 * Buttons and file inputs are left out. Good enough for the markup Hono's JSX writes.
 */
export function browserFields(html: string, formId = "check-form"): Record<string, string> {
  const start = html.indexOf(`<form id="${formId}"`);
  const end = html.indexOf("</form>", start);
  const form = html.slice(start, end);
  const out: Record<string, string> = {};
  const attr = (tag: string, name: string) => new RegExp(`\\s${name}="([^"]*)"`).exec(tag)?.[1];
  const has = (tag: string, name: string) => new RegExp(`\\s${name}(=""|\\s|/?>)`).test(tag);
  const text = (s: string) =>
    s
      .replace(/&quot;/g, '"')
      .replace(/&#39;/g, "'")
      .replace(/&lt;/g, "<")
      .replace(/&gt;/g, ">")
      .replace(/&amp;/g, "&");
  for (const m of form.matchAll(/<(input|select|textarea)\b[^>]*>/g)) {
    const tag = m[0];
    const name = attr(tag, "name");
    if (!name || has(tag, "disabled")) continue;
    if (m[1] === "input") {
      const type = attr(tag, "type") ?? "text";
      if (type === "file" || type === "submit" || type === "button") continue;
      if ((type === "checkbox" || type === "radio") && !has(tag, "checked")) continue;
      out[name] = text(attr(tag, "value") ?? (type === "checkbox" || type === "radio" ? "on" : ""));
    } else if (m[1] === "select") {
      const body = form.slice((m.index ?? 0) + tag.length, form.indexOf("</select>", m.index));
      const options = [...body.matchAll(/<option\b[^>]*>/g)].map((o) => o[0]);
      const chosen = options.find((o) => has(o, "selected")) ?? options[0];
      if (chosen) out[name] = text(attr(chosen, "value") ?? "");
    } else {
      const body = form.slice((m.index ?? 0) + tag.length, form.indexOf("</textarea>", m.index));
      out[name] = text(body);
    }
  }
  return out;
}
