import { cochainDims, type BasedComplex } from '../based/BasedComplex';
import type { Vec } from '../fields/Field';
import { denseKernel } from './denseKernel';
import { scalarRows, transposeRows } from './scalarRows';
import { SparseEchelon } from './SparseEchelon';

/** Largest cochain dimension for which a dense basis computation is attempted. */
export const DENSE_LIMIT = 6000;

/**
 * Cocycles of degree k whose classes form a basis of H^k: a kernel basis of
 * δ^k, kept only where independent of the image of δ^(k−1) and of the
 * representatives already kept.
 */
export function cohomologyBasis<E>(X: BasedComplex<E>, k: number): Vec<E>[] {
  const F = X.field;
  const d = cochainDims(X);
  if (d[k] > DENSE_LIMIT) {
    throw new RangeError(`degree ${k} has ${d[k]} coordinates after reduction, more than ${DENSE_LIMIT} for a dense basis`);
  }
  let kernel: Vec<E>[];
  let scale = 1;
  if (k + 1 < X.dims.length) {
    const rows = scalarRows(X, k);
    scale = Math.max(scale, rows.scale);
    kernel = denseKernel(F, rows);
  } else {
    kernel = Array.from({ length: d[k] }, (_, i) => {
      const v = F.newVec(d[k]);
      v[i] = F.one;
      return v;
    });
  }
  let image: { cols: Int32Array; vals: Vec<E> }[] = [];
  if (k > 0) {
    const below = scalarRows(X, k - 1);
    scale = Math.max(scale, below.scale);
    image = transposeRows(below, F.newVec).rows;
  }
  const ech = new SparseEchelon(F, d[k], scale);
  for (const r of image) ech.insert(r.cols, r.vals);
  const reps: Vec<E>[] = [];
  for (const z of kernel) {
    const cols: number[] = [];
    const vals: E[] = [];
    for (let i = 0; i < z.length; i++) {
      if (!F.isZero(z[i])) {
        cols.push(i);
        vals.push(z[i]);
      }
    }
    if (ech.insert(cols, vals)) reps.push(z);
  }
  return reps;
}
