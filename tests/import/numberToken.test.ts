/**
 * Reading numbers in place (shared/import/numberToken.ts). The fast path
 * must round exactly as `Number` does (Clinger 1990); checked against it on
 * random doubles in the forms mesh writers produce.
 */
import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { parseFloatToken, parseIntToken } from '../../shared/import/numberToken';

const float = (s: string) => parseFloatToken(` ${s} `, 1, s.length + 1);
const int = (s: string) => parseIntToken(` ${s} `, 1, s.length + 1);

describe('parseFloatToken', () => {
  test('agrees with Number on shortest, fixed and exponential forms of random doubles', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.integer({ min: 0, max: 20 }), (x, digits) => {
        for (const s of [String(x), x.toFixed(digits), x.toExponential(digits), x.toPrecision(digits + 1)]) {
          if (/e\+?(\d{3,})/.test(s) && !Number.isFinite(Number(s))) continue;
          expect(Object.is(float(s), Number(s)), s).toBe(true);
        }
      }),
      { numRuns: 2000 },
    );
  });

  test('reads signs, bare points and exponents', () => {
    expect([float('+2.5'), float('-.5'), float('3.'), float('1E3'), float('1e-3'), float('-0')]).toEqual([2.5, -0.5, 3, 1000, 0.001, -0]);
  });

  test('is NaN for anything but a finite decimal number', () => {
    for (const s of ['', '-', '.', 'e5', '1e', '1e+', '1.2.3', '0x10', 'inf', 'nan', 'Infinity', '1,5', '1e400', '1_000']) {
      expect(float(s), s).toBeNaN();
    }
  });
});

describe('parseIntToken', () => {
  test('reads signed decimal integers', () => {
    expect([int('0'), int('42'), int('-7'), int('+3'), int('007')]).toEqual([0, 42, -7, 3, 7]);
  });

  test('is NaN for anything else', () => {
    for (const s of ['', '-', '1.0', '1e3', 'x', '9007199254740993']) expect(int(s), s).toBeNaN();
  });
});
