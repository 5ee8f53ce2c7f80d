import type { Field } from './Field';

export const DEFAULT_TOLERANCE = 1e-9;

/**
 * 64-bit floating point. `tolerance` is relative: a value counts as zero in
 * rank decisions when its magnitude is at most tolerance × the scale of the
 * matrix it belongs to.
 */
export function realField(tolerance: number = DEFAULT_TOLERANCE): Field<number> {
  if (!(tolerance > 0 && tolerance < 1)) throw new RangeError(`tolerance ${tolerance} must lie in (0, 1)`);
  return {
    kind: 'real',
    label: 'real',
    zero: 0,
    one: 1,
    tolerance,
    modulus: 0,
    add: (a, b) => a + b,
    sub: (a, b) => a - b,
    mul: (a, b) => a * b,
    neg: (a) => -a,
    inv: (a) => {
      if (a === 0) throw new RangeError('inverse of zero');
      return 1 / a;
    },
    isZero: (a) => a === 0,
    equals: (a, b) => a === b,
    negligible: (a, scale) => Math.abs(a) <= tolerance * scale,
    magnitude: (a) => Math.abs(a),
    fromRatio: (_n, _d, asFloat) => asFloat,
    fromInt: (n) => n,
    toJSON: (a) => a,
    toNumber: (a) => a,
    newVec: (n) => new Float64Array(n),
  };
}
