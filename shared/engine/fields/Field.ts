/**
 * One coefficient field behind every algorithm of the engine.
 *
 * Algorithms are written once against this interface; elements are opaque
 * (`number` for the prime and real fields, {@link Rational} for the exact
 * rationals) so the hot paths of the number fields stay allocation-free.
 */
export interface Field<E> {
  readonly kind: 'rational' | 'prime' | 'real';
  /** `"rational"`, `"real"` or `"prime:P"`, as the command line reports it. */
  readonly label: string;
  readonly zero: E;
  readonly one: E;
  add(a: E, b: E): E;
  sub(a: E, b: E): E;
  mul(a: E, b: E): E;
  neg(a: E): E;
  /** Multiplicative inverse; throws RangeError on zero. */
  inv(a: E): E;
  /** Exactly zero (in the real field: `=== 0`). */
  isZero(a: E): boolean;
  equals(a: E, b: E): boolean;
  /**
   * Zero for the purpose of rank decisions: exactly zero in exact fields;
   * in the real field, at most `tolerance · scale` in magnitude.
   */
  negligible(a: E, scale: number): boolean;
  /** |a| as a float, used for pivot choice and scales (1 for any nonzero exact element). */
  magnitude(a: E): number;
  /**
   * The element n/d. Returns undefined when it does not exist in the field
   * (a denominator divisible by P).
   */
  fromRatio(n: bigint, d: bigint, asFloat: number): E | undefined;
  fromInt(n: number): E;
  /** JSON form: a number, or an exact fraction string "p/q" where a number would lose digits. */
  toJSON(a: E): number | string;
  toNumber(a: E): number;
  /** A zero-filled vector; a Float64Array for the number fields. */
  newVec(n: number): Vec<E>;
  /** Relative tolerance of the real field; 0 for exact fields. */
  readonly tolerance: number;
  /** P for the prime field, 0 otherwise (lets hot kernels inline modular arithmetic). */
  readonly modulus: number;
}

/** Indexable storage of field elements (a typed array for number fields). */
export interface Vec<E> {
  [i: number]: E;
  readonly length: number;
}
