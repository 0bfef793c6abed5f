import { VERDICT_WORDS, type Verdict } from "../../src/engine/index.ts";
import type { CheckRecord, RevisionRecord } from "../../src/store/index.ts";
import type { InputChange, InputDiff } from "../../src/present/revisions/diff.ts";
import { relativeChange, type Figure, type WorkedRevision } from "../../src/present/revisions/figures.ts";
import { cycles, sig } from "../format.ts";
import { SelectField } from "./fields.tsx";
import { checkPath, comparePath } from "./paths.ts";
import { StateBadge, When } from "./state.tsx";

/** Two revisions of one check to compare; `errors` holds what is wrong with the revisions asked for. */
export interface Comparison {
  check: CheckRecord;
  from?: string;
  to?: string;
  errors: Map<string, string[]>;
  pair?: { a: RevisionRecord; b: RevisionRecord; input: InputDiff; worked: [WorkedRevision, WorkedRevision] };
  engineVersion: string;
}

export function CompareView(p: Comparison) {
  const options = p.check.revisions.map((r) => ({ value: String(r.number), label: `Revision ${r.number} (${r.state})` }));
  return (
    <>
      <p class="crumbs">
        <a href="/records">Saved checks</a> / <a href={checkPath(p.check.id)}>{p.check.calcNumber}</a> /
      </p>
      <h1>
        Compare revisions <span class="calc">{p.check.calcNumber}</span> {p.check.title}
      </h1>
      <form method="get" action={comparePath(p.check.id)} class="compare-form">
        <SelectField id="cmp-from" name="from" label="Earlier revision" value={p.from} options={options} errors={p.errors.get("from")} />
        <SelectField id="cmp-to" name="to" label="Later revision" value={p.to} options={options} errors={p.errors.get("to")} />
        <button type="submit">Compare</button>
      </form>
      {p.check.revisions.length < 2 ? <p class="empty">This check has one revision so far: there is nothing to compare it with.</p> : null}
      {p.check.revisions.length > 1 && !p.pair && p.errors.size === 0 ? (
        <p class="empty">Pick two different revisions to compare.</p>
      ) : null}
      {p.pair ? <Pair {...p.pair} engineVersion={p.engineVersion} /> : null}
    </>
  );
}

function Pair({ a, b, input, worked, engineVersion }: NonNullable<Comparison["pair"]> & { engineVersion: string }) {
  return (
    <>
      <div class="side-heads">
        <RevisionHead r={a} />
        <RevisionHead r={b} />
      </div>
      <section class="panel-box" aria-labelledby="h-input-diff" id="input-diff">
        <h2 id="h-input-diff">What changed in the input</h2>
        {input.changes.length === 0 ? <p class="empty">The inputs are the same.</p> : <InputTable a={a.number} b={b.number} diff={input} />}
      </section>
      <section class="panel-box" aria-labelledby="h-result-diff" id="result-diff">
        <h2 id="h-result-diff">What changed in the results</h2>
        <p class="hint">
          Both revisions are worked out again by the engine running now (version {engineVersion}); changed figures are marked.
        </p>
        <ResultTable a={a.number} b={b.number} worked={worked} />
      </section>
    </>
  );
}

function RevisionHead({ r }: { r: RevisionRecord }) {
  return (
    <div class="side-head">
      <strong>Revision {r.number}</strong> <StateBadge state={r.state} />
      <br />
      saved <When at={r.savedAt} />
      {r.savedBy ? ` by ${r.savedBy}` : ""}
    </div>
  );
}

const KIND_WORDS: Record<InputChange["kind"], string> = { changed: "changed", added: "added", removed: "removed" };

function InputTable({ a, b, diff }: { a: number; b: number; diff: InputDiff }) {
  return (
    <div class="scroll">
      <table class="records-table diff">
        <thead>
          <tr>
            <th scope="col">Key</th>
            <th scope="col">Unit</th>
            <th scope="col">Revision {a}</th>
            <th scope="col">Revision {b}</th>
            <th scope="col">Change</th>
          </tr>
        </thead>
        <tbody>
          {diff.changes.map((c) => (
            <tr class={`diff-${c.kind}`} data-path={c.path}>
              <th scope="row">
                {c.label ? <span class="diff-label">{c.label} </span> : null}
                <code>{c.path}</code>
              </th>
              <td>{c.unit ?? ""}</td>
              <td class="before">{c.kind === "added" ? <span class="hint">not given</span> : inputText(c.before)}</td>
              <td class="after">{c.kind === "removed" ? <span class="hint">not given</span> : inputText(c.after)}</td>
              <td>{KIND_WORDS[c.kind]}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {diff.more > 0 ? <p class="hint">…and {diff.more} more differences, not listed.</p> : null}
    </div>
  );
}

/** A saved value as it was typed: numbers in full, a long list by its length. */
function inputText(v: unknown): string {
  if (Array.isArray(v))
    return v.length <= 12 ? v.map(String).join(", ") : `${v.length} values (${v.slice(0, 3).map(String).join(", ")}, …)`;
  if (typeof v === "string") return v;
  return JSON.stringify(v) ?? "";
}

function ResultTable({ a, b, worked }: { a: number; b: number; worked: [WorkedRevision, WorkedRevision] }) {
  const [wa, wb] = worked;
  if (!wa.ok || !wb.ok) {
    return (
      <div class="form-problems" role="alert">
        <Unworked n={a} w={wa} />
        <Unworked n={b} w={wb} />
      </div>
    );
  }
  return (
    <div class="scroll">
      <table class="records-table diff">
        <thead>
          <tr>
            <th scope="col">Figure</th>
            <th scope="col">Revision {a}</th>
            <th scope="col">Revision {b}</th>
            <th scope="col">Change</th>
          </tr>
        </thead>
        <tbody>
          {wa.figures.map((fa, i) => {
            const fb = wb.figures[i];
            const changed = !Object.is(fa.value, fb.value);
            const rel = relativeChange(fa.value, fb.value);
            return (
              <tr class={changed ? "diff-changed" : "same"} data-figure={fa.id}>
                <th scope="row">{fa.label}</th>
                <td class="before">{figureText(fa)}</td>
                <td class="after">{figureText(fb)}</td>
                <td class="change">{changed ? rel === undefined ? "changed" : percent(rel) : <span class="hint">same</span>}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

function Unworked({ n, w }: { n: number; w: WorkedRevision }) {
  if (w.ok) return null;
  return (
    <p>
      Revision {n} cannot be worked out by this engine: {w.errors.map((e) => `${e.path}: ${e.message}`).join("; ")}
    </p>
  );
}

function figureText(f: Figure): string {
  const v = f.value;
  if (v === undefined) return "not part of this check";
  if (typeof v === "string") return f.kind === "verdict" ? (v in VERDICT_WORDS ? VERDICT_WORDS[v as Verdict].short : v) : v;
  switch (f.kind) {
    case "life":
      return cycles(v, f.unit);
    case "bound":
      return v === null ? "—" : cycles(v, f.unit);
    case "interval":
      return v === null ? "no growth (the pressure does not cycle)" : cycles(v, f.unit);
    case "stress":
      return v === null ? "—" : `${sig(v)} ${f.unit}`;
    default:
      return sig(v, 3);
  }
}

function percent(rel: number): string {
  const pct = rel * 100;
  return `${pct < 0 ? "−" : "+"}${sig(Math.abs(pct), 2)} %`;
}
