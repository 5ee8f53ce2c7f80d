/** An exact rational n/d with d > 0 and gcd(|n|, d) = 1. */
export interface Rational {
  readonly n: bigint;
  readonly d: bigint;
}

export function gcd(a: bigint, b: bigint): bigint {
  if (a < 0n) a = -a;
  if (b < 0n) b = -b;
  while (b !== 0n) {
    const t = a % b;
    a = b;
    b = t;
  }
  return a;
}

/** Normalise n/d (d ≠ 0) to lowest terms with a positive denominator. */
export function rational(n: bigint, d: bigint = 1n): Rational {
  if (d === 0n) throw new RangeError('zero denominator');
  if (d < 0n) {
    n = -n;
    d = -d;
  }
  if (d === 1n) return { n, d };
  const g = gcd(n, d);
  return g === 1n ? { n, d } : { n: n / g, d: d / g };
}
