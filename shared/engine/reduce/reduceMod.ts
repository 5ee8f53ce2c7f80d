/**
 * a mod p for a non-negative integer a < 2^53 and p < 2^26, without the
 * slow floating-point `%`: the quotient estimate is off by at most one.
 */
export function reduceMod(a: number, p: number, invP: number): number {
  const r = a - p * Math.floor(a * invP);
  return r < 0 ? r + p : r >= p ? r - p : r;
}
