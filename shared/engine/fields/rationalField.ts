import type { Field, Vec } from './Field';
import { rational, type Rational } from './Rational';

const ZERO: Rational = { n: 0n, d: 1n };
const ONE: Rational = { n: 1n, d: 1n };

/** Exact arithmetic over the rationals on normalised BigInt pairs. */
export const rationalField: Field<Rational> = {
  kind: 'rational',
  label: 'rational',
  zero: ZERO,
  one: ONE,
  tolerance: 0,
  modulus: 0,
  // Integer fast paths matter: most sheaves in practice carry ±1 and small integers.
  add: (a, b) =>
    a.d === 1n && b.d === 1n ? { n: a.n + b.n, d: 1n } : rational(a.n * b.d + b.n * a.d, a.d * b.d),
  sub: (a, b) =>
    a.d === 1n && b.d === 1n ? { n: a.n - b.n, d: 1n } : rational(a.n * b.d - b.n * a.d, a.d * b.d),
  mul: (a, b) => {
    if (a.n === 0n || b.n === 0n) return ZERO;
    return a.d === 1n && b.d === 1n ? { n: a.n * b.n, d: 1n } : rational(a.n * b.n, a.d * b.d);
  },
  neg: (a) => (a.n === 0n ? a : { n: -a.n, d: a.d }),
  inv: (a) => {
    if (a.n === 0n) throw new RangeError('inverse of zero');
    return a.n < 0n ? { n: -a.d, d: -a.n } : { n: a.d, d: a.n };
  },
  isZero: (a) => a.n === 0n,
  equals: (a, b) => a.n === b.n && a.d === b.d,
  negligible: (a) => a.n === 0n,
  magnitude: (a) => (a.n === 0n ? 0 : 1),
  fromRatio: (n, d) => rational(n, d),
  fromInt: (n) => ({ n: BigInt(n), d: 1n }),
  toJSON: (a) => {
    if (a.d === 1n && a.n <= BigInt(Number.MAX_SAFE_INTEGER) && a.n >= -BigInt(Number.MAX_SAFE_INTEGER)) {
      return Number(a.n);
    }
    return a.d === 1n ? a.n.toString() : `${a.n}/${a.d}`;
  },
  toNumber: (a) => Number(a.n) / Number(a.d),
  newVec: (n) => new Array<Rational>(n).fill(ZERO) as Vec<Rational>,
};
