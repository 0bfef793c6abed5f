/**
 * When two names are the same person's. The four-eyes rule compares people, so a name that only
 * looks different ("Ana Reyes" with a zero-width space, or with a Cyrillic "а") must not pass as
 * a second person. The key follows Unicode Technical Standard #39 (Unicode Security Mechanisms),
 * section 4, "Confusable Detection": a skeleton is made by normalising, mapping each character
 * to its prototype and normalising again; two strings with one skeleton are confusable.
 *
 * Steps, in order:
 * 1. NFKC (Unicode Standard Annex #15): compatibility forms fold (fullwidth "Ａ", mathematical
 *    "𝐀", ligature "ﬁ", superscripts) to their plain letters.
 * 2. Remove every Default_Ignorable_Code_Point (zero-width space and joiners, soft hyphen,
 *    word joiner, variation selectors, bidirectional controls…), as TS #39 §4 does.
 * 3. Spaces: every run of Unicode white space becomes one space, trimmed at both ends; dashes
 *    and hyphens of every kind become "-".
 * 4. NFD, then each character mapped through PROTOTYPES (capitals and small letters both),
 *    then lower case, then PROTOTYPES again (for the small look-alikes lower casing produces),
 *    then NFD again.
 *
 * Where the data comes from: the full mapping is the Unicode Consortium's confusables.txt (the
 * data file of TS #39), which this build does not carry. PROTOTYPES is a hand-made subset of it,
 * written from that file's well-known entries: the Cyrillic and Greek letters that look like
 * basic Latin letters, dotless and small-capital Latin forms, the digits 0 and 1, and the
 * letter pairs "rn" → "m", "vv" → "w", "cl" → "d". It covers Latin, Greek and Cyrillic names;
 * look-alikes from other scripts (Armenian, Cherokee, …) and rarer symbols are not folded.
 * Because lower-case "i", capital "I", "l", "1" and "|" look alike in many typefaces, all five
 * fold to "l" (as confusables.txt folds "I", "1" and "|" to "l"): "Ali" and "All" are then one
 * name, and the second to register adds an initial. That errs towards refusing a new name.
 */

// Each entry: a character (or pair) and the Latin prototype it is read as.
const PAIRS: ReadonlyArray<readonly [string, string]> = [
  // Cyrillic capitals
  ["А", "A"],
  ["В", "B"],
  ["Е", "E"],
  ["К", "K"],
  ["М", "M"],
  ["Н", "H"],
  ["О", "O"],
  ["Р", "P"],
  ["С", "C"],
  ["Т", "T"],
  ["Х", "X"],
  ["У", "Y"],
  ["Ү", "Y"],
  ["Ѕ", "S"],
  ["І", "l"],
  ["Ӏ", "l"],
  ["Ј", "J"],
  ["Ԛ", "Q"],
  ["Ԝ", "W"],
  ["Һ", "h"],
  ["Ԁ", "d"],
  ["З", "3"],
  ["Ь", "b"],
  // Cyrillic small letters
  ["а", "a"],
  ["е", "e"],
  ["о", "o"],
  ["р", "p"],
  ["с", "c"],
  ["у", "y"],
  ["х", "x"],
  ["ѕ", "s"],
  ["і", "l"],
  ["ј", "j"],
  ["һ", "h"],
  ["ԁ", "d"],
  ["ԛ", "q"],
  ["ԝ", "w"],
  ["ӏ", "l"],
  ["ү", "y"],
  ["ɡ", "g"],
  ["к", "k"],
  ["п", "n"],
  ["г", "r"],
  ["ь", "b"],
  ["т", "t"],
  ["м", "m"],
  ["в", "b"],
  ["н", "h"],
  // Greek capitals
  ["Α", "A"],
  ["Β", "B"],
  ["Ε", "E"],
  ["Ζ", "Z"],
  ["Η", "H"],
  ["Ι", "l"],
  ["Κ", "K"],
  ["Μ", "M"],
  ["Ν", "N"],
  ["Ο", "O"],
  ["Ρ", "P"],
  ["Τ", "T"],
  ["Υ", "Y"],
  ["Χ", "X"],
  ["Ϲ", "C"],
  ["Ϳ", "J"],
  // Greek small letters
  ["α", "a"],
  ["ο", "o"],
  ["ρ", "p"],
  ["ν", "v"],
  ["ι", "l"],
  ["κ", "k"],
  ["υ", "u"],
  ["χ", "x"],
  ["γ", "y"],
  ["ϲ", "c"],
  ["ϳ", "j"],
  ["τ", "t"],
  ["ω", "w"],
  ["ε", "e"],
  // Latin look-alikes
  ["ı", "l"],
  ["ɩ", "l"],
  ["ǀ", "l"],
  ["|", "l"],
  ["1", "l"],
  ["I", "l"],
  ["i", "l"],
  ["ɑ", "a"],
  ["ɒ", "a"],
  ["ʜ", "h"],
  ["ɪ", "l"],
  ["ʟ", "l"],
  ["ɴ", "n"],
  ["ʀ", "r"],
  ["ʏ", "y"],
  ["ᴀ", "a"],
  ["ᴄ", "c"],
  ["ᴅ", "d"],
  ["ᴇ", "e"],
  ["ᴊ", "j"],
  ["ᴋ", "k"],
  ["ᴍ", "m"],
  ["ᴏ", "o"],
  ["ᴘ", "p"],
  ["ᴛ", "t"],
  ["ᴜ", "u"],
  ["ᴠ", "v"],
  ["ᴡ", "w"],
  ["ᴢ", "z"],
  ["ꜱ", "s"],
  ["0", "o"],
  ["O", "o"],
  ["ſ", "f"],
  // Letter pairs read as one letter
  ["rn", "m"],
  ["vv", "w"],
  ["cl", "d"],
];

const SINGLE = new Map(PAIRS.filter(([from]) => [...from].length === 1));
const MULTI = PAIRS.filter(([from]) => [...from].length > 1);

const IGNORABLE = /\p{Default_Ignorable_Code_Point}/gu;
const DASHES = /[\u2010-\u2015\u2212\uFE58\uFE63\uFF0D]/gu;

function mapPrototypes(s: string): string {
  let out = "";
  for (const ch of s) out += SINGLE.get(ch) ?? ch;
  for (const [from, to] of MULTI) out = out.split(from).join(to);
  return out;
}

/** The skeleton two names are compared by: equal skeletons are one person. */
export function nameKey(name: string): string {
  const plain = name.normalize("NFKC").replace(IGNORABLE, "").replace(DASHES, "-").replace(/\s+/gu, " ").trim();
  return mapPrototypes(mapPrototypes(plain.normalize("NFD")).toLowerCase()).normalize("NFD");
}

/** A name as it is stored and printed: NFC, default-ignorable characters removed, spaces tidied. */
export function displayName(name: string): string {
  return name.normalize("NFC").replace(IGNORABLE, "").replace(/\s+/gu, " ").trim();
}
