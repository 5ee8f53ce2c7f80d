import type { Field } from './Field';

/** Deterministic primality for n < 2^31 by trial division (at most ~46341/6 steps). */
export function isPrime(n: number): boolean {
  if (!Number.isInteger(n) || n < 2) return false;
  if (n % 2 === 0) return n === 2;
  if (n % 3 === 0) return n === 3;
  for (let f = 5; f * f <= n; f += 6) {
    if (n % f === 0 || n % (f + 2) === 0) return false;
  }
  return true;
}

const TWO_16 = 65536;

/**
 * The finite field GF(p), p prime below 2^31, on plain numbers.
 * Products of residues below 2^26 stay under 2^53 and are exact in a double;
 * for larger p the multiplier is split into 16-bit halves so every partial
 * product stays exact.
 */
export function primeField(p: number): Field<number> {
  if (!isPrime(p) || p >= 2 ** 31) throw new RangeError(`${p} is not a prime below 2^31`);
  const small = p < 2 ** 26;
  const invP = 1 / p;
  const mul = small
    ? (a: number, b: number) => {
        // Floating `%` is a slow library call; the quotient estimate is off by at most one.
        const x = a * b;
        const r = x - p * Math.floor(x * invP);
        return r < 0 ? r + p : r >= p ? r - p : r;
      }
    : (a: number, b: number) => {
        const hi = Math.floor(b / TWO_16);
        const lo = b - hi * TWO_16;
        return (((a * hi) % p) * TWO_16 + a * lo) % p;
      };
  const inv = (a: number) => {
    if (a === 0) throw new RangeError('inverse of zero');
    // Extended Euclid; all intermediates stay below p in magnitude.
    let t = 0;
    let newT = 1;
    let r = p;
    let newR = a;
    while (newR !== 0) {
      const q = Math.floor(r / newR);
      [t, newT] = [newT, t - q * newT];
      [r, newR] = [newR, r - q * newR];
    }
    return t < 0 ? t + p : t;
  };
  const P = BigInt(p);
  const reduce = (n: bigint) => {
    const r = Number(((n % P) + P) % P);
    return r;
  };
  return {
    kind: 'prime',
    label: `prime:${p}`,
    zero: 0,
    one: 1,
    tolerance: 0,
    modulus: p,
    add: (a, b) => {
      const s = a + b;
      return s >= p ? s - p : s;
    },
    sub: (a, b) => {
      const s = a - b;
      return s < 0 ? s + p : s;
    },
    mul,
    neg: (a) => (a === 0 ? 0 : p - a),
    inv,
    isZero: (a) => a === 0,
    equals: (a, b) => a === b,
    negligible: (a) => a === 0,
    magnitude: (a) => (a === 0 ? 0 : 1),
    fromRatio: (n, d) => {
      const den = reduce(d);
      if (den === 0) return undefined;
      return mul(reduce(n), inv(den));
    },
    fromInt: (n) => ((n % p) + p) % p,
    toJSON: (a) => a,
    toNumber: (a) => a,
    newVec: (n) => new Float64Array(n),
  };
}
