/**
 * A model file's `simplices` list read straight from the text into typed
 * arrays, and the rest of the file left for JSON.parse.
 *
 * On a large model the simplex list is nearly all of the file, and parsing
 * it into one small JS array per simplex costs more than the text scan
 * itself: hundreds of thousands of objects to allocate, promote and trace
 * while the engine runs. This scanner accepts only the plain form
 * (`[[0,1,2],[1,2,3],…]`: lists of non-negative decimal integers with
 * optional whitespace) and gives up on anything else, so every other file,
 * including every malformed one, takes the ordinary path and gets the
 * ordinary messages.
 */
export interface ScannedSimplices {
  /** Vertex ids of all simplices, one after another. */
  readonly ids: Int32Array;
  /** ends[i]: one past the last id of simplex i in `ids`. */
  readonly ends: Int32Array;
  readonly count: number;
}

export interface SplitText {
  simplices: ScannedSimplices;
  /** The file with the simplex list replaced by `[]`, for JSON.parse. */
  rest: string;
}

const SPACE = 0x20;
const TAB = 0x09;
const LF = 0x0a;
const CR = 0x0d;
const QUOTE = 0x22;
const BACKSLASH = 0x5c;
const COMMA = 0x2c;
const COLON = 0x3a;
const OPEN = 0x5b;
const CLOSE = 0x5d;
const BRACE_OPEN = 0x7b;
const BRACE_CLOSE = 0x7d;
const ZERO = 0x30;
const NINE = 0x39;
/** Ids are kept in an Int32Array; larger ones (and more digits) take the ordinary path. */
const MAX_ID = 0x7fffffff;

/** Split a model file's text, or undefined when it is not in the plain form this scanner reads. */
export function splitModelText(text: string): SplitText | undefined {
  const at = findSimplices(text);
  if (!at) return undefined;
  return { simplices: at.simplices, rest: text.slice(0, at.start) + '[]' + text.slice(at.end) };
}

/**
 * The span of the top-level `simplices` value. Walks the top-level object
 * only as far as needed to be sure of the key: other values are skipped by
 * bracket depth, strings by their quotes. A key written with escapes, or a
 * second `simplices` key, ends the attempt.
 */
function findSimplices(text: string): { start: number; end: number; simplices: ScannedSimplices } | undefined {
  const n = text.length;
  let i = skipSpace(text, 0);
  if (text.charCodeAt(i) !== BRACE_OPEN) return undefined;
  i = skipSpace(text, i + 1);
  let found: { start: number; end: number; simplices: ScannedSimplices } | undefined;
  if (text.charCodeAt(i) === BRACE_CLOSE) return undefined;
  for (;;) {
    if (text.charCodeAt(i) !== QUOTE) return undefined;
    const keyStart = i + 1;
    let j = keyStart;
    while (j < n) {
      const c = text.charCodeAt(j);
      if (c === QUOTE) break;
      if (c === BACKSLASH) return undefined;
      j++;
    }
    if (j >= n) return undefined;
    const isSimplices = j - keyStart === 9 && text.startsWith('simplices', keyStart);
    i = skipSpace(text, j + 1);
    if (text.charCodeAt(i) !== COLON) return undefined;
    i = skipSpace(text, i + 1);
    let end: number;
    if (isSimplices) {
      if (found) return undefined;
      const scanned = scanList(text, i);
      if (!scanned) return undefined;
      end = scanned.end;
      found = { start: i, end, simplices: scanned.simplices };
    } else {
      end = skipValue(text, i);
      if (end < 0) return undefined;
    }
    i = skipSpace(text, end);
    const c = text.charCodeAt(i);
    if (c === COMMA) {
      i = skipSpace(text, i + 1);
      continue;
    }
    if (c === BRACE_CLOSE) return found;
    return undefined;
  }
}

/** One past the end of the JSON value starting at i (not validated: JSON.parse sees it later), or -1. */
function skipValue(text: string, i: number): number {
  const n = text.length;
  let depth = 0;
  while (i < n) {
    const c = text.charCodeAt(i);
    if (c === QUOTE) {
      i++;
      while (i < n) {
        const q = text.charCodeAt(i);
        if (q === BACKSLASH) i += 2;
        else if (q === QUOTE) break;
        else i++;
      }
      if (i >= n) return -1;
      i++;
      if (depth === 0) return i;
      continue;
    }
    if (c === OPEN || c === BRACE_OPEN) depth++;
    else if (c === CLOSE || c === BRACE_CLOSE) {
      if (depth === 0) return i; // a bare scalar ended by its container
      depth--;
      if (depth === 0) return i + 1;
    } else if (depth === 0 && (c === COMMA || isSpace(c))) return i;
    i++;
  }
  return depth === 0 ? i : -1;
}

/** The simplex list starting at `start` and one past its end, or undefined if it is not a list of lists of plain ids. */
function scanList(text: string, start: number): { simplices: ScannedSimplices; end: number } | undefined {
  // Room for ids of a few digits, grown when they are shorter; trimmed at the end.
  const guess = Math.min(text.length - start, 1 << 28);
  let ids = new Int32Array(Math.max(16, guess >> 2));
  let ends = new Int32Array(Math.max(16, guess >> 3));
  let count = 0;
  let w = 0;
  let i = start;
  if (text.charCodeAt(i) !== OPEN) return undefined;
  i = skipSpace(text, i + 1);
  if (text.charCodeAt(i) === CLOSE) return { simplices: { ids: new Int32Array(0), ends: new Int32Array(0), count: 0 }, end: i + 1 };
  // Spaces are looked for only where the expected character is missing:
  // generated files rarely have any, and the scan is most of a large read.
  for (;;) {
    let c = text.charCodeAt(i);
    if (c !== OPEN) {
      i = skipSpace(text, i);
      if (text.charCodeAt(i) !== OPEN) return undefined;
    }
    i++;
    for (;;) {
      c = text.charCodeAt(i);
      if (c < ZERO || c > NINE) {
        i = skipSpace(text, i);
        c = text.charCodeAt(i);
        if (c < ZERO || c > NINE) return undefined;
      }
      let v = c - ZERO;
      i++;
      c = text.charCodeAt(i);
      if (v === 0 && c >= ZERO && c <= NINE) return undefined; // a leading zero is not JSON
      while (c >= ZERO && c <= NINE) {
        v = v * 10 + (c - ZERO);
        if (v > MAX_ID) return undefined;
        i++;
        c = text.charCodeAt(i);
      }
      if (w === ids.length) ids = grow(ids);
      ids[w++] = v;
      if (c === COMMA) {
        i++;
        continue;
      }
      if (c === CLOSE) break;
      i = skipSpace(text, i);
      c = text.charCodeAt(i);
      if (c === COMMA) {
        i++;
        continue;
      }
      if (c === CLOSE) break;
      return undefined; // a fraction, an exponent or anything else
    }
    if (count === ends.length) ends = grow(ends);
    ends[count++] = w;
    i++;
    c = text.charCodeAt(i);
    if (c !== COMMA && c !== CLOSE) {
      i = skipSpace(text, i);
      c = text.charCodeAt(i);
    }
    if (c === COMMA) {
      i++;
      continue;
    }
    if (c === CLOSE) break;
    return undefined;
  }
  // No closure over ids and ends above: captured, they would live in a context and slow every access.
  return { simplices: { ids: trim(ids, w), ends: trim(ends, count), count }, end: i + 1 };
}

/** The first n entries, copied when the spare room would otherwise stay allocated. */
function trim(a: Int32Array<ArrayBuffer>, n: number): Int32Array {
  return a.length - n > (n >> 3) + 1024 ? a.slice(0, n) : a.subarray(0, n);
}

function grow(a: Int32Array<ArrayBuffer>): Int32Array<ArrayBuffer> {
  const b = new Int32Array(a.length * 2);
  b.set(a);
  return b;
}

function isSpace(c: number): boolean {
  return c === SPACE || c === LF || c === CR || c === TAB;
}

function skipSpace(text: string, i: number): number {
  for (;;) {
    const c = text.charCodeAt(i);
    if (c === SPACE || c === LF || c === CR || c === TAB) i++;
    else return i;
  }
}
