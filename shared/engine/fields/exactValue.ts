import { gcd } from './Rational';

/**
 * A matrix entry as written in a model file, read exactly: the ratio n/d
 * (d > 0, not necessarily reduced) plus the float a reader in the real
 * field should use.
 */
export interface ExactValue {
  n: bigint;
  d: bigint;
  float: number;
}

const FRACTION = /^\s*([+-]?\d+)\s*\/\s*(\d+)\s*$/;
const DECIMAL = /^\s*([+-]?)(\d*)(?:\.(\d*))?(?:[eE]([+-]?\d+))?\s*$/;

/**
 * Read an integer, a JSON number, a fraction string "p/q" or a decimal
 * string ("0.125", "-1.5e-3"). JSON numbers are read through their shortest
 * decimal form, so 0.1 means 1/10 rather than the nearest double.
 * Returns a message instead of a value when the entry is not a number.
 */
export function parseExactValue(raw: unknown): ExactValue | string {
  if (typeof raw === 'number') {
    if (!Number.isFinite(raw)) return `${raw} is not a finite number`;
    if (Number.isSafeInteger(raw)) return { n: BigInt(raw), d: 1n, float: raw };
    const parsed = parseDecimal(String(raw));
    return parsed ? { ...parsed, float: raw } : `cannot read ${raw}`;
  }
  if (typeof raw === 'string') {
    const f = FRACTION.exec(raw);
    if (f) {
      const n = BigInt(f[1]);
      const d = BigInt(f[2]);
      if (d === 0n) return `"${raw}" has a zero denominator`;
      const g = gcd(n, d);
      return { n: n / g, d: d / g, float: Number(n) / Number(d) };
    }
    const parsed = parseDecimal(raw);
    if (parsed) return { ...parsed, float: Number(raw) };
    return `"${raw}" is not a number, a fraction p/q or a decimal`;
  }
  return `${JSON.stringify(raw) ?? String(raw)} is not a number`;
}

function parseDecimal(s: string): { n: bigint; d: bigint } | undefined {
  const m = DECIMAL.exec(s);
  if (!m) return undefined;
  const [, sign, whole, frac = '', exp] = m;
  if (whole === '' && frac === '') return undefined;
  const e = exp === undefined ? 0 : Number(exp);
  if (Math.abs(e) > 400) return undefined;
  let n = BigInt((whole || '0') + frac);
  let d = 10n ** BigInt(frac.length);
  if (e > 0) n *= 10n ** BigInt(e);
  else if (e < 0) d *= 10n ** BigInt(-e);
  if (sign === '-') n = -n;
  // Lowest terms, so "0.5" is 1/2 and is defined in every field of odd characteristic.
  const g = gcd(n, d);
  return g > 1n ? { n: n / g, d: d / g } : { n, d };
}
