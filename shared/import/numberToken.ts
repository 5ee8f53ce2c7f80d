const PLUS = 43;
const MINUS = 45;
const DOT = 46;
const ZERO = 48;
const NINE = 57;
const E_LOWER = 101;
const E_UPPER = 69;

// Powers of ten that are exact in a double (10^22 is the last).
const POW10 = Array.from({ length: 23 }, (_, i) => Number(`1e${i}`));

/**
 * The integer written in text[start, end): an optional sign and decimal
 * digits, nothing else. NaN when malformed or beyond the safe integers.
 */
export function parseIntToken(text: string, start: number, end: number): number {
  let p = start;
  let sign = 1;
  const first = text.charCodeAt(p);
  if (first === MINUS || first === PLUS) {
    if (first === MINUS) sign = -1;
    p++;
  }
  if (p >= end) return NaN;
  let value = 0;
  for (; p < end; p++) {
    const c = text.charCodeAt(p);
    if (c < ZERO || c > NINE) return NaN;
    value = value * 10 + (c - ZERO);
  }
  return value <= Number.MAX_SAFE_INTEGER ? sign * value : NaN;
}

/**
 * The decimal number written in text[start, end): `[+-]digits[.digits][e[+-]digits]`
 * (either side of the point may be empty, not both). NaN when malformed
 * (`inf`, `nan` and hexadecimal are) or too large to be finite.
 *
 * Short numbers, the bulk of a mesh file, are read without a substring by
 * Clinger's fast path (W. D. Clinger, "How to read floating point numbers
 * accurately", PLDI 1990): a mantissa below 2^53 times or divided by an
 * exact power of ten at most 10^22 is one correctly rounded operation.
 * Everything else goes to `Number`, which rounds correctly too.
 */
export function parseFloatToken(text: string, start: number, end: number): number {
  let p = start;
  let negative = false;
  let c = text.charCodeAt(p);
  if (c === MINUS || c === PLUS) {
    negative = c === MINUS;
    c = text.charCodeAt(++p);
  }
  let mantissa = 0;
  let digits = 0;
  let fraction = 0;
  while (p < end && c >= ZERO && c <= NINE) {
    mantissa = mantissa * 10 + (c - ZERO);
    digits++;
    c = text.charCodeAt(++p);
  }
  if (p < end && c === DOT) {
    c = text.charCodeAt(++p);
    while (p < end && c >= ZERO && c <= NINE) {
      mantissa = mantissa * 10 + (c - ZERO);
      digits++;
      fraction++;
      c = text.charCodeAt(++p);
    }
  }
  if (digits === 0) return NaN;
  let exponent = 0;
  if (p < end && (c === E_LOWER || c === E_UPPER)) {
    c = text.charCodeAt(++p);
    let expNegative = false;
    if (c === MINUS || c === PLUS) {
      expNegative = c === MINUS;
      c = text.charCodeAt(++p);
    }
    let expDigits = 0;
    while (p < end && c >= ZERO && c <= NINE) {
      // Clamped: anything this large is 0 or Infinity, decided by Number below.
      if (exponent < 100_000) exponent = exponent * 10 + (c - ZERO);
      expDigits++;
      c = text.charCodeAt(++p);
    }
    if (expDigits === 0) return NaN;
    if (expNegative) exponent = -exponent;
  }
  if (p !== end) return NaN;
  const scale = exponent - fraction;
  let value: number;
  if (digits <= 15 && scale >= -22 && scale <= 22) {
    value = scale >= 0 ? mantissa * POW10[scale] : mantissa / POW10[-scale];
  } else {
    value = Math.abs(Number(text.slice(start, end)));
    if (value === Infinity) return NaN;
  }
  return negative ? -value : value;
}
