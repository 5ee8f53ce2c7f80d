import { cochainDims, type BasedComplex } from '../based/BasedComplex';
import type { Control } from '../reduce/Cancelled';
import { scalarRows } from './scalarRows';
import { sparseRank } from './SparseEchelon';

export interface Ranks {
  /** rank δ^k for k = 0 … top−1 */
  ranks: number[];
  /** dim H^k = d_k − rank δ^k − rank δ^(k−1) */
  dims: number[];
  /** Real field: smallest accepted pivot and largest value rounded to zero, relative to scale. */
  smallestPivot: number;
  largestDropped: number;
}

/** Cohomology dimensions of a based complex by sparse elimination of each coboundary. */
export function cohomologyDims<E>(X: BasedComplex<E>, control?: Control): Ranks {
  const d = cochainDims(X);
  const ranks: number[] = [];
  let smallestPivot = Infinity;
  let largestDropped = 0;
  for (let k = 0; k + 1 < X.dims.length; k++) {
    const rows = scalarRows(X, k);
    const r = sparseRank(X.field, rows, {
      tick: (f) => control?.progress?.('solve', (k + f) / Math.max(1, X.dims.length - 1)),
      shouldStop: control?.shouldStop,
    });
    ranks.push(r.rank);
    const scale = rows.scale || 1;
    smallestPivot = Math.min(smallestPivot, r.smallestPivot / scale);
    largestDropped = Math.max(largestDropped, r.largestDropped / scale);
  }
  const dims = d.map((dk, k) => dk - (ranks[k] ?? 0) - (k > 0 ? ranks[k - 1] : 0));
  return { ranks, dims, smallestPivot, largestDropped };
}
