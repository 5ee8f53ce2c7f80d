import type { BasedComplex } from '../based/BasedComplex';
import { invert, type Mat } from '../based/Mat';

/**
 * Inverses of matched blocks, computed once per block id. The matching
 * accepted every matched block as invertible, so a failure here is an
 * internal error, not a property of the input.
 */
export function matchedInverses<E>(X: BasedComplex<E>, pivotRatio: number): (blockId: number) => Mat<E> {
  const cache = new Map<number, Mat<E>>();
  return (blockId) => {
    let inv = cache.get(blockId);
    if (!inv) {
      const found = invert(X.field, X.blocks[blockId], pivotRatio);
      if (!found) throw new Error('internal check failed: a matched block is not invertible');
      inv = found.inv;
      cache.set(blockId, inv);
    }
    return inv;
  };
}
