/**
 * JSON text of a check to a value, as JSON.parse gives it, but with a long pressure history read by
 * a plain number scanner straight into one array of doubles. JSON.parse holds every number of a long
 * array as a separate heap object before it builds the array (about 4.5 times the text's bytes at
 * 10⁶ points); the scanner holds the finished array only (8 bytes a point).
 *
 * The scanner takes only the one case it can read exactly: the text holds `"history_MPa":[` once,
 * the bracket holds JSON numbers separated by commas and whitespace and nothing else, and the rest
 * of the document (the history taken out) parses to an object whose pressure.history_MPa is that
 * spot. Anything else is left to JSON.parse, so its error messages stay the ones users get.
 * A number of at most 15 significant digits and a decimal exponent within ±22 is worked as one
 * exact integer times or over one exact power of ten: a single IEEE operation on exact operands,
 * so rounded to the nearest double just as JSON.parse rounds it (Clinger, "How to read floating
 * point numbers accurately", PLDI 1990: the fast path). Every other number goes through Number(),
 * which rounds correctly too. No string is made per point.
 */
const KEY = /"history_MPa"\s*:\s*\[/g;
/** Below this, JSON.parse is as lean as anything and there is nothing to gain. */
const SCAN_FROM_CHARS = 64 * 1024;

export function parseJsonText(text: string): unknown {
  if (text.length >= SCAN_FROM_CHARS) {
    const fast = withScannedHistory(text);
    if (fast !== undefined) return fast;
  }
  return JSON.parse(text);
}

function withScannedHistory(text: string): unknown {
  KEY.lastIndex = 0;
  const m = KEY.exec(text);
  if (!m) return undefined;
  const open = m.index + m[0].length - 1;
  if (KEY.exec(text) !== null) return undefined; // the key twice: JSON.parse decides which counts
  const scanned = scanNumbers(text, open + 1);
  if (!scanned) return undefined;
  let rest: unknown;
  try {
    rest = JSON.parse(`${text.slice(0, open)}[]${text.slice(scanned.end + 1)}`);
  } catch {
    return undefined;
  }
  const pressure = (rest as { pressure?: { history_MPa?: unknown } } | null)?.pressure;
  if (!pressure || typeof pressure !== "object" || !Array.isArray(pressure.history_MPa) || pressure.history_MPa.length !== 0)
    return undefined;
  pressure.history_MPa = scanned.values;
  return rest;
}

enum C {
  Space = 32,
  Tab = 9,
  Lf = 10,
  Cr = 13,
  Comma = 44,
  Minus = 45,
  Plus = 43,
  Dot = 46,
  Zero = 48,
  Nine = 57,
  E = 69,
  LowerE = 101,
  Close = 93,
}

/** 10⁰ … 10²², each exact in a double. */
const POW10 = Array.from({ length: 23 }, (_, k) => 10 ** k);

const isSpace = (c: number) => c === C.Space || c === C.Lf || c === C.Cr || c === C.Tab;
const isDigit = (c: number) => c >= C.Zero && c <= C.Nine;

/** The numbers from `from` up to the closing bracket, or undefined if anything but JSON numbers is there. */
function scanNumbers(text: string, from: number): { values: number[]; end: number } | undefined {
  const close = text.indexOf("]", from);
  if (close < 0) return undefined;
  // Count the commas first, so the array is made once at its final length.
  let commas = 0;
  for (let i = text.indexOf(",", from); i >= 0 && i < close; i = text.indexOf(",", i + 1)) commas++;
  const values = new Array<number>(commas + 1);
  let n = 0;
  let i = from;
  const skip = () => {
    while (i < close && isSpace(text.charCodeAt(i))) i++;
  };
  skip();
  if (i === close) return commas === 0 ? { values: [], end: close } : undefined;
  for (;;) {
    const start = i;
    let negative = false;
    let mantissa = 0;
    let digits = 0;
    let scale = 0;
    if (text.charCodeAt(i) === C.Minus) {
      negative = true;
      i++;
    }
    let c = text.charCodeAt(i);
    if (c === C.Zero) c = text.charCodeAt(++i);
    else if (isDigit(c)) {
      while (isDigit(c)) {
        mantissa = mantissa * 10 + (c - C.Zero);
        digits++;
        c = text.charCodeAt(++i);
      }
    } else return undefined;
    if (c === C.Dot) {
      c = text.charCodeAt(++i);
      if (!isDigit(c)) return undefined;
      while (isDigit(c)) {
        if (mantissa > 0 || c !== C.Zero) digits++;
        mantissa = mantissa * 10 + (c - C.Zero);
        scale--;
        c = text.charCodeAt(++i);
      }
    }
    if (c === C.E || c === C.LowerE) {
      c = text.charCodeAt(++i);
      let expNegative = false;
      if (c === C.Plus || c === C.Minus) {
        expNegative = c === C.Minus;
        c = text.charCodeAt(++i);
      }
      if (!isDigit(c)) return undefined;
      let exp = 0;
      while (isDigit(c)) {
        if (exp < 1e6) exp = exp * 10 + (c - C.Zero);
        c = text.charCodeAt(++i);
      }
      scale += expNegative ? -exp : exp;
    }
    if (n > commas) return undefined;
    let v: number;
    if (digits <= 15 && scale >= -22 && scale <= 22) {
      v = scale < 0 ? mantissa / POW10[-scale] : mantissa * POW10[scale];
      if (negative) v = -v;
    } else v = Number(text.slice(start, i));
    values[n++] = v;
    skip();
    if (i === close) break;
    if (text.charCodeAt(i) !== C.Comma) return undefined;
    i++;
    skip();
  }
  return n === commas + 1 ? { values, end: close } : undefined;
}
