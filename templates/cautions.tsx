import { CAUTIONS } from "../src/present/words.ts";

/** What the sheet is and is not, in plain words: the one caution text of every face (src/present/words.ts). */
export { CAUTION_SHORT, CAUTIONS } from "../src/present/words.ts";

export function Cautions({ num }: { num: number }) {
  return (
    <section class="keep">
      <h2>
        <span class="num">{num}</span>Cautions and the governing code
      </h2>
      <div class="cautions">
        <ul>
          {CAUTIONS.map((c) => (
            <li>{c}</li>
          ))}
        </ul>
      </div>
    </section>
  );
}
